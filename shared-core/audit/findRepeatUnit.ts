// Recognises marks built from repeated copies of one glyph (a unit chart), so the marks can be
// read by count: the unit is the glyph that recurs, and a mark's count is its ink over the unit's
// ink (a cut partial glyph counts by its share of ink).
import type { Box } from '../geometry/region';
import type { MarkPart, MeasuredMark } from './types';

/** Two pieces are copies of one glyph when area, width and height agree within 2%. Common practice, no source. */
export const SAME_GLYPH_TOLERANCE = 0.02;

export interface RepeatUnit {
  inkAreaUnits2: number;
  box: Box;
  /** How many pieces across the chart are whole copies of the unit. */
  copies: number;
  perMark: Array<{
    /** Ink / unit ink. */
    count: number;
    /** Whole copies of the unit in the mark (1 when the mark is itself one copy). */
    repeats: number;
  }>;
}

const close = (a: number, b: number, tol: number) => Math.abs(a - b) <= tol * Math.max(Math.abs(a), Math.abs(b));

function same(p: MarkPart, q: MarkPart, tol: number): boolean {
  return close(p.inkAreaUnits2, q.inkAreaUnits2, tol) && close(p.box.width, q.box.width, tol) && close(p.box.height, q.box.height, tol);
}

function wholeOf(m: MeasuredMark): MarkPart {
  return { box: m.box, inkAreaUnits2: m.inkAreaUnits2 };
}

/**
 * The glyph that recurs most (whole marks and their parts both count as candidates; on a tie the
 * larger glyph wins, so a two-piece glyph beats its pieces) and that explains every mark: each mark
 * is one copy, or all its parts are copies or pieces small enough to be cut from it. Repeated details
 * inside one picture (two hoops on a barrel) explain nothing and are passed over. Null when no glyph does.
 */
export function findRepeatUnit(marks: readonly MeasuredMark[], tol = SAME_GLYPH_TOLERANCE): RepeatUnit | null {
  const pieces = [...marks.map(wholeOf), ...marks.flatMap((m) => (m.parts.length > 1 ? m.parts : []))].filter((p) => p.inkAreaUnits2 > 0);
  if (pieces.length < 2 || pieces.length > 20_000) return null;
  const sorted = [...pieces].sort((a, b) => b.inkAreaUnits2 - a.inkAreaUnits2);
  const classes: { rep: MarkPart; n: number }[] = [];
  for (const p of sorted) {
    const c = classes.find((k) => same(k.rep, p, tol));
    if (c) c.n += 1;
    else classes.push({ rep: p, n: 1 });
    if (classes.length > 500) return null;
  }
  const ranked = classes.filter((c) => c.n >= 2).sort((a, b) => b.n - a.n || b.rep.inkAreaUnits2 - a.rep.inkAreaUnits2);
  for (const c of ranked) {
    const unit = c.rep;
    const fits = (p: MarkPart) => p.inkAreaUnits2 <= unit.inkAreaUnits2 * (1 + tol) && p.box.width <= unit.box.width * (1 + tol) && p.box.height <= unit.box.height * (1 + tol);
    const explains = (m: MeasuredMark) => same(wholeOf(m), unit, tol) || m.parts.every((p) => same(p, unit, tol) || fits(p));
    if (!marks.every(explains)) continue;
    const perMark = marks.map((m) => ({
      count: m.inkAreaUnits2 / unit.inkAreaUnits2,
      repeats: same(wholeOf(m), unit, tol) ? 1 : m.parts.filter((p) => same(p, unit, tol)).length,
    }));
    return { inkAreaUnits2: unit.inkAreaUnits2, box: unit.box, copies: c.n, perMark };
  }
  return null;
}
