// Text as filled outlines from the bundled Noto Sans, in page millimetres.
export { loadFont, FONT_FAMILY_NAMES, type FontWeight, type TextFamily } from './loadFont';
export { measureText, type TextMetrics } from './measureText';
export { textOutline, type TextOutline } from './textOutline';
export { breakLines } from './breakLines';
export { textLines, type TextLine, type TextLinesOptions, type TextLinesOutline } from './textLines';
export { ptToMm, mmToPt } from './ptToMm';
export type { RectMm, TextAnchor, TextPlacement, TextStyle } from './textOptions';
