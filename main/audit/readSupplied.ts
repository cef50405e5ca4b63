// Reads a supplied graphic from disk with a size limit checked before reading, and decodes SVG bytes
// as strict UTF-8 at this edge, so the core only ever sees clean text or a decoded image.
import fs from 'node:fs';
import path from 'node:path';
import { TallyError } from '../../shared-core/errors';
import { DEFAULT_AUDIT_LIMITS } from '../../shared-core/audit/auditLimits';
import { decodeSvgBytes } from '../../shared-core/audit/decodeSvgBytes';
import { decodeRaster, sniffKind, RASTER_IMPORT_LIMITS, type RasterImage, type RasterLimits } from './decodeRaster';

// Shared with the app; re-exported so existing callers keep their imports.
export { decodeSvgBytes };

export type SuppliedFile = { kind: 'svg'; text: string; path: string; bytes: number } | { kind: 'raster'; image: RasterImage; path: string; bytes: number };

export interface ReadSuppliedOptions {
  /** Largest file accepted, in bytes; default 16 MB (the SVG character limit). */
  maxBytes?: number;
  raster?: RasterLimits;
}

function mb(n: number): string {
  return `${(n / 1_000_000).toFixed(1)} MB`;
}

export function readSuppliedFile(file: string, opts: ReadSuppliedOptions = {}): SuppliedFile {
  const maxBytes = opts.maxBytes ?? DEFAULT_AUDIT_LIMITS.maxChars;
  const name = path.basename(file);
  let stat: fs.Stats;
  try {
    stat = fs.statSync(file);
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    throw new TallyError('io-error', code === 'ENOENT' ? `There is no file "${name}".` : `Could not open "${name}" (${code ?? 'unknown error'}).`);
  }
  if (!stat.isFile()) throw new TallyError('io-error', `"${name}" is not a file.`);
  if (stat.size === 0) throw new TallyError(/\.svg$/i.test(name) ? 'svg-malformed' : 'raster-invalid', `"${name}" is empty (0 bytes): there is no graphic in it.`);
  if (stat.size > maxBytes) {
    throw new TallyError('svg-limit', `"${name}" is ${mb(stat.size)}; the file size limit for a supplied graphic is ${mb(maxBytes)}.`);
  }
  let bytes: Uint8Array;
  try {
    bytes = fs.readFileSync(file);
  } catch (e) {
    throw new TallyError('io-error', `Could not read "${name}" (${(e as NodeJS.ErrnoException).code ?? 'unknown error'}).`);
  }
  // The file may have grown between stat and read.
  if (bytes.length > maxBytes) throw new TallyError('svg-limit', `"${name}" is ${mb(bytes.length)}; the file size limit for a supplied graphic is ${mb(maxBytes)}.`);
  if (bytes[0] === 0x1f && bytes[1] === 0x8b) throw new TallyError('svg-malformed', `"${name}" is compressed (gzip, .svgz); unpack it to a plain .svg first.`);
  const kind = sniffKind(bytes);
  if (kind === 'svg') return { kind: 'svg', text: decodeSvgBytes(bytes), path: file, bytes: bytes.length };
  if (kind === 'png' || kind === 'jpeg') return { kind: 'raster', image: decodeRaster(bytes, opts.raster ?? RASTER_IMPORT_LIMITS), path: file, bytes: bytes.length };
  throw new TallyError('svg-malformed', `"${name}" is not an SVG, PNG or JPEG file.`);
}
