// Regions of ink: sets of closed rings after a union, outer rings and holes with opposite orientation,
// read under the nonzero rule. All area work funnels through here so precision is handled once.
import { Clipper, ClipType, FillRule, type PathD, type PathsD } from 'clipper2-ts';
import { TallyError } from '../errors';
import type { Matrix } from './matrix';
import { formatFixed } from './formatFixed';
import { guardSweepWork } from './sweepWork';

export type { PathD, PathsD };
export type Region = PathsD;

export interface Box {
  x: number;
  y: number;
  width: number;
  height: number;
}

export const EMPTY_BOX: Box = { x: 0, y: 0, width: 0, height: 0 };

/**
 * Decimal digits clipper2 keeps for coordinates of this extent: ~1e9 integer steps across the shape, at
 * most 8 (clipper2 refuses more: "Precision is out of range"), which still leaves 1e8 steps per unit.
 */
export function clipperPrecision(extent: number): number {
  if (!(extent > 0) || !Number.isFinite(extent)) return 6;
  return Math.max(-2, Math.min(8, Math.floor(9 - Math.log10(extent))));
}

export function boxOf(paths: PathsD): Box {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const p of paths) for (const pt of p) {
    if (pt.x < minX) minX = pt.x;
    if (pt.y < minY) minY = pt.y;
    if (pt.x > maxX) maxX = pt.x;
    if (pt.y > maxY) maxY = pt.y;
  }
  if (minX === Infinity) return { ...EMPTY_BOX };
  return { x: minX, y: minY, width: maxX - minX, height: maxY - minY };
}

export function extentOf(paths: PathsD): number {
  const b = boxOf(paths);
  return Math.max(b.width, b.height, Math.abs(b.x), Math.abs(b.y), 1e-9);
}

/** Shoelace signed area of one ring. */
export function ringArea(ring: PathD): number {
  let s = 0;
  const n = ring.length;
  for (let i = 0, j = n - 1; i < n; j = i++) s += (ring[j].x + ring[i].x) * (ring[j].y - ring[i].y);
  return -s / 2;
}

/** Area of a unioned region (holes subtract). */
export function regionArea(region: Region): number {
  let s = 0;
  for (const r of region) s += ringArea(r);
  return Math.abs(s);
}

export function regionCentroid(region: Region): { x: number; y: number } {
  let a = 0, cx = 0, cy = 0;
  for (const ring of region) {
    const n = ring.length;
    for (let i = 0, j = n - 1; i < n; j = i++) {
      const cross = ring[j].x * ring[i].y - ring[i].x * ring[j].y;
      a += cross;
      cx += (ring[j].x + ring[i].x) * cross;
      cy += (ring[j].y + ring[i].y) * cross;
    }
  }
  if (Math.abs(a) < 1e-300) return { x: 0, y: 0 };
  return { x: cx / (3 * a), y: cy / (3 * a) };
}

/** Union of filled paths under a fill rule into a clean region. */
export function unionPaths(paths: PathsD, rule: 'nonzero' | 'evenodd'): Region {
  const usable = paths.filter((p) => p.length >= 3);
  if (!usable.length) return [];
  guardCrossings(usable);
  guardSweepWork(usable);
  const prec = clipperPrecision(extentOf(usable));
  return Clipper.booleanOpD(ClipType.Union, usable, null, rule === 'evenodd' ? FillRule.EvenOdd : FillRule.NonZero, prec);
}

/** Union of several clean regions (each already nonzero-consistent). */
export function unionRegions(regions: Region[]): Region {
  const all = regions.flat();
  return unionPaths(all, 'nonzero');
}

/**
 * Most edge crossings a union may face. The clipper's cost grows with crossings (about 0.5 M per
 * second measured here), and real glyph outlines have almost none; scribbled or random outlines
 * have millions, which would stall the app without this guard.
 */
export const MAX_ESTIMATED_CROSSINGS = 1_000_000;

/** Estimate how many edge pairs cross by sampling random pairs; refuse outlines that would stall the union. */
export function guardCrossings(paths: PathsD, limit = MAX_ESTIMATED_CROSSINGS): void {
  let edges = 0;
  for (const p of paths) edges += p.length;
  if (edges < 2000) return;
  const starts: number[] = [];
  let acc = 0;
  for (const p of paths) {
    starts.push(acc);
    acc += p.length;
  }
  const edgeAt = (k: number): [PathD, number] => {
    let lo = 0, hi = starts.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (starts[mid] <= k) lo = mid;
      else hi = mid - 1;
    }
    return [paths[lo], k - starts[lo]];
  };
  let seed = 0x9e3779b9;
  const rnd = () => {
    seed ^= seed << 13; seed ^= seed >>> 17; seed ^= seed << 5;
    return (seed >>> 0) / 4294967296;
  };
  const samples = 20_000;
  let hits = 0;
  for (let s = 0; s < samples; s++) {
    const [pa, ia] = edgeAt(Math.floor(rnd() * edges));
    const [pb, ib] = edgeAt(Math.floor(rnd() * edges));
    if (pa === pb && Math.abs(ia - ib) <= 1) continue;
    const a1 = pa[ia], a2 = pa[(ia + 1) % pa.length], b1 = pb[ib], b2 = pb[(ib + 1) % pb.length];
    if (segmentsCross(a1, a2, b1, b2)) hits++;
  }
  const estimate = (hits / samples) * (edges * edges) / 2;
  if (estimate > limit) {
    throw new TallyError('geometry-limit', `The outline crosses itself about ${Math.round(estimate).toLocaleString('en')} times (limit ${limit.toLocaleString('en')}); it looks like scribble rather than a glyph. Simplify it.`);
  }
}

function segmentsCross(a: { x: number; y: number }, b: { x: number; y: number }, c: { x: number; y: number }, d: { x: number; y: number }): boolean {
  const o = (p: { x: number; y: number }, q: { x: number; y: number }, r: { x: number; y: number }) => (q.x - p.x) * (r.y - p.y) - (q.y - p.y) * (r.x - p.x);
  const d1 = o(a, b, c), d2 = o(a, b, d), d3 = o(c, d, a), d4 = o(c, d, b);
  return d1 * d2 < 0 && d3 * d4 < 0;
}

export function intersectRegions(a: Region, b: Region): Region {
  if (!a.length || !b.length) return [];
  const prec = clipperPrecision(Math.max(extentOf(a), extentOf(b)));
  return Clipper.booleanOpD(ClipType.Intersection, a, b, FillRule.NonZero, prec);
}

export function differenceRegions(a: Region, b: Region): Region {
  if (!a.length) return [];
  if (!b.length) return a;
  const prec = clipperPrecision(Math.max(extentOf(a), extentOf(b)));
  return Clipper.booleanOpD(ClipType.Difference, a, b, FillRule.NonZero, prec);
}

export function transformRegion(region: Region, m: Matrix): Region {
  const flip = m[0] * m[3] - m[1] * m[2] < 0;
  return region.map((ring) => {
    const out = ring.map((p) => ({ x: m[0] * p.x + m[2] * p.y + m[4], y: m[1] * p.x + m[3] * p.y + m[5] }));
    // Keep orientation consistent under reflections, so nonzero reading is unchanged.
    return flip ? out.reverse() : out;
  });
}

/** The region moved by (dx, dy): a pure translate keeps every ring's area, length and orientation. */
export function translateRegion(region: Region, dx: number, dy: number): Region {
  if (dx === 0 && dy === 0) return region;
  return region.map((ring) => ring.map((p) => ({ x: p.x + dx, y: p.y + dy })));
}

export function rectRing(b: Box): PathD {
  return [
    { x: b.x, y: b.y },
    { x: b.x + b.width, y: b.y },
    { x: b.x + b.width, y: b.y + b.height },
    { x: b.x, y: b.y + b.height },
  ];
}

/** Serialise a region as SVG path data with a fixed number of decimals; read it with fill-rule nonzero. */
export function regionToPathData(region: Region, decimals = 3): string {
  // Plain loops and one concatenation per ring: this runs once per written piece, for every point.
  let d = '';
  for (const r of region) {
    if (r.length < 3) continue;
    let ring = 'M' + formatFixed(r[0].x, decimals) + ' ' + formatFixed(r[0].y, decimals);
    for (let i = 1; i < r.length; i++) ring += 'L' + formatFixed(r[i].x, decimals) + ' ' + formatFixed(r[i].y, decimals);
    d += ring + 'Z';
  }
  return d;
}

/**
 * Signed area of the region on one side of an axis-aligned cut, without a clipping library:
 * Sutherland–Hodgman against one half-plane keeps signed area exact for any ring, because the
 * zero-width bridges it adds along the cut line enclose nothing.
 */
export function areaBelowCut(region: Region, axis: 'x' | 'y', t: number, keep: 'low' | 'high'): number {
  let total = 0;
  for (const ring of region) {
    const n = ring.length;
    if (n < 3) continue;
    let s = 0;
    let prev = ring[n - 1];
    let prevIn = keep === 'low' ? prev[axis] <= t : prev[axis] >= t;
    let lastOut: { x: number; y: number } | null = null;
    let firstOut: { x: number; y: number } | null = null;
    const emit = (p: { x: number; y: number }) => {
      if (lastOut) s += lastOut.x * p.y - p.x * lastOut.y;
      else firstOut = p;
      lastOut = p;
    };
    for (let i = 0; i < n; i++) {
      const cur = ring[i];
      const curIn = keep === 'low' ? cur[axis] <= t : cur[axis] >= t;
      if (curIn !== prevIn) {
        const u = (t - prev[axis]) / (cur[axis] - prev[axis]);
        emit({ x: prev.x + (cur.x - prev.x) * u, y: prev.y + (cur.y - prev.y) * u });
      }
      if (curIn) emit(cur);
      prev = cur;
      prevIn = curIn;
    }
    if (lastOut && firstOut) {
      const lo = lastOut as { x: number; y: number };
      const fo = firstOut as { x: number; y: number };
      s += lo.x * fo.y - fo.x * lo.y;
    }
    total += s / 2;
  }
  return total;
}
