// A supplied SVG's bytes as text: strict UTF-8 (RFC 3629; the WHATWG Encoding standard's decoder with
// fatal errors), so a file with invalid bytes is refused rather than patched with replacement characters.
// Written out here because the pure core has no TextDecoder; the command line and the app share it.
import { TallyError } from '../errors';

/** Bytes a lead byte may be followed by: the second byte's range, then the count of continuation bytes. */
function sequenceOf(lead: number): { min: number; max: number; length: number } | null {
  if (lead >= 0xc2 && lead <= 0xdf) return { min: 0x80, max: 0xbf, length: 2 };
  // E0 and F0 refuse overlong forms, ED refuses UTF-16 surrogates, F4 refuses code points past U+10FFFF.
  if (lead === 0xe0) return { min: 0xa0, max: 0xbf, length: 3 };
  if (lead === 0xed) return { min: 0x80, max: 0x9f, length: 3 };
  if (lead >= 0xe1 && lead <= 0xef) return { min: 0x80, max: 0xbf, length: 3 };
  if (lead === 0xf0) return { min: 0x90, max: 0xbf, length: 4 };
  if (lead === 0xf4) return { min: 0x80, max: 0x8f, length: 4 };
  if (lead >= 0xf1 && lead <= 0xf3) return { min: 0x80, max: 0xbf, length: 4 };
  return null;
}

/** Strict UTF-8 to a string, a leading byte-order mark dropped; null at the first invalid or cut-off sequence. */
export function decodeUtf8Strict(bytes: Uint8Array): string | null {
  let i = bytes.length >= 3 && bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf ? 3 : 0;
  // UTF-16 never needs more code units than UTF-8 has bytes.
  const units = new Uint16Array(bytes.length);
  let n = 0;
  while (i < bytes.length) {
    const lead = bytes[i];
    if (lead < 0x80) {
      units[n++] = lead;
      i += 1;
      continue;
    }
    const seq = sequenceOf(lead);
    if (!seq || i + seq.length > bytes.length) return null;
    const second = bytes[i + 1];
    if (second < seq.min || second > seq.max) return null;
    let cp = lead & (seq.length === 2 ? 0x1f : seq.length === 3 ? 0x0f : 0x07);
    for (let k = 1; k < seq.length; k++) {
      const b = bytes[i + k];
      if ((b & 0xc0) !== 0x80) return null;
      cp = (cp << 6) | (b & 0x3f);
    }
    if (cp > 0xffff) {
      cp -= 0x10000;
      units[n++] = 0xd800 + (cp >> 10);
      units[n++] = 0xdc00 + (cp & 0x3ff);
    } else units[n++] = cp;
    i += seq.length;
  }
  // Spread arguments have an engine limit: build the string from slices well below it.
  const chunks: string[] = [];
  // apply takes the typed array as it is (a spread would walk it through the iterator protocol, far slower).
  for (let at = 0; at < n; at += 8192) chunks.push(String.fromCharCode.apply(null, units.subarray(at, Math.min(n, at + 8192)) as unknown as number[]));
  return chunks.join('');
}

/** A supplied SVG file's text. Throws TallyError('svg-malformed') for UTF-16 or invalid UTF-8, saying what to do. */
export function decodeSvgBytes(bytes: Uint8Array): string {
  if ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff)) {
    throw new TallyError('svg-malformed', 'The SVG is saved as UTF-16 text; save it as UTF-8 and try again.');
  }
  const text = decodeUtf8Strict(bytes);
  if (text === null) throw new TallyError('svg-malformed', 'The SVG file contains bytes that are not valid UTF-8 text; save it as UTF-8 and try again.');
  return text;
}
