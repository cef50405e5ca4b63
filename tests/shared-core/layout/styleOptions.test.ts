// Layout and style options of the document, each asserted on the written SVG and re-verified by renderChart:
// title and source sizes, sort order, value units, key wording and the serif font.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import * as opentypeModule from 'opentype.js';
import { describe, expect, it } from 'vitest';
import { DEMO_CHARTS } from '../../../shared-core/demo/demoCharts';
import { renderChart } from '../../../shared-core/pipeline/renderChart';
import { writtenMarks, writtenTexts } from './writtenSvg';

const opentype: typeof opentypeModule = (opentypeModule as unknown as { default?: typeof opentypeModule }).default ?? opentypeModule;

// Invented household chores, litres of water each (our own scenario).
const CHORES = [
  { label: 'Washing up', value: 12 },
  { label: 'Laundry', value: 45.5 },
  { label: 'Shower', value: 7 },
  { label: 'Garden', value: 80 },
  { label: 'Kettle', value: 3.2 },
];

function chores(encoding: Record<string, unknown>, layout: Record<string, unknown> = {}, over: Record<string, unknown> = {}) {
  return {
    format: 'tallyglyph.chart/1',
    title: 'Water per chore',
    source: 'Invented household diary',
    data: CHORES,
    encoding: { glyph: 'drop', unitName: 'litres', ...encoding },
    layout,
    page: { width: 180, height: 120, unit: 'mm' },
    ...over,
  };
}

const MODES: Record<string, Record<string, unknown>> = {
  repeat: { mode: 'repeat', unit: 5 },
  'shared grid': { mode: 'repeat', unit: 2, arrangement: 'shared-grid' },
  stack: { mode: 'stack', unit: 5 },
  scale: { mode: 'scale' },
  fill: { mode: 'fill' },
};

function passes(doc: unknown): string {
  const result = renderChart(doc);
  expect(result.report.pass, JSON.stringify(result.report.findings.map((f) => f.code))).toBe(true);
  return result.svg;
}

describe('options left out draw exactly what was drawn before them', () => {
  it('renders every demo byte for byte the same with the default of every option written out', () => {
    const defaults = { groupEvery: 0, labelPosition: 'beside', labelAlign: 'end', sort: 'given', font: 'sans', titleSizePt: (5 * 72) / 25.4, sourceSizePt: (2.5 * 72) / 25.4 };
    for (const demo of DEMO_CHARTS) {
      const plain = renderChart(demo.document).svg;
      const explicit = renderChart({ ...demo.document, layout: { ...demo.document.layout, ...defaults } }).svg;
      expect(explicit === plain, demo.name).toBe(true);
    }
  });
});

describe('title and source sizes', () => {
  it.each(Object.keys(MODES))('%s: the written title and source outlines scale with the sizes asked for', (mode) => {
    const base = writtenTexts(passes(chores(MODES[mode])));
    const big = writtenTexts(passes(chores(MODES[mode], { titleSizePt: 24, sourceSizePt: 9 })));
    const title0 = base.find((t) => t.role === 'title')!;
    const title1 = big.find((t) => t.role === 'title')!;
    const source1 = big.find((t) => t.role === 'source')!;
    const source0 = base.find((t) => t.role === 'source')!;
    // The file records the size in pt (docs/chart-svg.md); default title 5 mm = 14.17 pt (1 pt = 25.4/72 mm, CSS Values).
    expect(title0.sizePt).toBeCloseTo(14.17, 2);
    expect(title1.sizePt).toBe(24);
    expect(source1.sizePt).toBe(9);
    // An outline is the font's em square scaled: the same line's ink height scales exactly with the size.
    expect(title1.box!.height / title0.box!.height).toBeCloseTo(24 / title0.sizePt, 2);
    expect(source1.box!.height / source0.box!.height).toBeCloseTo(9 / source0.sizePt, 2);
  });

  it('warns when the source is set under 6 pt, the usual print minimum', () => {
    const result = renderChart(chores(MODES.repeat, { sourceSizePt: 5 }));
    expect(result.warnings.map((w) => w.code)).toContain('text-small');
    expect(writtenTexts(result.svg).find((t) => t.role === 'source')!.sizePt).toBe(5);
  });
});

describe('sort', () => {
  it.each(['repeat', 'stack', 'scale', 'fill'])('%s: rows are drawn largest first or smallest first; ids and colours stay with their category', (mode) => {
    const given = writtenMarks(passes(chores(MODES[mode])));
    for (const sort of ['descending', 'ascending'] as const) {
      const marks = writtenMarks(passes(chores(MODES[mode], { sort })));
      // Chart order read from the file: repeat rows top to bottom, other modes left to right (single row here).
      const along = (m: (typeof marks)[number]) => (mode === 'repeat' ? m.box.y : m.box.x);
      const drawnOrder = [...marks].sort((a, b) => along(a) - along(b)).map((m) => m.value);
      const expected = CHORES.map((c) => c.value).sort((a, b) => (sort === 'descending' ? b - a : a - b));
      expect(drawnOrder).toEqual(expected);
      for (const m of marks) expect(m.id).toBe(given.find((g) => g.label === m.label)!.id);
    }
  });
});

describe('value units', () => {
  it.each(Object.keys(MODES))('%s: value labels read "12 L"', (mode) => {
    const svg = passes(chores(MODES[mode], { valueUnit: 'L' }, { outlineText: false }));
    const values = writtenTexts(svg).filter((t) => t.role === 'value-label').map((t) => t.content);
    expect(values).toContain('12 L');
    expect(values).toContain('45.5 L');
    expect(values.every((v) => v!.endsWith(' L'))).toBe(true);
  });
});

describe('key wording', () => {
  it.each(['repeat', 'shared grid', 'stack'])('%s: the key states the unit drawn, filled in from the data', (mode) => {
    const svg = passes(chores(MODES[mode], { keyWording: 'Each drop stands for {amount} {unit} of water' }, { outlineText: false }));
    const unit = (MODES[mode] as { unit: number }).unit;
    const key = writtenTexts(svg).find((t) => t.role === 'legend')!;
    expect(key.content).toBe(`Each drop stands for ${unit} litres of water`);
    // The key glyph carries the same amount for the verifier (data-unit-value, docs/chart-svg.md).
    expect(svg).toMatch(new RegExp(`class="tg-legend-key" data-glyph="drop" data-unit-value="${unit}"`));
  });

  it('fill: {amount} is the value of a full glyph; the outlined key is the filled-in sentence', () => {
    const doc = chores(MODES.fill, { keyWording: 'A full drop: {amount} {unit}' });
    const asText = writtenTexts(passes({ ...doc, outlineText: false })).find((t) => t.role === 'legend')!;
    expect(asText.content).toBe('A full drop: 80 litres');
    // The outline's ink width is that of the sentence in the package's own Noto Sans (opentype.js reading its WOFF).
    const outlined = writtenTexts(passes(doc)).find((t) => t.role === 'legend')!;
    const sansDir = dirname(createRequire(import.meta.url).resolve('@fontsource/noto-sans/LICENSE'));
    const sans400 = opentype.parse(readFileSync(join(sansDir, 'files', 'noto-sans-latin-400-normal.woff')).buffer);
    const ref = sans400.getPath('A full drop: 80 litres', 0, 0, (outlined.sizePt * 25.4) / 72).getBoundingBox();
    expect(Math.abs(outlined.box!.width / (ref.x2 - ref.x1) - 1)).toBeLessThan(0.01);
  });
});

describe('serif font', () => {
  // The font as published in the npm package (WOFF), read by opentype.js directly, not through the bundled module.
  const require = createRequire(import.meta.url);
  const serifDir = dirname(require.resolve('@fontsource/noto-serif/LICENSE'));
  const serif700 = opentype.parse(readFileSync(join(serifDir, 'files', 'noto-serif-latin-700-normal.woff')).buffer);

  it.each(Object.keys(MODES))('%s: every text is outlined from Noto Serif and the chart still verifies', (mode) => {
    const sans = writtenTexts(passes(chores(MODES[mode])));
    const serif = writtenTexts(passes(chores(MODES[mode], { font: 'serif' })));
    expect(serif.length).toBe(sans.length);
    // Every outline changes: no text stays in the sans face.
    serif.forEach((t, i) => expect(t.pathData).not.toBe(sans[i].pathData));
    // The title's ink width agrees with the package font's own outline of the same line (opentype.js, no kerning
    // differences for this text beyond 1%), and differs from the sans width by more than that.
    const title = serif.find((t) => t.role === 'title')!;
    const sizeMm = (title.sizePt * 25.4) / 72;
    const ref = serif700.getPath('Water per chore', 0, 0, sizeMm).getBoundingBox();
    expect(Math.abs(title.box!.width / (ref.x2 - ref.x1) - 1)).toBeLessThan(0.01);
    const sansTitle = sans.find((t) => t.role === 'title')!;
    expect(Math.abs(sansTitle.box!.width / (ref.x2 - ref.x1) - 1)).toBeGreaterThan(0.02);
  });

  it('writes font-family "Noto Serif" when text is not outlined', () => {
    const svg = passes(chores(MODES.repeat, { font: 'serif' }, { outlineText: false }));
    expect(svg).toContain('font-family="Noto Serif"');
    expect(svg).not.toContain('font-family="Noto Sans"');
  });
});
