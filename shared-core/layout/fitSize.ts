// Finds the largest size at which a layout fits its box. Fit is nearly but not strictly monotone
// (columns and rows jump in whole steps), so a coarse downward scan finds the region and a short
// bisection sharpens it, always returning a size that was checked to fit.
import { formatValue } from './labels';
import type { LayoutContext } from './layoutContext';
import { noRoomError, type NoRoomDetails } from './noRoom';

export interface FitResult {
  sizeMm: number;
  /** False when even the smallest size does not fit; sizeMm is then the smallest. */
  fits: boolean;
}

const STEP = 0.97;

export function fitLargest(maxMm: number, minMm: number, fits: (sizeMm: number) => boolean): FitResult {
  // A box with no room gives no positive size to scan from; the scan below would never end at 0.
  if (!(maxMm > 0) || !(minMm > 0) || !Number.isFinite(maxMm)) return { sizeMm: Math.max(0, minMm), fits: false };
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

/**
 * Smallest glyph the layout draws by itself: no smaller than the smallest print text (6 pt = 2.117 mm),
 * below which a pictogram reads as a speck (common practice, no source). Below it the chart is refused.
 */
export const MIN_GLYPH_MM = 2.2;

/**
 * The glyph size: the designer's (layout.glyphSizeMm) if it fits, else the largest that fits up to
 * `maxMm`; a warning says when the asked size was reduced. When nothing fits at a legible size the
 * chart is refused (TallyError 'layout-no-room'), with `explain` giving the figures for the sentence.
 */
export function chooseGlyphSize(
  ctx: LayoutContext,
  maxMm: number,
  fits: (sizeMm: number) => boolean,
  what: string,
  explain: (smallestMm: number) => Omit<NoRoomDetails, 'what'> = () => ({}),
): number {
  const asked = ctx.spec.layout.glyphSizeMm;
  const smallest = Math.min(MIN_GLYPH_MM, asked ?? MIN_GLYPH_MM);
  const fit = fitLargest(asked ?? maxMm, smallest, fits);
  if (!fit.fits) throw noRoomError(ctx.spec, { what, ...explain(smallest) });
  else if (asked !== undefined && fit.sizeMm < asked - 1e-9) {
    ctx.warnings.push({
      code: 'glyph-size-reduced',
      message: `Glyphs of ${formatValue(asked)} mm do not fit inside the margins; they are drawn at ${formatValue(fit.sizeMm)} mm.`,
    });
  }
  return fit.sizeMm;
}
