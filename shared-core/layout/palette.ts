// Tallyglyph's own colours. The category palette was picked here by hand: eight mid-tone hues far
// enough apart to tell categories apart, each at least 3:1 against white paper (the contrast WCAG 2.1
// asks of graphical objects), and deliberately not any charting program's default set.
import type { Warning } from '../errors';

/** Category colours in order of use: lake blue, terracotta, moss, plum, ochre, raspberry, verdigris, slate. */
export const PALETTE: readonly string[] = Object.freeze([
  '#2f6f8f',
  '#d0673a',
  '#5f8d3b',
  '#8c4f9f',
  '#b08a17',
  '#b3435a',
  '#3a8f84',
  '#6a6f7b',
]);

/** Colours that are not data: text, secondary text, rules and legend keys. */
export const INK_COLORS = Object.freeze({
  text: '#23262b',
  muted: '#5b6068',
  rule: '#3b3f45',
  key: '#4d535a',
  /** Nested reference sizes in a scale legend, largest first. */
  referenceKeys: Object.freeze(['#d3d6da', '#a4a9b0', '#737980']),
});

/** How much white goes into the unfilled remainder of a fill glyph. */
export const REST_WHITE_SHARE = 0.75;

function hexDigits(hex: string): string {
  const body = hex.slice(1);
  return body.length <= 4 ? [...body].map((c) => c + c).join('') : body;
}

function toHex2(n: number): string {
  return Math.round(Math.min(255, Math.max(0, n))).toString(16).padStart(2, '0');
}

/**
 * A CSS hex colour (#rgb, #rgba, #rrggbb, #rrggbbaa) as opaque #rrggbb. Transparency is flattened
 * onto white paper: a see-through mark would show less ink than its geometry says.
 */
export function opaqueColor(hex: string, warnings?: Warning[], owner?: string): string {
  const digits = hexDigits(hex.toLowerCase());
  const rgb = [0, 2, 4].map((i) => parseInt(digits.slice(i, i + 2), 16));
  const alpha = digits.length === 8 ? parseInt(digits.slice(6, 8), 16) / 255 : 1;
  if (alpha < 1) {
    warnings?.push({
      code: 'color-transparent',
      message: `${owner ? `${owner}: the` : 'The'} colour ${hex} is partly transparent; marks are printed opaque (mixed onto white) so their ink reads at full strength.`,
    });
  }
  return '#' + rgb.map((c) => toHex2(c * alpha + 255 * (1 - alpha))).join('');
}

/** The colour mixed with white; `whiteShare` 0 keeps it, 1 gives white. */
export function mixWithWhite(hex: string, whiteShare: number): string {
  const digits = hexDigits(hex.toLowerCase());
  return '#' + [0, 2, 4].map((i) => toHex2(parseInt(digits.slice(i, i + 2), 16) * (1 - whiteShare) + 255 * whiteShare)).join('');
}

/** Colour of category `index`: its own, else the document's list, else the palette, cycling. */
export function categoryColor(index: number, own: string | undefined, listed: readonly string[] | undefined): string {
  if (own) return own;
  const list = listed && listed.length > 0 ? listed : PALETTE;
  return list[index % list.length];
}
