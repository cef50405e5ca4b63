// The sheet keeps the supplied drawing's own words. Reference: resvg itself (its own text shaping, no
// project code) drawing the supplied file with the bundled Noto Sans given to it as a font file and set as
// its sans-serif; the sheet's PNG must carry as many dark pixels where that text sits. Text in a font that
// is not bundled is left out and named in the notes.
import fs from 'node:fs';
import path from 'node:path';
import { Resvg } from '@resvg/resvg-js';
import { PNG } from 'pngjs';
import { describe, expect, it } from 'vitest';
import { notoSans400Base64 } from '../../../assets/fonts/noto-sans-400';
import { main } from '../../../main/cli/index';
import { buildSheet, correctSvg } from '../../../shared-core/audit';
import { folderPerTest } from '../../helpers/tempDirs';

const tmp = folderPerTest('tallyglyph-sheet-text-');

// Invented: two crates drawn as bars, a sans-serif caption under them and a word in a font we do not bundle.
const CAPTION = '<text x="20" y="114" font-family="sans-serif" font-size="12">12 barrels</text>';
const SUPPLIED =
  '<svg xmlns="http://www.w3.org/2000/svg" width="200" height="120" viewBox="0 0 200 120">' +
  '<rect id="crate-a" x="20" y="60" width="20" height="40" fill="#333366"/>' +
  '<rect id="crate-b" x="80" y="20" width="40" height="80" fill="#333366"/>' +
  CAPTION +
  '<text x="140" y="40" font-family="Futura" font-size="10">Depot north</text>' +
  '</svg>';

const PPI = 150;

/** Pixels darker than mid-grey (luminance by the sRGB/BT.709 weights) inside a box of an RGBA raster. */
function darkPixels(rgba: Uint8Array, widthPx: number, box: { x0: number; y0: number; x1: number; y1: number }): number {
  let n = 0;
  for (let y = Math.max(0, box.y0); y < box.y1; y++) {
    for (let x = Math.max(0, box.x0); x < Math.min(widthPx, box.x1); x++) {
      const i = 4 * (y * widthPx + x);
      // Unpremultiply onto white: resvg's pixels without a background are premultiplied, transparent is white paper.
      const a = rgba[i + 3] / 255;
      const lum = (0.2126 * rgba[i] + 0.7152 * rgba[i + 1] + 0.0722 * rgba[i + 2]) + 255 * (1 - a);
      if (lum < 128) n++;
    }
  }
  return n;
}

describe('the sheet shows the supplied drawing\'s own text', () => {
  it('a sans-serif caption is drawn in the sheet PNG with as much ink as resvg draws it in Noto Sans', async () => {
    let out = '';
    const code = await main(['sheet', writeSupplied(), '--values', '1,4', '-o', 'sheet.png', '--ppi', String(PPI)], { stdout: (s) => void (out += s), stderr: (s) => void (out += s), cwd: tmp.dir });
    expect(code, out).toBe(0);
    const sheetPng = PNG.sync.read(fs.readFileSync(path.join(tmp.dir, 'sheet.png')));
    // Where the supplied panel lies on the sheet, from the same (pure) sheet builder the command uses.
    const fixed = correctSvg(SUPPLIED, { values: [1, 4] });
    const built = buildSheet({ supplied: SUPPLIED, corrected: fixed.svg, before: fixed.before, after: fixed.after, reading: fixed.reading });
    const panel = built.panels.supplied;
    const sheetWidthMm = built.widthMm;
    const pxPerUnit = ((panel.width / 200) * sheetPng.width) / sheetWidthMm;

    // The reference: resvg draws the caption alone, at the panel's scale, with Noto Sans as its sans-serif.
    const fontFile = path.join(tmp.dir, 'NotoSans-Regular.ttf');
    fs.writeFileSync(fontFile, Buffer.from(notoSans400Base64, 'base64'));
    const captionOnly = `<svg xmlns="http://www.w3.org/2000/svg" width="200" height="120" viewBox="0 0 200 120">${CAPTION}</svg>`;
    const reference = new Resvg(captionOnly, {
      fitTo: { mode: 'width', value: Math.round(200 * pxPerUnit) },
      font: { loadSystemFonts: false, fontFiles: [fontFile], sansSerifFamily: 'Noto Sans', defaultFontFamily: 'Noto Sans' },
    }).render();
    const referenceDark = darkPixels(reference.pixels, reference.width, { x0: 0, y0: 0, x1: reference.width, y1: reference.height });
    // The caption spans about 60 x 12 units; at this scale that is hundreds of dark pixels, not a speck.
    expect(referenceDark).toBeGreaterThan(500);

    // The caption's box on the sheet: x 18..100, y 100..118 in the drawing's units (baseline 114, size 12).
    const toPx = (xUnits: number, yUnits: number) => ({
      x: Math.round(((panel.x + (xUnits * panel.width) / 200) * sheetPng.width) / sheetWidthMm),
      y: Math.round(((panel.y + (yUnits * panel.height) / 120) * sheetPng.width) / sheetWidthMm),
    });
    const a = toPx(18, 100), b = toPx(100, 118);
    const sheetDark = darkPixels(new Uint8Array(sheetPng.data), sheetPng.width, { x0: a.x, y0: a.y, x1: b.x, y1: b.y });
    // Same font, same size: the dark pixel counts agree within 10% (anti-aliasing and pixel grid; common practice, no source).
    expect(Math.abs(sheetDark / referenceDark - 1)).toBeLessThan(0.1);

    // The Futura word is not drawn (its box stays paper) and the note names its font and its text.
    const c = toPx(138, 28), d = toPx(200, 44);
    expect(darkPixels(new Uint8Array(sheetPng.data), sheetPng.width, { x0: c.x, y0: c.y, x1: d.x, y1: d.y })).toBe(0);
    expect(out).toMatch(/Note: The sheet leaves out one text .*"Depot north" in "Futura" \(that font is not bundled\)/);
  });

  it('the app\'s sheet (the same builder) keeps the caption as outlines and lists the text it left out', () => {
    const fixed = correctSvg(SUPPLIED, { values: [1, 4] });
    const sheet = buildSheet({ supplied: SUPPLIED, corrected: fixed.svg, before: fixed.before, after: fixed.after, reading: fixed.reading });
    expect(sheet.svg).not.toMatch(/<text/);
    // Both panels carry the caption, as outlines with the words kept as the group's title.
    expect(sheet.svg.match(/<title>12 barrels<\/title><path d="M/g)?.length).toBe(2);
    expect(sheet.svg).not.toContain('Depot north');
    const note = sheet.warnings.find((w) => w.code === 'sheet-text-not-shown');
    expect(note?.message).toMatch(/"Depot north" in "Futura"/);
  });
});

function writeSupplied(): string {
  fs.writeFileSync(path.join(tmp.dir, 'crates.svg'), SUPPLIED);
  return 'crates.svg';
}
