// The committed font modules: current with the npm package, and a faithful WOFF-to-sfnt conversion.
import opentype from 'opentype.js';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { fontModulePath, fontModuleSource, fontPackageDir, fontSource, fontWeights, woffToSfnt } from '../../../scripts/build-font-module';

const woffBytes = (weight: (typeof fontWeights)[number]) => new Uint8Array(readFileSync(fontSource(weight).woffPath));
const arrayBuffer = (bytes: Uint8Array) => bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength);

/** OpenType spec, "Calculating checksums": big-endian uint32 sum, zero-padded, modulo 2^32. */
function checksum(view: DataView, offset: number, length: number): number {
  let sum = 0;
  for (let i = 0; i < length; i += 4) {
    let word = 0;
    for (let k = 0; k < 4; k++) word = word * 256 + (i + k < length ? view.getUint8(offset + i + k) : 0);
    sum = (sum + word) % 2 ** 32;
  }
  return sum;
}

describe('font modules', () => {
  for (const weight of fontWeights) {
    it(`noto-sans-${weight}.ts is what npm run build:font writes today`, () => {
      const expected = fontModuleSource(fontSource(weight), woffBytes(weight));
      expect(readFileSync(fontModulePath(weight), 'utf8')).toBe(expected);
    });

    it(`${weight}: the sfnt conversion has the glyphs opentype.js reads from the WOFF itself`, () => {
      const woff = woffBytes(weight);
      const fromWoff = opentype.parse(arrayBuffer(woff));
      const fromSfnt = opentype.parse(arrayBuffer(woffToSfnt(woff)));
      expect(fromSfnt.numGlyphs).toBe(fromWoff.numGlyphs);
      for (let i = 0; i < fromWoff.numGlyphs; i++) {
        const a = fromWoff.glyphs.get(i);
        const b = fromSfnt.glyphs.get(i);
        expect(b.advanceWidth).toBe(a.advanceWidth);
        expect(b.path.commands).toEqual(a.path.commands);
      }
      expect(fromSfnt.names.fullName).toEqual(fromWoff.names.fullName);
    });

    it(`${weight}: table checksums and head.checkSumAdjustment follow the OpenType spec`, () => {
      const sfnt = woffToSfnt(woffBytes(weight));
      const view = new DataView(sfnt.buffer, sfnt.byteOffset, sfnt.byteLength);
      const numTables = view.getUint16(4);
      let headOffset = -1;
      for (let i = 0; i < numTables; i++) {
        const record = 12 + i * 16;
        const tag = String.fromCharCode(...sfnt.subarray(record, record + 4));
        const offset = view.getUint32(record + 8);
        const length = view.getUint32(record + 12);
        expect(offset % 4).toBe(0);
        let sum = checksum(view, offset, length);
        if (tag === 'head') {
          headOffset = offset;
          // The head checksum is taken with checkSumAdjustment counted as zero.
          sum = (sum - view.getUint32(offset + 8) + 2 ** 32) % 2 ** 32;
        }
        expect(sum, tag).toBe(view.getUint32(record + 4));
      }
      expect(headOffset).toBeGreaterThan(0);
      // The whole font, adjustment included, sums to 0xB1B0AFBA.
      expect(checksum(view, 0, sfnt.length)).toBe(0xb1b0afba);
    });
  }

  it('OFL.txt is the licence shipped with the npm package', () => {
    const ours = readFileSync(new URL('../../../assets/fonts/OFL.txt', import.meta.url), 'utf8');
    expect(ours).toBe(readFileSync(`${fontPackageDir()}/LICENSE`, 'utf8'));
    expect(ours).toContain('SIL OPEN FONT LICENSE Version 1.1');
  });
});
