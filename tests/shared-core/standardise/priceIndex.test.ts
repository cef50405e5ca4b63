import { describe, expect, it } from 'vitest';
import { adjustForPrices } from '../../../shared-core/standardise/index';
import { caught } from '../../helpers/errors';

// PUBLISHED: consumer price index values from Moore, Statistics: Concepts and Controversies, ch. 16 (table with
// 1982-84 = 100): 1982 96.5, 1983 99.6, 1984 103.9, 2000 172.2, 2005 195.3. Also published there: the conversion
// rule amount_B = amount_A x CPI_B / CPI_A.
// COMPUTED (not published): each dollar result below was worked out by hand from those index values with
// exact fractions and rounded to the cent; the code must land on the same cent.
const MOORE_CPI = { '1982': 96.5, '1983': 99.6, '1984': 103.9, '2000': 172.2, '2005': 195.3 };

function cents(n: number): number {
  return Math.round(n * 100) / 100;
}

describe('adjustForPrices reproduces conversions built from published CPI values', () => {
  it('converts 1982 dollars to 2005 dollars: 10,000 x 195.3 / 96.5 = 20,238.34', () => {
    const out = adjustForPrices([{ label: '1982', value: 10_000 }], { basePeriod: '2005', index: MOORE_CPI, unitName: 'dollars' });
    expect(cents(out.values[0].value)).toBe(20_238.34);
  });

  it('converts a whole series to 2000 money to the cent, and names the money in the unit and the note', () => {
    const rows = [
      { label: '1982', value: 10_000 }, // x 172.2 / 96.5 = 17,844.56 (computed)
      { label: '1983', value: 4.5 }, // x 172.2 / 99.6 = 7.78 (computed)
      { label: '2005', value: 25_000 }, // x 172.2 / 195.3 = 22,043.01 (computed)
      { label: '2000', value: 1 }, // the base period itself is unchanged
    ];
    const out = adjustForPrices(rows, { basePeriod: '2000', index: MOORE_CPI, unitName: 'dollars' });
    expect(out.values.map((v) => cents(v.value))).toEqual([17_844.56, 7.78, 22_043.01, 1]);
    expect(out.values.map((v) => v.label)).toEqual(['1982', '1983', '2005', '2000']);
    expect(out.unitName).toBe('dollars (2000 money)');
    expect(out.note).toBe('adjusted to 2000 money with the supplied price index');
  });

  it('goes forwards and backwards: 1 dollar of 2000 is 1.13 in 2005 money; 100 of 1984 is 95.86 in 1983 money', () => {
    expect(cents(adjustForPrices([{ label: '2000', value: 1 }], { basePeriod: '2005', index: MOORE_CPI }).values[0].value)).toBe(1.13);
    expect(cents(adjustForPrices([{ label: '1984', value: 100 }], { basePeriod: '1983', index: MOORE_CPI }).values[0].value)).toBe(95.86);
  });

  it('reads periods from a period column and index values from an index column', () => {
    const out = adjustForPrices(
      [
        { label: 'Fares then', value: 10_000 },
        { label: 'Fares now', value: 20_000 },
      ],
      { basePeriod: '2005', periodOf: { 'Fares then': '1982', 'Fares now': '2005' }, indexByLabel: { 'Fares then': 96.5, 'Fares now': 195.3 } },
    );
    expect(out.values.map((v) => cents(v.value))).toEqual([20_238.34, 20_000]);
  });

  it('names a supplied index in the note', () => {
    const out = adjustForPrices([{ label: '1982', value: 1 }], { basePeriod: '1984', index: MOORE_CPI, indexName: 'the consumer price index (1982-84 = 100)' });
    expect(out.note).toBe('adjusted to 1984 money with the consumer price index (1982-84 = 100)');
  });
});

describe('adjustForPrices refuses bad input plainly, listing every row at fault', () => {
  it('a base period not in the table', () => {
    const e = caught(() => adjustForPrices([{ label: '1982', value: 1 }], { basePeriod: '2020', index: MOORE_CPI }));
    expect(e.code).toBe('data-invalid');
    expect(e.message).toContain('the base period "2020" is not in the price index (it has 1982, 1983, 1984, 2000, 2005)');
  });

  it('a period missing from the index: every such row is named, none is dropped', () => {
    const e = caught(() =>
      adjustForPrices(
        [
          { label: '1982', value: 1 },
          { label: '1990', value: 2 },
          { label: '1995', value: 3 },
        ],
        { basePeriod: '2005', index: MOORE_CPI },
      ),
    );
    expect(e.message).toBe('Cannot adjust to 2005 money: "1990": the price index has no value for its period "1990" (and 1 more problem)');
    expect((e.details as { problems: { label: string }[] }).problems.map((p) => p.label)).toEqual(['1990', '1995']);
  });

  it('a zero or non-numeric index value', () => {
    const e = caught(() => adjustForPrices([{ label: '1982', value: 1 }], { basePeriod: '2005', index: { '1982': 0, '2005': 195.3 } }));
    expect(e.message).toContain('the index value for "1982" is 0, not a positive number');
    const f = caught(() => adjustForPrices([{ label: '1982', value: 1 }], { basePeriod: '2005', index: { '1982': 'n/a', '2005': 195.3 } }));
    expect(f.message).toContain('the index value for "1982" is "n/a"');
  });

  it('mixed currencies', () => {
    const e = caught(() =>
      adjustForPrices(
        [
          { label: '1982', value: 1 },
          { label: '2000', value: 2 },
        ],
        { basePeriod: '2005', index: MOORE_CPI, currencyOf: { '1982': 'USD', '2000': 'euros' } },
      ),
    );
    expect(e.message).toContain('the rows are in different currencies: USD (1982), EUR (2000)');
  });

  it('no index at all', () => {
    expect(caught(() => adjustForPrices([{ label: '1982', value: 1 }], { basePeriod: '1982' })).message).toContain('no price index was supplied');
  });

  it('with an index column, a base period that is not one of the rows', () => {
    const e = caught(() => adjustForPrices([{ label: '1982', value: 1 }], { basePeriod: '2005', indexByLabel: { '1982': 96.5 } }));
    expect(e.message).toContain('the base period "2005" is not among the rows\' periods');
  });
});
