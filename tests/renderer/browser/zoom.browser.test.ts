// Zoom, pan and the honesty table's category pick, in Debian's Chromium.
import type { BrowserContext, Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { DEMO_CHARTS } from '../../../shared-core/demo/demoCharts';
import { verifySvg } from '../../../shared-core/integrity';
import { parseXml, walkElements } from '../../../shared-core/svg';
import { CHROMIUM, haveChromium, imageBytes, shot, startApp, waitForVerdict, type AppServer } from './helpers/appServer';

const BIKES = DEMO_CHARTS[0].document;
/** CSS Values 4: 1 in = 96 px = 25.4 mm. */
const CSS_PX_PER_MM = 96 / 25.4;

let app: AppServer | null = null;
let context: BrowserContext;
let page: Page;
let pageErrors: string[] = [];

const imageSize = () => page.getByTestId('preview-image').evaluate((img: HTMLImageElement) => ({ width: img.getBoundingClientRect().width, height: img.getBoundingClientRect().height }));
const zoomValue = async () => Number((await page.getByTestId('zoom-value').textContent())?.replace('%', ''));
const scroll = () => page.getByTestId('preview-canvas').evaluate((el) => ({ left: el.scrollLeft, top: el.scrollTop }));

function marksIn(svg: string, label: string): number {
  let n = 0;
  for (const el of walkElements(parseXml(svg))) if (el.name === 'g' && (el.attrs.class ?? '').split(/\s+/).includes('tg-mark') && el.attrs['data-label'] === label) n += 1;
  return n;
}

describe.skipIf(!haveChromium)(`zoom and pan in Chromium (skipped when ${CHROMIUM} is missing)`, () => {
  beforeAll(async () => {
    app = await startApp();
    context = await app.browser.newContext({ viewport: { width: 1440, height: 900 } });
  }, 180_000);

  afterAll(async () => {
    await context?.close();
    await app?.close();
  });

  beforeEach(async () => {
    page = await context.newPage();
    pageErrors = [];
    page.on('pageerror', (e) => pageErrors.push(e.message));
    await page.goto(app!.base);
    await waitForVerdict(page, 'pass');
  });

  afterEach(async () => {
    await page.close({ runBeforeUnload: false });
    expect(pageErrors, 'errors in the page').toEqual([]);
  });

  it('shows the page at its true size at 100% (96 CSS px to the inch) and steps the zoom from there', async () => {
    expect(await page.getByTestId('zoom-fit').getAttribute('aria-pressed')).toBe('true');
    await page.getByTestId('zoom-actual').click();
    // 180 x 120 mm at 96/25.4 px per mm: 680.3 x 453.5 CSS px, drawn in whole pixels.
    expect(await imageSize()).toEqual({ width: Math.floor(180 * CSS_PX_PER_MM), height: Math.floor(120 * CSS_PX_PER_MM) });
    expect(await zoomValue()).toBe(100);
    await page.getByTestId('zoom-in').click();
    expect(await zoomValue()).toBe(125);
    expect((await imageSize()).width).toBe(Math.floor(180 * CSS_PX_PER_MM * 1.25));
    await page.getByTestId('zoom-out').click();
    await page.getByTestId('zoom-out').click();
    expect(await zoomValue()).toBe(75);
    expect((await imageSize()).width).toBe(Math.floor(180 * CSS_PX_PER_MM * 0.75));
    await page.getByTestId('zoom-fit').click();
    const room = await page.getByTestId('preview-canvas').evaluate((el) => ({ w: el.clientWidth, h: el.clientHeight }));
    const fitted = await imageSize();
    expect(fitted.width).toBeLessThanOrEqual(room.w);
    expect(fitted.height).toBeLessThanOrEqual(room.h);
    // Keyboard on the page: + and - step, 0 fits.
    await page.getByTestId('preview-canvas').focus();
    await page.keyboard.press('+');
    expect(await page.getByTestId('zoom-fit').getAttribute('aria-pressed')).toBe('false');
    await page.keyboard.press('0');
    expect(await page.getByTestId('zoom-fit').getAttribute('aria-pressed')).toBe('true');
  });

  it('pans by dragging and by space-drag when zoomed in', async () => {
    await page.getByTestId('zoom-actual').click();
    for (let i = 0; i < 4; i++) await page.getByTestId('zoom-in').click();
    expect(await zoomValue()).toBe(300);
    await shot(page, 'zoom-01-300-percent');
    const box = await page.getByTestId('preview-canvas').boundingBox();
    if (!box) throw new Error('no canvas');
    const cx = box.x + box.width / 2;
    const cy = box.y + box.height / 2;
    const before = await scroll();
    await page.mouse.move(cx, cy);
    await page.mouse.down();
    await page.mouse.move(cx - 100, cy - 60, { steps: 5 });
    await page.mouse.move(cx - 150, cy - 80, { steps: 5 });
    await page.mouse.up();
    const after = await scroll();
    expect(after.left - before.left).toBeCloseTo(150, 0);
    expect(after.top - before.top).toBeCloseTo(80, 0);

    await page.keyboard.down('Space');
    expect(await page.getByTestId('preview-canvas').getAttribute('class')).toMatch(/pan-ready/);
    await page.mouse.move(cx, cy);
    await page.mouse.down();
    await page.mouse.move(cx + 90, cy + 40, { steps: 5 });
    await page.mouse.up();
    await page.keyboard.up('Space');
    const back = await scroll();
    expect(after.left - back.left).toBeCloseTo(90, 0);
    expect(after.top - back.top).toBeCloseTo(40, 0);
    expect(await page.getByTestId('preview-canvas').getAttribute('class')).not.toMatch(/pan-ready/);
  });

  it('a click on a row of the honesty table zooms to that category and frames its marks, leaving the preview the exported file', async () => {
    const fitZoom = await zoomValue();
    const row = page.locator('[data-testid=factor-table] tr[data-label="Old Market"]');
    await row.click();
    await page.getByTestId('highlight-note').waitFor();
    expect(await row.getAttribute('aria-selected')).toBe('true');
    expect(await page.getByTestId('highlight-note').textContent()).toMatch(/Showing “Old Market”/);
    expect(await zoomValue()).toBeGreaterThan(fitZoom);
    await shot(page, 'zoom-02-row-picked');
    // The overlay holds the marks of that category and nothing else's.
    const preview = (await imageBytes(page, 'preview-image')).toString('utf8');
    const overlay = (await imageBytes(page, 'preview-highlight')).toString('utf8');
    const labels = [...walkElements(parseXml(overlay))].filter((el) => (el.attrs.class ?? '').includes('tg-mark')).map((el) => el.attrs['data-label']);
    expect(labels.length).toBe(marksIn(preview, 'Old Market'));
    expect(new Set(labels)).toEqual(new Set(['Old Market']));
    // The preview itself is still the verified file, byte for byte what export writes.
    expect(verifySvg(preview).pass).toBe(true);
    expect(marksIn(preview, BIKES.data[0].label)).toBeGreaterThan(0);
    // Keyboard: Enter on another row picks it; Show all clears.
    await page.locator('[data-testid=factor-table] tr[data-label="Mill Lane"]').focus();
    await page.keyboard.press('Enter');
    await expect.poll(() => page.getByTestId('highlight-note').textContent()).toMatch(/Showing “Mill Lane”/);
    await page.getByTestId('highlight-clear').click();
    expect(await page.getByTestId('preview-highlight').count()).toBe(0);
    expect(await row.getAttribute('aria-selected')).toBe('false');
  });
});
