import { describe, expect, it } from 'vitest';
import { effectFormula, formatFactor, formatGraphic, inkPixels, meterPosition, rowFormula } from '../../../renderer/src/honesty/formatHonesty';
import { shortReason, toUiWords } from '../../../renderer/src/honesty/findingWords';

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

describe('effectFormula', () => {
  it('writes the lie factor in the effect form it is computed from', () => {
    // Tufte (1983) p. 57: effect = (second - first) / first. Drawn 3x as many glyphs for a value 3.75x:
    // (3 - 1) / (3.75 - 1) = 0.727, not 3 / 3.75 = 0.80.
    expect(effectFormula(3, 3.75, 'effect')).toBe('(3 − 1) ÷ (3.75 − 1)');
    expect(2 / 2.75).toBeCloseTo(0.727, 3);
    // Close values use the ratio form, and keep enough digits to show how far from 1 they are.
    expect(effectFormula(1.012, 1.01, 'ratio')).toBe('1.012 ÷ 1.01');
    // Enough decimals that the division written out gives the figure shown: 2 / (2.04 - 1) = 1.923,
    // but 275/135 = 2.0370 and 2 / 1.037 = 1.929, the lie factor itself.
    expect(effectFormula(3, 275 / 135, 'effect')).toBe('(3 − 1) ÷ (2.037 − 1)');
    expect((2 / (275 / 135 - 1)).toFixed(3)).toBe('1.929');
  });

  it('takes a row against the reference row', () => {
    const reference = { graphic: 2, value: 40 };
    expect(rowFormula({ graphic: 6, value: 150, lieFactor: 0.727, basis: 'effect' }, reference)).toBe('(3 − 1) ÷ (3.75 − 1)');
    expect(rowFormula({ graphic: 6, value: 150, lieFactor: null, basis: null }, reference)).toBeNull();
  });
});

describe('findings in the app’s words', () => {
  it('replaces the file format’s setting names with the names on the controls', () => {
    expect(toUiWords('use partial glyphs cut by ink (rounding "ink-cut") or a smaller unit.')).toBe('use partial glyphs cut by ink (Remainders: Cut by ink) or a smaller unit.');
    expect(toUiWords('repeat or stack glyphs of one size instead (mode "repeat" or "stack").')).toBe('repeat or stack glyphs of one size instead (the Repeat or Stack mode).');
    expect(toUiWords('scale by ink area (mode "scale")')).toBe('scale by ink area (the Scale mode)');
  });

  it('names the first blocking finding for the toolbar, the lie factor only when that is the reason', () => {
    expect(shortReason({ code: 'lie-factor', message: 'x' }, '0.733')).toBe('lie factor 0.733');
    const white = { code: 'file-mismatch', message: '"Harbour Gate" is painted in the colour of the page (#ffffff), so a reader sees nothing of it; give it a colour that shows.' };
    expect(shortReason(white, '1.000')).toBe('"Harbour Gate" is painted in the colour of the page (#ffffff)');
    expect(shortReason({ code: 'ink-page-coloured', message: 'whatever', category: 'Mill Lane' }, '1.000')).toBe('a mark is in the page colour (Mill Lane)');
  });
});
