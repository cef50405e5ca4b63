import { describe, expect, it } from 'vitest';
import { chartToDocument, parseChart, CHART_FORMAT, type ChartSpec } from '../../../shared-core/document/index';
import { TallyError } from '../../../shared-core/errors';

const EXAMPLE_TEXT = `{ "format": "tallyglyph.chart/1", "title": "Bikes parked per day", "source": "Site counts, invented demo data", "data": [ { "label": "Station A", "value": 7.5 }, { "label": "Station B", "value": 22.5 } ], "encoding": { "mode": "repeat", "unit": 1, "glyph": "bike" }, "page": { "width": 180, "height": 120, "unit": "mm" } }`;

function example(): Record<string, unknown> {
  return JSON.parse(EXAMPLE_TEXT) as Record<string, unknown>;
}

// Tests poke at arbitrary fields, including wrong types on purpose.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
type LooseDocument = Record<string, any>;

function patched(patch: (doc: LooseDocument) => void): Record<string, unknown> {
  const doc = example();
  patch(doc);
  return doc;
}

function problemOf(input: unknown): TallyError {
  try {
    parseChart(input);
  } catch (e) {
    if (e instanceof TallyError) return e;
    throw e;
  }
  throw new Error('expected parseChart to throw');
}

describe('parseChart accepts and defaults', () => {
  it('accepts the reference example, as text and as an object, with every default filled in', () => {
    const fromText = parseChart(EXAMPLE_TEXT);
    expect(parseChart(example())).toEqual(fromText);
    expect(fromText).toEqual({
      format: CHART_FORMAT,
      title: 'Bikes parked per day',
      source: 'Site counts, invented demo data',
      data: [
        { label: 'Station A', value: 7.5 },
        { label: 'Station B', value: 22.5 },
      ],
      encoding: { mode: 'repeat', unit: 1, glyph: 'bike', rounding: 'ink-cut', arrangement: 'per-category' },
      layout: {
        columns: 'auto',
        gapRatio: 0.2,
        direction: 'ltr',
        labels: true,
        valueLabels: true,
        legend: true,
        margins: { top: 10, right: 10, bottom: 10, left: 10 },
        bleedMm: 0,
      },
      page: { widthMm: 180, heightMm: 120, given: { width: 180, height: 120, unit: 'mm' } },
      outlineText: true,
      // References are the default: copies written with <use> measure exactly as copies written out in full.
      useReferences: true,
    } satisfies ChartSpec);
  });

  it('converts the page to mm with CSS absolute units (1 in = 25.4 mm = 72 pt = 96 px)', () => {
    const page = (width: number, height: number, unit: string) => parseChart(patched((d) => (d.page = { width, height, unit }))).page;
    // US Letter, 8.5 x 11 in.
    expect(page(8.5, 11, 'in').widthMm).toBeCloseTo(215.9, 9);
    expect(page(8.5, 11, 'in').heightMm).toBeCloseTo(279.4, 9);
    // 72 pt is one inch; 96 px is one inch.
    expect(page(72, 144, 'pt').widthMm).toBeCloseTo(25.4, 12);
    expect(page(72, 144, 'pt').heightMm).toBeCloseTo(50.8, 12);
    expect(page(96, 960, 'px').widthMm).toBeCloseTo(25.4, 12);
    expect(page(96, 960, 'px').heightMm).toBeCloseTo(254, 12);
    // A4 (210 x 297 mm, ISO 216, from memory) written in points: 210 / 25.4 * 72 = 595.2756 pt.
    const a4 = page(595.2756, 841.8898, 'pt');
    expect(a4.widthMm).toBeCloseTo(210, 4);
    expect(a4.heightMm).toBeCloseTo(297, 4);
    expect(a4.given).toEqual({ width: 595.2756, height: 841.8898, unit: 'pt' });
  });

  it('fills mode-specific defaults and keeps explicit options', () => {
    const fill = parseChart(patched((d) => (d.encoding = { mode: 'fill', glyph: { svg: '<svg/>' } })));
    expect(fill.encoding).toEqual({ mode: 'fill', glyph: { svg: '<svg/>' }, rounding: 'ink-cut', fillTo: 'max' });
    const stack = parseChart(patched((d) => (d.encoding = { mode: 'stack', glyph: 'bike', rounding: 'whole', unitName: 'bikes' })));
    expect(stack.encoding).toEqual({ mode: 'stack', glyph: 'bike', rounding: 'whole', unitName: 'bikes' });
    const laid = parseChart(
      patched((d) => {
        d.layout = { columns: 5, gapRatio: 0, direction: 'btt', colors: ['#1f77b4', '#abc'], margins: { top: 4 }, bleedMm: 3, glyphSizeMm: 8, legend: false };
        d.data[0].color = '#ff000080';
        d.data[1].glyph = 'bus';
        d.outlineText = false;
        d.useReferences = false;
      }),
    );
    expect(laid.layout).toEqual({
      columns: 5,
      gapRatio: 0,
      direction: 'btt',
      colors: ['#1f77b4', '#abc'],
      margins: { top: 4, right: 10, bottom: 10, left: 10 },
      bleedMm: 3,
      glyphSizeMm: 8,
      labels: true,
      valueLabels: true,
      legend: false,
    });
    expect(laid.data).toEqual([
      { label: 'Station A', value: 7.5, color: '#ff000080' },
      { label: 'Station B', value: 22.5, glyph: 'bus' },
    ]);
    // An explicit choice against each default is kept.
    expect([laid.outlineText, laid.useReferences]).toEqual([false, false]);
  });

  it('round-trips through chartToDocument', () => {
    const spec = parseChart(
      patched((d) => {
        d.page = { width: 8.5, height: 11, unit: 'in' };
        d.encoding.arrangement = 'shared-grid';
        d.layout = { margins: 12 };
      }),
    );
    const doc = chartToDocument(spec);
    expect(doc.page).toEqual({ width: 8.5, height: 11, unit: 'in' });
    expect(parseChart(JSON.stringify(doc))).toEqual(spec);
  });
});

describe('parseChart refuses with the field named', () => {
  it('a missing or unknown format is a version error naming the known versions', () => {
    const missing = problemOf(patched((d) => delete d.format));
    expect(missing.code).toBe('document-version');
    expect(missing.message).toMatch(/"tallyglyph\.chart\/1"/);
    const newer = problemOf(patched((d) => (d.format = 'tallyglyph.chart/2')));
    expect(newer.code).toBe('document-version');
    expect(newer.message).toBe('Unknown document format "tallyglyph.chart/2". Known versions: "tallyglyph.chart/1".');
  });

  it('a wrong type names the path: data[1].value: expected a number', () => {
    const e = problemOf(patched((d) => (d.data[1].value = '22.5')));
    expect(e.code).toBe('document-invalid');
    expect(e.message).toMatch(/^data\[1\]\.value: expected a number/);
  });

  it('non-finite numbers and negative values say what is wrong', () => {
    expect(problemOf(patched((d) => (d.data[0].value = Infinity))).message).toMatch(/^data\[0\]\.value: expected a finite number, got Infinity/);
    expect(problemOf(patched((d) => (d.data[1].value = NaN))).message).toMatch(/^data\[1\]\.value: expected a finite number, got NaN/);
    const negative = problemOf(patched((d) => (d.data[1].value = -4)));
    expect(negative.message).toMatch(/^data\[1\]\.value: is negative \(-4\): a count, area or length of ink cannot show a negative amount/);
  });

  it('empty data is an error', () => {
    expect(problemOf(patched((d) => (d.data = []))).message).toMatch(/^data: is empty/);
  });

  it('missing fields, unknown fields and bad choices are named', () => {
    expect(problemOf(patched((d) => delete d.page.unit)).message).toMatch(/^page\.unit: required: one of "mm", "in", "pt", "px"/);
    expect(problemOf(patched((d) => (d.encoding.colour = 'red'))).message).toMatch(/^encoding\.colour: unknown field/);
    expect(problemOf(patched((d) => (d.encoding.mode = 'bars'))).message).toMatch(/^encoding\.mode: expected one of "repeat", "stack", "scale", "fill", got the text "bars"/);
    expect(problemOf(patched((d) => (d.encoding.unit = 0))).message).toMatch(/^encoding\.unit: must be greater than 0/);
    expect(problemOf(patched((d) => (d.encoding.glyph = 7))).message).toMatch(/^encoding\.glyph: expected a glyph name/);
    expect(problemOf(patched((d) => (d.encoding.glyph = ''))).message).toMatch(/^encoding\.glyph: must not be empty/);
    expect(problemOf(patched((d) => (d.encoding.glyph = { svg: '<svg/>', href: 'x' }))).message).toMatch(/^encoding\.glyph\.href: unknown field/);
    expect(problemOf(patched((d) => (d.encoding.glyph = { svg: '' }))).message).toMatch(/^encoding\.glyph\.svg: must not be empty/);
    expect(problemOf(patched((d) => (d.data[0].color = 'red'))).message).toMatch(/^data\[0\]\.color: expected a CSS hex colour/);
    expect(problemOf(patched((d) => (d.data[0].label = ''))).message).toMatch(/^data\[0\]\.label: must not be empty/);
    expect(problemOf(patched((d) => (d.layout = { columns: 2.5 }))).message).toMatch(/^layout\.columns: expected "auto" or a whole number/);
    expect(problemOf(patched((d) => (d.layout = { colors: ['#12345'] }))).message).toMatch(/^layout\.colors\[0\]: expected a CSS hex colour/);
  });

  it('options for another mode, shares above 1, repeated labels and oversized margins are refused', () => {
    expect(problemOf(patched((d) => (d.encoding.fillTo = 'share'))).message).toMatch(/^encoding\.fillTo: only applies to mode "fill"/);
    expect(problemOf(patched((d) => (d.encoding = { mode: 'stack', glyph: 'bike', arrangement: 'shared-grid' }))).message).toMatch(
      /^encoding\.arrangement: only applies to mode "repeat"/,
    );
    const share = problemOf(patched((d) => (d.encoding = { mode: 'fill', glyph: 'bike', fillTo: 'share' })));
    expect(share.message).toMatch(/^data\[0\]\.value: is 7\.5, more than 1/);
    expect(problemOf(patched((d) => (d.data[1].label = 'Station A'))).message).toMatch(/^data\[1\]\.label: "Station A" is already used by data\[0\]/);
    expect(problemOf(patched((d) => (d.layout = { margins: 60 }))).message).toMatch(/^layout\.margins: top and bottom margins \(120 mm together\)/);
  });

  it('collects every problem in the details and counts the rest in the message', () => {
    const e = problemOf(
      patched((d) => {
        d.data[0].value = 'x';
        d.data[1].value = -1;
        d.page.width = 0;
      }),
    );
    const details = e.details as { path: string; message: string }[];
    expect(details.map((p) => p.path)).toEqual(['data[0].value', 'data[1].value', 'page.width']);
    expect(e.message).toMatch(/\(and 2 more: data\[1\]\.value, page\.width\)$/);
  });

  it('refuses text that is not JSON and JSON that is not an object', () => {
    expect(problemOf('{ "format": ').message).toMatch(/not valid JSON/);
    expect(problemOf('[1, 2]').code).toBe('document-invalid');
    expect(problemOf(null).message).toMatch(/must be a JSON object/);
  });
});
