// What the checks of a written file share: the finding they build, number formatting for their sentences,
// and the tolerance by which two copies of one glyph count as the same size.
import type { IntegrityFinding } from '../check';
import type { PieceInk } from '../measureFile';

/** Glyphs meant to be one and the same must agree this closely in ink (1%, far above measuring noise of ~1e-4; common practice, no source). */
export const SAME_GLYPH_TOLERANCE = 0.01;

/** The one fix for a file whose own records disagree with its marks: only a hand edit (or a broken writer) does that. */
export const REEXPORT_FIX = 'Export the chart again from its document; a file edited by hand no longer matches its data.';

/** A finding that stops the export, about the data row `category` when there is one. */
export function blockingFinding(code: string, message: string, fix: string, category?: string): IntegrityFinding {
  const finding: IntegrityFinding = { code, severity: 'blocking', message, fix };
  if (category !== undefined) finding.category = category;
  return finding;
}

/** A number for a sentence: integers as they are, others to four significant digits. */
export function num(n: number): string {
  if (!Number.isFinite(n)) return String(n);
  if (Number.isInteger(n)) return String(n);
  return String(Number(n.toPrecision(4)));
}

export function relDiff(a: number, b: number): number {
  return Math.abs(a / b - 1);
}

export function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 ? s[mid] : (s[mid - 1] + s[mid]) / 2;
}

/** A mark's full glyphs that carry ink. */
export function fullsOf(mi: { pieces: PieceInk[] }): PieceInk[] {
  return mi.pieces.filter((p) => p.piece.part === 'full' && p.ink.areaMm2 > 0);
}
