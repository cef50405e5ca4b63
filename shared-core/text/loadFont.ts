// The bundled text faces (Noto Sans, and Noto Serif for the serif choice), decoded and parsed once on first use.

import * as opentypeModule from 'opentype.js';
import type { Font } from 'opentype.js';
import { notoSans400Base64 } from '../../assets/fonts/noto-sans-400';
import { notoSans700Base64 } from '../../assets/fonts/noto-sans-700';
import { notoSerif400Base64 } from '../../assets/fonts/noto-serif-400';
import { notoSerif700Base64 } from '../../assets/fonts/noto-serif-700';
import { TallyError } from '../errors';
import { decodeBase64 } from './decodeBase64';
import { readPairKerning, type PairKerning } from './readPairKerning';

// opentype.js ships CommonJS for Node (everything on `default`) and an ES build without a default
// export for bundlers; take whichever this environment loaded.
const opentype: typeof opentypeModule =
  (opentypeModule as unknown as { default?: typeof opentypeModule }).default ?? opentypeModule;

export type FontWeight = 400 | 700;
/** The bundled text families: Noto Sans (default) and Noto Serif, both SIL Open Font License. */
export type TextFamily = 'sans' | 'serif';
/** The family name each bundled face is written under when text is not outlined. */
export const FONT_FAMILY_NAMES: Readonly<Record<TextFamily, string>> = Object.freeze({ sans: 'Noto Sans', serif: 'Noto Serif' });

/** A parsed face with what layout needs beside opentype.js. */
export interface FontFace {
  weight: FontWeight;
  font: Font;
  /** GPOS pair kerning in font units; opentype.js misses most of Noto Sans' kerning. */
  kerning: PairKerning;
  unitsPerEm: number;
  /** Vertical metrics in font units, y up (descender is negative). */
  ascenderUnits: number;
  descenderUnits: number;
  lineGapUnits: number;
  capHeightUnits: number;
}

const faceBase64: Record<TextFamily, Record<FontWeight, string>> = {
  sans: { 400: notoSans400Base64, 700: notoSans700Base64 },
  serif: { 400: notoSerif400Base64, 700: notoSerif700Base64 },
};
const faces = new Map<string, FontFace>();

/** The opentype.js font for a weight of the bundled Noto Sans (latin subset). */
export function loadFont(weight: FontWeight, family: TextFamily = 'sans'): Font {
  return loadFontFace(weight, family).font;
}

export function loadFontFace(weight: FontWeight, family: TextFamily = 'sans'): FontFace {
  const key = `${family}-${weight}`;
  const cached = faces.get(key);
  if (cached) return cached;
  if (weight !== 400 && weight !== 700) {
    throw new TallyError('usage', `Text weight ${String(weight)} is not available: use 400 (regular) or 700 (bold).`);
  }
  if (family !== 'sans' && family !== 'serif') {
    throw new TallyError('usage', `Text font "${String(family)}" is not bundled: use sans or serif.`);
  }
  const sfnt = decodeBase64(faceBase64[family][weight]);
  const font = opentype.parse(sfnt.buffer);
  const face: FontFace = { weight, font, kerning: readPairKerning(sfnt), unitsPerEm: font.unitsPerEm, ...verticalMetrics(font) };
  faces.set(key, face);
  return face;
}

interface VerticalMetrics {
  ascenderUnits: number;
  descenderUnits: number;
  lineGapUnits: number;
  capHeightUnits: number;
}

/**
 * OpenType spec, OS/2 fsSelection bit 7 (USE_TYPO_METRICS): when set, the sTypo values are the
 * font's intended ascent, descent and line gap; otherwise fall back to hhea as most renderers do.
 */
function verticalMetrics(font: Font): VerticalMetrics {
  const os2 = font.tables.os2 as Record<string, number> | undefined;
  const hhea = font.tables.hhea as Record<string, number> | undefined;
  const useTypo = os2 !== undefined && (os2.fsSelection & 0x80) !== 0;
  const ascenderUnits = useTypo ? os2.sTypoAscender : (hhea?.ascender ?? font.ascender);
  const descenderUnits = useTypo ? os2.sTypoDescender : (hhea?.descender ?? font.descender);
  const lineGapUnits = useTypo ? os2.sTypoLineGap : (hhea?.lineGap ?? 0);
  // sCapHeight exists from OS/2 version 2; without it, the height of 'H' is the usual stand-in.
  const capHeightUnits = os2?.sCapHeight || (font.charToGlyph('H').getBoundingBox().y2 ?? 0);
  return { ascenderUnits, descenderUnits, lineGapUnits, capHeightUnits };
}
