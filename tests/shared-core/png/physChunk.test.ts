import zlib from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { PNG } from 'pngjs';
import { ppiToPpm, pngCrc32, readPhysChunk, validatePngChunks, withPhysChunk } from '../../../shared-core/png';
import { withPhysChunk as nodeWithPhysChunk } from '../../../main/raster/physChunk';
import { hasPngcheck, pngcheckPhys, pngcheckRun } from '../../helpers/independent';

function tinyPng(width = 3, height = 2): Uint8Array {
  const png = new PNG({ width, height });
  png.data.fill(200);
  return new Uint8Array(PNG.sync.write(png));
}

describe('pngCrc32', () => {
  it('gives the CRC-32 check value: "123456789" is 0xCBF43926 (PNG spec annex D polynomial)', () => {
    expect(pngCrc32(new TextEncoder().encode('123456789'))).toBe(0xcbf43926);
  });
});

describe('ppiToPpm', () => {
  it('converts with 1 in = 0.0254 m: 300 ppi is 11811 px/m, 72 ppi is 2835', () => {
    expect(ppiToPpm(300)).toBe(11811);
    expect(ppiToPpm(72)).toBe(2835);
  });
});

describe('withPhysChunk (pure)', () => {
  it('adds one pHYs right after IHDR, read back by pngcheck as 11811 px/m', () => {
    const out = withPhysChunk(tinyPng(), 300);
    const chunks = validatePngChunks(out).map((c) => c.type);
    expect(chunks.slice(0, 2)).toEqual(['IHDR', 'pHYs']);
    expect(readPhysChunk(out)).toEqual({ ppmX: 11811, ppmY: 11811, unit: 1 });
    // Twice keeps one chunk.
    expect(validatePngChunks(withPhysChunk(out, 600)).filter((c) => c.type === 'pHYs')).toHaveLength(1);
  });

  it.skipIf(!hasPngcheck)('is accepted by pngcheck, an independent decoder, with the same resolution', () => {
    const out = withPhysChunk(tinyPng(), 300);
    expect(pngcheckRun(out).ok).toBe(true);
    expect(pngcheckPhys(out)).toEqual({ ppmX: 11811, ppmY: 11811, unit: 1 });
  });

  it('writes chunk CRCs that agree with zlib\'s independent CRC-32 (PNG spec §5.3: CRC over type and data)', () => {
    const png = withPhysChunk(tinyPng(5, 4), 300);
    const view = new DataView(png.buffer, png.byteOffset, png.byteLength);
    let checked = 0;
    for (let at = 8; at < png.length; ) {
      const length = view.getUint32(at);
      const typeAndData = png.subarray(at + 4, at + 8 + length);
      expect(view.getUint32(at + 8 + length)).toBe(zlib.crc32(typeAndData));
      checked += 1;
      at += 12 + length;
    }
    expect(checked).toBeGreaterThanOrEqual(4); // IHDR, pHYs, IDAT, IEND
    // The Node wrapper hands back the same bytes as a Buffer.
    expect(Buffer.from(png).equals(nodeWithPhysChunk(tinyPng(5, 4), 300))).toBe(true);
  });

  it('refuses a file that is not a PNG or is damaged', () => {
    expect(() => withPhysChunk(new Uint8Array([1, 2, 3]), 300)).toThrow(/not a PNG/);
    const broken = tinyPng();
    broken[20] ^= 0xff;
    expect(() => withPhysChunk(broken, 300)).toThrow(/checksum/);
  });
});
