import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { lieFactors, RATIO_BASIS_BELOW } from '../../../shared-core/integrity/index';
import { TallyError } from '../../../shared-core/errors';

// Tufte, The Visual Display of Quantitative Information (1983), ch. 2 "Graphical Integrity".
// An effect of +454% means the second value is 1 + 4.54 times the first.
const fromEffect = (effect: number): number => 1 + effect;

describe('lieFactors on Tufte\'s worked examples', () => {
  it('barrels: data +454%, drawing +4,280% gives the book\'s 9.4 (p. 62)', () => {
    const report = lieFactors([
      { label: 'first', data: 1, graphic: 1 },
      { label: 'second', data: fromEffect(4.54), graphic: fromEffect(42.8) },
    ]);
    const pair = report.pairs[0];
    expect(pair.basis).toBe('effect');
    expect(pair.dataEffect).toBeCloseTo(4.54, 12);
    // The book prints one decimal.
    expect(Math.abs((pair.lieFactor as number) - 9.4)).toBeLessThan(0.05);
  });

  it('derricks: $1.80 to $14.54 is +708%, drawn +6,700%: lie factor 9.5 (p. 62)', () => {
    const report = lieFactors([
      { label: '1958', data: 1.8, graphic: 1 },
      { label: '1978', data: 14.54, graphic: fromEffect(67) },
    ]);
    const pair = report.pairs[0];
    expect(Math.round(pair.dataEffect * 100)).toBe(708);
    expect(Math.abs((pair.lieFactor as number) - 9.5)).toBeLessThan(0.05);
  });

  it('barrels read by volume: +27,000% against +454% is 27000/454 = 59.47 (p. 71; the book truncates to 59.4)', () => {
    const report = lieFactors([
      { label: 'first', data: 1, graphic: 1 },
      { label: 'second', data: fromEffect(4.54), graphic: fromEffect(270) },
    ]);
    expect(report.pairs[0].lieFactor).toBeCloseTo(59.47, 2);
    expect(Math.trunc((report.pairs[0].lieFactor as number) * 10) / 10).toBe(59.4);
  });

  it('shrinking banknote: 1.00 to 0.44 drawn by area; the small note should be 0.44/0.44^2 = 2.27x as big (p. 70)', () => {
    const report = lieFactors([
      { label: 'earlier', data: 1, graphic: 1 },
      { label: 'later', data: 0.44, graphic: 0.44 * 0.44 },
    ]);
    expect(report.reference).toBe('later');
    expect(report.pairs[0].ratioLieFactor).toBeCloseTo(2.27, 2);
  });
});

describe('lieFactors report shape', () => {
  it('measures every category against the smallest positive value, wherever it sits', () => {
    const report = lieFactors([
      { label: 'B', data: 5, graphic: 5 },
      { label: 'A', data: 2, graphic: 2 },
      { label: 'Z', data: 0, graphic: 0 },
      { label: 'C', data: 8, graphic: 8 },
    ]);
    expect(report.reference).toBe('A');
    expect(report.pairs.map((p) => p.label)).toEqual(['B', 'C']);
    expect(report.pairs.every((p) => p.reference === 'A')).toBe(true);
    expect(report.zeros).toEqual([{ label: 'Z', graphic: 0, drawnAsZero: true }]);
  });

  it('reads height scaling as area: values 1, 2, 3 drawn with areas 1, 4, 9 give lie factors 3 and 4 and spread 3', () => {
    // Scaling a glyph's height (and width with it) by the value makes its area grow with the square.
    const report = lieFactors([1, 2, 3].map((v) => ({ label: `v${v}`, data: v, graphic: v * v })));
    // Effects: data +100% / +200%, area +300% / +800%.
    expect(report.pairs[0].lieFactor).toBeCloseTo(3, 12);
    expect(report.pairs[1].lieFactor).toBeCloseTo(4, 12);
    expect(report.worst?.label).toBe('v3');
    expect(report.spread).toBeCloseTo(3, 12);
    expect(report.spreadBetween).toEqual({ highest: 'v3', lowest: 'v1' });
  });

  it('ranks the worst pair in log terms: 0.5 and 2 are equally bad, 0.4 is worse than 2', () => {
    const even = lieFactors([
      { label: 'ref', data: 1, graphic: 1 },
      { label: 'half', data: 2, graphic: 1.5 }, // effect 0.5 / 1
      { label: 'double', data: 3, graphic: 5 }, // effect 4 / 2
    ]);
    expect(even.pairs[0].lieFactor).toBeCloseTo(0.5, 12);
    expect(even.pairs[1].lieFactor).toBeCloseTo(2, 12);
    expect(even.pairs[0].severity).toBeCloseTo(even.pairs[1].severity, 12);

    const report = lieFactors([
      { label: 'ref', data: 1, graphic: 1 },
      { label: 'under', data: 2, graphic: 1.4 }, // 0.4: |ln| 0.916, |LF - 1| 0.6
      { label: 'over', data: 3, graphic: 5 }, // 2.0: |ln| 0.693, |LF - 1| 1.0
    ]);
    expect(report.worst?.label).toBe('under');
  });
});

describe('lieFactors edge cases', () => {
  it('equal values compare ratios and report the graphic\'s own difference', () => {
    const report = lieFactors([
      { label: 'A', data: 10, graphic: 10 },
      { label: 'B', data: 10, graphic: 12 },
    ]);
    const pair = report.pairs[0];
    expect(pair.dataEffect).toBe(0);
    expect(pair.basis).toBe('ratio');
    expect(pair.graphicEffect).toBeCloseTo(0.2, 12);
    expect(pair.lieFactor).toBeCloseTo(1.2, 12);
  });

  it('equal values drawn equal give exactly 1', () => {
    const report = lieFactors([
      { label: 'A', data: 3, graphic: 7 },
      { label: 'B', data: 3, graphic: 7 },
    ]);
    expect(report.pairs[0].lieFactor).toBe(1);
    expect(report.spread).toBe(1);
  });

  it('a 0.1% data difference with 0.02% measurement noise uses the stable ratio basis', () => {
    // On the effect basis this would be 0.12 / 0.1 = 1.2 from noise alone.
    const noise = 2e-4;
    const report = lieFactors([
      { label: 'A', data: 1000, graphic: 1000 },
      { label: 'B', data: 1001, graphic: 1001 * (1 + noise) },
    ]);
    const pair = report.pairs[0];
    expect(pair.basis).toBe('ratio');
    expect(Math.abs((pair.lieFactor as number) - 1)).toBeLessThan(1e-3);
    expect(pair.ratioLieFactor).toBe(pair.lieFactor);
  });

  it('switches basis at the documented threshold: just below uses ratio, at it uses effect', () => {
    expect(RATIO_BASIS_BELOW).toBe(0.02);
    const below = lieFactors([
      { label: 'A', data: 100, graphic: 100 },
      { label: 'B', data: 101.9, graphic: 101.9 },
    ]);
    const at = lieFactors([
      { label: 'A', data: 100, graphic: 100 },
      { label: 'B', data: 102, graphic: 102 },
    ]);
    expect(below.pairs[0].basis).toBe('ratio');
    expect(at.pairs[0].basis).toBe('effect');
    expect(lieFactors([{ label: 'A', data: 100, graphic: 100 }, { label: 'B', data: 101.9, graphic: 101.9 }], { ratioBasisBelow: 0 }).pairs[0].basis).toBe('effect');
  });

  it('a zero must be drawn as nothing; ink on a zero is a finding', () => {
    const report = lieFactors([
      { label: 'A', data: 4, graphic: 4 },
      { label: 'none', data: 0, graphic: 0 },
      { label: 'ghost', data: 0, graphic: 0.5 },
    ]);
    expect(report.zeros).toEqual([
      { label: 'none', graphic: 0, drawnAsZero: true },
      { label: 'ghost', graphic: 0.5, drawnAsZero: false },
    ]);
    expect(report.pairs).toEqual([]);
  });

  it('all zeros: no reference, no pair, spread 1, and a note saying why', () => {
    const report = lieFactors([
      { label: 'A', data: 0, graphic: 0 },
      { label: 'B', data: 0, graphic: 0 },
    ]);
    expect(report.reference).toBeNull();
    expect(report.pairs).toEqual([]);
    expect(report.worst).toBeNull();
    expect(report.spread).toBe(1);
    expect(report.zeros.every((z) => z.drawnAsZero)).toBe(true);
    expect(report.notes.join(' ')).toMatch(/no lie factor is defined/);
  });

  it('a single category has no pair: lie factor undefined, spread 1', () => {
    const report = lieFactors([{ label: 'Only', data: 12, graphic: 30 }]);
    expect(report.reference).toBe('Only');
    expect(report.pairs).toEqual([]);
    expect(report.worst).toBeNull();
    expect(report.spread).toBe(1);
    expect(report.notes[0]).toMatch(/Only.*not defined/);
  });

  it('a positive value drawn as nothing: the pair says so and the spread is unbounded (null)', () => {
    const report = lieFactors([
      { label: 'A', data: 1, graphic: 1 },
      { label: 'B', data: 2, graphic: 0 },
    ]);
    expect(report.pairs[0].problem).toBe('not-drawn');
    expect(report.pairs[0].severity).toBe(Infinity);
    expect(report.notDrawn).toEqual(['B']);
    expect(report.spread).toBeNull();
  });

  it('a reference drawn as nothing gives no number rather than a division by zero', () => {
    const report = lieFactors([
      { label: 'A', data: 1, graphic: 0 },
      { label: 'B', data: 2, graphic: 2 },
    ]);
    const pair = report.pairs[0];
    expect(pair.problem).toBe('reference-not-drawn');
    expect(pair.lieFactor).toBeNull();
    expect(pair.graphicRatio).toBeNull();
    expect(report.worst).toBe(pair);
  });

  it('a graphic that shrinks while the data grow has a negative lie factor, flagged as the wrong direction', () => {
    const report = lieFactors([
      { label: 'A', data: 1, graphic: 1 },
      { label: 'B', data: 2, graphic: 0.5 },
    ]);
    expect(report.pairs[0].lieFactor).toBeCloseTo(-0.5, 12);
    expect(report.pairs[0].problem).toBe('wrong-direction');
    expect(report.pairs[0].severity).toBe(Infinity);
  });

  it('refuses negative values, saying why they cannot be drawn', () => {
    const call = () => lieFactors([{ label: 'A', data: 1, graphic: 1 }, { label: 'Loss', data: -3, graphic: 1 }]);
    expect(call).toThrow(TallyError);
    expect(call).toThrow(/"Loss".*negative.*No count, area or length of ink/);
    try {
      call();
    } catch (e) {
      expect((e as TallyError).code).toBe('data-invalid');
    }
  });

  it('refuses NaN and infinite values and measurements', () => {
    for (const bad of [NaN, Infinity, -Infinity]) {
      expect(() => lieFactors([{ label: 'A', data: bad, graphic: 1 }, { label: 'B', data: 1, graphic: 1 }])).toThrow(/finite/);
      expect(() => lieFactors([{ label: 'A', data: 1, graphic: bad }, { label: 'B', data: 1, graphic: 1 }])).toThrow(/finite/);
    }
    expect(() => lieFactors([{ label: 'A', data: 1, graphic: -1 }])).toThrow(/cannot be negative/);
    expect(() => lieFactors([])).toThrow(/no categories/);
  });
});

describe('lieFactors property', () => {
  it('a graphic exactly proportional to the data gives lie factor 1 +/- 1e-9 for every pair and spread 1', () => {
    const value = fc.oneof(fc.constant(0), fc.double({ min: 1e-6, max: 1e9, noNaN: true, noDefaultInfinity: true }));
    fc.assert(
      fc.property(fc.array(value, { minLength: 1, maxLength: 30 }), fc.double({ min: 1e-3, max: 1e3, noNaN: true }), (values, k) => {
        const report = lieFactors(values.map((v, i) => ({ label: `c${i}`, data: v, graphic: k * v })));
        for (const pair of report.pairs) {
          expect(Math.abs((pair.lieFactor as number) - 1)).toBeLessThanOrEqual(1e-9);
          expect(Math.abs((pair.ratioLieFactor as number) - 1)).toBeLessThanOrEqual(1e-9);
        }
        expect(Math.abs((report.spread as number) - 1)).toBeLessThanOrEqual(1e-9);
        expect(report.zeros.every((z) => z.drawnAsZero)).toBe(true);
      }),
      { numRuns: 300 },
    );
  });
});
