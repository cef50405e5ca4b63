export { measureGlyph, inkOfShapes, summarise, type GlyphInk, type MeasureOptions } from './measureGlyph';
export { cutInk, cutByWidth, type CutDirection, type InkCut } from './cutInk';
export { collectShapes, shapeToPathData, parseViewBox, type PaintedShape, type CollectedGlyph } from './collectShapes';
export { flattenPathData, newBudget, type Polyline } from './flattenPath';
export { checkChartDetail, checkGlyphDetail, regionPoints, MAX_CHART_POINTS, MAX_GLYPH_POINTS } from './outlineBudget';
export { strokeRegion, type StrokeStyle, type LineCap, type LineJoin } from './strokeOutline';
export { listGlyphs, getGlyph, findGlyphs, closeGlyphNames, GLYPH_SET_INFO, GLYPH_CATEGORIES, GLYPH_INDEX_FORMAT, type GlyphEntry, type GlyphCategory, type GlyphSetInfo } from './catalog';
