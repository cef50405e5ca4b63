import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { assertGlyphBudget, chooseUnit } from '../../../shared-core/layout/chooseUnit';
import { TallyError } from '../../../shared-core/errors';

// An independent list of readable units, 1, 2, 2.5 and 5 x 10^k, written out as decimal
// literals so that no arithmetic of the module under test is reused.
const READABLE = [
  '1e-4', '2e-4', '2.5e-4', '5e-4', '1e-3', '2e-3', '2.5e-3', '5e-3', '0.01', '0.02', '0.025', '0.05', '0.1', '0.2', '0.25', '0.5',
  '1', '2', '2.5', '5', '10', '20', '25', '50', '100', '200', '250', '500', '1e3', '2e3', '2.5e3', '5e3', '1e4', '2e4', '2.5e4', '5e4',
  '1e5', '2e5', '2.5e5', '5e5', '1e6', '2e6', '2.5e6', '5e6', '1e7', '2e7', '2.5e7', '5e7', '1e8', '2e8', '2.5e8', '5e8', '1e9',
].map(Number);

describe('chooseUnit', () => {
  it('picks the smallest readable unit that keeps the largest category at or under 50 glyphs', () => {
    expect(chooseUnit([7.5, 22.5]).unit).toBe(0.5); // 45 glyphs; 0.25 would need 90
    expect(chooseUnit([50]).unit).toBe(1); // exactly 50 is allowed
    expect(chooseUnit([51]).unit).toBe(2); // 25.5 glyphs
    expect(chooseUnit([120]).unit).toBe(2.5); // 48 glyphs; 2 would need 60
    expect(chooseUnit([1e9]).unit).toBe(2e7); // 50 glyphs
    expect(chooseUnit([0.3]).unit).toBe(0.01); // 30 glyphs, not 29.999999999999996
    expect(chooseUnit([0.3]).glyphCounts).toEqual([30]);
  });

  it('honours maxGlyphsPerCategory and minUnit', () => {
    expect(chooseUnit([1000], { maxGlyphsPerCategory: 10 }).unit).toBe(100);
    expect(chooseUnit([7.5, 22.5], { minUnit: 1 }).unit).toBe(1);
    expect(chooseUnit([300], { minUnit: 1 }).unit).toBe(10);
  });

  it('reports exact glyph counts and what whole-glyph rounding would change', () => {
    const choice = chooseUnit([7.5, 22.5, 3], { minUnit: 1, labels: ['Station A', 'Station B', 'Station C'] });
    expect(choice.glyphCounts).toEqual([7.5, 22.5, 3]);
    expect(choice.roundingErrors[0]).toEqual({ label: 'Station A', exact: 7.5, whole: 8, error: 0.5, relativeError: 0.5 / 7.5 });
    expect(choice.roundingErrors[2]).toEqual({ label: 'Station C', exact: 3, whole: 3, error: 0, relativeError: 0 });
  });

  it('copes with zeros and refuses negative or non-finite values', () => {
    expect(chooseUnit([0, 0])).toEqual({
      unit: 1,
      glyphCounts: [0, 0],
      roundingErrors: [
        { exact: 0, whole: 0, error: 0, relativeError: 0 },
        { exact: 0, whole: 0, error: 0, relativeError: 0 },
      ],
    });
    expect(() => chooseUnit([3, -1])).toThrow(TallyError);
    expect(() => chooseUnit([3, -1], { labels: ['a', 'Loss'] })).toThrow(/"Loss" is negative/);
    expect(() => chooseUnit([Number.NaN])).toThrow(/finite/);
    expect(() => chooseUnit([])).toThrow(/no values/);
    expect(() => chooseUnit([1], { maxGlyphsPerCategory: 0 })).toThrow(/at least 1/);
  });

  it('agrees with a brute-force search over the written-out readable units', () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: 0, max: 4e10, noNaN: true }), { minLength: 1, maxLength: 8 }),
        fc.integer({ min: 1, max: 200 }),
        (values, maxGlyphs) => {
          const largest = Math.max(...values);
          fc.pre(largest / READABLE[0] > maxGlyphs);
          const expected = READABLE.find((u) => largest / u <= maxGlyphs * (1 + 1e-12));
          fc.pre(expected !== undefined);
          expect(chooseUnit(values, { maxGlyphsPerCategory: maxGlyphs }).unit).toBe(expected);
        },
      ),
      { numRuns: 400 },
    );
  });
});

describe('assertGlyphBudget', () => {
  it('counts a partial glyph as one glyph slot', () => {
    expect(assertGlyphBudget([7.5, 22.5], 1)).toEqual({ glyphsTotal: 31 });
  });

  it('refuses 10^9 at one per glyph and suggests the smallest readable unit that fits 2,000 glyphs', () => {
    let error: TallyError | undefined;
    try {
      assertGlyphBudget([1e9], 1);
    } catch (e) {
      error = e as TallyError;
    }
    expect(error).toBeInstanceOf(TallyError);
    expect(error?.code).toBe('data-invalid');
    // 1e9 / 2,000 = 500,000 exactly; the readable unit below it, 250,000, would need 4,000.
    expect(error?.message).toMatch(/1,000,000,000 glyphs; the limit is 2,000\. Use a unit of 500,000 or more/);
    expect((error?.details as { suggestedUnit: number }).suggestedUnit).toBe(5e5);
  });

  it('accounts for rounding up partial glyphs when it suggests a unit', () => {
    // 30 categories of 10.5 at unit 1 need 11 slots each (330); at unit 2, 6 each (180).
    const values = Array.from({ length: 30 }, () => 10.5);
    expect(() => assertGlyphBudget(values, 1, { maxGlyphsTotal: 200 })).toThrow(/Use a unit of 2 or more \(180 glyphs\)/);
  });

  it('says when no unit can fit because there are more categories than glyphs', () => {
    expect(() => assertGlyphBudget(Array.from({ length: 5 }, () => 1), 1, { maxGlyphsTotal: 3 })).toThrow(/Split it into several charts/);
  });

  it('refuses an impossible unit', () => {
    expect(() => assertGlyphBudget([1], 0)).toThrow(/greater than 0/);
    expect(() => assertGlyphBudget([1], Number.POSITIVE_INFINITY)).toThrow(/greater than 0/);
  });
});
