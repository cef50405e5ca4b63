// The desktop host's PDF export and recovery copy, through the same handlers Electron registers.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PT_PER_MM } from '../../../main/export/pdfFromSvg';
import { createHostHandlers, type DialogPort, type FileKind } from '../../../main/electron/ipcHandlers';
import { DEMO_CHARTS } from '../../../shared-core/demo/demoCharts';
import { parseHostResult, type HostMethod } from '../../../shared-core/host';
import { renderChart } from '../../../shared-core/pipeline';
import { hasPoppler, pdfinfoBoxes } from '../../helpers/poppler';

let dir: string;
beforeAll(() => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyglyph-ipc-pdf-'));
});
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

function setup(saveAnswers: (string | null)[] = [], extra: Partial<Parameters<typeof createHostHandlers>[0]> = {}) {
  const asked: { suggestedName: string; kind: FileKind }[] = [];
  const dialogs: DialogPort = {
    chooseOpenPath: async () => null,
    async chooseSavePath(o) {
      asked.push({ suggestedName: o.suggestedName, kind: o.kind });
      return saveAnswers.shift() ?? null;
    },
  };
  const folder = fs.mkdtempSync(path.join(dir, 'case-'));
  let clock = 1_700_000_000_000;
  const handlers = createHostHandlers({ dialogs, recentFile: path.join(folder, 'recent.json'), now: () => (clock += 1000), ...extra });
  const call = async <M extends HostMethod>(method: M, payload: unknown) => parseHostResult(method, await handlers[method](payload));
  return { call, asked, folder };
}

describe('recovery copy in the desktop host', () => {
  it('keeps one copy beside the recent list, replaces it, reads it back and clears it', async () => {
    const { call, folder } = setup();
    expect(await call('loadRecovery', {})).toEqual({ ok: true, value: null });
    expect((await call('saveRecovery', { text: 'first' })).ok).toBe(true);
    const second = await call('saveRecovery', { text: 'second' });
    const loaded = await call('loadRecovery', {});
    expect(loaded.ok && loaded.value).toEqual({ text: 'second', savedMs: second.ok ? second.value.savedMs : -1 });
    expect(fs.existsSync(path.join(folder, 'recovery.json'))).toBe(true);
    expect(await call('clearRecovery', {})).toEqual({ ok: true, value: true });
    expect(await call('loadRecovery', {})).toEqual({ ok: true, value: null });
    expect(await call('clearRecovery', {})).toEqual({ ok: true, value: false });
  });

  it('reads a damaged recovery file as no copy, and refuses an empty text', async () => {
    const { call, folder } = setup();
    fs.writeFileSync(path.join(folder, 'recovery.json'), '{"format":"tallyglyph.recovery/1","copy":{"text":');
    expect(await call('loadRecovery', {})).toEqual({ ok: true, value: null });
    const empty = await call('saveRecovery', { text: '' });
    expect(empty.ok).toBe(false);
  });
});

describe.skipIf(!hasPoppler)('PDF export through the desktop host', () => {
  it('writes the PDF where the designer chose, adding .pdf, at the page size', async () => {
    const folder = fs.mkdtempSync(path.join(dir, 'chosen-'));
    const target = path.join(folder, 'for the printer');
    const again = setup([target]);
    const { svg } = renderChart(DEMO_CHARTS[2].document);
    const result = await again.call('exportPdf', { svg, suggestedName: 'trees.pdf' });
    expect(result.ok && result.value?.name).toBe('for the printer.pdf');
    expect(again.asked).toEqual([{ suggestedName: 'trees.pdf', kind: 'pdf' }]);
    const info = pdfinfoBoxes(new Uint8Array(fs.readFileSync(`${target}.pdf`)));
    // 180 x 120 mm; 1 mm = 72/25.4 pt.
    expect(info.mediaBox[2]).toBeCloseTo(180 * PT_PER_MM, 1);
    expect(info.mediaBox[3]).toBeCloseTo(120 * PT_PER_MM, 1);
  }, 60_000);

  it('refuses a tampered SVG before asking where to write', async () => {
    const { call, asked } = setup([path.join(dir, 'never.pdf')]);
    const { svg } = renderChart(DEMO_CHARTS[2].document);
    // Make the first mark's data claim double its value: the file no longer matches its drawing.
    const tampered = svg.replace(/(<g id="mark-1"[^>]*data-value=")([^"]+)"/, (_m, head: string, v: string) => `${head}${Number(v) * 2}"`);
    expect(tampered).not.toBe(svg);
    const result = await call('exportPdf', { svg: tampered, suggestedName: 'trees.pdf' });
    expect(result.ok).toBe(false);
    expect(!result.ok && result.error.code).toBe('gate-refused');
    expect(asked).toEqual([]);
    expect(fs.existsSync(path.join(dir, 'never.pdf'))).toBe(false);
  }, 60_000);
});
