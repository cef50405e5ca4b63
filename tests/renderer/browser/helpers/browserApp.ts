// A browser context on the app (built, served on a free port and opened in Debian's Chromium by
// startApp in appServer.ts), for browser test files that need their own suite.
import fs from 'node:fs';
import path from 'node:path';
import type { BrowserContext, Download, Page } from 'playwright-core';
import { CHROMIUM, haveChromium, REPO, SHOTS, startApp } from './appServer';

export { CHROMIUM, haveChromium, REPO, SHOTS };

export interface BrowserApp {
  context: BrowserContext;
  /** The served app's address, on the port the system gave. */
  base: string;
  close(): Promise<void>;
}

/** Builds the renderer, serves it and opens a browser context that accepts downloads. */
export async function startBrowserApp(): Promise<BrowserApp> {
  const app = await startApp();
  try {
    const context = await app.browser.newContext({ viewport: { width: 1440, height: 900 }, acceptDownloads: true });
    return { context, base: app.base, close: () => app.close() };
  } catch (e) {
    await app.close();
    throw e;
  }
}

/** A fresh page on the app, collecting page errors and console errors into `errors`. */
export async function openApp(app: BrowserApp, errors: string[]): Promise<Page> {
  const page = await app.context.newPage();
  page.on('pageerror', (e) => errors.push(e.message));
  page.on('console', (m) => {
    if (m.type() === 'error') errors.push(m.text());
  });
  await page.goto(app.base);
  return page;
}

export async function readDownload(download: Download): Promise<Buffer> {
  return fs.readFileSync(await download.path());
}

export async function screenshot(page: Page, name: string): Promise<void> {
  fs.mkdirSync(SHOTS, { recursive: true });
  await page.screenshot({ path: path.join(SHOTS, `${name}.png`) });
}
