// Greedy line breaking in time linear in the text: every word is shaped once, and a line's width grows
// by the kerning at the joins plus a space, instead of re-measuring the whole line for every word.
import { layoutLine } from './layoutLine';
import { loadFontFace } from './loadFont';
import { checkStyle, type TextStyle } from './textOptions';

/**
 * Breaks text into lines no wider than maxWidthMm where it has blanks (runs of blanks become one space);
 * a word wider than the width keeps a line of its own. Explicit line breaks (CR LF, LF, CR, U+2028,
 * U+2029) are kept. Widths are exact: no substitution spans a space, so a line's glyphs are its words'
 * glyphs with a space between them, and advances and kerning are whole font units.
 */
export function breakLines(text: string, maxWidthMm: number, style: TextStyle): string[] {
  const { sizeMm, weight, family } = checkStyle(style);
  const face = loadFontFace(weight, family);
  const space = layoutLine(face, ' ').glyphs[0].glyph;
  const spaceAdvance = space.advanceWidth ?? 0;
  const widthMm = (units: number) => (units * sizeMm) / face.unitsPerEm;
  const lines: string[] = [];
  for (const paragraph of text.split(/\r\n|[\r\n\u2028\u2029]/)) {
    let line = '';
    let lineUnits = 0;
    let lastGlyph = 0;
    for (const word of paragraph.split(/\s+/)) {
      if (word === '') continue;
      const laid = layoutLine(face, word);
      const first = laid.glyphs[0].glyph.index;
      const last = laid.glyphs[laid.glyphs.length - 1].glyph.index;
      if (line === '') {
        line = word;
        lineUnits = laid.advanceUnits;
      } else {
        const joined = lineUnits + face.kerning(lastGlyph, space.index) + spaceAdvance + face.kerning(space.index, first) + laid.advanceUnits;
        if (widthMm(joined) > maxWidthMm) {
          lines.push(line);
          line = word;
          lineUnits = laid.advanceUnits;
        } else {
          line = `${line} ${word}`;
          lineUnits = joined;
        }
      }
      lastGlyph = last;
    }
    if (line) lines.push(line);
  }
  return lines;
}
