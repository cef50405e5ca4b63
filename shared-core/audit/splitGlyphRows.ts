// A unit chart drawn as ONE path (every glyph a subpath, as some exporters merge them): the path's
// separate pieces of ink, when they are copies of one glyph (a cut partial allowed), grouped into rows
// or columns, so each row or column can be read as a mark by count.
import type { Box, Region } from '../geometry/region';
import { SAME_GLYPH_TOLERANCE } from './findRepeatUnit';
import { splitComponents, type InkComponent } from './splitComponents';

export interface GlyphLine {
  region: Region;
  pieces: InkComponent[];
}

const close = (a: number, b: number) => Math.abs(a - b) <= SAME_GLYPH_TOLERANCE * Math.max(Math.abs(a), Math.abs(b));

/** Pieces whose spans along one axis overlap by more than half the shorter piece join one line. */
function lines(pieces: readonly InkComponent[], axis: 'y' | 'x'): InkComponent[][] {
  const start = (b: Box) => (axis === 'y' ? b.y : b.x);
  const size = (b: Box) => (axis === 'y' ? b.height : b.width);
  const sorted = [...pieces].sort((a, b) => start(a.box) + size(a.box) / 2 - (start(b.box) + size(b.box) / 2));
  const out: Array<{ from: number; to: number; pieces: InkComponent[] }> = [];
  for (const p of sorted) {
    const from = start(p.box), to = from + size(p.box);
    const line = out[out.length - 1];
    if (line && Math.min(to, line.to) - Math.max(from, line.from) > 0.5 * Math.min(to - from, line.to - line.from)) {
      line.pieces.push(p);
      line.from = Math.min(line.from, from);
      line.to = Math.max(line.to, to);
    } else out.push({ from, to, pieces: [p] });
  }
  return out.map((l) => l.pieces);
}

/**
 * Rows (top to bottom) or columns (left to right) of one path's glyph copies; null when the pieces
 * are not copies of one glyph or stand in a single row and a single column.
 */
export function splitGlyphRows(region: Region): { axis: 'row' | 'column'; lines: GlyphLine[] } | null {
  const pieces = splitComponents(region);
  if (!pieces || pieces.length < 2) return null;
  // The glyph is the largest piece; every other piece is a copy of it or smaller (a cut partial glyph).
  const glyph = pieces.reduce((a, b) => (b.areaUnits2 > a.areaUnits2 ? b : a));
  const copies = pieces.filter((p) => close(p.areaUnits2, glyph.areaUnits2) && close(p.box.width, glyph.box.width) && close(p.box.height, glyph.box.height));
  if (copies.length < 2) return null;
  if (pieces.some((p) => p.box.width > glyph.box.width * (1 + SAME_GLYPH_TOLERANCE) || p.box.height > glyph.box.height * (1 + SAME_GLYPH_TOLERANCE))) return null;
  // Only when most pieces are whole copies: a few equal details inside one picture do not make a chart.
  if (copies.length < 0.5 * pieces.length) return null;
  // Glyphs of one category run along their line, so the grouping into fewer lines is the chart's own
  // (rows of a repeat chart, columns of a stack); a tie reads as rows.
  const rows = lines(pieces, 'y'), columns = lines(pieces, 'x');
  const [axis, found] = rows.length >= 2 && (rows.length <= columns.length || columns.length < 2) ? (['row', rows] as const) : (['column', columns] as const);
  if (found.length < 2) return null;
  return { axis, lines: found.map((l) => ({ region: l.flatMap((p) => p.region), pieces: l })) };
}
