// The painted area of a stroke, built as the union of its parts the way SVG 2 (§13.5 "Stroke shape")
// defines it: a rectangle swept along each segment, a join on the outside of each corner, a cap at
// each open end. Built from pieces instead of one polygon offset so that miter-limit fallback is a
// true bevel (SVG) and not the squared miter a polygon offsetter would give.
import type { PathD, PathsD } from 'clipper2-ts';
import { ringArea, unionPaths, type Region } from '../geometry/region';
import { guardSweepWork } from '../geometry/sweepWork';
import type { Polyline } from './flattenPath';

export type LineJoin = 'miter' | 'round' | 'bevel';
export type LineCap = 'butt' | 'round' | 'square';

export interface StrokeStyle {
  width: number;
  join: LineJoin;
  cap: LineCap;
  miterLimit: number;
}

type P = { x: number; y: number };

/** Turning angle above which a smooth-curve vertex gets a round wedge instead of a tiny miter. */
const SMOOTH_MITER_MAX_TURN = 0.2;

export function strokeRegion(lines: Polyline[], style: StrokeStyle, toleranceUnits: number): Region {
  const h = style.width / 2;
  if (!(h > 0)) return [];
  // The stroke's outline runs beside its centre line at every height, so the union can cost no less
  // than the centre line's own sweep: refuse a comb of strokes before building a piece per segment.
  guardSweepWork(lines.map((l) => l.points));
  const pieces: PathD[] = [];
  const tol = Math.min(toleranceUnits, h / 4);
  const arcStep = 2 * Math.acos(Math.max(-1, 1 - tol / h));

  for (const line of lines) {
    let pts = line.points;
    let corners = line.corners;
    if (line.closed && pts.length > 1 && same(pts[0], pts[pts.length - 1])) {
      pts = pts.slice(0, -1);
      corners = corners.slice(0, -1);
    }
    if (pts.length === 1 || pts.every((p) => same(p, pts[0]))) {
      // Zero-length subpath: SVG 2 paints a dot for round caps and an axis-aligned square for square caps.
      if (style.cap === 'round') pieces.push(circle(pts[0], h, arcStep));
      if (style.cap === 'square') pieces.push(square(pts[0], h));
      continue;
    }
    const n = pts.length;
    const segCount = line.closed ? n : n - 1;
    for (let i = 0; i < segCount; i++) {
      const a = pts[i], b = pts[(i + 1) % n];
      const nrm = normal(a, b);
      pieces.push([add(a, nrm, h), add(b, nrm, h), add(b, nrm, -h), add(a, nrm, -h)]);
    }
    const joinAt = (i: number) => {
      const prev = pts[(i - 1 + n) % n], v = pts[i], next = pts[(i + 1) % n];
      const join: LineJoin | 'smooth' = corners[i] ? style.join : 'smooth';
      addJoin(pieces, prev, v, next, h, join, style.miterLimit, arcStep);
    };
    if (line.closed) for (let i = 0; i < n; i++) joinAt(i);
    else for (let i = 1; i < n - 1; i++) joinAt(i);
    if (!line.closed && style.cap !== 'butt') {
      addCap(pieces, pts[1], pts[0], h, style.cap, arcStep);
      addCap(pieces, pts[n - 2], pts[n - 1], h, style.cap, arcStep);
    }
  }
  // Same orientation for every piece, so overlaps never cancel under nonzero.
  const oriented = pieces.filter((p) => p.length >= 3).map((p) => (ringArea(p) < 0 ? p.slice().reverse() : p));
  return unionPaths(oriented, 'nonzero');
}

function same(a: P, b: P) {
  return a.x === b.x && a.y === b.y;
}
function normal(a: P, b: P): P {
  const dx = b.x - a.x, dy = b.y - a.y;
  const len = Math.hypot(dx, dy) || 1;
  return { x: -dy / len, y: dx / len };
}
function add(p: P, d: P, k: number): P {
  return { x: p.x + d.x * k, y: p.y + d.y * k };
}

function addJoin(pieces: PathD[], prev: P, v: P, next: P, h: number, join: LineJoin | 'smooth', miterLimit: number, arcStep: number) {
  const n1 = normal(prev, v), n2 = normal(v, next);
  const d1 = { x: v.x - prev.x, y: v.y - prev.y }, d2 = { x: next.x - v.x, y: next.y - v.y };
  const cross = d1.x * d2.y - d1.y * d2.x;
  const dot = d1.x * d2.x + d1.y * d2.y;
  const turn = Math.atan2(Math.abs(cross), dot); // 0 = straight on, π = doubling back
  if (turn < 1e-12) return;
  const s = cross > 0 ? -1 : 1; // the outer side is opposite the turn
  const a = add(v, n1, s * h), b = add(v, n2, s * h);
  let kind: LineJoin = join === 'smooth' ? (turn < SMOOTH_MITER_MAX_TURN ? 'miter' : 'round') : join;
  if (kind === 'miter') {
    // SVG: miter length / stroke width = 1 / sin(θ/2), θ the angle between segments = π - turn.
    const ratio = 1 / Math.max(1e-12, Math.cos(turn / 2));
    if (join !== 'smooth' && ratio > miterLimit) kind = 'bevel';
    else {
      const bis = { x: n1.x + n2.x, y: n1.y + n2.y };
      const bl = Math.hypot(bis.x, bis.y);
      if (bl < 1e-12) kind = 'bevel';
      else {
        const tip = add(v, { x: bis.x / bl, y: bis.y / bl }, s * h * ratio);
        pieces.push([v, a, tip, b]);
        return;
      }
    }
  }
  if (kind === 'bevel') {
    pieces.push([v, a, b]);
    return;
  }
  // Round: a wedge of the circle from a to b on the outer side.
  const start = Math.atan2(a.y - v.y, a.x - v.x);
  let sweep = Math.atan2(b.y - v.y, b.x - v.x) - start;
  while (sweep > Math.PI) sweep -= 2 * Math.PI;
  while (sweep < -Math.PI) sweep += 2 * Math.PI;
  const steps = Math.max(1, Math.ceil(Math.abs(sweep) / arcStep));
  const wedge: PathD = [v];
  for (let i = 0; i <= steps; i++) {
    const t = start + (sweep * i) / steps;
    wedge.push({ x: v.x + h * Math.cos(t), y: v.y + h * Math.sin(t) });
  }
  pieces.push(wedge);
}

function addCap(pieces: PathD[], from: P, end: P, h: number, cap: LineCap, arcStep: number) {
  const nrm = normal(from, end);
  const dir = { x: nrm.y, y: -nrm.x }; // unit vector along from→end
  if (cap === 'square') {
    pieces.push([add(end, nrm, h), add(add(end, nrm, h), dir, h), add(add(end, nrm, -h), dir, h), add(end, nrm, -h)]);
    return;
  }
  const start = Math.atan2(nrm.y, nrm.x);
  const steps = Math.max(2, Math.ceil(Math.PI / arcStep));
  const half: PathD = [];
  // Half disc on the outside of the end, from +normal through the forward direction to -normal.
  const sign = dir.x * -nrm.y + dir.y * nrm.x > 0 ? 1 : -1;
  for (let i = 0; i <= steps; i++) {
    const t = start + sign * (Math.PI * i) / steps;
    half.push({ x: end.x + h * Math.cos(t), y: end.y + h * Math.sin(t) });
  }
  pieces.push(half);
}

function circle(c: P, r: number, arcStep: number): PathD {
  const steps = Math.max(8, Math.ceil((2 * Math.PI) / arcStep));
  const out: PathD = [];
  for (let i = 0; i < steps; i++) {
    const t = (2 * Math.PI * i) / steps;
    out.push({ x: c.x + r * Math.cos(t), y: c.y + r * Math.sin(t) });
  }
  return out;
}

function square(c: P, h: number): PathD {
  return [{ x: c.x - h, y: c.y - h }, { x: c.x + h, y: c.y - h }, { x: c.x + h, y: c.y + h }, { x: c.x - h, y: c.y + h }];
}

export type { PathsD };
