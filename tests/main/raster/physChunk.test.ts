import zlib from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { PNG } from 'pngjs';
import { Resvg } from '@resvg/resvg-js';
import { ppiToPpm, readPhysChunk, readPngSize, tableCrc32, validatePngChunks, withPhysChunk } from '../../../main/raster/physChunk';
import { caught } from '../../helpers/errors';
import { hasPngcheck, pngcheckPhys, pngcheckRun } from '../../helpers/independent';

const PAGE = '<svg xmlns="http://www.w3.org/2000/svg" width="40" height="20"><rect x="5" y="5" width="20" height="10"/></svg>';

/** A PNG straight from resvg, which writes no pHYs chunk. */
function plainPng(): Buffer {
  return new Resvg(PAGE, { font: { loadSystemFonts: false } }).render().asPng();
}

function expectRasterInvalid(run: () => unknown, message: RegExp): void {
  const e = caught(run);
  expect(e.code).toBe('raster-invalid');
  expect(e.message).toMatch(message);
}

/** Offset of the first byte of a chunk's data. */
function dataOffset(png: Buffer, type: string): number {
  const chunk = validatePngChunks(png).find((c) => c.type === type);
  if (!chunk) throw new Error(`no ${type}`);
  return chunk.offset + 8;
}

describe('withPhysChunk / readPhysChunk', () => {
  // PNG spec (ISO/IEC 15948) §11.3.5.3: pixels per unit X and Y, unit 1 = metre. 1 in = 0.0254 m exactly,
  // so the values below are the published ones in REFERENCES.md ("Files and units").
  const cases: Array<[number, number]> = [
    [300, 11811],
    [600, 23622],
    [96, 3780],
    [72, 2835],
  ];

  it.each(cases)('%d ppi is stored as %d px/m and read back by this module', (ppi, ppm) => {
    expect(ppiToPpm(ppi)).toBe(ppm);
    expect(readPhysChunk(withPhysChunk(plainPng(), ppi))).toEqual({ ppmX: ppm, ppmY: ppm, unit: 1 });
  });

  it.skipIf(!hasPngcheck).each(cases)('%d ppi reads back as %d px/m in pngcheck (independent decoder)', (ppi, ppm) => {
    expect(pngcheckPhys(withPhysChunk(plainPng(), ppi))).toEqual({ ppmX: ppm, ppmY: ppm, unit: 1 });
  });

  it('reports no pHYs for a PNG without one, agreeing with pngcheck', () => {
    expect(readPhysChunk(plainPng())).toBeNull();
    if (hasPngcheck) expect(pngcheckPhys(plainPng())).toBeNull();
  });

  it('puts pHYs right after IHDR, before IDAT (PNG spec §5.6 ordering)', () => {
    const types = validatePngChunks(withPhysChunk(plainPng(), 300)).map((c) => c.type);
    expect(types[0]).toBe('IHDR');
    expect(types[1]).toBe('pHYs');
    expect(types.indexOf('IDAT')).toBeGreaterThan(1);
    expect(types.at(-1)).toBe('IEND');
  });

  it('replaces an existing pHYs instead of adding a second one', () => {
    const twice = withPhysChunk(withPhysChunk(plainPng(), 300), 72);
    expect(validatePngChunks(twice).filter((c) => c.type === 'pHYs')).toHaveLength(1);
    expect(readPhysChunk(twice)).toEqual({ ppmX: 2835, ppmY: 2835, unit: 1 });
    if (hasPngcheck) expect(pngcheckPhys(twice)).toEqual({ ppmX: 2835, ppmY: 2835, unit: 1 });
  });

  it('leaves the image intact: pngjs (independent decoder, CRC checking on) decodes the same pixels', () => {
    const original = plainPng();
    const before = PNG.sync.read(original);
    const after = PNG.sync.read(withPhysChunk(original, 300));
    expect([after.width, after.height]).toEqual([40, 20]);
    expect(Buffer.compare(after.data, before.data)).toBe(0);
    expect(readPngSize(withPhysChunk(original, 300))).toEqual({ widthPx: 40, heightPx: 20 });
  });

  it('refuses resolutions that are not positive numbers', () => {
    for (const bad of [0, -300, Number.NaN, Number.POSITIVE_INFINITY]) expectRasterInvalid(() => ppiToPpm(bad), /positive/);
  });
});

describe('validatePngChunks on damaged files', () => {
  it('detects a changed byte in the image data by its CRC, as pngcheck does', () => {
    const png = withPhysChunk(plainPng(), 300);
    png[dataOffset(png, 'IDAT') + 2] ^= 0x01;
    expectRasterInvalid(() => validatePngChunks(png), /checksum \(CRC\) of its IDAT chunk/);
    if (hasPngcheck) expect(pngcheckRun(png).ok).toBe(false);
  });

  it('detects a damaged CRC field itself', () => {
    const png = withPhysChunk(plainPng(), 300);
    const phys = validatePngChunks(png).find((c) => c.type === 'pHYs')!;
    png[phys.offset + 8 + phys.dataLength] ^= 0x80;
    expectRasterInvalid(() => readPhysChunk(png), /pHYs chunk/);
  });

  it('detects a truncated file, as pngcheck does', () => {
    const png = withPhysChunk(plainPng(), 300);
    for (const cut of [1, 5, 12, Math.floor(png.length / 2), 20, 9]) {
      const short = png.subarray(0, png.length - cut);
      expectRasterInvalid(() => validatePngChunks(short), /cut short|header chunk/);
      if (hasPngcheck && cut === 5) expect(pngcheckRun(short).ok).toBe(false);
    }
  });

  it('refuses a file that is not a PNG, bytes after IEND, and an impossible chunk length', () => {
    expectRasterInvalid(() => validatePngChunks(Buffer.from('GIF89a-not-a-png')), /not a PNG/);
    expectRasterInvalid(() => validatePngChunks(Buffer.concat([plainPng(), Buffer.from([0])])), /after its end marker/);
    const png = plainPng();
    const idat = validatePngChunks(png).find((c) => c.type === 'IDAT')!;
    png.writeUInt32BE(0xffffffff, idat.offset);
    expectRasterInvalid(() => validatePngChunks(png), /impossible length/);
  });

  it('refuses a PNG whose first chunk is not IHDR', () => {
    const png = plainPng();
    png.write('ABCD', 12, 'latin1');
    expectRasterInvalid(() => validatePngChunks(png), /IHDR/);
  });
});

describe('table CRC-32', () => {
  it('matches zlib.crc32 (an independent implementation) on varied inputs', () => {
    let seed = 12345;
    for (const length of [0, 1, 3, 13, 256, 4099]) {
      const bytes = new Uint8Array(length).map(() => (seed = (seed * 1103515245 + 12345) >>> 0) >>> 24);
      expect(tableCrc32(bytes)).toBe(zlib.crc32(bytes) >>> 0);
    }
  });

  it('gives the standard CRC-32 check value for "123456789" (0xCBF43926, from memory)', () => {
    expect(tableCrc32(Buffer.from('123456789', 'latin1'))).toBe(0xcbf43926);
  });
});
