// A supplied graphic (opened or dropped) read as the `audit` command reads a file: the size limit
// first, the kind from the bytes rather than the name, SVG as strict UTF-8, and an image's pixel
// count from its header before a single pixel is decoded.
import { DEFAULT_AUDIT_LIMITS } from '../../../shared-core/audit/auditLimits';
import { decodeSvgBytes } from '../../../shared-core/audit/decodeSvgBytes';
import { RASTER_IMPORT_LIMITS, readJpegSize, sniffKind, type RasterImage } from '../../../shared-core/audit/rasterHeaders';
import { TallyError } from '../../../shared-core/errors';
import { readPngSize } from '../../../shared-core/png';

export type SuppliedGraphic =
  | { kind: 'svg'; name: string; text: string }
  | { kind: 'raster'; name: string; image: RasterImage; mime: 'image/png' | 'image/jpeg'; bytes: Uint8Array };

function mb(n: number): string {
  return `${(n / 1_000_000).toFixed(1)} MB`;
}

/** Strict UTF-8 (a leading byte-order mark is dropped), the same decoding as the command line's. */
export const decodeSvgText = decodeSvgBytes;

/** Checks the bytes and says what they are; images are sized from their headers but not decoded yet. */
export function classifySupplied(name: string, bytes: Uint8Array): { kind: 'svg'; text: string } | { kind: 'png' | 'jpeg'; widthPx: number; heightPx: number } {
  const maxBytes = DEFAULT_AUDIT_LIMITS.maxChars;
  if (bytes.length === 0) throw new TallyError('raster-invalid', `"${name}" is empty (0 bytes): there is no graphic in it.`);
  if (bytes.length > maxBytes) throw new TallyError('svg-limit', `"${name}" is ${mb(bytes.length)}; the file size limit for a supplied graphic is ${mb(maxBytes)}.`);
  if (bytes[0] === 0x1f && bytes[1] === 0x8b) throw new TallyError('svg-malformed', `"${name}" is compressed (gzip, .svgz); unpack it to a plain .svg first.`);
  const kind = sniffKind(bytes);
  if (kind === 'svg') return { kind, text: decodeSvgText(bytes) };
  if (kind === 'png' || kind === 'jpeg') {
    // PNG: chunk structure and CRCs are checked here, before the browser's decoder sees the file.
    const size = kind === 'png' ? readPngSize(bytes) : readJpegSize(bytes);
    if (!(size.widthPx > 0 && size.heightPx > 0)) throw new TallyError('raster-invalid', `The image has no pixels (${size.widthPx} x ${size.heightPx}); there is nothing to measure.`);
    if (size.widthPx * size.heightPx > RASTER_IMPORT_LIMITS.maxPixels) {
      throw new TallyError('raster-invalid', `The image is ${size.widthPx} x ${size.heightPx} pixels, more than the ${(RASTER_IMPORT_LIMITS.maxPixels / 1e6).toFixed(0)} million pixel limit; export it at a lower resolution.`);
    }
    return { kind, ...size };
  }
  throw new TallyError('svg-malformed', `"${name}" is not an SVG, PNG or JPEG file.`);
}

/** Reads a supplied file's bytes into text or straight RGBA pixels. Throws TallyError naming the problem. */
export async function readSupplied(name: string, bytes: Uint8Array): Promise<SuppliedGraphic> {
  const kind = classifySupplied(name, bytes);
  if (kind.kind === 'svg') return { kind: 'svg', name, text: kind.text };
  const mime = kind.kind === 'png' ? 'image/png' : 'image/jpeg';
  let bitmap: ImageBitmap;
  try {
    // No colour conversion and no premultiplying: the pixels as stored, as the command line's decoder gives them.
    bitmap = await createImageBitmap(new Blob([bytes as BlobPart], { type: mime }), { premultiplyAlpha: 'none', colorSpaceConversion: 'none' });
  } catch {
    throw new TallyError('raster-invalid', `The ${kind.kind === 'png' ? 'PNG' : 'JPEG'} file could not be decoded; it may be damaged.`);
  }
  try {
    if (bitmap.width !== kind.widthPx || bitmap.height !== kind.heightPx) throw new TallyError('raster-invalid', 'The image decoded to a different size than its header states.');
    const canvas = document.createElement('canvas');
    canvas.width = bitmap.width;
    canvas.height = bitmap.height;
    const ctx = canvas.getContext('2d', { willReadFrequently: true });
    if (!ctx) throw new TallyError('raster-invalid', 'This browser gave no canvas to read the image with.');
    ctx.drawImage(bitmap, 0, 0);
    const data = ctx.getImageData(0, 0, bitmap.width, bitmap.height).data;
    const image: RasterImage = { format: kind.kind, widthPx: bitmap.width, heightPx: bitmap.height, rgba: new Uint8Array(data.buffer, data.byteOffset, data.byteLength) };
    return { kind: 'raster', name, image, mime, bytes };
  } finally {
    bitmap.close();
  }
}

export function base64ToBytes(base64: string): Uint8Array {
  const s = atob(base64);
  const out = new Uint8Array(s.length);
  for (let i = 0; i < s.length; i++) out[i] = s.charCodeAt(i);
  return out;
}
