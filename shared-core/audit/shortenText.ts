// Shortens text for a field or a note without splitting a character a reader sees as one (an accented
// letter, a flag, a family emoji): the cut falls between grapheme clusters and an ellipsis marks it.

const ELLIPSIS = '…';

export interface ShortenedText {
  text: string;
  /** True when the text was cut. */
  shortened: boolean;
}

/** At most `maxCodePoints` code points (the ellipsis included), cut at a grapheme boundary. */
export function shortenText(text: string, maxCodePoints: number): ShortenedText {
  if ([...text].length <= maxCodePoints) return { text, shortened: false };
  const room = Math.max(0, maxCodePoints - 1);
  let kept = '';
  let used = 0;
  for (const { segment } of new Intl.Segmenter('en', { granularity: 'grapheme' }).segment(text)) {
    const n = [...segment].length;
    if (used + n > room) break;
    kept += segment;
    used += n;
  }
  return { text: kept.trimEnd() + ELLIPSIS, shortened: true };
}
