// A glyph from one character of a font: the bundled symbol font (Noto Sans Symbols 2, OFL) read by
// opentype.js, its outline measured by ink and checked against closed forms and an independent renderer.
import fs from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { codePointLabel, fontFamilyName, fontHasCharacter, glyphFromFont, parseCharacter, readFont } from '../../../shared-core/glyph/glyphFromFont';
import { renderChart } from '../../../shared-core/pipeline';
import { verifySvg } from '../../../shared-core/integrity';
import { caught } from '../../helpers/errors';
import { resvgAlphaSum } from '../../helpers/independent';

const SYMBOLS = new Uint8Array(fs.readFileSync(fileURLToPath(new URL('../../../assets/fonts/noto-sans-symbols-2-symbols-400.woff', import.meta.url))));
const font = readFont(SYMBOLS);

describe('glyphFromFont', () => {
  it('reads the bundled WOFF and names it', () => {
    expect(fontFamilyName(font)).toMatch(/Noto Sans Symbols 2/);
    expect(fontHasCharacter(font, 0x2713)).toBe(true);
  });

  it('a filled square (U+25A0) fills its ink box; a black circle (U+25CF) fills π/4 of it (closed forms)', () => {
    expect(glyphFromFont(font, 0x25a0).boxFraction).toBeCloseTo(1, 6);
    // The font's circle is drawn with curves, not a true circle: 0.5% is far beyond flattening error.
    expect(Math.abs(glyphFromFont(font, 0x25cf).boxFraction / (Math.PI / 4) - 1)).toBeLessThan(0.005);
  });

  it('a check mark has the ink an independent renderer (resvg) finds, within 0.5%', () => {
    const check = glyphFromFont(font, 0x2713);
    expect(check.from).toBe('U+2713 ✓ from Noto Sans Symbols 2');
    const widthPx = 2048;
    const unitsPerPx = check.viewBox.width / widthPx;
    const resvgArea = resvgAlphaSum(check.svg, widthPx) * unitsPerPx * unitsPerPx;
    expect(Math.abs(resvgArea / check.inkAreaUnits2 - 1)).toBeLessThan(0.005);
  });

  it('refuses a character the font lacks, a space, WOFF2 and bytes that are no font', () => {
    expect(caught(() => glyphFromFont(font, 0x266a)).code).toBe('glyph-unknown');
    expect(caught(() => readFont(new TextEncoder().encode('wOF2 and then nothing'))).message).toMatch(/WOFF2/);
    expect(caught(() => readFont(new TextEncoder().encode('not a font at all'))).code).toBe('data-invalid');
  });

  it('reads characters typed or as U+ codes', () => {
    expect(parseCharacter('★')).toBe(0x2605);
    expect(parseCharacter(' U+2713 ')).toBe(0x2713);
    expect(codePointLabel(0x25a0)).toBe('U+25A0');
    expect(caught(() => parseCharacter('ab')).code).toBe('usage');
    expect(caught(() => parseCharacter('U+D800')).code).toBe('usage');
  });

  it('a chart of font stars is laid out, written and verified from the written file', () => {
    const star = glyphFromFont(font, 0x2605);
    const result = renderChart({
      format: 'tallyglyph.chart/1',
      title: 'Stars given per review (invented)',
      data: [
        { label: 'Café A', value: 3.5 },
        { label: 'Café B', value: 5 },
      ],
      encoding: { mode: 'repeat', unit: 1, glyph: 'own:star' },
      page: { width: 180, height: 120, unit: 'mm' },
      glyphs: { 'own:star': { svg: star.svg, from: star.from } },
    });
    const report = verifySvg(result.svg);
    expect(report.pass).toBe(true);
    expect(Math.abs((report.lieFactor.worst ?? 0) - 1)).toBeLessThan(0.001);
  });
});

describe('font contours', () => {
  it('are closed, so no font glyph is reported as an open path', () => {
    for (const cp of [0x2605, 0x2713, 0x2665, 0x2602]) {
      const g = glyphFromFont(font, cp);
      expect(g.warnings.map((w) => w.code)).not.toContain('open-path');
      expect(g.svg).toMatch(/Z"/);
    }
  });
});
