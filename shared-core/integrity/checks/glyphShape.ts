// Whether two inks are one glyph at two sizes: the same share of their box inked and the same box aspect.
import type { Ink } from '../measureFile';
import { relDiff, SAME_GLYPH_TOLERANCE } from './fileFinding';

/** Shape signature independent of size: ink / box area and box aspect. Equal signatures mean one glyph at two sizes. */
function signature(ink: Ink): { fill: number; aspect: number } | null {
  const b = ink.boxMm;
  if (!b || !(b.width > 0) || !(b.height > 0)) return null;
  return { fill: ink.areaMm2 / (b.width * b.height), aspect: b.width / b.height };
}

export function sameShape(a: Ink, b: Ink): boolean {
  const sa = signature(a);
  const sb = signature(b);
  return !!sa && !!sb && relDiff(sa.fill, sb.fill) <= SAME_GLYPH_TOLERANCE && relDiff(sa.aspect, sb.aspect) <= SAME_GLYPH_TOLERANCE;
}
