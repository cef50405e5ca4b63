// The automatic unit, category colours and legend keys: what the layout offers must pass the export gate,
// categories that only colour tells apart never share a colour, and every glyph drawn is keyed.
import { describe, expect, it } from 'vitest';
import { DEMO_CHARTS } from '../../../shared-core/demo/demoCharts';
import { parseChart, type ChartDocument } from '../../../shared-core/document';
import { layoutChart, PALETTE } from '../../../shared-core/layout';
import { autoUnits, wholeCountsPass } from '../../../shared-core/layout/resolveUnit';
import { renderChart } from '../../../shared-core/pipeline/renderChart';
import { caught } from '../../helpers/errors';

const bikeDemo = DEMO_CHARTS.find((d) => d.name === 'repeat-bike-share')!.document;

describe('choose automatically, whole glyphs', () => {
  const wholeAuto: ChartDocument = { ...bikeDemo, encoding: { ...bikeDemo.encoding, unit: undefined, rounding: 'whole' } };

  it('offers for the bike demo only units whose rounded counts pass the gate, and the chart exports and re-verifies', { timeout: 60_000 }, () => {
    // Worked by hand with Tufte's effect form (1983, p. 57): at 20 rides per glyph Harbour Gate 420 -> 21 glyphs and
    // Station Square 135 -> 7 (6.75 rounded): (21/7 - 1) / (420/135 - 1) = 2 / 2.111 = 0.947, outside 0.95-1.05.
    expect(wholeCountsPass([420, 275, 610, 135], ['a', 'b', 'c', 'd'], 20)).toBe(false);
    // At 5 rides per glyph every count is whole (84, 55, 122, 27): lie factor 1.
    expect(wholeCountsPass([420, 275, 610, 135], ['a', 'b', 'c', 'd'], 5)).toBe(true);
    const offered = autoUnits(parseChart(wholeAuto), { maxGlyphsPerCategory: 50 });
    for (const u of offered) expect(wholeCountsPass([420, 275, 610, 135], ['a', 'b', 'c', 'd'], u)).toBe(true);
    const result = renderChart(wholeAuto);
    expect(result.report.pass).toBe(true);
    expect(result.scene.unitChoice?.chosen).toBe(true);
    expect(result.scene.unitChoice?.unit).not.toBe(20);
  });

  it('says so when no readable unit can draw the values as whole glyphs', () => {
    // 0.3 and 1999.7: any unit small enough to draw 0.3 as a glyph needs more than the 2,000-glyph budget.
    const e = caught(() => renderChart({ ...wholeAuto, data: [{ label: 'Small', value: 0.3 }, { label: 'Large', value: 1999.7 }] }));
    expect(e.code).toBe('data-invalid');
    expect(e.message).toMatch(/No readable unit/);
    expect(e.message).toMatch(/Cut remainders by ink/);
  });
});

describe('category colours', () => {
  const categories = (n: number) => Array.from({ length: n }, (_, i) => ({ label: `Plot ${i + 1}`, value: i + 1 }));
  const doc = (encoding: ChartDocument['encoding'], data: ChartDocument['data'], layout: ChartDocument['layout'] = {}): ChartDocument => ({
    format: 'tallyglyph.chart/1',
    data,
    encoding,
    layout,
    page: { width: 297, height: 210, unit: 'mm' },
  });

  it('never gives two categories of a shared grid one colour: nine distinct colours, then a refusal with the reason', () => {
    const nine = layoutChart(parseChart(doc({ mode: 'repeat', glyph: 'person', unit: 1, arrangement: 'shared-grid' }, categories(9))));
    expect(new Set(nine.marks.map((m) => m.color)).size).toBe(9);
    const e = caught(() => layoutChart(parseChart(doc({ mode: 'repeat', glyph: 'person', unit: 1, arrangement: 'shared-grid' }, categories(10)))));
    expect(e.code).toBe('data-invalid');
    expect(e.message).toMatch(/10 categories are more than the 9 colours/);
  });

  it('refuses colours a user set equal in a shared grid, naming both categories', () => {
    const data = [{ label: 'Bus', value: 3, color: '#336699' }, { label: 'Tram', value: 4, color: '#336699' }];
    const e = caught(() => layoutChart(parseChart(doc({ mode: 'repeat', glyph: 'person', unit: 1, arrangement: 'shared-grid' }, data))));
    expect(e.message).toMatch(/"Bus" and "Tram" are both #336699/);
  });

  it('says, rather than hides, a repeated colour where labels tell the categories apart', () => {
    const scene = layoutChart(parseChart(doc({ mode: 'stack', glyph: 'coin', unit: 1 }, categories(10))));
    expect(new Set(scene.marks.slice(0, 9).map((m) => m.color)).size).toBe(9);
    expect(scene.warnings.map((w) => w.code)).toContain('color-repeated');
  });

  it('uses the nine colours of the named scheme, the first six at 3:1 or more against white paper', () => {
    // WCAG 2.1 relative luminance and contrast ratio (definitions "relative luminance" and "contrast ratio").
    const lum = (hex: string) => {
      const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255).map((c) => (c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4));
      return 0.2126 * r + 0.7152 * g + 0.0722 * b;
    };
    expect(PALETTE).toHaveLength(9);
    expect(new Set(PALETTE).size).toBe(9);
    // Paul Tol's muted scheme (SRON/EPS/TN/09-002), from memory.
    expect([...PALETTE].sort()).toEqual(['#117733', '#332288', '#44aa99', '#882255', '#88ccee', '#999933', '#aa4499', '#cc6677', '#ddcc77']);
    for (const c of PALETTE.slice(0, 6)) expect(1.05 / (lum(c) + 0.05)).toBeGreaterThanOrEqual(3);
  });
});

describe('legend keys', () => {
  it('keys every glyph drawn, including a row drawn with its own glyph (repeat, stack, fill)', () => {
    const data = [{ label: 'Bikes', value: 3 }, { label: 'Buses', value: 2, glyph: 'bus' }];
    for (const encoding of [
      { mode: 'repeat', glyph: 'bike', unit: 1 },
      { mode: 'stack', glyph: 'bike', unit: 1 },
      { mode: 'fill', glyph: 'bike' },
    ] as ChartDocument['encoding'][]) {
      const scene = layoutChart(parseChart({ format: 'tallyglyph.chart/1', data, encoding, page: { width: 180, height: 120, unit: 'mm' } }));
      const drawn = new Set(scene.marks.flatMap((m) => m.glyphs.map((g) => g.glyph)));
      const keyed = new Set(scene.legendKeys.map((k) => k.glyph));
      expect([...drawn].sort()).toEqual(['bike', 'bus']);
      expect([...keyed].sort()).toEqual([...drawn].sort());
    }
  });

  it('keys every glyph drawn in scale mode, each key at the marks\' ink per value, and the chart still passes', { timeout: 60_000 }, () => {
    // Common practice, no source: a key explains every symbol the chart draws. Values 12 and 45.5 litres
    // (the chores dataset of issue 7): the first reference is readableFloor(45.5 / 4) = 10.
    const doc: ChartDocument = {
      format: 'tallyglyph.chart/1',
      data: [{ label: 'Dishes', value: 12 }, { label: 'Laundry', value: 45.5, glyph: 'bus' }],
      encoding: { mode: 'scale', glyph: 'bike', unitName: 'litres' },
      page: { width: 180, height: 120, unit: 'mm' },
    } as ChartDocument;
    const scene = layoutChart(parseChart(doc));
    const drawn = new Set(scene.marks.flatMap((m) => m.glyphs.map((g) => g.glyph)));
    expect([...drawn].sort()).toEqual(['bike', 'bus']);
    expect([...new Set(scene.legendKeys.map((k) => k.glyph))].sort()).toEqual(['bike', 'bus']);
    const busKeys = scene.legendKeys.filter((k) => k.glyph === 'bus');
    expect(busKeys.map((k) => k.unitValue)).toEqual([10]);
    const result = renderChart(doc);
    expect(result.report.problems).toEqual([]);
    expect(result.report.pass).toBe(true);
  });
});
