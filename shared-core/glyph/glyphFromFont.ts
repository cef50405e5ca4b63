// A glyph from one character of a font (TTF, OTF or WOFF, read by opentype.js): its outline becomes
// SVG markup in font units, y down, in a box of the advance width by ascender-to-descender, then goes
// through the same import as an SVG glyph, so it is measured by ink like any other.
import * as opentypeModule from 'opentype.js';
import type { Font } from 'opentype.js';
import { TallyError } from '../errors';
import { importOwnGlyph, type OwnGlyphImport } from './importOwnGlyph';

// opentype.js ships CommonJS for Node (everything on `default`) and an ES build without a default
// export for bundlers; take whichever this environment loaded.
const opentype: typeof opentypeModule = (opentypeModule as unknown as { default?: typeof opentypeModule }).default ?? opentypeModule;

/** Font files accepted for glyphs: 16 MB, far above any symbol font (common practice, no source). */
export const MAX_FONT_BYTES = 16 * 1024 * 1024;

export interface FontGlyph extends OwnGlyphImport {
  codePoint: number;
  /** The font's own glyph name, when it has one ("uni2713", "heart"). */
  glyphName: string;
  /** "U+2713 ✓ from Noto Sans Symbols 2", for the document's record of where the glyph came from. */
  from: string;
}

/** Reads a font file. Throws TallyError('data-invalid') for anything opentype.js cannot read (WOFF2 included). */
export function readFont(bytes: Uint8Array): Font {
  if (bytes.length === 0) throw new TallyError('data-invalid', 'The font file is empty.');
  if (bytes.length > MAX_FONT_BYTES) throw new TallyError('data-invalid', `The font file is ${(bytes.length / 1e6).toFixed(1)} MB; fonts for glyphs may be at most ${MAX_FONT_BYTES / 1e6} MB.`);
  const tag = String.fromCharCode(...bytes.subarray(0, 4));
  if (tag === 'wOF2') throw new TallyError('data-invalid', 'WOFF2 fonts cannot be read here; use the TTF, OTF or WOFF version of the font.');
  try {
    return opentype.parse(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer);
  } catch (e) {
    throw new TallyError('data-invalid', `The file is not a font this app can read (TTF, OTF or WOFF): ${e instanceof Error ? e.message.slice(0, 200) : String(e)}.`);
  }
}

/** The family name a font gives itself, or a fallback. */
export function fontFamilyName(font: Font, fallback = 'the font'): string {
  // opentype.js 2 keeps names per platform (windows, macintosh, unicode); older builds keep them flat.
  type NameTable = Record<string, Record<string, string> | undefined>;
  const all = font.names as unknown as Record<string, NameTable | Record<string, string> | undefined>;
  const tables: NameTable[] = [all as NameTable, ...['windows', 'macintosh', 'unicode'].map((p) => (all[p] ?? {}) as NameTable)];
  for (const t of tables) {
    const family = t.preferredFamily ?? t.fontFamily;
    const name = family && typeof family === 'object' ? (family.en ?? Object.values(family)[0]) : undefined;
    if (typeof name === 'string' && name.trim()) return name.trim().slice(0, 80);
  }
  return fallback;
}

/**
 * One character: the character itself ("✓"), or a code point written "U+2713" (or "2713" with U+).
 * Returns the code point. Throws TallyError('usage') when it is not exactly one character.
 */
export function parseCharacter(text: string): number {
  const t = text.trim();
  const hex = /^U\+([0-9A-Fa-f]{1,6})$/.exec(t);
  if (hex) {
    const cp = parseInt(hex[1], 16);
    if (cp > 0x10ffff || (cp >= 0xd800 && cp <= 0xdfff)) throw new TallyError('usage', `${t} is not a Unicode character.`);
    return cp;
  }
  const chars = [...t];
  if (chars.length !== 1) throw new TallyError('usage', chars.length === 0 ? 'Type one character, or its code such as U+2713.' : `"${t.slice(0, 12)}" is ${chars.length} characters; choose one, or type its code such as U+2713.`);
  return chars[0].codePointAt(0) as number;
}

export function codePointLabel(cp: number): string {
  return `U+${cp.toString(16).toUpperCase().padStart(4, '0')}`;
}

/** True when the font has its own outline for the character (not the missing-glyph box). */
export function fontHasCharacter(font: Font, codePoint: number): boolean {
  const glyph = font.charToGlyph(String.fromCodePoint(codePoint));
  return glyph.index > 0;
}

/**
 * The raw outline of one character as SVG markup (not yet cleaned or measured): for thumbnails, and
 * the input to glyphFromFont. Throws TallyError when the font lacks the character or it has no outline.
 */
export function characterOutlineSvg(font: Font, codePoint: number, fontLabel = fontFamilyName(font)): { svg: string; glyphName: string } {
  const char = String.fromCodePoint(codePoint);
  const glyph = font.charToGlyph(char);
  if (glyph.index === 0) throw new TallyError('glyph-unknown', `${fontLabel} has no glyph for ${codePointLabel(codePoint)} (${char}).`);
  const upem = font.unitsPerEm;
  const ascender = font.ascender;
  const descender = font.descender;
  // At size = units per em, one path unit is one font unit; the baseline sits at y = ascender (y down).
  // Font contours are closed by definition (TrueType and CFF alike); opentype.js may leave out the
  // final Z, so each contour is closed here rather than reported as an open path.
  const d = glyph
    .getPath(0, ascender, upem)
    .toPathData(2)
    .split(/(?=M)/)
    .map((contour) => contour.trim())
    .filter(Boolean)
    .map((contour) => (/Z$/i.test(contour) ? contour : `${contour}Z`))
    .join('');
  if (!d.trim()) throw new TallyError('glyph-empty', `The ${codePointLabel(codePoint)} (${char}) glyph of ${fontLabel} has no outline (it is a space or a control character).`);
  const width = glyph.advanceWidth && glyph.advanceWidth > 0 ? glyph.advanceWidth : upem;
  const height = ascender - descender;
  return { svg: `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${width} ${height}"><path d="${d}"/></svg>`, glyphName: glyph.name ?? '' };
}

/** The glyph of one character as cleaned, measured SVG. Throws TallyError when the font lacks it or it has no ink. */
export function glyphFromFont(font: Font, codePoint: number, fontLabel = fontFamilyName(font)): FontGlyph {
  const { svg, glyphName } = characterOutlineSvg(font, codePoint, fontLabel);
  const imported = importOwnGlyph(svg);
  return { ...imported, codePoint, glyphName, from: `${codePointLabel(codePoint)} ${String.fromCodePoint(codePoint)} from ${fontLabel}` };
}
