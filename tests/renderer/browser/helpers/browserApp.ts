// The app's production build served by vite preview and driven in Debian's Chromium through
// playwright-core (no browser download), for browser test files that need their own suite.
// Same set-up as app.browser.test.ts (headless, no GPU), except the port: each file using this helper
// asks the system for a free one, so browser test files running side by side (vitest runs two at
// once) and checkouts on one machine never collide.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type Browser, type BrowserContext, type Download, type Page } from 'playwright-core';
import { preview, type PreviewServer } from 'vite';

export const REPO = fileURLToPath(new URL('../../../../', import.meta.url));
export const CHROMIUM = process.env.TALLYGLYPH_CHROMIUM ?? '/usr/bin/chromium';
export const haveChromium = fs.existsSync(CHROMIUM);
export const SHOTS = path.join(REPO, 'test-results', 'browser');
const CHROMIUM_ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];

export interface BrowserApp {
  context: BrowserContext;
  /** The served app's address, on the port the system gave. */
  base: string;
  close(): Promise<void>;
}

/** Builds the renderer, serves it and opens a browser context that accepts downloads. */
export async function startBrowserApp(): Promise<BrowserApp> {
  const outDir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyglyph-web-'));
  let server: PreviewServer | null = null;
  let browser: Browser | null = null;
  try {
    // A separate process, so the build sees NODE_ENV=production rather than the test runner's "test".
    const vite = path.join(REPO, 'node_modules', 'vite', 'bin', 'vite.js');
    const built = spawnSync(process.execPath, [vite, 'build', '--config', path.join(REPO, 'renderer', 'vite.config.ts'), '--outDir', outDir, '--logLevel', 'warn'], {
      cwd: REPO,
      encoding: 'utf8',
      env: { ...process.env, NODE_ENV: 'production' },
      timeout: 120_000,
    });
    if (built.status !== 0) throw new Error(`vite build failed: ${built.stderr}${built.stdout}`);
    server = await preview({
      configFile: path.join(REPO, 'renderer', 'vite.config.ts'),
      build: { outDir },
      // Port 0: the system picks a free port; resolvedUrls says which.
      preview: { host: '127.0.0.1', port: 0, strictPort: true },
      logLevel: 'warn',
    });
    browser = await chromium.launch({ executablePath: CHROMIUM, args: CHROMIUM_ARGS });
    const context = await browser.newContext({ viewport: { width: 1440, height: 900 }, acceptDownloads: true });
    const opened = { server, browser };
    const base = server.resolvedUrls?.local[0];
    if (!base) throw new Error('vite preview did not say where it serves the app.');
    return {
      context,
      base,
      async close() {
        await opened.browser.close();
        await opened.server.close();
        fs.rmSync(outDir, { recursive: true, force: true });
      },
    };
  } catch (e) {
    await browser?.close();
    await server?.close();
    fs.rmSync(outDir, { recursive: true, force: true });
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
