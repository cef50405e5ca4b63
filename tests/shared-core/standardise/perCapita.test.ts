import { describe, expect, it } from 'vitest';
import { perCapita, perCapitaPhrase } from '../../../shared-core/standardise/index';
import { caught } from '../../helpers/errors';

describe('perCapita reproduces a published rate', () => {
  it('44,232 new AIDS cases in a mid-year population of 290,809,777 give 15.2 per 100,000', () => {
    // From memory, not checked against the source: CDC, Principles of Epidemiology in Public Health Practice
    // (3rd ed.), Lesson 3, worked example of an incidence rate for the United States in 2003: count 44,232,
    // population 290,809,777, published rate 15.2 new cases per 100,000 population (one decimal).
    const out = perCapita([{ label: 'United States 2003', value: 44_232 }], { 'United States 2003': 290_809_777 }, { per: 100_000, baseName: 'population', unitName: 'new cases' });
    expect(Number(out.values[0].value.toFixed(1))).toBe(15.2);
    expect(out.unitName).toBe('new cases per 100,000 population');
  });
});

describe('perCapita on invented data', () => {
  // Invented: two towns of very different size.
  const rows = [
    { label: 'Kestrel Bay', value: 120 },
    { label: 'Ashby Cross', value: 2_400 },
  ];

  it('divides by each row\'s base and multiplies by the rate base', () => {
    const out = perCapita(rows, { 'Kestrel Bay': 8_000, 'Ashby Cross': 480_000 }, { per: 1_000, baseName: 'residents', unitName: 'bike thefts' });
    // 120 / 8,000 x 1,000 = 15; 2,400 / 480,000 x 1,000 = 5 (arithmetic by hand).
    expect(out.values).toEqual([
      { label: 'Kestrel Bay', value: 15 },
      { label: 'Ashby Cross', value: 5 },
    ]);
    expect(out.note).toBe('per 1,000 residents');
  });

  it('reads numbers written as text with thousands separators', () => {
    expect(perCapita(rows, { 'Kestrel Bay': '8,000', 'Ashby Cross': '480,000' }, { per: 1, baseName: 'residents' }).values[0].value).toBe(0.015);
  });

  it('says "per resident" for a base of 1 and groups thousands otherwise', () => {
    expect(perCapitaPhrase(1, 'residents')).toBe('per resident');
    expect(perCapitaPhrase(1, 'families')).toBe('per family');
    expect(perCapitaPhrase(100_000, 'residents')).toBe('per 100,000 residents');
    expect(perCapitaPhrase(2_500, 'households')).toBe('per 2,500 households');
  });

  it('refuses a zero, missing, negative or non-numeric base, naming every row', () => {
    const e = caught(() =>
      perCapita(
        [...rows, { label: 'Fenwick', value: 3 }, { label: 'Orr Vale', value: 4 }],
        { 'Kestrel Bay': 0, 'Fenwick': -5, 'Orr Vale': 'unknown' },
        { per: 1_000, baseName: 'residents' },
      ),
    );
    expect(e.code).toBe('data-invalid');
    expect(e.message).toBe('Cannot compute values per 1,000 residents: "Kestrel Bay": its residents figure is 0; a rate needs a base above 0 (and 3 more problems)');
    const problems = (e.details as { problems: { label: string; message: string }[] }).problems;
    expect(problems.map((p) => p.label)).toEqual(['Kestrel Bay', 'Ashby Cross', 'Fenwick', 'Orr Vale']);
    expect(problems[1].message).toBe('has no residents figure; give one for every category');
    expect(problems[3].message).toContain('"unknown" is not a number');
  });

  it('refuses a rate base that is not a positive number', () => {
    expect(caught(() => perCapita(rows, { 'Kestrel Bay': 1, 'Ashby Cross': 1 }, { per: 0, baseName: 'residents' })).message).toContain('the rate base must be a positive number');
  });
});
