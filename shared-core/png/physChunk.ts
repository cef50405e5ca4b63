// PNG chunk plumbing without Node: walk and check chunks, and write or read the pHYs (physical
// pixel size) chunk, on plain Uint8Arrays so the same code runs in the browser, the main process
// and the command line.
// Layout per the PNG specification (ISO/IEC 15948, §5.3 chunk layout, §11.3.5.3 pHYs):
// every chunk is length (4 bytes, big-endian) + type (4 ASCII letters) + data + CRC-32 of type and data.

import { TallyError } from '../errors';

const PNG_SIGNATURE = [137, 80, 78, 71, 13, 10, 26, 10];
const SIGNATURE_LENGTH = 8;
/** PNG four-byte unsigned integers are limited to 2^31 - 1 (PNG spec §7.1). */
const PNG_MAX_UINT = 0x7fffffff;
const METRES_PER_INCH = 0.0254;

export interface PngChunk {
  type: string;
  /** Byte offset of the chunk's length field. */
  offset: number;
  /** Length of the data part in bytes. */
  dataLength: number;
}

export interface PhysChunk {
  ppmX: number;
  ppmY: number;
  /** 1 = metre, 0 = unknown (aspect ratio only). */
  unit: number;
}

let crcTable: Uint32Array | null = null;

/** CRC-32 as PNG uses it (polynomial 0xEDB88320, the spec's annex D), table-driven. */
export function pngCrc32(bytes: Uint8Array): number {
  if (!crcTable) {
    crcTable = new Uint32Array(256);
    for (let n = 0; n < 256; n++) {
      let c = n;
      for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
      crcTable[n] = c >>> 0;
    }
  }
  let crc = 0xffffffff;
  for (let i = 0; i < bytes.length; i++) crc = crcTable[(crc ^ bytes[i]) & 0xff] ^ (crc >>> 8);
  return (crc ^ 0xffffffff) >>> 0;
}

function isChunkTypeByte(b: number): boolean {
  return (b >= 65 && b <= 90) || (b >= 97 && b <= 122);
}

function damaged(message: string): TallyError {
  return new TallyError('raster-invalid', message);
}

/**
 * Walks every chunk of a PNG file and checks its structure: signature, IHDR first, lengths that fit,
 * chunk-type letters, each CRC, and IEND last with nothing after it. Pixel data is not decoded.
 * Throws TallyError('raster-invalid') naming the first problem; meant for files from outside.
 */
export function validatePngChunks(png: Uint8Array): PngChunk[] {
  if (png.length < SIGNATURE_LENGTH || PNG_SIGNATURE.some((b, i) => png[i] !== b)) {
    throw damaged('This file is not a PNG image: it does not start with the PNG signature.');
  }
  const view = new DataView(png.buffer, png.byteOffset, png.byteLength);
  const chunks: PngChunk[] = [];
  let offset = SIGNATURE_LENGTH;
  for (;;) {
    if (offset + 8 > png.length) {
      throw damaged(`The PNG file is cut short: it ends at byte ${png.length} before its end marker (IEND).`);
    }
    const dataLength = view.getUint32(offset);
    if (dataLength > PNG_MAX_UINT) {
      throw damaged(`The PNG file is damaged: the chunk at byte ${offset} claims an impossible length (${dataLength} bytes).`);
    }
    const typeBytes = png.subarray(offset + 4, offset + 8);
    if (!Array.from(typeBytes).every(isChunkTypeByte)) {
      throw damaged(`The PNG file is damaged: the chunk at byte ${offset} has no valid chunk name.`);
    }
    const type = String.fromCharCode(...typeBytes);
    const end = offset + 12 + dataLength;
    if (end > png.length) {
      throw damaged(`The PNG file is cut short: its ${type} chunk at byte ${offset} needs ${end - offset} bytes but only ${png.length - offset} remain.`);
    }
    if (chunks.length === 0 && (type !== 'IHDR' || dataLength !== 13)) {
      throw damaged('The PNG file is damaged: it does not begin with a valid header chunk (IHDR).');
    }
    const storedCrc = view.getUint32(offset + 8 + dataLength);
    const actualCrc = pngCrc32(png.subarray(offset + 4, offset + 8 + dataLength));
    if (storedCrc !== actualCrc) {
      throw damaged(`The PNG file is damaged: the checksum (CRC) of its ${type} chunk at byte ${offset} does not match its contents.`);
    }
    chunks.push({ type, offset, dataLength });
    offset = end;
    if (type === 'IEND') break;
  }
  if (offset !== png.length) {
    throw damaged(`The PNG file has ${png.length - offset} unexpected bytes after its end marker (IEND).`);
  }
  return chunks;
}

/** Image size from the IHDR chunk, after checking the whole chunk structure (cheap: no pixel decoding). */
export function readPngSize(png: Uint8Array): { widthPx: number; heightPx: number } {
  validatePngChunks(png);
  const view = new DataView(png.buffer, png.byteOffset, png.byteLength);
  const widthPx = view.getUint32(SIGNATURE_LENGTH + 8);
  const heightPx = view.getUint32(SIGNATURE_LENGTH + 12);
  if (widthPx === 0 || heightPx === 0 || widthPx > PNG_MAX_UINT || heightPx > PNG_MAX_UINT) {
    throw damaged(`The PNG file is damaged: its header gives an impossible size (${widthPx} x ${heightPx} pixels).`);
  }
  return { widthPx, heightPx };
}

/** Pixels per metre for a resolution in pixels per inch; 1 in = 0.0254 m exactly, so 300 ppi = 11811. */
export function ppiToPpm(ppi: number): number {
  if (!Number.isFinite(ppi) || ppi <= 0) {
    throw new TallyError('raster-invalid', `The resolution must be a positive number of pixels per inch (got ${ppi}).`);
  }
  const ppm = Math.round(ppi / METRES_PER_INCH);
  if (ppm < 1 || ppm > PNG_MAX_UINT) {
    throw new TallyError('raster-invalid', `A resolution of ${ppi} ppi cannot be stored in a PNG file.`);
  }
  return ppm;
}

function chunkBytes(type: string, data: Uint8Array): Uint8Array {
  const out = new Uint8Array(12 + data.length);
  const view = new DataView(out.buffer);
  view.setUint32(0, data.length);
  for (let i = 0; i < 4; i++) out[4 + i] = type.charCodeAt(i);
  out.set(data, 8);
  view.setUint32(8 + data.length, pngCrc32(out.subarray(4, 8 + data.length)));
  return out;
}

function concat(parts: readonly Uint8Array[]): Uint8Array {
  const out = new Uint8Array(parts.reduce((n, p) => n + p.length, 0));
  let at = 0;
  for (const p of parts) {
    out.set(p, at);
    at += p.length;
  }
  return out;
}

/**
 * Returns a copy of the PNG with one pHYs chunk (unit: metre) right after IHDR, which satisfies the
 * spec's "before the first IDAT" rule. Any existing pHYs chunks are dropped, so the file never carries two.
 */
export function withPhysChunk(png: Uint8Array, ppi: number): Uint8Array {
  const ppm = ppiToPpm(ppi);
  const chunks = validatePngChunks(png);
  const data = new Uint8Array(9);
  const view = new DataView(data.buffer);
  view.setUint32(0, ppm);
  view.setUint32(4, ppm);
  view.setUint8(8, 1);
  const parts: Uint8Array[] = [png.subarray(0, SIGNATURE_LENGTH)];
  for (const chunk of chunks) {
    if (chunk.type === 'pHYs') continue;
    parts.push(png.subarray(chunk.offset, chunk.offset + 12 + chunk.dataLength));
    if (chunk.type === 'IHDR') parts.push(chunkBytes('pHYs', data));
  }
  return concat(parts);
}

/** The pHYs chunk's values, or null when the PNG has none. Checks the whole chunk structure first. */
export function readPhysChunk(png: Uint8Array): PhysChunk | null {
  const chunk = validatePngChunks(png).find((c) => c.type === 'pHYs');
  if (!chunk) return null;
  if (chunk.dataLength !== 9) {
    throw damaged(`The PNG file is damaged: its resolution chunk (pHYs) has ${chunk.dataLength} bytes instead of 9.`);
  }
  const view = new DataView(png.buffer, png.byteOffset + chunk.offset + 8, 9);
  return { ppmX: view.getUint32(0), ppmY: view.getUint32(4), unit: view.getUint8(8) };
}
