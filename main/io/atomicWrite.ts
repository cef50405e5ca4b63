// Saving without ever leaving a half-written file: write a temp file beside the target, flush it, rename it over.
// rename() within one folder replaces the target in one step on POSIX file systems and on NTFS, so a crash or
// an error at any point leaves either the old file or the new one, never a mix.

import fs from 'node:fs';
import fsp from 'node:fs/promises';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import { TallyError } from '../../shared-core/errors';

type Chunk = string | Uint8Array;
/** Whole contents, or chunks from a producer; a producer that throws part-way leaves the target untouched. */
export type AtomicData = Chunk | Iterable<Chunk>;

function isWhole(data: unknown): data is Chunk {
  return typeof data === 'string' || ArrayBuffer.isView(data);
}

function isFsError(e: unknown): e is NodeJS.ErrnoException {
  return e instanceof Error && typeof (e as NodeJS.ErrnoException).syscall === 'string';
}

const REASONS: Record<string, string> = {
  ENOENT: 'the folder does not exist',
  ENOTDIR: 'part of the path is not a folder',
  EACCES: 'permission was denied',
  EPERM: 'permission was denied',
  EROFS: 'the disk is read-only',
  ENOSPC: 'the disk is full',
  EDQUOT: 'the disk quota is used up',
  EISDIR: 'a folder already has that name',
};

function ioError(target: string, e: NodeJS.ErrnoException): TallyError {
  const reason = (e.code && REASONS[e.code]) ?? e.message;
  return new TallyError('io-error', `Could not save "${target}": ${reason}.`, { cause: e });
}

function tempPathFor(target: string): string {
  return path.join(path.dirname(target), `.${path.basename(target)}.${process.pid}.${randomBytes(6).toString('hex')}.tmp`);
}

/** Follows a symlink so the link survives and its target is replaced; refuses a folder as the target. */
function resolveTarget(target: string, stat: fs.Stats | null, real: string | null): { real: string; mode: number | null } {
  if (stat?.isDirectory()) {
    const e = Object.assign(new Error('is a directory'), { code: 'EISDIR', syscall: 'open' });
    throw ioError(target, e);
  }
  return { real: real ?? path.resolve(target), mode: stat ? stat.mode & 0o7777 : null };
}

function throwAfterCleanup(target: string, e: unknown): never {
  if (isFsError(e)) throw ioError(target, e);
  throw e;
}

/** Writes `data` to `target` atomically (temp file in the same folder, fsync, rename). Keeps an existing file's mode. */
export async function writeFileAtomic(target: string, data: AtomicData | AsyncIterable<Chunk>): Promise<void> {
  let tmp: string | null = null;
  let handle: fsp.FileHandle | null = null;
  try {
    const stat = await fsp.stat(target).catch(() => null);
    const { real, mode } = resolveTarget(target, stat, stat ? await fsp.realpath(target) : null);
    tmp = tempPathFor(real);
    handle = await fsp.open(tmp, 'wx', mode ?? 0o666);
    if (mode !== null) await handle.chmod(mode);
    for await (const chunk of isWhole(data) ? [data] : data) await handle.writeFile(chunk);
    await handle.sync();
    await handle.close();
    handle = null;
    await fsp.rename(tmp, real);
    tmp = null;
    await syncFolder(path.dirname(real));
  } catch (e) {
    await handle?.close().catch(() => undefined);
    if (tmp) await fsp.unlink(tmp).catch(() => undefined);
    throwAfterCleanup(target, e);
  }
}

/** Synchronous twin of writeFileAtomic, for the command line. */
export function writeFileAtomicSync(target: string, data: AtomicData): void {
  let tmp: string | null = null;
  let fd: number | null = null;
  try {
    let stat: fs.Stats | null = null;
    try {
      stat = fs.statSync(target);
    } catch {
      stat = null;
    }
    const { real, mode } = resolveTarget(target, stat, stat ? fs.realpathSync(target) : null);
    tmp = tempPathFor(real);
    fd = fs.openSync(tmp, 'wx', mode ?? 0o666);
    if (mode !== null) fs.fchmodSync(fd, mode);
    for (const chunk of isWhole(data) ? [data] : data) fs.writeFileSync(fd, chunk);
    fs.fsyncSync(fd);
    fs.closeSync(fd);
    fd = null;
    fs.renameSync(tmp, real);
    tmp = null;
    try {
      const dirFd = fs.openSync(path.dirname(real), 'r');
      try {
        fs.fsyncSync(dirFd);
      } finally {
        fs.closeSync(dirFd);
      }
    } catch {
      // Folder fsync is not possible everywhere (Windows); the rename itself has happened.
    }
  } catch (e) {
    if (fd !== null) {
      try {
        fs.closeSync(fd);
      } catch {
        // already failing; the original error matters more
      }
    }
    if (tmp) {
      try {
        fs.unlinkSync(tmp);
      } catch {
        // nothing to remove
      }
    }
    throwAfterCleanup(target, e);
  }
}

async function syncFolder(dir: string): Promise<void> {
  // Makes the rename itself durable; not possible everywhere (Windows), and the rename has happened anyway.
  const handle = await fsp.open(dir, 'r').catch(() => null);
  if (!handle) return;
  await handle.sync().catch(() => undefined);
  await handle.close().catch(() => undefined);
}
