// Bench item 5: the app in Debian Chromium (playwright-core, no browser download). A chart document is opened
// through the app's own Open button, then one value is typed again and again; each figure is the time from the
// keystroke (the input event, in the page's clock) to the preview <img> showing a new file while the honesty
// panel says that file passed. It includes the app's typing debounce (RENDER_DEBOUNCE_MS).
import type { Page } from 'playwright-core';
import { startApp } from '../tests/renderer/browser/helpers/appServer';

export interface AppEditTimes {
  /** Milliseconds per timed edit, in order (the warm-up edit left out). */
  editMs: number[];
  /** Whether every new preview arrived with a current "pass" verdict (the preview shows only checked files). */
  allVerified: boolean;
}

async function openDocument(page: Page, doc: unknown): Promise<void> {
  const [chooser] = await Promise.all([page.waitForEvent('filechooser'), page.getByRole('button', { name: 'Open', exact: true }).click()]);
  await chooser.setFiles({ name: 'bench.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(doc)) });
  await page.locator('[data-testid=verdict][data-verdict=pass][data-current=true]').waitFor({ timeout: 120_000 });
  await page.locator('[data-testid=busy]:not(:has(.spinner))').waitFor({ state: 'attached', timeout: 120_000 });
}

/**
 * What runs in the page for one edit: types `value` into row 1's value cell and resolves when the preview shows a
 * new file with a current verdict. Kept as plain source text: the TypeScript loader would wrap a function
 * passed to page.evaluate in helpers that do not exist in the page.
 */
const EDIT_IN_PAGE = `(v) => new Promise((resolve, reject) => {
  const img = () => document.querySelector('[data-testid=preview-image]');
  const before = img()?.src ?? '';
  const input = document.querySelector('input[aria-label="Value of row 1"]');
  if (!input) return reject(new Error('no value cell for row 1'));
  let t0 = 0;
  const check = () => {
    const now = img()?.src ?? '';
    if (!now || now === before) return;
    const verdict = document.querySelector('[data-testid=verdict][data-current=true]');
    if (!verdict) return;
    observer.disconnect();
    clearTimeout(timer);
    resolve({ ms: performance.now() - t0, verified: verdict.getAttribute('data-verdict') === 'pass' });
  };
  const observer = new MutationObserver(check);
  observer.observe(document.body, { subtree: true, childList: true, attributes: true, attributeFilter: ['src', 'data-current', 'data-verdict'] });
  const timer = setTimeout(() => { observer.disconnect(); reject(new Error('the preview did not update within 60 s')); }, 60000);
  const setValue = Object.getOwnPropertyDescriptor(HTMLInputElement.prototype, 'value').set;
  t0 = performance.now();
  setValue.call(input, v);
  input.dispatchEvent(new Event('input', { bubbles: true }));
})`;

function timeEdit(page: Page, value: string): Promise<{ ms: number; verified: boolean }> {
  return page.evaluate(`(${EDIT_IN_PAGE})(${JSON.stringify(value)})`) as Promise<{ ms: number; verified: boolean }>;
}

export async function measureAppEdits(doc: { data: { value: number }[] }, edits: number): Promise<AppEditTimes> {
  const app = await startApp();
  try {
    const context = await app.browser.newContext({ viewport: { width: 1440, height: 900 } });
    const page = await context.newPage();
    await page.goto(app.base);
    await page.locator('[data-testid=verdict][data-current=true]').waitFor({ timeout: 120_000 });
    await openDocument(page, doc);
    const first = doc.data[0].value;
    const editMs: number[] = [];
    let allVerified = true;
    // Distinct values, so no edit is answered from the app's cache of recent outcomes.
    for (let i = 0; i <= edits; i++) {
      const r = await timeEdit(page, String(first + i + 1));
      allVerified &&= r.verified;
      if (i > 0) editMs.push(r.ms);
      // Let the worker go idle before the next keystroke: each figure is one edit, not a burst.
      await page.locator('[data-testid=busy]:not(:has(.spinner))').waitFor({ state: 'attached', timeout: 60_000 });
    }
    await context.close();
    return { editMs, allVerified };
  } finally {
    await app.close();
  }
}
