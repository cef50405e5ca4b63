// A small base64 decoder: shared-core has neither atob nor Buffer, and the font arrives as base64 text.

import { TallyError } from '../errors';

const alphabet = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+/';
const sextets = new Int16Array(128).fill(-1);
for (let i = 0; i < alphabet.length; i++) sextets[alphabet.charCodeAt(i)] = i;

/** Decodes standard base64 (RFC 4648 section 4, with or without '=' padding) into bytes. */
export function decodeBase64(text: string): Uint8Array {
  let end = text.length;
  while (end > 0 && text[end - 1] === '=') end--;
  if (text.length - end > 2 || end % 4 === 1) {
    throw new TallyError('data-invalid', 'The embedded data is not valid base64: its length does not fit.');
  }
  const bytes = new Uint8Array(Math.floor((end * 3) / 4));
  let buffer = 0;
  let bits = 0;
  let out = 0;
  for (let i = 0; i < end; i++) {
    const code = text.charCodeAt(i);
    const value = code < 128 ? sextets[code] : -1;
    if (value < 0) {
      throw new TallyError('data-invalid', `The embedded data is not valid base64: unexpected character at position ${i}.`);
    }
    buffer = ((buffer << 6) | value) & 0xffffff;
    bits += 6;
    if (bits >= 8) {
      bits -= 8;
      bytes[out++] = (buffer >> bits) & 0xff;
    }
  }
  return bytes;
}
