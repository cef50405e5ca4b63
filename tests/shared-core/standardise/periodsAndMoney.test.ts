import { describe, expect, it } from 'vitest';
import { moneyUnitOf, parsePeriod, periodSeries } from '../../../shared-core/standardise/index';

describe('parsePeriod', () => {
  it('reads years, split years, quarters and months onto one axis in years', () => {
    expect(parsePeriod('2019')).toEqual({ text: '2019', granularity: 'year', startYears: 2019 });
    expect(parsePeriod(' FY2019 ')?.startYears).toBe(2019);
    expect(parsePeriod('2019/20')?.granularity).toBe('year');
    expect(parsePeriod('2019-20')?.granularity).toBe('year');
    expect(parsePeriod('2021 Q3')?.startYears).toBe(2021.5);
    expect(parsePeriod('Q2 2021')?.startYears).toBe(2021.25);
    expect(parsePeriod('2021-03')).toEqual({ text: '2021-03', granularity: 'month', startYears: 2021 + 2 / 12 });
    expect(parsePeriod('March 2021')?.startYears).toBe(2021 + 2 / 12);
    expect(parsePeriod('Sept 2021')?.startYears).toBe(2021 + 8 / 12);
  });

  it('does not read categories or counts as periods', () => {
    for (const label of ['Station A', '12', '99999', 'Marmalade 2021', '2019-45', 'Q5 2020', '1982-84']) expect(parsePeriod(label)).toBeNull();
  });

  it('periodSeries needs two or more periods of one granularity', () => {
    expect(periodSeries(['2019', '2020'])?.map((p) => p.startYears)).toEqual([2019, 2020]);
    expect(periodSeries(['2019'])).toBeNull();
    expect(periodSeries(['2019', 'Q1 2020'])).toBeNull();
    expect(periodSeries(['2019', 'North'])).toBeNull();
  });
});

describe('moneyUnitOf', () => {
  it('recognises currency symbols, words and codes', () => {
    expect(moneyUnitOf('€ thousand')).toEqual({ currency: 'EUR' });
    expect(moneyUnitOf('euros')).toEqual({ currency: 'EUR' });
    expect(moneyUnitOf('GBP')).toEqual({ currency: 'GBP' });
    expect(moneyUnitOf('US dollars')).toEqual({ currency: 'USD' });
    expect(moneyUnitOf('$')).toEqual({ currency: '$' });
    expect(moneyUnitOf('million NZD')).toEqual({ currency: 'NZD' });
    expect(moneyUnitOf('ticket prices')).toEqual({ currency: null });
  });

  it('leaves other units alone', () => {
    for (const unit of ['bikes', 'trees', 'cups', 'residents', undefined, '']) expect(moneyUnitOf(unit)).toBeNull();
  });
});
