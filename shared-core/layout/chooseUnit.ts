// Picks how much one glyph stands for: a readable amount (1, 2, 2.5 or 5 times a power of ten)
// that keeps every category to a countable number of glyphs, and guards the total glyph budget.

import { TallyError } from '../errors';

/** Units a reader can multiply in their head: m x 10^k. */
export const READABLE_MANTISSAS: readonly number[] = Object.freeze([1, 2, 2.5, 5]);

export interface ChooseUnitOptions {
  /** The largest category may use at most this many glyphs. Default 50. */
  maxGlyphsPerCategory?: number;
  /** Labels for the rounding report, in the order of the values. */
  labels?: readonly string[];
  /** Never choose a unit below this, e.g. 1 when the data count whole things. */
  minUnit?: number;
}

export interface RoundingError {
  label?: string;
  /** value / unit: the glyphs drawn when remainders are cut by ink. */
  exact: number;
  /** The nearest whole number of glyphs. */
  whole: number;
  /** whole - exact, in glyphs: what rounding to whole glyphs would add (+) or remove (-). */
  error: number;
  /** error / exact; 0 for a zero value. */
  relativeError: number;
}

export interface UnitChoice {
  unit: number;
  /** value / unit for each value, partial glyphs included. */
  glyphCounts: number[];
  roundingErrors: RoundingError[];
}

export interface GlyphBudgetOptions {
  /** Default 2000. */
  maxGlyphsTotal?: number;
  labels?: readonly string[];
}

/** Raised only inside withGlyphBudget (the benchmark draws charts beyond the app's limit). */
let glyphBudgetOverride: number | null = null;

/**
 * Runs `run` with a different total glyph budget, restoring the default afterwards. For measuring speed on
 * charts larger than a designer would draw; every check still runs.
 */
export function withGlyphBudget<T>(maxGlyphsTotal: number, run: () => T): T {
  const before = glyphBudgetOverride;
  glyphBudgetOverride = maxGlyphsTotal;
  try {
    return run();
  } finally {
    glyphBudgetOverride = before;
  }
}

// Counts are cleaned to 12 significant digits so that 0.3 / 0.01 (29.999999999999996 in binary
// floating point) counts as the 30 glyphs it means; no chart draws glyphs to the 12th digit.
function glyphsFor(value: number, unit: number): number {
  return Number((value / unit).toPrecision(12));
}

/** m x 10^k built by division for negative k, so that 0.05 is the double nearest 0.05. */
function readableUnit(mantissa: number, exponent: number): number {
  return exponent >= 0 ? mantissa * 10 ** exponent : mantissa / 10 ** -exponent;
}

/** Readable units in increasing order, starting just below `from`. */
function* readableUnitsFrom(from: number): Generator<number> {
  for (let k = Math.floor(Math.log10(from)) - 1; k < 400; k += 1) {
    for (const m of READABLE_MANTISSAS) yield readableUnit(m, k);
  }
}

/** The `count` readable units next to `from` (exclusive), going up or down. */
export function nextReadableUnits(from: number, count: number, way: 'up' | 'down'): number[] {
  const out: number[] = [];
  if (way === 'up') {
    for (const u of readableUnitsFrom(from)) {
      if (u > from * (1 + 1e-12)) out.push(u);
      if (out.length >= count) break;
    }
    return out;
  }
  const below: number[] = [];
  for (const u of readableUnitsFrom(from / 10 ** Math.ceil(count / READABLE_MANTISSAS.length + 1))) {
    if (u >= from * (1 - 1e-12)) break;
    below.push(u);
  }
  return below.reverse().slice(0, count);
}

function formatAmount(value: number): string {
  return value.toLocaleString('en-US', { maximumSignificantDigits: 12 });
}

function validateValues(values: readonly number[], labels: readonly string[] | undefined): void {
  if (!Array.isArray(values) || values.length === 0) throw new TallyError('data-invalid', 'There are no values to choose a unit for.');
  values.forEach((value, i) => {
    const name = labels?.[i] !== undefined ? `"${labels[i]}"` : `Value ${i + 1}`;
    if (typeof value !== 'number' || !Number.isFinite(value)) {
      throw new TallyError('data-invalid', `${name} is not a finite number (${String(value)}); every value must be a number.`);
    }
    if (value < 0) {
      throw new TallyError('data-invalid', `${name} is negative (${value}); a number of glyphs cannot show a negative amount.`);
    }
  });
}

function positiveLimit(value: number, name: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value) || value < 1) {
    throw new TallyError('usage', `${name} must be a finite number of at least 1 (got ${String(value)}).`);
  }
  return value;
}

/**
 * The smallest readable unit (1, 2, 2.5 or 5 x 10^k, k any integer) that keeps the largest
 * category at or under maxGlyphsPerCategory glyphs, with what whole-glyph rounding would cost.
 */
export function chooseUnit(values: readonly number[], opts: ChooseUnitOptions = {}): UnitChoice {
  const { labels } = opts;
  validateValues(values, labels);
  const maxGlyphs = positiveLimit(opts.maxGlyphsPerCategory ?? 50, 'maxGlyphsPerCategory');
  const minUnit = opts.minUnit;
  if (minUnit !== undefined && !(Number.isFinite(minUnit) && minUnit > 0)) {
    throw new TallyError('usage', `minUnit must be a finite number greater than 0 (got ${String(minUnit)}).`);
  }

  const largest = Math.max(...values);
  const floor = Math.max(largest / maxGlyphs, minUnit ?? 0);
  let unit = 1;
  if (floor > 0) {
    for (const candidate of readableUnitsFrom(floor)) {
      if (minUnit !== undefined && candidate < minUnit * (1 - 1e-12)) continue;
      if (glyphsFor(largest, candidate) <= maxGlyphs) {
        unit = candidate;
        break;
      }
    }
  }

  const glyphCounts = values.map((value) => glyphsFor(value, unit));
  const roundingErrors = glyphCounts.map((exact, i) => {
    const whole = Math.round(exact);
    const error = whole - exact;
    const entry: RoundingError = { exact, whole, error, relativeError: exact === 0 ? 0 : error / exact };
    if (labels?.[i] !== undefined) entry.label = labels[i];
    return entry;
  });
  return { unit, glyphCounts, roundingErrors };
}

/** Glyph slots a layout needs: a partial glyph takes a whole slot. */
function slotsFor(values: readonly number[], unit: number): number {
  let total = 0;
  for (const value of values) total += Math.ceil(glyphsFor(value, unit));
  return total;
}

/**
 * Refuses (TallyError 'data-invalid') a unit that would need more than maxGlyphsTotal glyphs,
 * suggesting the smallest readable unit that fits. Returns the number of glyphs otherwise.
 */
export function assertGlyphBudget(values: readonly number[], unit: number, opts: GlyphBudgetOptions = {}): { glyphsTotal: number } {
  validateValues(values, opts.labels);
  if (typeof unit !== 'number' || !Number.isFinite(unit) || !(unit > 0)) {
    throw new TallyError('data-invalid', `The unit must be a finite number greater than 0 (got ${String(unit)}).`);
  }
  const maxTotal = positiveLimit(opts.maxGlyphsTotal ?? glyphBudgetOverride ?? 2000, 'maxGlyphsTotal');
  const glyphsTotal = slotsFor(values, unit);
  if (glyphsTotal <= maxTotal) return { glyphsTotal };

  const drawn = values.filter((value) => value > 0).length;
  if (drawn > maxTotal) {
    throw new TallyError(
      'data-invalid',
      `This chart has ${formatAmount(drawn)} categories with a value, and each needs at least one glyph: more than the limit of ` +
        `${formatAmount(maxTotal)} glyphs whatever the unit. Split it into several charts.`,
      { glyphsTotal, maxGlyphsTotal: maxTotal },
    );
  }
  const sum = values.reduce((a, b) => a + b, 0);
  let suggestedUnit = unit;
  for (const candidate of readableUnitsFrom(sum / maxTotal)) {
    if (slotsFor(values, candidate) <= maxTotal) {
      suggestedUnit = candidate;
      break;
    }
  }
  throw new TallyError(
    'data-invalid',
    `At ${formatAmount(unit)} per glyph this chart would need ${formatAmount(glyphsTotal)} glyphs; the limit is ${formatAmount(maxTotal)}. ` +
      `Use a unit of ${formatAmount(suggestedUnit)} or more (${formatAmount(slotsFor(values, suggestedUnit))} glyphs).`,
    { glyphsTotal, maxGlyphsTotal: maxTotal, suggestedUnit },
  );
}
