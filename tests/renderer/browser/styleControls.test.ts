// Every layout and style control in Debian's Chromium: change it as a designer would, export the SVG, and
// find the change in the written file (colours of marks, geometry measured by resvg, the words of <text>,
// the order of marks, the background rect), with the file still passing verification; then Save and Open.
import fs from 'node:fs';
import { Resvg } from '@resvg/resvg-js';
import type { BrowserContext, Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_CHARTS } from '../../../shared-core/demo/demoCharts';
import { verifySvg } from '../../../shared-core/integrity';
import { PALETTE } from '../../../shared-core/layout';
import { CHROMIUM, haveChromium, shot, startApp, waitForVerdict, type AppServer } from './helpers/appServer';

/** The bike demo: repeat, one row per category, 50 rides per glyph, 420 / 275 / 610 / 135 rides. */
const BIKES = DEMO_CHARTS[0].document;

/** An invented household log, written with <text> (not outlines) so the file's words can be read back. */
const WATER = {
  format: 'tallyglyph.chart/1',
  title: 'Water used per chore in one week',
  source: 'Invented household log',
  outlineText: false,
  data: [
    { label: 'Dishes', value: 12 },
    { label: 'Laundry', value: 45.5 },
    { label: 'Plants', value: 7 },
    { label: 'Shower', value: 80 },
  ],
  encoding: { mode: 'repeat', unit: 5, unitName: 'litres', glyph: 'drop' },
  page: { width: 180, height: 120, unit: 'mm' },
};

let app: AppServer | null = null;
let context: BrowserContext;
const pages: Page[] = [];
let pageErrors: string[] = [];

async function openApp(): Promise<Page> {
  const page = await context.newPage();
  pages.push(page);
  page.on('pageerror', (e) => pageErrors.push(e.message));
  page.on('console', (m) => {
    if (m.type() === 'error') pageErrors.push(m.text());
  });
  await page.goto(app!.base);
  await waitForVerdict(page, 'pass');
  return page;
}

async function openDocument(page: Page, name: string, doc: unknown): Promise<void> {
  const [chooser] = await Promise.all([page.waitForEvent('filechooser'), page.getByRole('button', { name: 'Open', exact: true }).click()]);
  await chooser.setFiles({ name, mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(doc)) });
  await expect.poll(() => page.getByTestId('doc-name').textContent()).toBe(name);
  await waitForVerdict(page, 'pass');
}

/** Exports the SVG the app shows now (after its check passed) and checks the file verifies on its own. */
async function exportSvg(page: Page): Promise<string> {
  await waitForVerdict(page, 'pass');
  await expect.poll(() => page.getByTestId('export-svg').isEnabled()).toBe(true);
  const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('export-svg').click()]);
  const svg = fs.readFileSync(await download.path(), 'utf8');
  expect(verifySvg(svg).pass, 'the exported chart verifies').toBe(true);
  return svg;
}

interface Piece {
  part: string;
  fill: string;
  box: { x: number; y: number; width: number; height: number };
}

/** Each mark's pieces with the ink box resvg finds for the piece alone (an independent renderer's geometry). */
function marksOf(svg: string): { label: string; pieces: Piece[] }[] {
  const boxOf = (d: string) => new Resvg(`<svg xmlns="http://www.w3.org/2000/svg" width="400" height="400" viewBox="0 0 400 400"><path d="${d}"/></svg>`).getBBox()!;
  // Full glyphs placed with <use> (references are the default): the <defs> shape's box moved by x and y (SVG 1.1 'use').
  const defs = new Map([...(/<defs>([\s\S]*?)<\/defs>/.exec(svg)?.[1] ?? '').matchAll(/<path id="([^"]+)" d="([^"]*)"\/>/g)].map((m) => [m[1], m[2]] as const));
  return [...svg.matchAll(/<g id="mark-\d+" class="tg-mark" data-label="([^"]*)"[^>]*>([\s\S]*?)<\/g>/g)].map((m) => ({
    label: m[1],
    pieces: [...m[2].matchAll(/<(path|use)([^>]*)\/>/g)].map((p) => {
      const attrs = p[2];
      const isUse = p[1] === 'use';
      const d = isUse ? defs.get(/xlink:href="#([^"]+)"/.exec(attrs)![1])! : /\bd="([^"]*)"/.exec(attrs)![1];
      const box = boxOf(d);
      const dx = isUse ? Number(/\bx="([^"]*)"/.exec(attrs)![1]) : 0;
      const dy = isUse ? Number(/\by="([^"]*)"/.exec(attrs)![1]) : 0;
      return { part: /data-part="(\w+)"/.exec(attrs)![1], fill: /\bfill="([^"]*)"/.exec(attrs)![1], box: { x: box.x + dx, y: box.y + dy, width: box.width, height: box.height } };
    }),
  }));
}

/** The words of each <text> with a role, in file order (the file is written with outlineText false). */
function textsOf(svg: string, role: string): { text: string; fontFamily: string; sizePt: number }[] {
  return [...svg.matchAll(/<g class="tg-text" data-role="([^"]*)" data-size-pt="([^"]*)"><text[^>]*font-family="([^"]*)"[^>]*>([^<]*)<\/text>/g)]
    .filter((m) => m[1] === role)
    .map((m) => ({ text: m[4], fontFamily: m[3], sizePt: Number(m[2]) }));
}

const section = (page: Page, name: string) => page.locator('details.section', { has: page.locator('summary', { hasText: name }) });
const radio = (page: Page, group: string, name: string) => page.getByTestId(group).getByRole('radio', { name, exact: true });

describe.skipIf(!haveChromium)(`layout and style controls in Chromium (skipped when ${CHROMIUM} is missing)`, () => {
  beforeAll(async () => {
    app = await startApp();
    context = await app.browser.newContext({ viewport: { width: 1440, height: 900 }, acceptDownloads: true });
  }, 180_000);

  afterAll(async () => {
    await app?.close();
  });

  afterEach(async () => {
    for (const p of pages.splice(0)) if (!p.isClosed()) await p.close();
    expect(pageErrors, 'errors in the page').toEqual([]);
    pageErrors = [];
  });

  it('a row colour paints that category’s marks; the automatic swatch shows the palette colour; undo is one step', async () => {
    const page = await openApp();
    const mill = BIKES.data[1].label;
    // Automatic: the second palette colour (the layout's categoryColor by place).
    expect(await page.getByTestId('row-color-2').inputValue()).toBe(PALETTE[1]);
    await page.getByTestId('row-color-2').fill('#0b6e4f');
    await waitForVerdict(page, 'pass');
    const svg = await exportSvg(page);
    const marks = marksOf(svg);
    expect(new Set(marks.find((m) => m.label === mill)!.pieces.map((p) => p.fill))).toEqual(new Set(['#0b6e4f']));
    expect(new Set(marks.find((m) => m.label === BIKES.data[0].label)!.pieces.map((p) => p.fill))).toEqual(new Set([PALETTE[0]]));
    await shot(page, 'style-01-row-colour');

    await page.getByTestId('undo').click();
    await waitForVerdict(page, 'pass');
    expect(await page.getByTestId('row-color-2').inputValue()).toBe(PALETTE[1]);
    expect(new Set(marksOf(await exportSvg(page)).find((m) => m.label === mill)!.pieces.map((p) => p.fill))).toEqual(new Set([PALETTE[1]]));
  });

  it('two categories given one colour in a shared grid: the core’s refusal shows under the table and export is off until one goes back to automatic', async () => {
    const page = await openApp();
    await page.getByTestId('arrangement-group').getByRole('radio', { name: 'One shared grid' }).click();
    await waitForVerdict(page, 'pass');
    await page.getByTestId('row-color-2').fill(PALETTE[0]);
    await expect.poll(() => page.getByTestId('color-note').textContent(), { timeout: 30_000 }).toMatch(new RegExp(`"${BIKES.data[0].label}" and "${BIKES.data[1].label}" are both ${PALETTE[0]}`));
    expect(await page.getByTestId('export-svg').isDisabled()).toBe(true);
    await shot(page, 'style-02-equal-colours-refused');
    await page.getByRole('button', { name: 'Colour of row 2 back to automatic' }).click();
    await waitForVerdict(page, 'pass');
    expect(await page.getByTestId('color-note').count()).toBe(0);
    await exportSvg(page);
  });

  it('glyph size and gap are found in the file’s geometry (resvg’s ink boxes of neighbouring glyphs)', async () => {
    const page = await openApp();
    await section(page, 'Size & order').getByLabel('Glyph size: automatic').uncheck();
    await page.getByTestId('glyph-size').fill('6');
    await page.getByTestId('glyph-gap').fill('50');
    await page.getByTestId('glyph-gap').blur();
    const svg = await exportSvg(page);
    const harbour = marksOf(svg).find((m) => m.label === BIKES.data[0].label)!;
    const full = harbour.pieces.filter((p) => p.part === 'full');
    // Glyph size is the longer side of the ink box (layoutContext sizePerRootInk, one glyph): 6 mm.
    for (const p of full) expect(Math.max(p.box.width, p.box.height)).toBeCloseTo(6, 2);
    // The gap between neighbours in a row is 50% of 6 mm.
    const row = full.filter((p) => Math.abs(p.box.y - full[0].box.y) < 0.01);
    expect(row.length).toBeGreaterThan(2);
    for (let i = 1; i < row.length; i++) expect(row[i].box.x - (row[i - 1].box.x + row[i - 1].box.width)).toBeCloseTo(3, 2);
    await shot(page, 'style-03-size-gap');

    // Grouped in fives: one extra gap after every fifth glyph of a row (the document contract), so 6 mm there.
    await radio(page, 'group-group', 'In fives').click();
    const grouped = marksOf(await exportSvg(page)).find((m) => m.label === BIKES.data[0].label)!.pieces;
    const firstRow = grouped.filter((p) => Math.abs(p.box.y + p.box.height - (grouped[0].box.y + grouped[0].box.height)) < 0.5);
    expect(firstRow.length).toBeGreaterThanOrEqual(6);
    const gaps = firstRow.slice(1).map((p, i) => p.box.x - (firstRow[i].box.x + firstRow[i].box.width));
    gaps.slice(0, 5).forEach((g, i) => expect(g, `gap after glyph ${i + 1}`).toBeCloseTo(i === 4 ? 6 : 3, 2));
  });

  it('glyphs per row wraps each category after that many glyphs; right to left puts the partial glyph on the left of its row', async () => {
    const page = await openApp();
    await section(page, 'Size & order').getByLabel('Glyphs per row: automatic').uncheck();
    await page.getByTestId('columns').fill('4');
    await page.getByTestId('columns').blur();
    let svg = await exportSvg(page);
    // Harbour Gate: 420 / 50 = 8.4 glyphs, so 9 slots in rows of 4, 4, 1.
    let harbour = marksOf(svg).find((m) => m.label === BIKES.data[0].label)!;
    const rows = new Map<number, number>();
    for (const p of harbour.pieces) rows.set(Math.round(p.box.y + p.box.height), (rows.get(Math.round(p.box.y + p.box.height)) ?? 0) + 1);
    expect([...rows.values()].sort((a, b) => b - a)).toEqual([4, 4, 1]);

    // Old Market: 610 / 50 = 12.2 glyphs; left to right its partial glyph sits right of the full ones in its row.
    const partialLeftOfRow = (s: string) => {
      const market = marksOf(s).find((m) => m.label === BIKES.data[2].label)!;
      const partial = market.pieces.find((p) => p.part === 'partial')!;
      const sameRow = market.pieces.filter((p) => p.part === 'full' && Math.abs(p.box.y + p.box.height - (partial.box.y + partial.box.height)) < 1);
      return sameRow.length === 0 ? null : partial.box.x < Math.min(...sameRow.map((p) => p.box.x));
    };
    await page.getByTestId('columns').fill('5');
    await page.getByTestId('columns').blur();
    svg = await exportSvg(page);
    expect(partialLeftOfRow(svg)).toBe(false);
    await radio(page, 'direction-group', 'Right to left').click();
    svg = await exportSvg(page);
    expect(partialLeftOfRow(svg)).toBe(true);
    harbour = marksOf(svg).find((m) => m.label === BIKES.data[0].label)!;
    expect(harbour.pieces).toHaveLength(9);
    await shot(page, 'style-04-columns-direction');
  });

  it('sort reorders the chart’s categories, not the table', async () => {
    const page = await openApp();
    await radio(page, 'sort-group', 'Largest first').click();
    let svg = await exportSvg(page);
    const byValue = [...BIKES.data].sort((a, b) => b.value - a.value).map((d) => d.label);
    expect(marksOf(svg).map((m) => m.label)).toEqual(byValue);
    // The table keeps the designer's order.
    for (const [i, d] of BIKES.data.entries()) expect(await page.getByLabel(`Label of row ${i + 1}`, { exact: true }).inputValue()).toBe(d.label);
    // Arrow keys move through the choices (WAI-ARIA radio group).
    await radio(page, 'sort-group', 'Largest first').press('ArrowRight');
    svg = await exportSvg(page);
    expect(marksOf(svg).map((m) => m.label)).toEqual([...byValue].reverse());
  });

  it('value labels take a unit ("12 L"), title and source take their sizes, the font its family, the key its wording', async () => {
    const page = await openApp();
    await openDocument(page, 'water.json', WATER);
    const types = section(page, 'Type & labels');
    await page.getByTestId('value-unit').fill('L');
    let svg = await exportSvg(page);
    expect(textsOf(svg, 'value-label').map((t) => t.text)).toEqual(['12 L', '45.5 L', '7 L', '80 L']);

    await page.getByTestId('title-size').fill('20');
    await page.getByTestId('source-size').fill('9');
    await page.getByTestId('source-size').blur();
    svg = await exportSvg(page);
    // data-size-pt is the text size in points (docs/chart-svg.md); 1 pt = 25.4/72 mm (CSS Values and Units).
    expect(textsOf(svg, 'title')[0].sizePt).toBe(20);
    expect(textsOf(svg, 'source')[0].sizePt).toBe(9);
    expect(Number(/font-size="([^"]*)"[^>]*>Water used/.exec(svg)![1])).toBeCloseTo((20 * 25.4) / 72, 2);

    await radio(page, 'font-group', 'Serif').click();
    svg = await exportSvg(page);
    expect(new Set([...svg.matchAll(/font-family="([^"]*)"/g)].map((m) => m[1]))).toEqual(new Set(['Noto Serif']));

    // The key wording: the amount and the unit name come from the chart, typed with its placeholders.
    await page.getByTestId('key-wording').fill('Each drop = {amount} {unit}');
    svg = await exportSvg(page);
    expect(textsOf(svg, 'legend').map((t) => t.text)).toEqual(['Each drop = 5 litres']);
    // Without {amount} the wording is refused inline and export waits.
    await page.getByTestId('key-wording').fill('Each drop = a bucket');
    await page.getByTestId('key-wording-problem').waitFor();
    expect(await page.getByTestId('key-wording-problem').textContent()).toMatch(/\{amount\}/);
    await expect.poll(() => page.getByTestId('export-svg').isDisabled()).toBe(true);
    await types.scrollIntoViewIfNeeded();
    await shot(page, 'style-05-type-and-labels-key-problem');
    await page.getByTestId('key-wording').fill('{amount} {unit} per drop');
    svg = await exportSvg(page);
    expect(textsOf(svg, 'legend').map((t) => t.text)).toEqual(['5 litres per drop']);
  });

  it('category labels go above their rows or beside them, flush left or flush right', async () => {
    const page = await openApp();
    await openDocument(page, 'water.json', WATER);
    const labels = async () =>
      [...(await exportSvg(page)).matchAll(/data-role="label"[^>]*><text x="([^"]*)" y="([^"]*)"[^>]*text-anchor="([^"]*)"[^>]*>([^<]*)</g)].map((m) => ({ x: Number(m[1]), y: Number(m[2]), anchor: m[3], text: m[4] }));
    const beside = await labels();
    // Beside and flush left (the standard look): every label starts at the left margin (10 mm).
    expect(beside.map((l) => [l.text, l.anchor, l.x])).toEqual(WATER.data.map((d) => [d.label, 'start', 10]));
    await radio(page, 'label-align-group', 'Flush right').click();
    const besideEnd = await labels();
    // Flush right: anchored at their end, all at one x, right of the margin, on the same baselines as before.
    expect(new Set(besideEnd.map((l) => l.anchor))).toEqual(new Set(['end']));
    expect(new Set(besideEnd.map((l) => l.x)).size).toBe(1);
    expect(besideEnd[0].x).toBeGreaterThan(10);
    expect(besideEnd.map((l) => l.y)).toEqual(beside.map((l) => l.y));
    await radio(page, 'label-position-group', 'Above the glyphs').click();
    await radio(page, 'label-align-group', 'Flush left').click();
    const svg = await exportSvg(page);
    const above = await labels();
    // Above: each label's baseline is at or above the top of its own row's ink (resvg's box of the mark's pieces).
    const marks = marksOf(svg);
    for (const l of above) {
      const inkTop = Math.min(...marks.find((m) => m.label === l.text)!.pieces.map((p) => p.box.y));
      expect(l.y, l.text).toBeLessThanOrEqual(inkTop + 0.01);
    }
    expect(new Set(above.map((l) => l.anchor))).toEqual(new Set(['start']));
    await shot(page, 'style-07-labels-above');
  });

  it('labels, values and key switch off in the file; the background paints a rect to the bleed edge in the chosen colour', async () => {
    const page = await openApp();
    let svg = await exportSvg(page);
    expect(svg).toMatch(/data-role="label"/);
    expect(svg).toMatch(/data-role="value-label"/);
    expect(svg).toMatch(/class="tg-legend"/);
    expect(svg).not.toMatch(/tg-background/);
    await page.getByTestId('show-labels').uncheck();
    await page.getByTestId('show-values').uncheck();
    await page.getByTestId('show-key').uncheck();
    await page.getByTestId('page-background-on').check();
    await page.getByTestId('page-background').fill('#fdf6e3');
    svg = await exportSvg(page);
    expect(svg).not.toMatch(/data-role="label"/);
    expect(svg).not.toMatch(/data-role="value-label"/);
    expect(svg).not.toMatch(/class="tg-legend"/);
    expect(svg).toMatch(/<rect[^>]*class="tg-background"[^>]*fill="#fdf6e3"|<rect[^>]*fill="#fdf6e3"[^>]*class="tg-background"/);
  });

  it('every setting survives Save and Open, and the controls show it again', async () => {
    const page = await openApp();
    await page.getByTestId('row-color-3').fill('#0b6e4f');
    await section(page, 'Size & order').getByLabel('Glyph size: automatic').uncheck();
    await page.getByTestId('glyph-size').fill('5');
    await page.getByTestId('glyph-gap').fill('30');
    await radio(page, 'sort-group', 'Smallest first').click();
    await page.getByTestId('value-unit').fill('rides');
    await radio(page, 'font-group', 'Serif').click();
    await page.getByTestId('title-size').fill('18');
    await page.getByTestId('key-wording').fill('{amount} {unit} a bike');
    await page.getByTestId('key-wording').blur();
    const before = await exportSvg(page);
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('save').click()]);
    const saved = JSON.parse(fs.readFileSync(await download.path(), 'utf8'));
    expect(saved.data[2].color).toBe('#0b6e4f');
    expect(saved.layout).toMatchObject({ glyphSizeMm: 5, gapRatio: 0.3, sort: 'ascending', valueUnit: 'rides', font: 'serif', titleSizePt: 18, keyWording: '{amount} {unit} a bike' });

    await page.getByTestId('demo-picker').selectOption(DEMO_CHARTS[1].name);
    await waitForVerdict(page, 'pass');
    await openDocument(page, 'saved.json', saved);
    expect(await page.getByTestId('row-color-3').inputValue()).toBe('#0b6e4f');
    expect(await page.getByTestId('glyph-size').inputValue()).toBe('5');
    expect(await page.getByTestId('glyph-gap').inputValue()).toBe('30');
    expect(await radio(page, 'sort-group', 'Smallest first').getAttribute('aria-checked')).toBe('true');
    expect(await radio(page, 'font-group', 'Serif').getAttribute('aria-checked')).toBe('true');
    expect(await page.getByTestId('value-unit').inputValue()).toBe('rides');
    expect(await page.getByTestId('title-size').inputValue()).toBe('18');
    expect(await page.getByTestId('key-wording').inputValue()).toBe('{amount} {unit} a bike');
    // The reopened document draws the very same file.
    expect(await exportSvg(page)).toBe(before);
  });

  it('keyboard: every new control is reached with Tab and named; typing a size is one undo step', async () => {
    const page = await openApp();
    const named = ['glyph-size-auto', 'glyph-gap', 'columns-auto', 'sort-group', 'direction-group', 'show-labels', 'value-unit', 'font-group', 'title-size', 'source-size', 'key-wording', 'row-color-1'];
    for (const id of named) {
      const el = page.getByTestId(id);
      const target = (await el.getAttribute('role')) === 'radiogroup' ? el.locator('[tabindex="0"]') : el;
      expect(await target.evaluate((e) => (e as HTMLElement).tabIndex)).toBe(0);
      const name = await target.evaluate((e) => {
        const el = e as HTMLElement & { labels?: NodeListOf<HTMLLabelElement> | null };
        return el.getAttribute('aria-label') ?? el.labels?.[0]?.textContent ?? el.textContent ?? '';
      });
      expect(name.trim(), id).not.toBe('');
    }
    await page.getByTestId('title-size').click();
    await page.getByTestId('title-size').press('Control+a');
    await page.getByTestId('title-size').pressSequentially('24');
    await page.getByTestId('title-size').press('Tab');
    await waitForVerdict(page, 'pass');
    expect(await page.getByTestId('undo').getAttribute('title')).toMatch(/^Undo title size change/);
    await page.getByTestId('undo').click();
    await waitForVerdict(page, 'pass');
    expect(await page.getByTestId('title-size').inputValue()).toBe('14.2');
    expect(await page.getByTestId('undo').isDisabled()).toBe(true);
  });

  it('a long refusal keeps the status bar to one line, the whole sentence in its title and on focus', async () => {
    const page = await openApp();
    // The narrowest window the app allows (.app min-width), where a refusal is longer than the bar.
    await page.setViewportSize({ width: 1000, height: 800 });
    await page.getByLabel('Value of row 1', { exact: true }).fill('-5');
    await page.keyboard.press('Control+e');
    const notice = page.getByTestId('notice');
    await expect.poll(() => notice.textContent()).toMatch(/^Fix the table first/);
    const full = (await notice.textContent())!;
    expect(await notice.getAttribute('title')).toBe(full);
    const bar = await page.locator('.statusbar').boundingBox();
    const line = await notice.boundingBox();
    // One line of 12 px text in a 28 px bar.
    expect(bar!.height).toBeLessThanOrEqual(29);
    expect(line!.height).toBeLessThan(24);
    expect(await notice.evaluate((e) => e.scrollWidth > e.clientWidth)).toBe(true);
    await notice.focus();
    await shot(page, 'style-06-status-focus');
    expect(await notice.evaluate((e) => getComputedStyle(e).whiteSpace)).toBe('normal');
  });
});
