// Numbers as a reader should see them: rounded for reading, never rounded across the 0.95–1.05 line.
import { DISTORTION_LIMITS } from '../integrity';

const within = (v: number) => v >= DISTORTION_LIMITS.low - 1e-12 && v <= DISTORTION_LIMITS.high + 1e-12;

/** A lie factor with two decimals, or more when two would make a failing value read as passing. */
export function formatFactor(v: number | null): string {
  if (v === null || !Number.isFinite(v)) return 'n/a';
  let digits = Math.abs(v) >= 100 ? 0 : Math.abs(v) >= 10 ? 1 : 2;
  let text = v.toFixed(digits);
  while (digits < 8 && !within(v) && within(Number(text))) {
    digits += 1;
    text = v.toFixed(digits);
  }
  return text;
}

/** A measurement with about four significant digits, without exponent for everyday sizes. */
export function formatMeasure(v: number | null | undefined): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return 'n/a';
  if (v === 0) return '0';
  const a = Math.abs(v);
  if (a >= 1e7 || a < 1e-3) return v.toPrecision(4);
  const digits = Math.max(0, 3 - Math.floor(Math.log10(a)));
  return Number(v.toFixed(digits)).toString();
}

/** A ratio such as ×5.54 or ×43.8. */
export function formatRatio(v: number | null): string {
  if (v === null || !Number.isFinite(v)) return 'n/a';
  return v >= 100 ? v.toFixed(0) : v >= 10 ? v.toFixed(1) : v.toFixed(2);
}
