// Legends: one key glyph at exactly the chart's unit size with "one glyph = N units", or for
// scale charts nested reference glyphs whose ink follows the same k as the marks.
import type { SceneLegendKey, SceneText } from '../scene';
import { READABLE_MANTISSAS } from './chooseUnit';
import type { ChartShape, GlyphBook } from './glyphBook';
import { formatValue, lineMetrics, makeText, textWidthMm, TEXT_SIZE_MM } from './labels';
import type { BoxMm } from './layoutContext';
import { INK_COLORS } from './palette';
import type { ResolvedGlyph } from './resolveGlyphs';

/** Space between the marks (or their labels) and the legend row. */
export const LEGEND_GAP_MM = 4;
const KEY_TEXT_GAP_MM = 2;
const KEY_GLYPH_GAP_MM = 1.5;

export interface LegendPart {
  texts: SceneText[];
  legendKeys: SceneLegendKey[];
  /** Bottom of the legend row. */
  bottomMm: number;
}

/** Height the unit legend adds below the marks, gap included. */
export function unitLegendHeightMm(keyHeightMm: number): number {
  return LEGEND_GAP_MM + Math.max(keyHeightMm, lineMetrics(TEXT_SIZE_MM.legend).boxHeightMm);
}

export function unitLegendText(unit: number, unitName: string, prefix = 'one glyph =', wording?: string): string {
  const name = unit === 1 ? singularOf(unitName) : unitName;
  if (wording !== undefined) return keyWordingText(wording, formatValue(unit), name);
  return `${prefix} ${formatValue(unit)}${name ? ` ${name}` : ''}`;
}

/**
 * The designer's key wording with {amount} and {unit} filled in from the chart, so the amount stated is always
 * the unit the glyphs are drawn at. Blanks left by an empty unit name are closed up.
 */
export function keyWordingText(wording: string, amount: string, unitName: string): string {
  const filled = wording.split('{amount}').join(amount).split('{unit}').join(unitName);
  return filled.replace(/\s+/g, ' ').replace(/\s+([,.:;)])/g, '$1').trim();
}

/**
 * "1 commuter", not "1 commuters": English plural nouns as unit names are the common case, so the
 * usual regular endings are undone for a unit of exactly one. Irregular plurals (people, children)
 * and anything unrecognised are kept as written.
 */
export function singularOf(unitName: string): string {
  const words = unitName.trimEnd().split(' ');
  const last = words[words.length - 1] ?? '';
  let one = last;
  if (/[^aeiou]ies$/i.test(last)) one = last.slice(0, -3) + (last.endsWith('IES') ? 'Y' : 'y');
  else if (/(ss|sh|ch|x|z|us)es$/i.test(last)) one = last.slice(0, -2);
  else if (/[^su]s$/i.test(last) && last.length > 3) one = last.slice(0, -1);
  words[words.length - 1] = one;
  return words.join(' ');
}

/**
 * Key glyphs (full glyphs at the chart's unit ink, one per distinct glyph drawn, so a row drawn with its own
 * glyph is keyed too) and the sentence, in a row starting at topMm; glyphs and sentence share one centre line.
 */
export function placeUnitLegend(book: GlyphBook, shapes: ChartShape | readonly ChartShape[], box: BoxMm, topMm: number, text: string, unitValue: number, unitName: string): LegendPart {
  const list = Array.isArray(shapes) ? (shapes as readonly ChartShape[]) : [shapes as ChartShape];
  const m = lineMetrics(TEXT_SIZE_MM.legend);
  const rowHeightMm = Math.max(...list.map((s) => s.heightMm), m.boxHeightMm);
  const legendKeys: SceneLegendKey[] = [];
  let x = box.x;
  list.forEach((shape, i) => {
    const keyYMm = topMm + (rowHeightMm - shape.heightMm) / 2;
    legendKeys.push({ glyph: shape.glyph.name, region: book.full(shape, x, keyYMm).region, color: INK_COLORS.key, unitValue, unitName });
    x += shape.widthMm + (i < list.length - 1 ? KEY_GLYPH_GAP_MM : 0);
  });
  const label = makeText({
    role: 'legend',
    text,
    xMm: x + KEY_TEXT_GAP_MM,
    yMm: topMm + rowHeightMm / 2 + m.capHeightMm / 2,
    sizeMm: TEXT_SIZE_MM.legend,
    color: INK_COLORS.muted,
  });
  return { texts: [label], legendKeys, bottomMm: topMm + rowHeightMm };
}

/** Largest readable amount (1, 2, 2.5 or 5 x 10^k) not above x. */
export function readableFloor(x: number): number {
  if (!(x > 0) || !Number.isFinite(x)) return 0;
  let k = Math.floor(Math.log10(x));
  for (let tries = 0; tries < 3; tries++, k--) {
    for (let i = READABLE_MANTISSAS.length - 1; i >= 0; i--) {
      const v = k >= 0 ? READABLE_MANTISSAS[i] * 10 ** k : READABLE_MANTISSAS[i] / 10 ** -k;
      if (v <= x * (1 + 1e-12)) return v;
    }
  }
  return x;
}

export const SCALE_LEGEND_CAPTION = 'Glyph area shows the value:';

interface Reference {
  value: number;
  shape: ChartShape;
}

/**
 * Reference amounts for a scale legend: a readable value near a quarter of the largest, and one near a
 * quarter of that (half its height) when it is still tall enough to read as the glyph.
 */
function references(book: GlyphBook, glyph: ResolvedGlyph, inkMm2PerValue: number, maxValue: number): Reference[] {
  const first = readableFloor(maxValue / 4);
  if (!(first > 0)) return [];
  const refs: Reference[] = [{ value: first, shape: book.shape(glyph, inkMm2PerValue * first) }];
  const second = readableFloor(first / 4);
  const m = lineMetrics(TEXT_SIZE_MM.legend);
  if (second > 0 && second < first) {
    const shape = book.shape(glyph, inkMm2PerValue * second);
    if (shape.heightMm >= m.capHeightMm + m.descentMm) refs.push({ value: second, shape });
  }
  return refs;
}

/**
 * Height the scale legend adds below the marks, gap included: the reference glyphs over one line of their
 * values; with several glyphs drawn, the tallest first reference sets the row.
 */
export function scaleLegendHeightMm(glyphs: ResolvedGlyph | readonly ResolvedGlyph[], inkMm2PerValue: number, maxValue: number): number {
  const list = Array.isArray(glyphs) ? (glyphs as readonly ResolvedGlyph[]) : [glyphs as ResolvedGlyph];
  const first = readableFloor(maxValue / 4);
  if (!(first > 0) || list.length === 0) return 0;
  const heightMm = Math.max(...list.map((g) => g.bbox.height * Math.sqrt((inkMm2PerValue * first) / g.areaUnits2)));
  return LEGEND_GAP_MM + heightMm + KEY_TEXT_GAP_MM + lineMetrics(TEXT_SIZE_MM.legend).boxHeightMm;
}

/**
 * The scale key as a grid: the caption in the first column, then one column per reference glyph, the glyphs
 * standing on one baseline and each value centred under its glyph on the caption's text line. Every distinct
 * glyph drawn gets its columns (the first glyph both references, each further glyph the first), each at the
 * chart's one ink per value, so a row drawn with its own glyph is keyed too.
 */
export function placeScaleLegend(book: GlyphBook, glyphs: ResolvedGlyph | readonly ResolvedGlyph[], inkMm2PerValue: number, maxValue: number, unitName: string, box: BoxMm, topMm: number): LegendPart {
  const list = Array.isArray(glyphs) ? (glyphs as readonly ResolvedGlyph[]) : [glyphs as ResolvedGlyph];
  const columns = list.flatMap((g, gi) => {
    const refs = references(book, g, inkMm2PerValue, maxValue);
    return (gi === 0 ? refs : refs.slice(0, 1)).map((ref, i) => ({ glyph: g, ref, colorIndex: i }));
  });
  if (columns.length === 0) return { texts: [], legendKeys: [], bottomMm: topMm };
  const m = lineMetrics(TEXT_SIZE_MM.legend);
  const glyphBaseMm = topMm + Math.max(...columns.map((c) => c.ref.shape.heightMm));
  const textBaselineMm = glyphBaseMm + KEY_TEXT_GAP_MM + m.ascentMm;
  const bottomMm = glyphBaseMm + KEY_TEXT_GAP_MM + m.boxHeightMm;
  const texts: SceneText[] = [makeText({ role: 'legend', text: SCALE_LEGEND_CAPTION, xMm: box.x, yMm: textBaselineMm, sizeMm: TEXT_SIZE_MM.legend, color: INK_COLORS.muted })];
  const legendKeys: SceneLegendKey[] = [];
  let columnXMm = box.x + textWidthMm(SCALE_LEGEND_CAPTION, TEXT_SIZE_MM.legend) + 3;
  columns.forEach(({ glyph, ref, colorIndex }) => {
    const valueText = `${formatValue(ref.value)}${unitName ? ` ${unitName}` : ''}`;
    const columnWMm = Math.max(ref.shape.widthMm, textWidthMm(valueText, TEXT_SIZE_MM.legend));
    const centreXMm = columnXMm + columnWMm / 2;
    legendKeys.push({ glyph: glyph.name, region: book.full(ref.shape, centreXMm - ref.shape.widthMm / 2, glyphBaseMm - ref.shape.heightMm).region, color: INK_COLORS.referenceKeys[colorIndex + 1] ?? INK_COLORS.key, unitValue: ref.value, unitName });
    texts.push(makeText({ role: 'legend', text: valueText, xMm: centreXMm, yMm: textBaselineMm, sizeMm: TEXT_SIZE_MM.legend, anchor: 'middle', color: INK_COLORS.muted }));
    columnXMm += columnWMm + 4;
  });
  return { texts, legendKeys, bottomMm };
}
