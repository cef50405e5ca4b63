// Grouping glyphs in fives or tens (layout.groupEvery): a wider gap after every group, measured on the written
// SVG; partial glyphs still cut by ink; stacks declare the grouping in the file and verify from it alone.
import { describe, expect, it } from 'vitest';
import { verifySvg } from '../../../shared-core/integrity';
import { renderChart } from '../../../shared-core/pipeline/renderChart';
import { writtenMarks, type WrittenPiece } from './writtenSvg';

// Invented: litres of rainwater collected per garden (our own scenario).
const GARDENS = [
  { label: 'Plot 1', value: 23 },
  { label: 'Plot 2', value: 12.5 },
  { label: 'Plot 3', value: 7 },
];

function doc(encoding: Record<string, unknown>, layout: Record<string, unknown>) {
  return {
    format: 'tallyglyph.chart/1',
    title: 'Rainwater per plot',
    data: GARDENS,
    encoding: { glyph: 'drop', unitName: 'litres', unit: 1, ...encoding },
    layout,
    page: { width: 210, height: 148, unit: 'mm' },
  };
}

/** Gaps between successive pieces along x (repeat rows) or y (stacks), in reading order. */
function gapsAlong(pieces: WrittenPiece[], axis: 'x' | 'y', reverse: boolean): number[] {
  const sorted = [...pieces].sort((a, b) => (reverse ? b.box[axis] - a.box[axis] : a.box[axis] - b.box[axis]));
  const size = axis === 'x' ? 'width' : 'height';
  const out: number[] = [];
  for (let i = 1; i < sorted.length; i++) {
    const [a, b] = reverse ? [sorted[i], sorted[i - 1]] : [sorted[i - 1], sorted[i]];
    out.push(b.box[axis] - (a.box[axis] + a.box[size]));
  }
  return out;
}

function render(d: unknown) {
  const result = renderChart(d);
  expect(result.report.pass, JSON.stringify(result.report.findings.map((f) => f.code))).toBe(true);
  return result;
}

describe('repeat rows grouped in fives and tens', () => {
  for (const every of [5, 10]) {
    for (const direction of ['ltr', 'rtl'] as const) {
      it(`groups of ${every}, ${direction}: one extra gap after every ${every} glyphs of a row, the partial glyph cut by ink`, () => {
        const plain = writtenMarks(render(doc({ mode: 'repeat' }, { direction, columns: 30 })).svg);
        const grouped = writtenMarks(render(doc({ mode: 'repeat' }, { direction, columns: 30, groupEvery: every })).svg);
        const plot1 = grouped[0];
        // 23 whole drops in one row (30 columns): full glyph boxes are the same width, so their gaps are the cell gaps.
        const fulls = plot1.pieces.filter((p) => p.part === 'full');
        expect(fulls.length).toBe(23);
        const gaps = gapsAlong(fulls, 'x', direction === 'rtl');
        const even = gapsAlong(plain[0].pieces.filter((p) => p.part === 'full'), 'x', direction === 'rtl')[0];
        gaps.forEach((gap, i) => {
          const afterGroup = (i + 1) % every === 0;
          // One extra gap: at least the plain gap again (the default gap share, 0.2 of the glyph size).
          if (afterGroup) expect(gap, `gap ${i}`).toBeGreaterThan(2 * even * 0.999 * (grouped[0].pieces[0].box.height / plain[0].pieces[0].box.height));
          else expect(Math.abs(gap - gaps[0]), `gap ${i}`).toBeLessThan(0.003); // the file's 3 decimals
        });
        // Plot 2's partial glyph (12.5 -> 0.5 of a drop) keeps half the ink of a whole one, as without grouping.
        const partial = grouped[1].pieces.find((p) => p.part === 'partial');
        expect(partial).toBeDefined();
      });
    }
  }

  it('wrapped rows hold whole groups, so the groups line up down the rows', () => {
    const marks = writtenMarks(render(doc({ mode: 'repeat' }, { groupEvery: 5, glyphSizeMm: 12 })).svg);
    const plot1 = marks[0].pieces;
    const rowsTop = [...new Set(plot1.map((p) => Number(p.box.y.toFixed(1))))];
    expect(rowsTop.length).toBeGreaterThan(1);
    const perRow = rowsTop.map((y) => plot1.filter((p) => Number(p.box.y.toFixed(1)) === y).length);
    expect(perRow[0] % 5).toBe(0);
  });

  it('shared grid: grouped columns and still verified', () => {
    // Whole values, so every slot holds one category's whole glyph and the boxes are alike.
    const result = render({ ...doc({ mode: 'repeat', arrangement: 'shared-grid' }, { groupEvery: 10, columns: 20 }), data: [{ label: 'Plot 1', value: 23 }, { label: 'Plot 2', value: 12 }, { label: 'Plot 3', value: 7 }] });
    const all = writtenMarks(result.svg).flatMap((m) => m.pieces.filter((p) => p.part === 'full'));
    const firstRowY = Math.min(...all.map((p) => p.box.y));
    const row = all.filter((p) => Math.abs(p.box.y - firstRowY) < 0.5);
    const gaps = gapsAlong(row, 'x', false);
    expect(gaps.length).toBeGreaterThanOrEqual(10);
    expect(gaps[9]).toBeGreaterThan(1.5 * gaps[0]);
  });
});

describe('stacks grouped in fives and tens', () => {
  it.each([5, 10])('groups of %i: a wider gap after each group, declared in the file, and the file verifies', (every) => {
    const result = render(doc({ mode: 'stack' }, { groupEvery: every }));
    expect(result.svg).toMatch(new RegExp(`class="tg-marks" data-baseline-y="[^"]+" data-group-every="${every}" data-group-gap-mm="[^"]+"`));
    const fulls = writtenMarks(result.svg)[0].pieces.filter((p) => p.part === 'full');
    const gaps = gapsAlong(fulls, 'y', true);
    gaps.forEach((gap, i) => {
      if ((i + 1) % every === 0) expect(gap, `gap ${i}`).toBeGreaterThan(1.5 * gaps[0]);
      else expect(Math.abs(gap - gaps[0]), `gap ${i}`).toBeLessThan(0.003); // the file's 3 decimals
    });
    // Verification from the file alone: the even pitch once the declared group gaps are taken out.
    expect(verifySvg(result.svg).pass).toBe(true);
  });

  it('a file whose grouping is removed or widened fails the pitch check', () => {
    const { svg } = render(doc({ mode: 'stack' }, { groupEvery: 5 }));
    const removed = svg.replace(/ data-group-every="5" data-group-gap-mm="[^"]+"/, '');
    expect(verifySvg(removed).findings.map((f) => f.code)).toContain('uneven-pitch');
    const wrongEvery = svg.replace('data-group-every="5"', 'data-group-every="4"');
    expect(verifySvg(wrongEvery).findings.map((f) => f.code)).toContain('uneven-pitch');
    const wide = svg.replace(/data-group-gap-mm="[^"]+"/, 'data-group-gap-mm="40"');
    expect(verifySvg(wide).findings.map((f) => f.code)).toContain('uneven-pitch');
  });

  it('stacks no taller than one group are written without the grouping attributes', () => {
    const { svg } = render(doc({ mode: 'stack', unit: 5 }, { groupEvery: 10 }));
    expect(svg).not.toContain('data-group-every');
  });
});
