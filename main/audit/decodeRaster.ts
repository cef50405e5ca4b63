// Decodes a supplied PNG or JPEG mock-up to RGBA with the size checked before any pixel is decoded,
// so a damaged or oversized image is refused with a sentence instead of exhausting memory.
import jpeg from 'jpeg-js';
import { PNG } from 'pngjs';
import { TallyError } from '../../shared-core/errors';
import { readPngSize } from '../raster/physChunk';
import { RASTER_IMPORT_LIMITS, readJpegSize, sniffKind, type RasterImage, type RasterLimits } from '../../shared-core/audit/rasterHeaders';

// Moved to shared-core (pure); re-exported so existing callers keep their imports.
export { RASTER_IMPORT_LIMITS, readJpegSize, sniffKind, type RasterImage, type RasterLimits, type SuppliedKind } from '../../shared-core/audit/rasterHeaders';

function checkSize(widthPx: number, heightPx: number, limits: RasterLimits, what: string): void {
  if (!(widthPx > 0) || !(heightPx > 0)) {
    throw new TallyError('raster-invalid', `The ${what} image has no pixels (${widthPx} x ${heightPx}); there is nothing to measure.`);
  }
  if (widthPx * heightPx > limits.maxPixels) {
    throw new TallyError(
      'raster-invalid',
      `The ${what} image is ${widthPx} x ${heightPx} pixels, more than the ${(limits.maxPixels / 1e6).toFixed(0)} million pixel limit; export it at a lower resolution.`,
    );
  }
}

/** Decode PNG or JPEG bytes. Throws TallyError('raster-invalid') naming what is wrong. */
export function decodeRaster(bytes: Uint8Array, limits: RasterLimits = RASTER_IMPORT_LIMITS): RasterImage {
  if (!bytes.length) throw new TallyError('raster-invalid', 'The image file is empty (0 bytes).');
  const kind = sniffKind(bytes);
  if (kind === 'png') {
    // Chunk structure and every CRC are checked first: a damaged file is refused before the decoder sees it.
    const { widthPx, heightPx } = readPngSize(bytes);
    checkSize(widthPx, heightPx, limits, 'PNG');
    let decoded: PNG;
    try {
      decoded = PNG.sync.read(Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength));
    } catch (e) {
      throw new TallyError('raster-invalid', `The PNG file could not be decoded: ${e instanceof Error ? e.message.split('\n')[0] : String(e)}.`);
    }
    return { format: 'png', widthPx: decoded.width, heightPx: decoded.height, rgba: new Uint8Array(decoded.data.buffer, decoded.data.byteOffset, decoded.data.byteLength) };
  }
  if (kind === 'jpeg') {
    const { widthPx, heightPx } = readJpegSize(bytes);
    checkSize(widthPx, heightPx, limits, 'JPEG');
    let decoded: { width: number; height: number; data: Uint8Array };
    try {
      decoded = jpeg.decode(bytes, { useTArray: true, formatAsRGBA: true, maxResolutionInMP: limits.maxPixels / 1e6, maxMemoryUsageInMB: 1024 });
    } catch (e) {
      throw new TallyError('raster-invalid', `The JPEG file could not be decoded: ${e instanceof Error ? e.message.split('\n')[0] : String(e)}.`);
    }
    checkSize(decoded.width, decoded.height, limits, 'JPEG');
    if (decoded.data.length !== decoded.width * decoded.height * 4) throw new TallyError('raster-invalid', 'The JPEG file decoded to the wrong number of pixels.');
    return { format: 'jpeg', widthPx: decoded.width, heightPx: decoded.height, rgba: decoded.data };
  }
  throw new TallyError('raster-invalid', 'The file is neither a PNG nor a JPEG image.');
}
