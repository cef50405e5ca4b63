// Documents in the app, in Debian's Chromium: new chart, recovery after a killed page, copy SVG, and the
// desktop host's Save As and PDF export (the real main-process handlers), each ending on the real output.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { BrowserContext, Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { verifyPdf } from '../../../main/export/verifyPdf';
import { PT_PER_MM } from '../../../main/export/pdfFromSvg';
import { DEMO_CHARTS } from '../../../shared-core/demo/demoCharts';
import { parseChart } from '../../../shared-core/document';
import { verifySvg } from '../../../shared-core/integrity';
import { hasPoppler, pdffontsNames, pdfinfoBoxes } from '../../helpers/poppler';
import { haveChromium, CHROMIUM, imageBytes, shot, startApp, waitForVerdict, type AppServer } from './helpers/appServer';
import { installDesktopHost, type DesktopHost } from './helpers/desktopHost';

const BIKES = DEMO_CHARTS[0].document;

let app: AppServer | null = null;
const openPages: Page[] = [];
const contexts: BrowserContext[] = [];
let pageErrors: string[] = [];

async function newContext(options: { desktopFolder?: string } = {}): Promise<{ context: BrowserContext; host: DesktopHost | null }> {
  if (!app) throw new Error('app not started');
  const context = await app.browser.newContext({ viewport: { width: 1440, height: 900 }, acceptDownloads: true });
  contexts.push(context);
  const host = options.desktopFolder ? await installDesktopHost(context, options.desktopFolder) : null;
  return { context, host };
}

async function openApp(context: BrowserContext, verdict: 'pass' | 'waiting' = 'pass'): Promise<Page> {
  const page = await context.newPage();
  openPages.push(page);
  page.on('pageerror', (e) => pageErrors.push(e.message));
  page.on('console', (m) => {
    if (m.type() === 'error') pageErrors.push(m.text());
  });
  await page.goto(app!.base);
  await waitForVerdict(page, verdict);
  return page;
}

describe.skipIf(!haveChromium)(`documents in Chromium (skipped when ${CHROMIUM} is missing)`, () => {
  beforeAll(async () => {
    app = await startApp();
  }, 180_000);

  afterAll(async () => {
    await app?.close();
  });

  afterEach(async () => {
    for (const p of openPages.splice(0)) if (!p.isClosed()) await p.close();
    for (const c of contexts.splice(0)) await c.close();
    expect(pageErrors, 'errors in the page').toEqual([]);
    pageErrors = [];
  });

  it('New gives a blank chart with one empty row and says how to start; typing draws a chart that exports', async () => {
    const { context } = await newContext();
    const page = await openApp(context);
    await page.getByTestId('new-chart').click();
    await page.getByTestId('empty-state').waitFor();
    expect(await page.getByTestId('empty-state').textContent()).toMatch(/A new chart.*Type a category and its value/);
    expect(await page.getByTestId('doc-name').textContent()).toBe('Untitled chart');
    expect(await page.getByLabel('Value of row 1', { exact: true }).inputValue()).toBe('');
    expect(await page.locator('#chart-title').inputValue()).toBe('');
    await shot(page, 'documents-01-new-chart');
    await page.getByLabel('Label of row 1', { exact: true }).fill('Reading room');
    await page.getByLabel('Value of row 1', { exact: true }).fill('12');
    await waitForVerdict(page, 'pass');
    expect(await page.getByTestId('empty-state').count()).toBe(0);
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('export-svg').click()]);
    const svg = fs.readFileSync(await download.path(), 'utf8');
    const report = verifySvg(svg);
    expect(report.pass).toBe(true);
    expect(report.marks.map((m) => [m.label, m.value])).toEqual([['Reading room', 12]]);
  });

  it('keeps a recovery copy of unsaved work and offers it after the page is killed; Restore brings it back, still unsaved', async () => {
    const { context } = await newContext();
    const page = await openApp(context);
    await page.locator('#chart-title').fill('Rides before the crash');
    await page.getByLabel('Value of row 2', { exact: true }).fill('300');
    await waitForVerdict(page, 'pass');
    // The copy is written a few seconds after the change (RECOVERY_DELAY_MS = 2 s).
    await expect.poll(() => page.evaluate(() => localStorage.getItem('tallyglyph.recovery/1')), { timeout: 10_000 }).toContain('Rides before the crash');
    // Killed: no beforeunload, no chance to save.
    await page.close({ runBeforeUnload: false });

    const again = await openApp(context);
    await again.getByTestId('recovery-banner').waitFor();
    expect(await again.getByTestId('recovery-banner').textContent()).toMatch(/Unsaved work was found.*was not saved before the app closed/);
    await shot(again, 'documents-02-recovery-offer');
    await again.getByTestId('recovery-restore').click();
    await waitForVerdict(again, 'pass');
    expect(await again.locator('#chart-title').inputValue()).toBe('Rides before the crash');
    expect(await again.getByLabel('Value of row 2', { exact: true }).inputValue()).toBe('300');
    // Still unsaved: the dirty marker shows, and the copy stays until a save.
    expect(await again.locator('[data-testid=doc-name] .dirty-dot').count()).toBe(1);
    expect(await again.getByTestId('recovery-banner').count()).toBe(0);
    // The restored chart is the one that exports: the file carries the new value.
    const [download] = await Promise.all([again.waitForEvent('download'), again.getByTestId('export-svg').click()]);
    const report = verifySvg(fs.readFileSync(await download.path(), 'utf8'));
    expect(report.marks.find((m) => m.label === BIKES.data[1].label)?.value).toBe(300);
  });

  it('Discard drops the recovery copy: the next start offers nothing', async () => {
    const { context } = await newContext();
    const page = await openApp(context);
    await page.locator('#chart-title').fill('Thrown away');
    await expect.poll(() => page.evaluate(() => localStorage.getItem('tallyglyph.recovery/1')), { timeout: 10_000 }).toContain('Thrown away');
    await page.close({ runBeforeUnload: false });
    const again = await openApp(context);
    await again.getByTestId('recovery-discard').click();
    expect(await again.evaluate(() => localStorage.getItem('tallyglyph.recovery/1'))).toBeNull();
    await again.close({ runBeforeUnload: false });
    const third = await openApp(context);
    await third.waitForTimeout(500);
    expect(await third.getByTestId('recovery-banner').count()).toBe(0);
  });

  it('copies the checked chart to the clipboard as SVG, the same bytes as the preview', async () => {
    const { context } = await newContext();
    await context.grantPermissions(['clipboard-read', 'clipboard-write'], { origin: app!.base });
    const page = await openApp(context);
    await page.getByTestId('copy-svg').click();
    await expect.poll(() => page.getByTestId('notice').textContent()).toMatch(/^Copied the checked chart/);
    const copied = await page.evaluate(() => navigator.clipboard.readText());
    expect(copied).toBe((await imageBytes(page, 'preview-image')).toString('utf8'));
    expect(verifySvg(copied).pass).toBe(true);
  });

  it('in the browser, the PDF dialog says CMYK is out of scope and that PDF export needs the desktop app', async () => {
    const { context } = await newContext();
    const page = await openApp(context);
    await page.getByTestId('export-pdf').click();
    await page.getByTestId('pdf-dialog').waitFor();
    expect(await page.getByTestId('pdf-dialog-cmyk').textContent()).toMatch(/CMYK is out of scope\. Ask your printer/);
    expect(await page.getByTestId('pdf-dialog-unavailable').textContent()).toMatch(/needs the desktop app/);
    expect(await page.getByTestId('pdf-dialog-export').isDisabled()).toBe(true);
    await page.keyboard.press('Escape');
    expect(await page.getByTestId('pdf-dialog').count()).toBe(0);
  });

  describe.skipIf(!hasPoppler)('with the desktop host', () => {
    let folder: string;
    beforeAll(() => {
      folder = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyglyph-desktop-'));
    });
    afterAll(() => fs.rmSync(folder, { recursive: true, force: true }));

    it('exports a PDF under the name the designer chose, re-checked from pdftoppm pixels, at the page size in mm', async () => {
      const { context, host } = await newContext({ desktopFolder: folder });
      const page = await openApp(context);
      await page.getByTestId('export-pdf').click();
      await page.getByTestId('pdf-dialog').waitFor();
      expect(await page.getByTestId('pdf-dialog-page').textContent()).toMatch(/^180 × 120 mm/);
      await shot(page, 'documents-03-pdf-dialog');
      (host as DesktopHost).nextSaveName = 'client proof';
      await page.getByTestId('pdf-dialog-export').click();
      await expect.poll(() => page.getByTestId('notice').textContent(), { timeout: 60_000 }).toMatch(/^Exported client proof\.pdf/);
      expect(host?.saves.at(-1)?.kind).toBe('pdf');
      expect(host?.saves.at(-1)?.suggestedName).toMatch(/^Wrenfield bike share.*\.pdf$/);
      const pdf = new Uint8Array(fs.readFileSync(path.join(folder, 'client proof.pdf')));
      // pdfinfo reads points; 1 mm = 72/25.4 pt.
      const info = pdfinfoBoxes(pdf);
      expect(info.mediaBox[2]).toBeCloseTo(180 * PT_PER_MM, 1);
      expect(info.mediaBox[3]).toBeCloseTo(120 * PT_PER_MM, 1);
      expect(pdffontsNames(pdf)).toEqual([]);
      // The written file, drawn by poppler: every mark's ink and the lie factor against the preview's verified SVG.
      const svg = (await imageBytes(page, 'preview-image')).toString('utf8');
      const check = await verifyPdf(pdf, svg, verifySvg(svg));
      expect(check.pass).toBe(true);
      expect(check.lieFactor.worst as number).toBeGreaterThan(0.95);
      expect(check.lieFactor.worst as number).toBeLessThan(1.05);
      for (const m of check.marks) expect(Math.abs((m.inkRatio as number) - 1)).toBeLessThan(0.02);
    }, 120_000);

    it('Save As writes the chart document under the chosen name and clears the dirty marker; Recent lists it', async () => {
      const { context, host } = await newContext({ desktopFolder: folder });
      const page = await openApp(context);
      await page.locator('#chart-title').fill('Saved as a copy');
      await page.locator('[data-testid=doc-name] .dirty-dot').waitFor();
      (host as DesktopHost).nextSaveName = 'copy of rides.json';
      await page.getByTestId('save-as').click();
      await expect.poll(() => page.getByTestId('notice').textContent()).toBe('Saved copy of rides.json.');
      expect(await page.locator('[data-testid=doc-name] .dirty-dot').count()).toBe(0);
      const saved = parseChart(JSON.parse(fs.readFileSync(path.join(folder, 'copy of rides.json'), 'utf8')));
      expect(saved.title).toBe('Saved as a copy');
      // The recovery copy on disk is emptied once the work is saved.
      const recoveryFile = path.join(folder, 'recovery.json');
      await expect.poll(() => (fs.existsSync(recoveryFile) ? JSON.parse(fs.readFileSync(recoveryFile, 'utf8')).copy : null), { timeout: 10_000 }).toBeNull();
      await page.getByRole('button', { name: 'Recent' }).click();
      // The list opens only once the host has answered listRecent (an IPC round trip), and
      // allTextContents does not wait: read it after the menu is there, not before.
      await page.locator('.recent-list[role=menu]').waitFor();
      expect(await page.locator('.recent-item .recent-name').allTextContents()).toContain('copy of rides.json');
    });

    it('opens a chart document the operating system passed at launch, as Open would', async () => {
      const { context, host } = await newContext({ desktopFolder: folder });
      const file = path.join(folder, 'rides from the file manager.json');
      fs.writeFileSync(file, JSON.stringify({ ...BIKES, title: 'Opened by double-click' }, null, 2));
      (host as DesktopHost).openRequests.add(file);
      const page = await openApp(context);
      await expect.poll(() => page.locator('#chart-title').inputValue(), { timeout: 15_000 }).toBe('Opened by double-click');
      await expect.poll(() => page.getByTestId('notice').textContent()).toBe('Opened rides from the file manager.json.');
      await waitForVerdict(page, 'pass');
      expect((host as DesktopHost).openRequests.size).toBe(0);
      await shot(page, 'documents-opened-by-os');
    });

    it('keeps the recovery copy in a file through the desktop host and restores it in a new window', async () => {
      const { context } = await newContext({ desktopFolder: folder });
      const page = await openApp(context);
      await page.locator('#chart-title').fill('Desktop crash');
      await expect.poll(() => fs.existsSync(path.join(folder, 'recovery.json')) && fs.readFileSync(path.join(folder, 'recovery.json'), 'utf8'), { timeout: 10_000 }).toContain('Desktop crash');
      await page.close({ runBeforeUnload: false });
      const again = await openApp(context);
      await again.getByTestId('recovery-restore').click();
      await waitForVerdict(again, 'pass');
      expect(await again.locator('#chart-title').inputValue()).toBe('Desktop crash');
    });
  });
});
