// The supplied drawing's own text, drawn as outlines in the bundled Noto Sans, so the sheet shows it the
// same in its SVG, in its PNG and in every viewer, whatever fonts are installed. Text in a font that is
// not bundled, or in a layout this does not reproduce, is left out and reported, never drawn wrongly.
import type { XmlElement } from '../svg/parseXml';
import { escapeXmlText } from '../svg/writeSvg';
import { layoutLine } from '../text/layoutLine';
import { loadFontFace, type FontWeight } from '../text/loadFont';
import { placeLine } from '../text/textOutline';
import type { TextAnchor } from '../text/textOptions';
import { shortenText } from './shortenText';

/** Text style inherited down the tree (CSS inheritance of the font properties and text-anchor). */
export interface InheritedTextStyle {
  /** The font-family list as written, or null where none was given. */
  family: string | null;
  sizeUnits: number;
  weight: FontWeight;
  anchor: TextAnchor;
  hidden: boolean;
}

/** CSS 2.1 §15.7: the initial font-size is "medium", 16 px in every mainstream browser (common practice, no source). */
export const INITIAL_TEXT_STYLE: InheritedTextStyle = { family: null, sizeUnits: 16, weight: 400, anchor: 'start', hidden: false };

/** Family names drawn with the bundled Noto Sans: itself, and the generic families it stands in for. */
const BUNDLED_SANS = new Set(['noto sans', 'sans-serif', 'system-ui', 'ui-sans-serif']);

export interface TextNotShown {
  /** The text, shortened for a note. */
  text: string;
  /** The font-family as written, or "(none)". */
  font: string;
  reason: string;
}

/**
 * Most characters of supplied text one copy draws as outlines: far more than any chart's labels, few
 * enough that a file of nothing but text cannot make the sheet huge or slow (common practice, no source).
 */
export const MAX_OUTLINED_CHARACTERS = 20_000;

/** What is left of MAX_OUTLINED_CHARACTERS for one copy of a drawing. */
export interface OutlineBudget {
  characters: number;
}

export type OutlinedText = { kind: 'outlined'; markup: string } | { kind: 'not-shown'; notShown: TextNotShown } | { kind: 'hidden' };

const CSS_PX_PER: Record<string, number> = { px: 1, '': 1, pt: 96 / 72, pc: 16, in: 96, cm: 96 / 2.54, mm: 96 / 25.4 };
/** CSS Fonts 3 §3.5, absolute-size keywords as scaling factors of medium (3/5, 3/4, 8/9, 1, 6/5, 3/2, 2). */
const SIZE_KEYWORDS: Record<string, number> = { 'xx-small': 0.6, 'x-small': 0.75, small: 8 / 9, medium: 1, large: 1.2, 'x-large': 1.5, 'xx-large': 2 };

/** Presentation attributes overlaid with the `style` attribute (which wins, per CSS cascade). */
function styleOf(el: XmlElement): Record<string, string> {
  const out: Record<string, string> = { ...el.attrs };
  for (const decl of (el.attrs.style ?? '').split(';')) {
    const i = decl.indexOf(':');
    if (i > 0) out[decl.slice(0, i).trim().toLowerCase()] = decl.slice(i + 1).replace(/!important/i, '').trim();
  }
  return out;
}

function fontSize(value: string | undefined, inherited: number): number {
  if (value === undefined) return inherited;
  const v = value.trim().toLowerCase();
  if (v in SIZE_KEYWORDS) return 16 * SIZE_KEYWORDS[v];
  const m = /^([+-]?(?:\d+\.?\d*|\.\d+)(?:e[+-]?\d+)?)(px|pt|pc|in|cm|mm|em|%)?$/.exec(v);
  if (!m) return inherited;
  const n = Number(m[1]);
  const unit = m[2] ?? '';
  const size = unit === 'em' ? n * inherited : unit === '%' ? (n / 100) * inherited : n * CSS_PX_PER[unit];
  return Number.isFinite(size) && size > 0 ? size : inherited;
}

function fontWeight(value: string | undefined, inherited: FontWeight): FontWeight {
  if (value === undefined) return inherited;
  const v = value.trim().toLowerCase();
  if (v === 'bold' || v === 'bolder') return 700;
  if (v === 'normal' || v === 'lighter') return 400;
  const n = Number(v);
  // Only 400 and 700 are bundled: CSS Fonts 3 §5.2 matching takes the nearer face for weights between.
  return Number.isFinite(n) && n > 0 ? (n >= 600 ? 700 : 400) : inherited;
}

/** The style an element passes to its children. */
export function inheritTextStyle(parent: InheritedTextStyle, el: XmlElement): InheritedTextStyle {
  const s = styleOf(el);
  const anchor = s['text-anchor']?.trim();
  return {
    family: s['font-family'] !== undefined && s['font-family'].trim() !== 'inherit' ? s['font-family'].trim() : parent.family,
    sizeUnits: fontSize(s['font-size'], parent.sizeUnits),
    weight: fontWeight(s['font-weight'], parent.weight),
    anchor: anchor === 'middle' || anchor === 'end' || anchor === 'start' ? anchor : parent.anchor,
    hidden: parent.hidden || s.display?.trim() === 'none',
  };
}

/** The first family of the list that is bundled; null when the list names none (CSS Fonts 3 §5.1 fallback order). */
function bundledFamily(family: string | null): 'sans' | null {
  // No family at all: the viewer's default face, for which the bundled sans stands in.
  if (family === null) return 'sans';
  for (const name of family.split(',')) {
    if (BUNDLED_SANS.has(name.trim().replace(/^["']|["']$/g, '').trim().toLowerCase())) return 'sans';
  }
  return null;
}

/** A length list attribute (x, y, dx, dy) read as plain user units; null when it holds anything else. */
function lengths(value: string | undefined): number[] | null {
  if (value === undefined || value.trim() === '') return [];
  const out: number[] = [];
  for (const part of value.trim().split(/[\s,]+/)) {
    const m = /^([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)(px)?$/.exec(part);
    if (!m || !Number.isFinite(Number(m[1]))) return null;
    out.push(Number(m[1]));
  }
  return out;
}

interface Run {
  text: string;
  /** Cleaned attributes of a <tspan> (its own fill, say), for a group around its outlines; '' for the <text>. */
  attributes: string;
  style: InheritedTextStyle;
  x?: number;
  y?: number;
  dx: number;
  dy: number;
}

/** XML's default space handling for SVG text (SVG 1.1 §10.15): newlines go, tabs become spaces, runs of spaces collapse. */
function collapse(text: string): string {
  return text.replace(/[\r\n]/g, '').replace(/\t/g, ' ').replace(/ {2,}/g, ' ');
}

function plainText(el: XmlElement): string {
  return el.text + el.children.map(plainText).join('');
}

/**
 * The runs of a <text>, in order: its own characters, then each <tspan> (the parsed tree keeps an
 * element's own characters apart from its children; characters before the children is the usual order).
 * Returns a reason instead where the layout is one this does not reproduce.
 */
function runsOf(el: XmlElement, style: InheritedTextStyle, attributesOf: (el: XmlElement) => string, out: Run[]): string | null {
  const s = styleOf(el);
  if (el.name === 'textPath') return 'it follows a path';
  if (el.name !== 'text' && el.name !== 'tspan' && el.name !== 'a') return null;
  if (s.rotate !== undefined || s.textLength !== undefined) return 'its letters are rotated or stretched one by one';
  if (/^(tb|vertical)/.test(s['writing-mode']?.trim() ?? '')) return 'it is set vertically';
  const xs = lengths(s.x), ys = lengths(s.y), dxs = lengths(s.dx), dys = lengths(s.dy);
  if (!xs || !ys || !dxs || !dys) return 'its position is given in units other than user units';
  if (xs.length > 1 || ys.length > 1 || dxs.length > 1 || dys.length > 1) return 'each letter has its own position';
  const own = collapse(el.text);
  const first: Run = { text: own, attributes: el.name === 'text' ? '' : attributesOf(el), style, dx: dxs[0] ?? 0, dy: dys[0] ?? 0, ...(xs.length ? { x: xs[0] } : {}), ...(ys.length ? { y: ys[0] } : {}) };
  out.push(first);
  for (const child of el.children) {
    if (child.name === 'title' || child.name === 'desc') continue;
    const childStyle = inheritTextStyle(style, child);
    if (childStyle.hidden) continue;
    const reason = runsOf(child, childStyle, attributesOf, out);
    if (reason) return reason;
  }
  return null;
}

/** Decimals that keep outline points to about 1/10,000 of the font size (at least 2, at most 6). */
function decimalsFor(sizeUnits: number): number {
  return Math.min(6, Math.max(2, 4 - Math.floor(Math.log10(sizeUnits))));
}

/**
 * One <text> element (with `style` already inherited from its ancestors and itself) as a group of
 * outline paths in the element's own user units, or the reason it cannot be shown. `attributesOf` gives an
 * element's cleaned attributes for the group that replaces it (fill, stroke, transform, opacity still apply).
 */
export function outlineSuppliedText(el: XmlElement, style: InheritedTextStyle, attributesOf: (el: XmlElement) => string, budget: OutlineBudget): OutlinedText {
  if (style.hidden) return { kind: 'hidden' };
  const fullText = collapse(plainText(el)).trim();
  if (fullText === '') return { kind: 'hidden' };
  const notShown = (reason: string): OutlinedText => ({
    kind: 'not-shown',
    notShown: { text: shortenText(fullText, 40).text, font: style.family ?? '(none)', reason },
  });
  const characters = [...fullText].length;
  if (characters > budget.characters) return notShown(`the drawing holds more text than the sheet draws (${MAX_OUTLINED_CHARACTERS.toLocaleString('en')} characters)`);
  budget.characters -= characters;
  const runs: Run[] = [];
  const layoutProblem = runsOf(el, style, attributesOf, runs);
  if (layoutProblem) return notShown(layoutProblem);
  for (const run of runs) {
    if (run.text.trim() !== '' && bundledFamily(run.style.family) === null) {
      return { kind: 'not-shown', notShown: { text: shortenText(fullText, 40).text, font: run.style.family ?? '(none)', reason: 'that font is not bundled' } };
    }
  }
  // Leading space of the whole text and trailing space of its last run are not drawn (SVG 1.1 §10.15).
  const firstShown = runs.findIndex((r) => r.text !== '');
  const lastShown = runs.length - 1 - [...runs].reverse().findIndex((r) => r.text !== '');
  if (firstShown >= 0) runs[firstShown].text = runs[firstShown].text.replace(/^ +/, '');
  if (lastShown < runs.length) runs[lastShown].text = runs[lastShown].text.replace(/ +$/, '');

  // Text chunks start at each absolute x or y (SVG 1.1 §10.4); text-anchor moves a whole chunk.
  const chunks: Array<{ anchor: TextAnchor; advance: number; paths: string[] }> = [];
  let penX = 0, penY = 0;
  for (const [i, run] of runs.entries()) {
    if (i === 0 || run.x !== undefined || run.y !== undefined) chunks.push({ anchor: run.style.anchor, advance: 0, paths: [] });
    penX = (run.x ?? penX) + run.dx;
    penY = (run.y ?? penY) + run.dy;
    if (run.text === '') continue;
    const face = loadFontFace(run.style.weight);
    const line = layoutLine(face, run.text);
    if (line.warnings.some((w) => w.code === 'text-glyph-missing')) return notShown('the bundled font has no letter for some of its characters');
    const sizeUnits = run.style.sizeUnits;
    const placed = placeLine(face, line, { sizeMm: sizeUnits, weight: run.style.weight, family: 'sans', xMm: penX, yMm: penY, anchor: 'start', decimals: decimalsFor(sizeUnits) }, penY);
    const chunk = chunks[chunks.length - 1];
    if (placed.pathData) chunk.paths.push(run.attributes ? `<g${run.attributes}><path d="${placed.pathData}"/></g>` : `<path d="${placed.pathData}"/>`);
    chunk.advance += placed.advanceMm;
    penX += placed.advanceMm;
  }
  const body = chunks
    .filter((c) => c.paths.length > 0)
    .map((c) => {
      const shift = c.anchor === 'middle' ? -c.advance / 2 : c.anchor === 'end' ? -c.advance : 0;
      const paths = c.paths.join('');
      return shift === 0 ? paths : `<g transform="translate(${shift} 0)">${paths}</g>`;
    })
    .join('');
  // The words stay in the file as the group's title, for search and for screen readers.
  return { kind: 'outlined', markup: `<g${attributesOf(el)}><title>${escapeXmlText(fullText)}</title>${body}</g>` };
}

/** One note for all the text the sheet could not show, naming each font and text (the first few). */
export function textNotShownNote(items: readonly TextNotShown[]): string | null {
  if (items.length === 0) return null;
  const listed = items.slice(0, 4).map((t) => `"${t.text}" in ${t.font === '(none)' ? 'no named font' : `"${shortenText(t.font, 40).text}"`} (${t.reason})`);
  const more = items.length > 4 ? `, and ${items.length - 4} more` : '';
  return (
    `The sheet leaves out ${items.length === 1 ? 'one text' : `${items.length} texts`} of the supplied drawing it cannot show as drawn: ${listed.join('; ')}${more}. ` +
    'Only Noto Sans and the generic sans-serif are bundled; check these words against the supplied file.'
  );
}
