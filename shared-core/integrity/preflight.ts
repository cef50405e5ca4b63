// Print checks before export. These are printers' common practice, not standards: each finding
// says so, and none of them stops an export.

import { TallyError } from '../errors';

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

export const PREFLIGHT_DEFAULTS: Readonly<Required<PreflightOptions>> = Object.freeze({ minStrokePt: 0.25, minTextPt: 6 });

// Geometry in millimetres comes out of float arithmetic; a nanometre is far below anything printable.
const EDGE_SLACK_MM = 1e-6;

function finite(value: number, what: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new TallyError('number-invalid', `Preflight needs a finite number for ${what} (got ${String(value)}).`);
  }
  return value;
}

function mm(value: number): string {
  return String(Number(value.toFixed(2)));
}

function pt(value: number): string {
  return String(Number(value.toPrecision(3)));
}

/** Smallest value per owner, so 2,000 thin glyph strokes make one finding, not 2,000. */
function thinnestByOwner<T>(items: readonly T[], size: (item: T) => number, owner: (item: T) => string): Map<string, { size: number; count: number }> {
  const out = new Map<string, { size: number; count: number }>();
  for (const item of items) {
    const key = owner(item);
    const seen = out.get(key);
    if (!seen) out.set(key, { size: size(item), count: 1 });
    else {
      seen.size = Math.min(seen.size, size(item));
      seen.count += 1;
    }
  }
  return out;
}

function plural(count: number, word: string): string {
  return `${count} ${word}${count === 1 ? '' : 's'}`;
}

export function preflight(input: PreflightInput, opts: PreflightOptions = {}): Finding[] {
  const { minStrokePt, minTextPt } = { ...PREFLIGHT_DEFAULTS, ...opts };
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

  const findings: Finding[] = [];
  const add = (code: PreflightCode, message: string, owner?: string): void => {
    const finding: Finding = { code, message, severity: 'warning', basis: 'common practice' };
    if (owner !== undefined) finding.owner = owner;
    findings.push(finding);
  };

  // A zero width paints no stroke at all in SVG ("A zero value causes no stroke to be painted",
  // SVG 2, stroke-width), so it is not a hairline.
  const thinStrokes = thinnestByOwner(
    input.strokes.filter((s) => s.widthPt > 0 && s.widthPt < minStrokePt),
    (s) => s.widthPt,
    (s) => s.owner,
  );
  for (const [owner, { size, count }] of thinStrokes) {
    add(
      'stroke-thin',
      `${owner}: ${plural(count, 'line')} as thin as ${pt(size)} pt; lines under about ${pt(minStrokePt)} pt may break up or vanish in print (common practice).`,
      owner,
    );
  }

  const smallTexts = thinnestByOwner(
    input.texts.filter((t) => t.sizePt > 0 && t.sizePt < minTextPt),
    (t) => t.sizePt,
    (t) => t.owner,
  );
  for (const [owner, { size, count }] of smallTexts) {
    add(
      'text-small',
      `${owner}: ${plural(count, 'text')} as small as ${pt(size)} pt; text under about ${pt(minTextPt)} pt is hard to read in print (common practice).`,
      owner,
    );
  }

  const left = box.x;
  const top = box.y;
  const right = box.x + box.width;
  const bottom = box.y + box.height;
  const outsidePage = left < -EDGE_SLACK_MM || top < -EDGE_SLACK_MM || right > widthMm + EDGE_SLACK_MM || bottom > heightMm + EDGE_SLACK_MM;
  if (outsidePage) {
    add(
      'content-outside-page',
      `Content reaches beyond the page (content ${mm(left)}–${mm(right)} x ${mm(top)}–${mm(bottom)} mm on a ${mm(widthMm)} x ${mm(heightMm)} mm page); whatever lies outside is cut off when trimmed.`,
    );
  } else {
    const outsideSafe =
      left < safeMm - EDGE_SLACK_MM ||
      top < safeMm - EDGE_SLACK_MM ||
      right > widthMm - safeMm + EDGE_SLACK_MM ||
      bottom > heightMm - safeMm + EDGE_SLACK_MM;
    if (outsideSafe) {
      add(
        'content-outside-safe-area',
        `Content comes closer than ${mm(safeMm)} mm to the trim edge; trimming can be off by a millimetre or two, so keep labels and marks inside the safe area (common practice).`,
      );
    }
  }

  for (const f of sliverFindings(input.partials ?? [])) findings.push(f);

  if (bleedMm > 0 && !input.backgroundCoversBleed) {
    add(
      'bleed-unused',
      `A ${mm(bleedMm)} mm bleed was asked for but nothing reaches into it; extend the background to the bleed edge, or drop the bleed.`,
    );
  }

  return findings;
}

/** A partial glyph holding less than this share of a glyph's ink reads as a dash, not as the glyph (common practice, no source). */
export const SLIVER_SHARE = 0.1;

/**
 * Slivers: partial glyphs so small a reader sees a 1-2 mm dash rather than a piece of the glyph. The cut stays
 * ink-true (the share is right); the finding names the category and its share so the designer can pick another unit.
 */
export function sliverFindings(partials: readonly PartialGlyph[]): Finding[] {
  const out: Finding[] = [];
  for (const p of partials) {
    // A share of 0.1 computed as 0.0999999999 (4.1 - 4 in binary floating point) is a tenth, not a sliver.
    if (!(p.share > 0) || p.share >= SLIVER_SHARE - 1e-9) continue;
    const pct = String(Number((p.share * 100).toPrecision(2)));
    out.push({
      code: 'sliver',
      message: `${p.owner}: the last glyph holds only ${pct}% of a glyph's ink, a ${mm(p.shortSideMm)} mm sliver that may not read as the glyph (common practice).`,
      severity: 'warning',
      basis: 'common practice',
      owner: p.owner,
    });
  }
  return out;
}
