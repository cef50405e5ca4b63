// The registry of checks of a written chart file, each in its own file named after its code. verifySvg
// measures the file once (measureFile.ts) and runs these in this order; the command line lists them.
import type { FileCheck } from '../measureFile';
import { baselineMismatch } from './baselineMismatch';
import { bleedUnused } from './bleedUnused';
import { contentOutsidePage } from './contentOutsidePage';
import { contentOutsideSafeArea } from './contentOutsideSafeArea';
import { fillPartsSameColour } from './fillPartsSameColour';
import { glyphSizeVaries } from './glyphSizeVaries';
import { inkPageColoured } from './inkPageColoured';
import { keyGlyphSize } from './keyGlyphSize';
import { keyUnitMismatch } from './keyUnitMismatch';
import { lieFactor } from './lieFactor';
import { notDrawn } from './notDrawn';
import { paintedOver } from './paintedOver';
import { referenceNotDrawn } from './referenceNotDrawn';
import { sameGlyphTwoSizes } from './sameGlyphTwoSizes';
import { sliver } from './sliver';
import { spread } from './spread';
import { stackPartialSlot } from './stackPartialSlot';
import { stackSlots } from './stackSlots';
import { strokeThin } from './strokeThin';
import { summaryMismatch } from './summaryMismatch';
import { textSmall } from './textSmall';
import { unevenPitch } from './unevenPitch';
import { zeroDrawn } from './zeroDrawn';

/**
 * Every check, in the order its findings are listed: the lie factor (blocking), whether the ink shows
 * (blocking), whether the file keeps one scale and agrees with its own records (blocking), then print
 * preflight (warnings, never blocking).
 */
export const FILE_CHECKS: readonly FileCheck[] = Object.freeze([
  lieFactor,
  notDrawn,
  referenceNotDrawn,
  zeroDrawn,
  spread,
  inkPageColoured,
  fillPartsSameColour,
  paintedOver,
  glyphSizeVaries,
  sameGlyphTwoSizes,
  keyGlyphSize,
  stackSlots,
  stackPartialSlot,
  unevenPitch,
  baselineMismatch,
  summaryMismatch,
  keyUnitMismatch,
  strokeThin,
  textSmall,
  contentOutsidePage,
  contentOutsideSafeArea,
  sliver,
  bleedUnused,
]);

export {
  baselineMismatch,
  bleedUnused,
  contentOutsidePage,
  contentOutsideSafeArea,
  fillPartsSameColour,
  glyphSizeVaries,
  inkPageColoured,
  keyGlyphSize,
  keyUnitMismatch,
  lieFactor,
  notDrawn,
  paintedOver,
  referenceNotDrawn,
  sameGlyphTwoSizes,
  sliver,
  spread,
  stackPartialSlot,
  stackSlots,
  strokeThin,
  summaryMismatch,
  textSmall,
  unevenPitch,
  zeroDrawn,
};
