// Category labels beside their row (flush left as before, or flush against the marks) or above it (from the
// grid's start or to its end), measured from the pen positions of the written <text> and the glyph polygons.
import { describe, expect, it } from 'vitest';
import { renderChart } from '../../../shared-core/pipeline/renderChart';
import { writtenMarks, writtenTexts } from './writtenSvg';

// Invented: litres of water per household chore.
const CHORES = [
  { label: 'Washing up', value: 12 },
  { label: 'Laundry', value: 45.5 },
  { label: 'Shower', value: 7 },
  { label: 'Kettle', value: 3.2 },
];
const FILE_DECIMALS_MM = 0.002;

function render(layout: Record<string, unknown>) {
  const result = renderChart({
    format: 'tallyglyph.chart/1',
    title: 'Water per chore',
    data: CHORES,
    encoding: { mode: 'repeat', glyph: 'drop', unit: 2, unitName: 'litres' },
    layout,
    page: { width: 180, height: 120, unit: 'mm' },
    outlineText: false,
  });
  expect(result.report.pass, JSON.stringify(result.report.findings.map((f) => f.code))).toBe(true);
  const texts = writtenTexts(result.svg);
  return { marks: writtenMarks(result.svg), labels: texts.filter((t) => t.role === 'label') };
}

describe('label position and alignment (repeat)', () => {
  it('beside, start (the default): flush left at the margin, on the row', () => {
    const { marks, labels } = render({});
    labels.forEach((l, i) => {
      expect(l.pen!.anchor).toBe('start');
      expect(l.pen!.xMm).toBeCloseTo(10, 6); // the 10 mm default margin
      expect(l.pen!.yMm).toBeGreaterThan(marks[i].box.y);
      expect(l.pen!.yMm).toBeLessThan(marks[i].box.y + marks[i].box.height);
    });
  });

  it('beside, end: every label ends at one x, left of every mark', () => {
    const { marks, labels } = render({ labelAlign: 'end' });
    const ends = labels.map((l) => l.pen!.xMm);
    labels.forEach((l) => expect(l.pen!.anchor).toBe('end'));
    expect(Math.max(...ends) - Math.min(...ends)).toBeLessThan(FILE_DECIMALS_MM);
    // Flush against the marks: 3 mm (LABEL_PAD_MM) before the grid's first cell; the drops are centred in their cells.
    expect(Math.min(...marks.map((m) => m.box.x)) - ends[0]).toBeGreaterThanOrEqual(3 - FILE_DECIMALS_MM);
    expect(Math.min(...marks.map((m) => m.box.x)) - ends[0]).toBeLessThan(5);
  });

  for (const align of ['start', 'end'] as const) {
    it(`above, ${align}: each label's baseline is above its own row's ink, aligned to the grid's ${align}`, () => {
      const { marks, labels } = render({ labelPosition: 'above', labelAlign: align });
      const gridLeft = Math.min(...marks.map((m) => m.box.x));
      const gridRight = Math.max(...marks.map((m) => m.box.x + m.box.width));
      labels.forEach((l, i) => {
        expect(l.pen!.anchor).toBe(align);
        // Above its row: the baseline is at or over the top of the row's ink, and under the previous row.
        expect(l.pen!.yMm).toBeLessThanOrEqual(marks[i].box.y + FILE_DECIMALS_MM);
        if (i > 0) expect(l.pen!.yMm).toBeGreaterThan(marks[i - 1].box.y + marks[i - 1].box.height);
        if (align === 'start') expect(Math.abs(l.pen!.xMm - gridLeft)).toBeLessThan(1); // the glyph is centred in its cell
        else expect(l.pen!.xMm).toBeGreaterThanOrEqual(gridRight - FILE_DECIMALS_MM);
      });
      // With no label column the glyphs start at the margin's edge (give or take the centring in the cell).
      expect(gridLeft).toBeLessThan(11);
    });
  }
});
