// Tallyglyph's colours. Categories take Paul Tol's "muted" qualitative scheme (Paul Tol, "Colour Schemes",
// SRON technical note SRON/EPS/TN/09-002): nine colours chosen to stay distinguishable for readers with
// colour-vision deficiency and in grey print. Hex values checked against Paul Tol's own tol_colors.py
// (2019, BSD-3-Clause), tol_cset('muted'): rose #CC6677, indigo #332288, sand #DDCC77, green #117733,
// cyan #88CCEE, wine #882255, teal #44AA99, olive #999933, purple #AA4499 (pale grey #DDDDDD is its
// colour for missing data, not a category); all nine agree. Ordered so the six that reach 3:1 against
// white paper (the contrast WCAG 2.1 asks of graphical objects) come first.
import { TallyError, type Warning } from '../errors';

/** Category colours in order of use: indigo, rose, green, purple, olive, wine, teal, cyan, sand. */
export const PALETTE: readonly string[] = Object.freeze([
  '#332288',
  '#cc6677',
  '#117733',
  '#aa4499',
  '#999933',
  '#882255',
  '#44aa99',
  '#88ccee',
  '#ddcc77',
]);

export const PALETTE_SOURCE = 'Paul Tol\'s muted scheme';

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

/**
 * Where colour is the only thing that tells categories apart (a shared grid), two categories may never share
 * one: refuses (TallyError 'data-invalid') with the two names, or, for more categories than the palette has
 * colours, with the reason. Elsewhere each category carries its own label, so a repeated colour is allowed but
 * said (warning 'color-repeated').
 */
export function checkDistinctColors(labels: readonly string[], colors: readonly string[], colourIdentifies: boolean, warnings: Warning[]): void {
  const first = new Map<string, number>();
  const clashes: [number, number][] = [];
  colors.forEach((c, i) => {
    const seen = first.get(c);
    if (seen === undefined) first.set(c, i);
    else clashes.push([seen, i]);
  });
  if (clashes.length === 0) return;
  const [a, b] = clashes[0];
  const pair = `"${labels[a]}" and "${labels[b]}" are both ${colors[a]}`;
  if (!colourIdentifies) {
    warnings.push({ code: 'color-repeated', message: `${pair}${clashes.length > 1 ? ` (and ${clashes.length - 1} more pairs)` : ''}; their labels tell them apart, but a reader matching by colour could confuse them.` });
    return;
  }
  if (labels.length > PALETTE.length && first.size <= PALETTE.length) {
    throw new TallyError(
      'data-invalid',
      `A shared grid tells its categories apart by colour alone, and ${labels.length} categories are more than the ${PALETTE.length} colours ` +
        `that stay distinguishable for readers with colour-vision deficiency (${PALETTE_SOURCE}). Merge the smallest into one "Other" category, ` +
        'or draw one row per category.',
    );
  }
  throw new TallyError('data-invalid', `In a shared grid colour alone tells categories apart, but ${pair}. Give each category its own colour.`);
}

/** WCAG 2.1 contrast ratio of two opaque #rrggbb colours: (L1 + 0.05) / (L2 + 0.05) with sRGB relative luminance. */
export function contrastRatio(a: string, b: string): number {
  const lum = (hex: string) => {
    const [r, g, bl] = [0, 2, 4]
      .map((i) => parseInt(hexDigits(hex.toLowerCase()).slice(i, i + 2), 16) / 255)
      .map((c) => (c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4));
    return 0.2126 * r + 0.7152 * g + 0.0722 * bl;
  };
  const [hi, lo] = [lum(a), lum(b)].sort((x, y) => y - x);
  return (hi + 0.05) / (lo + 0.05);
}
