// The chart as a scene: glyphs resolved and normalised by ink, the mode's layout inside the page
// frame (title on top, source at the foot), labels checked for collisions, and the summary that
// the written file will carry. Pure: the same spec always gives the same scene.
import type { ChartSpec } from '../document';
import type { Warning } from '../errors';
import type { ChartSummary, Reading, Scene, SceneText } from '../scene';
import { resolveLabelCollisions } from './collisions';
import { MIN_GLYPH_MM } from './fitSize';
import { noRoomError } from './noRoom';
import { sliverWarnings } from './slivers';
import { fillLayout } from './fillLayout';
import { createGlyphBook } from './glyphBook';
import { lineMetrics, makeText, MIN_TEXT_SIZE_MM, oneLine, textWidthMm, TEXT_SIZE_MM, withTextFamily, wrapText } from './labels';
import { ptToMm } from '../text';
import type { BoxMm, ChartRow, LayoutContext, ModeResult } from './layoutContext';
import { categoryColor, checkDistinctColors, contrastRatio, INK_COLORS, mixWithWhite, opaqueColor, REST_WHITE_SHARE } from './palette';
import { repeatLayout } from './repeatLayout';
import { resolveGlyphs } from './resolveGlyphs';
import { scaleLayout } from './scaleLayout';
import { stackLayout } from './stackLayout';
import { assertGlyphBudget } from './chooseUnit';
import { toXmlChars } from '../svg/xmlChars';
import { adjustmentFootnote } from '../standardise/applyAdjustments';

export const READING_OF_MODE: Readonly<Record<ChartSpec['encoding']['mode'], Reading>> = Object.freeze({
  repeat: 'count',
  stack: 'length',
  scale: 'area',
  fill: 'fill',
});

/** Space between the title block and the chart, and between the chart and the source line. */
const BLOCK_GAP_MM = 4;
/** Distance inside the trim edge that content keeps clear of: a printer's usual safe zone (common practice, no source). */
export const SAFE_MARGIN_MM = 3;

interface Frame {
  box: BoxMm;
  texts: SceneText[];
}

/** Lines of text that fit a width: wrapped at words, then shrunk (not below the print minimum) if a single word is still too wide. */
function fittedLines(text: string, widthMm: number, sizeMm: number, weight: 400 | 700): { lines: string[]; sizeMm: number } {
  let size = sizeMm;
  let lines = wrapText(text, widthMm, size, weight);
  const widest = Math.max(0, ...lines.map((l) => textWidthMm(l, size, weight)));
  if (widest > widthMm) {
    size = Math.max(MIN_TEXT_SIZE_MM, (size * widthMm) / widest);
    lines = wrapText(text, widthMm, size, weight);
  }
  return { lines, sizeMm: size };
}

/** The foot line: the source, then the footnote of any standardisation applied (per capita, prices...). */
function sourceLine(spec: ChartSpec): string {
  const source = spec.source?.trim() ?? '';
  const named = source && !/^source\b/i.test(source) ? `Source: ${source}` : source;
  const footnote = adjustmentFootnote(spec.standardise);
  if (!footnote) return named;
  return named ? `${named}${/[.!?]$/.test(named) ? '' : '.'} ${footnote}` : footnote;
}

/** Title and source sizes in mm: the document's sizes in points where it sets them, else the defaults. */
export function frameTextSizesMm(spec: ChartSpec): { titleMm: number; sourceMm: number } {
  const { titleSizePt, sourceSizePt } = spec.layout;
  return {
    titleMm: titleSizePt !== undefined ? ptToMm(titleSizePt) : TEXT_SIZE_MM.title,
    sourceMm: sourceSizePt !== undefined ? ptToMm(sourceSizePt) : TEXT_SIZE_MM.source,
  };
}

function pageFrame(spec: ChartSpec, warnings: Warning[]): Frame {
  const { margins } = spec.layout;
  const x = margins.left;
  const width = spec.page.widthMm - margins.left - margins.right;
  let top = margins.top;
  let bottom = spec.page.heightMm - margins.bottom;
  const texts: SceneText[] = [];
  const sizes = frameTextSizesMm(spec);

  const title = spec.title?.trim();
  if (title) {
    const fitted = fittedLines(title, width, sizes.titleMm, 700);
    const m = lineMetrics(fitted.sizeMm, 700);
    fitted.lines.forEach((line, i) => {
      texts.push(makeText({ role: 'title', text: line, xMm: x, yMm: top + m.ascentMm + i * m.lineHeightMm, sizeMm: fitted.sizeMm, weight: 700 }));
    });
    top += m.boxHeightMm + (fitted.lines.length - 1) * m.lineHeightMm + BLOCK_GAP_MM;
  }
  const source = sourceLine(spec);
  if (source) {
    const fitted = fittedLines(source, width, sizes.sourceMm, 400);
    if (fitted.sizeMm < MIN_TEXT_SIZE_MM) {
      warnings.push({
        code: 'text-small',
        message: `The source line is set at ${(fitted.sizeMm * 72 / 25.4).toFixed(1)} pt, under the 6 pt most printers give as the smallest legible size; it may not read in print.`,
      });
    }
    const m = lineMetrics(fitted.sizeMm);
    const count = fitted.lines.length;
    fitted.lines.forEach((line, i) => {
      texts.push(makeText({ role: 'source', text: line, xMm: x, yMm: bottom - m.descentMm - (count - 1 - i) * m.lineHeightMm, sizeMm: fitted.sizeMm, color: INK_COLORS.muted }));
    });
    bottom -= m.boxHeightMm + (count - 1) * m.lineHeightMm + BLOCK_GAP_MM;
  }
  // Title and source must leave room for at least a row of legible glyphs between them, or they overlap.
  if (bottom - top < MIN_GLYPH_MM) {
    throw noRoomError(spec, {
      what: 'The title, the source and the chart between them',
      neededMm: { width, height: spec.page.heightMm - margins.top - margins.bottom + (top - bottom) + MIN_GLYPH_MM },
      roomMm: { width, height: spec.page.heightMm - margins.top - margins.bottom },
    });
  }
  return { box: { x, y: top, width, height: Math.max(0, bottom - top) }, texts };
}

/**
 * Data indices in chart order: as given, or by value (largest or smallest first). The sort is stable, so equal
 * values keep the table's order; the table itself is never reordered.
 */
export function chartOrder(spec: ChartSpec): number[] {
  const order = spec.data.map((_, i) => i);
  const sort = spec.layout.sort ?? 'given';
  if (sort === 'given') return order;
  const sign = sort === 'descending' ? -1 : 1;
  return order.sort((a, b) => sign * (spec.data[a].value - spec.data[b].value) || a - b);
}

function chartRows(spec: ChartSpec, glyphs: ReturnType<typeof resolveGlyphs>['rows'], warnings: Warning[]): ChartRow[] {
  const warned = new Set<string>();
  // Each row keeps its table index for its mark id and colour, so sorting moves a category, never renames or recolours it.
  const out = chartOrder(spec).map((i) => {
    const row = spec.data[i];
    const given = categoryColor(i, row.color, spec.layout.colors);
    // One warning per colour, however many categories share it.
    const color = opaqueColor(given, warned.has(given) ? undefined : warnings, `"${row.label}"`);
    warned.add(given);
    return {
      id: `mark-${i + 1}`,
      label: oneLine(row.label),
      // Cleaned once here so the mark's attribute and the summary's JSON carry the same label.
      dataLabel: toXmlChars(row.label),
      value: row.value,
      glyph: glyphs[i],
      color,
      restColor: mixWithWhite(color, REST_WHITE_SHARE),
    };
  });
  const sharedGrid = spec.encoding.mode === 'repeat' && spec.encoding.arrangement === 'shared-grid';
  checkDistinctColors(out.map((r) => r.label), out.map((r) => r.color), sharedGrid, warnings);
  return out;
}

function runMode(ctx: LayoutContext): ModeResult {
  switch (ctx.spec.encoding.mode) {
    case 'repeat':
      return repeatLayout(ctx);
    case 'stack':
      return stackLayout(ctx);
    case 'scale':
      return scaleLayout(ctx);
    case 'fill':
      return fillLayout(ctx);
  }
}

/**
 * Lays out a validated chart (see parseChart) as a scene in page millimetres.
 * Throws TallyError for glyphs that cannot be used and for charts over the glyph budget
 * (the message suggests a unit that fits).
 */
export function layoutChart(spec: ChartSpec): Scene {
  return withTextFamily(spec.layout.font ?? 'sans', () => layoutInFamily(spec));
}

function layoutInFamily(given: ChartSpec): Scene {
  const order = chartOrder(given);
  // The modes read the data in chart order (units, counts and slivers are per row), so they see the sorted rows.
  const spec: ChartSpec = order.every((k, i) => k === i) ? given : { ...given, data: order.map((i) => given.data[i]) };
  const { mode } = spec.encoding;
  // Scale and fill draw one glyph per category: the same budget bounds the number of categories.
  if (mode === 'scale' || mode === 'fill') assertGlyphBudget(spec.data.map(() => 1), 1, { labels: spec.data.map((r) => r.label) });
  const warnings: Warning[] = [];
  const glyphs = resolveGlyphs(given);
  warnings.push(...glyphs.warnings);
  const rows = chartRows(given, glyphs.rows, warnings);
  const frame = pageFrame(spec, warnings);
  const book = createGlyphBook();
  const ctx: LayoutContext = { spec, rows, chartGlyph: glyphs.chart, box: frame.box, book, warnings };
  const result = runMode(ctx);
  // Slivers only where one category owns each partial glyph; a shared grid splits glyphs between categories.
  const sharedGrid = mode === 'repeat' && spec.encoding.arrangement === 'shared-grid';
  if ((mode === 'repeat' && !sharedGrid) || mode === 'stack') warnings.push(...sliverWarnings(spec, result.marks, result.unit));

  const resolved = resolveLabelCollisions({ marks: result.marks, legendKeys: result.legendKeys, texts: [...frame.texts, ...result.texts] });
  warnings.push(...resolved.warnings);

  const summary: ChartSummary = {
    format: 'tallyglyph.summary/1',
    title: spec.title ?? '',
    source: spec.source ?? '',
    mode,
    reading: READING_OF_MODE[mode],
    unit: result.unit,
    unitName: spec.encoding.unitName ?? '',
    data: rows.map((r) => ({ id: r.id, label: r.dataLabel, value: r.value })),
  };
  if (result.unitGlyphInkMm2 !== undefined) summary.unitGlyphInkMm2 = result.unitGlyphInkMm2;
  if (result.pitchMm !== undefined) summary.pitchMm = result.pitchMm;
  if (result.baselineYMm !== undefined) summary.baselineYMm = result.baselineYMm;
  const footnote = adjustmentFootnote(spec.standardise);
  if (footnote && spec.standardise?.adjustments) summary.adjustments = { note: footnote, steps: spec.standardise.adjustments.steps };

  const scene: Scene = {
    page: {
      widthMm: spec.page.widthMm,
      heightMm: spec.page.heightMm,
      bleedMm: spec.layout.bleedMm,
      safeMarginMm: SAFE_MARGIN_MM,
    },
    marks: result.marks,
    texts: resolved.texts,
    lines: result.lines,
    legendKeys: result.legendKeys,
    summary,
    warnings: dedupe(warnings),
    shapes: book.shapes(),
  };
  if (result.unitChoice) scene.unitChoice = result.unitChoice;
  if (result.grouping) scene.grouping = result.grouping;
  if (spec.layout.background) {
    // Painted opaque to the bleed edge; verification then reads marks against it as the paper colour.
    scene.background = opaqueColor(spec.layout.background, scene.warnings, 'The page background');
    const ratio = contrastRatio(scene.background, INK_COLORS.text);
    if (ratio < 4.5) {
      scene.warnings.push({ code: 'background-contrast', message: `Text on the ${scene.background} background has a contrast of ${ratio.toFixed(1)}:1, under the 4.5:1 WCAG 2.1 asks of body text; choose a lighter background.` });
    }
  }
  return scene;
}

function dedupe(warnings: Warning[]): Warning[] {
  const seen = new Set<string>();
  return warnings.filter((w) => {
    const key = `${w.code}\n${w.message}`;
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}
