import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { notoSans400Base64 } from '../../../assets/fonts/noto-sans-400';
import { isTallyError } from '../../../shared-core/errors';
import { decodeBase64 } from '../../../shared-core/text/decodeBase64';

const bytesOf = (s: string) => [...s].map((c) => c.charCodeAt(0));

describe('decodeBase64', () => {
  it('decodes the RFC 4648 section 10 test vectors', () => {
    const vectors: Array<[string, string]> = [
      ['', ''],
      ['Zg==', 'f'],
      ['Zm8=', 'fo'],
      ['Zm9v', 'foo'],
      ['Zm9vYg==', 'foob'],
      ['Zm9vYmE=', 'fooba'],
      ['Zm9vYmFy', 'foobar'],
    ];
    for (const [encoded, plain] of vectors) expect([...decodeBase64(encoded)]).toEqual(bytesOf(plain));
  });

  it('accepts unpadded input', () => {
    expect([...decodeBase64('Zm9vYg')]).toEqual(bytesOf('foob'));
  });

  it('agrees with Node Buffer on random bytes', () => {
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 200 }), (bytes) => {
        const encoded = Buffer.from(bytes).toString('base64');
        expect([...decodeBase64(encoded)]).toEqual([...bytes]);
      }),
    );
  });

  it('agrees with Node Buffer on the embedded font', () => {
    expect(Buffer.from(decodeBase64(notoSans400Base64)).equals(Buffer.from(notoSans400Base64, 'base64'))).toBe(true);
  });

  it('refuses characters outside the alphabet and impossible lengths', () => {
    for (const bad of ['Zm9v!', 'Zm9vY', 'Zg===', 'Zm 9v']) {
      let error: unknown;
      try {
        decodeBase64(bad);
      } catch (e) {
        error = e;
      }
      expect(isTallyError(error) && error.code).toBe('data-invalid');
    }
  });
});
