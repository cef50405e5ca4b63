// layoutChart: the geometric facts each mode promises, checked on the scene's own polygons and, where it
// matters, against an independent rasteriser (resvg, alpha summed) drawing the same outlines.
import { describe, expect, it } from 'vitest';
import { parseChart, type ChartDocument, type ChartSpec } from '../../../shared-core/document';
import { isTallyError, TallyError } from '../../../shared-core/errors';
import { boxOf, regionArea, regionToPathData, unionRegions, type Region } from '../../../shared-core/geometry/region';
import { cutByWidth } from '../../../shared-core/glyph';
import { getGlyph } from '../../../shared-core/glyph/catalog';
import { layoutChart, MIN_TEXT_SIZE_MM, RULE_WIDTH_MM } from '../../../shared-core/layout';
import type { Scene, SceneGlyph, SceneMark } from '../../../shared-core/scene';
import { ptToMm } from '../../../shared-core/text';
import { resvgAlphaSum } from '../../helpers/independent';

const PAGE = { width: 210, height: 148, unit: 'mm' } as const;

function doc(encoding: ChartDocument['encoding'], data: ChartDocument['data'], layout: ChartDocument['layout'] = {}): ChartDocument {
  return { format: 'tallyglyph.chart/1', title: 'Test chart', source: 'made-up numbers', data, encoding, layout, page: PAGE };
}

function lay(encoding: ChartDocument['encoding'], data: ChartDocument['data'], layout: ChartDocument['layout'] = {}): Scene {
  return layoutChart(parseChart(doc(encoding, data, layout)));
}

const rows = (...values: number[]) => values.map((value, i) => ({ label: `Category ${String.fromCharCode(65 + i)}`, value }));
const area = (g: SceneGlyph) => regionArea(g.region);
const markInk = (m: SceneMark) => m.glyphs.reduce((a, g) => a + area(g), 0);
const bottom = (r: Region) => {
  const b = boxOf(r);
  return b.y + b.height;
};

/** Ink in mm² as resvg draws the outline alone, about 1500 px across (independent rasteriser, alpha summed). */
function resvgInkMm2(region: Region): number {
  const b = boxOf(region);
  const pad = 0.5;
  const vb = { x: b.x - pad, y: b.y - pad, w: b.width + 2 * pad, h: b.height + 2 * pad };
  const widthPx = Math.round((1500 * vb.w) / Math.max(vb.w, vb.h));
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${vb.w}mm" height="${vb.h}mm" viewBox="${vb.x} ${vb.y} ${vb.w} ${vb.h}"><path d="${regionToPathData(region, 6)}"/></svg>`;
  const mmPerPx = vb.w / widthPx;
  return resvgAlphaSum(svg, widthPx) * mmPerPx * mmPerPx;
}

function expectClose(actual: number, expected: number, relative: number): void {
  expect(Math.abs(actual / expected - 1)).toBeLessThanOrEqual(relative);
}

describe('layoutChart repeat: every glyph normalised by its ink, not its box', () => {
  // Area scaling (DESIGN.md, "Area scaling"): a glyph of ink a is scaled by s = sqrt(A / a), so two different
  // glyphs carry the same ink A. Normalising by bounding box would not: bike and bus fill their boxes differently.
  const scene = lay({ mode: 'repeat', glyph: 'bike', unit: 1 }, [
    { label: 'Bikes', value: 3, glyph: 'bike' },
    { label: 'Buses', value: 3, glyph: 'bus' },
  ]);
  const bike = scene.marks[0].glyphs[0];
  const bus = scene.marks[1].glyphs[0];

  it('gives the bike and the bus the same ink area (polygon areas agree to 1e-9)', () => {
    const unit = scene.summary.unitGlyphInkMm2 as number;
    for (const m of scene.marks) for (const g of m.glyphs) expectClose(area(g), unit, 1e-9);
    expect(bike.glyph).toBe('bike');
    expect(bus.glyph).toBe('bus');
  });

  it('still differs by box: the two glyphs fill their ink boxes very differently, so a box-based size would fail', () => {
    // Ink / box area from the catalog's own figures: bike about 0.48, bus about 0.56.
    const fill = (name: string) => getGlyph(name).boxFraction;
    expect(Math.abs(fill('bike') / fill('bus') - 1)).toBeGreaterThan(0.1);
  });

  it('agrees with resvg: bike ink / bus ink = 1 within 0.5%', () => {
    expectClose(resvgInkMm2(bike.region) / resvgInkMm2(bus.region), 1, 0.005);
    expectClose(resvgInkMm2(bike.region), scene.summary.unitGlyphInkMm2 as number, 0.005);
  });
});

describe('layoutChart repeat: the remainder is an ink-true partial glyph', () => {
  // Partial glyphs (DESIGN.md): a remainder f shows f of the glyph's ink, found by cutting where the ink, not the width, splits.
  const scene = lay({ mode: 'repeat', glyph: 'bike', unit: 1 }, rows(2.37));
  const [first, , partial] = scene.marks[0].glyphs;

  it('draws 2 full glyphs and one partial holding 0.37 of the ink (within 0.002)', () => {
    expect(scene.marks[0].glyphs.map((g) => g.part)).toEqual(['full', 'full', 'partial']);
    expect(partial.fraction).toBeCloseTo(0.37, 12);
    expect(Math.abs(area(partial) / area(first) - 0.37)).toBeLessThan(0.002);
  });

  it('agrees with resvg within 0.002 of the fraction', () => {
    expect(Math.abs(resvgInkMm2(partial.region) / resvgInkMm2(first.region) - 0.37)).toBeLessThan(0.002);
  });

  it('cuts somewhere else than a width cut would: 37% of the width holds a different share of ink', () => {
    const fullRegion = scene.marks[0].glyphs[0].region;
    expect(Math.abs(cutByWidth(fullRegion, 0.37, 'ltr').fraction - 0.37)).toBeGreaterThan(0.01);
  });

  it('keeps the right-hand part when the direction is rtl', () => {
    const rtl = lay({ mode: 'repeat', glyph: 'bike', unit: 1 }, rows(1.4), { direction: 'rtl' });
    const [full, part] = rtl.marks[0].glyphs;
    expect(part.part).toBe('partial');
    expect(Math.abs(area(part) / area(full) - 0.4)).toBeLessThan(0.002);
    // Right-to-left: the first glyph sits right of the second, and the partial keeps its slot's right edge.
    expect(boxOf(full.region).x).toBeGreaterThan(boxOf(part.region).x);
  });

  it('rounds to whole glyphs when asked, and reports what rounding costs', () => {
    const whole = lay({ mode: 'repeat', glyph: 'person', unit: 10, rounding: 'whole' }, rows(14, 27, 30));
    expect(whole.marks.map((m) => m.glyphs.length)).toEqual([1, 3, 3]);
    expect(whole.marks.flatMap((m) => m.glyphs).every((g) => g.part === 'full')).toBe(true);
    const errors = whole.unitChoice?.categories.map((c) => Number(c.relativeError.toFixed(4)));
    expect(errors).toEqual([Number(((1 - 1.4) / 1.4).toFixed(4)), Number(((3 - 2.7) / 2.7).toFixed(4)), 0]);
    expect(whole.warnings.filter((w) => w.code === 'rounding-whole')).toHaveLength(2);
  });
});

describe('layoutChart repeat: shared grid for parts of a whole', () => {
  it('draws 100 glyphs for 23 + 77, the 23 as one contiguous run at the start', () => {
    const scene = lay({ mode: 'repeat', glyph: 'person', unit: 1, arrangement: 'shared-grid' }, rows(23, 77), { columns: 10 });
    expect(scene.marks.map((m) => m.glyphs.length)).toEqual([23, 77]);
    // Reading order in a 10-column grid: the 23 fill rows 1 and 2 and three of row 3.
    const rowsOf = (m: SceneMark) => m.glyphs.map((g) => Math.round(boxOf(g.region).y));
    const highlightedRows = new Set(rowsOf(scene.marks[0]));
    expect(highlightedRows.size).toBe(3);
    const restFirstRow = Math.min(...rowsOf(scene.marks[1]));
    expect(restFirstRow).toBe(Math.max(...highlightedRows));
  });

  it('splits a glyph between two categories by ink when a run ends inside it', () => {
    const scene = lay({ mode: 'repeat', glyph: 'person', unit: 1, arrangement: 'shared-grid' }, rows(2.5, 1.5));
    const a = scene.marks[0].glyphs;
    const b = scene.marks[1].glyphs;
    expect(a.map((g) => g.part)).toEqual(['full', 'full', 'partial']);
    expect(b.map((g) => g.part)).toEqual(['partial', 'full']);
    const unit = scene.summary.unitGlyphInkMm2 as number;
    expect(Math.abs(area(a[2]) / unit - 0.5)).toBeLessThan(0.002);
    expect(Math.abs(area(b[0]) / unit - 0.5)).toBeLessThan(0.002);
    // Together the two halves are exactly one glyph.
    expectClose(regionArea(unionRegions([a[2].region, b[0].region])), unit, 1e-4);
  });
});

describe('layoutChart stack: slot k sits k pitches above the baseline', () => {
  // Stacks (DESIGN.md): a glyph's share of length is its pitch (glyph plus gap), so n glyphs span n pitches.
  const scene = lay({ mode: 'stack', glyph: 'house', unit: 1 }, rows(3, 1.5, 0, 6));
  const pitch = scene.summary.pitchMm as number;
  const baseline = scene.summary.baselineYMm as number;

  it('puts the ink bottom of slot k at baseline - k * pitch in every column', () => {
    for (const m of scene.marks) {
      m.glyphs.forEach((g, k) => {
        expect(g.slot).toBe(k);
        expect(bottom(g.region)).toBeCloseTo(baseline - k * pitch, 9);
      });
    }
  });

  it('makes the pitch the glyph height plus a gap, the same for every column', () => {
    const h = boxOf(scene.marks[0].glyphs[0].region).height;
    expect(pitch).toBeGreaterThan(h);
    const gapMm = pitch - h;
    expect(gapMm / h).toBeCloseTo(0.2, 6); // the default gapRatio of the document schema
    const inks = scene.marks.flatMap((m) => m.glyphs.filter((g) => g.part === 'full').map(area));
    for (const ink of inks) expectClose(ink, scene.summary.unitGlyphInkMm2 as number, 1e-9);
  });

  it('cuts the partial glyph bottom to top by ink', () => {
    const [full, part] = scene.marks[1].glyphs;
    expect(part.part).toBe('partial');
    expect(Math.abs(area(part) / area(full) - 0.5)).toBeLessThan(0.002);
    expect(Math.abs(resvgInkMm2(part.region) / resvgInkMm2(full.region) - 0.5)).toBeLessThan(0.002);
    expect(bottom(part.region)).toBeCloseTo(baseline - pitch, 9);
  });

  it('records lengths of n pitches and draws the baseline rule just under the ink', () => {
    [3, 1.5, 0, 6].forEach((n, i) => expect(scene.marks[i].intended / pitch).toBeCloseTo(n, 12));
    const rule = scene.lines.find((l) => l.role === 'baseline');
    expect(rule?.widthMm).toBe(RULE_WIDTH_MM);
    expect((rule?.y1Mm as number) - RULE_WIDTH_MM / 2).toBeCloseTo(baseline, 9);
  });
});

describe('layoutChart scale: ink area, not height, follows the value', () => {
  // Area scaling (DESIGN.md) with one k for the chart: ink = k * value. d3 scaleSqrt has exponent 0.5
  // (REFERENCES.md), so the linear size grows with sqrt(value); scaling height by value would square the area.
  it('gives values 1 and 2 drawn with two different glyphs an ink ratio of 2.000 (within 0.5%)', () => {
    const scene = lay({ mode: 'scale', glyph: 'bike' }, [
      { label: 'Bike', value: 1, glyph: 'bike' },
      { label: 'Bus', value: 2, glyph: 'bus' },
    ]);
    const [bike, bus] = scene.marks.map((m) => m.glyphs[0]);
    expectClose(area(bus) / area(bike), 2, 0.005);
    expectClose(resvgInkMm2(bus.region) / resvgInkMm2(bike.region), 2, 0.005);
    // The file's scale reads each value back: value = ink * (value per mm²).
    for (const m of scene.marks) expectClose(markInk(m) * scene.summary.unit, m.value, 1e-9);
  });

  it('makes the height ratio the square root of the value ratio for one glyph', () => {
    const scene = lay({ mode: 'scale', glyph: 'circle' }, rows(1, 4));
    const [small, large] = scene.marks.map((m) => m.glyphs[0]);
    expectClose(area(large) / area(small), 4, 1e-9);
    expectClose(boxOf(large.region).height / boxOf(small.region).height, 2, 1e-9);
  });

  it('stands every glyph on one baseline and keeps the largest inside the margins', () => {
    const scene = lay({ mode: 'scale', glyph: 'tree' }, rows(340, 1250, 610, 95));
    const bottoms = scene.marks.map((m) => bottom(m.glyphs[0].region));
    for (const b of bottoms) expect(b).toBeCloseTo(bottoms[0], 9);
    const largest = boxOf(scene.marks[1].glyphs[0].region);
    expect(largest.x).toBeGreaterThanOrEqual(10);
    expect(largest.x + largest.width).toBeLessThanOrEqual(PAGE.width - 10);
    expect(largest.y).toBeGreaterThanOrEqual(10);
  });
});

describe('layoutChart fill: the filled share of ink equals the data share', () => {
  it('fills to value / max (fillTo "max") by ink, the rest being the glyph minus the cut', () => {
    const scene = lay({ mode: 'fill', glyph: 'drop' }, rows(4, 1, 2.5));
    const max = 4;
    for (const m of scene.marks) {
      const filled = m.glyphs.filter((g) => g.part === 'filled').reduce((a, g) => a + area(g), 0);
      const rest = m.glyphs.filter((g) => g.part === 'rest').reduce((a, g) => a + area(g), 0);
      expect(Math.abs(filled / (filled + rest) - m.value / max)).toBeLessThan(0.002);
      expectClose(filled + rest, scene.summary.unitGlyphInkMm2 as number, 1e-4);
    }
    expect(scene.summary.unit).toBe(max);
  });

  it('fills to the share itself with fillTo "share", checked by resvg too', () => {
    const scene = lay({ mode: 'fill', glyph: 'heart', fillTo: 'share' }, rows(0.25, 0.8));
    const m = scene.marks[0];
    const filled = m.glyphs.find((g) => g.part === 'filled') as SceneGlyph;
    const rest = m.glyphs.find((g) => g.part === 'rest') as SceneGlyph;
    expect(Math.abs(area(filled) / (area(filled) + area(rest)) - 0.25)).toBeLessThan(0.002);
    const f = resvgInkMm2(filled.region);
    expect(Math.abs(f / (f + resvgInkMm2(rest.region)) - 0.25)).toBeLessThan(0.002);
    // Bottom to top: the filled part is the lower part of the glyph, and the rest ends where it begins.
    expect(boxOf(filled.region).y).toBeGreaterThan(boxOf(rest.region).y);
    expect(boxOf(filled.region).y).toBeCloseTo(bottom(rest.region), 6);
  });
});

describe('layoutChart zero values', () => {
  it.each([
    ['repeat', { mode: 'repeat', glyph: 'car', unit: 1 }],
    ['stack', { mode: 'stack', glyph: 'car', unit: 1 }],
    ['scale', { mode: 'scale', glyph: 'car' }],
  ] as const)('%s draws no glyph for a zero and still labels it', (_mode, encoding) => {
    const scene = lay(encoding, rows(0, 3, 0));
    expect(scene.marks.map((m) => m.glyphs.length > 0)).toEqual([false, true, false]);
    expect(scene.texts.filter((t) => t.owner === 'mark-1').map((t) => t.role).sort()).toEqual(['label', 'value-label']);
  });

  it('fill draws a zero as an empty glyph: all rest, no filled piece', () => {
    const scene = lay({ mode: 'fill', glyph: 'car' }, rows(0, 3));
    expect(scene.marks[0].glyphs.map((g) => g.part)).toEqual(['rest']);
    expectClose(area(scene.marks[0].glyphs[0]), scene.summary.unitGlyphInkMm2 as number, 1e-6);
  });

  it('copes with every value being zero', () => {
    for (const encoding of [
      { mode: 'repeat', glyph: 'car', unit: 1 },
      { mode: 'stack', glyph: 'car' },
      { mode: 'scale', glyph: 'car' },
      { mode: 'fill', glyph: 'car' },
    ] as const) {
      const scene = lay(encoding, rows(0, 0));
      expect(scene.marks).toHaveLength(2);
    }
  });
});

describe('layoutChart units and the glyph budget', () => {
  it('refuses a billion units at unit 1 quickly, suggesting a unit that fits', () => {
    const start = Date.now();
    let error: unknown;
    try {
      lay({ mode: 'repeat', glyph: 'person', unit: 1 }, rows(1e9));
    } catch (e) {
      error = e;
    }
    expect(Date.now() - start).toBeLessThan(2000);
    expect(isTallyError(error)).toBe(true);
    const e = error as TallyError;
    expect(e.code).toBe('data-invalid');
    const suggested = (e.details as { suggestedUnit: number }).suggestedUnit;
    expect(1e9 / suggested).toBeLessThanOrEqual(2000);
    expect(e.message).toContain('500,000');
  });

  it('chooses a readable unit when none is given and says so', () => {
    const scene = lay({ mode: 'repeat', glyph: 'person' }, rows(1234, 5678, 910));
    expect(scene.unitChoice?.chosen).toBe(true);
    expect(scene.summary.unit).toBe(200); // 5678 / 200 = 28.4 glyphs, under the 50 per category; 100 would give 56.8
    expect(scene.unitChoice?.categories[1].exact).toBeCloseTo(28.39, 12);
    expect(scene.marks[1].intended).toBeCloseTo(28.39, 12);
  });

  it('never lets one glyph stand for a fraction of a counted thing', () => {
    const scene = lay({ mode: 'repeat', glyph: 'person' }, rows(3, 2));
    expect(scene.summary.unit).toBe(1);
  });
});

describe('layoutChart glyphs', () => {
  const square = '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"><rect x="1" y="1" width="8" height="8"/></svg>';

  it('measures inline markup and normalises it like a catalog glyph', () => {
    const scene = lay({ mode: 'repeat', glyph: 'circle', unit: 1 }, [
      { label: 'Inline', value: 1, glyph: { svg: square } },
      { label: 'Circle', value: 1 },
    ]);
    const [sq, circle] = scene.marks.map((m) => m.glyphs[0]);
    expect(sq.glyph).toBe('inline:1');
    expectClose(area(sq), area(circle), 1e-9);
    // A square's box is its ink; a circle's ink is pi/4 of its box, so the normalised circle is the wider one.
    expectClose(boxOf(circle.region).width / boxOf(sq.region).width, Math.sqrt(4 / Math.PI), 1e-3);
  });

  it('refuses inline markup that is not XML, naming the field', () => {
    expect(() => lay({ mode: 'repeat', glyph: { svg: '<svg><path d="M0 0' }, unit: 1 }, rows(1))).toThrow(/encoding\.glyph.*not usable SVG/);
  });

  it('refuses a glyph without ink', () => {
    const line = '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"><path d="M0 0L10 0"/></svg>';
    try {
      lay({ mode: 'repeat', glyph: 'car', unit: 1 }, [{ label: 'Lines', value: 1, glyph: { svg: line } }]);
      expect.unreachable();
    } catch (e) {
      expect((e as TallyError).code).toBe('glyph-empty');
      expect((e as TallyError).message).toMatch(/data\[0\]\.glyph.*no ink/);
    }
  });

  it('refuses an unknown catalog name with close names', () => {
    expect(() => lay({ mode: 'repeat', glyph: 'bicycel', unit: 1 }, rows(1))).toThrow(/bike/);
  });
});

describe('layoutChart text', () => {
  const specs: ChartSpec[] = [
    parseChart(doc({ mode: 'repeat', glyph: 'bike', unit: 50, unitName: 'rides' }, rows(420, 275, 610, 135))),
    parseChart(doc({ mode: 'stack', glyph: 'coffee', unit: 20 }, ['Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat', 'Sun'].map((label, i) => ({ label, value: [86, 94, 112, 105, 148, 173, 131][i] })))),
    parseChart(doc({ mode: 'fill', glyph: 'drop' }, rows(3, 14, 15, 9, 26, 5, 35, 8, 9, 7, 9, 3, 2, 3, 8, 4))),
  ];

  it('keeps every text at or above 6 pt and inside the margins', () => {
    // 6 pt = 6 x 25.4 / 72 mm (CSS absolute units), the usual printers' minimum (REFERENCES.md, weak).
    expect(MIN_TEXT_SIZE_MM).toBeGreaterThanOrEqual(ptToMm(6));
    for (const spec of specs) {
      const scene = layoutChart(spec);
      for (const t of scene.texts) {
        expect(t.sizeMm).toBeGreaterThanOrEqual(ptToMm(6));
        const b = t.bboxMm as NonNullable<typeof t.bboxMm>;
        expect(b.x).toBeGreaterThanOrEqual(spec.layout.margins.left - 1e-9);
        expect(b.x + b.width).toBeLessThanOrEqual(spec.page.widthMm - spec.layout.margins.right + 1e-9);
      }
    }
  });

  it('refuses, before anything is written, a chart that cannot fit its page at a legible size', () => {
    const e = (() => {
      try {
        lay({ mode: 'stack', glyph: 'coin', unit: 1 }, rows(...Array.from({ length: 40 }, (_, i) => i + 1)));
      } catch (err) {
        return err as TallyError;
      }
      return null;
    })();
    expect(e?.code).toBe('layout-no-room');
    expect(e?.message).toMatch(/bigger page/);
  });

  it('writes the legend sentence with the unit', () => {
    const scene = layoutChart(specs[0]);
    expect(scene.texts.find((t) => t.role === 'legend')?.text).toBe('one glyph = 50 rides');
    expect(scene.legendKeys[0].unitValue).toBe(50);
    expectClose(regionArea(scene.legendKeys[0].region), scene.summary.unitGlyphInkMm2 as number, 1e-9);
  });
});
