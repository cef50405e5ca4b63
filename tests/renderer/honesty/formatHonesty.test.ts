import { describe, expect, it } from 'vitest';
import { formatFactor, formatGraphic, inkPixels, meterPosition } from '../../../renderer/src/honesty/formatHonesty';

// Tufte, The Visual Display of Quantitative Information (1983), p. 57: 0.95 and 1.05 bound a faithful graphic.
const LIMITS = { low: 0.95, high: 1.05 };

describe('formatFactor', () => {
  it('rounds to three decimals for reading', () => {
    expect(formatFactor(1.0000131, LIMITS)).toBe('1.000');
    expect(formatFactor(1.928571, LIMITS)).toBe('1.929');
    expect(formatFactor(null, LIMITS)).toBe('—');
  });

  it('never prints a failing factor as a passing one', () => {
    // 1.0504 is outside 1.05 but rounds to "1.050", which reads as inside.
    const text = formatFactor(1.0504, LIMITS);
    expect(Number(text)).toBeGreaterThan(1.05);
    expect(Number(formatFactor(0.94996, LIMITS))).toBeLessThan(0.95);
    // And a passing value close to a limit stays short.
    expect(formatFactor(1.0496, LIMITS)).toBe('1.050');
  });
});

describe('meterPosition', () => {
  it('puts 1 in the middle and x and 1/x equally far from it (log scale)', () => {
    expect(meterPosition(1, LIMITS)).toBeCloseTo(0.5, 12);
    const up = meterPosition(1.04, LIMITS) - 0.5;
    const down = 0.5 - meterPosition(1 / 1.04, LIMITS);
    expect(up).toBeCloseTo(down, 12);
    expect(meterPosition(10, LIMITS)).toBe(1);
    expect(meterPosition(0, LIMITS)).toBe(0);
  });
});

describe('inkPixels', () => {
  it('converts mm² to pixels at a resolution: 1 in² is 300 x 300 px at 300 ppi (1 in = 25.4 mm)', () => {
    expect(inkPixels(25.4 * 25.4, 300)).toBeCloseTo(90_000, 6);
  });
});

describe('formatGraphic', () => {
  it('names the unit of each reading', () => {
    expect(formatGraphic(8.4, 'glyphs')).toBe('8.4 glyphs');
    expect(formatGraphic(1, 'glyphs')).toBe('1 glyph');
    expect(formatGraphic(0.82, 'share')).toBe('82%');
    expect(formatGraphic(310.4, 'mm2')).toBe('310 mm²');
  });
});
