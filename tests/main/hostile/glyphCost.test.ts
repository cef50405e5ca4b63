// Hostile corpus, costly glyphs: inline glyphs of about 190,000 path commands (below every command-count
// limit) once ran past 60 s in repeat and stack mode. The work is now bounded by what the outline
// measurably costs, and the refusal names the limit, before any cut, write or re-measure.
import { describe, expect, it } from 'vitest';
import { MAX_SWEEP_STEPS, sweepSteps } from '../../../shared-core/geometry/sweepWork';
import { unionPaths } from '../../../shared-core/geometry/region';
import { MAX_CHART_POINTS, MAX_GLYPH_POINTS } from '../../../shared-core/glyph/outlineBudget';
import { renderChart } from '../../../shared-core/pipeline';
import { chartDoc } from '../../helpers/chartDoc';
import { caught } from '../../helpers/errors';

// Only proves the input cannot hang (these ran past 60 s before): each case took 2 to 6 s on two cores
// shared by several test runs, less on an idle machine.
const BOUND_MS = 20_000;

const svgOf = (d: string) => `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 1000 1000"><path d="${d}"/></svg>`;

/** A comb of thin teeth, 4 commands a tooth: every tooth spans the full height, so a sweep meets all of them at every vertex. */
function comb(commands: number): string {
  return `M0 0${'h.1v99h.1v-99'.repeat(commands / 4)}v-1H0z`;
}

/** A staircase of `commands` steps: harmless per union (each height meets three edges), but detailed. */
function staircase(commands: number): string {
  return `M0 0${'h.01v.01'.repeat(commands / 2)}H0z`;
}

function timedRefusal(doc: unknown) {
  const t0 = Date.now();
  const e = caught(() => renderChart(doc));
  return { e, ms: Date.now() - t0 };
}

describe('sweepSteps measures the union work before it starts', () => {
  it('counts, for every vertex, the edges whose height range holds it (worked by hand)', () => {
    // A rectangle: each of its 4 vertices lies in 3 of the 4 edges' height ranges (both sides and its own end).
    expect(sweepSteps([[{ x: 0, y: 0 }, { x: 4, y: 0 }, { x: 4, y: 2 }, { x: 0, y: 2 }]])).toBe(12);
    // A zigzag of n vertices between two heights: every edge spans both, so n x n.
    const n = 1000;
    const teeth = Array.from({ length: n }, (_, i) => ({ x: i, y: i % 2 ? 1 : 0 }));
    expect(sweepSteps([teeth])).toBe(n * n);
  });

  it('refuses a comb whose union would take minutes, at once, naming the limit', () => {
    const teeth = Array.from({ length: 20_000 }, (_, i) => ({ x: i / 100, y: i % 2 ? 1 : 0 }));
    const t0 = Date.now();
    const e = caught(() => unionPaths([teeth], 'nonzero'));
    expect(e.code).toBe('geometry-limit');
    expect(e.message).toMatch(/about 400 million steps \(limit 40 million, the sweep work limit\)/);
    expect(Date.now() - t0).toBeLessThan(BOUND_MS);
    expect(MAX_SWEEP_STEPS).toBe(40_000_000);
  });
});

describe('glyphs of about 190,000 commands in repeat and stack mode', () => {
  for (const mode of ['repeat', 'stack'] as const) {
    it(`${mode}: a 190,000-command comb is refused by the sweep work limit`, () => {
      const { e, ms } = timedRefusal(chartDoc({ encoding: { mode, glyph: { svg: svgOf(comb(190_000)) }, unit: 10 } }));
      expect(e.code).toBe('geometry-limit');
      expect(e.message).toMatch(/^encoding\.glyph: .*[\d,]+ edges .*sweep work limit/);
      expect(ms).toBeLessThan(BOUND_MS);
    });
  }

  it('a comb of 190,000 stroked commands is refused by the sweep work limit of its centre line, before a piece is built', () => {
    const stroked = `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 1000 1000"><path d="${comb(190_000)}" fill="none" stroke="#000" stroke-width="2"/></svg>`;
    const { e, ms } = timedRefusal(chartDoc({ encoding: { mode: 'repeat', glyph: { svg: stroked }, unit: 10 } }));
    expect(e.code).toBe('geometry-limit');
    expect(e.message).toMatch(/sweep work limit/);
    expect(ms).toBeLessThan(BOUND_MS);
  });

  it('a 190,000-command staircase (cheap per union) is refused by the glyph detail limit before any cut', () => {
    const svg = svgOf(staircase(190_000));
    expect(svg.length).toBeLessThan(1_000_000); // inside the inline glyph size limit
    const { e, ms } = timedRefusal(chartDoc({ encoding: { mode: 'stack', glyph: { svg }, unit: 10 } }));
    expect(e.code).toBe('geometry-limit');
    expect(e.message).toMatch(/^encoding\.glyph: the glyph's outline has [\d,]+ points; a chart glyph may have at most 20,000 \(glyph detail limit\)/);
    expect(MAX_GLYPH_POINTS).toBe(20_000);
    expect(ms).toBeLessThan(BOUND_MS);
  });

  it('a glyph under the detail limit drawn hundreds of times is refused by the chart detail limit before writing', () => {
    // About 15,000 points a copy, 150 copies: over 2 million points.
    const doc = chartDoc({ data: [{ label: 'A', value: 300 }, { label: 'B', value: 150 }], encoding: { mode: 'repeat', glyph: { svg: svgOf(staircase(15_000)) }, unit: 3 } });
    const { e, ms } = timedRefusal(doc);
    expect(e.code).toBe('geometry-limit');
    expect(e.message).toMatch(/^The chart would carry [\d,]+ outline points \(the glyph "inline:1" drawn \d+ times carries [\d,]+\); the chart detail limit is 1,000,000/);
    expect(MAX_CHART_POINTS).toBe(1_000_000);
    expect(ms).toBeLessThan(BOUND_MS);
  });
});
