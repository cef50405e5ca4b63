// The one contract between the UI and whatever hosts it (the Electron main process over IPC, or a
// browser with web APIs): the calls, their channel names, and zod schemas that both sides use to
// refuse malformed payloads. Results are values ({ ok, value } or { ok, error }) because errors
// thrown across IPC lose their code and arrive as bare strings.

import { z } from 'zod';
import { TallyError } from '../errors';

/** Bumped when a call's shape changes; the preload and the UI refuse a host of another version. */
export const HOST_API_VERSION = 1;

/** Name under which the Electron preload exposes the host on `window`. */
export const HOST_GLOBAL_NAME = 'tallyglyphHost';

// Bounds on what may cross: a chart document is small, an SVG with thousands of marks is a few MB.
export const HOST_LIMITS = Object.freeze({
  maxDocumentChars: 16 * 1024 * 1024,
  maxSvgChars: 64 * 1024 * 1024,
  maxNameChars: 200,
  minPpi: 36,
  maxPpi: 1200,
  maxRecent: 12,
  /** Documents from the operating system waiting at once (a folder dropped on the app's icon keeps the first). */
  maxOpenRequests: 16,
  /** A supplied graphic, glyph or font file read for the app (the audit's own file size limit). */
  maxSuppliedBytes: 16 * 1024 * 1024,
});

/** Every invoke channel the host answers; nothing else is forwarded by the preload or handled by main. */
export const HOST_CHANNELS = Object.freeze({
  getCapabilities: 'tallyglyph:get-capabilities',
  openChart: 'tallyglyph:open-chart',
  saveChart: 'tallyglyph:save-chart',
  exportSvg: 'tallyglyph:export-svg',
  exportPng: 'tallyglyph:export-png',
  listRecent: 'tallyglyph:list-recent',
  exportPdf: 'tallyglyph:export-pdf',
  saveRecovery: 'tallyglyph:save-recovery',
  loadRecovery: 'tallyglyph:load-recovery',
  clearRecovery: 'tallyglyph:clear-recovery',
  openSupplied: 'tallyglyph:open-supplied',
  exportSheet: 'tallyglyph:export-sheet',
  /** Chart documents the operating system asked to open (double-click, "Open with"), waiting for the window. */
  takeOpenRequests: 'tallyglyph:take-open-requests',
} as const);

export type HostMethod = keyof typeof HOST_CHANNELS;
export type HostChannel = (typeof HOST_CHANNELS)[HostMethod];

/** The one event channel from host to UI: a menu item or accelerator was used. */
export const HOST_EVENT_MENU_COMMAND = 'tallyglyph:menu-command';

/** Host to UI: documents from the operating system are waiting; the UI takes them with takeOpenRequests. */
export const HOST_EVENT_OPEN_REQUEST = 'tallyglyph:open-request';

export const MENU_COMMANDS = ['open', 'save', 'save-as', 'export-svg', 'export-png', 'undo', 'redo', 'new', 'export-pdf', 'copy-svg'] as const;
export type MenuCommand = (typeof MENU_COMMANDS)[number];

const HOST_METHODS = Object.keys(HOST_CHANNELS) as HostMethod[];
const CHANNEL_TO_METHOD = new Map<string, HostMethod>(HOST_METHODS.map((m) => [HOST_CHANNELS[m], m]));

/** The method behind an allowlisted channel, or null for anything else. */
export function methodForChannel(channel: unknown): HostMethod | null {
  return typeof channel === 'string' ? (CHANNEL_TO_METHOD.get(channel) ?? null) : null;
}

// ---------------------------------------------------------------------------------------------
// Schemas

// A file name offered to a save dialog or a download: no folders, no control characters, no
// leading dot (hidden files), and short enough for every file system.
// eslint-disable-next-line no-control-regex
const UNSAFE_NAME = /[/\\:*?"<>|\u0000-\u001f\u007f]/;
const fileName = z
  .string()
  .min(1)
  .max(HOST_LIMITS.maxNameChars)
  .refine((s) => !UNSAFE_NAME.test(s) && !s.startsWith('.') && s.trim() === s, {
    error: 'must be a plain file name without folders or special characters',
  });

/** An opaque handle for a file the host has opened or saved; the UI never sees or sends paths. */
const documentId = z.string().min(1).max(128).regex(/^[A-Za-z0-9_-]+$/);

const capabilitiesSchema = z.strictObject({
  apiVersion: z.literal(HOST_API_VERSION),
  kind: z.enum(['electron', 'browser']),
  /** The host turns an SVG into a PNG itself (exportPng is offered). */
  rasterizesPng: z.boolean(),
  /** Menu accelerators deliver shortcuts as menu commands, so the UI must not also handle the keys. */
  menuShortcuts: z.boolean(),
  /** Save can write back to the file it came from; false means every save is a download. */
  savesInPlace: z.boolean(),
  /** The host writes PDF files, checked by an independent PDF renderer first (exportPdf is offered). */
  exportsPdf: z.boolean().optional(),
});

const openedChartSchema = z.strictObject({
  documentId: documentId.nullable(),
  name: fileName,
  text: z.string().max(HOST_LIMITS.maxDocumentChars),
});

/** A document the OS asked to open: an id that openChart accepts, and its name; never its path. */
const openRequestSchema = z.strictObject({ documentId, name: fileName });

const savedChartSchema = z.strictObject({ documentId: documentId.nullable(), name: fileName });

const exportedFileSchema = z.strictObject({
  name: fileName,
  bytes: z.number().int().min(0),
});

/** The recovery copy: the editor's state as JSON text, written every few seconds while there are unsaved changes. */
const recoveryCopySchema = z.strictObject({
  text: z.string().min(1).max(HOST_LIMITS.maxDocumentChars),
  savedMs: z.number().int().min(0),
});

const recentChartSchema = z.strictObject({
  documentId,
  name: fileName,
  /** Where it lives, for display only (a folder name, or "this browser"). */
  location: z.string().max(1000),
  whenMs: z.number().int().min(0),
});

/** What a supplied file is opened for: the dialog offers the matching file types. */
export const SUPPLIED_PURPOSES = ['audit', 'glyph', 'font'] as const;
export type SuppliedPurpose = (typeof SUPPLIED_PURPOSES)[number];

// Bytes cross as base64 (4 characters per 3 bytes), so the limit on the text follows the limit on the file.
const suppliedFileSchema = z.strictObject({
  name: fileName,
  base64: z.string().max(Math.ceil(HOST_LIMITS.maxSuppliedBytes / 3) * 4).regex(/^[A-Za-z0-9+/]*={0,2}$/),
});

export const hostRequestSchemas = {
  getCapabilities: z.strictObject({}),
  openChart: z.strictObject({
    /** Reopen a recent chart without a dialog; absent: ask the user. */
    documentId: documentId.optional(),
  }),
  saveChart: z.strictObject({
    text: z.string().min(1).max(HOST_LIMITS.maxDocumentChars),
    suggestedName: fileName,
    /** The file this document came from; absent or null: ask where to save. */
    documentId: documentId.nullable().optional(),
    saveAs: z.boolean().optional(),
  }),
  exportSvg: z.strictObject({
    svg: z.string().min(1).max(HOST_LIMITS.maxSvgChars),
    suggestedName: fileName,
  }),
  exportPng: z.strictObject({
    svg: z.string().min(1).max(HOST_LIMITS.maxSvgChars),
    suggestedName: fileName,
    ppi: z.number().min(HOST_LIMITS.minPpi).max(HOST_LIMITS.maxPpi),
  }),
  listRecent: z.strictObject({}),
  exportPdf: z.strictObject({
    svg: z.string().min(1).max(HOST_LIMITS.maxSvgChars),
    suggestedName: fileName,
  }),
  saveRecovery: z.strictObject({ text: z.string().min(1).max(HOST_LIMITS.maxDocumentChars) }),
  loadRecovery: z.strictObject({}),
  clearRecovery: z.strictObject({}),
  openSupplied: z.strictObject({ purpose: z.enum(SUPPLIED_PURPOSES) }),
  /** A side-by-side audit sheet: not a chart, so the chart gate does not apply; the host writes it as given. */
  exportSheet: z.strictObject({
    svg: z.string().min(1).max(HOST_LIMITS.maxSvgChars),
    suggestedName: fileName,
    format: z.enum(['svg', 'png']),
    ppi: z.number().min(HOST_LIMITS.minPpi).max(HOST_LIMITS.maxPpi),
  }),
  takeOpenRequests: z.strictObject({}),
} as const;

/** Schemas of each call's value on success; null means the user cancelled a dialog. */
export const hostValueSchemas = {
  getCapabilities: capabilitiesSchema,
  openChart: openedChartSchema.nullable(),
  saveChart: savedChartSchema.nullable(),
  exportSvg: exportedFileSchema.nullable(),
  exportPng: exportedFileSchema.nullable(),
  listRecent: z.array(recentChartSchema).max(HOST_LIMITS.maxRecent),
  exportPdf: exportedFileSchema.nullable(),
  saveRecovery: z.strictObject({ savedMs: z.number().int().min(0) }),
  /** null: there is no recovery copy. */
  loadRecovery: recoveryCopySchema.nullable(),
  clearRecovery: z.boolean(),
  openSupplied: suppliedFileSchema.nullable(),
  exportSheet: exportedFileSchema.nullable(),
  /** Oldest first; empty when none is waiting. */
  takeOpenRequests: z.array(openRequestSchema).max(HOST_LIMITS.maxOpenRequests),
} as const;

const hostErrorSchema = z.strictObject({ code: z.string().min(1).max(64), message: z.string().min(1).max(2000) });

const menuCommandSchema = z.strictObject({ command: z.enum(MENU_COMMANDS) });

export type HostCapabilities = z.infer<typeof capabilitiesSchema>;
export type OpenedChart = z.infer<typeof openedChartSchema>;
export type SavedChart = z.infer<typeof savedChartSchema>;
export type ExportedFile = z.infer<typeof exportedFileSchema>;
export type RecentChart = z.infer<typeof recentChartSchema>;
export type RecoveryCopy = z.infer<typeof recoveryCopySchema>;
export type HostError = z.infer<typeof hostErrorSchema>;
export type SuppliedFileBytes = z.infer<typeof suppliedFileSchema>;
export type OpenRequest = z.infer<typeof openRequestSchema>;

export type HostRequest<M extends HostMethod> = z.infer<(typeof hostRequestSchemas)[M]>;
export type HostValue<M extends HostMethod> = z.infer<(typeof hostValueSchemas)[M]>;
export type HostResult<T> = { ok: true; value: T } | { ok: false; error: HostError };

/** What the UI may ask of its host. Every call resolves; failures come back as { ok: false, error }. */
export interface HostApi {
  getCapabilities(): Promise<HostResult<HostCapabilities>>;
  openChart(request: HostRequest<'openChart'>): Promise<HostResult<OpenedChart | null>>;
  saveChart(request: HostRequest<'saveChart'>): Promise<HostResult<SavedChart | null>>;
  exportSvg(request: HostRequest<'exportSvg'>): Promise<HostResult<ExportedFile | null>>;
  exportPng(request: HostRequest<'exportPng'>): Promise<HostResult<ExportedFile | null>>;
  listRecent(): Promise<HostResult<RecentChart[]>>;
  /** A vector PDF of a checked chart SVG, re-checked from an independent renderer's pixels before it is written. */
  exportPdf(request: HostRequest<'exportPdf'>): Promise<HostResult<ExportedFile | null>>;
  /** Keeps (replaces) the one recovery copy; it outlives a crash or a reload. */
  saveRecovery(request: HostRequest<'saveRecovery'>): Promise<HostResult<{ savedMs: number }>>;
  loadRecovery(): Promise<HostResult<RecoveryCopy | null>>;
  /** Drops the recovery copy (after a save, or when the designer discards it); true if there was one. */
  clearRecovery(): Promise<HostResult<boolean>>;
  /** Asks for a supplied graphic, glyph or font file and returns its bytes; null when cancelled. */
  openSupplied(request: HostRequest<'openSupplied'>): Promise<HostResult<SuppliedFileBytes | null>>;
  /** Writes an audit sheet as SVG or PNG (with its resolution recorded). */
  exportSheet(request: HostRequest<'exportSheet'>): Promise<HostResult<ExportedFile | null>>;
  /** Listens for menu commands; returns the function that stops listening. */
  onMenuCommand(listener: (command: MenuCommand) => void): () => void;
  /**
   * Listens for documents the operating system asks the app to open, including any passed before the UI
   * was listening (they are delivered on subscribing); each batch arrives oldest first. The listener opens
   * them through openChart({ documentId }), so an unsaved chart is asked about as with Open. Only a desktop
   * host has an operating system to hear from, so a host may leave this out.
   */
  onOpenRequest?(listener: (requests: OpenRequest[]) => void): () => void;
}

// ---------------------------------------------------------------------------------------------
// Validation, used on both sides of the boundary

function issueText(error: z.ZodError): string {
  const issue = error.issues[0];
  const where = issue.path.length > 0 ? issue.path.map(String).join('.') : 'the payload';
  return `${where} ${issue.message}`;
}

/** Checks what arrives on a host channel. Throws TallyError('usage') with the first problem. */
export function parseHostRequest<M extends HostMethod>(method: M, payload: unknown): HostRequest<M> {
  const parsed = hostRequestSchemas[method].safeParse(payload ?? {});
  if (!parsed.success) {
    throw new TallyError('usage', `The app sent a malformed "${method}" request: ${issueText(parsed.error)}.`);
  }
  return parsed.data as HostRequest<M>;
}

/**
 * Checks a result coming back from the host. A malformed result becomes an { ok: false } result
 * rather than a throw, so one bad reply cannot crash the UI.
 */
export function parseHostResult<M extends HostMethod>(method: M, payload: unknown): HostResult<HostValue<M>> {
  if (typeof payload === 'object' && payload !== null && 'ok' in payload) {
    const p = payload as { ok: unknown; value?: unknown; error?: unknown };
    if (p.ok === true) {
      const value = hostValueSchemas[method].safeParse(p.value);
      if (value.success) return { ok: true, value: value.data as HostValue<M> };
      return hostFailure('host-invalid', `The file helper sent back a malformed "${method}" reply: ${issueText(value.error)}.`);
    }
    if (p.ok === false) {
      const error = hostErrorSchema.safeParse(p.error);
      if (error.success) return { ok: false, error: error.data };
    }
  }
  return hostFailure('host-invalid', `The file helper sent back a malformed "${method}" reply.`);
}

/** Checks a menu-command event. Returns null for anything that is not one of MENU_COMMANDS. */
export function parseMenuCommand(payload: unknown): MenuCommand | null {
  const parsed = menuCommandSchema.safeParse(payload);
  return parsed.success ? parsed.data.command : null;
}

export function hostSuccess<T>(value: T): HostResult<T> {
  return { ok: true, value };
}

export function hostFailure<T = never>(code: string, message: string): HostResult<T> {
  return { ok: false, error: { code: code.slice(0, 64), message: message.slice(0, 2000) || 'Unknown failure.' } };
}

/** Turns anything thrown at the host's edge into a failure result: a TallyError keeps its code and sentence. */
export function failureFromError<T = never>(e: unknown): HostResult<T> {
  if (e instanceof TallyError) return hostFailure(e.code, e.message);
  const message = e instanceof Error ? e.message : String(e);
  return hostFailure('host-error', `The file helper failed: ${message}`);
}

/**
 * A file name safe to offer in a dialog or a download, from a title or a stored name: folders,
 * special characters and leading dots removed, the extension replaced, length bounded.
 */
export function safeFileName(base: string, extension: string): string {
  const stem = String(base)
    .replace(/\.[A-Za-z0-9]{1,5}$/, '')
    // eslint-disable-next-line no-control-regex
    .replace(/[/\\:*?"<>|\u0000-\u001f\u007f]+/g, ' ')
    .replace(/\s+/g, ' ')
    .replace(/^[.\s]+/, '')
    .slice(0, HOST_LIMITS.maxNameChars - extension.length - 1)
    .trim();
  return `${stem || 'chart'}.${extension}`;
}
