// Path data for a shared glyph shape moved by an offset, written so that every copy is an exact translate of
// the shape as <defs> writes it: each coordinate is the shape's coordinate rounded to the file's decimals plus
// the offset rounded the same way, added in whole decimal steps. Rounding each moved coordinate on its own
// instead shifts every copy's vertices by up to half a step in its own way, so copies of one glyph differ in
// ink by about 1e-5 of their area, and a file written with <use> (shape and offset rounded apart) measures
// differently from the same chart written out in full.
//
// The offset is rounded at the shape's ink-box left and bottom edges, not at its origin: those edges then land
// exactly where rounding the moved coordinate would put them, so a glyph standing on a baseline touches the rule
// under it as in a file written out in full, instead of reaching up to one step into it.
import type { Region } from '../geometry/region';

/** A shape's rings as whole steps of 10^-decimals, each coordinate exactly what toFixed(decimals) writes. */
export interface ShapeSteps {
  decimals: number;
  rings: number[][];
  /** The shape's leftmost and lowest (largest y) coordinates, as numbers and in steps: where copies are anchored. */
  leftMm: number;
  bottomMm: number;
  leftSteps: number;
  bottomSteps: number;
}

function stepsOf(n: number, decimals: number): number {
  // toFixed is the rounding every other coordinate of the file gets; the product is within a hair of a whole number.
  return Math.round(Number(n.toFixed(decimals)) * 10 ** decimals);
}

/** The shape once in steps; rings with fewer than three points are left out as regionToPathData does. */
export function shapeSteps(region: Region, decimals: number): ShapeSteps {
  const rings: number[][] = [];
  let leftMm = Infinity;
  let bottomMm = -Infinity;
  for (const ring of region) {
    if (ring.length < 3) continue;
    const r: number[] = new Array<number>(ring.length * 2);
    for (let i = 0; i < ring.length; i++) {
      r[2 * i] = stepsOf(ring[i].x, decimals);
      r[2 * i + 1] = stepsOf(ring[i].y, decimals);
      if (ring[i].x < leftMm) leftMm = ring[i].x;
      if (ring[i].y > bottomMm) bottomMm = ring[i].y;
    }
    rings.push(r);
  }
  if (rings.length === 0) return { decimals, rings, leftMm: 0, bottomMm: 0, leftSteps: 0, bottomSteps: 0 };
  return { decimals, rings, leftMm, bottomMm, leftSteps: stepsOf(leftMm, decimals), bottomSteps: stepsOf(bottomMm, decimals) };
}

/** A whole number of steps as the shortest decimal text: no trailing zeros, no "-0". */
export function stepsToText(steps: number, decimals: number): string {
  if (steps === 0) return '0';
  if (decimals === 0) return String(steps);
  const scale = 10 ** decimals;
  const a = Math.abs(steps);
  const whole = Math.floor(a / scale);
  const frac = a - whole * scale;
  const sign = steps < 0 ? '-' : '';
  if (frac === 0) return `${sign}${whole}`;
  return `${sign}${whole}.${String(frac).padStart(decimals, '0').replace(/0+$/, '')}`;
}

/**
 * The offset, in steps, at which a copy moved by (xMm, yMm) is written (as <use x y> or added to every
 * coordinate): its ink box's left edge is round(xMm + left) and its bottom edge round(yMm + bottom).
 */
export function placementSteps(shape: ShapeSteps, xMm: number, yMm: number): { dx: number; dy: number } {
  const d = shape.decimals;
  return { dx: stepsOf(xMm + shape.leftMm, d) - shape.leftSteps, dy: stepsOf(yMm + shape.bottomMm, d) - shape.bottomSteps };
}

/** Path data of the shape moved by (dx, dy) steps: the same text regionToPathData writes for the same numbers. */
export function translatedPathData(shape: ShapeSteps, dxSteps: number, dySteps: number): string {
  const d = shape.decimals;
  let out = '';
  for (const ring of shape.rings) {
    out += 'M';
    for (let i = 0; i < ring.length; i += 2) {
      if (i > 0) out += 'L';
      out += `${stepsToText(ring[i] + dxSteps, d)} ${stepsToText(ring[i + 1] + dySteps, d)}`;
    }
    out += 'Z';
  }
  return out;
}
