// Finds the largest size at which a layout fits its box. Fit is nearly but not strictly monotone
// (columns and rows jump in whole steps), so a coarse downward scan finds the region and a short
// bisection sharpens it, always returning a size that was checked to fit.
import { formatValue } from './labels';
import { overflowWarning, type LayoutContext } from './layoutContext';

export interface FitResult {
  sizeMm: number;
  /** False when even the smallest size does not fit; sizeMm is then the smallest. */
  fits: boolean;
}

const STEP = 0.97;

export function fitLargest(maxMm: number, minMm: number, fits: (sizeMm: number) => boolean): FitResult {
  if (fits(maxMm)) return { sizeMm: maxMm, fits: true };
  let above = maxMm;
  for (let size = maxMm * STEP; size >= minMm; size *= STEP) {
    if (fits(size)) {
      let lo = size;
      let hi = above;
      for (let i = 0; i < 14; i++) {
        const mid = (lo + hi) / 2;
        if (fits(mid)) lo = mid;
        else hi = mid;
      }
      return { sizeMm: lo, fits: true };
    }
    above = size;
  }
  return { sizeMm: minMm, fits: fits(minMm) };
}

/** Smallest glyph size the layout tries before it gives up and lets content overflow. */
export const MIN_GLYPH_MM = 1;

/**
 * The glyph size: the designer's (layout.glyphSizeMm) if it fits, else the largest that fits up to
 * `maxMm`; a warning says when the asked size was reduced or nothing fits.
 */
export function chooseGlyphSize(ctx: LayoutContext, maxMm: number, fits: (sizeMm: number) => boolean, what: string): number {
  const asked = ctx.spec.layout.glyphSizeMm;
  const fit = fitLargest(asked ?? maxMm, Math.min(MIN_GLYPH_MM, asked ?? MIN_GLYPH_MM), fits);
  if (!fit.fits) ctx.warnings.push(overflowWarning(what));
  else if (asked !== undefined && fit.sizeMm < asked - 1e-9) {
    ctx.warnings.push({
      code: 'glyph-size-reduced',
      message: `Glyphs of ${formatValue(asked)} mm do not fit inside the margins; they are drawn at ${formatValue(fit.sizeMm)} mm.`,
    });
  }
  return fit.sizeMm;
}
