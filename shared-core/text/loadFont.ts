// The bundled Noto Sans faces, decoded and parsed once on first use.

import * as opentypeModule from 'opentype.js';
import type { Font } from 'opentype.js';
import { notoSans400Base64 } from '../../assets/fonts/noto-sans-400';
import { notoSans700Base64 } from '../../assets/fonts/noto-sans-700';
import { TallyError } from '../errors';
import { decodeBase64 } from './decodeBase64';
import { readPairKerning, type PairKerning } from './readPairKerning';

// opentype.js ships CommonJS for Node (everything on `default`) and an ES build without a default
// export for bundlers; take whichever this environment loaded.
const opentype: typeof opentypeModule =
  (opentypeModule as unknown as { default?: typeof opentypeModule }).default ?? opentypeModule;

export type FontWeight = 400 | 700;

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

const faceBase64: Record<FontWeight, string> = { 400: notoSans400Base64, 700: notoSans700Base64 };
const faces = new Map<FontWeight, FontFace>();

/** The opentype.js font for a weight of the bundled Noto Sans (latin subset). */
export function loadFont(weight: FontWeight): Font {
  return loadFontFace(weight).font;
}

export function loadFontFace(weight: FontWeight): FontFace {
  const cached = faces.get(weight);
  if (cached) return cached;
  if (weight !== 400 && weight !== 700) {
    throw new TallyError('usage', `Text weight ${String(weight)} is not available: use 400 (regular) or 700 (bold).`);
  }
  const sfnt = decodeBase64(faceBase64[weight]);
  const font = opentype.parse(sfnt.buffer);
  const face: FontFace = { weight, font, kerning: readPairKerning(sfnt), unitsPerEm: font.unitsPerEm, ...verticalMetrics(font) };
  faces.set(weight, face);
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
