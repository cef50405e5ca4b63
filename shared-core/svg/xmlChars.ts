// Characters XML 1.0 cannot carry at all (controls, lone surrogates, U+FFFE/FFFF), found once for every writer.
export const NOT_XML_CHAR = /[^\t\n\r\u0020-\uD7FF\uE000-\uFFFD\u{10000}-\u{10FFFF}]/gu;

/** The text with every character XML cannot carry replaced by "?", so data and attributes agree. */
export function toXmlChars(s: string): string {
  return s.replace(NOT_XML_CHAR, '?');
}
