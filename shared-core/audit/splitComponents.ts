// Splits a unioned ink region into its separate pieces: each outer ring with the holes inside it.
import { boxOf, ringArea, type Box, type Region } from '../geometry/region';

export interface InkComponent {
  region: Region;
  box: Box;
  areaUnits2: number;
}

function inside(pt: { x: number; y: number }, ring: readonly { x: number; y: number }[]): boolean {
  let c = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const a = ring[i], b = ring[j];
    if (a.y > pt.y !== b.y > pt.y && pt.x < ((b.x - a.x) * (pt.y - a.y)) / (b.y - a.y) + a.x) c = !c;
  }
  return c;
}

/** Connected pieces of a clean (unioned) region; more than `maxPieces` returns null (too many to be sub-glyphs). */
export function splitComponents(region: Region, maxPieces = 2000): InkComponent[] | null {
  const rings = region.filter((r) => r.length >= 3).map((r) => ({ ring: r, area: ringArea(r) }));
  if (!rings.length) return [];
  // After a union outer rings and holes wind in opposite directions; the largest ring is an outer one.
  let largest = rings[0];
  for (const r of rings) if (Math.abs(r.area) > Math.abs(largest.area)) largest = r;
  const outerSign = Math.sign(largest.area);
  const outers = rings.filter((r) => Math.sign(r.area) === outerSign);
  if (outers.length > maxPieces) return null;
  const holes = rings.filter((r) => Math.sign(r.area) !== outerSign);
  const pieces = outers.map((o) => ({ rings: [o.ring], outer: Math.abs(o.area), area: Math.abs(o.area), box: boxOf([o.ring]) }));
  for (const h of holes) {
    let best: (typeof pieces)[number] | null = null;
    for (const p of pieces) {
      if (p.outer <= Math.abs(h.area)) continue;
      if (!inside(h.ring[0], p.rings[0])) continue;
      if (!best || p.outer < best.outer) best = p;
    }
    if (best) {
      best.rings.push(h.ring);
      best.area -= Math.abs(h.area);
    }
  }
  return pieces.map((p) => ({ region: p.rings, box: p.box, areaUnits2: p.area }));
}
