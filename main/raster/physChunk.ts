// Node face of the PNG chunk helpers: the one implementation lives in shared-core/png (pure, so the
// browser host uses it too); here withPhysChunk hands back a Buffer, which the file writers and pngjs expect.
// The CRC is the pure table one everywhere: zlib.crc32 is 10-25 times faster, but checking every chunk of
// a 1 MB PNG (a demo chart at 1200 ppi, 8504 x 5669 px) took about 3 ms here against 1.3 s to rasterise it,
// so a second code path is not worth keeping.

import { withPhysChunk as withPhysChunkBytes } from '../../shared-core/png/index';

export { readPhysChunk, validatePngChunks, readPngSize, ppiToPpm, pngCrc32, type PhysChunk, type PngChunk } from '../../shared-core/png/index';
/** The table-driven CRC-32 under its former name here; the same function as pngCrc32. */
export { pngCrc32 as tableCrc32 } from '../../shared-core/png/index';

/**
 * A copy of the PNG with one pHYs chunk (unit: metre) right after IHDR, as a Buffer over the same bytes
 * (no second copy). See shared-core/png/physChunk.ts.
 */
export function withPhysChunk(png: Uint8Array, ppi: number): Buffer {
  const out = withPhysChunkBytes(png, ppi);
  return Buffer.from(out.buffer, out.byteOffset, out.byteLength);
}
