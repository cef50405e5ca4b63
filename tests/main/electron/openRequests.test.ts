// Documents passed by the operating system: which command-line entries are chart documents, the queue that
// holds them until the window takes them, and the host channel that hands them over as ids Open accepts.
// Conventions from Electron's documentation (from memory): a second instance's argv reaches the first through
// app's 'second-instance' event with its working directory; on Windows Electron adds Chromium switches such as
// --allow-file-access-from-files and --original-process-start-time to it; macOS delivers documents through
// 'open-file', possibly before 'ready', and may pass -psn_0_NNN to an app started from the Finder.
import fs from 'node:fs';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { describe, expect, it } from 'vitest';
import { DEMO_CHARTS } from '../../../shared-core/demo/demoCharts';
import { chartToDocument, parseChart } from '../../../shared-core/document';
import { HOST_CHANNELS, HOST_LIMITS, parseHostResult, type HostMethod } from '../../../shared-core/host';
import { createHostHandlers } from '../../../main/electron/ipcHandlers';
import { chartPathsFromArgv, createOpenRequestQueue, isChartDocumentPath, leadingArgvEntries, MAX_PENDING_OPENS } from '../../../main/electron/openRequests';
import { folderPerTest } from '../../helpers/tempDirs';

const work = folderPerTest('tallyglyph-open-requests-');
const packaged = { cwd: '/home/ana/charts', leadingEntries: 1 };

describe('chartPathsFromArgv', () => {
  it('takes the chart documents after the executable, resolved against the working directory, in order, once each', () => {
    const argv = ['/opt/Tallyglyph/tallyglyph', 'rides.json', '/data/other.JSON', './rides.json', 'notes.txt', 'image.svg'];
    expect(chartPathsFromArgv(argv, packaged)).toEqual(['/home/ana/charts/rides.json', '/data/other.JSON']);
  });

  it('skips Chromium switches, the macOS process serial number and a "--" end of switches', () => {
    const argv = ['C:/Program Files/Tallyglyph/Tallyglyph.exe', '--allow-file-access-from-files', '--original-process-start-time=13345678901234567', '-psn_0_12345', '--', 'budget.json'];
    expect(chartPathsFromArgv(argv, packaged)).toEqual(['/home/ana/charts/budget.json']);
  });

  it('also skips the app path of an unpackaged app (electron . file.json)', () => {
    expect(leadingArgvEntries(true)).toBe(2);
    expect(leadingArgvEntries(undefined)).toBe(1);
    // "." is the app folder here, not a document, and it is not a .json file either way.
    expect(chartPathsFromArgv(['/usr/lib/electron/electron', 'out/main/index.json', 'a.json'], { cwd: '/w', leadingEntries: leadingArgvEntries(true) })).toEqual(['/w/a.json']);
  });

  it('turns a local file:// URL into its path (RFC 8089) and ignores remote hosts and other schemes', () => {
    const url = pathToFileURL('/home/ana/My charts/rides per day.json').href;
    expect(url).toContain('%20');
    const argv = ['tallyglyph', url, 'file://server/share/x.json', 'https://example.org/chart.json', 'mailto:a@b.json'];
    expect(chartPathsFromArgv(argv, packaged)).toEqual(['/home/ana/My charts/rides per day.json']);
  });

  it('knows chart documents by the extension electron-builder associates with the app', () => {
    const builder = JSON.parse(fs.readFileSync(path.join(__dirname, '../../../electron-builder.json'), 'utf8')) as { fileAssociations: { ext: string }[] };
    for (const association of builder.fileAssociations) expect(isChartDocumentPath(`x.${association.ext}`)).toBe(true);
    expect(isChartDocumentPath('x.svg')).toBe(false);
    expect(isChartDocumentPath('json')).toBe(false);
  });
});

describe('createOpenRequestQueue', () => {
  it('holds documents passed before the window is ready, announces once it is, and hands them over once', () => {
    let announced = 0;
    const queue = createOpenRequestQueue(() => announced++);
    queue.addArgv(['tallyglyph', 'a.json'], packaged);
    queue.add('/x/b.json');
    expect(announced).toBe(0);
    queue.windowReady();
    expect(announced).toBe(1);
    expect(queue.take()).toEqual(['/home/ana/charts/a.json', '/x/b.json']);
    expect(queue.take()).toEqual([]);
  });

  it('announces each later document at once, not a path already waiting, and nothing while the window is gone', () => {
    let announced = 0;
    const queue = createOpenRequestQueue(() => announced++);
    queue.windowReady();
    expect(announced).toBe(0);
    queue.add('/x/a.json');
    queue.add('/x/a.json');
    queue.addArgv(['tallyglyph', '/x/a.json', 'readme.md'], packaged);
    expect(announced).toBe(1);
    expect(queue.size).toBe(1);
    queue.windowGone();
    queue.add('/x/b.json');
    expect(announced).toBe(1);
    queue.windowReady();
    expect(announced).toBe(2);
    expect(queue.take()).toEqual(['/x/a.json', '/x/b.json']);
  });

  it('keeps at most the host limit of waiting documents, the first ones', () => {
    const queue = createOpenRequestQueue(() => undefined);
    const argv = ['tallyglyph', ...Array.from({ length: 40 }, (_, i) => `/many/c${i}.json`)];
    queue.addArgv(argv, packaged);
    expect(MAX_PENDING_OPENS).toBe(HOST_LIMITS.maxOpenRequests);
    const taken = queue.take();
    expect(taken.length).toBe(MAX_PENDING_OPENS);
    expect(taken[0]).toBe('/many/c0.json');
  });
});

describe('the takeOpenRequests channel', () => {
  function handlers(queue: { take(): string[] }) {
    const h = createHostHandlers({
      dialogs: { chooseOpenPath: async () => null, chooseSavePath: async () => null },
      recentFile: path.join(work.dir, 'recent.json'),
      openRequests: queue,
    });
    return <M extends HostMethod>(method: M, payload: unknown) => h[method](payload).then((r) => parseHostResult(method, r));
  }

  it('is allowlisted, and hands each waiting document over as an id that Open accepts without a dialog', async () => {
    expect(Object.keys(HOST_CHANNELS)).toContain('takeOpenRequests');
    const first = path.join(work.dir, 'rides.json');
    const second = path.join(work.dir, 'cups.json');
    const text = JSON.stringify(chartToDocument(parseChart(DEMO_CHARTS[0].document)), null, 2) + '\n';
    fs.writeFileSync(first, text);
    fs.writeFileSync(second, text);
    const queue = createOpenRequestQueue(() => undefined);
    queue.addArgv(['tallyglyph', first, second], { cwd: work.dir, leadingEntries: 1 });
    const call = handlers(queue);

    const taken = await call('takeOpenRequests', {});
    expect(taken.ok).toBe(true);
    if (!taken.ok) return;
    expect(taken.value.map((r) => r.name)).toEqual(['rides.json', 'cups.json']);
    // Ids, never paths, cross to the window.
    for (const r of taken.value) expect(r.documentId).not.toContain(path.sep);

    const opened = await call('openChart', { documentId: taken.value[0].documentId });
    expect(opened.ok && opened.value?.text).toBe(text);
    // Both are on the recent list, so the second stays one click away.
    const recent = await call('listRecent', {});
    expect(recent.ok && recent.value.map((r) => r.name).sort()).toEqual(['cups.json', 'rides.json']);
    // Taken once: the next call finds nothing waiting.
    const again = await call('takeOpenRequests', {});
    expect(again.ok && again.value).toEqual([]);
  });

  it('answers an empty list when the host has no queue (the browser, tests)', async () => {
    const h = createHostHandlers({ dialogs: { chooseOpenPath: async () => null, chooseSavePath: async () => null }, recentFile: path.join(work.dir, 'recent.json') });
    expect(parseHostResult('takeOpenRequests', await h.takeOpenRequests({}))).toEqual({ ok: true, value: [] });
  });

  it('reports a document that vanished before it was opened with the usual sentence, not a crash', async () => {
    const gone = path.join(work.dir, 'gone.json');
    const queue = createOpenRequestQueue(() => undefined);
    queue.add(gone);
    const call = handlers(queue);
    const taken = await call('takeOpenRequests', {});
    if (!taken.ok) throw new Error(taken.error.message);
    const opened = await call('openChart', { documentId: taken.value[0].documentId });
    expect(opened.ok).toBe(false);
    if (!opened.ok) expect(opened.error.message).toMatch(/gone\.json.*no longer exists/);
  });
});
