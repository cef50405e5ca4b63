// The check's findings in the app's own words: the verifier speaks the chart file's vocabulary
// (rounding "ink-cut", mode "stack"), the designer sees the names on the buttons ("Cut by ink", Stack).

/** File-format phrases and the controls that set them, longest first so a phrase is replaced whole. */
const UI_WORDS: ReadonlyArray<readonly [RegExp, string]> = [
  [/\(mode "repeat" or "stack"\)/g, '(the Repeat or Stack mode)'],
  [/\(rounding "ink-cut"\)/g, '(Remainders: Cut by ink)'],
  [/\(rounding "whole"\)/g, '(Remainders: Whole glyphs)'],
  [/rounding "ink-cut"/g, 'Remainders: Cut by ink'],
  [/rounding "whole"/g, 'Remainders: Whole glyphs'],
  [/\(mode "(repeat|stack|scale|fill)"\)/g, '(the $1 mode)'],
  [/mode "(repeat|stack|scale|fill)"/g, 'the $1 mode'],
  [/fillTo "max"/g, 'Full glyph means: The largest value'],
  [/fillTo "share"/g, 'Full glyph means: Each value is a share'],
  [/arrangement "shared-grid"/g, 'Arrangement: One shared grid'],
  [/arrangement "per-category"/g, 'Arrangement: A row per category'],
];

const MODE_NAMES: Record<string, string> = { repeat: 'Repeat', stack: 'Stack', scale: 'Scale', fill: 'Fill' };

/** A sentence from the verifier, with the file's words for settings replaced by the app's. */
export function toUiWords(sentence: string): string {
  let out = sentence;
  for (const [pattern, words] of UI_WORDS) out = out.replace(pattern, words);
  // "the stack mode" -> "the Stack mode": the mode as its button is labelled.
  return out.replace(/the (repeat|stack|scale|fill) mode/g, (_, m: string) => `the ${MODE_NAMES[m]} mode`);
}

/** Short names for the pill in the toolbar, by finding code; anything else is cut from its message. */
const SHORT_BY_CODE: Record<string, string> = {
  'ink-page-coloured': 'a mark is in the page colour',
  'ink-same-colour': 'a fill cannot be seen',
  'ink-covered': 'something covers a mark',
  'painted-over': 'something covers a mark',
  'not-drawn': 'a category is not drawn',
  'reference-not-drawn': 'the smallest category is not drawn',
  'zero-drawn': 'a zero value is drawn',
  overflow: 'the chart does not fit the page',
  'content-overflow': 'the chart does not fit the page',
  'summary-mismatch': 'the file does not match its data',
};

const PILL_MAX_CHARS = 64;

/** The first blocking finding in a few words, for the toolbar: what actually stops the export. */
export function shortReason(finding: { code: string; message: string; category?: string }, lieFactorText: string | null): string {
  if (finding.code === 'lie-factor' || finding.code.startsWith('lie-factor')) {
    return lieFactorText ? `lie factor ${lieFactorText}${finding.category ? ` (${finding.category})` : ''}` : 'lie factor out of bounds';
  }
  const known = SHORT_BY_CODE[finding.code];
  if (known) return finding.category ? `${known} (${finding.category})` : known;
  // Unknown code: the message up to its first clause, cut at a word.
  const first = toUiWords(finding.message).split(/[;:]\s|,\s(?:so|but|although|which)\s/)[0].replace(/\.$/, '');
  if (first.length <= PILL_MAX_CHARS) return first;
  const cut = first.slice(0, PILL_MAX_CHARS);
  return `${cut.slice(0, Math.max(cut.lastIndexOf(' '), 24))}…`;
}
