// Strict UTF-8 decoding of supplied SVG bytes, against Node's own TextDecoder with fatal errors (the WHATWG
// Encoding standard's UTF-8 decoder, ICU inside V8): the same text where that accepts the bytes, a refusal
// where it throws. Byte cases from RFC 3629 §3-4 and the Unicode Standard's Table 3-7 (well-formed sequences).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { decodeSvgBytes, decodeUtf8Strict } from '../../../shared-core/audit/decodeSvgBytes';

function reference(bytes: Uint8Array): string | null {
  try {
    return new TextDecoder('utf-8', { fatal: true, ignoreBOM: false }).decode(bytes);
  } catch {
    return null;
  }
}

const CASES: Array<[string, number[]]> = [
  ['ASCII', [0x3c, 0x73, 0x76, 0x67, 0x3e]],
  ['byte-order mark dropped', [0xef, 0xbb, 0xbf, 0x41]],
  ['a second byte-order mark kept as U+FEFF', [0xef, 0xbb, 0xbf, 0xef, 0xbb, 0xbf]],
  ['2-byte é', [0xc3, 0xa9]],
  ['3-byte €', [0xe2, 0x82, 0xac]],
  ['4-byte emoji (a surrogate pair in UTF-16)', [0xf0, 0x9f, 0x98, 0x80]],
  ['highest code point U+10FFFF', [0xf4, 0x8f, 0xbf, 0xbf]],
  ['overlong slash C0 AF', [0xc0, 0xaf]],
  ['overlong E0 80 AF', [0xe0, 0x80, 0xaf]],
  ['overlong F0 80 80 AF', [0xf0, 0x80, 0x80, 0xaf]],
  ['surrogate ED A0 80', [0xed, 0xa0, 0x80]],
  ['past U+10FFFF: F4 90 80 80', [0xf4, 0x90, 0x80, 0x80]],
  ['F5 lead byte', [0xf5, 0x80, 0x80, 0x80]],
  ['lone continuation byte', [0x41, 0x80]],
  ['cut-off 3-byte sequence at the end', [0x41, 0xe2, 0x82]],
  ['lead byte followed by ASCII', [0xe2, 0x41, 0x42]],
  ['Latin-1 é (not UTF-8)', [0x63, 0x61, 0x66, 0xe9]],
];

describe('decodeUtf8Strict against TextDecoder (fatal)', () => {
  for (const [name, bytes] of CASES) {
    it(name, () => {
      expect(decodeUtf8Strict(Uint8Array.from(bytes))).toBe(reference(Uint8Array.from(bytes)));
    });
  }

  it('agrees on 3,000 random byte strings (biased toward UTF-8 lead and continuation bytes) and on encoded random text', () => {
    const byte = fc.oneof(fc.integer({ min: 0, max: 0x7f }), fc.integer({ min: 0x80, max: 0xbf }), fc.integer({ min: 0xc0, max: 0xff }));
    fc.assert(
      fc.property(fc.array(byte, { maxLength: 24 }), (list) => {
        const bytes = Uint8Array.from(list);
        expect(decodeUtf8Strict(bytes)).toBe(reference(bytes));
      }),
      { numRuns: 3000, seed: 9 },
    );
    fc.assert(
      fc.property(fc.string({ unit: 'grapheme', maxLength: 40 }), (text) => {
        const bytes = new TextEncoder().encode(text);
        expect(decodeUtf8Strict(bytes)).toBe(reference(bytes));
      }),
      { numRuns: 1000, seed: 10 },
    );
  });

  it('decodes a long file whole (past the chunk size the decoder builds strings in)', () => {
    const text = '<svg>' + 'é€😀a'.repeat(20_000) + '</svg>';
    expect(decodeUtf8Strict(new TextEncoder().encode(text))).toBe(text);
  });
});

describe('decodeSvgBytes', () => {
  it('refuses UTF-16 and invalid UTF-8 with a sentence saying what to do', () => {
    expect(() => decodeSvgBytes(Uint8Array.from([0xff, 0xfe, 0x3c, 0x00]))).toThrow(/saved as UTF-16 text; save it as UTF-8/);
    expect(() => decodeSvgBytes(Uint8Array.from([0x3c, 0xe9, 0x3e]))).toThrow(/bytes that are not valid UTF-8 text/);
    expect(decodeSvgBytes(Uint8Array.from([0xef, 0xbb, 0xbf, 0x3c, 0x73, 0x76, 0x67, 0x2f, 0x3e]))).toBe('<svg/>');
  });
});
