// Rules about what the numbers are: money over time, groups of different size, mixed units, the recorded
// adjustment, uneven time steps, two-period comparisons, and the unit and source. Every chart here is invented.
import { describe, expect, it } from 'vitest';
import { applyAdjustment } from '../../../../shared-core/standardise/index';
import { layoutChart } from '../../../../shared-core/layout/index';
import {
  adjustmentStale,
  contextThin,
  groupSizeIgnored,
  mixedUnits,
  moneyNominal,
  sourceUnstated,
  timeUneven,
  unitUnstated,
} from '../../../../shared-core/integrity/rules/index';
import { laid, run } from './ruleFixtures';

// Published CPI values (Moore, Statistics: Concepts and Controversies, ch. 16, 1982-84 = 100); used as a supplied index.
const CPI = { '1982': 96.5, '1983': 99.6, '1984': 103.9, '2000': 172.2, '2005': 195.3 };
const fares = (over: Record<string, unknown> = {}) =>
  laid({
    title: 'Ferry fare income',
    data: [
      { label: '1982', value: 400 },
      { label: '1983', value: 420 },
      { label: '1984', value: 455 },
    ],
    encoding: { mode: 'repeat', glyph: 'coin', unit: 50, unitName: 'dollars' },
    ...over,
  });

describe('money-nominal: money over time not adjusted for prices', () => {
  it('triggers on a currency unit with period labels, offering the adjustment when an index is supplied', () => {
    const [f] = run(moneyNominal, fares({ standardise: { priceIndex: { values: CPI } } }));
    expect(f.code).toBe('money-nominal');
    expect(f.severity).toBe('warning');
    expect(f.message).toContain('from 1982 to 1984');
    expect(f.action).toEqual({ kind: 'apply-price-index', label: 'Adjust to 1984 money', payload: { step: { kind: 'price-index', basePeriod: '1984' } } });
    expect(f.basis).toContain('Moore');
    // Without an index there is nothing to click, but the fix says what to supply.
    const [g] = run(moneyNominal, fares());
    expect(g.action).toBeUndefined();
    expect(g.fix).toContain('Supply a price index');
  });

  it('also triggers on a currency column', () => {
    const chart = fares({ encoding: { mode: 'repeat', glyph: 'coin', unit: 50, unitName: 'takings' }, standardise: { columns: { currency: { values: { '1982': 'EUR', '1983': 'EUR', '1984': 'EUR' } } } } });
    expect(run(moneyNominal, chart).map((f) => f.code)).toEqual(['money-nominal']);
  });

  it('does not trigger once adjusted, for real money, for money across places, or for counts over time', () => {
    const adjusted = applyAdjustment(fares({ standardise: { priceIndex: { values: CPI } } }).spec, { kind: 'price-index', basePeriod: '1984' });
    expect(run(moneyNominal, { spec: adjusted, scene: layoutChart(adjusted) })).toEqual([]);
    expect(run(moneyNominal, fares({ encoding: { mode: 'repeat', glyph: 'coin', unit: 50, unitName: 'dollars at 1984 prices' } }))).toEqual([]);
    expect(run(moneyNominal, laid({ encoding: { mode: 'repeat', glyph: 'coin', unit: 5, unitName: 'euros' } }))).toEqual([]);
    expect(run(moneyNominal, fares({ encoding: { mode: 'repeat', glyph: 'boat', unit: 50, unitName: 'crossings' } }))).toEqual([]);
  });
});

describe('size-unadjusted: totals of groups of very different size', () => {
  const towns = (population: Record<string, unknown>, over: Record<string, unknown> = {}) =>
    laid({
      data: [
        { label: 'Kestrel Bay', value: 120 },
        { label: 'Ashby Cross', value: 2_400 },
      ],
      encoding: { mode: 'repeat', glyph: 'bike', unit: 100, unitName: 'bike thefts' },
      standardise: { columns: { population: { unitName: 'residents', values: population } } },
      ...over,
    });

  it('triggers when one group is 60 times the size of the other, offering a rate that counts whole things', () => {
    const [f] = run(groupSizeIgnored, towns({ 'Kestrel Bay': 8_000, 'Ashby Cross': 480_000 }));
    expect(f.code).toBe('size-unadjusted');
    expect(f.message).toContain('differ 60-fold');
    // Rates per resident: 0.015 and 0.005; per 1,000: 15 and 5, the smallest base giving every rate at least 1.
    expect(f.action).toEqual({ kind: 'apply-per-capita', label: 'Show per 1,000 residents', payload: { step: { kind: 'per-capita', column: 'population', per: 1_000 } } });
  });

  it('reports a zero or missing population instead of skipping the row', () => {
    const [f] = run(groupSizeIgnored, towns({ 'Kestrel Bay': 0 }));
    expect(f.code).toBe('size-unadjusted-base-incomplete');
    expect(f.message).toContain('"Kestrel Bay" and "Ashby Cross"');
  });

  it('does not trigger for groups of similar size, for rates, or once per-capita is applied', () => {
    expect(run(groupSizeIgnored, towns({ 'Kestrel Bay': 300_000, 'Ashby Cross': 480_000 }))).toEqual([]);
    expect(run(groupSizeIgnored, towns({ 'Kestrel Bay': 8_000, 'Ashby Cross': 480_000 }, { encoding: { mode: 'repeat', glyph: 'bike', unit: 100, unitName: 'thefts per 1,000 residents' } }))).toEqual([]);
    const chart = towns({ 'Kestrel Bay': 8_000, 'Ashby Cross': 480_000 });
    const adjusted = applyAdjustment(chart.spec, { kind: 'per-capita', column: 'population', per: 1_000 });
    expect(run(groupSizeIgnored, { spec: adjusted, scene: chart.scene })).toEqual([]);
  });
});

describe('units-mixed: values of different units', () => {
  it('triggers on a unit column with two units and on mixed currencies', () => {
    const chart = laid({ standardise: { columns: { unit: { values: { 'Alder Street': 'kg', 'Birch Road': 'kg', 'Cedar Lane': 'tonnes' } }, currency: { values: { 'Alder Street': 'EUR', 'Birch Road': '€', 'Cedar Lane': 'USD' } } } } });
    const found = run(mixedUnits, chart);
    expect(found.map((f) => f.code)).toEqual(['units-mixed', 'units-mixed']);
    expect(found[0].message).toContain('kg ("Alder Street" and "Birch Road"), tonnes ("Cedar Lane")');
    expect(found[1].message).toContain('EUR ("Alder Street" and "Birch Road"), USD ("Cedar Lane")');
  });

  it('does not trigger when every row has one unit, however it is spelled', () => {
    expect(run(mixedUnits, laid({ standardise: { columns: { currency: { values: { 'Alder Street': 'EUR', 'Birch Road': 'euros', 'Cedar Lane': '€' } } } } }))).toEqual([]);
    expect(run(mixedUnits, laid())).toEqual([]);
  });
});

describe('adjustment-stale: the recorded adjustment no longer gives the values', () => {
  const population = { population: { unitName: 'residents', values: { 'Alder Street': 1_000, 'Birch Road': 2_000, 'Cedar Lane': 4_000 } } };
  it('triggers when a value was edited after the adjustment, and when the inputs are gone', () => {
    const adjusted = applyAdjustment(laid({ standardise: { columns: population } }).spec, { kind: 'per-capita', column: 'population', per: 1_000 });
    const edited = { ...adjusted, data: adjusted.data.map((r, i) => (i === 1 ? { ...r, value: 99 } : r)) };
    const [f] = run(adjustmentStale, { spec: edited, scene: layoutChart(edited) });
    expect(f.code).toBe('adjustment-stale');
    expect(f.category).toBe('Birch Road');
    const gone = { ...adjusted, standardise: { ...adjusted.standardise, columns: {} } };
    expect(run(adjustmentStale, { spec: gone, scene: layoutChart(adjusted) })[0].message).toContain('there is no column "population"');
  });

  it('does not trigger on a fresh adjustment or without one', () => {
    const adjusted = applyAdjustment(laid({ standardise: { columns: population } }).spec, { kind: 'per-capita', column: 'population', per: 1_000 });
    expect(run(adjustmentStale, { spec: adjusted, scene: layoutChart(adjusted) })).toEqual([]);
    expect(run(adjustmentStale, laid())).toEqual([]);
  });
});

describe('time-uneven: uneven time steps drawn at equal spacing', () => {
  const years = (labels: string[], mode = 'stack') => laid({ data: labels.map((label, i) => ({ label, value: 20 + 5 * i })), encoding: { mode, glyph: 'tree', unit: 5, unitName: 'trees' } });

  it('triggers on 2000, 2005, 2010, 2020 drawn as equal columns, naming the long step', () => {
    const [f] = run(timeUneven, years(['2000', '2005', '2010', '2020']));
    expect(f.code).toBe('time-uneven');
    expect(f.message).toContain('5 years, 5 years, 10 years apart');
    expect(f.message).toContain('2010 to 2020');
    expect(f.category).toBe('2020');
  });

  it('triggers on periods out of order', () => {
    expect(run(timeUneven, years(['2021', '2019', '2020']))[0].code).toBe('time-uneven-order');
  });

  it('does not trigger on even steps (years, quarters) or on categories', () => {
    expect(run(timeUneven, years(['2000', '2005', '2010', '2015']))).toEqual([]);
    expect(run(timeUneven, years(['2021 Q3', '2021 Q4', '2022 Q1']))).toEqual([]);
    expect(run(timeUneven, laid())).toEqual([]);
  });
});

describe('context-thin: only two periods (advice)', () => {
  it('triggers on a before/after of two years', () => {
    const [f] = run(contextThin, laid({ data: [{ label: '2019', value: 30 }, { label: '2024', value: 55 }] }));
    expect(f).toMatchObject({ code: 'context-thin', severity: 'advice' });
    expect(f.message).toContain('2019 and 2024');
  });

  it('does not trigger on three periods or on two places', () => {
    expect(run(contextThin, laid({ data: [{ label: '2018', value: 30 }, { label: '2019', value: 30 }, { label: '2024', value: 55 }] }))).toEqual([]);
    expect(run(contextThin, laid({ data: [{ label: 'North', value: 30 }, { label: 'South', value: 55 }] }))).toEqual([]);
  });
});

describe('unit-unstated and source-unstated', () => {
  it('unit: triggers with the legend off, and with a legend that names no unit', () => {
    const off = run(unitUnstated, laid({ layout: { legend: false } }));
    expect(off[0]).toMatchObject({ code: 'unit-unstated', action: { kind: 'show-legend' } });
    const unnamed = run(unitUnstated, laid({ encoding: { mode: 'repeat', glyph: 'bike', unit: 5 } }));
    expect(unnamed[0]).toMatchObject({ code: 'unit-unstated', action: { kind: 'set-unit-name' } });
    expect(unnamed[0].message).toContain('(5)');
  });

  it('unit: does not trigger with a named unit in the legend, nor for fill shares', () => {
    expect(run(unitUnstated, laid())).toEqual([]);
    expect(run(unitUnstated, laid({ data: [{ label: 'North', value: 0.4 }, { label: 'South', value: 0.7 }], encoding: { mode: 'fill', glyph: 'tree', fillTo: 'share' } }))).toEqual([]);
  });

  it('source: triggers with no source or a blank one, not with a source', () => {
    expect(run(sourceUnstated, laid({ source: undefined }))[0]).toMatchObject({ code: 'source-unstated', action: { kind: 'set-source' } });
    expect(run(sourceUnstated, laid({ source: '   ' }))).toHaveLength(1);
    expect(run(sourceUnstated, laid())).toEqual([]);
  });
});
