// Ink-true cuts: where to cut a glyph so the kept part holds a given fraction of its ink,
// returned as real geometry (for print, no clip paths). Ink on one side of an axis-aligned
// cut grows monotonically with the cut position, so bisection always converges.
import { TallyError } from '../errors';
import { areaBelowCut, boxOf, intersectRegions, rectRing, regionArea, type Region } from '../geometry/region';

/** Which part is kept: `ltr` keeps the left part (filling from the left), `btt` the bottom part, and so on. */
export type CutDirection = 'ltr' | 'rtl' | 'btt' | 'ttb';

export interface InkCut {
  region: Region;
  /** Cut coordinate on the cut axis (x for ltr/rtl, y for btt/ttb), glyph units. */
  cutAt: number;
  keptAreaUnits2: number;
  totalAreaUnits2: number;
  fraction: number;
}

export function cutInk(region: Region, fraction: number, direction: CutDirection = 'ltr'): InkCut {
  if (!Number.isFinite(fraction) || fraction < 0 || fraction > 1) {
    throw new TallyError('number-invalid', `An ink fraction must be between 0 and 1; got ${fraction}.`);
  }
  const total = regionArea(region);
  if (!(total > 0)) throw new TallyError('glyph-empty', 'The glyph has no ink to cut.');
  const box = boxOf(region);
  const axis = direction === 'ltr' || direction === 'rtl' ? 'x' : 'y';
  const keep: 'low' | 'high' = direction === 'ltr' || direction === 'ttb' ? 'low' : 'high';
  const lo0 = axis === 'x' ? box.x : box.y;
  const hi0 = lo0 + (axis === 'x' ? box.width : box.height);
  if (fraction === 0) return { region: [], cutAt: keep === 'low' ? lo0 : hi0, keptAreaUnits2: 0, totalAreaUnits2: total, fraction };
  if (fraction === 1) return { region, cutAt: keep === 'low' ? hi0 : lo0, keptAreaUnits2: total, totalAreaUnits2: total, fraction };

  const target = fraction * total;
  const kept = (t: number) => Math.abs(areaBelowCut(region, axis, t, keep));
  let lo = lo0, hi = hi0;
  for (let i = 0; i < 200 && hi - lo > (hi0 - lo0) * 1e-13; i++) {
    const mid = (lo + hi) / 2;
    const a = kept(mid);
    // For 'low' the kept ink grows with t; for 'high' it shrinks.
    if ((a < target) === (keep === 'low')) lo = mid;
    else hi = mid;
  }
  const cutAt = (lo + hi) / 2;
  const pad = Math.max(box.width, box.height) + 1;
  const keepBox = axis === 'x'
    ? keep === 'low' ? { x: box.x - pad, y: box.y - pad, width: cutAt - box.x + pad, height: box.height + 2 * pad } : { x: cutAt, y: box.y - pad, width: box.x + box.width + pad - cutAt, height: box.height + 2 * pad }
    : keep === 'low' ? { x: box.x - pad, y: box.y - pad, width: box.width + 2 * pad, height: cutAt - box.y + pad } : { x: box.x - pad, y: cutAt, width: box.width + 2 * pad, height: box.y + box.height + pad - cutAt };
  const part = intersectRegions(region, [rectRing(keepBox)]);
  return { region: part, cutAt, keptAreaUnits2: regionArea(part), totalAreaUnits2: total, fraction };
}

/** The naive cut at a fraction of the bounding-box width, for comparison in reports and tests. */
export function cutByWidth(region: Region, fraction: number, direction: CutDirection = 'ltr'): InkCut {
  const box = boxOf(region);
  const total = regionArea(region);
  const horizontal = direction === 'ltr' || direction === 'rtl';
  const len = horizontal ? box.width : box.height;
  const start = horizontal ? box.x : box.y;
  const keepLow = direction === 'ltr' || direction === 'ttb';
  const cutAt = keepLow ? start + fraction * len : start + (1 - fraction) * len;
  const kept = Math.abs(areaBelowCut(region, horizontal ? 'x' : 'y', cutAt, keepLow ? 'low' : 'high'));
  return { region: [], cutAt, keptAreaUnits2: kept, totalAreaUnits2: total, fraction: kept / total };
}
