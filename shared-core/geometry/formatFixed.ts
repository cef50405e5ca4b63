// Coordinates as text with a fixed number of decimals and no trailing zeros: the one number format of
// written path data and positions. A chart of 100,000 glyphs formats millions of numbers, so this avoids
// regular expressions and gives integers a shortcut, while returning exactly the text of the plain form
// (toFixed, then trailing zeros and a bare point removed, "-0" as "0"; see formatFixedPlain).

/** The plain form, kept as the definition the fast one must match byte for byte (and for the rare cases). */
export function formatFixedPlain(n: number, decimals: number): string {
  const s = n.toFixed(decimals);
  const trimmed = s.includes('.') ? s.replace(/0+$/, '').replace(/\.$/, '') : s;
  return trimmed === '-0' ? '0' : trimmed;
}

/** `n` with `decimals` (0 to 100) decimals, trailing zeros and a bare point dropped, negative zero as "0". */
export function formatFixed(n: number, decimals: number): string {
  // toFixed switches to exponent notation at 1e21 (where trimming would cut into the exponent): the plain form
  // keeps that behaviour, as it does for NaN and the infinities.
  if (!(n > -1e21 && n < 1e21)) return formatFixedPlain(n, decimals);
  // A whole number up to 2^53 is written by toFixed as its digits then ".000…", which trims to exactly what
  // String gives (larger ones differ: String writes the shortest digits that read back, toFixed the exact value).
  if (Number.isSafeInteger(n)) return n === 0 ? '0' : String(n);
  if (decimals <= 6) {
    const quick = formatByScaling(n, decimals);
    if (quick !== null) return quick;
  }
  const s = n.toFixed(decimals);
  if (decimals === 0) return s === '-0' ? '0' : s;
  // Below 1e21 toFixed with decimals always writes a point; drop the zeros after it, then the point itself.
  let end = s.length;
  while (s.charCodeAt(end - 1) === 48 /* 0 */) end -= 1;
  if (s.charCodeAt(end - 1) === 46 /* . */) end -= 1;
  if (end === s.length) return s;
  // Only a value that rounds to zero trims to "-0".
  return end === 2 && s.charCodeAt(0) === 45 /* - */ && s.charCodeAt(1) === 48 ? '0' : s.slice(0, end);
}

const POWERS_OF_TEN = [1, 10, 100, 1e3, 1e4, 1e5, 1e6];

/**
 * toFixed rounds the exact value of |n| times 10^decimals to the nearest integer, halves up (ECMA-262,
 * Number.prototype.toFixed). Multiplying in doubles is off by at most half a unit in the last place, so
 * wherever the product is clearly away from a half (by more than 1e-15 of itself, several such units) the
 * rounded product is that same integer and the digits follow from integer arithmetic, exact below 2^53.
 * Null near a half and for large values: the caller then asks toFixed.
 */
function formatByScaling(n: number, decimals: number): string | null {
  const negative = n < 0;
  const scale = POWERS_OF_TEN[decimals];
  const scaled = (negative ? -n : n) * scale;
  if (!(scaled < 1e15)) return null;
  const whole = Math.floor(scaled);
  const above = scaled - whole; // exact: below 2^52 the fraction of a double is a double
  if (Math.abs(above - 0.5) <= scaled * 1e-15) return null;
  const rounded = above > 0.5 ? whole + 1 : whole;
  if (rounded === 0) return '0';
  const sign = negative ? '-' : '';
  if (decimals === 0) return sign + String(rounded);
  let fraction = rounded % scale;
  const integer = (rounded - fraction) / scale; // an exact multiple divided: exact
  if (fraction === 0) return sign + String(integer);
  let digits = decimals;
  while (fraction % 10 === 0) {
    fraction /= 10;
    digits -= 1;
  }
  return sign + String(integer) + '.' + String(fraction).padStart(digits, '0');
}
