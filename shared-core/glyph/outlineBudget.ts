// Bounds on outline detail in a chart, checked on measured outlines before any cut, write or re-measure.
// A chart's cost grows with the points of its glyph times the number of times it is drawn: every
// piece is cut, written and re-measured from the file. A single command count cannot say that; the
// measured outline and the count of pieces can.
import { TallyError } from '../errors';
import type { Region } from '../geometry/region';

/**
 * Most outline points one chart glyph may have once measured (at the layout tolerance). The most
 * detailed bundled glyph has 591 (cow); this allows 30 times more, enough for any icon drawn by hand.
 */
export const MAX_GLYPH_POINTS = 20_000;

/**
 * Most outline points all the pieces of one chart may carry. Re-measuring the written file takes
 * about 7 µs a point on two shared cores (measured on 190,000-point outlines), so this keeps the check
 * of the written file within seconds.
 */
export const MAX_CHART_POINTS = 1_000_000;

export function regionPoints(region: Region): number {
  let n = 0;
  for (const ring of region) n += ring.length;
  return n;
}

/** Refuses a chart glyph whose measured outline is too detailed to be cut and re-measured many times. */
export function checkGlyphDetail(region: Region, where: string): void {
  const points = regionPoints(region);
  if (points > MAX_GLYPH_POINTS) {
    throw new TallyError(
      'geometry-limit',
      `${where}: the glyph's outline has ${points.toLocaleString('en')} points; a chart glyph may have at most ${MAX_GLYPH_POINTS.toLocaleString('en')} ` +
        '(glyph detail limit), because every copy is cut, written and re-measured from the file. Simplify the outline (most icons need a few hundred points).',
    );
  }
}

/** Refuses a laid-out chart whose pieces together carry more than MAX_CHART_POINTS outline points. */
export function checkChartDetail(pieces: readonly { region: Region; glyph: string }[]): void {
  let total = 0;
  let heaviest = { glyph: '', points: 0, count: 0 };
  const byGlyph = new Map<string, { points: number; count: number }>();
  for (const piece of pieces) {
    const points = regionPoints(piece.region);
    total += points;
    const entry = byGlyph.get(piece.glyph) ?? { points: 0, count: 0 };
    entry.points += points;
    entry.count += 1;
    byGlyph.set(piece.glyph, entry);
    if (entry.points > heaviest.points) heaviest = { glyph: piece.glyph, ...entry };
  }
  if (total <= MAX_CHART_POINTS) return;
  throw new TallyError(
    'geometry-limit',
    `The chart would carry ${total.toLocaleString('en')} outline points (the glyph "${heaviest.glyph}" drawn ${heaviest.count} times carries ${heaviest.points.toLocaleString('en')}); ` +
      `the chart detail limit is ${MAX_CHART_POINTS.toLocaleString('en')}, so that the written file can be re-measured in seconds. Use a simpler glyph or a larger unit (fewer glyphs).`,
  );
}
