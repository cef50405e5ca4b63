// Charts fit their page: every mode on common sheets and a tiny label, with 3, 10 and 16 categories, keeps its
// marks, labels, key, title and source inside the margins without overlaps, or is refused before anything is
// written with a sentence that says what to change. Sheet sizes from ISO 216 (A4 210 x 297 mm, A5 148 x 210 mm).
import { describe, expect, it } from 'vitest';
import { parseChart, type ChartDocument } from '../../../shared-core/document';
import { isTallyError } from '../../../shared-core/errors';
import { layoutChart } from '../../../shared-core/layout';
import { renderChart } from '../../../shared-core/pipeline/renderChart';
import type { Scene } from '../../../shared-core/scene';
import { caught } from '../../helpers/errors';
import { drawnBoxes, pageFitProblems } from './pageFit';
import { writtenBlock, writtenLegendKeys, writtenMarks, writtenTexts } from './writtenSvg';
import { REPEAT_MAX_GLYPH_MM } from '../../../shared-core/layout/repeatLayout';
import { MIN_GLYPH_MM } from '../../../shared-core/layout/fitSize';

// Invented stations of an invented town; values chosen to give remainders and a wide range.
const LABELS = ['Harbour Gate', 'Mill Lane', 'Old Market', 'Station Square', 'Quarry Hill', 'Ferry Steps', 'Tanners Row', 'Bell Yard', 'Copper Street', 'Lantern Walk', 'North Pier', 'Rope Walk', 'Saltmarsh', 'Weavers Close', 'Kiln Lane', 'Orchard End'];
const VALUES = [42, 27.5, 61, 13.5, 35, 8, 52, 19, 30, 4.5, 47, 23, 16, 39, 11, 26];
const PAGES: Record<string, { width: number; height: number }> = {
  'A5 landscape': { width: 210, height: 148 },
  'A4 portrait': { width: 210, height: 297 },
  '180 x 120 mm': { width: 180, height: 120 },
  '40 x 30 mm': { width: 40, height: 30 },
};
const MODES: Record<string, ChartDocument['encoding']> = {
  repeat: { mode: 'repeat', glyph: 'bike', unitName: 'rides' },
  'shared grid': { mode: 'repeat', glyph: 'person', arrangement: 'shared-grid', unitName: 'people' },
  stack: { mode: 'stack', glyph: 'coffee', unitName: 'cups' },
  scale: { mode: 'scale', glyph: 'tree', unitName: 'trees' },
  fill: { mode: 'fill', glyph: 'drop', unitName: 'litres' },
  'scale, a glyph per row': { mode: 'scale', glyph: 'tree', unitName: 'things' },
};
/** Bundled glyphs of many shapes (wide, tall, round), one per row where a mode's name says so: every one is keyed. */
const ROW_GLYPHS = ['tree', 'house', 'bike', 'car', 'bus', 'heart', 'person', 'drop', 'coffee', 'star', 'leaf', 'fish', 'sun', 'book', 'plane', 'cat'];

function chart(encoding: ChartDocument['encoding'], page: { width: number; height: number }, n: number, glyphPerRow = encoding === MODES['scale, a glyph per row']): ChartDocument {
  return {
    format: 'tallyglyph.chart/1',
    title: `Rides per station (${n})`,
    source: 'Invented demo data',
    data: LABELS.slice(0, n).map((label, i) => ({ label, value: VALUES[i], ...(glyphPerRow ? { glyph: ROW_GLYPHS[i] } : {}) })),
    encoding,
    page: { ...page, unit: 'mm' },
  };
}

describe('every mode fits the page or is refused before export', () => {
  for (const [pageName, page] of Object.entries(PAGES)) {
    for (const [modeName, encoding] of Object.entries(MODES)) {
      for (const n of [3, 10, 16]) {
        it(`${modeName}, ${n} categories, ${pageName}`, { timeout: 60_000 }, () => {
          const spec = parseChart(chart(encoding, page, n));
          let scene: Scene;
          try {
            scene = layoutChart(spec);
          } catch (e) {
            expect(isTallyError(e)).toBe(true);
            const err = e as { code: string; message: string };
            if (modeName === 'shared grid' && n > 9) {
              // More categories than distinguishable colours, where colour alone tells them apart.
              expect(err.code).toBe('data-invalid');
              expect(err.message).toMatch(/colour-vision deficiency/);
              return;
            }
            // Only the tiny page may leave no room; the refusal says what to change.
            expect(pageName).toBe('40 x 30 mm');
            expect(err.code).toBe('layout-no-room');
            expect(err.message).toMatch(/bigger page/);
            return;
          }
          expect(pageFitProblems(scene, spec)).toEqual([]);
        });
      }
    }
  }
});

describe('the ten-row stack on 180 x 120 mm', () => {
  // People in ten invented households' groups; the first label is long and has a long word.
  const values = [100, 100, 50, 25, 12, 6, 3, 2, 1, 1];
  const tenRows = (unit?: number): ChartDocument => ({
    format: 'tallyglyph.chart/1',
    title: 'Who lives where',
    source: 'Invented demo data',
    data: values.map((value, i) => ({ label: i === 0 ? 'Intergenerational households of the northern quarter' : `Group ${i + 1}`, value })),
    encoding: { mode: 'stack', glyph: 'person', unitName: 'people', ...(unit !== undefined ? { unit } : {}) },
    page: { width: 180, height: 120, unit: 'mm' },
  });

  it('exports and re-verifies with the unit chosen automatically, everything inside the margins', { timeout: 60_000 }, () => {
    const result = renderChart(tenRows());
    expect(result.report.pass).toBe(true);
    expect(pageFitProblems(result.scene, result.spec)).toEqual([]);
    expect(result.scene.texts.filter((t) => t.role === 'label').length).toBeGreaterThanOrEqual(10);
  });

  it('refuses one glyph per person before verifying, saying there is no room and what to change', () => {
    // 100 glyphs in a column cannot stand in about 80 mm at a legible glyph size.
    const e = caught(() => renderChart(tenRows(1)));
    expect(e.code).toBe('layout-no-room');
    expect(e.message).toMatch(/legible size/);
    expect(e.message).toMatch(/bigger page/);
    expect(e.message).toMatch(/larger unit \((\d+) or more per glyph\)/);
    expect(e.message).not.toMatch(/edited by hand/);
  });
});

describe('tiny pages', () => {
  it('refuses a 40 x 30 mm page with 10 mm margins in every mode, quickly, instead of drawing outside the page', () => {
    // A time bound only to prove the search cannot hang on a box with no room (it used to loop at size 0).
    const start = Date.now();
    for (const encoding of Object.values(MODES)) {
      const e = caught(() => layoutChart(parseChart(chart(encoding, PAGES['40 x 30 mm'], 3))));
      expect(e.code).toBe('layout-no-room');
    }
    expect(Date.now() - start).toBeLessThan(30_000);
  });

  it('fits a 40 x 30 mm page with 2 mm margins and no title when the data are small', () => {
    const doc: ChartDocument = { format: 'tallyglyph.chart/1', data: [{ label: 'A', value: 3 }, { label: 'B', value: 5 }], encoding: { mode: 'repeat', glyph: 'bike', unit: 1 }, layout: { margins: 2 }, page: { width: 40, height: 30, unit: 'mm' } };
    const spec = parseChart(doc);
    expect(pageFitProblems(layoutChart(spec), spec)).toEqual([]);
  });
});

describe('composition uses the page', () => {
  // Common practice, no source: a chart block is centred in the room it is given rather than left in a corner.
  for (const [pageName, page] of Object.entries({ 'A5 landscape': PAGES['A5 landscape'], 'A4 portrait': PAGES['A4 portrait'] })) {
    for (const [modeName, encoding] of Object.entries(MODES)) {
      it(`${modeName} with 3 categories on ${pageName} is centred in the content box`, { timeout: 60_000 }, () => {
        const spec = parseChart(chart(encoding, page, 3));
        const scene = layoutChart(spec);
        // The chart block: everything drawn but the title and the source line.
        const block = drawnBoxes(scene).filter((d) => !/^(title|source) text/.test(d.what)).map((d) => d.box);
        const minX = Math.min(...block.map((b) => b.x));
        const maxX = Math.max(...block.map((b) => b.x + b.width));
        const minY = Math.min(...block.map((b) => b.y));
        const maxY = Math.max(...block.map((b) => b.y + b.height));
        const m = spec.layout.margins;
        const widthMm = spec.page.widthMm - m.left - m.right;
        const centreX = m.left + widthMm / 2;
        // The block's centre sits within a tenth of the width of the content box's centre.
        expect(Math.abs((minX + maxX) / 2 - centreX)).toBeLessThan(widthMm / 10);
        // And the block is not confined to the top: its centre is below the upper third of the page.
        expect((minY + maxY) / 2).toBeGreaterThan(spec.page.heightMm / 3 - 1e-9);
      });
    }
  }
});

describe('fill and scale glyphs use the content box', () => {
  function blockBox(scene: Scene) {
    const block = drawnBoxes(scene).filter((d) => !/^(title|source) text/.test(d.what)).map((d) => d.box);
    const minX = Math.min(...block.map((b) => b.x));
    const minY = Math.min(...block.map((b) => b.y));
    return { width: Math.max(...block.map((b) => b.x + b.width)) - minX, height: Math.max(...block.map((b) => b.y + b.height)) - minY };
  }

  // Common practice, no source: a chart with few categories is drawn large enough that its block (marks, labels and
  // key) covers at least half of the content box. Fill glyphs used to stop at 60 mm, covering under a third of an
  // A4 portrait page.
  for (const [pageName, page] of Object.entries({ 'A5 landscape': PAGES['A5 landscape'], 'A4 portrait': PAGES['A4 portrait'], '180 x 120 mm': PAGES['180 x 120 mm'] })) {
    for (const modeName of ['fill', 'scale']) {
      it(`${modeName} with 3 categories on ${pageName} covers at least half of the content box`, { timeout: 60_000 }, () => {
        const spec = parseChart(chart(MODES[modeName], page, 3));
        const scene = layoutChart(spec);
        const block = blockBox(scene);
        const m = spec.layout.margins;
        const room = { width: spec.page.widthMm - m.left - m.right, height: spec.page.heightMm - m.top - m.bottom };
        expect((block.width * block.height) / (room.width * room.height)).toBeGreaterThan(0.5);
        expect(pageFitProblems(scene, spec)).toEqual([]);
      });
    }
  }

  it('fill glyphs of 10 categories on A4 portrait stand on one column grid, the short last row centred on it', { timeout: 60_000 }, () => {
    const spec = parseChart(chart(MODES.fill, PAGES['A4 portrait'], 10));
    const scene = layoutChart(spec);
    const boxes = scene.marks.map((mk) => drawnBoxes({ ...scene, marks: [mk], texts: [], lines: [], legendKeys: [] }).map((d) => d.box));
    const glyph = boxes.map((parts) => ({
      x: Math.min(...parts.map((b) => b.x)),
      right: Math.max(...parts.map((b) => b.x + b.width)),
      top: Math.min(...parts.map((b) => b.y)),
      bottom: Math.max(...parts.map((b) => b.y + b.height)),
    }));
    const centres = glyph.map((g) => (g.x + g.right) / 2);
    const rowsByBottom = new Map<string, number[]>();
    glyph.forEach((g, i) => rowsByBottom.set(g.bottom.toFixed(3), [...(rowsByBottom.get(g.bottom.toFixed(3)) ?? []), i]));
    const rows = [...rowsByBottom.values()];
    expect(rows.length).toBeGreaterThan(1);
    // Every centre of a later row sits on a centre of the first (full) row: one grid, a short row centred on it.
    const firstRow = rows[0].map((i) => centres[i]);
    for (const row of rows.slice(1)) for (const i of row) expect(Math.min(...firstRow.map((c) => Math.abs(c - centres[i])))).toBeLessThan(1e-6);
  });

  it('fill glyphs of 3 categories on A4 portrait are drawn larger than the old 60 mm cap', { timeout: 60_000 }, () => {
    const scene = layoutChart(parseChart(chart(MODES.fill, PAGES['A4 portrait'], 3)));
    const heights = scene.marks.map((mk) => {
      const parts = drawnBoxes({ ...scene, marks: [mk], texts: [], lines: [], legendKeys: [] }).map((d) => d.box);
      return Math.max(...parts.map((b) => b.y + b.height)) - Math.min(...parts.map((b) => b.y));
    });
    expect(Math.min(...heights)).toBeGreaterThan(60);
  });
});

describe('the scale key with a glyph per row', () => {
  // 16 categories, each its own glyph: 16 or 17 reference glyphs (the first glyph may have a second, smaller one).
  // Glyphs of one value stand side by side and share one value text per key row, so that text sets no pitch.
  for (const [pageName, page] of Object.entries({ 'A5 landscape': PAGES['A5 landscape'], 'A4 portrait': PAGES['A4 portrait'], '180 x 120 mm': PAGES['180 x 120 mm'] })) {
    it(`lays out a key inside the content box on ${pageName}, one key per glyph drawn, one value text per row of same-value glyphs`, { timeout: 60_000 }, () => {
      const spec = parseChart(chart(MODES['scale, a glyph per row'], page, 16));
      const scene = layoutChart(spec);
      expect(pageFitProblems(scene, spec)).toEqual([]);
      expect(new Set(scene.legendKeys.map((k) => k.glyph))).toEqual(new Set(ROW_GLYPHS));
      const keys = drawnBoxes(scene).filter((d) => d.what.startsWith('legend key')).map((d, i) => ({ box: d.box, value: scene.legendKeys[i].unitValue }));
      const bottomOf = (b: { y: number; height: number }) => (b.y + b.height).toFixed(3);
      const valueTexts = scene.texts.filter((t) => t.role === 'legend' && /things$/.test(t.text) && t.bboxMm);
      // Per key row and value: the glyphs on one baseline and one pitch, and one text under them.
      const groups = new Map<string, typeof keys>();
      for (const k of keys) groups.set(`${bottomOf(k.box)} ${k.value}`, [...(groups.get(`${bottomOf(k.box)} ${k.value}`) ?? []), k]);
      expect(valueTexts.length).toBe(groups.size);
      expect(groups.size).toBeLessThan(keys.length);
      for (const group of groups.values()) {
        const centres = group.map((k) => k.box.x + k.box.width / 2).sort((p, q) => p - q);
        const pitches = centres.slice(1).map((c, i) => c - centres[i]);
        for (const p of pitches) expect(Math.abs(p - pitches[0])).toBeLessThan(1e-6);
        // Each glyph is centred on its cell, so the middle of the first and last glyph centres is the group's middle.
        const middle = (centres[0] + centres[centres.length - 1]) / 2;
        const text = valueTexts.find((t) => t.text.startsWith(`${group[0].value} `) && t.bboxMm!.y > Math.max(...group.map((k) => k.box.y)) && Math.abs(t.bboxMm!.x + t.bboxMm!.width / 2 - middle) < 0.3);
        expect(text, `value ${group[0].value} under the row at ${bottomOf(group[0].box)}`).toBeDefined();
      }
    });
  }

  it('refuses with layout-no-room, naming the key, when even one key column is wider than the content box', () => {
    // 60 mm of room: three short-labelled glyphs fit, but a key value with a long unit name ("10 litres of ...") cannot.
    const doc: ChartDocument = {
      format: 'tallyglyph.chart/1',
      data: [{ label: 'A', value: 40 }, { label: 'B', value: 20 }, { label: 'C', value: 10 }],
      encoding: { mode: 'scale', glyph: 'drop', unitName: 'litres of rainwater collected from the roof each week' },
      page: { width: 80, height: 150, unit: 'mm' },
    };
    const e = caught(() => layoutChart(parseChart(doc)));
    expect(e.code).toBe('layout-no-room');
    expect(e.message).toMatch(/scale key/);
    expect(e.message).toMatch(/bigger page/);
    // Without the key the same marks fit: the refusal is the key's.
    const spec = parseChart({ ...doc, layout: { legend: false } });
    expect(pageFitProblems(layoutChart(spec), spec)).toEqual([]);
  });
});

describe('the shared grid uses the content box', () => {
  // Common practice, no source: a chart block either grows until it meets the room between the margins, the title
  // and the source line in one direction (here 90% of the room's width or height, the rest being the key list's and
  // the legend's fixed gaps), or, where the glyph-size cap stops it first, stands centred in that room. Measured
  // from the written SVG: the box of all ink but the title and source, against that room.
  for (const [pageName, page] of Object.entries({ 'A5 landscape': PAGES['A5 landscape'], 'A4 portrait': PAGES['A4 portrait'], '180 x 120 mm': PAGES['180 x 120 mm'] })) {
    for (const n of [3, 6, 9]) {
      it(`${n} categories on ${pageName}`, { timeout: 60_000 }, () => {
        const result = renderChart(chart(MODES['shared grid'], page, n));
        expect(result.report.pass).toBe(true);
        expect(pageFitProblems(result.scene, result.spec)).toEqual([]);
        const { room, block } = writtenBlock(result.svg, result.spec.layout.margins, result.spec.page);
        // The glyph size the layout caps: the larger side of a full unit glyph's ink box.
        const glyphMm = Math.max(...writtenLegendKeys(result.svg).map((k) => Math.max(k.box.width, k.box.height)));
        const fullMm = Math.max(...writtenMarks(result.svg).flatMap((m) => m.pieces.filter((p) => p.part === 'full').map((p) => Math.max(p.box.width, p.box.height))));
        expect(Math.abs(glyphMm - fullMm)).toBeLessThan(0.01);
        const usesWidth = block.width / room.width;
        const usesHeight = block.height / room.height;
        const capped = glyphMm >= REPEAT_MAX_GLYPH_MM - 0.05;
        expect(capped || Math.max(usesWidth, usesHeight) >= 0.9, `uses ${(usesWidth * 100).toFixed(1)}% of the width, ${(usesHeight * 100).toFixed(1)}% of the height, glyphs ${glyphMm.toFixed(2)} mm`).toBe(true);
        // Centred across within 0.1 mm (the list is planned as wide as its widest entry's ink; file coordinates
        // carry three decimals), and down within a millimetre (the key sentence's line box is taller than its ink).
        expect(Math.abs(block.x + block.width / 2 - (room.x + room.width / 2))).toBeLessThan(0.1);
        expect(Math.abs(block.y + block.height / 2 - (room.y + room.height / 2))).toBeLessThan(1);
      });
    }
  }
});

describe('the scale key with many different glyphs leaves room for the glyphs', () => {
  const larger = (b: { width: number; height: number }) => Math.max(b.width, b.height);

  it('16 categories with a glyph each on 180 x 120 mm: one value text per run of same-value key glyphs, every glyph legible', { timeout: 60_000 }, () => {
    const result = renderChart(chart(MODES['scale, a glyph per row'], PAGES['180 x 120 mm'], 16));
    expect(result.report.pass).toBe(true);
    expect(pageFitProblems(result.scene, result.spec)).toEqual([]);
    const keys = writtenLegendKeys(result.svg);
    expect(new Set(keys.map((k) => k.glyph))).toEqual(new Set(ROW_GLYPHS));
    // Reference values shown: one text per key row and value, not one per glyph.
    const values = writtenTexts(result.svg).filter((t) => t.role === 'legend' && t.box && t.box.y > Math.min(...keys.map((k) => k.box.y)));
    const distinct = new Set(keys.map((k) => k.unitValue));
    expect(values.length).toBeLessThan(keys.length / 2);
    expect(values.length).toBeGreaterThanOrEqual(distinct.size);
    // MIN_GLYPH_MM (2.2 mm, common practice, no source): below it a glyph reads as a speck. Every key glyph is at
    // least that on its larger side, and the largest mark at least twice its key's (a key shows a quarter of the
    // largest value, half its linear size).
    for (const k of keys) expect(larger(k.box), k.glyph).toBeGreaterThanOrEqual(MIN_GLYPH_MM - 0.01);
    const largestMm = Math.max(...writtenMarks(result.svg).map((m) => larger(m.box)));
    expect(largestMm).toBeGreaterThanOrEqual(2 * MIN_GLYPH_MM);
  });

  it('refuses with layout-no-room naming too many different glyphs when their key leaves no legible size', () => {
    // 16 glyphs on A6 landscape (148 x 105 mm, ISO 216): their 16 references cannot stand at a legible size beside the marks.
    const doc = chart(MODES['scale, a glyph per row'], { width: 148, height: 105 }, 16);
    const e = caught(() => layoutChart(parseChart(doc)));
    expect(e.code).toBe('layout-no-room');
    expect(e.message).toMatch(/different glyphs/);
    expect(e.message).toMatch(/one glyph/);
    // With one glyph for every row the same data fit: the refusal is the key's many glyphs.
    const one = parseChart(chart(MODES['scale, a glyph per row'], { width: 148, height: 105 }, 16, false));
    expect(pageFitProblems(layoutChart(one), one)).toEqual([]);
  });
});
