// Chart documents the operating system asks the app to open (double-click, "Open with", a file dropped on
// the app's icon): which command-line entries are documents, a queue that holds them until the window can
// take them, and single-instance forwarding. Electron-free, so all of it is tested in Node; main.ts only
// feeds it Electron's argv, `open-file` and `second-instance` events.
import path from 'node:path';
import { HOST_LIMITS } from '../../shared-core/host';

/**
 * Extensions electron-builder.json associates with the app ("fileAssociations"): chart documents are JSON.
 * Only these are taken from the command line, so a stray argument is never read as a document.
 */
export const CHART_DOCUMENT_EXTENSIONS: readonly string[] = Object.freeze(['json']);

/** Most documents kept waiting at once: a burst beyond it (a whole folder dropped on the icon) keeps the first ones. */
export const MAX_PENDING_OPENS = HOST_LIMITS.maxOpenRequests;

export interface ArgvContext {
  /** Folder the command line was typed in: relative paths are resolved against it. */
  cwd: string;
  /**
   * Entries before the documents: the executable; when the app is not packaged (`electron .` or
   * `electron out/main/index.js`), also the app path. Electron's own `process.defaultApp` says which.
   */
  leadingEntries: number;
}

/** True for a path whose extension is one the app is associated with. */
export function isChartDocumentPath(filePath: string): boolean {
  const ext = path.extname(filePath).slice(1).toLowerCase();
  return CHART_DOCUMENT_EXTENSIONS.includes(ext);
}

/**
 * The chart documents in a command line, as absolute paths, in order, each once. Switches are skipped:
 * Chromium's (`--allow-file-access-from-files`, `--original-process-start-time=…`, which Electron adds to a
 * second instance's argv on Windows), ours, and macOS's `-psn_…` process serial number; so is a `--` that
 * ends the switches. A `file://` URL, which some Linux file managers pass, is turned into its path.
 */
export function chartPathsFromArgv(argv: readonly string[], context: ArgvContext): string[] {
  const out: string[] = [];
  for (const raw of argv.slice(context.leadingEntries)) {
    if (typeof raw !== 'string' || raw.length === 0 || raw.startsWith('-')) continue;
    let entry = raw;
    if (/^file:\/\//i.test(entry)) {
      try {
        const url = new URL(entry);
        if (url.host !== '' && url.host !== 'localhost') continue;
        entry = decodeURIComponent(url.pathname);
        // file:///C:/x.json → C:/x.json on Windows.
        if (/^\/[A-Za-z]:\//.test(entry)) entry = entry.slice(1);
      } catch {
        continue;
      }
    } else if (/^[A-Za-z][A-Za-z0-9+.-]+:/.test(entry) && !/^[A-Za-z]:[\\/]/.test(entry)) {
      // Another URL scheme (https:, mailto:): never a document on disk.
      continue;
    }
    if (!isChartDocumentPath(entry)) continue;
    const absolute = path.resolve(context.cwd, entry);
    if (!out.includes(absolute)) out.push(absolute);
  }
  return out;
}

export interface OpenRequestQueue {
  /** A document the OS asked to open (macOS `open-file`, or one path from a command line). */
  add(filePath: string): void;
  /** Every chart document in a command line (the first instance's, or one forwarded by a second instance). */
  addArgv(argv: readonly string[], context: ArgvContext): void;
  /** The window is ready for documents: from now on each addition is announced at once. */
  windowReady(): void;
  /** The window is gone (closed, or reloading): additions wait again until the next windowReady. */
  windowGone(): void;
  /** Hands over and forgets every waiting document, oldest first. */
  take(): string[];
  /** How many documents are waiting. */
  readonly size: number;
}

/**
 * A queue of documents to open. Nothing is delivered before the window is ready, so a document passed at
 * launch (or on macOS before `ready`) waits instead of being lost; once ready, `announce` tells the window
 * that documents are waiting, and the window takes them (so a window that was still loading cannot miss one).
 * A path already waiting is not queued twice.
 */
export function createOpenRequestQueue(announce: () => void): OpenRequestQueue {
  const pending: string[] = [];
  let ready = false;
  const push = (filePath: string): boolean => {
    if (pending.includes(filePath) || pending.length >= MAX_PENDING_OPENS) return false;
    pending.push(filePath);
    return true;
  };
  return {
    add(filePath) {
      if (typeof filePath !== 'string' || filePath.length === 0) return;
      if (push(path.resolve(filePath)) && ready) announce();
    },
    addArgv(argv, context) {
      let added = false;
      for (const p of chartPathsFromArgv(argv, context)) added = push(p) || added;
      if (added && ready) announce();
    },
    windowReady() {
      ready = true;
      if (pending.length > 0) announce();
    },
    windowGone() {
      ready = false;
    },
    take() {
      return pending.splice(0, pending.length);
    },
    get size() {
      return pending.length;
    },
  };
}

/**
 * How many leading argv entries precede the documents: the executable, plus the app path when Electron runs
 * an unpackaged app (`process.defaultApp` is true then).
 */
export function leadingArgvEntries(defaultApp: boolean | undefined): number {
  return defaultApp ? 2 : 1;
}
