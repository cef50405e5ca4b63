// How much one glyph stands for in repeat and stack charts, how many glyphs each category gets,
// and what rounding costs. The glyph budget is checked before anything is laid out.
import type { ChartSpec } from '../document';
import type { Warning } from '../errors';
import type { SceneUnitChoice } from '../scene';
import { assertGlyphBudget, chooseUnit } from './chooseUnit';
import { formatValue } from './labels';

export interface GlyphCount {
  /** value / unit. */
  exact: number;
  /** Glyphs drawn: exact, or rounded to whole glyphs. */
  drawn: number;
  /** Whole glyphs drawn. */
  full: number;
  /** Ink share of the last, partial glyph (0 when none). */
  partial: number;
}

export interface ResolvedUnit {
  unit: number;
  counts: GlyphCount[];
  choice: SceneUnitChoice;
  warnings: Warning[];
}

/** Below this a remainder is float noise, not a glyph sliver (counts are kept to 12 digits). */
const REMAINDER_EPSILON = 1e-9;

/** value / unit cleaned to 12 significant digits, as chooseUnit counts, so 0.3 / 0.1 is 3 glyphs. */
export function exactGlyphs(value: number, unit: number): number {
  return Number((value / unit).toPrecision(12));
}

export function splitCount(drawn: number): { full: number; partial: number } {
  let full = Math.floor(drawn);
  let partial = drawn - full;
  if (partial < REMAINDER_EPSILON) partial = 0;
  if (partial > 1 - REMAINDER_EPSILON) {
    full += 1;
    partial = 0;
  }
  return { full, partial };
}

export interface UnitOptions {
  /** Largest number of glyphs one category may take when the layout picks the unit. */
  maxGlyphsPerCategory: number;
  /** Parts of a whole in one grid: the unit is chosen for the total. */
  sharedGrid?: boolean;
}

export function resolveUnit(spec: ChartSpec, opts: UnitOptions): ResolvedUnit {
  const values = spec.data.map((r) => r.value);
  const labels = spec.data.map((r) => r.label);
  const given = spec.encoding.unit;
  let unit: number;
  if (given !== undefined) {
    unit = given;
  } else {
    // Whole-number data count whole things: never let one glyph stand for a fraction of one.
    const minUnit = values.every((v) => Number.isInteger(v)) ? 1 : undefined;
    const basis = opts.sharedGrid ? [values.reduce((a, b) => a + b, 0)] : values;
    unit = chooseUnit(basis, { maxGlyphsPerCategory: opts.maxGlyphsPerCategory, minUnit }).unit;
  }
  // Before any geometry: a billion glyphs must be refused with a unit that works, not attempted.
  assertGlyphBudget(values, unit, { labels });

  const whole = spec.encoding.rounding === 'whole';
  const counts: GlyphCount[] = [];
  const categories: SceneUnitChoice['categories'] = [];
  const warnings: Warning[] = [];
  values.forEach((value, i) => {
    const exact = exactGlyphs(value, unit);
    const drawn = whole ? Math.round(exact) : exact;
    counts.push({ exact, drawn, ...splitCount(drawn) });
    const error = drawn - exact;
    categories.push({ label: labels[i], exact, drawn, error, relativeError: exact === 0 ? 0 : error / exact });
    if (whole && error !== 0) {
      const pct = exact === 0 ? '' : ` (${error > 0 ? '+' : ''}${formatValue((error / exact) * 100)}%)`;
      warnings.push({
        code: 'rounding-whole',
        message: `"${labels[i]}": ${formatValue(value)} is ${formatValue(exact)} glyphs, drawn as ${drawn} whole glyph${drawn === 1 ? '' : 's'}${pct}.`,
      });
    }
  });
  return { unit, counts, choice: { unit, chosen: given === undefined, rounding: whole ? 'whole' : 'ink-cut', categories }, warnings };
}
