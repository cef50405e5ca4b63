import { describe, expect, it } from 'vitest';
import { createBrowserHost, pngSizePx } from '../../../renderer/src/host/browserHost';
import { rasterSizePx } from '../../../main/raster';

/** A Storage in memory, as the Web Storage API defines it (getItem, setItem, removeItem, clear, key, length). */
function memoryStorage(): Storage {
  const map = new Map<string, string>();
  return {
    get length() {
      return map.size;
    },
    clear: () => map.clear(),
    getItem: (k) => map.get(k) ?? null,
    key: (i) => [...map.keys()][i] ?? null,
    removeItem: (k) => void map.delete(k),
    setItem: (k, v) => void map.set(k, String(v)),
  };
}

describe('pngSizePx', () => {
  it('sizes the canvas as the main process rasteriser does: round(mm x ppi / 25.4) per side', () => {
    // 1 in = 25.4 mm (CSS absolute units): 180 mm at 300 ppi is 2125.98 px, 120 mm is 1417.32 px.
    expect(pngSizePx({ widthMm: 180, heightMm: 120 }, 300)).toEqual({ widthPx: 2126, heightPx: 1417 });
    for (const page of [{ widthMm: 210, heightMm: 297 }, { widthMm: 100, heightMm: 50 }, { widthMm: 215.9, heightMm: 279.4 }]) {
      expect(pngSizePx(page, 300)).toEqual(rasterSizePx(page, 300));
    }
  });

  it('refuses sizes a browser canvas cannot hold, with a plain sentence', () => {
    expect(() => pngSizePx({ widthMm: 2000, heightMm: 2000 }, 600)).toThrow(/more than a browser can draw/);
    expect(() => pngSizePx({ widthMm: 0.01, heightMm: 0.01 }, 36)).toThrow(/less than one pixel/);
  });
});

describe('createBrowserHost', () => {
  it('says what it can do: PNG drawn in the page only where a canvas exists, no menu, saves as downloads', async () => {
    const caps = await createBrowserHost({ storage: memoryStorage() }).getCapabilities();
    expect(caps).toEqual({ ok: true, value: { apiVersion: 1, kind: 'browser', rasterizesPng: false, menuShortcuts: false, savesInPlace: false } });
  });

  it('checks requests against the contract before doing anything', async () => {
    const host = createBrowserHost({ storage: memoryStorage() });
    const r = await host.exportSvg({ svg: '<svg/>', suggestedName: '../evil.svg' });
    expect(r.ok).toBe(false);
    expect(!r.ok && r.error.code).toBe('usage');
  });

  it('reads a damaged recent list as empty instead of failing', async () => {
    const storage = memoryStorage();
    storage.setItem('tallyglyph.recent/1', '{not json');
    expect(await createBrowserHost({ storage }).listRecent()).toEqual({ ok: true, value: [] });
    storage.setItem('tallyglyph.recent/1', JSON.stringify([{ documentId: '../../x', name: 'a.json', whenMs: 1 }]));
    expect(await createBrowserHost({ storage }).listRecent()).toEqual({ ok: true, value: [] });
  });
});
