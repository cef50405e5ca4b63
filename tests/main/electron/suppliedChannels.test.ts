// The host channels of the audit workspace and own glyphs, in plain Node: opening a supplied file
// (its bytes cross as base64, size-limited) and writing an audit sheet (SVG as given, PNG with its
// resolution recorded; active content refused).
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { HOST_CHANNELS, HOST_LIMITS, parseHostResult, type HostMethod, type SuppliedPurpose } from '../../../shared-core/host';
import { createHostHandlers, OPEN_FILTERS, registerHostHandlers, type DialogPort } from '../../../main/electron/ipcHandlers';
import { readPngSize } from '../../../main/raster';
import { hasPngcheck, pngcheckPhys } from '../../helpers/independent';

let dir: string;
beforeAll(() => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyglyph-supplied-'));
});
afterAll(() => {
  fs.rmSync(dir, { recursive: true, force: true });
});

function handlersWith(open: (string | null)[], save: (string | null)[] = []) {
  const purposes: (SuppliedPurpose | undefined)[] = [];
  const dialogs: DialogPort = {
    async chooseOpenPath(purpose) {
      purposes.push(purpose);
      return open.shift() ?? null;
    },
    async chooseSavePath() {
      return save.shift() ?? null;
    },
  };
  const handlers = createHostHandlers({ dialogs, recentFile: path.join(dir, `recent-${Math.random().toString(16).slice(2)}.json`) });
  const call = async <M extends HostMethod>(method: M, payload: unknown) => parseHostResult(method, await handlers[method](payload));
  return { call, purposes };
}

// A small sheet: white page 50 × 20 mm with one 10 × 10 mm square.
const SHEET = '<svg xmlns="http://www.w3.org/2000/svg" width="50mm" height="20mm" viewBox="0 0 50 20"><rect width="50" height="20" fill="#fff"/><rect x="5" y="5" width="10" height="10" fill="#000"/></svg>';

describe('openSupplied', () => {
  it('returns the chosen file as base64 with its name, asking with the purpose', async () => {
    const file = path.join(dir, 'mock-up.png');
    const bytes = new Uint8Array([137, 80, 78, 71, 13, 10, 26, 10, 1, 2, 3]);
    fs.writeFileSync(file, bytes);
    const { call, purposes } = handlersWith([file]);
    const result = await call('openSupplied', { purpose: 'audit' });
    expect(result).toEqual({ ok: true, value: { name: 'mock-up.png', base64: Buffer.from(bytes).toString('base64') } });
    expect(purposes).toEqual(['audit']);
    expect(OPEN_FILTERS.audit.extensions).toEqual(['svg', 'png', 'jpg', 'jpeg']);
    expect(OPEN_FILTERS.font.extensions).toEqual(['ttf', 'otf', 'woff']);
  });

  it('answers null when the dialog is cancelled and refuses a file past the size limit before reading it', async () => {
    expect(await handlersWith([null]).call('openSupplied', { purpose: 'glyph' })).toEqual({ ok: true, value: null });
    const big = path.join(dir, 'big.svg');
    fs.writeFileSync(big, '');
    fs.truncateSync(big, HOST_LIMITS.maxSuppliedBytes + 1);
    const refused = await handlersWith([big]).call('openSupplied', { purpose: 'glyph' });
    expect(refused.ok).toBe(false);
    if (!refused.ok) expect(refused.error.message).toMatch(/big\.svg.*limit for a supplied file/);
  });

  it('refuses an unknown purpose and a missing file with sentences', async () => {
    const bad = await handlersWith([]).call('openSupplied', { purpose: 'anything' });
    expect(bad.ok).toBe(false);
    const gone = await handlersWith([path.join(dir, 'nowhere.svg')]).call('openSupplied', { purpose: 'audit' });
    expect(gone.ok).toBe(false);
    if (!gone.ok) expect(gone.error.message).toBe('Could not open "nowhere.svg": it no longer exists.');
  });
});

describe('exportSheet', () => {
  it('writes the SVG as given, without the chart gate (a sheet shows the distorted original on purpose)', async () => {
    const target = path.join(dir, 'sheet');
    const result = await handlersWith([], [target]).call('exportSheet', { svg: SHEET, suggestedName: 'sheet.svg', format: 'svg', ppi: 300 });
    expect(result).toEqual({ ok: true, value: { name: 'sheet.svg', bytes: Buffer.byteLength(SHEET) } });
    expect(fs.readFileSync(`${target}.svg`, 'utf8')).toBe(SHEET);
  });

  it('writes a PNG of the page size at the resolution asked, recorded in pHYs (PNG spec: pixels per metre)', async () => {
    const target = path.join(dir, 'sheet.png');
    const result = await handlersWith([], [target]).call('exportSheet', { svg: SHEET, suggestedName: 'sheet.png', format: 'png', ppi: 254 });
    expect(result.ok).toBe(true);
    const png = new Uint8Array(fs.readFileSync(target));
    // 50 mm at 254 ppi = 50 / 25.4 × 254 = 500 px; 20 mm = 200 px.
    expect(readPngSize(png)).toEqual({ widthPx: 500, heightPx: 200 });
    // 254 ppi = 10,000 px per metre exactly.
    if (hasPngcheck) expect(pngcheckPhys(png)).toEqual({ ppmX: 10000, ppmY: 10000, unit: 1 });
  });

  it('refuses a sheet with active content before asking where to write', async () => {
    const { call } = handlersWith([], [path.join(dir, 'never.svg')]);
    const result = await call('exportSheet', { svg: SHEET.replace('</svg>', '<script>alert(1)</script></svg>'), suggestedName: 'x.svg', format: 'svg', ppi: 300 });
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.error.message).toBe('Not exported: The SVG contains a <script> element.');
    expect(fs.existsSync(path.join(dir, 'never.svg'))).toBe(false);
  });

  it('both channels are registered on the allowlist', () => {
    const registered: string[] = [];
    registerHostHandlers({ handle: (channel) => registered.push(channel) }, createHostHandlers({ dialogs: { chooseOpenPath: async () => null, chooseSavePath: async () => null }, recentFile: path.join(dir, 'r.json') }), () => true);
    expect(registered).toEqual(expect.arrayContaining([HOST_CHANNELS.openSupplied, HOST_CHANNELS.exportSheet]));
  });
});
