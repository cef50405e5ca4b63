// The recovery copy: what it holds, how a damaged one is refused, and the browser host's keeping of it.
import { describe, expect, it } from 'vitest';
import { DEMO_CHARTS } from '../../../shared-core/demo/demoCharts';
import { fromChartDocument } from '../../../renderer/src/editor/editorDocument';
import { blankDocument, isBlank } from '../../../renderer/src/documents/blankChart';
import { decodeRecovery, encodeRecovery } from '../../../renderer/src/documents/recoveryCopy';
import { createBrowserHost } from '../../../renderer/src/host/browserHost';

/** A Storage in memory, as the Web Storage API defines it; `full` makes setItem throw as a full storage does. */
function memoryStorage(full = false): Storage {
  const map = new Map<string, string>();
  return {
    get length() {
      return map.size;
    },
    clear: () => map.clear(),
    getItem: (k) => map.get(k) ?? null,
    key: (i) => [...map.keys()][i] ?? null,
    removeItem: (k) => void map.delete(k),
    setItem: (k, v) => {
      if (full) throw new DOMException('full', 'QuotaExceededError');
      map.set(k, String(v));
    },
  };
}

const demo = fromChartDocument(DEMO_CHARTS[0].document);

describe('recovery copy', () => {
  it('round-trips the editor state, half-typed cells included', () => {
    const editor = { ...demo, rows: demo.rows.map((r, i) => (i === 1 ? { ...r, valueText: '27,5' } : r)) };
    const back = decodeRecovery(encodeRecovery({ name: 'rides.json', documentId: 'doc-abc', editor }));
    expect(back).toEqual({ name: 'rides.json', documentId: 'doc-abc', editor });
  });

  it('refuses text that is not a recovery copy of this version, rather than half-using it', () => {
    expect(decodeRecovery('not json')).toBeNull();
    expect(decodeRecovery(JSON.stringify({ format: 'tallyglyph.recovery/2', name: 'x', documentId: null, editor: demo }))).toBeNull();
    expect(decodeRecovery(JSON.stringify({ format: 'tallyglyph.recovery/1', name: 'x', documentId: '../etc', editor: demo }))).toBeNull();
    expect(decodeRecovery(JSON.stringify({ format: 'tallyglyph.recovery/1', name: 'x', documentId: null, editor: { ...demo, rows: [{ id: 1 }] } }))).toBeNull();
  });
});

describe('blank chart', () => {
  it('has one empty row, no title and an automatic unit, and keeps the page and mode', () => {
    const blank = blankDocument(demo);
    expect(blank.rows).toEqual([{ id: 'r1', label: '', valueText: '' }]);
    expect([blank.title, blank.source, blank.encoding.unit]).toEqual(['', '', undefined]);
    expect(blank.page).toEqual(demo.page);
    expect(blank.encoding.mode).toBe(demo.encoding.mode);
    expect(isBlank(blank)).toBe(true);
    expect(isBlank(demo)).toBe(false);
  });
});

describe('browser host recovery', () => {
  it('keeps one copy in local storage, replaces it, and clears it', async () => {
    let now = 1000;
    const host = createBrowserHost({ storage: memoryStorage(), now: () => now });
    expect(await host.loadRecovery()).toEqual({ ok: true, value: null });
    await host.saveRecovery({ text: 'one' });
    now = 2000;
    await host.saveRecovery({ text: 'two' });
    expect(await host.loadRecovery()).toEqual({ ok: true, value: { text: 'two', savedMs: 2000 } });
    expect(await host.clearRecovery()).toEqual({ ok: true, value: true });
    expect(await host.loadRecovery()).toEqual({ ok: true, value: null });
  });

  it('says plainly when the storage is full instead of failing silently', async () => {
    const host = createBrowserHost({ storage: memoryStorage(true) });
    const r = await host.saveRecovery({ text: 'work' });
    expect(r.ok).toBe(false);
    expect(!r.ok && r.error.message).toMatch(/storage is full.*Save the chart/);
  });

  it('refuses PDF export with the reason (the checking renderer runs only in the desktop app)', async () => {
    const host = createBrowserHost({ storage: memoryStorage() });
    const caps = await host.getCapabilities();
    expect(caps.ok && caps.value.exportsPdf === true).toBe(false);
    const r = await host.exportPdf({ svg: '<svg/>', suggestedName: 'chart.pdf' });
    expect(!r.ok && r.error.message).toMatch(/needs the desktop app/);
  });
});
