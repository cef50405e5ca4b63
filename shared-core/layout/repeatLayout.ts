// Repeat: each category as a count of equal unit glyphs, either a grid per category (label left,
// value right) or one shared grid for parts of a whole, each category a contiguous run in its colour.
import type { RepeatEncoding } from '../document';
import type { CutDirection } from '../glyph';
import type { SceneGlyph, SceneLegendKey, SceneMark, SceneText } from '../scene';
import { chooseGlyphSize } from './fitSize';
import { isTallyError } from '../errors';
import { labelLines, valueLabelText, lineMetrics, linesHeightMm, linesWidthMm, makeLines, makeText, MIN_TEXT_SIZE_MM, textWidthMm, TEXT_SIZE_MM } from './labels';
import { groupGapMm, groupShiftMm, keyGlyphs, sizePerRootInk, type LayoutContext, type ModeResult } from './layoutContext';
import { LEGEND_GAP_MM, placeUnitLegend, unitLegendHeightMm, unitLegendText } from './legend';
import { INK_COLORS } from './palette';
import { resolveUnit, withFittingUnit, type GlyphCount } from './resolveUnit';
import type { ResolvedGlyph } from './resolveGlyphs';

/** Largest glyph the layout picks by itself (common practice for icon arrays, no source). */
export const REPEAT_MAX_GLYPH_MM = 18;
const LABEL_PAD_MM = 3;
/** Widest a category label may be before it breaks onto more lines, as a share of the chart width. */
const LABEL_SHARE = 0.3;
const VALUE_PAD_MM = 2;
/** Space between a label set above its row and the row's glyphs (common practice, no source). */
const LABEL_ABOVE_GAP_MM = 1;
const EPS_MM = 1e-9;

interface Grid {
  cellWMm: number;
  cellHMm: number;
  gapMm: number;
  inkMm2: number;
  columns: number;
}

/** Columns grouped in fives or tens (layout.groupEvery): 0 for none, and the extra gap after each group. */
interface Grouping {
  every: number;
  groupMm: number;
}

function gridAt(glyphs: readonly ResolvedGlyph[], glyphSizeMm: number, gapRatio: number, every = 0): Omit<Grid, 'columns'> & Grouping {
  const f = sizePerRootInk(glyphs);
  const root = glyphSizeMm / f.largest;
  const gapMm = gapRatio * glyphSizeMm;
  return { cellWMm: root * f.width, cellHMm: root * f.height, gapMm, inkMm2: root * root, every, groupMm: groupGapMm(gapMm, glyphSizeMm) };
}

function autoColumns(widthMm: number, g: { cellWMm: number; gapMm: number } & Partial<Grouping>, most: number): number {
  let columns = Math.max(1, Math.min(Math.max(1, most), Math.floor((widthMm + g.gapMm + EPS_MM) / (g.cellWMm + g.gapMm))));
  const every = g.every ?? 0;
  if (every > 0) {
    // Group gaps take room too; and a row that wraps holds whole groups, so groups line up down the rows.
    while (columns > 1 && gridWidthMm(columns, g) > widthMm + EPS_MM) columns--;
    if (most > columns && columns >= every) columns -= columns % every;
  }
  return columns;
}

function gridWidthMm(columns: number, g: { cellWMm: number; gapMm: number } & Partial<Grouping>): number {
  return columns * g.cellWMm + (columns - 1) * g.gapMm + groupShiftMm(columns - 1, g.every ?? 0, g.groupMm ?? 0);
}

/** Left edge of the cell in reading column `k` from the grid's left, mirrored for right-to-left rows. */
function columnXMm(k: number, columns: number, g: { cellWMm: number; gapMm: number } & Grouping, direction: CutDirection): number {
  const fromStart = k * (g.cellWMm + g.gapMm) + groupShiftMm(k, g.every, g.groupMm);
  return direction === 'rtl' ? gridWidthMm(columns, g) - fromStart - g.cellWMm : fromStart;
}

function cutDirection(direction: string): CutDirection {
  return direction === 'rtl' || direction === 'btt' ? direction : 'ltr';
}

/** Where slot `index` of a run sits in a grid of `columns`, following the reading direction. */
function slotCell(index: number, columns: number, rows: number, direction: CutDirection): { row: number; column: number } {
  let row = Math.floor(index / columns);
  let column = index % columns;
  if (direction === 'rtl') column = columns - 1 - column;
  if (direction === 'btt') row = rows - 1 - row;
  return { row, column };
}

function slotsOf(c: GlyphCount): number {
  return c.full + (c.partial > 0 ? 1 : 0);
}

export function repeatLayout(ctx: LayoutContext): ModeResult {
  const shared = (ctx.spec.encoding as RepeatEncoding).arrangement === 'shared-grid';
  return withFittingUnit(ctx, { maxGlyphsPerCategory: shared ? 100 : 50, sharedGrid: shared }, (opts) => {
    const unit = resolveUnit(ctx.spec, opts);
    ctx.warnings.push(...unit.warnings);
    const result = shared ? sharedGrid(ctx, unit.counts, unit.unit) : perCategory(ctx, unit.counts, unit.unit);
    return { ...result, unitChoice: unit.choice };
  });
}

function legendSentence(ctx: LayoutContext, unit: number): string {
  const text = unitLegendText(unit, ctx.spec.encoding.unitName ?? '', undefined, ctx.spec.layout.keyWording);
  return ctx.spec.encoding.rounding === 'whole' ? `${text} (counts rounded to whole glyphs)` : text;
}

/** Text scales tried, largest first, when the rows do not fit: the smallest keeps labels at the print minimum. */
const TEXT_SCALES = [1, 0.85, MIN_TEXT_SIZE_MM / TEXT_SIZE_MM.label];

function perCategory(ctx: LayoutContext, counts: GlyphCount[], unit: number): ModeResult {
  // Many categories on a short page: smaller label text before giving up, never below the print minimum.
  for (let k = 0; ; k++) {
    const scale = TEXT_SCALES[k];
    try {
      return perCategoryAt(ctx, counts, unit, TEXT_SIZE_MM.label * scale, Math.max(MIN_TEXT_SIZE_MM, TEXT_SIZE_MM.valueLabel * scale));
    } catch (e) {
      if (!(isTallyError(e) && e.code === 'layout-no-room') || k >= TEXT_SCALES.length - 1) throw e;
    }
  }
}

function perCategoryAt(ctx: LayoutContext, counts: GlyphCount[], unit: number, labelSizeMm: number, valueSizeMm: number): ModeResult {
  const { spec, box, rows, book } = ctx;
  const { layout } = spec;
  const direction = cutDirection(layout.direction);
  const lm = lineMetrics(labelSizeMm);
  const vm = lineMetrics(valueSizeMm);
  const valueTexts = rows.map((r) => valueLabelText(r.value, layout));
  // Labels beside their rows (the default) take a column; labels above their rows take a line over each row.
  const above = layout.labels && layout.labelPosition === 'above';
  const valueColMm = layout.valueLabels ? VALUE_PAD_MM + Math.max(...valueTexts.map((t) => textWidthMm(t, valueSizeMm))) : 0;
  // Labels longer than a share of the width break onto more lines rather than squeezing the glyphs.
  const labelText = rows.map((r) => (layout.labels ? labelLines(r.label, above ? Math.max(1, box.width - valueColMm) : box.width * LABEL_SHARE, labelSizeMm) : []));
  const labelColMm = layout.labels && !above ? Math.max(...labelText.map((l) => linesWidthMm(l, labelSizeMm))) + LABEL_PAD_MM : 0;
  const labelAboveMm = labelText.map((l) => (above ? linesHeightMm(l.length, lm) + LABEL_ABOVE_GAP_MM : 0));
  // Right-to-left rows end at the left, so their values stand between the labels and the grid.
  const gridXMm = box.x + labelColMm + (direction === 'rtl' ? valueColMm : 0);
  const gridRoomMm = box.width - labelColMm - valueColMm;
  const slots = counts.map(slotsOf);
  const mostSlots = Math.max(1, ...slots);
  const glyphs = [...new Set(rows.map((r) => r.glyph))];
  const keys = keyGlyphs(ctx);
  const keyFactor = sizePerRootInk(keys);
  const firstLineMm = Math.max(layout.labels && !above ? lm.boxHeightMm : 0, layout.valueLabels ? vm.boxHeightMm : 0);


  const plan = (sizeMm: number) => {
    const g = gridAt(glyphs, sizeMm, layout.gapRatio, layout.groupEvery ?? 0);
    const columns = layout.columns === 'auto' ? autoColumns(gridRoomMm, g, mostSlots) : layout.columns;
    const offsetMm = Math.max(0, (firstLineMm - g.cellHMm) / 2);
    const rowsPer = slots.map((n) => Math.max(1, Math.ceil(n / columns)));
    // The first label line is centred on the first glyph row; further lines hang below it.
    const labelTopMm = Math.max(0, offsetMm + g.cellHMm / 2 + lm.capHeightMm / 2 - lm.ascentMm);
    const bandMm = rowsPer.map((r, i) =>
      above
        ? labelAboveMm[i] + Math.max(offsetMm + r * g.cellHMm + (r - 1) * g.gapMm, layout.valueLabels ? vm.boxHeightMm : 0)
        : Math.max(offsetMm + r * g.cellHMm + (r - 1) * g.gapMm, labelTopMm + linesHeightMm(labelText[i].length, lm), layout.valueLabels ? vm.boxHeightMm : 0),
    );
    const bandGapMm = g.gapMm + 1;
    const keyHeightMm = Math.sqrt(g.inkMm2) * keyFactor.height;
    const heightMm = bandMm.reduce((a, b) => a + b, 0) + (rows.length - 1) * bandGapMm + (layout.legend ? unitLegendHeightMm(keyHeightMm) : 0);
    return { ...g, columns, offsetMm, rowsPer, bandMm, bandGapMm, heightMm };
  };
  const fits = (sizeMm: number) => {
    const p = plan(sizeMm);
    return gridWidthMm(p.columns, p) <= gridRoomMm + EPS_MM && p.heightMm <= box.height + EPS_MM;
  };
  const explain = (smallestMm: number) => {
    const q = plan(smallestMm);
    return { neededMm: { width: labelColMm + gridWidthMm(q.columns, q) + valueColMm, height: q.heightMm }, roomMm: { width: box.width, height: box.height } };
  };
  const p = plan(chooseGlyphSize(ctx, REPEAT_MAX_GLYPH_MM, fits, 'The glyph rows and their labels', explain));
  const shapeFor = (g: ResolvedGlyph) => book.shape(g, p.inkMm2);
  const fullWidthMm = gridWidthMm(p.columns, p);

  const marks: SceneMark[] = [];
  const texts: SceneText[] = [];
  // Use the page: spare height opens the gaps between categories (up to half a band each) and centres the rest.
  const spareHMm = Math.max(0, box.height - p.heightMm);
  const bandGrowMm = rows.length > 1 ? Math.min(spareHMm / rows.length, Math.min(...p.bandMm) / 2) : 0;
  const bandGapMm = p.bandGapMm + bandGrowMm;
  let topMm = box.y + (spareHMm - bandGrowMm * (rows.length - 1)) / 2;
  rows.forEach((row, i) => {
    const count = counts[i];
    const shape = shapeFor(row.glyph);
    const rowTopMm = topMm + labelAboveMm[i] + p.offsetMm;
    const pieces: SceneGlyph[] = [];
    for (let j = 0; j < slots[i]; j++) {
      const { row: r } = slotCell(j, p.columns, p.rowsPer[i], direction);
      const x = gridXMm + columnXMm(j % p.columns, p.columns, p, direction) + (p.cellWMm - shape.widthMm) / 2;
      const y = rowTopMm + r * (p.cellHMm + p.gapMm) + p.cellHMm - shape.heightMm;
      if (j < count.full) pieces.push(book.fullPiece(shape, x, y, { glyph: row.glyph.name, part: 'full', fraction: 1 }));
      else pieces.push({ region: book.band(shape, 0, count.partial, direction, x, y), glyph: row.glyph.name, part: 'partial', fraction: count.partial });
    }
    marks.push({ id: row.id, label: row.dataLabel, value: row.value, color: row.color, reading: 'count', glyphs: pieces, intended: count.drawn });

    const baselineMm = rowTopMm + p.cellHMm / 2 + lm.capHeightMm / 2;
    if (layout.labels) {
      // Beside: in the label column, flush left (as before) or flush against the marks ("end"). Above: over the
      // grid, from its start or to its end.
      const alignEnd = layout.labelAlign === 'end';
      const place = above
        ? { xMm: alignEnd ? gridXMm + fullWidthMm : gridXMm, yMm: topMm + lm.ascentMm }
        : { xMm: alignEnd ? box.x + labelColMm - LABEL_PAD_MM : box.x, yMm: baselineMm };
      texts.push(...makeLines({ role: 'label', text: row.label, ...place, sizeMm: labelSizeMm, anchor: alignEnd ? 'end' : 'start', owner: row.id }, labelText[i], lm.lineHeightMm));
    }
    if (layout.valueLabels) {
      // The value follows the ink of the category's last glyph, like a bar-end label (a partial glyph's cut
      // edge, not its empty slot), on the grid row that glyph stands in: after the ink's right edge, or for
      // right-to-left rows before its left edge. Extremes come from the glyph book (same bits, no point scan).
      const lastSlot = slots[i] - 1;
      const lastRow = lastSlot >= 0 ? slotCell(lastSlot, p.columns, p.rowsPer[i], direction).row : 0;
      const inRow = lastSlot >= 0 ? pieces.slice(lastSlot - (lastSlot % p.columns)) : [];
      const rowBaselineMm = baselineMm + lastRow * (p.cellHMm + p.gapMm);
      if (direction === 'rtl') {
        const inkStartMm = inRow.reduce((start, g) => Math.min(start, book.pieceBounds(g)?.minX ?? Infinity), Infinity);
        const startMm = Number.isFinite(inkStartMm) ? inkStartMm : gridXMm + fullWidthMm;
        texts.push(makeText({ role: 'value-label', text: valueTexts[i], xMm: Math.min(gridXMm + fullWidthMm, startMm) - VALUE_PAD_MM, yMm: rowBaselineMm, sizeMm: valueSizeMm, anchor: 'end', color: INK_COLORS.muted, owner: row.id }));
      } else {
        const inkEndMm = inRow.reduce((end, g) => Math.max(end, book.pieceBounds(g)?.maxX ?? -Infinity), -Infinity);
        const endMm = Number.isFinite(inkEndMm) ? inkEndMm : gridXMm;
        texts.push(makeText({ role: 'value-label', text: valueTexts[i], xMm: Math.max(gridXMm, endMm) + VALUE_PAD_MM, yMm: rowBaselineMm, sizeMm: valueSizeMm, color: INK_COLORS.muted, owner: row.id }));
      }
    }
    topMm += p.bandMm[i] + bandGapMm;
  });

  const legendKeys: SceneLegendKey[] = [];
  if (layout.legend) {
    const chartBottomMm = topMm - bandGapMm;
    const legend = placeUnitLegend(book, keys.map((g) => book.shape(g, p.inkMm2)), box, chartBottomMm + LEGEND_GAP_MM, legendSentence(ctx, unit), unit, spec.encoding.unitName ?? '');
    texts.push(...legend.texts);
    legendKeys.push(...legend.legendKeys);
  }
  return { marks, texts, lines: [], legendKeys, unit, unitGlyphInkMm2: p.inkMm2 };
}

function sharedGrid(ctx: LayoutContext, counts: GlyphCount[], unit: number): ModeResult {
  const { spec, box, rows, book } = ctx;
  const { layout } = spec;
  const direction = cutDirection(layout.direction);
  if (rows.some((r) => r.glyph !== ctx.chartGlyph)) {
    ctx.warnings.push({
      code: 'glyph-ignored',
      message: 'A shared grid draws every category with the chart glyph (encoding.glyph), so runs can meet inside one glyph; per-row glyphs are not used.',
    });
  }
  const glyph = ctx.chartGlyph;
  const starts: number[] = [];
  let total = 0;
  for (const c of counts) {
    starts.push(total);
    total += c.drawn;
  }
  const slotCount = total > 1e-9 ? Math.ceil(total - 1e-9) : 0;

  const lm = lineMetrics(TEXT_SIZE_MM.label);
  const valueTexts = rows.map((r) => valueLabelText(r.value, layout));
  const listed = layout.labels || layout.valueLabels;
  const labelText = rows.map((r) => (layout.labels ? labelLines(r.label, box.width * LABEL_SHARE, TEXT_SIZE_MM.label, 700) : []));
  const textBlockMm = labelText.map((l) => Math.max(linesHeightMm(l.length, lm), layout.valueLabels ? lm.boxHeightMm : 0));
  // Each entry's text as drawn (the value follows its own label's first line), measured by its ink from the
  // text's start: the list is as wide as its widest entry, so the block centred on the page is centred in ink.
  const inkRightMm = (t: SceneText | undefined) => (t?.bboxMm && t.bboxMm.width > 0 ? t.bboxMm.x + t.bboxMm.width : 0);
  const entryTextWMm = rows.map((row, i) => {
    const lines = layout.labels ? makeLines({ role: 'label', text: row.label, xMm: 0, yMm: 0, sizeMm: TEXT_SIZE_MM.label, weight: 700, owner: row.id }, labelText[i], lm.lineHeightMm) : [];
    const labelsMm = Math.max(0, ...lines.map(inkRightMm));
    if (!layout.valueLabels) return labelsMm;
    const firstLine = lines[0]?.bboxMm;
    const valueXMm = firstLine && firstLine.width > 0 ? firstLine.x + firstLine.width + VALUE_PAD_MM : 0;
    return Math.max(labelsMm, inkRightMm(makeText({ role: 'value-label', text: valueTexts[i], xMm: valueXMm, yMm: 0, sizeMm: TEXT_SIZE_MM.valueLabel, owner: row.id })));
  });
  const textWMm = Math.max(0, ...entryTextWMm);

  const plan = (sizeMm: number) => {
    const g = gridAt([glyph], sizeMm, layout.gapRatio, layout.groupEvery ?? 0);
    // The key list at the right: a unit glyph in each category's colour, its label and value.
    const listWMm = listed ? 4 + g.cellWMm + 2 + textWMm : 0;
    const roomMm = box.width - listWMm;
    let columns = layout.columns === 'auto' ? autoColumns(roomMm, g, slotCount) : layout.columns;
    const gridRows = Math.max(1, Math.ceil(slotCount / columns));
    // As few columns as keep the same number of rows: a less ragged last row (grouped rows keep whole groups).
    if (layout.columns === 'auto' && slotCount > 0 && !(g.every > 0 && gridRows > 1)) columns = Math.ceil(slotCount / gridRows);
    const gridHMm = gridRows * g.cellHMm + (gridRows - 1) * g.gapMm;
    const entryMm = textBlockMm.map((t) => Math.max(g.cellHMm, t));
    const listHMm = listed ? entryMm.reduce((a, b) => a + b, 0) + (rows.length - 1) * g.gapMm : 0;
    const heightMm = Math.max(gridHMm, listHMm) + (layout.legend ? unitLegendHeightMm(g.cellHMm) : 0);
    return { ...g, columns, gridRows, gridHMm, entryMm, listHMm, roomMm, heightMm };
  };
  const fits = (sizeMm: number) => {
    const p = plan(sizeMm);
    return gridWidthMm(p.columns, p) <= p.roomMm + EPS_MM && p.heightMm <= box.height + EPS_MM;
  };
  const explain = (smallestMm: number) => {
    const q = plan(smallestMm);
    return { neededMm: { width: box.width - q.roomMm + gridWidthMm(q.columns, q), height: q.heightMm }, roomMm: { width: box.width, height: box.height } };
  };
  const p = plan(chooseGlyphSize(ctx, REPEAT_MAX_GLYPH_MM, fits, 'The glyph grid and its key', explain));
  const shape = book.shape(glyph, p.inkMm2);
  // Use the page: the grid and its key list together are centred in the box, across and down.
  const blockWMm = gridWidthMm(p.columns, p) + (box.width - p.roomMm);
  // On the file's 0.001 mm grid, like the box edges, so a glyph placed by reference and one written out rasterise alike.
  const originX = Math.round((box.x + Math.max(0, box.width - blockWMm) / 2) * 1000) / 1000;
  const originY = box.y + Math.max(0, box.height - p.heightMm) / 2;

  const pieces: SceneGlyph[][] = rows.map(() => []);
  // Runs are contiguous and in order, so one cursor finds the runs touching each slot (slots + rows, not slots × rows).
  let first = 0;
  for (let j = 0; j < slotCount; j++) {
    const { row: r } = slotCell(j, p.columns, p.gridRows, direction);
    const x = originX + columnXMm(j % p.columns, p.columns, p, direction) + (p.cellWMm - shape.widthMm) / 2;
    const y = originY + r * (p.cellHMm + p.gapMm) + p.cellHMm - shape.heightMm;
    while (first < rows.length && starts[first] + counts[first].drawn <= j) first++;
    for (let i = first; i < rows.length && starts[i] < j + 1; i++) {
      const from = Math.max(starts[i], j) - j;
      const to = Math.min(starts[i] + counts[i].drawn, j + 1) - j;
      if (!(to - from > 1e-9)) continue;
      if (from <= 1e-9 && to >= 1 - 1e-9) pieces[i].push(book.fullPiece(shape, x, y, { glyph: glyph.name, part: 'full', fraction: 1 }));
      else pieces[i].push({ region: book.band(shape, from, to, direction, x, y), glyph: glyph.name, part: 'partial', fraction: to - from });
    }
  }
  const marks: SceneMark[] = rows.map((row, i) => ({ id: row.id, label: row.dataLabel, value: row.value, color: row.color, reading: 'count', glyphs: pieces[i], intended: counts[i].drawn }));

  const texts: SceneText[] = [];
  const legendKeys: SceneLegendKey[] = [];
  if (listed) {
    const listXMm = originX + gridWidthMm(p.columns, p) + 4;
    let topMm = originY;
    rows.forEach((row, i) => {
      const entryMm = p.entryMm[i];
      const keyYMm = topMm + (entryMm - shape.heightMm) / 2;
      legendKeys.push({ glyph: glyph.name, region: book.full(shape, listXMm + (p.cellWMm - shape.widthMm) / 2, keyYMm).region, color: row.color, unitValue: unit, unitName: spec.encoding.unitName ?? '' });
      const baselineMm = topMm + (entryMm - textBlockMm[i]) / 2 + lm.ascentMm;
      const textXMm = listXMm + p.cellWMm + 2;
      const labelLinesDrawn = layout.labels ? makeLines({ role: 'label', text: row.label, xMm: textXMm, yMm: baselineMm, sizeMm: TEXT_SIZE_MM.label, weight: 700, owner: row.id }, labelText[i], lm.lineHeightMm) : [];
      texts.push(...labelLinesDrawn);
      if (layout.valueLabels) {
        // The value follows its own label's ink on the same line, not a column after the longest label.
        const firstLine = labelLinesDrawn[0]?.bboxMm;
        const valueXMm = firstLine && firstLine.width > 0 ? firstLine.x + firstLine.width + VALUE_PAD_MM : textXMm;
        texts.push(makeText({ role: 'value-label', text: valueTexts[i], xMm: valueXMm, yMm: baselineMm, sizeMm: TEXT_SIZE_MM.valueLabel, color: INK_COLORS.muted, owner: row.id }));
      }
      topMm += entryMm + p.gapMm;
    });
  }
  if (layout.legend) {
    const bottomMm = originY + Math.max(p.gridHMm, p.listHMm);
    const legend = placeUnitLegend(book, shape, { ...box, x: originX }, bottomMm + LEGEND_GAP_MM, legendSentence(ctx, unit), unit, spec.encoding.unitName ?? '');
    texts.push(...legend.texts);
    legendKeys.push(...legend.legendKeys);
  }
  return { marks, texts, lines: [], legendKeys, unit, unitGlyphInkMm2: p.inkMm2 };
}
