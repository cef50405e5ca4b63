// Independent check: resvg (its own font parser and shaper) draws <text> with the same Noto Sans
// bytes; our outlines must cover the same pixels. Ink is measured as the sum of alpha / 255, which
// tracks covered area closely (TOOLCHAIN.md: within 0.02% for filled shapes).
import { Resvg } from '@resvg/resvg-js';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { notoSans400Base64 } from '../../../assets/fonts/noto-sans-400';
import { notoSans700Base64 } from '../../../assets/fonts/noto-sans-700';
import { loadFont, textOutline, type FontWeight, type TextAnchor } from '../../../shared-core/text';

const pxPerMm = 20;
const pageWidthMm = 200;
const pageHeightMm = 30;
const sizeMm = 10;
const baselineMm = 20;

let fontDir = '';
let fontFiles: string[] = [];

beforeAll(() => {
  // The modules hold plain sfnt (TrueType) bytes, so resvg reads them as .ttf files.
  // Decoded with Node's Buffer here, not with the project's own base64 decoder.
  fontDir = mkdtempSync(join(tmpdir(), 'tallyglyph-font-'));
  fontFiles = [
    ['noto-sans-400.ttf', notoSans400Base64],
    ['noto-sans-700.ttf', notoSans700Base64],
  ].map(([name, base64]) => {
    const file = join(fontDir, name);
    writeFileSync(file, Buffer.from(base64, 'base64'));
    return file;
  });
});

afterAll(() => {
  if (fontDir) rmSync(fontDir, { recursive: true, force: true });
});

function escapeXml(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;');
}

function render(body: string): Float64Array {
  const svg =
    `<svg xmlns="http://www.w3.org/2000/svg" width="${pageWidthMm * pxPerMm}" height="${pageHeightMm * pxPerMm}" ` +
    `viewBox="0 0 ${pageWidthMm} ${pageHeightMm}">${body}</svg>`;
  const image = new Resvg(svg, {
    font: { fontFiles, loadSystemFonts: false, defaultFontFamily: 'Noto Sans' },
    fitTo: { mode: 'original' },
  }).render();
  const pixels = image.pixels; // a fresh copy on every access: read once
  const alpha = new Float64Array(image.width * image.height);
  for (let i = 0; i < alpha.length; i++) alpha[i] = pixels[i * 4 + 3] / 255;
  return alpha;
}

interface Ink {
  total: number;
  centroidXMm: number;
  centroidYMm: number;
  minXMm: number;
  maxXMm: number;
  minYMm: number;
  maxYMm: number;
}

function ink(alpha: Float64Array): Ink {
  const width = pageWidthMm * pxPerMm;
  let total = 0;
  let sumX = 0;
  let sumY = 0;
  let minX = Infinity;
  let maxX = -Infinity;
  let minY = Infinity;
  let maxY = -Infinity;
  for (let i = 0; i < alpha.length; i++) {
    const a = alpha[i];
    if (a === 0) continue;
    const x = i % width;
    const y = Math.floor(i / width);
    total += a;
    sumX += a * (x + 0.5);
    sumY += a * (y + 0.5);
    if (x < minX) minX = x;
    if (x + 1 > maxX) maxX = x + 1;
    if (y < minY) minY = y;
    if (y + 1 > maxY) maxY = y + 1;
  }
  return {
    total,
    centroidXMm: sumX / total / pxPerMm,
    centroidYMm: sumY / total / pxPerMm,
    minXMm: minX / pxPerMm,
    maxXMm: maxX / pxPerMm,
    minYMm: minY / pxPerMm,
    maxYMm: maxY / pxPerMm,
  };
}

function compare(text: string, weight: FontWeight, anchor: TextAnchor, xMm: number) {
  const outline = textOutline(text, { xMm, yMm: baselineMm, sizeMm, weight, anchor });
  const ours = render(`<path d="${outline.pathData}"/>`);
  const theirs = render(
    `<text x="${xMm}" y="${baselineMm}" font-family="Noto Sans" font-size="${sizeMm}" font-weight="${weight}" ` +
      `text-anchor="${anchor}">${escapeXml(text)}</text>`,
  );
  let difference = 0;
  for (let i = 0; i < ours.length; i++) difference += Math.abs(ours[i] - theirs[i]);
  const a = ink(ours);
  const b = ink(theirs);
  return { outline, ours: a, theirs: b, inkRatio: a.total / b.total, pixelDifference: difference / b.total };
}

const samples: Array<[string, FontWeight]> = [
  ['AVAWAY To Ty P. r, Wa LT', 400],
  ['Tallyglyph: 1,234 units (2024)', 400],
  ['office flow fjord', 400],
  ['Årets “bäst” – Ødegård ß €', 400],
  ['AVAWAY To Ty P. r, Wa LT', 700],
  ['Source: National Survey 2023', 700],
];

// Measured here: ink ratio within 0.001%, pixel-by-pixel difference at most 0.003% of the ink,
// centroids within 0.0001 mm. The limits below leave room for rasteriser changes, not for layout errors.
describe('outlines agree with resvg rendering <text> in the same font', () => {
  for (const [text, weight] of samples) {
    it(`${weight}: ${text}`, () => {
      // Anchor 'end' puts the start of the ink at x minus the whole advance, so any error in
      // advances, kerning or ligatures moves our ink away from resvg's.
      const r = compare(text, weight, 'end', 190);
      expect(r.theirs.total).toBeGreaterThan(1000); // resvg found the font and drew something
      expect(Math.abs(r.inkRatio - 1)).toBeLessThan(0.005);
      expect(r.pixelDifference).toBeLessThan(0.01);
      expect(Math.abs(r.ours.centroidXMm - r.theirs.centroidXMm)).toBeLessThan(0.01);
      expect(Math.abs(r.ours.centroidYMm - r.theirs.centroidYMm)).toBeLessThan(0.01);
    });
  }

  it('anchor middle centres the advance as SVG text-anchor does', () => {
    const r = compare('Median: 42 (Wave 7)', 400, 'middle', 100);
    expect(r.pixelDifference).toBeLessThan(0.01);
    expect(Math.abs(r.ours.centroidXMm - r.theirs.centroidXMm)).toBeLessThan(0.01);
  });

  it('the reported ink box matches the rasterised extent to within one pixel', () => {
    const r = compare('AVAWAY To Ty P. r, fjord', 400, 'start', 5);
    const px = 1 / pxPerMm;
    const { bbox } = r.outline;
    // Raster extents are whole pixels that touch the ink, so they enclose the exact box by < 1 px.
    for (const [exact, raster] of [
      [bbox.x, r.theirs.minXMm],
      [bbox.y, r.theirs.minYMm],
    ]) {
      expect(exact).toBeGreaterThanOrEqual(raster);
      expect(exact - raster).toBeLessThan(px);
    }
    for (const [exact, raster] of [
      [bbox.x + bbox.width, r.theirs.maxXMm],
      [bbox.y + bbox.height, r.theirs.maxYMm],
    ]) {
      expect(exact).toBeLessThanOrEqual(raster);
      expect(raster - exact).toBeLessThan(px);
    }
  });

  it('is sensitive to kerning: opentype.js getPath, which skips GPOS Extension lookups, lands visibly off', () => {
    const text = 'AVAWAY To Ty P. r, Wa LT';
    const font = loadFont(400);
    const plain = font.getPath(text, 0, baselineMm, sizeMm);
    const xStartMm = 190 - font.getAdvanceWidth(text, sizeMm);
    const ours = ink(render(`<path d="${plain.toPathData(3)}" transform="translate(${xStartMm} 0)"/>`));
    const theirs = ink(
      render(`<text x="190" y="${baselineMm}" font-family="Noto Sans" font-size="${sizeMm}" text-anchor="end">${text}</text>`),
    );
    // Noto Sans kerns A-V, T-o, P-. and r-, by 40 to 160 units: several tenths of a millimetre at 10 mm.
    expect(Math.abs(ours.centroidXMm - theirs.centroidXMm)).toBeGreaterThan(0.1);
  });
});
