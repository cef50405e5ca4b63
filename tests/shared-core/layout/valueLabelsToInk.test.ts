// Value labels stand beside their own row's ink, like bar-end labels (common practice, no source): 2 mm after
// the last ink in the reading direction, on the grid row of the category's last glyph; for right-to-left rows
// 2 mm before the leftmost ink, ending there. Measured from the written SVG (pen positions of <text>, glyph
// polygons of the marks), for one row, wrapped rows, right-to-left rows and the shared grid's key list.
import { describe, expect, it } from 'vitest';
import { renderChart } from '../../../shared-core/pipeline/renderChart';
import { writtenMarks, writtenTexts, type WrittenMark } from './writtenSvg';

// Invented: litres of water per household chore.
const CHORES = [
  { label: 'Washing up', value: 12 },
  { label: 'Laundry', value: 45.5 },
  { label: 'Shower', value: 7 },
  { label: 'Garden', value: 80 },
  { label: 'Kettle', value: 3.2 },
];
const PAD_MM = 2;
const FILE_DECIMALS_MM = 0.002;

function render(layout: Record<string, unknown>, encoding: Record<string, unknown> = {}, outlineText = false) {
  const result = renderChart({
    format: 'tallyglyph.chart/1',
    title: 'Water per chore',
    data: CHORES,
    encoding: { mode: 'repeat', glyph: 'drop', unit: 2, unitName: 'litres', ...encoding },
    layout,
    page: { width: 180, height: 120, unit: 'mm' },
    outlineText,
  });
  expect(result.report.pass).toBe(true);
  return { marks: writtenMarks(result.svg), texts: writtenTexts(result.svg) };
}

/** The pieces on the grid row of the category's last glyph: the row whose pieces sit lowest (ltr, rtl). */
function lastRow(mark: WrittenMark) {
  const bottom = Math.max(...mark.pieces.map((p) => p.box.y + p.box.height));
  // A sliver of a partial glyph may end above the row's bottom: half a glyph's height tells the rows apart.
  const half = Math.max(...mark.pieces.map((p) => p.box.height)) / 2;
  return mark.pieces.filter((p) => p.box.y + p.box.height > bottom - half);
}

describe('repeat value labels follow their own row\'s ink', () => {
  for (const [name, layout] of [
    ['one row each, left to right', {}],
    ['wrapped rows (10 columns), left to right', { columns: 10 }],
  ] as const) {
    it(name, () => {
      const { marks, texts } = render(layout);
      const values = texts.filter((t) => t.role === 'value-label');
      expect(values.length).toBe(marks.length);
      marks.forEach((mark, i) => {
        const row = lastRow(mark);
        const inkRight = Math.max(...row.map((p) => p.box.x + p.box.width));
        const pen = values[i].pen!;
        expect(pen.anchor).toBe('start');
        expect(Math.abs(pen.xMm - (inkRight + PAD_MM)), mark.label).toBeLessThan(FILE_DECIMALS_MM);
        // On that row: the baseline lies within the row's glyphs' height.
        const top = Math.min(...row.map((p) => p.box.y));
        const bottom = Math.max(...row.map((p) => p.box.y + p.box.height));
        expect(pen.yMm).toBeGreaterThan(top);
        expect(pen.yMm).toBeLessThan(bottom + 1);
      });
      if ('columns' in layout) expect(marks.some((m) => new Set(m.pieces.map((p) => p.box.y.toFixed(1))).size > 1)).toBe(true);
    });
  }

  for (const [name, layout] of [
    ['one row each, right to left', { direction: 'rtl' }],
    ['wrapped rows (10 columns), right to left', { direction: 'rtl', columns: 10 }],
  ] as const) {
    it(name, () => {
      const { marks, texts } = render(layout);
      const values = texts.filter((t) => t.role === 'value-label');
      marks.forEach((mark, i) => {
        const row = lastRow(mark);
        const inkLeft = Math.min(...row.map((p) => p.box.x));
        const pen = values[i].pen!;
        expect(pen.anchor).toBe('end');
        expect(Math.abs(inkLeft - PAD_MM - pen.xMm), mark.label).toBeLessThan(FILE_DECIMALS_MM);
      });
      // The category labels stay clear of the values: every label's pen is left of every value's text.
      const labels = texts.filter((t) => t.role === 'label');
      expect(Math.max(...labels.map((l) => l.pen!.xMm))).toBeLessThan(Math.min(...values.map((v) => v.pen!.xMm)));
    });
  }

  it('shared grid: each value stands 2 mm after its own label\'s ink, not in a column after the longest label', () => {
    const { texts } = render({}, { arrangement: 'shared-grid' }, true);
    const labels = texts.filter((t) => t.role === 'label');
    const values = texts.filter((t) => t.role === 'value-label');
    expect(values.length).toBe(labels.length);
    values.forEach((v, i) => {
      const labelRight = labels[i].box!.x + labels[i].box!.width;
      // The value's ink starts after the pen by the first digit's left side bearing (well under 0.4 mm at 3 mm).
      expect(v.box!.x - labelRight, CHORES[i].label).toBeGreaterThanOrEqual(PAD_MM - FILE_DECIMALS_MM);
      expect(v.box!.x - labelRight, CHORES[i].label).toBeLessThan(PAD_MM + 0.4);
    });
    // Labels of different widths give values at different x: they follow the labels, not the longest one.
    expect(new Set(values.map((v) => v.box!.x.toFixed(1))).size).toBeGreaterThan(1);
  });
});
