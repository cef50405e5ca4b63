// The audit workspace in Chromium, end to end: a supplied SVG and a supplied PNG are opened, their
// marks found and numbered, values confirmed, lie factors read under each reading, the drawing
// corrected or redrawn, and the side-by-side sheet exported and measured by an independent renderer.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { PNG } from 'pngjs';
import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { hasPngcheck, hasRsvg, pngcheckPhys, rsvgRender } from '../../helpers/independent';
import { CHROMIUM, SHOTS, haveChromium, openApp, readDownload, screenshot, startBrowserApp, type BrowserApp } from './helpers/browserApp';

// An invented mock-up: pots of tea poured on two afternoons, 20 and 30, drawn as bars 40 and 100
// units tall (the same width), each with its value printed under it, and a heading in a font we do not bundle.
const TEA_SVG = `<svg xmlns="http://www.w3.org/2000/svg" width="160mm" height="120mm" viewBox="0 0 160 120">
  <title>Pots of tea poured per afternoon</title>
  <rect id="bar-monday" x="30" y="60" width="30" height="40" fill="#c0572b"/>
  <text x="45" y="110" font-size="6" text-anchor="middle">20</text>
  <rect id="bar-friday" x="100" y="0" width="30" height="100" fill="#c0572b"/>
  <text x="115" y="110" font-size="6" text-anchor="middle">30</text>
  <text x="5" y="10" font-family="Futura" font-size="6">Tea room</text>
</svg>
`;

// An invented raster mock-up: two filled squares, 40 and 60 pixels wide, on white (240 x 120 px).
const SQUARE_RGB = [42, 111, 176];
function squaresPng(): Buffer {
  const png = new PNG({ width: 240, height: 120 });
  png.data.fill(255);
  const square = (x0: number, y0: number, side: number) => {
    for (let y = y0; y < y0 + side; y++) {
      for (let x = x0; x < x0 + side; x++) {
        const i = (y * 240 + x) * 4;
        png.data[i] = SQUARE_RGB[0];
        png.data[i + 1] = SQUARE_RGB[1];
        png.data[i + 2] = SQUARE_RGB[2];
      }
    }
  };
  square(30, 50, 40);
  square(130, 30, 60);
  return PNG.sync.write(png);
}

/**
 * Pixels of one fill colour in each half of a panel of the sheet, as rsvg-convert renders the whole
 * sheet: [left of splitMm, right of it] within [fromMm, toMm) across.
 */
function colourPixelsBySide(svg: string, rgb: readonly number[], widthMm: number, fromMm: number, splitMm: number, toMm: number): [number, number] {
  const raster = rsvgRender(svg, { widthPx: Math.round((widthMm / 25.4) * 300) });
  const pxPerMm = raster.widthPx / widthMm;
  let left = 0, right = 0;
  for (let y = 0; y < raster.heightPx; y++) {
    for (let x = 0; x < raster.widthPx; x++) {
      const i = (y * raster.widthPx + x) * 4;
      if (raster.rgba[i + 3] < 128 || Math.abs(raster.rgba[i] - rgb[0]) > 30 || Math.abs(raster.rgba[i + 1] - rgb[1]) > 30 || Math.abs(raster.rgba[i + 2] - rgb[2]) > 30) continue;
      const xMm = x / pxPerMm;
      if (xMm >= fromMm && xMm < splitMm) left++;
      else if (xMm >= splitMm && xMm < toMm) right++;
    }
  }
  return [left, right];
}

let app: BrowserApp;
let page: Page;
let errors: string[] = [];
let dir: string;

async function toAudit(): Promise<void> {
  await page.getByTestId('workspace-audit').click();
  await page.getByTestId('audit-open').waitFor();
}

async function openSupplied(file: string): Promise<void> {
  const [chooser] = await Promise.all([page.waitForEvent('filechooser'), page.getByTestId('audit-open').click()]);
  await chooser.setFiles(file);
  await page.getByTestId('audit-outlines').waitFor();
}

describe.skipIf(!haveChromium)(`the audit workspace in Chromium (skipped when ${CHROMIUM} is missing)`, () => {
  beforeAll(async () => {
    app = await startBrowserApp();
    dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyglyph-audit-ui-'));
    fs.writeFileSync(path.join(dir, 'tea-mockup.svg'), TEA_SVG);
    fs.writeFileSync(path.join(dir, 'squares-mockup.png'), squaresPng());
  }, 180_000);

  afterAll(async () => {
    await app?.close();
    if (dir) fs.rmSync(dir, { recursive: true, force: true });
  });

  beforeEach(async () => {
    errors = [];
    page = await openApp(app, errors);
  });

  afterEach(async () => {
    await page.close();
    expect(errors, 'errors in the page').toEqual([]);
  });

  it('audits a supplied SVG: marks numbered, values read from labels, effect-form arithmetic, corrected in place, sheet exported', async () => {
    await toAudit();
    // The caution shows once: dismissed, it stays away after a reload.
    await page.getByTestId('audit-caution').waitFor();
    expect(await page.getByTestId('audit-caution').textContent()).toContain("the audit measures the drawing; what the client's data mean is your call".replace('the audit', 'The audit'));
    await openSupplied(path.join(dir, 'tea-mockup.svg'));
    await screenshot(page, 'audit-01-svg-opened');

    // Two marks outlined and numbered on the drawing.
    expect(await page.locator('[data-testid=audit-outlines] .audit-mark').count()).toBe(2);
    expect(await page.locator('[data-testid=audit-outlines] text').allTextContents()).toEqual(['1', '2']);
    // Values pre-filled from the labels printed under the bars.
    expect(await page.getByLabel('Value of mark 1').inputValue()).toBe('20');
    expect(await page.getByLabel('Value of mark 2').inputValue()).toBe('30');

    // Tufte's lie factor (1983, p. 57), effect form: the bar grows 100/40 = 2.5×, the data 30/20 = 1.5×,
    // so (2.5 − 1) ÷ (1.5 − 1) = 3.00. Length is suggested (only the height changes).
    expect(await page.locator('[data-reading=length] .tag').textContent()).toBe('suggested');
    expect(await page.getByTestId('factor-length').textContent()).toBe('3.00');
    expect(await page.getByTestId('arithmetic-length').textContent()).toContain('(2.5 − 1) ÷ (1.5 − 1) = 1.5 ÷ 0.5 = 3.00');
    expect(await page.getByTestId('audit-verdict').getAttribute('data-pass')).toBe('false');
    // Count is not available: the bars are not built from a repeated glyph.
    expect(await page.getByTestId('factor-count').textContent()).toBe('n/a');

    // Editing a value re-audits: with 20 and 50 the data grow 2.5× like the bars, so length is faithful.
    await page.getByLabel('Value of mark 2').fill('50');
    await expect.poll(() => page.getByTestId('factor-length').textContent()).toBe('1.00');
    await page.getByLabel('Value of mark 2').fill('30');
    await expect.poll(() => page.getByTestId('factor-length').textContent()).toBe('3.00');

    // Choosing another reading: area; with equal widths it matches length here.
    await page.locator('[data-reading=area] input[type=radio]').check();
    expect(await page.getByTestId('audit-verdict').textContent()).toContain('area reading');
    await page.locator('[data-reading=length] input[type=radio]').check();

    await page.getByTestId('audit-correct').click();
    await page.getByTestId('audit-answer').waitFor();
    expect(await page.getByTestId('audit-answer-caption').textContent()).toBe('Corrected for the length reading · lie factor 1.00');
    // The drawing's own labels (no font named) are drawn in the bundled sans; the heading in a font that is
    // not bundled is left out, and the app says which text and which font.
    expect(await page.getByTestId('sheet-note').allTextContents()).toContain(
      'The sheet leaves out one text of the supplied drawing it cannot show as drawn: "Tea room" in "Futura" (that font is not bundled). Only Noto Sans and the generic sans-serif are bundled; check these words against the supplied file.',
    );
    await screenshot(page, 'audit-02-svg-corrected');

    const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('audit-sheet-svg').click()]);
    expect(download.suggestedFilename()).toBe('tea-mockup audit sheet.svg');
    const sheet = (await readDownload(download)).toString('utf8');
    // The sheet holds both copies of the drawing, ids prefixed, and its captions as outlines.
    expect(sheet).toContain('id="supplied-bar-friday"');
    expect(sheet).toContain('id="corrected-bar-friday"');
    expect(sheet).not.toContain('<script');
    // The value labels are outlines in both panels (the words kept as each group's title), never live text.
    expect(sheet).not.toMatch(/<text/);
    expect(sheet.match(/<title>20<\/title><g transform="translate\(/g)?.length).toBe(2);
    if (hasRsvg) {
      // Independent renderer (rsvg-convert) over the whole sheet (278 mm wide: two 120 mm frames, 14 mm
      // apart, 12 mm margins). The drawing (160 × 120 units) fills each frame at 0.75 mm per unit; the
      // bars are told apart at x = 80 units. Same bar width, so pixel counts compare heights: the supplied
      // bars keep their 100 : 40 = 2.5; the corrected bars hold the data's 30 : 20 = 1.5 (within 1%).
      const bar = [0xc0, 0x57, 0x2b];
      const [suppliedMonday, suppliedFriday] = colourPixelsBySide(sheet, bar, 278, 12, 12 + 80 * 0.75, 132);
      const [correctedMonday, correctedFriday] = colourPixelsBySide(sheet, bar, 278, 146, 146 + 80 * 0.75, 266);
      expect(Math.abs(suppliedFriday / suppliedMonday / 2.5 - 1)).toBeLessThan(0.01);
      expect(Math.abs(correctedFriday / correctedMonday / 1.5 - 1)).toBeLessThan(0.01);
    }

    // The caution was shown once; dismissed, a fresh page does not show it again.
    await page.getByRole('button', { name: 'Understood' }).click();
    await page.reload();
    await toAudit();
    expect(await page.getByTestId('audit-caution').count()).toBe(0);
  }, 120_000);

  it('audits a supplied PNG: regions found as marks, typed values, redrawn as a verified unit chart, sheet PNG measured by pixels', async () => {
    await toAudit();
    await openSupplied(path.join(dir, 'squares-mockup.png'));
    expect(await page.locator('[data-testid=audit-outlines] .audit-mark').count()).toBe(2);
    // An image carries no labels to read: the values are typed.
    expect(await page.getByLabel('Value of mark 1').inputValue()).toBe('');
    await page.getByLabel('Value of mark 1').fill('16');
    await page.getByLabel('Value of mark 2').fill('25');
    // Both sides grow 1.5×, so area is suggested: area 2.25× against data 25/16 = 1.5625×,
    // (2.25 − 1) ÷ (1.5625 − 1) = 2.22 (Tufte's effect form).
    expect(await page.getByTestId('arithmetic-area').textContent()).toContain('(2.25 − 1) ÷ (1.563 − 1) = 1.25 ÷ 0.5625 = 2.22');
    await page.getByTestId('factor-area').waitFor();
    expect(await page.locator('[data-reading=area] .tag').textContent()).toBe('suggested');
    expect(await page.getByTestId('factor-area').textContent()).toBe('2.22');
    // Length: the side grows 1.5× against 1.5625×: (1.5 − 1) ÷ (0.5625) = 0.89.
    expect(await page.getByTestId('factor-length').textContent()).toBe('0.89');
    // An image cannot be rescaled in place.
    expect(await page.getByTestId('audit-correct').isDisabled()).toBe(true);
    await screenshot(page, 'audit-03-png-opened');

    await page.getByTestId('audit-redraw').click();
    await page.getByTestId('audit-answer').waitFor();
    expect(await page.getByTestId('audit-answer').getAttribute('data-kind')).toBe('redrawn');
    expect(await page.getByTestId('audit-answer-caption').textContent()).toMatch(/lie factor 1\.00 \(verified\)$/);
    await screenshot(page, 'audit-04-png-redrawn');

    await page.getByLabel('Sheet PNG resolution').selectOption('150');
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('audit-sheet-png').click()]);
    expect(download.suggestedFilename()).toBe('squares-mockup audit sheet.png');
    const bytes = await readDownload(download);
    fs.mkdirSync(SHOTS, { recursive: true });
    fs.writeFileSync(path.join(SHOTS, 'audit-05-sheet.png'), bytes);
    // PNG spec, pHYs chunk: pixels per metre, unit 1; 150 ppi = 150 / 0.0254 = 5906 px/m (rounded).
    if (hasPngcheck) expect(pngcheckPhys(bytes)).toEqual({ ppmX: 5906, ppmY: 5906, unit: 1 });
    const png = PNG.sync.read(bytes);
    // The sheet is 278 × 162 mm (two 120 mm frames, 14 mm apart, 12 mm margins, 30 mm captions): at 150 ppi
    // 278 / 25.4 × 150 = 1641.7 px wide.
    expect(Math.abs(png.width - (278 / 25.4) * 150)).toBeLessThanOrEqual(1);
    // The supplied image fills the left frame (240 px image → 120 mm): its two squares, told apart at the
    // image's x = 100 px (62 mm on the sheet), keep their drawn area ratio 60² / 40² = 2.25.
    const pxPerMm = png.width / 278;
    let left = 0, right = 0, redrawnInk = 0;
    for (let y = 0; y < png.height; y++) {
      for (let x = 0; x < png.width; x++) {
        const i = (y * png.width + x) * 4;
        const xMm = x / pxPerMm;
        const near = Math.abs(png.data[i] - SQUARE_RGB[0]) < 30 && Math.abs(png.data[i + 1] - SQUARE_RGB[1]) < 30 && Math.abs(png.data[i + 2] - SQUARE_RGB[2]) < 30;
        if (near && xMm > 12 && xMm < 62) left++;
        if (near && xMm >= 62 && xMm < 132) right++;
        const yMm = y / pxPerMm;
        const white = png.data[i] > 245 && png.data[i + 1] > 245 && png.data[i + 2] > 245;
        if (!white && xMm > 146.5 && xMm < 265.5 && yMm > 12.5 && yMm < 131.5) redrawnInk++;
      }
    }
    expect(Math.abs(right / left / 2.25 - 1)).toBeLessThan(0.03);
    // The redrawn chart fills the right frame with ink (glyphs, labels): not an empty panel.
    expect(redrawnInk).toBeGreaterThan(2000);
  }, 120_000);

  it('refuses a file that is neither SVG, PNG nor JPEG with a sentence, and keeps working', async () => {
    await toAudit();
    const bogus = path.join(dir, 'notes.svg');
    fs.writeFileSync(bogus, 'just some notes, not a drawing');
    const [chooser] = await Promise.all([page.waitForEvent('filechooser'), page.getByTestId('audit-open').click()]);
    await chooser.setFiles(bogus);
    await expect.poll(() => page.getByTestId('notice').textContent()).toBe('Could not audit notes.svg: "notes.svg" is not an SVG, PNG or JPEG file.');
    await openSupplied(path.join(dir, 'tea-mockup.svg'));
    expect(await page.locator('[data-testid=audit-outlines] .audit-mark').count()).toBe(2);
  }, 60_000);
  // These two run in order: the suite shares one browser context, and storage must not leak between tests.
  it('leaves unsaved chart work behind (a recovery copy in local storage)', async () => {
    await page.locator('#chart-title').fill('Left behind by an earlier test');
    await expect.poll(() => page.evaluate(() => localStorage.getItem('tallyglyph.recovery/1')), { timeout: 10_000 }).toContain('Left behind by an earlier test');
  }, 60_000);

  it('the next test opens without the recovery offer: each test starts with empty storage', async () => {
    await page.locator('#chart-title').waitFor();
    expect(await page.evaluate(() => localStorage.getItem('tallyglyph.recovery/1'))).toBeNull();
    expect(await page.getByTestId('recovery-banner').count()).toBe(0);
  }, 60_000);
});
