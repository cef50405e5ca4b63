import { describe, expect, it } from 'vitest';
import { indexToBase, shareOfTotal } from '../../../shared-core/standardise/index';
import { caught } from '../../helpers/errors';

describe('indexToBase', () => {
  it('the published 1982, 1983, 1984 CPI values, indexed to their own mean, give the values back (1982-84 = 100)', () => {
    // Published: Moore, Statistics: Concepts and Controversies, ch. 16: 96.5, 99.6, 103.9 with 1982-84 = 100.
    // An index to a base period divides by the base value; a base that is itself 100 leaves the values unchanged.
    const rows = [
      { label: '1982', value: 96.5 },
      { label: '1983', value: 99.6 },
      { label: '1984', value: 103.9 },
      { label: '1982-84', value: (96.5 + 99.6 + 103.9) / 3 },
    ];
    const out = indexToBase(rows, { basePeriod: '1982-84' });
    expect(out.values.map((v) => Number(v.value.toFixed(10)))).toEqual([96.5, 99.6, 103.9, 100]);
    expect(out.unitName).toBe('index, 1982-84 = 100');
  });

  it('invented series: 40, 50, 70 indexed to the first period give 100, 125, 175', () => {
    const out = indexToBase(
      [
        { label: 'Ticket A', value: 40 },
        { label: 'Ticket B', value: 50 },
        { label: 'Ticket C', value: 70 },
      ],
      { basePeriod: '2019', periodOf: { 'Ticket A': '2019', 'Ticket B': '2020', 'Ticket C': '2021' } },
    );
    expect(out.values.map((v) => v.value)).toEqual([100, 125, 175]);
    expect(out.note).toBe('indexed to 2019 = 100');
  });

  it('refuses a base period that is not a row, a repeated one, or one with the value 0', () => {
    const rows = [
      { label: '2019', value: 0 },
      { label: '2020', value: 5 },
    ];
    expect(caught(() => indexToBase(rows, { basePeriod: '2018' })).message).toBe('Cannot index to 2018 = 100: the base period "2018" is not one of the rows (2019, 2020)');
    expect(caught(() => indexToBase(rows, { basePeriod: '2019' })).message).toContain('has the value 0; an index needs a base above 0');
    expect(caught(() => indexToBase(rows, { basePeriod: '2020', periodOf: { '2019': '2020' } })).message).toContain('appears in 2 rows');
  });
});

describe('shareOfTotal', () => {
  it('invented counts 15, 25, 60 are 15%, 25%, 60% of their total of 100; 1 of 3 is 33.33...%', () => {
    const out = shareOfTotal([
      { label: 'Walk', value: 15 },
      { label: 'Cycle', value: 25 },
      { label: 'Bus', value: 60 },
    ]);
    expect(out.values.map((v) => v.value)).toEqual([15, 25, 60]);
    expect(out.unitName).toBe('% of total');
    const third = shareOfTotal([
      { label: 'a', value: 1 },
      { label: 'b', value: 2 },
    ]);
    expect(third.values[0].value).toBeCloseTo(100 / 3, 12);
    expect(third.values[0].value + third.values[1].value).toBeCloseTo(100, 12);
  });

  it('refuses a total of 0', () => {
    expect(caught(() => shareOfTotal([{ label: 'a', value: 0 }])).message).toBe('Cannot show shares of the total: the values add up to 0; shares need a total above 0');
  });
});
