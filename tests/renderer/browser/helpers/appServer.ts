// The app built for production and served by vite preview on a free port, and Debian's
// Chromium driven by playwright-core (no browser download): the setup every browser test file shares.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type Browser, type Page } from 'playwright-core';
import { preview, type PreviewServer } from 'vite';

export const REPO = fileURLToPath(new URL('../../../../', import.meta.url));
export const CHROMIUM = process.env.TALLYGLYPH_CHROMIUM ?? '/usr/bin/chromium';
export const haveChromium = fs.existsSync(CHROMIUM);
export const SHOTS = path.join(REPO, 'test-results', 'browser');
export const CHROMIUM_ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];

export interface AppServer {
  server: PreviewServer;
  browser: Browser;
  /** The served app's address, on the free port the system gave (vitest runs two browser files at once). */
  base: string;
  close(): Promise<void>;
}

/** Browsers started by startApp in this test file and not yet closed. */
const running = new Set<Browser>();

/**
 * Every test starts with empty storage: a suite that shares one context across its tests would otherwise
 * carry the app's local storage (the recovery copy of unsaved work, the dismissed caution) from one test
 * into the next, and a later test would open on the recovery offer meant for the recovery test alone.
 * Registered when a test file imports this module, so it runs before each test of that file, ahead of the
 * file's own beforeEach that opens the page; storage kept within one test (kill the page, reopen) is untouched.
 */
// Only under the test runner: the benchmark (scripts/benchApp.ts) starts the app through this module too, and
// vitest cannot be imported outside its runner.
if (process.env.VITEST) {
  const { beforeEach } = await import('vitest');
  beforeEach(async () => {
    for (const browser of running) {
      for (const context of browser.contexts()) await context.setStorageState({ cookies: [], origins: [] });
    }
  });
}

/** Builds the renderer (in a child process, so NODE_ENV is production), serves it and starts Chromium. */
export async function startApp(): Promise<AppServer> {
  const outDir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyglyph-web-'));
  const vite = path.join(REPO, 'node_modules', 'vite', 'bin', 'vite.js');
  const built = spawnSync(process.execPath, [vite, 'build', '--config', path.join(REPO, 'renderer', 'vite.config.ts'), '--outDir', outDir, '--logLevel', 'warn'], {
    cwd: REPO,
    encoding: 'utf8',
    env: { ...process.env, NODE_ENV: 'production' },
    timeout: 120_000,
  });
  if (built.status !== 0) throw new Error(`vite build failed: ${built.stderr}${built.stdout}`);
  const server = await preview({
    configFile: path.join(REPO, 'renderer', 'vite.config.ts'),
    build: { outDir },
    preview: { host: '127.0.0.1', port: 0, strictPort: true },
    logLevel: 'warn',
  });
  const base = server.resolvedUrls?.local[0];
  if (!base) throw new Error('vite preview did not say where it serves the app.');
  const browser = await chromium.launch({ executablePath: CHROMIUM, args: CHROMIUM_ARGS });
  running.add(browser);
  return {
    server,
    browser,
    base,
    async close() {
      running.delete(browser);
      await browser.close();
      await server.close();
      fs.rmSync(outDir, { recursive: true, force: true });
    },
  };
}

/** Waits for the verdict of the document on screen now (not a faded earlier one) and for the worker to be idle. */
export async function waitForVerdict(page: Page, kind: 'pass' | 'refused' | 'waiting'): Promise<void> {
  await page.locator(`[data-testid=verdict][data-verdict=${kind}][data-current=true]`).waitFor({ timeout: 30_000 });
  await page.locator('[data-testid=busy]:not(:has(.spinner))').waitFor({ state: 'attached', timeout: 30_000 });
}

export async function shot(page: Page, name: string): Promise<void> {
  fs.mkdirSync(SHOTS, { recursive: true });
  await page.screenshot({ path: path.join(SHOTS, `${name}.png`) });
}

/** The bytes behind an <img> with a blob URL (the preview, the highlight overlay). */
export async function imageBytes(page: Page, testId: string): Promise<Buffer> {
  const text = await page.getByTestId(testId).evaluate(async (img: HTMLImageElement) => {
    const bytes = new Uint8Array(await (await fetch(img.src)).arrayBuffer());
    let s = '';
    for (let i = 0; i < bytes.length; i += 0x8000) s += String.fromCharCode(...bytes.subarray(i, i + 0x8000));
    return btoa(s);
  });
  return Buffer.from(text, 'base64');
}
