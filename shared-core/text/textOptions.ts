// Option types shared by the text functions, and the checks that turn bad options into plain errors.

import { TallyError } from '../errors';
import type { FontWeight, TextFamily } from './loadFont';

export type TextAnchor = 'start' | 'middle' | 'end';

export interface TextStyle {
  /** Font size (the em square) in millimetres; use ptToMm for a size in points. */
  sizeMm: number;
  /** 400 regular (default) or 700 bold. */
  weight?: FontWeight;
  /** Bundled family, 'sans' (default) or 'serif'. */
  family?: TextFamily;
}

export interface TextPlacement extends TextStyle {
  /** Anchor point on the baseline, page millimetres, y grows downward as in SVG. */
  xMm: number;
  yMm: number;
  /** Which part of the advance sits on xMm, as SVG text-anchor for left-to-right text. Default 'start'. */
  anchor?: TextAnchor;
  /** Decimals written in the path data, 0 to 6. Default 3 (a micrometre in mm). */
  decimals?: number;
}

/** A rectangle in page millimetres, y downward. */
export interface RectMm {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface CheckedPlacement {
  sizeMm: number;
  weight: FontWeight;
  family: TextFamily;
  xMm: number;
  yMm: number;
  anchor: TextAnchor;
  decimals: number;
}

export function checkStyle(style: TextStyle): { sizeMm: number; weight: FontWeight; family: TextFamily } {
  const { sizeMm, weight = 400, family = 'sans' } = style;
  if (!Number.isFinite(sizeMm) || sizeMm <= 0) {
    throw new TallyError('number-invalid', `Text size must be a positive number of millimetres, not ${String(sizeMm)}.`);
  }
  if (weight !== 400 && weight !== 700) {
    throw new TallyError('usage', `Text weight ${String(weight)} is not available: use 400 (regular) or 700 (bold).`);
  }
  return { sizeMm, weight, family };
}

export function checkPlacement(options: TextPlacement): CheckedPlacement {
  const { sizeMm, weight, family } = checkStyle(options);
  const { xMm, yMm, anchor = 'start', decimals = 3 } = options;
  if (!Number.isFinite(xMm) || !Number.isFinite(yMm)) {
    throw new TallyError('number-invalid', `Text position must be finite millimetres, not (${String(xMm)}, ${String(yMm)}).`);
  }
  if (anchor !== 'start' && anchor !== 'middle' && anchor !== 'end') {
    throw new TallyError('usage', `Text anchor "${String(anchor)}" is unknown: use start, middle or end.`);
  }
  // More than 6 decimals would make String() switch to exponent notation for tiny values.
  if (!Number.isInteger(decimals) || decimals < 0 || decimals > 6) {
    throw new TallyError('usage', `Path decimals must be a whole number from 0 to 6, not ${String(decimals)}.`);
  }
  return { sizeMm, weight, family, xMm, yMm, anchor, decimals };
}

export function rejectLineBreaks(text: string): void {
  if (/[\r\n\u2028\u2029]/.test(text)) {
    throw new TallyError(
      'usage',
      'This text has a line break but is drawn as a single line; use multi-line text (textLines) for it.',
    );
  }
}
