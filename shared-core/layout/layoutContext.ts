// What every mode layout receives and returns, and the glyph-size arithmetic they share.
import type { ChartSpec } from '../document';
import type { Warning } from '../errors';
import type { SceneGrouping, SceneLegendKey, SceneLine, SceneMark, SceneText, SceneUnitChoice } from '../scene';
import type { GlyphBook } from './glyphBook';
import type { ResolvedGlyph } from './resolveGlyphs';

export interface BoxMm {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface ChartRow {
  /** Mark id, `mark-N`. */
  id: string;
  /** The label on one line, as drawn. */
  label: string;
  /** The label as given in the data. */
  dataLabel: string;
  value: number;
  glyph: ResolvedGlyph;
  color: string;
  restColor: string;
}

export interface LayoutContext {
  spec: ChartSpec;
  rows: ChartRow[];
  chartGlyph: ResolvedGlyph;
  /** Room for the marks, their labels and the legend, inside the margins, below the title, above the source. */
  box: BoxMm;
  book: GlyphBook;
  warnings: Warning[];
}

export interface ModeResult {
  marks: SceneMark[];
  texts: SceneText[];
  lines: SceneLine[];
  legendKeys: SceneLegendKey[];
  /** Quantity per unit glyph (repeat, stack), value per mm² (scale), value of a full glyph (fill). */
  unit: number;
  unitGlyphInkMm2?: number;
  pitchMm?: number;
  baselineYMm?: number;
  unitChoice?: SceneUnitChoice;
  /** Stack only: the extra gap after every few slots, for the written file. */
  grouping?: SceneGrouping;
}

/**
 * The extra gap that marks groups of glyphs (layout.groupEvery): one more glyph gap, and never less than the
 * default gap share of the glyph size, so groups still read when the glyphs touch.
 */
export function groupGapMm(gapMm: number, glyphSizeMm: number): number {
  return Math.max(gapMm, 0.2 * glyphSizeMm);
}

/** How far past an even pitch slot `index` stands: one group gap per completed group before it. */
export function groupShiftMm(index: number, every: number, gapMm: number): number {
  return every > 0 ? Math.floor(index / every) * gapMm : 0;
}

/**
 * Size factors of glyphs that share one ink area A: a glyph with ink a and ink box bw x bh is
 * drawn bw·sqrt(A/a) wide. Returned per sqrt(A), the largest over the glyphs given.
 */
export function sizePerRootInk(glyphs: readonly ResolvedGlyph[]): { width: number; height: number; largest: number } {
  let width = 0;
  let height = 0;
  for (const g of glyphs) {
    const r = Math.sqrt(g.areaUnits2);
    width = Math.max(width, g.bbox.width / r);
    height = Math.max(height, g.bbox.height / r);
  }
  return { width, height, largest: Math.max(width, height) };
}

/**
 * The glyphs a unit legend keys: each distinct glyph drawn by a category with a value, in order of first use,
 * so a row drawn with its own glyph is explained too; the chart glyph when nothing is drawn.
 */
export function keyGlyphs(ctx: Pick<LayoutContext, 'rows' | 'chartGlyph'>): ResolvedGlyph[] {
  const out: ResolvedGlyph[] = [];
  for (const r of ctx.rows) if (r.value > 0 && !out.includes(r.glyph)) out.push(r.glyph);
  return out.length > 0 ? out : [ctx.chartGlyph];
}
