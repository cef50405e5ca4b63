// The integrity panel in Debian's Chromium, with the desktop host's real file handlers: a finding appears
// for the chart on screen, its fix is applied through a dialog, and the exported file (re-measured here
// with verifySvg) carries the adjusted values and the footnote; a finding set aside with a reason is saved
// in the document and still set aside after the file is opened again; undo restores each step.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { BrowserContext, Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { verifySvg } from '../../../shared-core/integrity';
import { readChartSvg } from '../../../shared-core/svg';
import { haveChromium, CHROMIUM, shot, startApp, waitForVerdict, type AppServer } from './helpers/appServer';
import { installDesktopHost, type DesktopHost } from './helpers/desktopHost';

// US consumer price index, all urban consumers, annual averages (1982-84 = 100), as printed in Moore,
// Statistics: Concepts and Controversies, ch. 16: 1982 96.5, 2000 172.2, 2005 195.3. The conversion
// amount_B = amount_A x CPI_B / CPI_A is the one published there.
const CPI = { '1982': '96.5', '2000': '172.2', '2005': '195.3' };

/** Invented: a festival's ticket takings in the dollars of each year. */
const TAKINGS = {
  format: 'tallyglyph.chart/1',
  title: 'Festival ticket takings',
  source: 'Box office ledgers, invented data',
  data: [
    { label: '1982', value: 10000 },
    { label: '2000', value: 20000 },
    { label: '2005', value: 25000 },
  ],
  encoding: { mode: 'repeat', glyph: 'coin', unitName: 'dollars', rounding: 'ink-cut' },
  page: { width: 180, height: 120, unit: 'mm' },
  outlineText: false,
};

/** Invented: library loans in two districts of very different size, with each district's residents. */
const LOANS = {
  format: 'tallyglyph.chart/1',
  title: 'Library loans by district',
  source: 'District library returns, invented data',
  data: [
    { label: 'Northside', value: 54 },
    { label: 'Riverside', value: 91 },
  ],
  encoding: { mode: 'repeat', glyph: 'book', unitName: 'loans', rounding: 'ink-cut' },
  page: { width: 180, height: 120, unit: 'mm' },
  outlineText: false,
  standardise: { columns: { population: { unitName: 'residents', values: { Northside: 12000, Riverside: 26000 } } } },
};

let app: AppServer | null = null;
const contexts: BrowserContext[] = [];
let pageErrors: string[] = [];
let folder = '';

async function openPage(): Promise<{ page: Page; host: DesktopHost }> {
  if (!app) throw new Error('app not started');
  const context = await app.browser.newContext({ viewport: { width: 1440, height: 1000 } });
  contexts.push(context);
  const host = await installDesktopHost(context, folder);
  const page = await context.newPage();
  page.on('pageerror', (e) => pageErrors.push(e.message));
  page.on('console', (m) => {
    if (m.type() === 'error') pageErrors.push(m.text());
  });
  await page.goto(app.base);
  await waitForVerdict(page, 'pass');
  return { page, host };
}

/** Opens a chart document through the desktop host's Open dialog (answered with `file`). */
async function openDocument(page: Page, host: DesktopHost, file: string): Promise<void> {
  host.nextOpenPath = file;
  await page.locator('button[title^="Open a chart document"]').click();
  await page.getByTestId('notice').filter({ hasText: `Opened ${path.basename(file)}` }).waitFor();
  await waitForVerdict(page, 'pass');
  await page.locator('[data-testid=integrity-panel] .panel-body:not(.integrity-stale)').waitFor();
}

function writeDoc(name: string, doc: unknown): string {
  const file = path.join(folder, name);
  fs.writeFileSync(file, JSON.stringify(doc, null, 2));
  return file;
}

/** Exports the SVG through the desktop host's save dialog and returns the written file's text. */
async function exportSvg(page: Page, host: DesktopHost, name: string): Promise<string> {
  host.nextSaveName = name;
  await page.getByTestId('export-svg').click();
  await page.getByTestId('notice').filter({ hasText: `Exported ${name}` }).waitFor();
  return fs.readFileSync(path.join(folder, name), 'utf8');
}

async function settled(page: Page): Promise<void> {
  await waitForVerdict(page, 'pass');
  await page.locator('[data-testid=integrity-panel] .panel-body:not(.integrity-stale)').waitFor();
}

function finding(page: Page, code: string) {
  return page.locator(`[data-testid=integrity-finding][data-code="${code}"]`);
}

describe.skipIf(!haveChromium)(`integrity panel in Chromium (skipped when ${CHROMIUM} is missing)`, () => {
  beforeAll(async () => {
    folder = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyglyph-integrity-'));
    app = await startApp();
  }, 180_000);

  afterAll(async () => {
    await app?.close();
    fs.rmSync(folder, { recursive: true, force: true });
  });

  afterEach(async () => {
    for (const c of contexts.splice(0)) await c.close();
    expect(pageErrors, 'errors in the page').toEqual([]);
    pageErrors = [];
  });

  it('money over years: the finding appears, a typed price index adjusts the amounts, and the exported file says so', async () => {
    const { page, host } = await openPage();
    await openDocument(page, host, writeDoc('takings.json', TAKINGS));
    const money = finding(page, 'money-nominal');
    await money.waitFor();
    expect(await money.textContent()).toMatch(/money \(dollars\) from 1982 to 2005/);
    expect(await money.locator('.integrity-basis').textContent()).toMatch(/Moore/);
    await shot(page, 'integrity-01-money-finding');

    const fix = money.getByTestId('integrity-fix');
    await fix.click();
    const dialog = page.getByTestId('price-dialog');
    await dialog.waitFor();
    // Applying with no index says what is missing, row by row, and changes nothing.
    await dialog.getByTestId('price-apply').click();
    expect(await dialog.getByTestId('dialog-problems').textContent()).toMatch(/1982: enter its index value/);
    const inputs = dialog.getByTestId('price-index-value');
    expect(await inputs.count()).toBe(3);
    for (const [i, period] of ['1982', '2000', '2005'].entries()) await inputs.nth(i).fill(CPI[period as keyof typeof CPI]);
    // The base period offered by default is the latest.
    expect(await dialog.getByTestId('price-base').inputValue()).toBe('2005');
    await dialog.getByTestId('price-index-name').fill('the consumer price index (1982-84 = 100)');
    await shot(page, 'integrity-02-price-dialog');
    await dialog.getByTestId('price-apply').click();
    await dialog.waitFor({ state: 'detached' });
    // Focus returns to the button that opened the dialog, or to the panel when the fixed finding is gone.
    await settled(page);
    await expect.poll(() => page.evaluate(() => document.activeElement?.closest('[data-testid=integrity-panel]') !== null)).toBe(true);
    expect(await finding(page, 'money-nominal').count()).toBe(0);
    const footnote = 'Figures adjusted to 2005 money with the consumer price index (1982-84 = 100).';
    expect(await page.getByTestId('integrity-footnote').textContent()).toContain(footnote);
    await shot(page, 'integrity-03-price-applied');

    const svg = await exportSvg(page, host, 'takings-2005-money.svg');
    const report = verifySvg(svg);
    expect(report.pass).toBe(true);
    const values = Object.fromEntries(report.marks.map((m) => [m.label, m.value]));
    // 10,000 x 195.3 / 96.5 = 20,238.34; 20,000 x 195.3 / 172.2 = 22,682.93 (to the cent, computed from Moore's CPI).
    expect(values['1982'].toFixed(2)).toBe('20238.34');
    expect(values['2000'].toFixed(2)).toBe('22682.93');
    expect(values['2005']).toBe(25000);
    expect(svg).toContain(footnote);
    expect(readChartSvg(svg).summary?.adjustments?.note).toBe(footnote);
    expect(readChartSvg(svg).summary?.unitName).toBe('dollars (2005 money)');

    // Undo brings back the nominal amounts, the finding and no footnote: one undo step for the whole adjustment.
    await page.getByTestId('undo').click();
    await settled(page);
    expect(await page.getByLabel('Value of row 1', { exact: true }).inputValue()).toBe('10000');
    await finding(page, 'money-nominal').waitFor();
    expect(await page.getByTestId('integrity-footnote').count()).toBe(0);
  });

  it('totals of districts of very different size: per 100,000 residents, exported; undo restores; bases typed in the dialog', async () => {
    const { page, host } = await openPage();
    await openDocument(page, host, writeDoc('loans.json', LOANS));
    const size = finding(page, 'size-unadjusted');
    await size.waitFor();
    expect(await size.textContent()).toMatch(/differ 2\.167-fold/);
    await size.getByTestId('integrity-fix').click();
    const dialog = page.getByTestId('per-capita-dialog');
    await dialog.waitFor();
    // The population column of the document fills the dialog.
    expect(await dialog.getByTestId('per-capita-base').nth(0).inputValue()).toBe('12000');
    expect(await dialog.getByTestId('per-capita-base').nth(1).inputValue()).toBe('26000');
    await dialog.getByTestId('per-capita-per').selectOption('100000');
    await shot(page, 'integrity-04-per-capita-dialog');
    await dialog.getByTestId('per-capita-apply').click();
    await dialog.waitFor({ state: 'detached' });
    await settled(page);
    const footnote = 'Figures per 100,000 residents.';
    expect(await page.getByTestId('integrity-footnote').textContent()).toContain(footnote);

    const svg = await exportSvg(page, host, 'loans-per-100k.svg');
    const report = verifySvg(svg);
    expect(report.pass).toBe(true);
    // A rate per 100,000 = count / population x 100,000 (common practice): 54 / 12,000 x 100,000 = 450; 91 / 26,000 x 100,000 = 350.
    const values = Object.fromEntries(report.marks.map((m) => [m.label, m.value]));
    expect(values.Northside).toBeCloseTo(450, 9);
    expect(values.Riverside).toBeCloseTo(350, 9);
    expect(svg).toContain(footnote);
    expect(readChartSvg(svg).summary?.unitName).toBe('loans per 100,000 residents');

    await page.getByTestId('undo').click();
    await settled(page);
    expect(await page.getByLabel('Value of row 1', { exact: true }).inputValue()).toBe('54');
    await finding(page, 'size-unadjusted').waitFor();

    // Bases typed by hand through "Per head…" (per 1,000, a base name of one's own) replace the column.
    await page.getByTestId('adjust-per-capita').click();
    await dialog.waitFor();
    await dialog.getByTestId('per-capita-base').nth(0).fill('6,000');
    await dialog.getByTestId('per-capita-base').nth(1).fill('');
    await dialog.getByTestId('per-capita-per').selectOption('1000');
    await dialog.getByTestId('per-capita-apply').click();
    expect(await dialog.getByTestId('dialog-problems').textContent()).toMatch(/Riverside: enter its residents figure/);
    await dialog.getByTestId('per-capita-base').nth(1).fill('13000');
    await dialog.getByTestId('per-capita-base-name').fill('people');
    await dialog.getByTestId('per-capita-apply').click();
    await settled(page);
    // 54 / 6,000 x 1,000 = 9; 91 / 13,000 x 1,000 = 7.
    expect(await page.getByLabel('Value of row 1', { exact: true }).inputValue()).toBe('9');
    expect(await page.getByLabel('Value of row 2', { exact: true }).inputValue()).toBe('7');
    expect(await page.getByTestId('integrity-footnote').textContent()).toContain('Figures per 1,000 people.');
    await page.getByTestId('adjust-remove').click();
    await settled(page);
    expect(await page.getByLabel('Value of row 1', { exact: true }).inputValue()).toBe('54');
  });

  it('sets a warning aside with a required reason, saves it in the document, keeps it after opening again; Bring back and undo', async () => {
    const { page, host } = await openPage();
    await openDocument(page, host, writeDoc('takings-aside.json', TAKINGS));
    const uneven = finding(page, 'time-uneven');
    await uneven.waitFor();
    const setAside = uneven.getByTestId('integrity-dismiss');
    await setAside.focus();
    await page.keyboard.press('Enter');
    const dialog = page.getByTestId('dismiss-dialog');
    await dialog.waitFor();
    // Focus starts in the reason field; Tab stays inside the dialog; Escape closes it and focus returns to the opener.
    expect(await page.evaluate(() => document.activeElement?.getAttribute('data-testid'))).toBe('dismiss-dialog-text');
    for (let i = 0; i < 4; i++) await page.keyboard.press('Tab');
    expect(await dialog.evaluate((d) => d.contains(document.activeElement))).toBe(true);
    await page.keyboard.press('Escape');
    await dialog.waitFor({ state: 'detached' });
    await expect.poll(() => page.evaluate(() => document.activeElement?.getAttribute('data-testid'))).toBe('integrity-dismiss');

    await page.keyboard.press('Enter');
    await dialog.waitFor();
    await dialog.getByTestId('dismiss-dialog-apply').click();
    expect(await dialog.getByTestId('dialog-problems').textContent()).toMatch(/Give a reason/);
    const reason = 'The festival was not held between 1982 and 2000.';
    await dialog.getByTestId('dismiss-dialog-text').fill(reason);
    await shot(page, 'integrity-05-dismiss-dialog');
    await dialog.getByTestId('dismiss-dialog-apply').click();
    await dialog.waitFor({ state: 'detached' });
    await settled(page);
    expect(await finding(page, 'time-uneven').count()).toBe(0);
    const aside = page.getByTestId('integrity-set-aside');
    await aside.locator('summary').click();
    expect(await aside.getByTestId('set-aside-reason').textContent()).toContain(reason);
    await aside.getByTestId('bring-back').scrollIntoViewIfNeeded();
    await shot(page, 'integrity-06-set-aside');

    host.nextSaveName = 'takings-aside-saved.json';
    await page.getByTestId('save-as').click();
    await page.getByTestId('notice').filter({ hasText: 'Saved takings-aside-saved.json' }).waitFor();
    const saved = JSON.parse(fs.readFileSync(path.join(folder, 'takings-aside-saved.json'), 'utf8')) as { dismissed?: unknown };
    // The finding named the first uneven step's category, so the dismissal covers that finding only.
    expect(saved.dismissed).toEqual([{ code: 'time-uneven', category: '2000', reason }]);

    // Undo brings the finding back; redo sets it aside again.
    await page.getByTestId('undo').click();
    await settled(page);
    await finding(page, 'time-uneven').waitFor();
    await page.getByTestId('redo').click();
    await settled(page);
    expect(await finding(page, 'time-uneven').count()).toBe(0);

    // A fresh window opening the saved file: still set aside, with the reason.
    const again = await openPage();
    await openDocument(again.page, again.host, path.join(folder, 'takings-aside-saved.json'));
    expect(await finding(again.page, 'time-uneven').count()).toBe(0);
    const againAside = again.page.getByTestId('integrity-set-aside');
    await againAside.locator('summary').click();
    expect(await againAside.getByTestId('set-aside-reason').textContent()).toContain(reason);
    await againAside.getByTestId('bring-back').click();
    await settled(again.page);
    await finding(again.page, 'time-uneven').waitFor();
    expect(await again.page.getByTestId('integrity-set-aside').count()).toBe(0);
    await again.page.getByTestId('undo').click();
    await settled(again.page);
    expect(await finding(again.page, 'time-uneven').count()).toBe(0);
  });

  it('from the keyboard: Add the source through its dialog (Enter applies), Show the key at once; each one undo step', async () => {
    const { page, host } = await openPage();
    await shot(page, 'integrity-00-demo');
    const { source: _none, ...unsourced } = LOANS;
    await openDocument(page, host, writeDoc('unsourced.json', { ...unsourced, layout: { legend: false } }));
    const fix = finding(page, 'source-unstated').getByTestId('integrity-fix');
    expect(await fix.textContent()).toBe('Add the source…');
    await fix.focus();
    await page.keyboard.press('Enter');
    const dialog = page.getByTestId('source-dialog');
    await dialog.waitFor();
    expect(await page.evaluate(() => document.activeElement?.getAttribute('data-testid'))).toBe('source-dialog-text');
    await page.keyboard.type('District library returns, invented data');
    await page.keyboard.press('Enter');
    await dialog.waitFor({ state: 'detached' });
    expect(await page.locator('#chart-source').inputValue()).toBe('District library returns, invented data');
    await settled(page);
    expect(await finding(page, 'source-unstated').count()).toBe(0);

    const legend = finding(page, 'unit-unstated').getByTestId('integrity-fix');
    expect(await legend.textContent()).toBe('Show the key');
    await legend.focus();
    await page.keyboard.press('Enter');
    await settled(page);
    expect(await finding(page, 'unit-unstated').count()).toBe(0);
    expect(await page.getByLabel('Key', { exact: true }).isChecked()).toBe(true);

    await page.getByTestId('undo').click();
    await settled(page);
    await finding(page, 'unit-unstated').waitFor();
    await page.getByTestId('undo').click();
    await settled(page);
    await finding(page, 'source-unstated').waitFor();
    expect(await page.locator('#chart-source').inputValue()).toBe('');
  });
});

