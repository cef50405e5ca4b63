// Legends: one key glyph at exactly the chart's unit size with "one glyph = N units", or for
// scale charts nested reference glyphs whose ink follows the same k as the marks.
import type { SceneLegendKey, SceneText } from '../scene';
import { READABLE_MANTISSAS } from './chooseUnit';
import { MIN_GLYPH_MM } from './fitSize';
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

/** One column of the scale key: a reference glyph at `value`, its size at the chart's ink per value. */
interface KeyColumn {
  glyph: ResolvedGlyph;
  value: number;
  /** Which grey: the first reference of a glyph, the second... */
  colorIndex: number;
  glyphWidthMm: number;
  glyphHeightMm: number;
  valueText: string;
  /** The wider of the glyph and its value text. */
  cellWidthMm: number;
}

/** Space between key columns, and between wrapped key rows. */
const KEY_COLUMN_GAP_MM = 4;
const KEY_ROW_GAP_MM = 2;
/** Space after the caption before the first column. */
const KEY_CAPTION_GAP_MM = 3;
/** Space between reference glyphs that share one value text (they need no room for text of their own). */
const KEY_SHARED_GAP_MM = 2;

/** One key glyph's place: its centre is box.x + startMm + k · pitchMm + (pitchMm - gapMm) / 2 (one sum, one order). */
interface KeyPlace {
  column: number;
  startMm: number;
  k: number;
  pitchMm: number;
  gapMm: number;
}

/**
 * One value text: centred under glyph k of a piece (one glyph per value), or centred under the piece's n glyphs
 * (several glyphs sharing the value).
 */
interface KeyLabel {
  text: string;
  place: 'glyph' | 'span';
  startMm: number;
  k: number;
  n: number;
  pitchMm: number;
  gapMm: number;
}

interface KeyRow {
  /** Tallest glyph of the row. */
  glyphHeightMm: number;
  keys: KeyPlace[];
  labels: KeyLabel[];
}

/**
 * The scale key's grid, computed from the glyphs' ink alone (no geometry yet), so the layout can ask how
 * tall the key is at any size. Reference amounts: a readable value near a quarter of the largest, and for the
 * first glyph one near a quarter of that (half its height) when it is still tall enough to read as the glyph;
 * each further glyph gets its first reference. With one reference per value the columns share one pitch (the
 * widest cell plus a gap), each value centred under its glyph. With several glyphs at one value (a glyph per
 * row), those glyphs stand side by side on their own, narrower pitch and share one value text per key row, so
 * the repeated text no longer sets the key's width. Rows wrap when the width runs out, each starting under the
 * first column; when not even one column fits beside the caption, the caption takes a line of its own above
 * the grid. `fits` is false when one column is wider than the box, or when several different glyphs are keyed
 * and a reference would be smaller than MIN_GLYPH_MM: the key cannot be drawn at this size.
 */
export interface ScaleKeyPlan {
  columns: KeyColumn[];
  rows: KeyRow[];
  /** Caption on its own line above the grid (else beside the first row). */
  captionAbove: boolean;
  /** Height of the whole key, without the gap above it. */
  heightMm: number;
  /** Widest row, caption included, from the box's left edge. */
  widthMm: number;
  fits: boolean;
  /** False when the key's glyphs are too small to read (several different glyphs at this size). */
  legible: boolean;
}


function keyHeightMm(rows: readonly KeyRow[], captionAbove: boolean, m: ReturnType<typeof lineMetrics>): number {
  const rowsMm = rows.reduce((a, r) => a + r.glyphHeightMm + KEY_TEXT_GAP_MM + m.boxHeightMm, 0) + (rows.length - 1) * KEY_ROW_GAP_MM;
  return rowsMm + (captionAbove ? m.boxHeightMm + KEY_ROW_GAP_MM : 0);
}

export function planScaleKey(glyphs: readonly ResolvedGlyph[], inkMm2PerValue: number, maxValue: number, unitName: string, boxWidthMm: number): ScaleKeyPlan {
  const m = lineMetrics(TEXT_SIZE_MM.legend);
  const first = readableFloor(maxValue / 4);
  const second = readableFloor(first / 4);
  const columns: KeyColumn[] = [];
  const column = (glyph: ResolvedGlyph, value: number, colorIndex: number): KeyColumn => {
    const mmPerUnit = Math.sqrt((inkMm2PerValue * value) / glyph.areaUnits2);
    const valueText = `${formatValue(value)}${unitName ? ` ${unitName}` : ''}`;
    const glyphWidthMm = glyph.bbox.width * mmPerUnit;
    return { glyph, value, colorIndex, glyphWidthMm, glyphHeightMm: glyph.bbox.height * mmPerUnit, valueText, cellWidthMm: Math.max(glyphWidthMm, textWidthMm(valueText, TEXT_SIZE_MM.legend)) };
  };
  const secondOf: KeyColumn[] = [];
  if (first > 0 && inkMm2PerValue > 0) {
    glyphs.forEach((g, gi) => {
      columns.push(column(g, first, 0));
      if (gi === 0 && second > 0 && second < first) {
        const c = column(g, second, 1);
        if (c.glyphHeightMm >= m.capHeightMm + m.descentMm) (glyphs.length > 1 ? secondOf : columns).push(c);
      }
    });
  }
  // Several glyphs: the glyphs of the first value together, the smaller reference after them.
  columns.push(...secondOf);
  if (columns.length === 0) return { columns, rows: [], captionAbove: false, heightMm: 0, widthMm: 0, fits: true, legible: true };
  const captionWMm = textWidthMm(SCALE_LEGEND_CAPTION, TEXT_SIZE_MM.legend);
  const besideXMm = captionWMm + KEY_CAPTION_GAP_MM;
  const shared = glyphs.length > 1;
  const rows: KeyRow[] = [];
  let widthMm = captionWMm;
  let fits: boolean;
  let gridXMm: number;
  if (!shared) {
    // One glyph: every column its own cell on one pitch (the widest cell plus a gap), its value under it.
    const cellMm = Math.max(...columns.map((c) => c.cellWidthMm));
    const pitchMm = cellMm + KEY_COLUMN_GAP_MM;
    const captionAbove = besideXMm + cellMm > boxWidthMm + 1e-9;
    gridXMm = captionAbove ? 0 : besideXMm;
    fits = gridXMm + cellMm <= boxWidthMm + 1e-9 && captionWMm <= boxWidthMm + 1e-9;
    const perRow = Math.max(1, Math.min(columns.length, Math.floor((boxWidthMm - gridXMm + KEY_COLUMN_GAP_MM + 1e-9) / pitchMm)));
    for (let i = 0; i < columns.length; i += perRow) {
      const slice = columns.slice(i, i + perRow);
      rows.push({
        glyphHeightMm: Math.max(...slice.map((c) => c.glyphHeightMm)),
        keys: slice.map((_, k) => ({ column: i + k, startMm: gridXMm, k, pitchMm, gapMm: KEY_COLUMN_GAP_MM })),
        labels: slice.map((c, k) => ({ text: c.valueText, place: 'glyph', startMm: gridXMm, k, n: 1, pitchMm, gapMm: KEY_COLUMN_GAP_MM })),
      });
    }
    widthMm = Math.max(captionWMm, gridXMm + perRow * pitchMm - KEY_COLUMN_GAP_MM);
    const heightMm = keyHeightMm(rows, captionAbove, m);
    return { columns, rows, captionAbove, heightMm, widthMm, fits, legible: true };
  }
  // Several glyphs: runs of columns showing one value, each on the pitch of its own glyphs with one text.
  const runs: { from: number; to: number; pitchMm: number; textMm: number }[] = [];
  for (let i = 0; i < columns.length; ) {
    let j = i;
    while (j < columns.length && columns[j].value === columns[i].value) j++;
    const run = columns.slice(i, j);
    runs.push({ from: i, to: j, pitchMm: Math.max(...run.map((c) => c.glyphWidthMm)) + KEY_SHARED_GAP_MM, textMm: textWidthMm(run[0].valueText, TEXT_SIZE_MM.legend) });
    i = j;
  }
  // The narrowest piece a run can be cut into: one glyph, or its text if wider.
  const needMm = Math.max(...runs.map((r) => Math.max(r.pitchMm - KEY_SHARED_GAP_MM, r.textMm)));
  const captionAbove = besideXMm + needMm > boxWidthMm + 1e-9;
  gridXMm = captionAbove ? 0 : besideXMm;
  fits = gridXMm + needMm <= boxWidthMm + 1e-9 && captionWMm <= boxWidthMm + 1e-9;
  const legible = columns.every((c) => c.colorIndex > 0 || Math.max(c.glyphWidthMm, c.glyphHeightMm) >= MIN_GLYPH_MM - 1e-9);
  let row: KeyRow = { glyphHeightMm: 0, keys: [], labels: [] };
  let xMm = gridXMm;
  const newRow = () => {
    rows.push(row);
    row = { glyphHeightMm: 0, keys: [], labels: [] };
    xMm = gridXMm;
  };
  const gapMm = KEY_SHARED_GAP_MM;
  for (const run of runs) {
    let next = run.from;
    while (fits && next < run.to) {
      const roomMm = boxWidthMm - xMm;
      let n = Math.min(run.to - next, Math.floor((roomMm + gapMm + 1e-9) / run.pitchMm));
      if (n >= 1 && Math.max(n * run.pitchMm - gapMm, run.textMm) > roomMm + 1e-9) n = 0;
      if (n < 1) {
        if (xMm === gridXMm) fits = false;
        else newRow();
        continue;
      }
      const spanMm = n * run.pitchMm - gapMm;
      // The piece is as wide as its glyphs or its text; the glyphs stand centred in it, the text centred under them.
      const pieceMm = Math.max(spanMm, run.textMm);
      const glyphsXMm = xMm + (pieceMm - spanMm) / 2;
      for (let k = 0; k < n; k++) {
        row.keys.push({ column: next + k, startMm: glyphsXMm, k, pitchMm: run.pitchMm, gapMm });
        row.glyphHeightMm = Math.max(row.glyphHeightMm, columns[next + k].glyphHeightMm);
      }
      row.labels.push({ text: columns[next].valueText, place: 'span', startMm: glyphsXMm, k: 0, n, pitchMm: run.pitchMm, gapMm });
      widthMm = Math.max(widthMm, xMm + pieceMm);
      xMm += pieceMm + KEY_COLUMN_GAP_MM;
      next += n;
      if (next < run.to) newRow();
    }
  }
  if (row.keys.length > 0) rows.push(row);
  const heightMm = keyHeightMm(rows, captionAbove, m);
  return { columns, rows, captionAbove, heightMm, widthMm, fits, legible };
}

/**
 * Height the scale legend adds below the marks, gap included; Infinity when the key cannot fit the width
 * at this size (so the layout tries a smaller one, and refuses when none is legible).
 */
export function scaleLegendHeightMm(glyphs: ResolvedGlyph | readonly ResolvedGlyph[], inkMm2PerValue: number, maxValue: number, unitName = '', boxWidthMm = Infinity): number {
  const list = Array.isArray(glyphs) ? (glyphs as readonly ResolvedGlyph[]) : [glyphs as ResolvedGlyph];
  const plan = planScaleKey(list, inkMm2PerValue, maxValue, unitName, boxWidthMm);
  if (plan.columns.length === 0) return 0;
  return plan.fits && plan.legible ? LEGEND_GAP_MM + plan.heightMm : Infinity;
}

/**
 * The scale key as a grid: the caption in the first column (or above, on a narrow page), then one column per
 * reference glyph on one pitch, wrapping onto further rows under the first column; in each row the glyphs stand
 * on one baseline with each value centred under its glyph on one text line (the caption's, in the first row).
 * Every distinct glyph drawn gets its column, each at the chart's one ink per value, so a row drawn with its own
 * glyph is keyed too.
 */
export function placeScaleLegend(book: GlyphBook, glyphs: ResolvedGlyph | readonly ResolvedGlyph[], inkMm2PerValue: number, maxValue: number, unitName: string, box: BoxMm, topMm: number): LegendPart {
  const list = Array.isArray(glyphs) ? (glyphs as readonly ResolvedGlyph[]) : [glyphs as ResolvedGlyph];
  const plan = planScaleKey(list, inkMm2PerValue, maxValue, unitName, box.width);
  if (plan.columns.length === 0) return { texts: [], legendKeys: [], bottomMm: topMm };
  const m = lineMetrics(TEXT_SIZE_MM.legend);
  const texts: SceneText[] = [];
  const legendKeys: SceneLegendKey[] = [];
  let rowTopMm = topMm;
  if (plan.captionAbove) {
    texts.push(makeText({ role: 'legend', text: SCALE_LEGEND_CAPTION, xMm: box.x, yMm: topMm + m.ascentMm, sizeMm: TEXT_SIZE_MM.legend, color: INK_COLORS.muted }));
    rowTopMm += m.boxHeightMm + KEY_ROW_GAP_MM;
  }
  let bottomMm = rowTopMm;
  plan.rows.forEach((row, r) => {
    const glyphBaseMm = rowTopMm + row.glyphHeightMm;
    const textBaselineMm = glyphBaseMm + KEY_TEXT_GAP_MM + m.ascentMm;
    if (r === 0 && !plan.captionAbove) {
      texts.push(makeText({ role: 'legend', text: SCALE_LEGEND_CAPTION, xMm: box.x, yMm: textBaselineMm, sizeMm: TEXT_SIZE_MM.legend, color: INK_COLORS.muted }));
    }
    for (const place of row.keys) {
      const c = plan.columns[place.column];
      const centreXMm = box.x + place.startMm + place.k * place.pitchMm + (place.pitchMm - place.gapMm) / 2;
      const shape = book.shape(c.glyph, inkMm2PerValue * c.value);
      legendKeys.push({ glyph: c.glyph.name, region: book.full(shape, centreXMm - shape.widthMm / 2, glyphBaseMm - shape.heightMm).region, color: INK_COLORS.referenceKeys[c.colorIndex + 1] ?? INK_COLORS.key, unitValue: c.value, unitName });
    }
    for (const label of row.labels) {
      const text = { role: 'legend' as const, text: label.text, yMm: textBaselineMm, sizeMm: TEXT_SIZE_MM.legend, color: INK_COLORS.muted };
      if (label.place === 'glyph') texts.push(makeText({ ...text, xMm: box.x + label.startMm + label.k * label.pitchMm + (label.pitchMm - label.gapMm) / 2, anchor: 'middle' }));
      else texts.push(makeText({ ...text, xMm: box.x + label.startMm + (label.n * label.pitchMm - label.gapMm) / 2, anchor: 'middle' }));
    }
    bottomMm = glyphBaseMm + KEY_TEXT_GAP_MM + m.boxHeightMm;
    rowTopMm = bottomMm + KEY_ROW_GAP_MM;
  });
  return { texts, legendKeys, bottomMm };
}
