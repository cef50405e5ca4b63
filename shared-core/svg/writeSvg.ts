// Serialises a scene as the print SVG described in docs/chart-svg.md: physical page size, SVG 1.1
// with Tallyglyph's attributes declared in the internal DTD subset, the data summary in <metadata>,
// marks as baked filled paths carrying their data, text as outlines. Geometry is built as numbers
// first and only here turned into text, with a fixed number of decimals.
import { TallyError } from '../errors';
import { formatFixed } from '../geometry/formatFixed';
import { regionToPathData, type Region } from '../geometry/region';
import type { Scene, SceneLine, SceneMark, SceneText } from '../scene';
import { FONT_FAMILY_NAMES, mmToPt, textOutline } from '../text';
import { SUMMARY_ID } from './readChartSvg';
import { placementSteps, shapeSteps, stepsToText, translatedPathData, type ShapeSteps } from './translatedPathData';
import { toXmlChars } from './xmlChars';

export interface WriteSvgOptions {
  /**
   * Write each full glyph shape used more than once a single time in <defs> and place it with
   * <use xlink:href x y>. Default false: every piece is written out as its own path.
   */
  useReferences?: boolean;
  /** Decimals for coordinates, 0 to 6. Default 3 (a micrometre, in mm). */
  decimals?: number;
  /** Text as filled outlines from the bundled font (default true); false writes <text> that needs the font installed. */
  outlineText?: boolean;
}

/** Every attribute this writer adds to SVG 1.1, declared so the file validates against the SVG 1.1 DTD. */
export const SVG_DOCTYPE = [
  '<!DOCTYPE svg PUBLIC "-//W3C//DTD SVG 1.1//EN" "http://www.w3.org/Graphics/SVG/1.1/DTD/svg11.dtd" [',
  '<!ATTLIST svg data-safe-margin-mm CDATA #IMPLIED>',
  '<!ATTLIST g data-label CDATA #IMPLIED data-value CDATA #IMPLIED data-reading CDATA #IMPLIED data-role CDATA #IMPLIED ' +
    'data-glyph CDATA #IMPLIED data-unit-value CDATA #IMPLIED data-baseline-y CDATA #IMPLIED data-size-pt CDATA #IMPLIED>',
  '<!ATTLIST path data-part CDATA #IMPLIED data-slot CDATA #IMPLIED>',
  '<!ATTLIST use data-part CDATA #IMPLIED data-slot CDATA #IMPLIED>',
  ']>',
].join('\n');

/** Stack grouping (docs/chart-svg.md): one extra gap of data-group-gap-mm after every data-group-every slots. */
const GROUPING_ATTLIST = '<!ATTLIST g data-group-every CDATA #IMPLIED data-group-gap-mm CDATA #IMPLIED>';

const HEX6 = /^#[0-9a-f]{6}$/i;

/**
 * Anything escapeXmlText would change: characters XML cannot carry (see NOT_XML_CHAR), &, <, > and U+FFFD.
 * Written as the complement of what passes through unchanged, so a lone surrogate (not in any range) matches.
 */
const TEXT_NEEDS_ESCAPE = /[^\t\n\r\u0020-\u0025\u0027-\u003B\u003D\u003F-\uD7FF\uE000-\uFFFC\u{10000}-\u{10FFFF}]/u;
/** Anything escapeXmlAttr would change: the above, plus the quote, tab and line breaks. */
const ATTR_NEEDS_ESCAPE = /[^\u0020\u0021\u0023-\u0025\u0027-\u003B\u003D\u003F-\uD7FF\uE000-\uFFFC\u{10000}-\u{10FFFF}]/u;

/**
 * Markup-safe text. U+FFFD is written as a character reference: the safe reader takes a literal one as
 * the mark of a failed UTF-8 decode and refuses the file.
 */
export function escapeXmlText(s: string): string {
  // Most text (numbers, ids, path data) holds nothing to change: one scan instead of five replacements.
  if (!TEXT_NEEDS_ESCAPE.test(s)) return s;
  return toXmlChars(s).replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/\uFFFD/g, '&#xFFFD;');
}

/** Attribute values keep tabs and line breaks as character references (a parser would turn them into spaces). */
export function escapeXmlAttr(s: string): string {
  if (!ATTR_NEEDS_ESCAPE.test(s)) return s;
  return escapeXmlText(s).replace(/"/g, '&quot;').replace(/\t/g, '&#9;').replace(/\n/g, '&#10;').replace(/\r/g, '&#13;');
}

function checkDecimals(decimals: number): number {
  if (!Number.isInteger(decimals) || decimals < 0 || decimals > 6) {
    throw new TallyError('usage', `SVG decimals must be a whole number from 0 to 6, not ${String(decimals)}.`);
  }
  return decimals;
}

function numberWriter(decimals: number): (n: number, what?: string) => string {
  return (n, what = 'a coordinate') => {
    if (!Number.isFinite(n)) throw new TallyError('number-invalid', `The scene has ${what} that is not a finite number (${String(n)}); nothing was written.`);
    return formatFixed(n, decimals);
  };
}

/** The last colour checked: a mark's pieces all ask for the same one or two. */
let lastColor = { given: '', written: '' };

function color(c: string, what: string): string {
  if (c === lastColor.given) return lastColor.written;
  if (!HEX6.test(c)) throw new TallyError('usage', `${what} has the colour "${c.slice(0, 20)}"; the writer takes opaque #rrggbb colours.`);
  lastColor = { given: c, written: c.toLowerCase() };
  return lastColor.written;
}

/** Exact value as text: the shortest decimal that reads back as the same number. */
function exact(n: number, what: string): string {
  if (!Number.isFinite(n)) throw new TallyError('number-invalid', `The scene has ${what} that is not a finite number (${String(n)}); nothing was written.`);
  return String(n);
}

function attrs(list: Array<[string, string | undefined]>): string {
  let text = '';
  for (const [k, v] of list) if (v !== undefined) text += ` ${k}="${escapeXmlAttr(v)}"`;
  return text;
}

/** Ids of shape keys already seen: every <use> of a shape names the same one, worked out once. */
const shapeIds = new Map<string, string>();

function shapeId(key: string): string {
  let id = shapeIds.get(key);
  if (id === undefined) {
    id = `glyph-${key.replace(/[^A-Za-z0-9_-]+/g, '-')}`;
    // Keys are glyph names and cut fractions, a few per chart; the bound only keeps a long session's map small.
    if (shapeIds.size >= 1024) shapeIds.clear();
    shapeIds.set(key, id);
  }
  return id;
}

export function writeSvg(scene: Scene, opts: WriteSvgOptions = {}): string {
  const decimals = checkDecimals(opts.decimals ?? 3);
  const num = numberWriter(decimals);
  const outline = opts.outlineText ?? true;
  const { page } = scene;
  const b = page.bleedMm;
  if (!(page.widthMm > 0) || !(page.heightMm > 0) || !(b >= 0)) {
    throw new TallyError('number-invalid', `The page must have a positive size and a bleed of 0 or more (got ${page.widthMm} x ${page.heightMm} mm, bleed ${b} mm).`);
  }
  const outerW = page.widthMm + 2 * b;
  const outerH = page.heightMm + 2 * b;

  // Shapes worth a definition: used by at least two full pieces.
  const uses = new Map<string, number>();
  if (opts.useReferences) {
    for (const m of scene.marks) for (const g of m.glyphs) if (g.part === 'full' && g.ref && scene.shapes?.[g.ref.shape]) uses.set(g.ref.shape, (uses.get(g.ref.shape) ?? 0) + 1);
  }
  const defined = new Set([...uses].filter(([, n]) => n >= 2).map(([k]) => k));

  const out: string[] = [];
  out.push('<?xml version="1.0" encoding="UTF-8" standalone="no"?>');
  // The grouping attributes are declared only in files that carry them, so every other file keeps its doctype.
  out.push(scene.grouping ? SVG_DOCTYPE.replace(/\n\]>$/, `\n${GROUPING_ATTLIST}\n]>`) : SVG_DOCTYPE);
  out.push(
    `<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" version="1.1"` +
      attrs([
        ['width', `${num(outerW)}mm`],
        ['height', `${num(outerH)}mm`],
        ['viewBox', `${num(-b)} ${num(-b)} ${num(outerW)} ${num(outerH)}`],
        ['data-safe-margin-mm', num(page.safeMarginMm, 'a safe margin')],
      ]) +
      '>',
  );
  if (scene.summary.title) out.push(`<title>${escapeXmlText(scene.summary.title)}</title>`);
  out.push(`<metadata id="${SUMMARY_ID}">${escapeXmlText(JSON.stringify(scene.summary))}</metadata>`);

  if (defined.size > 0) {
    out.push('<defs>');
    for (const key of defined) out.push(`<path${attrs([['id', shapeId(key)], ['d', regionToPathData(scene.shapes?.[key] as Region, decimals)]])}/>`);
    out.push('</defs>');
  }
  if (scene.background) {
    out.push(`<rect${attrs([['class', 'tg-background'], ['x', num(-b)], ['y', num(-b)], ['width', num(outerW)], ['height', num(outerH)], ['fill', color(scene.background, 'The background')]])}/>`);
  }

  const baseline = scene.summary.baselineYMm;
  const grouping = scene.grouping;
  out.push(
    `<g${attrs([
      ['class', 'tg-marks'],
      ['data-baseline-y', baseline !== undefined ? num(baseline, 'a baseline') : undefined],
      ['data-group-every', grouping ? String(grouping.every) : undefined],
      ['data-group-gap-mm', grouping ? exact(grouping.gapMm, 'a group gap') : undefined],
    ])}>`,
  );
  // Full pieces written out are the shape's written coordinates plus the written offset, so they measure exactly as <use> copies do.
  const steps = new Map<string, ShapeSteps>();
  const placeFull: FullPlacer = (ref) => {
    const shape = scene.shapes?.[ref.shape];
    if (!shape) return null;
    num(ref.xMm);
    num(ref.yMm);
    let s = steps.get(ref.shape);
    if (!s) steps.set(ref.shape, (s = shapeSteps(shape, decimals)));
    const { dx, dy } = placementSteps(s, ref.xMm, ref.yMm);
    return { x: stepsToText(dx, decimals), y: stepsToText(dy, decimals), d: () => translatedPathData(s, dx, dy) };
  };
  // Pushed one by one: a mark of 100,000 pieces is too many arguments for a spread.
  for (const mark of scene.marks) for (const line of writeMark(mark, defined, num, decimals, placeFull)) out.push(line);
  out.push('</g>');

  for (const line of scene.lines) out.push(writeLine(line, num));

  if (scene.legendKeys.length > 0) {
    out.push('<g class="tg-legend">');
    for (const key of scene.legendKeys) {
      const d = regionToPathData(key.region, decimals);
      out.push(
        `<g${attrs([['class', 'tg-legend-key'], ['data-glyph', key.glyph], ['data-unit-value', exact(key.unitValue, 'a legend unit value')]])}>` +
          (d ? `<path${attrs([['fill', color(key.color, 'A legend key')], ['d', d]])}/>` : '') +
          '</g>',
      );
    }
    out.push('</g>');
  }

  const texts = scene.texts.map((t) => writeText(t, num, decimals, outline)).filter((t) => t !== '');
  if (texts.length > 0) {
    out.push('<g class="tg-texts">');
    out.push(...texts);
    out.push('</g>');
  }
  out.push('</svg>');
  return out.join('\n') + '\n';
}

/** Where a full piece of a shared shape is written: the <use> offset, or the moved outline's path data. */
type FullPlacer = (ref: NonNullable<SceneMark['glyphs'][number]['ref']>) => { x: string; y: string; d: () => string } | null;

function writeMark(mark: SceneMark, defined: Set<string>, num: (n: number, what?: string) => string, decimals: number, placeFull: FullPlacer): string[] {
  const lines: string[] = [];
  lines.push(`<g${attrs([['id', mark.id], ['class', 'tg-mark'], ['data-label', mark.label], ['data-value', exact(mark.value, `a value for "${mark.label}"`)], ['data-reading', mark.reading]])}>`);
  for (const piece of mark.glyphs) {
    const fill = piece.part === 'rest' ? color(mark.restColor ?? mark.color, `The rest of "${mark.label}"`) : color(mark.color, `"${mark.label}"`);
    const slot = piece.slot !== undefined ? String(piece.slot) : undefined;
    const placed = piece.part === 'full' && piece.ref ? placeFull(piece.ref) : null;
    if (placed && piece.ref && defined.has(piece.ref.shape)) {
      lines.push(`<use${attrs([['xlink:href', `#${shapeId(piece.ref.shape)}`], ['x', placed.x], ['y', placed.y], ['fill', fill], ['data-part', piece.part], ['data-slot', slot]])}/>`);
      continue;
    }
    const d = placed ? placed.d() : regionToPathData(piece.region, decimals);
    // Written out rather than through attrs: once per piece, the same bytes without a list per piece. Path
    // data is digits, signs, points, spaces and M/L/Z (toFixed's "e+", "NaN" and "Infinity" at worst), none of
    // which XML escapes, so the longest value of the file is not scanned again.
    if (d) lines.push(`<path data-part="${escapeXmlAttr(piece.part)}"${slot === undefined ? '' : ` data-slot="${escapeXmlAttr(slot)}"`} fill="${escapeXmlAttr(fill)}" d="${d}"/>`);
  }
  lines.push('</g>');
  return lines;
}

function writeLine(line: SceneLine, num: (n: number, what?: string) => string): string {
  const d = `M${num(line.x1Mm)} ${num(line.y1Mm)}L${num(line.x2Mm)} ${num(line.y2Mm)}`;
  return (
    `<g${attrs([['class', 'tg-rule'], ['data-role', line.role]])}>` +
    `<path${attrs([['d', d], ['fill', 'none'], ['stroke', color(line.color, 'A rule')], ['stroke-width', num(line.widthMm, 'a line width')]])}/>` +
    '</g>'
  );
}

function writeText(text: SceneText, num: (n: number, what?: string) => string, decimals: number, outline: boolean): string {
  const fill = color(text.color, `The ${text.role} text`);
  const head = `<g${attrs([['class', 'tg-text'], ['data-role', text.role], ['data-size-pt', String(Number(mmToPt(text.sizeMm).toFixed(2)))]])}>`;
  if (!outline) {
    return (
      head +
      `<text${attrs([['x', num(text.xMm)], ['y', num(text.yMm)], ['font-family', FONT_FAMILY_NAMES[text.family ?? 'sans']], ['font-size', num(text.sizeMm, 'a text size')], ['font-weight', String(text.weight)], ['text-anchor', text.anchor], ['fill', fill]])}>` +
      `${escapeXmlText(text.text)}</text></g>`
    );
  }
  const shape = textOutline(text.text, { xMm: text.xMm, yMm: text.yMm, sizeMm: text.sizeMm, weight: text.weight, family: text.family ?? 'sans', anchor: text.anchor, decimals });
  if (!shape.pathData) return '';
  return head + `<path${attrs([['fill', fill], ['d', shape.pathData]])}/></g>`;
}
