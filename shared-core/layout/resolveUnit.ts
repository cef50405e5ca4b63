// How much one glyph stands for in repeat and stack charts, how many glyphs each category gets,
// and what rounding costs. The glyph budget is checked before anything is laid out.
import type { ChartSpec } from '../document';
import { isTallyError, TallyError, type Warning } from '../errors';
import { DISTORTION_LIMITS, gate } from '../integrity/gate';
import { lieFactors } from '../integrity/lieFactor';
import type { SceneUnitChoice } from '../scene';
import { assertGlyphBudget, chooseUnit, nextReadableUnits } from './chooseUnit';
import { formatValue } from './labels';
import type { LayoutContext } from './layoutContext';

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
  /** Use this unit instead of the document's or the chooser's (one of autoUnits' candidates). */
  unit?: number;
}

/** How many larger readable units the layout may step through when the chosen one leaves no room. */
const MAX_UNIT_STEPS = 12;
/**
 * Whole glyphs are counted exactly in the file, but measured ink carries about 1e-4 of noise: a unit is
 * offered only when its rounded counts keep this far inside the gate's band, so it cannot fail on noise.
 */
const WHOLE_GATE_MARGIN = 0.002;

/** True when drawing round(value / unit) whole glyphs passes the export gate (count reading). */
export function wholeCountsPass(values: readonly number[], labels: readonly string[], unit: number): boolean {
  const items = values.map((v, i) => ({ label: labels[i] ?? `Value ${i + 1}`, data: v, graphic: Math.round(exactGlyphs(v, unit)) }));
  const report = lieFactors(items);
  return gate(report, { low: DISTORTION_LIMITS.low + WHOLE_GATE_MARGIN, high: DISTORTION_LIMITS.high - WHOLE_GATE_MARGIN }).pass;
}

/**
 * Units the layout may use when the document leaves the unit to it, best first: the chooser's readable
 * unit, then larger readable units for a chart that does not fit. With whole glyphs only units whose
 * rounded counts pass the gate are offered, looking below the chooser's unit (more glyphs, within the glyph
 * budget) when no larger one passes; when none does the chart is refused with the reason.
 */
export function autoUnits(spec: ChartSpec, opts: UnitOptions): number[] {
  const values = spec.data.map((r) => r.value);
  const labels = spec.data.map((r) => r.label);
  const minUnit = values.every((v) => Number.isInteger(v)) ? 1 : undefined;
  const basis = opts.sharedGrid ? [values.reduce((a, b) => a + b, 0)] : values;
  const first = chooseUnit(basis, { maxGlyphsPerCategory: opts.maxGlyphsPerCategory, minUnit }).unit;
  const larger = [first, ...nextReadableUnits(first, MAX_UNIT_STEPS, 'up')];
  if (spec.encoding.rounding !== 'whole') return larger;
  const passing = larger.filter((u) => wholeCountsPass(values, labels, u));
  if (passing.length > 0) return passing;
  // Smaller units draw more glyphs and round less; stop at the glyph budget or the counting floor.
  for (const u of nextReadableUnits(first, 40, 'down')) {
    if (minUnit !== undefined && u < minUnit) break;
    try {
      assertGlyphBudget(values, u, { labels });
    } catch {
      break;
    }
    if (wholeCountsPass(values, labels, u)) return [u];
  }
  throw new TallyError(
    'data-invalid',
    'No readable unit (1, 2, 2.5 or 5 times a power of ten) draws these values as whole glyphs within the lie-factor band 0.95–1.05: ' +
      'rounding to whole glyphs would misstate them. Cut remainders by ink, or set a unit yourself.',
  );
}

export function resolveUnit(spec: ChartSpec, opts: UnitOptions): ResolvedUnit {
  const values = spec.data.map((r) => r.value);
  const labels = spec.data.map((r) => r.label);
  const given = spec.encoding.unit;
  let unit: number;
  if (opts.unit !== undefined) {
    unit = opts.unit;
  } else if (given !== undefined) {
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

/**
 * Runs a repeat or stack layout with the document's unit, or, when the layout chooses, with the first of
 * autoUnits that fits the page: a larger unit is tried only when the smaller one leaves no room.
 */
export function withFittingUnit<T>(ctx: LayoutContext, opts: UnitOptions, attempt: (opts: UnitOptions) => T): T {
  if (ctx.spec.encoding.unit !== undefined) return attempt(opts);
  const units = autoUnits(ctx.spec, opts);
  const warningsBefore = ctx.warnings.length;
  for (let k = 0; ; k++) {
    try {
      return attempt({ ...opts, unit: units[k] });
    } catch (e) {
      if (!(isTallyError(e) && e.code === 'layout-no-room') || k >= units.length - 1) throw e;
      ctx.warnings.length = warningsBefore;
    }
  }
}
