// The fast coordinate formatter must write exactly what the writer wrote before it existed: toFixed, then
// trailing zeros and a bare point removed, "-0" as "0". Checked against a verbatim copy of that code on
// 100,000 numbers chosen to hit its corners (rounding halves, tiny, huge, whole, negative zero).
import { describe, expect, it } from 'vitest';
import { formatFixed, formatFixedPlain } from '../../../shared-core/geometry/formatFixed';
import { regionToPathData } from '../../../shared-core/geometry/region';

/** Verbatim the number writer of writeSvg and regionToPathData before the fast formatter. */
function formatBefore(n: number, decimals: number): string {
  const s = n.toFixed(decimals);
  const trimmed = s.includes('.') ? s.replace(/0+$/, '').replace(/\.$/, '') : s;
  return trimmed === '-0' ? '0' : trimmed;
}

/** Small seeded generator (mulberry32), so a failure can be replayed. */
function random(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** The neighbouring doubles of x (one unit in the last place either side). */
function neighbours(x: number): [number, number] {
  const f = new Float64Array([x]);
  const bits = new BigInt64Array(f.buffer);
  const up = new Float64Array(new BigInt64Array([bits[0] + 1n]).buffer)[0];
  const down = new Float64Array(new BigInt64Array([bits[0] - 1n]).buffer)[0];
  return [down, up];
}

function sample(rand: () => number): number {
  const sign = rand() < 0.5 ? -1 : 1;
  const kind = Math.floor(rand() * 7);
  const decimalsForEdge = Math.floor(rand() * 7);
  switch (kind) {
    case 0: // ordinary page coordinates in mm
      return sign * rand() * 2000;
    case 1: // tiny: many round to zero, some to "-0"
      return sign * 10 ** (-12 + rand() * 10);
    case 2: // huge, across the 1e21 switch to exponent notation and past 2^53
      return sign * 10 ** (12 + rand() * 14);
    case 3: { // exactly half a step at some number of decimals, and the doubles either side of it
      const half = (Math.floor(rand() * 1e6) + 0.5) / 10 ** decimalsForEdge;
      const [down, up] = neighbours(half);
      return sign * [half, down, up][Math.floor(rand() * 3)];
    }
    case 4: // whole numbers, small and beyond 2^53
      return sign * (rand() < 0.5 ? Math.floor(rand() * 1e6) : Math.floor(2 ** 53 * (1 + rand() * 2000)));
    case 5: // a whole number nudged by one unit in the last place
      return neighbours(sign * Math.floor(rand() * 1e4))[rand() < 0.5 ? 0 : 1];
    default: // values that trim to different lengths: k / 10^j
      return (sign * Math.floor(rand() * 1e7)) / 10 ** Math.floor(rand() * 8);
  }
}

describe('formatFixed', () => {
  it('equals the previous number writer on 100,000 random numbers at 0 to 6 decimals', () => {
    const rand = random(20261202);
    let mismatches = 0;
    const firstMismatches: string[] = [];
    for (let i = 0; i < 100_000; i++) {
      const n = sample(rand);
      const decimals = Math.floor(rand() * 7);
      const want = formatBefore(n, decimals);
      if (formatFixed(n, decimals) !== want || formatFixedPlain(n, decimals) !== want) {
        mismatches += 1;
        if (firstMismatches.length < 5) firstMismatches.push(`${n} at ${decimals}: ${formatFixed(n, decimals)} vs ${want}`);
      }
    }
    expect(firstMismatches).toEqual([]);
    expect(mismatches).toBe(0);
  });

  it('equals the previous writer on the special values', () => {
    const special = [0, -0, 1, -1, 0.5, -0.5, 2 ** 53, -(2 ** 53), 2 ** 53 + 2, 1e21, -1e21, 1.5e21, 1e30, 1.2e30, 5e-324, -5e-324, Number.MAX_VALUE, -Number.MAX_VALUE, NaN, Infinity, -Infinity, 0.0005, -0.0005, 0.00049999, -0.00049999];
    for (const n of special) for (let d = 0; d <= 6; d++) expect(formatFixed(n, d), `${n} at ${d}`).toBe(formatBefore(n, d));
  });

  it('rounds the exact binary value, as ECMAScript toFixed does', () => {
    // ECMA-262 Number.prototype.toFixed: n is the integer for which n / 10^f - x is as close to zero as
    // possible, x being the exact value of the double. 1.005 is stored as 1.00499999999999989...,
    // 2.675 as 2.67499999999999982..., and 1.0005 as 1.000499999999999945... (IEEE 754 binary64, exact
    // decimal expansions from Python's decimal module).
    expect(formatFixed(1.005, 2)).toBe('1');
    expect(formatFixed(2.675, 2)).toBe('2.67');
    expect(formatFixed(1.0005, 3)).toBe('1');
    // 0.125 is exact in binary and a tie: toFixed picks the larger n ("if there are two such n, pick the larger").
    expect(formatFixed(0.125, 2)).toBe('0.13');
    expect(formatFixed(-0.125, 2)).toBe('-0.13');
    // Trailing zeros and the point go; a value that rounds to zero is "0", never "-0".
    expect(formatFixed(12.5, 3)).toBe('12.5');
    expect(formatFixed(-0.0004, 3)).toBe('0');
    expect(formatFixed(-7, 3)).toBe('-7');
  });
});

describe('regionToPathData', () => {
  it('writes one M…Z per ring of at least three points, with the formatter\'s numbers', () => {
    const region = [
      [{ x: 0, y: 0 }, { x: 10.0004, y: -0 }, { x: 10.5, y: 2.0005 }],
      [{ x: 1, y: 1 }, { x: 2, y: 2 }], // too short to enclose anything: left out
      [{ x: -1.23456, y: 1e-9 }, { x: -2, y: 3 }, { x: 4, y: 5.1 }, { x: 6, y: 7 }],
    ];
    // 2.0005 is stored just above the half (2.000500000000000166...), so three decimals give 2.001.
    expect(regionToPathData(region, 3)).toBe('M0 0L10 0L10.5 2.001ZM-1.235 0L-2 3L4 5.1L6 7Z');
    expect(regionToPathData([], 3)).toBe('');
  });
});
