import svgpath from 'svgpath';
import { describe, expect, it } from 'vitest';
import { loadFont, measureText, textOutline, type TextAnchor } from '../../../shared-core/text';
import { codeOf } from '../../helpers/errors';

/** On-curve points of a path (segment end points), read back with svgpath. */
function endPoints(pathData: string): Array<[number, number]> {
  const points: Array<[number, number]> = [];
  svgpath(pathData)
    .abs()
    .iterate((segment) => {
      if (segment[0] === 'Z') return;
      points.push([segment[segment.length - 2] as number, segment[segment.length - 1] as number]);
    });
  return points;
}

const numbersIn = (pathData: string) => pathData.match(/-?\d+(\.\d+)?/g) ?? [];

describe('textOutline', () => {
  const base = { xMm: 12.5, yMm: 40, sizeMm: 3.5 };

  it('the ink box contains every point of the path and touches its extremes', () => {
    const outline = textOutline('Quarterly jobs, 2024 (Øresund)', base);
    const { x, y, width, height } = outline.bbox;
    const points = endPoints(outline.pathData);
    expect(points.length).toBeGreaterThan(100);
    for (const [px, py] of points) {
      expect(px).toBeGreaterThanOrEqual(x);
      expect(px).toBeLessThanOrEqual(x + width);
      expect(py).toBeGreaterThanOrEqual(y);
      expect(py).toBeLessThanOrEqual(y + height);
    }
    // Common practice, no source: type designers put on-curve points at the extremes, so the box is tight here.
    expect(Math.min(...points.map((p) => p[0]))).toBeCloseTo(x, 9);
    expect(Math.max(...points.map((p) => p[1]))).toBeCloseTo(y + height, 9);
  });

  it('y grows downward: a capital H stands on the baseline and reaches the cap height above it', () => {
    const outline = textOutline('H', base);
    const { capHeightMm } = measureText('H', base);
    expect(outline.bbox.y + outline.bbox.height).toBeCloseTo(base.yMm, 3);
    expect(outline.bbox.y).toBeCloseTo(base.yMm - capHeightMm, 3);
  });

  it('anchor middle centres the advance on x, anchor end ends it there', () => {
    const text = 'Median 42';
    const start = textOutline(text, { ...base, anchor: 'start' });
    const offsets: Array<[TextAnchor, number]> = [
      ['middle', start.advanceMm / 2],
      ['end', start.advanceMm],
    ];
    expect(start.startXMm).toBe(base.xMm);
    for (const [anchor, shiftMm] of offsets) {
      const moved = textOutline(text, { ...base, anchor });
      expect(moved.startXMm).toBeCloseTo(base.xMm - shiftMm, 10);
      expect(moved.advanceMm).toBeCloseTo(start.advanceMm, 10);
      // Same ink, shifted (up to the rounding of path coordinates).
      // Same ink, shifted: each side is rounded to 0.001 mm, so they may differ by one step.
      expect(Math.abs(moved.bbox.x - (start.bbox.x - shiftMm))).toBeLessThanOrEqual(0.001 + 1e-9);
      expect(Math.abs(moved.bbox.width - start.bbox.width)).toBeLessThanOrEqual(0.002 + 1e-9);
    }
    const middle = textOutline(text, { ...base, anchor: 'middle' });
    expect(middle.startXMm + middle.advanceMm / 2).toBeCloseTo(base.xMm, 10);
  });

  it('applies the font\'s fi ligature (GSUB liga), as resvg and browsers do', () => {
    const font = loadFont(400);
    let ligature = font.glyphs.get(0);
    for (let i = 0; i < font.numGlyphs; i++) if (font.glyphs.get(i).name === 'fi') ligature = font.glyphs.get(i);
    expect(ligature.name).toBe('fi');
    const scale = base.sizeMm / font.unitsPerEm;
    const expected = ligature.path.commands
      .filter((c) => c.type !== 'Z')
      .map((c) => [base.xMm + (c as { x: number }).x * scale, base.yMm - (c as { y: number }).y * scale]);
    const joined = endPoints(textOutline('fi', base).pathData);
    expect(joined.length).toBe(expected.length);
    joined.forEach(([x, y], i) => {
      expect(Math.abs(x - expected[i][0])).toBeLessThanOrEqual(0.0005 + 1e-9);
      expect(Math.abs(y - expected[i][1])).toBeLessThanOrEqual(0.0005 + 1e-9);
    });
    const separate = [...endPoints(textOutline('f', base).pathData), ...endPoints(textOutline('i', base).pathData)];
    expect(separate).not.toEqual(joined);
  });

  it('writes path numbers with the requested decimals', () => {
    for (const decimals of [0, 1, 3, 5]) {
      const { pathData } = textOutline('Rate 3.7%', { ...base, decimals });
      const longest = Math.max(...numbersIn(pathData).map((n) => (n.split('.')[1] ?? '').length));
      expect(longest).toBeLessThanOrEqual(decimals);
      if (decimals > 0) expect(longest).toBe(decimals); // trailing zeros aside, some coordinate uses them all
    }
    expect(textOutline('a', { ...base, yMm: 0, xMm: -1 }).pathData).not.toMatch(/-0(?![.\d])/);
  });

  it('rounded coordinates stay within half a unit of the last decimal of the precise ones', () => {
    const fine = endPoints(textOutline('Ag', { ...base, decimals: 6 }).pathData);
    const coarse = endPoints(textOutline('Ag', { ...base, decimals: 1 }).pathData);
    expect(coarse.length).toBe(fine.length);
    coarse.forEach(([x, y], i) => {
      expect(Math.abs(x - fine[i][0])).toBeLessThanOrEqual(0.05 + 1e-6);
      expect(Math.abs(y - fine[i][1])).toBeLessThanOrEqual(0.05 + 1e-6);
    });
  });

  it('an empty string gives an empty path, zero advance and a zero box at the pen', () => {
    const outline = textOutline('', { ...base, anchor: 'middle' });
    expect(outline.pathData).toBe('');
    expect(outline.advanceMm).toBe(0);
    expect(outline.bbox).toEqual({ x: base.xMm, y: base.yMm, width: 0, height: 0 });
    expect(outline.warnings).toEqual([]);
  });

  it('blank text has no ink but keeps its advance', () => {
    const font = loadFont(400);
    const outline = textOutline('  ', base);
    expect(outline.pathData).toBe('');
    expect(outline.advanceMm).toBeCloseTo(((2 * (font.charToGlyph(' ').advanceWidth ?? 0)) / font.unitsPerEm) * base.sizeMm, 10);
  });

  it('characters missing from the font warn once, draw the .notdef box and never throw', () => {
    const font = loadFont(400);
    const notdefMm = ((font.glyphs.get(0).advanceWidth ?? 0) / font.unitsPerEm) * base.sizeMm;
    const plain = textOutline('ab', base);
    const outline = textOutline('a😀Ωb Ω', base);
    expect(outline.warnings).toHaveLength(1);
    expect(outline.warnings[0].code).toBe('text-glyph-missing');
    expect(outline.warnings[0].message).toContain('U+1F600');
    expect(outline.warnings[0].message).toContain('U+03A9');
    // One .notdef per character (the emoji is one code point, not two UTF-16 halves).
    const space = ((font.charToGlyph(' ').advanceWidth ?? 0) / font.unitsPerEm) * base.sizeMm;
    expect(outline.advanceMm).toBeCloseTo(plain.advanceMm + 3 * notdefMm + space, 10);
    expect(outline.pathData.length).toBeGreaterThan(plain.pathData.length);
  });

  it('refuses line breaks and bad placement with plain errors', () => {
    expect(codeOf(() => textOutline('two\nlines', base))).toBe('usage');
    expect(codeOf(() => textOutline('two\r\nlines', base))).toBe('usage');
    expect(codeOf(() => textOutline('a', { ...base, xMm: Number.POSITIVE_INFINITY }))).toBe('number-invalid');
    expect(codeOf(() => textOutline('a', { ...base, sizeMm: -1 }))).toBe('number-invalid');
    expect(codeOf(() => textOutline('a', { ...base, decimals: 7 }))).toBe('usage');
    expect(codeOf(() => textOutline('a', { ...base, decimals: 1.5 }))).toBe('usage');
    expect(codeOf(() => textOutline('a', { ...base, anchor: 'left' as TextAnchor }))).toBe('usage');
  });
});
