// Print checks before export. These are printers' common practice, not standards: each finding
// says so, and none of them stops an export. This file holds what they read and the one call that runs them
// on a page's facts; verification runs the same checks on a written file.

import { TallyError } from '../errors';
import { bleedUnused } from './checks/bleedUnused';
import { contentOutsidePage } from './checks/contentOutsidePage';
import { contentOutsideSafeArea } from './checks/contentOutsideSafeArea';
import { PREFLIGHT_DEFAULTS, type PreflightCheck } from './checks/preflightShared';
import { sliver } from './checks/sliver';
import { strokeThin } from './checks/strokeThin';
import { textSmall } from './checks/textSmall';

export interface PreflightInput {
  page: { widthMm: number; heightMm: number };
  /** Bleed the designer asked for beyond each trim edge; 0 when none. */
  bleedMm: number;
  /** Distance inside each trim edge that important content should keep clear of. */
  safeMarginMm: number;
  strokes: { widthPt: number; owner: string }[];
  texts: { sizePt: number; owner: string }[];
  /** Bounding box of everything except a background, in page millimetres with the origin at the top-left trim corner. */
  contentBoxMm: { x: number; y: number; width: number; height: number };
  /** True when a background (or other artwork) reaches the bleed edge. */
  backgroundCoversBleed: boolean;
  /** Partial glyphs (remainders cut by ink): whose, the share of a glyph's ink kept, the ink box's shorter side. */
  partials?: PartialGlyph[];
}

export interface PartialGlyph {
  owner: string;
  share: number;
  shortSideMm: number;
}

export type PreflightCode = 'stroke-thin' | 'text-small' | 'content-outside-page' | 'content-outside-safe-area' | 'bleed-unused' | 'sliver';

export interface Finding {
  code: PreflightCode;
  message: string;
  severity: 'warning';
  basis: 'common practice';
  /** Whose marks are concerned, when the finding is about particular marks. */
  owner?: string;
}

export interface PreflightOptions {
  /** Printer guidance: lines below about 0.25 pt may break up or vanish. */
  minStrokePt?: number;
  /** Printer guidance: text below about 6 pt is hard to read (some printers say 8 pt). */
  minTextPt?: number;
}

// The checks themselves live one per file in ./checks, as peers of the other checks of a written file.
export { PREFLIGHT_DEFAULTS } from './checks/preflightShared';
export { SLIVER_SHARE, sliverFindings } from './checks/sliver';

/** The preflight checks in the order their findings are listed. */
export const PREFLIGHT_CHECKS: readonly PreflightCheck[] = Object.freeze([strokeThin, textSmall, contentOutsidePage, contentOutsideSafeArea, sliver, bleedUnused]);

function finite(value: number, what: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new TallyError('number-invalid', `Preflight needs a finite number for ${what} (got ${String(value)}).`);
  }
  return value;
}

/** Throws TallyError('number-invalid') for a page, bleed, margin, box, stroke or text size no check could judge. */
export function validatePreflightInput(input: PreflightInput): void {
  const widthMm = finite(input.page.widthMm, 'the page width');
  const heightMm = finite(input.page.heightMm, 'the page height');
  if (widthMm <= 0 || heightMm <= 0) throw new TallyError('number-invalid', `The page must have a positive size (got ${widthMm} x ${heightMm} mm).`);
  const bleedMm = finite(input.bleedMm, 'the bleed');
  const safeMm = finite(input.safeMarginMm, 'the safe margin');
  if (bleedMm < 0 || safeMm < 0) throw new TallyError('number-invalid', 'Bleed and safe margin cannot be negative.');
  const box = input.contentBoxMm;
  for (const key of ['x', 'y', 'width', 'height'] as const) finite(box[key], `the content box ${key}`);
  input.strokes.forEach((s, i) => finite(s.widthPt, `stroke ${i + 1} width`));
  input.texts.forEach((t, i) => finite(t.sizePt, `text ${i + 1} size`));
}

/** Every preflight finding for a page's facts, in the checks' order. */
export function preflight(input: PreflightInput, opts: PreflightOptions = {}): Finding[] {
  validatePreflightInput(input);
  const options = { ...PREFLIGHT_DEFAULTS, ...opts };
  return PREFLIGHT_CHECKS.flatMap((check) => check.findIn(input, options));
}
