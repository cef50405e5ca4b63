// Glyphs of one's own in Chromium, end to end: an SVG file and a font character become the chart's
// glyph, travel inside the saved document, and the exported chart is re-verified from the file and
// measured by an independent renderer.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { PNG } from 'pngjs';
import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { DEMO_CHARTS } from '../../../shared-core/demo/demoCharts';
import { verifySvg } from '../../../shared-core/integrity';
import { renderChart } from '../../../shared-core/pipeline';
import { hasRsvg } from '../../helpers/independent';
import { CHROMIUM, haveChromium, openApp, readDownload, screenshot, startBrowserApp, type BrowserApp } from './helpers/browserApp';

// An invented studio icon: a cup whose body is an open filled path and whose handle is a stroke,
// drawn partly past its own viewBox (the saucer line reaches y = 21 of a 20-unit box).
const CUP_SVG = `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 20 20">
  <script>alert('not in a glyph')</script>
  <path d="M3 4 H15 V12 A6 6 0 0 1 3 12" fill="#222"/>
  <path d="M15 6 h2 a3 3 0 0 1 0 6 h-2" fill="none" stroke="#222" stroke-width="1.5"/>
  <rect x="1" y="19" width="18" height="2" fill="#222"/>
</svg>`;

const SYSTEM_FONT = '/usr/share/fonts/truetype/dejavu/DejaVuSans.ttf';

let app: BrowserApp;
let page: Page;
let errors: string[] = [];
let dir: string;

async function waitForVerdict(kind: 'pass' | 'refused'): Promise<void> {
  await page.locator(`[data-testid=verdict][data-verdict=${kind}][data-current=true]`).waitFor({ timeout: 30_000 });
  await page.locator('[data-testid=busy]:not(:has(.spinner))').waitFor({ state: 'attached', timeout: 30_000 });
}

/** Ink (sum of alpha / 255) of one element alone, as rsvg-convert renders it at 600 dpi (export-id). */
function rsvgInkOfId(svg: string, id: string): number {
  const work = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyglyph-mark-'));
  try {
    fs.writeFileSync(path.join(work, 'in.svg'), svg);
    const run = spawnSync('rsvg-convert', ['-i', id, '-d', '600', '-p', '600', '-f', 'png', '-o', path.join(work, 'out.png'), path.join(work, 'in.svg')], { encoding: 'utf8', timeout: 120_000 });
    if (run.status !== 0) throw new Error(`rsvg-convert failed: ${run.stderr}`);
    const decoded = PNG.sync.read(fs.readFileSync(path.join(work, 'out.png')));
    let total = 0;
    for (let i = 3; i < decoded.data.length; i += 4) total += decoded.data[i];
    return total / 255;
  } finally {
    fs.rmSync(work, { recursive: true, force: true });
  }
}

/** Exports the chart's SVG, checks it from the file alone and, with rsvg-convert, that ink follows the data. */
async function exportAndCheck(): Promise<string> {
  await waitForVerdict('pass');
  const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('export-svg').click()]);
  const svg = (await readDownload(download)).toString('utf8');
  const report = verifySvg(svg);
  expect(report.pass).toBe(true);
  if (hasRsvg) {
    // Independent renderer: ink-true units make each mark's ink proportional to its value, so the
    // ink ratio of two marks equals their data ratio (Tufte's lie factor 1; within 1% of edge pixels).
    const marks = report.marks.slice(0, 2);
    const ratio = rsvgInkOfId(svg, marks[1].id) / rsvgInkOfId(svg, marks[0].id);
    const dataRatio = marks[1].value / marks[0].value;
    expect(Math.abs(ratio / dataRatio - 1)).toBeLessThan(0.01);
  }
  return svg;
}

describe.skipIf(!haveChromium)(`own glyphs in Chromium (skipped when ${CHROMIUM} is missing)`, () => {
  beforeAll(async () => {
    app = await startBrowserApp();
    dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyglyph-glyphs-ui-'));
    fs.writeFileSync(path.join(dir, 'Studio Cup.svg'), CUP_SVG);
  }, 180_000);

  afterAll(async () => {
    await app?.close();
    if (dir) fs.rmSync(dir, { recursive: true, force: true });
  });

  beforeEach(async () => {
    errors = [];
    page = await openApp(app, errors);
    await waitForVerdict('pass');
  });

  afterEach(async () => {
    await page.close();
    expect(errors, 'errors in the page').toEqual([]);
  });

  it('imports an SVG as a glyph with its geometry warnings, keeps it in the saved document, and exports a verified chart with it', async () => {
    const [chooser] = await Promise.all([page.waitForEvent('filechooser'), page.getByTestId('import-svg-glyph').click()]);
    await chooser.setFiles(path.join(dir, 'Studio Cup.svg'));
    await page.getByTestId('glyph-warnings').waitFor();
    const codes = await page.locator('[data-testid=glyph-warnings] li').evaluateAll((items) => items.map((li) => li.getAttribute('data-code')));
    expect(codes).toEqual(expect.arrayContaining(['sheet-dropped', 'strokes-converted', 'open-path', 'ink-outside-box']));
    // The glyph is now the chart's, listed with its ink share of its box.
    expect(await page.getByTestId('chart-glyph').textContent()).toContain('own:studio-cup');
    expect(await page.locator('[data-glyph="own:studio-cup"] [data-testid=own-glyph-share]').textContent()).toMatch(/^ink \d+% of its box · Studio Cup\.svg$/);
    await waitForVerdict('pass');
    await screenshot(page, 'glyphs-01-svg-imported');

    const svg = await exportAndCheck();
    expect(svg).not.toContain('alert');

    // Saved, the document carries the glyph; laid out again in Node from that file alone, it passes.
    const [saved] = await Promise.all([page.waitForEvent('download'), page.getByTestId('save').click()]);
    const doc = JSON.parse((await readDownload(saved)).toString('utf8'));
    expect(doc.encoding.glyph).toBe('own:studio-cup');
    expect(Object.keys(doc.glyphs)).toEqual(['own:studio-cup']);
    expect(doc.glyphs['own:studio-cup'].svg).not.toContain('script');
    expect(renderChart(doc).report.pass).toBe(true);

    // Undo takes the import back: the chart returns to the demo's own glyph.
    await page.getByTestId('undo').click();
    expect(await page.getByTestId('chart-glyph').textContent()).toContain(DEMO_CHARTS[0].document.encoding.glyph as string);
  }, 120_000);

  it('takes a glyph from a character of the bundled symbol font and exports a verified chart with it', async () => {
    await page.getByTestId('font-glyph').click();
    await expect.poll(() => page.getByTestId('font-glyph-font').textContent(), { timeout: 20_000 }).toBe('Noto Sans Symbols 2');
    await page.getByRole('option', { name: 'U+2605 ★' }).click();
    expect(await page.getByTestId('chart-glyph').textContent()).toContain('own:u2605');
    expect(await page.locator('[data-glyph="own:u2605"] [data-testid=own-glyph-share]').textContent()).toContain('U+2605 ★ from Noto Sans Symbols 2');
    await waitForVerdict('pass');
    await screenshot(page, 'glyphs-02-font-star');
    await exportAndCheck();

    // A code typed by hand: the check mark.
    await page.getByLabel('Character or its code').fill('U+2713');
    await page.getByTestId('add-font-glyph').click();
    expect(await page.getByTestId('chart-glyph').textContent()).toContain('own:u2713');
    // A character the font lacks is refused with a sentence.
    await page.getByLabel('Character or its code').fill('♪');
    await page.getByTestId('add-font-glyph').click();
    expect(await page.locator('[data-testid=font-glyph-picker] .field-problem').textContent()).toBe('Noto Sans Symbols 2 has no glyph for U+266A (♪).');
  }, 120_000);

  it('browses the bundled glyphs by category, each with its ink share of its box, and lists own glyphs under yours', async () => {
    await page.getByTestId('chart-glyph').click();
    await page.getByRole('radio', { name: 'shapes' }).click();
    const cells = page.locator('.glyph-picker .glyph-cell');
    const titles = await cells.evaluateAll((els) => els.map((el) => el.getAttribute('title') ?? ''));
    expect(titles.length).toBeGreaterThan(3);
    expect(titles.every((t) => t.includes('(shapes'))).toBe(true);
    // Closed forms: a disc fills π/4 = 78.5% of its box; the bundled square (side 192, corner radius 16)
    // fills 1 − (4 − π)·16² / 192² = 99.4%.
    const shareOf = (name: string) => page.locator(`.glyph-picker .glyph-cell[title^="${name} ("] [data-testid=glyph-share]`).textContent();
    expect(await shareOf('circle')).toBe('79%');
    expect(await shareOf('square')).toBe('99%');
    await screenshot(page, 'glyphs-04-browse-shapes');
    // Search works within a category: "tractor" is in transport, not in shapes.
    await page.getByLabel('Search glyphs').fill('tractor');
    expect(await cells.count()).toBe(0);
    await page.getByRole('radio', { name: 'transport' }).click();
    expect(await cells.first().getAttribute('title')).toMatch(/^tractor \(transport/);
    await page.keyboard.press('Escape');

    // An own glyph appears under "yours" and can be picked for the chart from there.
    await page.getByTestId('font-glyph').click();
    await expect.poll(() => page.getByTestId('font-glyph-font').textContent(), { timeout: 20_000 }).toBe('Noto Sans Symbols 2');
    await page.getByRole('option', { name: 'U+25A0 ■' }).click();
    await page.getByTestId('chart-glyph').click();
    await page.getByRole('radio', { name: 'yours' }).click();
    expect(await cells.count()).toBe(1);
    // A filled square fills its whole box (closed form: 100%).
    expect(await cells.first().locator('[data-testid=glyph-share]').textContent()).toBe('100%');
  }, 120_000);

  it.skipIf(!fs.existsSync(SYSTEM_FONT))('takes a letter from a font file the designer opens (TTF through opentype.js)', async () => {
    await page.getByTestId('font-glyph').click();
    await expect.poll(() => page.getByTestId('font-glyph-font').textContent(), { timeout: 20_000 }).toBe('Noto Sans Symbols 2');
    const [chooser] = await Promise.all([page.waitForEvent('filechooser'), page.getByTestId('open-font-file').click()]);
    await chooser.setFiles(SYSTEM_FONT);
    await expect.poll(() => page.getByTestId('font-glyph-font').textContent()).toBe('DejaVu Sans');
    await page.getByLabel('Character or its code').fill('A');
    await page.getByTestId('add-font-glyph').click();
    expect(await page.getByTestId('chart-glyph').textContent()).toContain('own:a');
    await screenshot(page, 'glyphs-03-font-file');
    await exportAndCheck();
  }, 120_000);
});
