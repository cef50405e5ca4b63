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

  let glyphs: Glyph[];
  try {
    glyphs = face.font.stringToGlyphs(text);
  } catch {
    // A substitution table opentype.js cannot run: fall back to one glyph per character, no ligatures.
    glyphs = Array.from(text, (ch) => face.font.charToGlyph(ch));
    warnings.push({ code: 'text-shaping-fallback', message: 'Ligatures could not be applied to this text; it is set letter by letter.' });
  }

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

function missingCharacters(face: FontFace, text: string): string[] {
  const missing = new Set<string>();
  for (const ch of text) {
    if (face.font.charToGlyphIndex(ch) === 0) missing.add(ch);
  }
  return [...missing];
}
