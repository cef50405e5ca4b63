import { describe, expect, it } from 'vitest';
import { measureText, textLines, textOutline } from '../../../shared-core/text';

describe('textLines', () => {
  const base = { xMm: 50, yMm: 20, sizeMm: 4, anchor: 'middle' as const };

  it('puts each line on its own baseline, the font line height apart by default', () => {
    const { lineHeightMm } = measureText('x', base);
    const result = textLines('First line\nSecond\r\n\nFourth', base);
    expect(result.lines.map((l) => l.text)).toEqual(['First line', 'Second', '', 'Fourth']);
    result.lines.forEach((line, i) => expect(line.baselineYMm).toBeCloseTo(base.yMm + i * lineHeightMm, 10));
    expect(result.lines[2].bbox).toBeUndefined();
    expect(result.lines[2].advanceMm).toBe(0);
  });

  it('each line is exactly the single-line outline at its baseline', () => {
    const result = textLines('Alpha\nBeta Gamma', { ...base, lineHeightMm: 6 });
    const expected = result.lines.map((line) => textOutline(line.text, { ...base, yMm: line.baselineYMm }));
    expect(result.pathData).toBe(expected.map((e) => e.pathData).join(''));
    expect(result.lines[1].baselineYMm).toBe(26);
    expect(result.advanceMm).toBeCloseTo(Math.max(...expected.map((e) => e.advanceMm)), 10);
    const top = Math.min(...expected.map((e) => e.bbox.y));
    const bottom = Math.max(...expected.map((e) => e.bbox.y + e.bbox.height));
    expect(result.bbox.y).toBeCloseTo(top, 10);
    expect(result.bbox.y + result.bbox.height).toBeCloseTo(bottom, 10);
  });

  it('merges repeated warnings and handles empty text', () => {
    expect(textLines('Ω\nΩ', base).warnings).toHaveLength(1);
    const empty = textLines('', base);
    expect(empty.pathData).toBe('');
    expect(empty.lines).toHaveLength(1);
    expect(empty.bbox).toEqual({ x: base.xMm, y: base.yMm, width: 0, height: 0 });
  });
});
