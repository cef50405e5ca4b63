import type { Warning } from '../errors';
import { layoutLine } from './layoutLine';
import { loadFontFace, type FontFace } from './loadFont';
import { checkStyle, rejectLineBreaks, type TextStyle } from './textOptions';

export interface TextMetrics {
  /** Advance width of the line with kerning (where the next text would start), not the ink width. */
  widthMm: number;
  /** Font ascent above the baseline and descent below it (both positive), from the font's metrics. */
  ascentMm: number;
  descentMm: number;
  /** Height of flat capitals such as H above the baseline. */
  capHeightMm: number;
  /** The font's default baseline-to-baseline distance: ascent + descent + line gap. */
  lineHeightMm: number;
  warnings: Warning[];
}

/** Measures one line of text. Line breaks are refused; measure each line on its own. */
export function measureText(text: string, style: TextStyle): TextMetrics {
  const { sizeMm, weight, family } = checkStyle(style);
  rejectLineBreaks(text);
  const face = loadFontFace(weight, family);
  const line = layoutLine(face, text);
  return { widthMm: (line.advanceUnits * sizeMm) / face.unitsPerEm, ...verticalMetricsMm(face, sizeMm), warnings: line.warnings };
}

export function verticalMetricsMm(face: FontFace, sizeMm: number) {
  const mmPerUnit = sizeMm / face.unitsPerEm;
  return {
    ascentMm: face.ascenderUnits * mmPerUnit,
    descentMm: -face.descenderUnits * mmPerUnit,
    capHeightMm: face.capHeightUnits * mmPerUnit,
    lineHeightMm: (face.ascenderUnits - face.descenderUnits + face.lineGapUnits) * mmPerUnit,
  };
}
