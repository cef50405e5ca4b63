// Fill: one glyph per category, all at the same ink area, filled to value / max (or to a 0..1
// share). The filled part is an ink-true cut and the rest is the glyph minus that cut, so the two
// pieces together are exactly the glyph and the filled share of ink equals the data share.
import type { FillEncoding } from '../document';
import type { CutDirection } from '../glyph';
import type { SceneGlyph, SceneLegendKey, SceneMark, SceneText } from '../scene';
import { noRoomError } from './noRoom';
import { planCellRows, TEXT_GAP_MM, type CellItem } from './cellRows';
import { MIN_GLYPH_MM } from './fitSize';
import { formatShare, formatValue, lineMetrics, valueLabelText, makeLines, makeText, TEXT_SIZE_MM } from './labels';
import { keyGlyphs, sizePerRootInk, type LayoutContext, type ModeResult } from './layoutContext';
import { keyWordingText, LEGEND_GAP_MM, placeUnitLegend, unitLegendHeightMm, unitLegendText } from './legend';
import { INK_COLORS } from './palette';

export const FILL_MAX_GLYPH_MM = 60;
/** The legend's key says what a full glyph means; it need not be drawn at the marks' size, which may be large. */
const KEY_MAX_HEIGHT_MM = 8;

function keyInkMm2(inkMm2: number, keyHeightAtInkMm: number): number {
  const shrink = Math.min(1, KEY_MAX_HEIGHT_MM / keyHeightAtInkMm);
  return inkMm2 * shrink * shrink;
}

/**
 * Fill rises from the bottom, like a level. The document's direction defaults to "ltr", which cannot
 * be told apart from an explicit choice, so only "rtl" changes it.
 */
export function fillDirection(direction: string): CutDirection {
  return direction === 'rtl' ? 'rtl' : 'btt';
}

export function fillLayout(ctx: LayoutContext): ModeResult {
  const { spec, box, rows, book } = ctx;
  const { layout } = spec;
  const byShare = (spec.encoding as FillEncoding).fillTo === 'share';
  const maxValue = Math.max(...rows.map((r) => r.value));
  const fullValue = byShare ? 1 : maxValue;
  if (!byShare && !(maxValue > 0)) {
    ctx.warnings.push({ code: 'all-zero', message: 'Every value is 0: each glyph is drawn empty.' });
  }
  const shares = rows.map((r) => (fullValue > 0 ? Math.min(1, r.value / fullValue) : 0));
  const direction = fillDirection(layout.direction);
  const glyphs = [...new Set(rows.map((r) => r.glyph))];
  const f = sizePerRootInk(glyphs);
  const keys = keyGlyphs(ctx);
  const keyFactor = sizePerRootInk(keys);
  const valueTexts = rows.map((r) => (byShare ? formatShare(r.value) : valueLabelText(r.value, layout)));
  // The size parameter is the glyph size G; each glyph's box follows from the shared ink area (G / largest)².
  const items: CellItem[] = rows.map((r, i) => {
    const root = Math.sqrt(r.glyph.areaUnits2) * f.largest;
    return { widthPerSize: r.glyph.bbox.width / root, heightPerSize: r.glyph.bbox.height / root, label: r.label, value: valueTexts[i] };
  });
  const asked = layout.glyphSizeMm;
  const plan = planCellRows(items, box, {
    columns: layout.columns,
    labels: layout.labels,
    valueLabels: layout.valueLabels,
    legendHeightMm: (size) => (layout.legend ? unitLegendHeightMm(Math.min(KEY_MAX_HEIGHT_MM, (size * keyFactor.height) / f.largest)) : 0),
    maxSize: asked ?? FILL_MAX_GLYPH_MM,
    minSize: Math.min(MIN_GLYPH_MM, asked ?? MIN_GLYPH_MM),
  });
  if (!plan.fits) throw noRoomError(spec, { what: 'The glyphs and their labels', roomMm: { width: box.width, height: box.height }, neededMm: { width: plan.widthMm, height: plan.heightMm } });
  if (asked !== undefined && plan.size < asked - 1e-9) {
    ctx.warnings.push({ code: 'glyph-size-reduced', message: `Glyphs of ${formatValue(asked)} mm do not fit inside the margins; they are drawn at ${formatValue(plan.size)} mm.` });
  }
  const root = plan.size / f.largest;
  const inkMm2 = root * root;

  const lm = lineMetrics(TEXT_SIZE_MM.label);
  const vm = lineMetrics(TEXT_SIZE_MM.valueLabel);
  const marks: SceneMark[] = [];
  const texts: SceneText[] = [];
  rows.forEach((row, i) => {
    const shape = book.shape(row.glyph, inkMm2);
    const baseline = plan.baselineYMm[i];
    const centre = plan.centreXMm[i];
    const x = centre - shape.widthMm / 2;
    const y = baseline - shape.heightMm;
    const share = shares[i];
    const pieces: SceneGlyph[] = [];
    if (share > 0) pieces.push({ region: book.band(shape, 0, share, direction, x, y), glyph: row.glyph.name, part: 'filled', fraction: share });
    if (share < 1) pieces.push({ region: book.band(shape, share, 1, direction, x, y), glyph: row.glyph.name, part: 'rest', fraction: 1 - share });
    marks.push({ id: row.id, label: row.dataLabel, value: row.value, color: row.color, restColor: row.restColor, reading: 'fill', glyphs: pieces, intended: share });
    if (layout.valueLabels) {
      texts.push(makeText({ role: 'value-label', text: valueTexts[i], xMm: centre, yMm: y - TEXT_GAP_MM - vm.descentMm, sizeMm: TEXT_SIZE_MM.valueLabel, anchor: 'middle', color: INK_COLORS.muted, owner: row.id }));
    }
    if (layout.labels) {
      texts.push(...makeLines({ role: 'label', text: row.label, xMm: centre, yMm: baseline + TEXT_GAP_MM + lm.ascentMm, sizeMm: TEXT_SIZE_MM.label, anchor: 'middle', owner: row.id }, plan.labelLines[i], lm.lineHeightMm));
    }
  });

  const legendKeys: SceneLegendKey[] = [];
  if (layout.legend) {
    const unitName = spec.encoding.unitName ?? '';
    const wording = layout.keyWording;
    const sentence = byShare
      ? (wording !== undefined ? keyWordingText(wording, '100%', '') : 'full glyph = 100%')
      : unitLegendText(fullValue, unitName, 'full glyph =', wording);
    const keyInk = keyInkMm2(inkMm2, root * keyFactor.height);
    const legend = placeUnitLegend(book, keys.map((g) => book.shape(g, keyInk)), box, plan.bottomMm + LEGEND_GAP_MM, sentence, fullValue, unitName);
    texts.push(...legend.texts);
    legendKeys.push(...legend.legendKeys);
  }
  return { marks, texts, lines: [], legendKeys, unit: fullValue, unitGlyphInkMm2: inkMm2 };
}
