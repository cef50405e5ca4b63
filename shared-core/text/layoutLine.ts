// One line of text as positioned glyphs in font units: GSUB substitutions (ligatures) from
// opentype.js, advances from hmtx, pair kerning from GPOS.

import type { Glyph } from 'opentype.js';
import type { Warning } from '../errors';
import type { FontFace } from './loadFont';

export interface PlacedGlyph {
  glyph: Glyph;
  /** Pen position of the glyph origin, font units from the line start. */
  xUnits: number;
}

export interface LineLayout {
  glyphs: PlacedGlyph[];
  /** Sum of advances and kerning, font units. */
  advanceUnits: number;
  warnings: Warning[];
}

export function layoutLine(face: FontFace, text: string): LineLayout {
  const warnings: Warning[] = [];
  if (text === '') return { glyphs: [], advanceUnits: 0, warnings };

  const missing = missingCharacters(face, text);
  if (missing.length > 0) {
    const list = missing.map((ch) => `"${ch}" (U+${ch.codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0')})`).join(', ');
    warnings.push({
      code: 'text-glyph-missing',
      message: `The bundled font (Noto Sans, Latin) has no glyph for ${list}; each prints as an empty box. Check the text before printing.`,
    });
  }

  const glyphs: Glyph[] = [];
  let fellBack = false;
  for (const run of shapingRuns(text)) {
    try {
      glyphs.push(...face.font.stringToGlyphs(run));
    } catch {
      // A substitution table opentype.js cannot run: fall back to one glyph per character, no ligatures.
      for (const ch of run) glyphs.push(face.font.charToGlyph(ch));
      fellBack = true;
    }
  }
  if (fellBack) warnings.push({ code: 'text-shaping-fallback', message: 'Ligatures could not be applied to this text; it is set letter by letter.' });

  const placed: PlacedGlyph[] = [];
  let xUnits = 0;
  for (let i = 0; i < glyphs.length; i++) {
    const glyph = glyphs[i];
    placed.push({ glyph, xUnits });
    // .notdef keeps its own advance (600 units in Noto Sans), so missing characters still take room.
    xUnits += glyph.advanceWidth ?? 0;
    if (i + 1 < glyphs.length) xUnits += face.kerning(glyph.index, glyphs[i + 1].index);
  }
  return { glyphs: placed, advanceUnits: xUnits, warnings };
}

/**
 * Most UTF-16 units shaped in one call. opentype.js copies the whole context for every position it
 * shapes, so one call costs the square of its length (a 6,000-letter word took 7 s); runs of this
 * size keep shaping linear in the text length.
 */
export const MAX_SHAPING_RUN = 64;

/**
 * A cut between text[i - 1] and text[i] changes no substitution when no ligature can span it and no
 * mark is split from its base: Noto Sans' ligatures (ff, fi, fl, ffi, ffl) all start with "f", and its
 * contextual composition (ccmp) joins a base with the marks after it.
 */
function safeCut(text: string, i: number): boolean {
  const before = text.charCodeAt(i - 1);
  const at = text.charCodeAt(i);
  if (before === 0x66 || before === 0x200d) return false; // "f", zero-width joiner
  if (at >= 0xdc00 && at <= 0xdfff) return false; // inside a surrogate pair
  return !COMBINING.test(text[i]) && at !== 0x200d;
}

const COMBINING = /^[\p{M}\u200c\u200d]/u;

/** The text split into runs of at most MAX_SHAPING_RUN units, cut only where shaping cannot tell (see safeCut). */
export function shapingRuns(text: string): string[] {
  if (text.length <= MAX_SHAPING_RUN) return [text];
  const runs: string[] = [];
  let start = 0;
  while (text.length - start > MAX_SHAPING_RUN) {
    let cut = start + MAX_SHAPING_RUN;
    while (cut > start + 1 && !safeCut(text, cut)) cut--;
    if (cut === start + 1 && !safeCut(text, cut)) {
      // No safe cut in the whole run (a wall of "f"s or of combining marks): cut anyway, off a surrogate pair.
      cut = start + MAX_SHAPING_RUN;
      const at = text.charCodeAt(cut);
      if (at >= 0xdc00 && at <= 0xdfff) cut--;
    }
    runs.push(text.slice(start, cut));
    start = cut;
  }
  runs.push(text.slice(start));
  return runs;
}

function missingCharacters(face: FontFace, text: string): string[] {
  const missing = new Set<string>();
  for (const ch of text) {
    if (face.font.charToGlyphIndex(ch) === 0) missing.add(ch);
  }
  return [...missing];
}
