// Reads the structure of a chart SVG that Tallyglyph wrote (docs/chart-svg.md): page, summary, marks and
// their pieces, legend keys, text and rules. It trusts nothing it cannot see in the file and measures no
// ink; integrity/verifySvg measures the geometry this finds.
import { TallyError, type Warning } from '../errors';
import type { ChartSummary, Reading } from '../scene/types';
import { parseXml, type XmlElement, type XmlLimits } from './parseXml';

export type PiecePart = 'full' | 'partial' | 'filled' | 'rest';

export interface ChartSvgPiece {
  element: XmlElement;
  part: PiecePart;
  /** Stack slot from the baseline (data-slot), or null when the piece has none. */
  slot: number | null;
}

export interface ChartSvgMark {
  id: string;
  label: string;
  value: number;
  reading: Reading;
  element: XmlElement;
  pieces: ChartSvgPiece[];
}

export interface ChartSvgLegendKey {
  element: XmlElement;
  glyph: string | null;
  unitValue: number | null;
}

export interface ChartSvgText {
  element: XmlElement;
  role: string;
  /** Declared size (data-size-pt), when the writer recorded one. */
  sizePt: number | null;
}

export interface ChartSvgPage {
  /** The trim size: the page without its bleed. */
  widthMm: number;
  heightMm: number;
  bleedMm: number;
  /** Millimetres per user unit (1 in files Tallyglyph writes). */
  mmPerUnit: number;
  /** The viewBox in user units. */
  viewBox: { x: number; y: number; width: number; height: number };
}

export interface ChartSvgFile {
  root: XmlElement;
  page: ChartSvgPage;
  /** The embedded summary, or null when it is missing or unreadable (see warnings). */
  summary: ChartSummary | null;
  marks: ChartSvgMark[];
  /** The common reading of every mark. */
  reading: Reading;
  legendKeys: ChartSvgLegendKey[];
  texts: ChartSvgText[];
  rules: XmlElement[];
  /** Elements marked as background (class tg-background). */
  backgrounds: XmlElement[];
  /** data-baseline-y of the marks' parent, in user units; null when absent. */
  baselineY: number | null;
  /** data-group-every and data-group-gap-mm of the marks' parent: stack slots grouped with one extra gap; null when absent. */
  grouping: { every: number; gapMm: number } | null;
  warnings: Warning[];
}

export const SUMMARY_ID = 'tallyglyph-summary';
const READINGS: readonly Reading[] = ['count', 'length', 'area', 'fill'];
const PARTS: readonly PiecePart[] = ['full', 'partial', 'filled', 'rest'];
/** Containers whose content is not drawn where it stands (a `use` draws it elsewhere). */
const NOT_DRAWN = new Set(['defs', 'symbol', 'clipPath', 'mask', 'pattern', 'marker', 'metadata']);

/** CSS absolute units (CSS Values and Units §6.2): 1in = 25.4mm = 96px = 72pt = 6pc. */
const MM_PER: Record<string, number> = { mm: 1, cm: 10, in: 25.4, pt: 25.4 / 72, pc: 25.4 / 6, px: 25.4 / 96, '': 25.4 / 96 };

export function classesOf(el: XmlElement): string[] {
  return (el.attrs.class ?? '').split(/\s+/).filter(Boolean);
}

function hasClass(el: XmlElement, name: string): boolean {
  return classesOf(el).includes(name);
}

function lengthMm(value: string | undefined, what: string): number {
  const m = /^\s*([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)(mm|cm|in|pt|pc|px)?\s*$/.exec(value ?? '');
  if (!m) {
    throw new TallyError('svg-malformed', `The root <svg> ${what} "${(value ?? '').slice(0, 30)}" is not a physical length; a Tallyglyph chart gives its size in mm.`);
  }
  const n = Number(m[1]) * MM_PER[m[2] ?? ''];
  if (!(n > 0) || !Number.isFinite(n)) throw new TallyError('svg-malformed', `The root <svg> ${what} must be a positive length, not "${value}".`);
  return n;
}

function readPage(root: XmlElement): ChartSvgPage {
  const outerW = lengthMm(root.attrs.width, 'width');
  const outerH = lengthMm(root.attrs.height, 'height');
  const parts = (root.attrs.viewBox ?? '').trim().split(/[\s,]+/).map(Number);
  if (parts.length !== 4 || parts.some((n) => !Number.isFinite(n)) || !(parts[2] > 0) || !(parts[3] > 0)) {
    throw new TallyError('svg-malformed', 'The root <svg> has no usable viewBox, so its user units cannot be tied to millimetres.');
  }
  const [x, y, width, height] = parts;
  const mmPerUnit = outerW / width;
  // One scale for both axes, or shapes would be measured on a stretched page.
  if (Math.abs((outerH / height) / mmPerUnit - 1) > 1e-6) {
    throw new TallyError('svg-malformed', `The page is ${outerW} x ${outerH} mm but its viewBox is ${width} x ${height}: the two axes are scaled differently.`);
  }
  // The writer puts the trim corner at user (0, 0), so the bleed is whatever lies before it.
  const bleedUnits = Math.max(0, -x);
  if (Math.abs(x - y) > 1e-9 * Math.max(1, Math.abs(x))) {
    throw new TallyError('svg-malformed', `The viewBox starts at (${x}, ${y}); a Tallyglyph chart has the same bleed on every side.`);
  }
  const bleedMm = bleedUnits * mmPerUnit;
  const widthMm = outerW - 2 * bleedMm;
  const heightMm = outerH - 2 * bleedMm;
  if (!(widthMm > 0) || !(heightMm > 0)) throw new TallyError('svg-malformed', 'The bleed leaves no page inside it.');
  return { widthMm, heightMm, bleedMm, mmPerUnit, viewBox: { x, y, width, height } };
}

function readSummary(root: XmlElement, warnings: Warning[]): ChartSummary | null {
  const meta = findFirst(root, (el) => el.name === 'metadata' && el.attrs.id === SUMMARY_ID);
  if (!meta) {
    warnings.push({ code: 'summary-missing', message: 'The file has no machine-readable summary (<metadata id="tallyglyph-summary">); only its marks are checked.' });
    return null;
  }
  let parsed: unknown;
  try {
    parsed = JSON.parse(meta.text);
  } catch {
    warnings.push({ code: 'summary-unreadable', message: 'The file\'s summary is not valid JSON; only its marks are checked.' });
    return null;
  }
  const s = parsed as Partial<ChartSummary> | null;
  if (!s || typeof s !== 'object' || s.format !== 'tallyglyph.summary/1') {
    warnings.push({ code: 'summary-version', message: `The file's summary has an unknown format (${JSON.stringify((s as { format?: unknown } | null)?.format ?? null)}); only its marks are checked.` });
    return null;
  }
  return s as ChartSummary;
}

function findFirst(el: XmlElement, test: (el: XmlElement) => boolean): XmlElement | null {
  if (test(el)) return el;
  for (const c of el.children) {
    const hit = findFirst(c, test);
    if (hit) return hit;
  }
  return null;
}

function numberAttr(el: XmlElement, name: string): number | null {
  const raw = el.attrs[name];
  if (raw === undefined || raw.trim() === '') return null;
  const n = Number(raw);
  return Number.isFinite(n) ? n : NaN;
}

function markName(el: XmlElement): string {
  return el.attrs.id ? `Mark "${el.attrs.id}"` : 'A mark';
}

function readMark(el: XmlElement): ChartSvgMark {
  const id = el.attrs.id;
  if (!id) throw new TallyError('document-invalid', 'A mark (class "tg-mark") has no id, so it cannot be reported or checked by pixels.');
  const label = el.attrs['data-label'];
  if (label === undefined) throw new TallyError('document-invalid', `${markName(el)} has no data-label.`);
  const value = numberAttr(el, 'data-value');
  if (value === null || Number.isNaN(value)) {
    throw new TallyError('document-invalid', `${markName(el)} ("${label}") has no readable data-value ("${el.attrs['data-value'] ?? ''}"); every mark carries its value.`);
  }
  if (value < 0) {
    throw new TallyError('data-invalid', `${markName(el)} ("${label}") carries the negative value ${value}; no count, area or length of ink can show a negative amount.`);
  }
  const reading = el.attrs['data-reading'] as Reading;
  if (!READINGS.includes(reading)) {
    throw new TallyError('document-invalid', `${markName(el)} ("${label}") has data-reading "${el.attrs['data-reading'] ?? ''}"; expected one of ${READINGS.join(', ')}.`);
  }
  const pieces: ChartSvgPiece[] = [];
  const visit = (child: XmlElement) => {
    if (hasClass(child, 'tg-mark')) throw new TallyError('document-invalid', `${markName(child)} sits inside mark "${id}"; marks cannot nest.`);
    const part = child.attrs['data-part'];
    if (part !== undefined) {
      if (!PARTS.includes(part as PiecePart)) {
        throw new TallyError('document-invalid', `A piece of mark "${id}" has data-part "${part}"; expected one of ${PARTS.join(', ')}.`);
      }
      const slot = numberAttr(child, 'data-slot');
      if (slot !== null && !(Number.isInteger(slot) && slot >= 0)) {
        throw new TallyError('document-invalid', `A piece of mark "${id}" has data-slot "${child.attrs['data-slot']}"; a slot is a whole number from 0.`);
      }
      pieces.push({ element: child, part: part as PiecePart, slot });
      return;
    }
    for (const c of child.children) visit(c);
  };
  for (const c of el.children) visit(c);
  return { id, label, value, reading, element: el, pieces };
}

/**
 * Reads a written chart's structure. Throws TallyError 'svg-malformed' for unreadable XML or page size,
 * 'document-invalid' when the file is not a Tallyglyph chart (no marks) or a mark lacks its data.
 */
export function readChartSvg(svgText: string, limits: Partial<XmlLimits> = {}): ChartSvgFile {
  const root = parseXml(svgText, limits);
  if (root.name !== 'svg') throw new TallyError('svg-malformed', `The file's root element is <${root.qname}>, not <svg>.`);
  const warnings: Warning[] = [];
  const marks: ChartSvgMark[] = [];
  const legendKeys: ChartSvgLegendKey[] = [];
  const texts: ChartSvgText[] = [];
  const rules: XmlElement[] = [];
  const backgrounds: XmlElement[] = [];
  let baselineY: number | null = null;
  let grouping: { every: number; gapMm: number } | null = null;

  const walk = (el: XmlElement) => {
    if (NOT_DRAWN.has(el.name)) return;
    if (hasClass(el, 'tg-mark')) {
      marks.push(readMark(el));
      return;
    }
    if (hasClass(el, 'tg-marks')) {
      const y = numberAttr(el, 'data-baseline-y');
      if (y !== null && Number.isFinite(y)) baselineY = y;
      const every = numberAttr(el, 'data-group-every');
      const gapMm = numberAttr(el, 'data-group-gap-mm');
      // Read as written; verification decides whether the values are allowed.
      if (every !== null && gapMm !== null) grouping = { every, gapMm };
    }
    if (hasClass(el, 'tg-legend-key')) {
      const unitValue = numberAttr(el, 'data-unit-value');
      legendKeys.push({ element: el, glyph: el.attrs['data-glyph'] ?? null, unitValue: unitValue !== null && Number.isFinite(unitValue) && unitValue > 0 ? unitValue : null });
      return;
    }
    if (hasClass(el, 'tg-text')) {
      const size = numberAttr(el, 'data-size-pt');
      texts.push({ element: el, role: el.attrs['data-role'] ?? 'text', sizePt: size !== null && size > 0 ? size : null });
      return;
    }
    if (hasClass(el, 'tg-rule')) {
      rules.push(el);
      return;
    }
    if (hasClass(el, 'tg-background')) {
      backgrounds.push(el);
      return;
    }
    for (const c of el.children) walk(c);
  };
  walk(root);

  if (marks.length === 0) {
    throw new TallyError(
      'document-invalid',
      'This SVG is not a Tallyglyph chart: it has no data marks (groups with class "tg-mark"). To measure a graphic made elsewhere, use audit.',
    );
  }
  const page = readPage(root);
  const ids = new Set<string>();
  for (const m of marks) {
    if (ids.has(m.id)) throw new TallyError('document-invalid', `Two marks share the id "${m.id}".`);
    ids.add(m.id);
  }
  const reading = marks[0].reading;
  const other = marks.find((m) => m.reading !== reading);
  if (other) {
    throw new TallyError('document-invalid', `Mark "${marks[0].id}" is read by ${reading} but mark "${other.id}" by ${other.reading}; one chart is read one way.`);
  }
  const summary = readSummary(root, warnings);
  return { root, page, summary, marks, reading, legendKeys, texts, rules, backgrounds, baselineY, grouping, warnings };
}
