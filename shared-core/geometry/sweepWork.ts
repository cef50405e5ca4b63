// What a polygon union will cost, measured from the outline before the union starts. The clipper sweeps a
// line across the outline and keeps the edges it crosses in a list; every vertex it meets costs about
// the length of that list. A glyph's outline crosses a few dozen edges at any height, so the work is
// nearly linear; a zigzag of 190,000 teeth crosses all of them at every height, and the sweep needs
// 190,000² steps (minutes) although the outline never crosses itself. The crossing guard cannot see
// that; this measure does.
import { TallyError } from '../errors';
import type { PathsD } from './region';

/**
 * Most sweep steps a union may take. Measured on two shared cores: 20 to 150 ns a step (zigzags, combs,
 * grids of squares, long lines of text), so this is about 1 to 6 s at worst. Real outlines stay below:
 * the most a bundled glyph needs is 14,000 steps (motorbike); a line of 300 capital Ws (the longest source
 * line, in the widest letter) needs 30 million.
 */
export const MAX_SWEEP_STEPS = 40_000_000;

/**
 * Sum over every vertex of the number of edges whose vertical extent contains the vertex's height: the
 * length of the clipper's active edge list as it meets each vertex (an upper bound on its real work).
 * Exact, in O(n log n) for n edges.
 */
export function sweepSteps(paths: PathsD): number {
  let n = 0;
  for (const p of paths) n += p.length;
  const lows = new Float64Array(n);
  const highs = new Float64Array(n);
  const heights = new Float64Array(n);
  let k = 0;
  for (const p of paths) {
    const m = p.length;
    for (let i = 0; i < m; i++) {
      const a = p[i].y;
      const b = p[(i + 1) % m].y;
      lows[k] = a < b ? a : b;
      highs[k] = a < b ? b : a;
      heights[k] = a;
      k++;
    }
  }
  lows.sort();
  highs.sort();
  heights.sort();
  // Walk the sorted heights once: edges started at or below y, minus edges that ended below y.
  let steps = 0;
  let started = 0;
  let ended = 0;
  for (let i = 0; i < n; i++) {
    const y = heights[i];
    while (started < n && lows[started] <= y) started++;
    while (ended < n && highs[ended] < y) ended++;
    steps += started - ended;
  }
  return steps;
}

/** Refuses, before any polygon work, an outline whose union would take longer than MAX_SWEEP_STEPS allows. */
export function guardSweepWork(paths: PathsD, limit = MAX_SWEEP_STEPS): void {
  let n = 0;
  for (const p of paths) n += p.length;
  // Fewer edges than this cannot reach the limit even if every edge spans every height.
  if (n * n <= limit) return;
  const steps = sweepSteps(paths);
  if (steps > limit) {
    throw new TallyError(
      'geometry-limit',
      `The outline has ${n.toLocaleString('en')} edges stacked so that measuring its ink would take about ${Math.round(steps / 1e6).toLocaleString('en')} million steps ` +
        `(limit ${Math.round(limit / 1e6).toLocaleString('en')} million, the sweep work limit); it looks like hatching or a comb rather than a glyph. Simplify the outline.`,
    );
  }
}
