// The escapes skip strings with nothing to change; what they return must be exactly what the full chain of
// replacements returned before, for every kind of character XML 1.0 (section 2.2, Char) allows or forbids.
import { describe, expect, it } from 'vitest';
import { escapeXmlAttr, escapeXmlText } from '../../../shared-core/svg/writeSvg';
import { toXmlChars } from '../../../shared-core/svg/xmlChars';

/** Verbatim the escapes before the skip. */
function textBefore(s: string): string {
  return toXmlChars(s).replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/\uFFFD/g, '&#xFFFD;');
}
function attrBefore(s: string): string {
  return textBefore(s).replace(/"/g, '&quot;').replace(/\t/g, '&#9;').replace(/\n/g, '&#10;').replace(/\r/g, '&#13;');
}

/** Every boundary of the XML Char production and of the escaped set, plus ordinary text and path data. */
const PIECES = [
  'a', 'Z', '0', '9', '.', '-', ' ', 'M', 'L', 'é', 'Ω', '中', '😀', '#', '=', '?', ';', "'", '%',
  '&', '<', '>', '"', '\t', '\n', '\r', '\uFFFD', '\uFFFC', '\uFFFE', '\uFFFF', '\u0000', '\u0001', '\u001F', '\u007F',
  '\uD7FF', '\uE000', '\uD800', '\uDBFF', '\uDC00', '\uDFFF', '\u{10000}', '\u{10FFFF}', '&amp;', 'M1.5 -2L3 4Z',
];

function random(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

describe('escapeXmlText and escapeXmlAttr', () => {
  it('equal the full replacement chain on 20,000 random strings', () => {
    const rand = random(8);
    const wrong: string[] = [];
    for (let i = 0; i < 20_000; i++) {
      // Mostly plain strings (the skip) and some with one character from anywhere in the list.
      const plain = rand() < 0.5;
      const length = Math.floor(rand() * 12);
      let s = '';
      for (let j = 0; j < length; j++) s += PIECES[Math.floor(rand() * (plain ? 19 : PIECES.length))];
      if (escapeXmlText(s) !== textBefore(s) || escapeXmlAttr(s) !== attrBefore(s)) wrong.push(JSON.stringify(s));
    }
    expect(wrong.slice(0, 5)).toEqual([]);
  });

  it('escape each special character on its own', () => {
    for (const p of PIECES) {
      expect(escapeXmlText(p), JSON.stringify(p)).toBe(textBefore(p));
      expect(escapeXmlAttr(p), JSON.stringify(p)).toBe(attrBefore(p));
    }
    // XML 1.0 section 2.4: & and < must be escaped in character data; attribute values keep tabs and line
    // breaks only as character references (section 3.3.3, attribute-value normalisation).
    expect(escapeXmlAttr('a&b<c>"\t\n\r')).toBe('a&amp;b&lt;c&gt;&quot;&#9;&#10;&#13;');
    expect(escapeXmlText('a\uD800b\u0001')).toBe('a?b?');
    expect(escapeXmlText('M1 2L3 4Z')).toBe('M1 2L3 4Z');
  });
});
