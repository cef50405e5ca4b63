// The host contract with web APIs only, for running the app in a plain browser: a file input to
// open, downloads to save and export, localStorage for the recent list, and <img> + canvas to
// turn the written SVG into a PNG (the pHYs chunk is added with shared-core/png).

import {
  HOST_API_VERSION,
  HOST_LIMITS,
  failureFromError,
  hostSuccess,
  parseHostRequest,
  type ExportedFile,
  type HostApi,
  type HostCapabilities,
  type HostResult,
  type OpenedChart,
  type RecentChart,
  type RecoveryCopy,
  type SavedChart,
  type SuppliedFileBytes,
  type SuppliedPurpose,
} from '../../../shared-core/host';
import { TallyError } from '../../../shared-core/errors';
import { withPhysChunk } from '../../../shared-core/png';
import { describeKinds, findOutsideReferences } from '../../../shared-core/audit';

const RECENT_KEY = 'tallyglyph.recent/1';
/** The recovery copy of unsaved work; survives a reload or a crashed tab (localStorage is per origin). */
const RECOVERY_KEY = 'tallyglyph.recovery/1';
/** Documents larger than this are listed as recent but not kept, so localStorage does not fill up. */
const MAX_STORED_TEXT_CHARS = 512 * 1024;
// Canvas limits vary by browser; these stay inside Chromium's and Firefox's (common practice, no source).
const MAX_CANVAS_SIDE_PX = 16_000;
const MAX_CANVAS_PIXELS = 120_000_000;
const MM_PER_UNIT: Record<string, number> = { mm: 1, cm: 10, in: 25.4, pt: 25.4 / 72, pc: 25.4 / 6, px: 25.4 / 96, '': 25.4 / 96 };

interface StoredRecent {
  documentId: string;
  name: string;
  whenMs: number;
  text?: string;
}

/** The chart writer emits no outside reference; an export holding one did not come from it. */
function refuseOutsideReferences(svg: string): void {
  const outside = findOutsideReferences(svg);
  if (outside.length) throw new TallyError('gate-refused', `Not exported: the SVG refers outside itself (${describeKinds(outside)}).`);
}

export interface BrowserHostOptions {
  storage?: Storage | null;
  now?: () => number;
}

function readRecent(storage: Storage | null): StoredRecent[] {
  if (!storage) return [];
  try {
    const parsed: unknown = JSON.parse(storage.getItem(RECENT_KEY) ?? '[]');
    if (!Array.isArray(parsed)) return [];
    return parsed
      .filter(
        (e): e is StoredRecent =>
          typeof e === 'object' && e !== null && typeof e.documentId === 'string' && /^[A-Za-z0-9_-]{1,128}$/.test(e.documentId) &&
          typeof e.name === 'string' && typeof e.whenMs === 'number' && (e.text === undefined || typeof e.text === 'string'),
      )
      .slice(0, HOST_LIMITS.maxRecent);
  } catch {
    return [];
  }
}

function writeRecent(storage: Storage | null, entries: StoredRecent[]): void {
  if (!storage) return;
  try {
    storage.setItem(RECENT_KEY, JSON.stringify(entries.slice(0, HOST_LIMITS.maxRecent)));
  } catch {
    // A full or disabled storage only costs the recent list.
  }
}

function browserId(name: string): string {
  // A stable id per file name: a browser never learns where a file lives, only its name.
  let h = 2166136261;
  for (let i = 0; i < name.length; i++) h = Math.imul(h ^ name.charCodeAt(i), 16777619) >>> 0;
  return `web-${h.toString(16).padStart(8, '0')}`;
}

function download(bytes: Uint8Array | string, name: string, type: string): number {
  const data = typeof bytes === 'string' ? new TextEncoder().encode(bytes) : bytes;
  const blob = new Blob([data as BlobPart], { type });
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  a.rel = 'noopener';
  a.style.display = 'none';
  document.body.appendChild(a);
  a.click();
  a.remove();
  // Let the download start before the URL goes away.
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
  return data.length;
}

function chooseFile(accept: string): Promise<File | null> {
  return new Promise((resolve) => {
    const input = document.createElement('input');
    input.type = 'file';
    input.accept = accept;
    input.style.display = 'none';
    let settled = false;
    const finish = (file: File | null) => {
      if (settled) return;
      settled = true;
      input.remove();
      resolve(file);
    };
    input.addEventListener('change', () => finish(input.files?.[0] ?? null));
    input.addEventListener('cancel', () => finish(null));
    document.body.appendChild(input);
    input.click();
  });
}

/** What the file chooser offers, by what a supplied file is opened for. */
const SUPPLIED_ACCEPT: Record<SuppliedPurpose, string> = {
  audit: '.svg,.png,.jpg,.jpeg,image/svg+xml,image/png,image/jpeg',
  glyph: '.svg,image/svg+xml',
  font: '.ttf,.otf,.woff,font/ttf,font/otf,font/woff',
};

/** Bytes as base64, in slices so a large file does not overflow the argument list. */
export function bytesToBase64(bytes: Uint8Array): string {
  let s = '';
  for (let i = 0; i < bytes.length; i += 0x8000) s += String.fromCharCode(...bytes.subarray(i, i + 0x8000));
  return btoa(s);
}

/** The page size the root <svg> declares, in mm (CSS absolute units). */
export function svgPageSizeMm(svg: string): { widthMm: number; heightMm: number } {
  const doc = new DOMParser().parseFromString(svg, 'image/svg+xml');
  const root = doc.documentElement;
  if (doc.getElementsByTagName('parsererror').length > 0 || root.localName !== 'svg') {
    throw new TallyError('svg-malformed', 'The chart could not be read back for the PNG: it is not a well-formed SVG.');
  }
  const length = (name: string): number => {
    const m = /^\s*([0-9]*\.?[0-9]+(?:e[+-]?\d+)?)\s*(mm|cm|in|pt|pc|px|)\s*$/i.exec(root.getAttribute(name) ?? '');
    if (!m) throw new TallyError('raster-invalid', `The chart's root <svg> has no fixed ${name}; a PNG needs the page size.`);
    return Number(m[1]) * MM_PER_UNIT[m[2].toLowerCase()];
  };
  return { widthMm: length('width'), heightMm: length('height') };
}

/** Pixel size at a resolution, rounded to whole pixels as the main process's rasteriser does. */
export function pngSizePx(page: { widthMm: number; heightMm: number }, ppi: number): { widthPx: number; heightPx: number } {
  const widthPx = Math.round((page.widthMm * ppi) / 25.4);
  const heightPx = Math.round((page.heightMm * ppi) / 25.4);
  if (widthPx < 1 || heightPx < 1) throw new TallyError('raster-invalid', `At ${ppi} ppi the page is less than one pixel across.`);
  if (widthPx > MAX_CANVAS_SIDE_PX || heightPx > MAX_CANVAS_SIDE_PX || widthPx * heightPx > MAX_CANVAS_PIXELS) {
    throw new TallyError('geometry-limit', `At ${ppi} ppi this page would be ${widthPx} x ${heightPx} pixels, more than a browser can draw; choose a lower resolution.`);
  }
  return { widthPx, heightPx };
}

/** Draws the SVG string through the browser's own SVG renderer into a canvas and encodes a PNG with pHYs. */
export async function rasterizeInBrowser(svg: string, ppi: number): Promise<{ png: Uint8Array; widthPx: number; heightPx: number }> {
  const { widthPx, heightPx } = pngSizePx(svgPageSizeMm(svg), ppi);
  const url = URL.createObjectURL(new Blob([svg], { type: 'image/svg+xml' }));
  try {
    const img = new Image();
    img.decoding = 'async';
    img.src = url;
    try {
      await img.decode();
    } catch {
      throw new TallyError('svg-malformed', 'The browser could not draw the chart SVG for the PNG.');
    }
    const canvas = document.createElement('canvas');
    canvas.width = widthPx;
    canvas.height = heightPx;
    const ctx = canvas.getContext('2d');
    if (!ctx) throw new TallyError('raster-invalid', 'This browser gave no canvas to draw the PNG on.');
    ctx.drawImage(img, 0, 0, widthPx, heightPx);
    const blob = await new Promise<Blob | null>((resolve) => canvas.toBlob(resolve, 'image/png'));
    if (!blob) throw new TallyError('raster-invalid', 'The browser could not encode the PNG (the page may be too large at this resolution).');
    const png = withPhysChunk(new Uint8Array(await blob.arrayBuffer()), ppi);
    return { png, widthPx, heightPx };
  } finally {
    URL.revokeObjectURL(url);
  }
}

export function createBrowserHost(options: BrowserHostOptions = {}): HostApi {
  const storage = options.storage === undefined ? safeLocalStorage() : options.storage;
  const now = options.now ?? Date.now;

  const capabilities: HostCapabilities = {
    apiVersion: HOST_API_VERSION,
    kind: 'browser',
    rasterizesPng: typeof document !== 'undefined' && typeof HTMLCanvasElement !== 'undefined',
    menuShortcuts: false,
    savesInPlace: false,
    // No exportsPdf: a PDF is checked by rendering it with poppler, which only the desktop app's main process can run.
  };

  function remember(name: string, text: string | null): string {
    const documentId = browserId(name);
    const entry: StoredRecent = { documentId, name, whenMs: Math.round(now()) };
    if (text !== null && text.length <= MAX_STORED_TEXT_CHARS) entry.text = text;
    writeRecent(storage, [entry, ...readRecent(storage).filter((e) => e.documentId !== documentId)]);
    return documentId;
  }

  async function attempt<T>(work: () => Promise<T>): Promise<HostResult<T>> {
    try {
      return hostSuccess(await work());
    } catch (e) {
      return failureFromError(e);
    }
  }

  return {
    getCapabilities: () => attempt(async () => ({ ...capabilities })),

    openChart: (request) =>
      attempt(async (): Promise<OpenedChart | null> => {
        const { documentId } = parseHostRequest('openChart', request);
        if (documentId) {
          const entry = readRecent(storage).find((e) => e.documentId === documentId);
          if (!entry?.text) throw new TallyError('io-error', 'This browser did not keep a copy of that chart; open the file with Open… instead.');
          remember(entry.name, entry.text);
          return { documentId, name: entry.name, text: entry.text };
        }
        const file = await chooseFile('.json,application/json');
        if (!file) return null;
        if (file.size > HOST_LIMITS.maxDocumentChars) {
          throw new TallyError('io-error', `"${file.name}" is ${Math.round(file.size / 1e6)} MB; a chart document is at most ${Math.round(HOST_LIMITS.maxDocumentChars / 1e6)} MB.`);
        }
        const text = await file.text();
        const name = file.name.slice(0, HOST_LIMITS.maxNameChars) || 'chart.json';
        return { documentId: remember(name, text), name, text };
      }),

    saveChart: (request) =>
      attempt(async (): Promise<SavedChart | null> => {
        const { text, suggestedName } = parseHostRequest('saveChart', request);
        download(text, suggestedName, 'application/json');
        return { documentId: remember(suggestedName, text), name: suggestedName };
      }),

    exportSvg: (request) =>
      attempt(async (): Promise<ExportedFile | null> => {
        const { svg, suggestedName } = parseHostRequest('exportSvg', request);
        refuseOutsideReferences(svg);
        return { name: suggestedName, bytes: download(svg, suggestedName, 'image/svg+xml') };
      }),

    exportPng: (request) =>
      attempt(async (): Promise<ExportedFile | null> => {
        const { svg, suggestedName, ppi } = parseHostRequest('exportPng', request);
        refuseOutsideReferences(svg);
        const { png } = await rasterizeInBrowser(svg, ppi);
        return { name: suggestedName, bytes: download(png, suggestedName, 'image/png') };
      }),

    openSupplied: (request) =>
      attempt(async (): Promise<SuppliedFileBytes | null> => {
        const { purpose } = parseHostRequest('openSupplied', request);
        const file = await chooseFile(SUPPLIED_ACCEPT[purpose]);
        if (!file) return null;
        if (file.size > HOST_LIMITS.maxSuppliedBytes) {
          throw new TallyError('io-error', `"${file.name}" is ${(file.size / 1e6).toFixed(1)} MB; the limit for a supplied file is ${(HOST_LIMITS.maxSuppliedBytes / 1e6).toFixed(1)} MB.`);
        }
        const name = file.name.slice(0, HOST_LIMITS.maxNameChars).replace(/^\.+/, '') || 'supplied';
        return { name, base64: bytesToBase64(new Uint8Array(await file.arrayBuffer())) };
      }),

    exportSheet: (request) =>
      attempt(async (): Promise<ExportedFile | null> => {
        const { svg, suggestedName, format, ppi } = parseHostRequest('exportSheet', request);
        if (format === 'svg') return { name: suggestedName, bytes: download(svg, suggestedName, 'image/svg+xml') };
        const { png } = await rasterizeInBrowser(svg, ppi);
        return { name: suggestedName, bytes: download(png, suggestedName, 'image/png') };
      }),

    listRecent: () =>
      attempt(async (): Promise<RecentChart[]> =>
        readRecent(storage).map((e) => ({ documentId: e.documentId, name: e.name, location: e.text ? 'kept in this browser' : 'not kept (too large)', whenMs: e.whenMs })),
      ),

    exportPdf: (request) =>
      attempt(async (): Promise<ExportedFile | null> => {
        parseHostRequest('exportPdf', request);
        throw new TallyError('usage', 'PDF export needs the desktop app: it checks the PDF with an independent renderer before writing it, which a browser cannot run. Export the SVG and place it in your layout program instead.');
      }),

    saveRecovery: (request) =>
      attempt(async () => {
        const { text } = parseHostRequest('saveRecovery', request);
        if (!storage) throw new TallyError('io-error', 'This browser keeps no local storage, so unsaved work cannot be kept for recovery.');
        const copy: RecoveryCopy = { text, savedMs: Math.round(now()) };
        try {
          storage.setItem(RECOVERY_KEY, JSON.stringify(copy));
        } catch {
          throw new TallyError('io-error', 'The browser\'s storage is full: the recovery copy could not be kept. Save the chart to keep your work.');
        }
        return { savedMs: copy.savedMs };
      }),

    loadRecovery: () => attempt(async (): Promise<RecoveryCopy | null> => readRecovery(storage)),

    clearRecovery: () =>
      attempt(async () => {
        const had = readRecovery(storage) !== null;
        try {
          storage?.removeItem(RECOVERY_KEY);
        } catch {
          // Nothing kept, nothing to clear.
        }
        return had;
      }),

    onMenuCommand: () => () => undefined,
  };
}

function readRecovery(storage: Storage | null): RecoveryCopy | null {
  try {
    const parsed: unknown = JSON.parse(storage?.getItem(RECOVERY_KEY) ?? 'null');
    if (typeof parsed !== 'object' || parsed === null) return null;
    const { text, savedMs } = parsed as Record<string, unknown>;
    return typeof text === 'string' && text.length > 0 && text.length <= HOST_LIMITS.maxDocumentChars && typeof savedMs === 'number' && Number.isInteger(savedMs) && savedMs >= 0 ? { text, savedMs } : null;
  } catch {
    return null;
  }
}

function safeLocalStorage(): Storage | null {
  try {
    return typeof localStorage === 'undefined' ? null : localStorage;
  } catch {
    return null;
  }
}
