// What the main process does for the UI, without importing Electron: dialogs, the file system and
// the rasteriser come in as ports, so every handler runs (and is tested) in plain Node.
// main.ts supplies the Electron ports and registers these handlers on the allowlisted channels.

import fs from 'node:fs/promises';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { createHash } from 'node:crypto';
import { z } from 'zod';
import { describeKinds, findOutsideReferences } from '../../shared-core/audit';
import { parseChart } from '../../shared-core/document';
import { TallyError, isTallyError } from '../../shared-core/errors';
import { verifySvg } from '../../shared-core/integrity';
import type { RenderResult } from '../../shared-core/pipeline';
import { parseXml, walkElements } from '../../shared-core/svg';
import {
  HOST_API_VERSION,
  HOST_CHANNELS,
  HOST_LIMITS,
  failureFromError,
  hostFailure,
  hostSuccess,
  hostValueSchemas,
  methodForChannel,
  parseHostRequest,
  type HostCapabilities,
  type HostMethod,
  type HostRequest,
  type HostResult,
  type MenuCommand,
  type RecentChart,
  type SuppliedPurpose,
} from '../../shared-core/host';
import { exportFromRender } from '../export';
import { pdfFromRender } from '../export/pdfExport';
import { ppiToPpm, rasterizeSvg, readPhysChunk } from '../raster';
import { writeFileAtomic } from '../io/atomicWrite';

export type FileKind = 'chart' | 'svg' | 'png' | 'pdf';

/** File filters for dialogs, by what is being written or read. */
export const FILE_FILTERS: Readonly<Record<FileKind, { name: string; extensions: string[] }>> = Object.freeze({
  chart: { name: 'Tallyglyph chart', extensions: ['tallyglyph.json', 'json'] },
  svg: { name: 'SVG image', extensions: ['svg'] },
  png: { name: 'PNG image', extensions: ['png'] },
  pdf: { name: 'PDF document', extensions: ['pdf'] },
});

/** File filters for opening a supplied file, by what it is opened for. */
export const OPEN_FILTERS: Readonly<Record<SuppliedPurpose, { name: string; extensions: string[] }>> = Object.freeze({
  audit: { name: 'Supplied graphic (SVG, PNG, JPEG)', extensions: ['svg', 'png', 'jpg', 'jpeg'] },
  glyph: { name: 'SVG glyph', extensions: ['svg'] },
  font: { name: 'Font (TTF, OTF, WOFF)', extensions: ['ttf', 'otf', 'woff'] },
});

/** Native dialogs, as main.ts provides them; null means the user cancelled. */
export interface DialogPort {
  /** Without a purpose: a chart document. */
  chooseOpenPath(purpose?: SuppliedPurpose): Promise<string | null>;
  chooseSavePath(options: { suggestedName: string; kind: FileKind; folder: string | null }): Promise<string | null>;
}

export interface FilePort {
  readText(filePath: string, maxBytes: number): Promise<string>;
  writeAtomic(filePath: string, data: string | Uint8Array): Promise<void>;
  /** Raw bytes with the size checked before reading; default: nodeFiles.readBytes. */
  readBytes?(filePath: string, maxBytes: number): Promise<Uint8Array>;
}

export interface HandlerDeps {
  dialogs: DialogPort;
  /** Where the recent-files list is kept (a JSON file in the app's user-data folder). */
  recentFile: string;
  files?: FilePort;
  /**
   * A checked SVG to PNG bytes; throws TallyError to refuse. Default: verifiedPng, the CLI's own
   * export path (pixel re-check, small-glyph refusal, pHYs check).
   */
  buildPng?: (svg: string, ppi: number) => Uint8Array;
  /**
   * Last check before an export reaches the disk: a sentence saying why the file must not be
   * written, or null. The UI already refuses; this keeps a buggy or hostile renderer from writing
   * a distorted or active file through the host. Default: exportRefusal.
   */
  checkExport?: (svg: string) => string | null;
  /** A checked SVG to PDF bytes, re-checked by poppler; throws TallyError to refuse. Default: verifiedPdf. */
  buildPdf?: (svg: string) => Promise<Uint8Array>;
  /** Where the recovery copy is kept; default recovery.json beside the recent-files list. */
  recoveryFile?: string;
  now?: () => number;
  /** An audit sheet SVG to PNG bytes with its resolution recorded; default: sheetPng. */
  buildSheetPng?: (svg: string, ppi: number) => Uint8Array;
  /** Documents the operating system asked to open (openRequests.ts); absent: none ever arrive. */
  openRequests?: { take(): string[] };
}

export type HostHandler = (payload: unknown) => Promise<HostResult<unknown>>;
export type HostHandlers = { readonly [M in HostMethod]: HostHandler };

const ALLOWED_DATA_IMAGE = /^data:image\//i;

/** The local part of a qualified name: `xlink:href` → `href`. */
function localName(qname: string): string {
  return qname.slice(qname.indexOf(':') + 1);
}

/**
 * Why an SVG could run code or fetch something when opened in a browser or layout program, or
 * null. The chart writer never emits any of these, so their presence means the text did not come
 * from it. Refused: <script>, <foreignObject>, event attributes (on…, SVG 2 §15.4 event
 * attributes), animations that set an href or an event attribute, and any href other than a
 * fragment (#id) or an embedded data:image/ URL.
 */
export function activeContentRefusal(svg: string): string | null {
  let root;
  try {
    root = parseXml(svg);
  } catch (e) {
    return isTallyError(e) ? e.message : 'The file is not well-formed XML.';
  }
  for (const el of walkElements(root)) {
    const name = el.name.toLowerCase();
    if (name === 'script') return 'The SVG contains a <script> element.';
    if (name === 'foreignobject') return 'The SVG contains a <foreignObject> element.';
    if (name === 'animate' || name === 'set' || name === 'animatemotion' || name === 'animatetransform') {
      const target = localName(el.attrs.attributeName ?? '').toLowerCase();
      if (target === 'href' || target.startsWith('on')) return `The SVG has an <${el.name}> that changes "${target}".`;
    }
    for (const [qname, value] of Object.entries(el.attrs)) {
      const local = localName(qname).toLowerCase();
      if (local.startsWith('on')) return `The SVG has an event attribute "${qname}" on <${el.name}>.`;
      if (local === 'href') {
        const href = value.trim();
        if (href.startsWith('#') || ALLOWED_DATA_IMAGE.test(href)) continue;
        const shown = href.length > 60 ? `${href.slice(0, 57)}...` : href;
        return `The SVG links to "${shown}"; only links inside the file (#…) and embedded images are allowed.`;
      }
    }
  }
  // What the walk above does not see: CSS url() and @import, linked style sheets, outside DTDs, xml:base.
  const outside = findOutsideReferences(svg);
  if (outside.length) return `The SVG refers outside itself: ${describeKinds(outside)}.`;
  return null;
}

/**
 * The export check main.ts uses: the file is re-measured from its text alone, so only a chart that
 * passes the lie-factor gate reaches the disk, whatever the renderer claims; and it must hold no
 * active content.
 */
export function exportRefusal(svg: string): string | null {
  const active = activeContentRefusal(svg);
  if (active) return `Not exported: ${active}`;
  try {
    const report = verifySvg(svg);
    return report.pass ? null : `Not exported: ${report.reason ?? 'the chart did not pass the honesty check.'}`;
  } catch (e) {
    return `Not exported: ${isTallyError(e) ? e.message : 'the file could not be checked.'}`;
  }
}

/**
 * PDF bytes for a checked SVG by the CLI's PDF path (main/export pdfFromRender): drawn by pdfkit, then
 * rendered by poppler and re-measured from its pixels before anything is returned.
 */
export async function verifiedPdf(svg: string): Promise<Uint8Array> {
  const report = verifySvg(svg);
  if (!report.pass) throw new TallyError('gate-refused', `Not exported: ${report.reason ?? 'the chart did not pass the honesty check.'}`, report);
  return (await pdfFromRender({ svg, report, warnings: [] })).bytes;
}

/**
 * PNG bytes for a checked SVG by the CLI's export path (main/export exportFromRender): the raster is
 * re-measured from its pixels, too-small glyphs are refused, and the pHYs chunk must hold `ppi`.
 * Throws TallyError('gate-refused' | ...) on refusal.
 */
export function verifiedPng(svg: string, ppi: number): Uint8Array {
  const report = verifySvg(svg);
  if (!report.pass) throw new TallyError('gate-refused', `Not exported: ${report.reason ?? 'the chart did not pass the honesty check.'}`, report);
  // exportFromRender reads only the file, its report and the warnings; spec and scene stay with the renderer.
  const rendered: Pick<RenderResult, 'svg' | 'report' | 'warnings'> = { svg, report, warnings: [] };
  return exportFromRender(rendered, 'png', { ppi }).bytes;
}

/**
 * PNG bytes of an audit sheet, as `tallyglyph sheet` makes them: drawn on white, and refused when the
 * pHYs chunk does not record `ppi` (a PNG without its resolution is placed at the wrong size).
 */
export function sheetPng(svg: string, ppi: number): Uint8Array {
  const image = rasterizeSvg(svg, { ppi, background: '#ffffff' });
  const phys = readPhysChunk(image.png);
  if (!phys || phys.unit !== 1 || phys.ppmX !== ppiToPpm(ppi)) throw new TallyError('raster-invalid', `The PNG does not record its resolution of ${ppi} ppi; nothing was written.`);
  return image.png;
}

export const nodeFiles: FilePort = {
  async readBytes(filePath, maxBytes) {
    const stat = await fs.stat(filePath);
    const name = path.basename(filePath);
    if (!stat.isFile()) throw new TallyError('io-error', `"${name}" is not a file.`);
    if (stat.size > maxBytes) throw new TallyError('io-error', `"${name}" is ${(stat.size / 1e6).toFixed(1)} MB; the limit for a supplied file is ${(maxBytes / 1e6).toFixed(1)} MB.`);
    const bytes = new Uint8Array(await fs.readFile(filePath));
    // The file may have grown between stat and read.
    if (bytes.length > maxBytes) throw new TallyError('io-error', `"${name}" is larger than the ${(maxBytes / 1e6).toFixed(1)} MB limit for a supplied file.`);
    return bytes;
  },
  async readText(filePath, maxBytes) {
    const stat = await fs.stat(filePath);
    if (!stat.isFile()) throw new TallyError('io-error', `"${path.basename(filePath)}" is not a file.`);
    if (stat.size > maxBytes) {
      throw new TallyError('io-error', `"${path.basename(filePath)}" is ${Math.round(stat.size / 1e6)} MB; a chart document is at most ${Math.round(maxBytes / 1e6)} MB.`);
    }
    return fs.readFile(filePath, 'utf8');
  },
  writeAtomic: (filePath, data) => writeFileAtomic(filePath, data),
};

/** A stable opaque id for a path, so the UI can name a file without ever holding its path. */
export function documentIdFor(filePath: string): string {
  return 'doc-' + createHash('sha256').update(path.resolve(filePath)).digest('hex').slice(0, 24);
}

function displayName(filePath: string): string {
  const base = path.basename(filePath);
  // eslint-disable-next-line no-control-regex
  const clean = base.replace(/[/\\:*?"<>|\u0000-\u001f\u007f]+/g, '_').replace(/^\.+/, '').slice(0, HOST_LIMITS.maxNameChars);
  return clean || 'chart.json';
}

// ---------------------------------------------------------------------------------------------
// Recent files

const RECENT_FORMAT = 'tallyglyph.recent/1';
const storedRecentSchema = z.object({
  format: z.literal(RECENT_FORMAT),
  entries: z.array(z.object({ path: z.string().min(1).max(4096), whenMs: z.number().int().min(0) })).max(100),
});
type StoredRecent = z.infer<typeof storedRecentSchema>['entries'];

export interface RecentStore {
  list(): Promise<StoredRecent>;
  remember(filePath: string): Promise<void>;
}

/** The recent-files list in one JSON file; a missing or damaged file reads as an empty list. */
export function createRecentStore(recentFile: string, files: FilePort, now: () => number): RecentStore {
  async function list(): Promise<StoredRecent> {
    try {
      const parsed = storedRecentSchema.safeParse(JSON.parse(await files.readText(recentFile, 1024 * 1024)));
      return parsed.success ? parsed.data.entries.slice(0, HOST_LIMITS.maxRecent) : [];
    } catch {
      return [];
    }
  }
  async function remember(filePath: string): Promise<void> {
    const resolved = path.resolve(filePath);
    const entries = [{ path: resolved, whenMs: Math.round(now()) }, ...(await list()).filter((e) => e.path !== resolved)].slice(0, HOST_LIMITS.maxRecent);
    try {
      await files.writeAtomic(recentFile, JSON.stringify({ format: RECENT_FORMAT, entries }, null, 2) + '\n');
    } catch {
      // Losing the recent list is not worth failing a save or an open over.
    }
  }
  return { list, remember };
}

// ---------------------------------------------------------------------------------------------
// The recovery copy

const RECOVERY_FORMAT = 'tallyglyph.recovery/1';
const storedRecoverySchema = z.object({
  format: z.literal(RECOVERY_FORMAT),
  copy: z.object({ text: z.string().min(1).max(HOST_LIMITS.maxDocumentChars), savedMs: z.number().int().min(0) }).nullable(),
});

export interface RecoveryStore {
  save(text: string): Promise<{ savedMs: number }>;
  load(): Promise<{ text: string; savedMs: number } | null>;
  clear(): Promise<boolean>;
}

/**
 * One recovery copy in one JSON file, replaced atomically each time, so a crash mid-write leaves the
 * previous copy whole. Clearing writes an empty record (the file port has no delete). A missing or
 * damaged file reads as no copy.
 */
export function createRecoveryStore(recoveryFile: string, files: FilePort, now: () => number): RecoveryStore {
  async function load(): Promise<{ text: string; savedMs: number } | null> {
    try {
      const parsed = storedRecoverySchema.safeParse(JSON.parse(await files.readText(recoveryFile, HOST_LIMITS.maxDocumentChars + 4096)));
      return parsed.success ? parsed.data.copy : null;
    } catch {
      return null;
    }
  }
  async function save(text: string): Promise<{ savedMs: number }> {
    const savedMs = Math.round(now());
    await files.writeAtomic(recoveryFile, JSON.stringify({ format: RECOVERY_FORMAT, copy: { text, savedMs } }));
    return { savedMs };
  }
  async function clear(): Promise<boolean> {
    const had = (await load()) !== null;
    if (had) await files.writeAtomic(recoveryFile, JSON.stringify({ format: RECOVERY_FORMAT, copy: null }));
    return had;
  }
  return { save, load, clear };
}

// ---------------------------------------------------------------------------------------------
// Handlers

export const ELECTRON_CAPABILITIES: HostCapabilities = Object.freeze({
  apiVersion: HOST_API_VERSION,
  kind: 'electron',
  rasterizesPng: true,
  menuShortcuts: true,
  savesInPlace: true,
  exportsPdf: true,
});

function withExtension(filePath: string, extension: string): string {
  return filePath.toLowerCase().endsWith(`.${extension}`) ? filePath : `${filePath}.${extension}`;
}

/** Every host call, validated on arrival and answered with a result value; nothing here throws. */
export function createHostHandlers(deps: HandlerDeps): HostHandlers {
  const files = deps.files ?? nodeFiles;
  const now = deps.now ?? Date.now;
  const buildPng = deps.buildPng ?? verifiedPng;
  const checkExport = deps.checkExport ?? exportRefusal;
  const buildSheetPng = deps.buildSheetPng ?? sheetPng;
  const readBytes = files.readBytes ?? nodeFiles.readBytes!;
  const recent = createRecentStore(deps.recentFile, files, now);
  const buildPdf = deps.buildPdf ?? verifiedPdf;
  const recovery = createRecoveryStore(deps.recoveryFile ?? path.join(path.dirname(deps.recentFile), 'recovery.json'), files, now);
  // Paths this session opened or saved, by id; recent entries add theirs on demand.
  const known = new Map<string, string>();
  let lastFolder: string | null = null;

  function rememberPath(filePath: string): string {
    const id = documentIdFor(filePath);
    known.set(id, path.resolve(filePath));
    lastFolder = path.dirname(filePath);
    return id;
  }

  async function pathForId(id: string): Promise<string | null> {
    const seen = known.get(id);
    if (seen) return seen;
    const entry = (await recent.list()).find((e) => documentIdFor(e.path) === id);
    return entry ? entry.path : null;
  }

  function guarded<M extends HostMethod>(method: M, work: (request: HostRequest<M>) => Promise<unknown>): HostHandler {
    return async (payload) => {
      try {
        const request = parseHostRequest(method, payload);
        const value = await work(request);
        // Check our own reply too: the preload will refuse anything off-contract anyway.
        const checked = hostValueSchemas[method].safeParse(value);
        if (!checked.success) return hostFailure('host-invalid', `The "${method}" reply did not match the contract.`);
        return hostSuccess(checked.data);
      } catch (e) {
        return failureFromError(e);
      }
    };
  }

  async function writeExport(kind: 'svg' | 'png' | 'pdf', svg: string, suggestedName: string, bytes: () => Uint8Array | string | Promise<Uint8Array>, refusalOf: (svg: string) => string | null = checkExport): Promise<{ name: string; bytes: number } | null> {
    const refusal = refusalOf(svg);
    if (refusal) throw new TallyError('gate-refused', refusal);
    // Built (and for PNG and PDF re-checked) before the dialog: a refusal never asks where to write.
    const data = await bytes();
    const chosen = await deps.dialogs.chooseSavePath({ suggestedName, kind, folder: lastFolder });
    if (!chosen) return null;
    const target = withExtension(chosen, kind);
    await files.writeAtomic(target, data);
    lastFolder = path.dirname(target);
    const size = typeof data === 'string' ? new TextEncoder().encode(data).length : data.length;
    return { name: displayName(target), bytes: size };
  }

  return {
    getCapabilities: guarded('getCapabilities', async () => ELECTRON_CAPABILITIES),

    // Each waiting document gets an id openChart accepts, so the UI opens it through its usual Open (with the
    // unsaved-changes question); all go on the recent list, so those after the first stay one click away.
    takeOpenRequests: guarded('takeOpenRequests', async () => {
      const taken = deps.openRequests?.take() ?? [];
      const out: { documentId: string; name: string }[] = [];
      for (const filePath of taken.slice(0, HOST_LIMITS.maxOpenRequests)) {
        out.push({ documentId: rememberPath(filePath), name: displayName(filePath) });
        await recent.remember(filePath);
      }
      return out;
    }),

    openChart: guarded('openChart', async (request) => {
      let filePath: string | null;
      if (request.documentId) {
        filePath = await pathForId(request.documentId);
        if (!filePath) throw new TallyError('io-error', 'That chart is no longer in the recent list; open it with Open… instead.');
      } else {
        filePath = await deps.dialogs.chooseOpenPath();
        if (!filePath) return null;
      }
      let text: string;
      try {
        text = await files.readText(filePath, HOST_LIMITS.maxDocumentChars);
      } catch (e) {
        if (e instanceof TallyError) throw e;
        const code = (e as NodeJS.ErrnoException).code;
        const reason = code === 'ENOENT' ? 'it no longer exists' : code === 'EACCES' || code === 'EPERM' ? 'permission was denied' : (e as Error).message;
        throw new TallyError('io-error', `Could not open "${path.basename(filePath)}": ${reason}.`);
      }
      const id = rememberPath(filePath);
      await recent.remember(filePath);
      return { documentId: id, name: displayName(filePath), text };
    }),

    saveChart: guarded('saveChart', async (request) => {
      // Bad input never overwrites a good file: the text must be a valid chart document.
      parseChart(request.text);
      let target = !request.saveAs && request.documentId ? await pathForId(request.documentId) : null;
      if (!target) {
        const chosen = await deps.dialogs.chooseSavePath({ suggestedName: request.suggestedName, kind: 'chart', folder: lastFolder });
        if (!chosen) return null;
        target = withExtension(chosen, 'json');
      }
      await files.writeAtomic(target, request.text);
      const id = rememberPath(target);
      await recent.remember(target);
      return { documentId: id, name: displayName(target) };
    }),

    exportSvg: guarded('exportSvg', async (request) => writeExport('svg', request.svg, request.suggestedName, () => request.svg)),

    exportPng: guarded('exportPng', async (request) =>
      writeExport('png', request.svg, request.suggestedName, () => buildPng(request.svg, request.ppi)),
    ),

    exportPdf: guarded('exportPdf', async (request) => writeExport('pdf', request.svg, request.suggestedName, () => buildPdf(request.svg))),

    saveRecovery: guarded('saveRecovery', async (request) => recovery.save(request.text)),
    loadRecovery: guarded('loadRecovery', async () => recovery.load()),
    clearRecovery: guarded('clearRecovery', async () => recovery.clear()),

    openSupplied: guarded('openSupplied', async (request) => {
      const filePath = await deps.dialogs.chooseOpenPath(request.purpose);
      if (!filePath) return null;
      let bytes: Uint8Array;
      try {
        bytes = await readBytes(filePath, HOST_LIMITS.maxSuppliedBytes);
      } catch (e) {
        if (e instanceof TallyError) throw e;
        const code = (e as NodeJS.ErrnoException).code;
        const reason = code === 'ENOENT' ? 'it no longer exists' : code === 'EACCES' || code === 'EPERM' ? 'permission was denied' : (e as Error).message;
        throw new TallyError('io-error', `Could not open "${path.basename(filePath)}": ${reason}.`);
      }
      lastFolder = path.dirname(filePath);
      return { name: displayName(filePath), base64: Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString('base64') };
    }),

    // A sheet is no chart (it shows the distorted original on purpose), so the lie-factor gate does not
    // apply; active content is still refused, as for every file the app writes.
    exportSheet: guarded('exportSheet', async (request) => {
      const sheetRefusal = (svg: string) => {
        const active = activeContentRefusal(svg);
        return active ? `Not exported: ${active}` : null;
      };
      return request.format === 'svg'
        ? writeExport('svg', request.svg, request.suggestedName, () => request.svg, sheetRefusal)
        : writeExport('png', request.svg, request.suggestedName, () => buildSheetPng(request.svg, request.ppi), sheetRefusal);
    }),

    listRecent: guarded('listRecent', async () => {
      const entries = await recent.list();
      return entries.map(
        (e): RecentChart => ({ documentId: documentIdFor(e.path), name: displayName(e.path), location: path.dirname(e.path).slice(0, 1000), whenMs: e.whenMs }),
      );
    }),
  };
}

// ---------------------------------------------------------------------------------------------
// Registration, with Electron's ipcMain passed in (typed by the little we use)

export interface IpcMainLike {
  handle(channel: string, listener: (event: IpcEventLike, payload: unknown) => unknown): void;
}

export interface IpcEventLike {
  senderFrame?: { url: string } | null;
}

/**
 * Registers one handler per allowlisted channel. Calls from any frame whose URL the app did not
 * load (an iframe, a page navigated elsewhere) get a failure instead of an answer.
 */
export function registerHostHandlers(ipc: IpcMainLike, handlers: HostHandlers, isTrustedUrl: (url: string) => boolean): string[] {
  const channels: string[] = [];
  for (const method of Object.keys(HOST_CHANNELS) as HostMethod[]) {
    const channel = HOST_CHANNELS[method];
    if (methodForChannel(channel) !== method) throw new Error(`Channel table is inconsistent at ${method}.`);
    ipc.handle(channel, (event, payload) => {
      const url = event.senderFrame?.url ?? '';
      if (!isTrustedUrl(url)) return hostFailure('host-refused', 'This request did not come from the Tallyglyph window.');
      return handlers[method](payload);
    });
    channels.push(channel);
  }
  return channels;
}

/** True for the app's own pages: the built files in `rendererDir`, or the dev server while developing. */
export function trustedUrlChecker(options: { rendererDir: string; devServerUrl?: string | null }): (url: string) => boolean {
  const dir = path.resolve(options.rendererDir);
  let devOrigin: string | null = null;
  if (options.devServerUrl) {
    try {
      devOrigin = new URL(options.devServerUrl).origin;
    } catch {
      devOrigin = null;
    }
  }
  return (url: string) => {
    let parsed: URL;
    try {
      parsed = new URL(url);
    } catch {
      return false;
    }
    if (devOrigin && parsed.origin === devOrigin) return true;
    if (parsed.protocol !== 'file:') return false;
    let filePath: string;
    try {
      // fileURLToPath handles drive letters and UNC hosts on Windows and refuses encoded separators.
      filePath = path.resolve(fileURLToPath(parsed));
    } catch {
      return false;
    }
    return filePath === dir || filePath.startsWith(dir + path.sep);
  };
}

// ---------------------------------------------------------------------------------------------
// Menu, as plain data: main.ts turns it into an Electron menu; tests check the accelerators.

export type MenuItemSpec =
  | { label: string; command: MenuCommand; accelerator?: string }
  | { role: 'quit' | 'cut' | 'copy' | 'paste' | 'selectAll' | 'reload' | 'toggleDevTools' | 'resetZoom' | 'zoomIn' | 'zoomOut' | 'togglefullscreen' | 'about' }
  | { separator: true };

export interface MenuSpec {
  label: string;
  items: MenuItemSpec[];
}

/**
 * Accelerators use Electron's CmdOrCtrl, so Cmd on macOS and Ctrl elsewhere. Undo and redo are our
 * document history, not the text field's, so they are commands rather than the built-in roles.
 */
export function menuTemplate(options: { isMac: boolean; devTools: boolean }): MenuSpec[] {
  const menus: MenuSpec[] = [];
  if (options.isMac) menus.push({ label: 'Tallyglyph', items: [{ role: 'about' }, { separator: true }, { role: 'quit' }] });
  menus.push({
    label: 'File',
    items: [
      { label: 'New Chart', command: 'new', accelerator: 'CmdOrCtrl+N' },
      { label: 'Open Chart…', command: 'open', accelerator: 'CmdOrCtrl+O' },
      { separator: true },
      { label: 'Save', command: 'save', accelerator: 'CmdOrCtrl+S' },
      { label: 'Save As…', command: 'save-as', accelerator: 'Shift+CmdOrCtrl+S' },
      { separator: true },
      { label: 'Export SVG…', command: 'export-svg', accelerator: 'CmdOrCtrl+E' },
      { label: 'Export PNG…', command: 'export-png', accelerator: 'Shift+CmdOrCtrl+E' },
      { label: 'Export PDF for Print…', command: 'export-pdf', accelerator: 'Alt+CmdOrCtrl+E' },
      ...(options.isMac ? [] : ([{ separator: true }, { role: 'quit' }] as MenuItemSpec[])),
    ],
  });
  menus.push({
    label: 'Edit',
    items: [
      { label: 'Undo', command: 'undo', accelerator: 'CmdOrCtrl+Z' },
      { label: 'Redo', command: 'redo', accelerator: 'Shift+CmdOrCtrl+Z' },
      { separator: true },
      { role: 'cut' },
      { role: 'copy' },
      { role: 'paste' },
      { role: 'selectAll' },
      { separator: true },
      { label: 'Copy Chart as SVG', command: 'copy-svg', accelerator: 'Alt+CmdOrCtrl+C' },
    ],
  });
  menus.push({
    label: 'View',
    items: [
      { role: 'resetZoom' },
      { role: 'zoomIn' },
      { role: 'zoomOut' },
      { separator: true },
      { role: 'togglefullscreen' },
      ...(options.devTools ? ([{ separator: true }, { role: 'reload' }, { role: 'toggleDevTools' }] as MenuItemSpec[]) : []),
    ],
  });
  return menus;
}
