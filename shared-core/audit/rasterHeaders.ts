// What a supplied file is, and an image's size, read from its first bytes without decoding a pixel:
// the app and the command line refuse oversized or damaged images the same way before decoding.
import { TallyError } from '../errors';

export type SuppliedKind = 'svg' | 'png' | 'jpeg';

export interface RasterImage {
  format: 'png' | 'jpeg';
  widthPx: number;
  heightPx: number;
  /** Straight (not premultiplied) RGBA, row by row. */
  rgba: Uint8Array;
}

export interface RasterLimits {
  /** Most pixels decoded (width × height). */
  maxPixels: number;
}

/** 25 million pixels: an A4 mock-up at 300 ppi is 8.7 million. Common practice, no source. */
export const RASTER_IMPORT_LIMITS: Readonly<RasterLimits> = Object.freeze({ maxPixels: 25_000_000 });

const PNG_SIGNATURE = [137, 80, 78, 71, 13, 10, 26, 10];

/** What the bytes are, from their first bytes (the file name is not trusted). Null when neither. */
export function sniffKind(bytes: Uint8Array): SuppliedKind | null {
  if (bytes.length >= 8 && PNG_SIGNATURE.every((b, i) => bytes[i] === b)) return 'png';
  if (bytes.length >= 3 && bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff) return 'jpeg';
  let i = bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf ? 3 : 0;
  while (i < bytes.length && i < 4096 && (bytes[i] === 0x20 || bytes[i] === 0x09 || bytes[i] === 0x0a || bytes[i] === 0x0d)) i++;
  if (bytes[i] === 0x3c) return 'svg';
  return null;
}

/** Width and height from a JPEG's start-of-frame marker (ITU-T T.81, B.2.2), without decoding. */
export function readJpegSize(bytes: Uint8Array): { widthPx: number; heightPx: number } {
  let i = 2;
  while (i + 4 <= bytes.length) {
    if (bytes[i] !== 0xff) throw new TallyError('raster-invalid', 'The JPEG file is damaged: a marker is missing where one should be.');
    const marker = bytes[i + 1];
    if (marker === 0xff) {
      i += 1;
      continue;
    }
    if (marker === 0xd8 || (marker >= 0xd0 && marker <= 0xd7) || marker === 0x01) {
      i += 2;
      continue;
    }
    if (marker === 0xd9) break;
    const length = (bytes[i + 2] << 8) | bytes[i + 3];
    if (length < 2) throw new TallyError('raster-invalid', 'The JPEG file is damaged: a segment has an impossible length.');
    // SOF0..SOF15 except DHT (C4), JPG (C8) and DAC (CC).
    if (marker >= 0xc0 && marker <= 0xcf && marker !== 0xc4 && marker !== 0xc8 && marker !== 0xcc) {
      if (i + 9 > bytes.length) break;
      return { heightPx: (bytes[i + 5] << 8) | bytes[i + 6], widthPx: (bytes[i + 7] << 8) | bytes[i + 8] };
    }
    i += 2 + length;
  }
  throw new TallyError('raster-invalid', 'The JPEG file is cut short or damaged: it has no image frame header.');
}
