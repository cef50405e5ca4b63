// Public door of chart layout: layoutChart (spec → scene), the unit chooser and the pieces worth reusing.
export { layoutChart, READING_OF_MODE } from './layoutChart';
export { chooseUnit, assertGlyphBudget, withGlyphBudget, READABLE_MANTISSAS } from './chooseUnit';
export type { ChooseUnitOptions, GlyphBudgetOptions, RoundingError, UnitChoice } from './chooseUnit';
export { resolveGlyphs, type ResolvedGlyph, type ResolvedGlyphs } from './resolveGlyphs';
export { createGlyphBook, mmPerGlyphUnit, type ChartShape, type GlyphBook } from './glyphBook';
export { resolveUnit, exactGlyphs, type GlyphCount, type ResolvedUnit } from './resolveUnit';
export { boxesOverlap, findLabelCollisions, markBoxes, resolveLabelCollisions, type LabelCollision } from './collisions';
export { PALETTE, PALETTE_SOURCE, INK_COLORS, REST_WHITE_SHARE, categoryColor, checkDistinctColors, mixWithWhite, opaqueColor } from './palette';
export { TEXT_SIZE_MM, MIN_TEXT_SIZE_MM, formatValue, formatShare } from './labels';
export { readableFloor, SCALE_LEGEND_CAPTION } from './legend';
export { RULE_WIDTH_MM } from './stackLayout';
export { fillDirection } from './fillLayout';
