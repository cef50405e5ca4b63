// Stack: a column of unit glyphs per category on one shared baseline. A glyph's share of length is
// its pitch (slot height plus gap), so slot k sits exactly k pitches above the baseline and n
// glyphs span n pitches; every column uses the same glyph size, gap and unit.
import type { SceneGlyph, SceneLegendKey, SceneLine, SceneMark, SceneText } from '../scene';
import { chooseUnit } from './chooseUnit';
import { chooseGlyphSize } from './fitSize';
import type { NoRoomDetails } from './noRoom';
import { labelLines, valueLabelText, lineMetrics, linesHeightMm, linesWidthMm, makeLines, makeText, MIN_TEXT_SIZE_MM, textWidthMm, TEXT_SIZE_MM } from './labels';
import { groupGapMm, groupShiftMm, keyGlyphs, sizePerRootInk, type LayoutContext, type ModeResult } from './layoutContext';
import { LEGEND_GAP_MM, placeUnitLegend, unitLegendHeightMm, unitLegendText } from './legend';
import { INK_COLORS } from './palette';
import { resolveUnit, withFittingUnit, type UnitOptions } from './resolveUnit';

export const STACK_MAX_GLYPH_MM = 18;
/** The baseline rule: about 1 pt, well above the 0.25 pt hairline printers warn about (common practice). */
export const RULE_WIDTH_MM = 0.35;
const TEXT_GAP_MM = 1.5;
const MIN_COLUMN_GAP_MM = 3;
const EPS_MM = 1e-9;

export function stackLayout(ctx: LayoutContext): ModeResult {
  return withFittingUnit(ctx, { maxGlyphsPerCategory: 30 }, (opts) => stackWithUnit(ctx, opts));
}

function stackWithUnit(ctx: LayoutContext, opts: UnitOptions): ModeResult {
  const { spec, box, rows, book } = ctx;
  const { layout } = spec;
  const unit = resolveUnit(spec, opts);
  ctx.warnings.push(...unit.warnings);
  const counts = unit.counts;
  const slots = counts.map((c) => c.full + (c.partial > 0 ? 1 : 0));
  const mostSlots = Math.max(1, ...slots);
  const glyphs = [...new Set(rows.map((r) => r.glyph))];
  const f = sizePerRootInk(glyphs);
  const keys = keyGlyphs(ctx);
  const keyFactor = sizePerRootInk(keys);
  const n = rows.length;
  // Grouping in fives or tens: one extra gap after every group, written on the marks for the verifier.
  const every = layout.groupEvery ?? 0;

  // Labels sit under their columns. Too wide for an equal share of the width: break them at spaces
  // first, then shrink them (never below the print minimum) if a single word is still too wide; a
  // column is as wide as its own label, so one long label does not widen every column.
  const roomEachMm = Math.max(1, (box.width - (n - 1) * MIN_COLUMN_GAP_MM) / n);
  let labelSizeMm: number = TEXT_SIZE_MM.label;
  let labelText = rows.map((r) => (layout.labels ? labelLines(r.label, roomEachMm, labelSizeMm) : []));
  const widestLine = Math.max(0, ...labelText.map((l) => linesWidthMm(l, labelSizeMm)));
  if (widestLine > roomEachMm) {
    labelSizeMm = Math.max(MIN_TEXT_SIZE_MM, (labelSizeMm * roomEachMm) / widestLine);
    labelText = rows.map((r) => (layout.labels ? labelLines(r.label, roomEachMm, labelSizeMm) : []));
  }
  const lm = lineMetrics(labelSizeMm);
  const vm = lineMetrics(TEXT_SIZE_MM.valueLabel);
  const valueTexts = rows.map((r) => valueLabelText(r.value, layout));
  const labelWMm = labelText.map((l) => linesWidthMm(l, labelSizeMm));
  const valueWMm = valueTexts.map((t) => (layout.valueLabels ? textWidthMm(t, TEXT_SIZE_MM.valueLabel) : 0));
  const mostLines = Math.max(0, ...labelText.map((l) => l.length));
  const aboveMm = layout.valueLabels ? vm.boxHeightMm + TEXT_GAP_MM : 0;
  const belowMm = RULE_WIDTH_MM + (mostLines > 0 ? TEXT_GAP_MM + linesHeightMm(mostLines, lm) : 0);

  const plan = (sizeMm: number) => {
    const root = sizeMm / f.largest;
    const cellWMm = root * f.width;
    const cellHMm = root * f.height;
    const gapMm = layout.gapRatio * sizeMm;
    const inkMm2 = root * root;
    const pitchMm = cellHMm + gapMm;
    const groupMm = groupGapMm(gapMm, sizeMm);
    const columnWMm = rows.map((_, i) => Math.max(cellWMm, labelWMm[i], valueWMm[i]));
    const columnGapMm = Math.max(gapMm, MIN_COLUMN_GAP_MM);
    const widthMm = columnWMm.reduce((a, w) => a + w, 0) + (n - 1) * columnGapMm;
    const stackMm = (mostSlots - 1) * pitchMm + groupShiftMm(mostSlots - 1, every, groupMm) + cellHMm;
    const legendMm = layout.legend ? unitLegendHeightMm(root * keyFactor.height) : 0;
    const heightMm = aboveMm + stackMm + belowMm + legendMm;
    return { cellWMm, cellHMm, gapMm, groupMm, inkMm2, pitchMm, columnWMm, columnGapMm, widthMm, stackMm, heightMm };
  };
  const explain = (smallestMm: number) => {
    const q = plan(smallestMm);
    const out: Omit<NoRoomDetails, 'what'> = { neededMm: { width: q.widthMm, height: q.heightMm }, roomMm: { width: box.width, height: box.height } };
    // How many slots a column could hold at the smallest size: the unit that keeps the tallest within it.
    const slotsRoom = Math.floor((box.height - (q.heightMm - q.stackMm) - q.cellHMm) / q.pitchMm) + 1;
    if (q.widthMm <= box.width + EPS_MM && slotsRoom >= 1) {
      out.suggestedUnit = chooseUnit(rows.map((r) => r.value), { maxGlyphsPerCategory: slotsRoom }).unit;
    }
    return out;
  };
  const p = plan(chooseGlyphSize(ctx, STACK_MAX_GLYPH_MM, (s) => {
    const q = plan(s);
    return q.widthMm <= box.width + EPS_MM && q.heightMm <= box.height + EPS_MM;
  }, 'The stacks and their labels', explain));

  // Use the page: equal column pitch across the width when every column fits one, else the spare width
  // spread between the columns; spare height is split above and below the chart.
  const pitchXMm = box.width / n;
  const equal = p.columnWMm.every((w) => w <= pitchXMm - MIN_COLUMN_GAP_MM + EPS_MM);
  const centres: number[] = [];
  if (equal) rows.forEach((_, i) => centres.push(box.x + (i + 0.5) * pitchXMm));
  else {
    const spare = Math.max(0, box.width - p.widthMm) / n;
    let x = box.x + spare / 2;
    rows.forEach((_, i) => {
      centres.push(x + p.columnWMm[i] / 2);
      x += p.columnWMm[i] + p.columnGapMm + spare;
    });
  }
  const topMm = box.y + Math.max(0, box.height - p.heightMm) / 2;
  const baselineYMm = topMm + aboveMm + p.stackMm;
  const marks: SceneMark[] = [];
  const texts: SceneText[] = [];
  rows.forEach((row, i) => {
    const shape = book.shape(row.glyph, p.inkMm2);
    const centreXMm = centres[i];
    const x = centreXMm - shape.widthMm / 2;
    const pieces: SceneGlyph[] = [];
    const count = counts[i];
    for (let k = 0; k < slots[i]; k++) {
      const y = baselineYMm - k * p.pitchMm - groupShiftMm(k, every, p.groupMm) - shape.heightMm;
      if (k < count.full) pieces.push({ ...book.full(shape, x, y), glyph: row.glyph.name, part: 'full', fraction: 1, slot: k });
      else pieces.push({ region: book.band(shape, 0, count.partial, 'btt', x, y), glyph: row.glyph.name, part: 'partial', fraction: count.partial, slot: k });
    }
    marks.push({ id: row.id, label: row.dataLabel, value: row.value, color: row.color, reading: 'length', glyphs: pieces, intended: count.drawn * p.pitchMm });

    if (layout.valueLabels) {
      const top = slots[i] > 0 ? baselineYMm - (slots[i] - 1) * p.pitchMm - groupShiftMm(slots[i] - 1, every, p.groupMm) - p.cellHMm : baselineYMm;
      texts.push(makeText({ role: 'value-label', text: valueTexts[i], xMm: centreXMm, yMm: top - TEXT_GAP_MM - vm.descentMm, sizeMm: TEXT_SIZE_MM.valueLabel, anchor: 'middle', color: INK_COLORS.muted, owner: row.id }));
    }
    if (layout.labels) {
      const first = { role: 'label' as const, text: row.label, xMm: centreXMm, yMm: baselineYMm + RULE_WIDTH_MM + TEXT_GAP_MM + lm.ascentMm, sizeMm: labelSizeMm, anchor: 'middle' as const, owner: row.id };
      texts.push(...makeLines(first, labelText[i], lm.lineHeightMm));
    }
  });

  const leftMm = centres[0] - p.columnWMm[0] / 2;
  const rightMm = centres[n - 1] + p.columnWMm[n - 1] / 2;
  // The rule lies just under the glyphs, so it never touches their ink.
  const ruleYMm = baselineYMm + RULE_WIDTH_MM / 2;
  const lines: SceneLine[] = [{ role: 'baseline', x1Mm: leftMm, y1Mm: ruleYMm, x2Mm: rightMm, y2Mm: ruleYMm, widthMm: RULE_WIDTH_MM, color: INK_COLORS.rule }];

  const legendKeys: SceneLegendKey[] = [];
  if (layout.legend) {
    const text = unitLegendText(unit.unit, spec.encoding.unitName ?? '', undefined, layout.keyWording);
    const sentence = spec.encoding.rounding === 'whole' ? `${text} (counts rounded to whole glyphs)` : text;
    const legend = placeUnitLegend(book, keys.map((g) => book.shape(g, p.inkMm2)), box, baselineYMm + belowMm + LEGEND_GAP_MM, sentence, unit.unit, spec.encoding.unitName ?? '');
    texts.push(...legend.texts);
    legendKeys.push(...legend.legendKeys);
  }
  const result: ModeResult = { marks, texts, lines, legendKeys, unit: unit.unit, unitGlyphInkMm2: p.inkMm2, pitchMm: p.pitchMm, baselineYMm, unitChoice: unit.choice };
  // Only a stack taller than one group shows a group gap; others are written exactly as without grouping.
  if (every > 0 && mostSlots > every) result.grouping = { every, gapMm: p.groupMm };
  return result;
}
