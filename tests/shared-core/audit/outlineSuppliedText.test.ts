// Supplied text drawn as outlines must sit where a renderer sets the live text. Reference: resvg's own
// text layout (SVG 1.1 §10: text-anchor, tspan x/dx, font-size units per CSS, bold) with the bundled Noto
// Sans given to it as a font file; our outlines, rendered by the same resvg without any font, must cover
// the same box and about the same number of dark pixels.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Resvg } from '@resvg/resvg-js';
import { afterAll, describe, expect, it } from 'vitest';
import { notoSans400Base64 } from '../../../assets/fonts/noto-sans-400';
import { notoSans700Base64 } from '../../../assets/fonts/noto-sans-700';
import { importSvg } from '../../../shared-core/audit/importSvg';
import { sanitizedCopy } from '../../../shared-core/audit/sanitizedCopy';

const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyglyph-outline-text-'));
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));
const fonts = [
  ['NotoSans-Regular.ttf', notoSans400Base64],
  ['NotoSans-Bold.ttf', notoSans700Base64],
].map(([name, base64]) => {
  const file = path.join(dir, name);
  fs.writeFileSync(file, Buffer.from(base64, 'base64'));
  return file;
});

const WIDTH_PX = 800;

function page(body: string): string {
  return `<svg xmlns="http://www.w3.org/2000/svg" width="200" height="100" viewBox="0 0 200 100">${body}</svg>`;
}

/** Dark pixels and their bounding box (rows and columns with any pixel darker than half). */
function inkOf(svg: string, withFonts: boolean): { dark: number; box: [number, number, number, number] | null } {
  const font = withFonts ? { loadSystemFonts: false, fontFiles: fonts, sansSerifFamily: 'Noto Sans', defaultFontFamily: 'Noto Sans' } : { loadSystemFonts: false };
  const img = new Resvg(svg, { fitTo: { mode: 'width', value: WIDTH_PX }, font, background: '#ffffff' }).render();
  const px = img.pixels;
  let dark = 0, x0 = Infinity, y0 = Infinity, x1 = -Infinity, y1 = -Infinity;
  for (let y = 0; y < img.height; y++) {
    for (let x = 0; x < img.width; x++) {
      const i = 4 * (y * img.width + x);
      if (0.2126 * px[i] + 0.7152 * px[i + 1] + 0.0722 * px[i + 2] < 128) {
        dark++;
        x0 = Math.min(x0, x); y0 = Math.min(y0, y); x1 = Math.max(x1, x); y1 = Math.max(y1, y);
      }
    }
  }
  return { dark, box: dark ? [x0, y0, x1, y1] : null };
}

function outlined(body: string): { svg: string; notShown: number } {
  const copy = sanitizedCopy(importSvg(page(body)).root, 'p-', { outlineText: true });
  return { svg: page(copy.markup), notShown: copy.textNotShown.length };
}

const CASES: Array<[string, string]> = [
  ['start anchor, size in user units', '<text x="10" y="50" font-family="sans-serif" font-size="20">12 barrels</text>'],
  ['middle anchor', '<text x="100" y="50" font-family="Noto Sans, sans-serif" font-size="18" text-anchor="middle">Harbour 2024</text>'],
  ['end anchor inherited from a group, size in pt', '<g text-anchor="end" font-family="sans-serif"><text x="190" y="60" font-size="15pt">Total: 35</text></g>'],
  ['bold from the style attribute', '<text x="10" y="70" style="font-family: sans-serif; font-size: 16px; font-weight: bold">Bold words</text>'],
  ['a tspan placed by its own x and dy', '<text x="10" y="30" font-family="sans-serif" font-size="14">First<tspan x="10" dy="20">Second line</tspan></text>'],
  ['a tspan continuing the line after dx', '<text x="10" y="50" font-family="sans-serif" font-size="14">Value<tspan dx="8">27.5</tspan></text>'],
];

describe('outlined supplied text against resvg setting the same text', () => {
  for (const [name, body] of CASES) {
    it(name, () => {
      const reference = inkOf(page(body), true);
      const ours = outlined(body);
      expect(ours.notShown).toBe(0);
      expect(ours.svg).not.toMatch(/<text/);
      const drawn = inkOf(ours.svg, false);
      expect(reference.box).not.toBeNull();
      // Same box within 2 px at 4 px per unit (half a unit; anti-aliasing decides the edge pixels).
      for (let k = 0; k < 4; k++) expect(Math.abs((drawn.box as number[])[k] - (reference.box as number[])[k])).toBeLessThanOrEqual(2);
      // Same glyphs, same size: dark pixel counts within 6% (common practice, no source).
      expect(Math.abs(drawn.dark / reference.dark - 1)).toBeLessThan(0.06);
    });
  }

  it('leaves out and lists text it cannot draw as the file sets it: unbundled font, per-letter positions, a path, missing letters', () => {
    const copy = sanitizedCopy(
      importSvg(
        page(
          '<text x="10" y="20" font-family="Futura">Depot</text>' +
            '<text x="10 20 30" y="40" font-family="sans-serif">abc</text>' +
            '<text font-family="sans-serif"><textPath href="#p">Curved</textPath></text>' +
            '<text x="10" y="80" font-family="sans-serif">東京 12</text>' +
            '<text x="10" y="90" display="none" font-family="Futura">Hidden</text>',
        ),
      ).root,
      'p-',
      { outlineText: true },
    );
    expect(copy.textNotShown.map((t) => [t.text, t.font])).toEqual([
      ['Depot', 'Futura'],
      ['abc', 'sans-serif'],
      ['Curved', 'sans-serif'],
      ['東京 12', 'sans-serif'],
    ]);
    expect(copy.markup).not.toMatch(/<text|Depot|Curved/);
    const note = copy.warnings.find((w) => w.code === 'sheet-text-not-shown')?.message ?? '';
    expect(note).toMatch(/leaves out 4 texts/);
    expect(note).toMatch(/"Depot" in "Futura" \(that font is not bundled\)/);
    expect(note).toMatch(/"東京 12" in "sans-serif" \(the bundled font has no letter for some of its characters\)/);
  });

  it('without the option, text stays live text (the app\'s on-screen copy and glyph import are unchanged)', () => {
    const copy = sanitizedCopy(importSvg(page('<text x="1" y="2" font-family="Futura">Depot</text>')).root, 'p-');
    expect(copy.markup).toBe('<text x="1" y="2" font-family="Futura">Depot</text>');
    expect(copy.textNotShown).toEqual([]);
  });
});

describe('hostile amounts of text', () => {
  it('draws at most 20,000 characters as outlines and lists the rest, in bounded time', () => {
    // 300 texts of 100 characters: 30,000 in all, so the last 100 texts go unshown.
    const line = 'Harbour depot crates 12 '.repeat(4) + 'abcd';
    const body = Array.from({ length: 300 }, (_, i) => `<text x="1" y="${(i % 90) + 5}" font-family="sans-serif" font-size="1">${line}</text>`).join('');
    const started = performance.now();
    const copy = sanitizedCopy(importSvg(`<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 200 100">${body}</svg>`).root, 'p-', { outlineText: true });
    // A bound only to prove the amount cannot hang the sheet (generous for a shared machine).
    expect(performance.now() - started).toBeLessThan(30_000);
    expect([...line].length).toBe(100);
    expect(copy.textNotShown.length).toBe(100);
    expect(copy.textNotShown[0].reason).toMatch(/more text than the sheet draws \(20,000 characters\)/);
    expect(copy.warnings.find((w) => w.code === 'sheet-text-not-shown')?.message).toMatch(/leaves out 100 texts .*, and 96 more\./);
  });
});
