// SVG path data to polylines. Curves are flattened with an absolute tolerance (max distance between
// curve and chord); arcs are sampled on the true ellipse rather than through Bézier approximations,
// because the cubic stand-in for a quarter circle is off by 2.7e-4 r and would bias circle areas.
import svgpath from 'svgpath';
import { TallyError } from '../errors';
import type { Matrix } from '../geometry/matrix';

export interface Polyline {
  points: { x: number; y: number }[];
  /** Ended with Z: a stroke joins the ends instead of capping them. */
  closed: boolean;
  /** true where the vertex is a command boundary (a real corner for stroke joins). */
  corners: boolean[];
}

export interface FlattenBudget {
  /** Most path commands accepted in one path. */
  maxCommands: number;
  /** Most polyline vertices produced in all (shared across a glyph). */
  maxVertices: number;
  used: number;
}

export function newBudget(maxCommands = 250_000, maxVertices = 3_000_000): FlattenBudget {
  return { maxCommands, maxVertices, used: 0 };
}

const MAX_SEGMENTS_PER_CURVE = 2048;

export function flattenPathData(d: string, m: Matrix, toleranceUnits: number, budget: FlattenBudget): Polyline[] {
  if (d.length > budget.maxCommands * 40) {
    throw new TallyError('geometry-limit', `A path is ${d.length} characters long, more than the ${budget.maxCommands}-command limit allows.`);
  }
  const parsed = svgpath(d);
  const err = (parsed as unknown as { err: string }).err;
  if (err) throw new TallyError('path-malformed', `The path data cannot be read (${err.replace('SvgPath: ', '')}).`);
  const segCount = (parsed as unknown as { segments: unknown[] }).segments.length;
  if (segCount > budget.maxCommands) {
    throw new TallyError('geometry-limit', `A path has ${segCount} commands; the limit is ${budget.maxCommands} (path command limit).`);
  }
  const tol = toleranceUnits > 0 ? toleranceUnits : 1e-3;
  const out: Polyline[] = [];
  let cur: Polyline | null = null;
  let startX = 0, startY = 0;

  const push = (x: number, y: number, corner: boolean) => {
    if (!Number.isFinite(x) || !Number.isFinite(y)) {
      throw new TallyError('number-invalid', 'The path data has a coordinate that is not a finite number.');
    }
    if (!cur) {
      cur = { points: [], closed: false, corners: [] };
      out.push(cur);
    }
    const pts = cur.points;
    const last = pts[pts.length - 1];
    if (last && last.x === x && last.y === y) {
      if (corner) cur.corners[pts.length - 1] = true;
      return;
    }
    budget.used += 1;
    if (budget.used > budget.maxVertices) {
      throw new TallyError('geometry-limit', `The glyph needs more than ${budget.maxVertices} outline points after flattening (geometry limit).`);
    }
    pts.push({ x, y });
    cur.corners.push(corner);
  };

  parsed.matrix([...m]).abs().unshort().iterate((seg, _i, x0, y0) => {
    const cmd = seg[0];
    switch (cmd) {
      case 'M':
        cur = null;
        startX = seg[1];
        startY = seg[2];
        push(seg[1], seg[2], true);
        break;
      case 'L':
        push(seg[1], seg[2], true);
        break;
      case 'H':
        push(seg[1], y0, true);
        break;
      case 'V':
        push(x0, seg[1], true);
        break;
      case 'C':
        flattenCubic(x0, y0, seg[1], seg[2], seg[3], seg[4], seg[5], seg[6], tol, push);
        break;
      case 'Q':
        flattenQuad(x0, y0, seg[1], seg[2], seg[3], seg[4], tol, push);
        break;
      case 'A':
        flattenArc(x0, y0, seg[1], seg[2], seg[3], seg[4], seg[5], seg[6], seg[7], tol, push);
        break;
      case 'Z':
      case 'z':
        if (cur) {
          (cur as Polyline).closed = true;
          if ((cur as Polyline).points.length) (cur as Polyline).corners[0] = true;
        }
        // A command after Z starts from the subpath start in a new polyline.
        cur = null;
        push(startX, startY, true);
        break;
      default:
        break;
    }
  });
  return out.filter((p) => p.points.length >= 2 || p.closed);
}

type Push = (x: number, y: number, corner: boolean) => void;

function segmentsFor(secondDiff: number, factor: number, tol: number): number {
  const n = Math.ceil(Math.sqrt((factor * secondDiff) / tol));
  return Math.max(1, Math.min(MAX_SEGMENTS_PER_CURVE, Number.isFinite(n) ? n : 1));
}

function flattenCubic(x0: number, y0: number, x1: number, y1: number, x2: number, y2: number, x3: number, y3: number, tol: number, push: Push) {
  // Uniform subdivision error <= (1/8) max|B''| / n^2 with |B''| <= 6 max(|p0-2p1+p2|, |p1-2p2+p3|).
  const dd = Math.max(Math.hypot(x0 - 2 * x1 + x2, y0 - 2 * y1 + y2), Math.hypot(x1 - 2 * x2 + x3, y1 - 2 * y2 + y3));
  const n = segmentsFor(dd, 0.75, tol);
  for (let i = 1; i <= n; i++) {
    const t = i / n, u = 1 - t;
    const a = u * u * u, b = 3 * u * u * t, c = 3 * u * t * t, e = t * t * t;
    push(a * x0 + b * x1 + c * x2 + e * x3, a * y0 + b * y1 + c * y2 + e * y3, i === n);
  }
}

function flattenQuad(x0: number, y0: number, x1: number, y1: number, x2: number, y2: number, tol: number, push: Push) {
  const dd = Math.hypot(x0 - 2 * x1 + x2, y0 - 2 * y1 + y2);
  const n = segmentsFor(dd, 0.25, tol);
  for (let i = 1; i <= n; i++) {
    const t = i / n, u = 1 - t;
    push(u * u * x0 + 2 * u * t * x1 + t * t * x2, u * u * y0 + 2 * u * t * y1 + t * t * y2, i === n);
  }
}

/** Endpoint-to-centre conversion, SVG 1.1 Implementation Notes F.6.5 and F.6.6 (radius correction). */
function flattenArc(x1: number, y1: number, rxIn: number, ryIn: number, phiDeg: number, large: number, sweep: number, x2: number, y2: number, tol: number, push: Push) {
  let rx = Math.abs(rxIn), ry = Math.abs(ryIn);
  if ((x1 === x2 && y1 === y2)) return;
  if (rx === 0 || ry === 0) {
    push(x2, y2, true);
    return;
  }
  const phi = (phiDeg * Math.PI) / 180;
  const cos = Math.cos(phi), sin = Math.sin(phi);
  const dx = (x1 - x2) / 2, dy = (y1 - y2) / 2;
  const x1p = cos * dx + sin * dy;
  const y1p = -sin * dx + cos * dy;
  const lambda = (x1p * x1p) / (rx * rx) + (y1p * y1p) / (ry * ry);
  if (lambda > 1) {
    const s = Math.sqrt(lambda);
    rx *= s;
    ry *= s;
  }
  const num = rx * rx * ry * ry - rx * rx * y1p * y1p - ry * ry * x1p * x1p;
  const den = rx * rx * y1p * y1p + ry * ry * x1p * x1p;
  let coef = den === 0 ? 0 : Math.sqrt(Math.max(0, num / den));
  if (large === sweep) coef = -coef;
  const cxp = (coef * rx * y1p) / ry;
  const cyp = (-coef * ry * x1p) / rx;
  const cx = cos * cxp - sin * cyp + (x1 + x2) / 2;
  const cy = sin * cxp + cos * cyp + (y1 + y2) / 2;
  const ang = (ux: number, uy: number, vx: number, vy: number) => Math.atan2(ux * vy - uy * vx, ux * vx + uy * vy);
  const theta1 = ang(1, 0, (x1p - cxp) / rx, (y1p - cyp) / ry);
  let dtheta = ang((x1p - cxp) / rx, (y1p - cyp) / ry, (-x1p - cxp) / rx, (-y1p - cyp) / ry);
  if (!sweep && dtheta > 0) dtheta -= 2 * Math.PI;
  if (sweep && dtheta < 0) dtheta += 2 * Math.PI;
  // Chord error of a step dθ on radius r is r (1 - cos(dθ/2)).
  const r = Math.max(rx, ry);
  const step = tol >= r ? Math.PI / 2 : 2 * Math.acos(1 - tol / r);
  const n = Math.max(2, Math.min(MAX_SEGMENTS_PER_CURVE * 2, Math.ceil(Math.abs(dtheta) / step)));
  for (let i = 1; i <= n; i++) {
    if (i === n) {
      push(x2, y2, true);
      break;
    }
    const t = theta1 + (dtheta * i) / n;
    const ex = rx * Math.cos(t), ey = ry * Math.sin(t);
    push(cos * ex - sin * ey + cx, sin * ex + cos * ey + cy, false);
  }
}
