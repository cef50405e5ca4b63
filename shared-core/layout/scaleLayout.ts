// Scale: one glyph per category whose INK AREA is k · value, with one k for the chart. The linear
// size comes from a square-root scale (d3 scaleSqrt), so area, not height, follows the data; each
// glyph is normalised by its own ink, so a bus and a bike still carry ink in proportion to value.
import { scaleSqrt } from 'd3-scale';
import type { SceneGlyph, SceneLegendKey, SceneMark, SceneText } from '../scene';
import { TallyError } from '../errors';
import { noRoomError } from './noRoom';
import { planCellRows, TEXT_GAP_MM, type CellItem } from './cellRows';
import { MIN_GLYPH_MM } from './fitSize';
import { formatValue, lineMetrics, valueLabelText, makeLines, makeText, TEXT_SIZE_MM } from './labels';
import { keyGlyphs, type LayoutContext, type ModeResult } from './layoutContext';
import { LEGEND_GAP_MM, placeScaleLegend, scaleLegendHeightMm } from './legend';
import { INK_COLORS } from './palette';

export function scaleLayout(ctx: LayoutContext): ModeResult {
  const { spec, box, rows, book } = ctx;
  const { layout } = spec;
  const maxValue = Math.max(...rows.map((r) => r.value));
  if (!(maxValue > 0)) {
    ctx.warnings.push({ code: 'all-zero', message: 'Every value is 0, so there is nothing to scale: no glyph is drawn.' });
  }
  // Linear size per unit of the size parameter L (the side of a square holding the largest value's ink).
  const linear = scaleSqrt().domain([0, maxValue > 0 ? maxValue : 1]).range([0, 1]);
  const items: CellItem[] = rows.map((r) => {
    const rel = r.value > 0 ? linear(r.value) : 0;
    const root = Math.sqrt(r.glyph.areaUnits2);
    return { widthPerSize: (rel * r.glyph.bbox.width) / root, heightPerSize: (rel * r.glyph.bbox.height) / root, label: r.label, value: valueLabelText(r.value, layout) };
  });
  const tallest = Math.max(...items.map((it) => it.heightPerSize), 1e-12);
  const largestSide = Math.max(...items.map((it) => Math.max(it.widthPerSize, it.heightPerSize)), 1e-12);
  const asked = layout.glyphSizeMm;
  // Every distinct glyph drawn is keyed, not only the chart's.
  const keys = keyGlyphs(ctx);
  // glyphSizeMm, when given, is the larger side of the largest glyph's ink box.
  const maxSize = asked !== undefined ? asked / largestSide : box.height / tallest;
  const inkPerValue = (size: number) => (maxValue > 0 ? (size * size) / maxValue : 0);
  const unitName = spec.encoding.unitName ?? '';
  const rowsKeying = (keyed: typeof keys) => planCellRows(items, box, {
    columns: layout.columns,
    labels: layout.labels,
    valueLabels: layout.valueLabels,
    // The key wraps onto rows within the box's width; where not even one key column fits, the size is refused.
    legendHeightMm: (size) => (layout.legend && maxValue > 0 ? scaleLegendHeightMm(keyed, inkPerValue(size), maxValue, unitName, box.width) : 0),
    maxSize,
    minSize: Math.min(MIN_GLYPH_MM / largestSide, maxSize),
  });
  const plan = rowsKeying(keys);
  // Refused with several glyphs keyed: is the key of several glyphs the cause? (The same rows with one glyph's key fit.)
  let judged = plan;
  if (!plan.fits && keys.length > 1 && layout.legend && maxValue > 0) {
    const oneKey = rowsKeying(keys.slice(0, 1));
    if (oneKey.fits) {
      throw new TallyError(
        'layout-no-room',
        `Too many different glyphs for this ${formatValue(spec.page.widthMm)} x ${formatValue(spec.page.heightMm)} mm page: the scale key needs a reference for each of the ${keys.length} glyphs drawn, ` +
          `and with them there is no room to draw the marks and references at a legible size (at least ${formatValue(MIN_GLYPH_MM)} mm), so nothing was drawn. ` +
          'Use a bigger page, draw every row with one glyph (clear the glyph cells in the table), or use fewer different glyphs.',
        { what: 'The scale key\'s reference glyphs', glyphs: keys.length },
      );
    }
    // Not even then: the marks and their labels are what does not fit.
    judged = oneKey;
  }
  if (!plan.fits) {
    const keyFits = Number.isFinite(judged.heightMm);
    throw noRoomError(spec, {
      what: keyFits ? 'The scaled glyphs and their labels' : 'The scale key\'s reference glyphs',
      ...(keyFits ? { roomMm: { width: box.width, height: box.height }, neededMm: { width: judged.widthMm, height: judged.heightMm } } : {}),
    });
  }
  if (asked !== undefined && plan.size < maxSize * (1 - 1e-9)) {
    ctx.warnings.push({ code: 'glyph-size-reduced', message: `The largest glyph at ${formatValue(asked)} mm does not fit inside the margins; it is drawn at ${formatValue(plan.size * largestSide)} mm.` });
  }
  const k = inkPerValue(plan.size);

  const lm = lineMetrics(TEXT_SIZE_MM.label);
  const vm = lineMetrics(TEXT_SIZE_MM.valueLabel);
  const marks: SceneMark[] = [];
  const texts: SceneText[] = [];
  rows.forEach((row, i) => {
    const pieces: SceneGlyph[] = [];
    const baseline = plan.baselineYMm[i];
    const centre = plan.centreXMm[i];
    let topMm = baseline;
    if (row.value > 0 && k > 0) {
      const shape = book.shape(row.glyph, k * row.value);
      topMm = baseline - shape.heightMm;
      pieces.push(book.fullPiece(shape, centre - shape.widthMm / 2, topMm, { glyph: row.glyph.name, part: 'full', fraction: 1 }));
    }
    marks.push({ id: row.id, label: row.dataLabel, value: row.value, color: row.color, reading: 'area', glyphs: pieces, intended: k * row.value });
    if (layout.valueLabels) {
      texts.push(makeText({ role: 'value-label', text: items[i].value, xMm: centre, yMm: topMm - TEXT_GAP_MM - vm.descentMm, sizeMm: TEXT_SIZE_MM.valueLabel, anchor: 'middle', color: INK_COLORS.muted, owner: row.id }));
    }
    if (layout.labels) {
      texts.push(...makeLines({ role: 'label', text: row.label, xMm: centre, yMm: baseline + TEXT_GAP_MM + lm.ascentMm, sizeMm: TEXT_SIZE_MM.label, anchor: 'middle', owner: row.id }, plan.labelLines[i], lm.lineHeightMm));
    }
  });

  const legendKeys: SceneLegendKey[] = [];
  if (layout.legend && k > 0) {
    const legend = placeScaleLegend(book, keys, k, maxValue, unitName, box, plan.bottomMm + LEGEND_GAP_MM);
    texts.push(...legend.texts);
    legendKeys.push(...legend.legendKeys);
  }
  return { marks, texts, lines: [], legendKeys, unit: k > 0 ? 1 / k : 0 };
}
