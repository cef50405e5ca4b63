import opentype from 'opentype.js';
import { describe, expect, it } from 'vitest';
import { notoSans400Base64 } from '../../../assets/fonts/noto-sans-400';
import { notoSans700Base64 } from '../../../assets/fonts/noto-sans-700';
import { measureText, textOutline, type FontWeight } from '../../../shared-core/text';
import { readPairKerning } from '../../../shared-core/text/readPairKerning';
import { codeOf } from '../../helpers/errors';

// An independent parse of the same bytes (Node Buffer for base64, opentype.js for hmtx and OS/2).
function reference(weight: FontWeight) {
  const bytes = Buffer.from(weight === 400 ? notoSans400Base64 : notoSans700Base64, 'base64');
  const font = opentype.parse(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength));
  return { font, kerning: readPairKerning(new Uint8Array(bytes)) };
}

describe('measureText', () => {
  for (const weight of [400, 700] as const) {
    it(`${weight}: width is the sum of advances and kerning over units per em, times the size`, () => {
      // OpenType spec (hmtx, head.unitsPerEm): advances are in font units, unitsPerEm per em.
      // Kerning values are checked against resvg's shaping in resvgAgreement.test.ts.
      const { font, kerning } = reference(weight);
      const text = 'AVAWAY To Ty, 1,234 kg';
      const glyphs = [...text].map((ch) => font.charToGlyph(ch));
      let units = 0;
      glyphs.forEach((g, i) => {
        units += g.advanceWidth ?? 0;
        if (i + 1 < glyphs.length) units += kerning(g.index, glyphs[i + 1].index);
      });
      const sizeMm = 4.2;
      expect(measureText(text, { sizeMm, weight }).widthMm).toBeCloseTo((units / font.unitsPerEm) * sizeMm, 10);
    });
  }

  it('kerns the classic pairs tighter than their bare advances', () => {
    // Common practice, no source: A-V and T-o are kerned in essentially every text face.
    const { font } = reference(400);
    const bare = (s: string) => [...s].reduce((sum, ch) => sum + (font.charToGlyph(ch).advanceWidth ?? 0), 0) / font.unitsPerEm;
    for (const pair of ['AV', 'To']) expect(measureText(pair, { sizeMm: 1 }).widthMm).toBeLessThan(bare(pair));
  });

  it('ascent, descent and line height come from the OS/2 typo metrics (USE_TYPO_METRICS is set)', () => {
    // OpenType spec, OS/2 fsSelection bit 7: when set, sTypoAscender/Descender/LineGap are the line metrics.
    const { font } = reference(400);
    const os2 = font.tables.os2 as Record<string, number>;
    expect(os2.fsSelection & 0x80).not.toBe(0);
    const sizeMm = 5;
    const m = measureText('Hg', { sizeMm });
    expect(m.ascentMm).toBeCloseTo((os2.sTypoAscender / font.unitsPerEm) * sizeMm, 10);
    expect(m.descentMm).toBeCloseTo((-os2.sTypoDescender / font.unitsPerEm) * sizeMm, 10);
    expect(m.capHeightMm).toBeCloseTo((os2.sCapHeight / font.unitsPerEm) * sizeMm, 10);
    expect(m.lineHeightMm).toBeCloseTo(((os2.sTypoAscender - os2.sTypoDescender + os2.sTypoLineGap) / font.unitsPerEm) * sizeMm, 10);
    expect(m.descentMm).toBeGreaterThan(0);
  });

  it('agrees with the advance textOutline reports', () => {
    const text = 'Share of households, 2023 (%)';
    expect(measureText(text, { sizeMm: 3, weight: 700 }).widthMm).toBeCloseTo(
      textOutline(text, { xMm: 0, yMm: 0, sizeMm: 3, weight: 700 }).advanceMm,
      10,
    );
  });

  it('an empty string has zero width and no warnings', () => {
    const m = measureText('', { sizeMm: 3 });
    expect(m.widthMm).toBe(0);
    expect(m.warnings).toEqual([]);
    expect(m.ascentMm).toBeGreaterThan(0);
  });

  it('missing characters take the .notdef advance and warn', () => {
    const { font } = reference(400);
    const notdef = font.glyphs.get(0).advanceWidth ?? 0;
    const m = measureText('Ω', { sizeMm: 2 });
    expect(m.widthMm).toBeCloseTo((notdef / font.unitsPerEm) * 2, 10);
    expect(m.warnings.map((w) => w.code)).toEqual(['text-glyph-missing']);
    expect(m.warnings[0].message).toContain('U+03A9');
  });

  it('refuses line breaks, bad sizes and unknown weights with plain errors', () => {
    expect(codeOf(() => measureText('a\nb', { sizeMm: 3 }))).toBe('usage');
    expect(codeOf(() => measureText('a', { sizeMm: 0 }))).toBe('number-invalid');
    expect(codeOf(() => measureText('a', { sizeMm: Number.NaN }))).toBe('number-invalid');
    expect(codeOf(() => measureText('a', { sizeMm: 3, weight: 500 as FontWeight }))).toBe('usage');
  });
});
