// The scene: a laid-out chart as plain data in page millimetres, before it becomes SVG text.
// Layout produces it, the SVG writer serialises it; verification never reads it (it reads the file).
import type { Warning } from '../errors';
import type { Region } from '../geometry/region';
import type { AdjustmentStep } from '../standardise/types';

/** How a mark's quantity is read by the eye, and so how verification measures it. */
export type Reading = 'count' | 'length' | 'area' | 'fill';

export interface SceneGlyph {
  /** The piece's ink, baked into page millimetres (y down). */
  region: Region;
  /** Glyph name from the catalog, or `inline:<n>` for inline markup. */
  glyph: string;
  /**
   * full: a whole unit glyph. partial: an ink-true cut standing for `fraction` of a unit glyph.
   * filled / rest (fill mode): the filled share of the glyph's ink and the unfilled remainder.
   */
  part: 'full' | 'partial' | 'filled' | 'rest';
  /** Share of one unit glyph's ink this piece stands for (1 for full, f for partial, the share for filled). */
  fraction: number;
  /** Stack slot counted from the baseline (0 = on the baseline), stack mode only. */
  slot?: number;
  /**
   * Set when the piece is a shared shape (Scene.shapes[shape]) moved by (xMm, yMm) and nothing else:
   * `region` equals that shape translated. Lets the writer reuse geometry with <use> when asked to.
   */
  ref?: { shape: string; xMm: number; yMm: number };
}

export interface SceneMark {
  /** Stable id, unique in the file, e.g. `mark-1`. */
  id: string;
  label: string;
  value: number;
  color: string;
  /** Colour of the unfilled remainder in fill mode. */
  restColor?: string;
  reading: Reading;
  glyphs: SceneGlyph[];
  /** What the layout meant to show (count, length mm, ink area mm², share); cross-checks only. */
  intended: number;
}

export interface SceneText {
  role: 'title' | 'subtitle' | 'label' | 'value-label' | 'legend' | 'source' | 'note';
  text: string;
  xMm: number;
  /** Baseline. */
  yMm: number;
  sizeMm: number;
  weight: 400 | 700;
  anchor: 'start' | 'middle' | 'end';
  color: string;
  /** Bundled text family; absent: sans (Noto Sans). */
  family?: 'serif';
  /** Mark id this text describes, if any. */
  owner?: string;
  /** Ink bounds of the outlined text at layout time (page mm), for collision checks. */
  bboxMm?: { x: number; y: number; width: number; height: number };
}

export interface SceneLine {
  role: 'baseline' | 'rule';
  x1Mm: number;
  y1Mm: number;
  x2Mm: number;
  y2Mm: number;
  widthMm: number;
  color: string;
}

/** A key glyph in the legend ("one glyph = N units"); not data ink, but measurable as the unit. */
export interface SceneLegendKey {
  glyph: string;
  region: Region;
  color: string;
  /** The quantity this key glyph stands for. */
  unitValue: number;
  unitName: string;
}

/** Machine-readable summary embedded in the file's <metadata>. */
export interface ChartSummary {
  format: 'tallyglyph.summary/1';
  title: string;
  source: string;
  mode: 'repeat' | 'stack' | 'scale' | 'fill';
  reading: Reading;
  /** Quantity per unit glyph (repeat, stack); for scale, value per mm² of ink; for fill, the value of a full glyph. */
  unit: number;
  unitName: string;
  data: { id: string; label: string; value: number }[];
  /** Ink of one full unit glyph in mm² (repeat, stack, fill). */
  unitGlyphInkMm2?: number;
  /** Stack pitch (glyph plus gap) in mm and the shared baseline y. */
  pitchMm?: number;
  baselineYMm?: number;
  /** Standardisation applied to the values (per capita, price index...): the footnote printed on the chart and the steps. */
  adjustments?: { note: string; steps: AdjustmentStep[] };
  /** Filled in by verification before writing: the lie factor measured on this very file. */
  measured?: { lieFactorWorst: number | null; spread: number | null; pass: boolean };
}

export interface Scene {
  page: { widthMm: number; heightMm: number; bleedMm: number; safeMarginMm: number };
  background?: string;
  marks: SceneMark[];
  texts: SceneText[];
  lines: SceneLine[];
  legendKeys: SceneLegendKey[];
  summary: ChartSummary;
  warnings: Warning[];
  /** Glyph outlines shared by several pieces (see SceneGlyph.ref), page mm with the ink box's top-left at 0,0. */
  shapes?: Record<string, Region>;
  /** Repeat and stack: the unit used, whether the layout chose it, and what rounding to whole glyphs costs per category. */
  unitChoice?: SceneUnitChoice;
  /** Stack glyphs grouped with one extra gap after every `every` slots; written on the marks so a verifier can allow for it. */
  grouping?: SceneGrouping;
}

export interface SceneGrouping {
  every: number;
  gapMm: number;
}

export interface SceneUnitChoice {
  unit: number;
  /** True when the document gave no unit and the layout picked a readable one. */
  chosen: boolean;
  rounding: 'ink-cut' | 'whole';
  categories: {
    label: string;
    /** value / unit. */
    exact: number;
    /** Glyphs drawn: exact (ink-cut) or the nearest whole number (whole). */
    drawn: number;
    /** drawn - exact, in glyphs. */
    error: number;
    /** error / exact; 0 for a zero value. */
    relativeError: number;
  }[];
}
