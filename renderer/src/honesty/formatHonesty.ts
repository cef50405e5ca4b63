// Numbers of the honesty check as a reader should see them: rounded for reading, but never so far
// that a failing lie factor prints as a passing one.

/** A lie factor with 3 decimals, more when 3 would move a value across a limit (1.0504 must not read 1.050). */
export function formatFactor(value: number | null, limits: { low: number; high: number }): string {
  if (value === null || !Number.isFinite(value)) return '—';
  const inside = (v: number) => v >= limits.low && v <= limits.high;
  let digits = 3;
  let text = value.toFixed(digits);
  while (digits < 8 && inside(Number(text)) !== inside(value)) {
    digits += 1;
    text = value.toFixed(digits);
  }
  return text;
}

const READINGS: Record<string, string> = {
  count: 'the number of glyphs, partial glyphs counted by their ink',
  length: 'the height of each stack, one pitch per glyph',
  area: 'the ink area of each glyph',
  fill: 'the filled share of each glyph’s ink',
};

export function readingSentence(reading: string): string {
  return READINGS[reading] ?? reading;
}

/** The measured quantity with its unit: "8.4 glyphs", "42.0 mm", "310 mm²", "82.0%". */
export function formatGraphic(value: number, unit: 'glyphs' | 'mm' | 'mm2' | 'share'): string {
  switch (unit) {
    case 'glyphs':
      return `${trimmed(value, 2)} ${Math.abs(value - 1) < 1e-9 ? 'glyph' : 'glyphs'}`;
    case 'mm':
      return `${trimmed(value, 1)} mm`;
    case 'mm2':
      return `${trimmed(value, value >= 100 ? 0 : 1)} mm²`;
    case 'share':
      return `${trimmed(value * 100, 1)}%`;
  }
}

/** The measured quantity as a bare number for a table whose heading names the unit. */
export function formatDrawn(value: number, unit: 'glyphs' | 'mm' | 'mm2' | 'share'): string {
  switch (unit) {
    case 'glyphs':
      return trimmed(value, 2);
    case 'mm':
      return trimmed(value, 1);
    case 'mm2':
      return trimmed(value, value >= 100 ? 0 : 1);
    case 'share':
      return `${trimmed(value * 100, 1)}%`;
  }
}

/** A data value for reading: up to 6 significant digits, thousands grouped. */
export function formatValue(value: number): string {
  return Number(value.toPrecision(6)).toLocaleString('en-US', { maximumFractionDigits: 6 });
}

function trimmed(value: number, decimals: number): string {
  return Number(value.toFixed(decimals)).toLocaleString('en-US', { maximumFractionDigits: decimals, minimumFractionDigits: 0 });
}

/**
 * Where a lie factor sits on the meter, 0..1, with the faithful band in the middle third: the
 * scale is logarithmic so 0.9 and 1/0.9 sit equally far from 1.
 */
export function meterPosition(value: number, limits: { low: number; high: number }): number {
  const span = 3 * Math.max(Math.log(limits.high), -Math.log(limits.low));
  if (!(value > 0) || !Number.isFinite(value)) return value > 0 ? 1 : 0;
  const t = 0.5 + Math.log(value) / span;
  return Math.min(1, Math.max(0, t));
}

/** Pixels of ink in a glyph of `inkMm2` at a resolution: area in mm² times (ppi / 25.4)². */
export function inkPixels(inkMm2: number, ppi: number): number {
  return inkMm2 * (ppi / 25.4) ** 2;
}

/** A ratio rounded for the formula: trailing zeros dropped, thousands grouped. */
function ratioWithDigits(value: number, digits: number): string {
  return Number(value.toFixed(digits)).toLocaleString('en-US', { maximumFractionDigits: digits, minimumFractionDigits: 0 });
}

/** At least 2 decimals, and enough that a ratio's distance from 1 keeps 2 significant digits. */
function baseDigits(value: number): number {
  const distance = Math.abs(value - 1);
  return distance > 0 ? Math.min(6, Math.max(2, Math.ceil(-Math.log10(distance)) + 1)) : 2;
}

/**
 * The lie factor written out the way it is computed, so a reader can redo it: Tufte's effect form
 * (The Visual Display of Quantitative Information, 1983, p. 57), (shown ratio − 1) ÷ (data ratio − 1),
 * or the ratio form, shown ratio ÷ data ratio, used when the values differ by less than 2%. The ratios
 * get more decimals where fewer would make the written-out division give another figure than the one shown.
 */
export function effectFormula(graphicRatio: number, dataRatio: number, basis: 'effect' | 'ratio'): string {
  if (!Number.isFinite(graphicRatio) || !Number.isFinite(dataRatio)) return '';
  const form = (g: number, d: number) => (basis === 'ratio' ? g / d : (g - 1) / (d - 1));
  const target = form(graphicRatio, dataRatio).toFixed(3);
  let gDigits = baseDigits(graphicRatio);
  let dDigits = baseDigits(dataRatio);
  for (let extra = 0; extra < 4; extra++) {
    const g = Number(graphicRatio.toFixed(gDigits));
    const d = Number(dataRatio.toFixed(dDigits));
    if (form(g, d).toFixed(3) === target) break;
    gDigits = Math.min(8, gDigits + 1);
    dDigits = Math.min(8, dDigits + 1);
  }
  const g = ratioWithDigits(graphicRatio, gDigits);
  const d = ratioWithDigits(dataRatio, dDigits);
  return basis === 'ratio' ? `${g} ÷ ${d}` : `(${g} − 1) ÷ (${d} − 1)`;
}
/** The row's effect formula against the reference row, or null when there is nothing to compare. */
export function rowFormula(
  row: { graphic: number; value: number; lieFactor: number | null; basis: 'effect' | 'ratio' | null },
  reference: { graphic: number; value: number } | undefined,
): string | null {
  if (!reference || row.lieFactor === null || row.basis === null || !(reference.graphic > 0) || !(reference.value > 0)) return null;
  return effectFormula(row.graphic / reference.graphic, row.value / reference.value, row.basis) || null;
}
