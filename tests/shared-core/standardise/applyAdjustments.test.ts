import { describe, expect, it } from 'vitest';
import { chartToDocument, parseChart } from '../../../shared-core/document/index';
import { layoutChart } from '../../../shared-core/layout/index';
import { renderChart } from '../../../shared-core/pipeline/index';
import { adjustmentFootnote, applyAdjustment, removeAdjustments, replayAdjustments } from '../../../shared-core/standardise/index';
import { readChartSvg } from '../../../shared-core/svg/index';
import { chartDoc } from '../../helpers/chartDoc';
import { caught } from '../../helpers/errors';

// Invented: library loans in three towns of very different size, over two years of nominal fines.
function townsDoc(over: Record<string, unknown> = {}) {
  return chartDoc({
    title: 'Library loans',
    source: 'Invented test data',
    data: [
      { label: 'Kestrel Bay', value: 1_200 },
      { label: 'Ashby Cross', value: 36_000 },
      { label: 'Fenwick', value: 9_000 },
    ],
    encoding: { mode: 'repeat', glyph: 'book', unit: 5, unitName: 'loans' },
    page: { width: 180, height: 120, unit: 'mm' },
    standardise: { columns: { population: { unitName: 'residents', values: { 'Kestrel Bay': 8_000, 'Ashby Cross': 480_000, Fenwick: 60_000 } } } },
    ...over,
  });
}

describe('applyAdjustment records the step and keeps the original data', () => {
  it('per 1,000 residents: values, unit name, original kept, footnote', () => {
    const spec = parseChart(townsDoc());
    const adjusted = applyAdjustment(spec, { kind: 'per-capita', column: 'population', per: 1_000 });
    // 1,200 / 8,000 x 1,000 = 150; 36,000 / 480,000 x 1,000 = 75; 9,000 / 60,000 x 1,000 = 150 (by hand).
    expect(adjusted.data.map((r) => r.value)).toEqual([150, 75, 150]);
    expect(adjusted.encoding.unitName).toBe('loans per 1,000 residents');
    expect(adjusted.standardise?.adjustments?.original).toEqual({ unitName: 'loans', values: { 'Kestrel Bay': 1_200, 'Ashby Cross': 36_000, Fenwick: 9_000 } });
    expect(adjustmentFootnote(adjusted.standardise)).toBe('Figures per 1,000 residents.');
    expect(spec.data.map((r) => r.value)).toEqual([1_200, 36_000, 9_000]);
  });

  it('two steps chain from the original and read as one footnote; removing them restores the data', () => {
    const spec = parseChart(
      townsDoc({
        data: [
          { label: '1982', value: 965 },
          { label: '2000', value: 1_722 },
        ],
        encoding: { mode: 'repeat', glyph: 'coin', unit: 100, unitName: 'dollars' },
        standardise: {
          columns: { population: { unitName: 'residents', values: { '1982': 1_000, '2000': 2_000 } } },
          // Published index values (Moore, ch. 16, 1982-84 = 100).
          priceIndex: { values: { '1982': 96.5, '2000': 172.2 } },
        },
      }),
    );
    const once = applyAdjustment(spec, { kind: 'price-index', basePeriod: '2000' });
    const twice = applyAdjustment(once, { kind: 'per-capita', column: 'population', per: 1 });
    // 965 x 172.2 / 96.5 = 1,722 (computed), / 1,000 = 1.722; 1,722 / 2,000 = 0.861.
    expect(twice.data.map((r) => Number(r.value.toFixed(9)))).toEqual([1.722, 0.861]);
    expect(twice.encoding.unitName).toBe('dollars (2000 money) per resident');
    expect(adjustmentFootnote(twice.standardise)).toBe('Figures adjusted to 2000 money with the supplied price index; per resident.');
    expect(replayAdjustments(twice.standardise ?? {}).notes).toEqual(['adjusted to 2000 money with the supplied price index', 'per resident']);
    const back = removeAdjustments(twice);
    expect(back.data).toEqual(spec.data);
    expect(back.encoding.unitName).toBe('dollars');
    expect(back.standardise?.adjustments).toBeUndefined();
    expect(back.standardise?.priceIndex).toEqual({ values: { '1982': 96.5, '2000': 172.2 } });
  });

  it('bad input leaves the chart untouched and names the rows', () => {
    const spec = parseChart(townsDoc({ standardise: { columns: { population: { values: { 'Kestrel Bay': 0, Fenwick: 60_000 } } } } }));
    const e = caught(() => applyAdjustment(spec, { kind: 'per-capita', column: 'population', per: 1_000 }));
    expect(e.message).toContain('"Kestrel Bay": its population figure is 0');
    expect((e.details as { problems: unknown[] }).problems).toHaveLength(2);
    expect(caught(() => applyAdjustment(spec, { kind: 'per-capita', column: 'households', per: 1 })).message).toContain('there is no column "households" (columns: population)');
    expect(spec.standardise?.adjustments).toBeUndefined();
  });
});

describe('the adjustment is written on the chart and in its metadata', () => {
  const adjusted = chartToDocument(applyAdjustment(parseChart(townsDoc()), { kind: 'per-capita', column: 'population', per: 1_000 }));

  it('the saved document parses back to the same chart', () => {
    expect(parseChart(JSON.parse(JSON.stringify(adjusted)))).toEqual(parseChart(adjusted));
  });

  it('the source line carries the footnote, and the verified file records it in its summary', () => {
    const scene = layoutChart(parseChart(adjusted));
    const foot = scene.texts.filter((t) => t.role === 'source').map((t) => t.text).join(' ');
    expect(foot).toBe('Source: Invented test data. Figures per 1,000 residents.');
    const result = renderChart(adjusted);
    expect(result.report.pass).toBe(true);
    const summary = readChartSvg(result.svg).summary;
    expect(summary?.adjustments).toEqual({ note: 'Figures per 1,000 residents.', steps: [{ kind: 'per-capita', column: 'population', per: 1_000 }] });
    expect(summary?.unitName).toBe('loans per 1,000 residents');
  });

  it('a chart without adjustments keeps its source line as before', () => {
    const scene = layoutChart(parseChart(townsDoc({ encoding: { mode: 'repeat', glyph: 'book', unit: 1_000, unitName: 'loans' } })));
    expect(scene.texts.filter((t) => t.role === 'source').map((t) => t.text)).toEqual(['Source: Invented test data']);
    expect(scene.summary.adjustments).toBeUndefined();
  });
});

describe('the document block is validated with field paths', () => {
  it('rejects an unknown step kind, a zero rate base and a dismissal without a reason', () => {
    expect(caught(() => parseChart(townsDoc({ standardise: { adjustments: { original: { values: {} }, steps: [{ kind: 'deflate' }] } } }))).message).toMatch(/^standardise\.adjustments\.steps\[0\]/);
    expect(caught(() => parseChart(townsDoc({ standardise: { adjustments: { original: { values: {} }, steps: [{ kind: 'per-capita', column: 'population', per: 0 }] } } }))).message).toContain('must be greater than 0');
    expect(caught(() => parseChart(townsDoc({ dismissed: [{ code: 'context-thin' }] }))).message).toMatch(/^dismissed\[0\]\.reason/);
  });

  it('keeps dismissed findings with their reasons through a save', () => {
    const dismissed = [{ code: 'context-thin', reason: 'The brief is a before/after comparison of two seasons.' }];
    expect(chartToDocument(parseChart(townsDoc({ dismissed }))).dismissed).toEqual(dismissed);
  });
});

describe('the demo chart with a standardised unit', () => {
  it('prints its footnote, replays its recorded adjustment to the values drawn, and raises no rule finding', async () => {
    const { DEMO_CHARTS } = await import('../../../shared-core/demo/demoCharts');
    const { runRules } = await import('../../../shared-core/integrity/rules/index');
    const demo = DEMO_CHARTS.find((d) => d.document.standardise?.adjustments);
    expect(demo?.name).toBe('repeat-library-per-resident');
    const spec = parseChart(demo?.document);
    // 5,400 / 12,000 x 1,000 = 450; 9,100 / 26,000 x 1,000 = 350; 2,100 / 5,000 x 1,000 = 420; 3,600 / 15,000 x 1,000 = 240 (by hand).
    expect(replayAdjustments(spec.standardise ?? {}).values.map((v) => Number(v.value.toFixed(9)))).toEqual([450, 350, 420, 240]);
    const scene = layoutChart(spec);
    expect(scene.texts.filter((t) => t.role === 'source').map((t) => t.text).join(' ')).toContain('Figures per 1,000 residents.');
    expect(runRules(spec, scene)).toEqual([]);
  });
});
