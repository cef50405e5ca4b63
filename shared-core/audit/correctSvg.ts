// Rescales each mark of a supplied SVG about an anchor so that one reading becomes honest, keeping the
// mark with the largest value at its size. Each mark's elements are wrapped in a <g transform> at
// the string level, so every other byte of the file stays as it was; the result is audited again.
import { TallyError, type Warning } from '../errors';
import type { Box } from '../geometry/region';
import { IDENTITY, multiply, parseTransform, translation, type Matrix } from '../geometry/matrix';
import type { XmlElement } from '../svg/parseXml';
import { auditSvgDetailed, type AuditReport, type AuditSvgOptions } from './auditReport';
import { elementSpans } from './elementSpans';
import { MARK_ATTRIBUTE, type SvgMark } from './findSvgMarks';
import { formatFactor } from './formatNumbers';
import { removalNote, stripOutsideReferences } from './outsideReferences';
import type { ReadingName } from './types';

export type Anchor = 'bottom-centre' | 'centre' | 'top-centre' | 'bottom-left' | 'bottom-right' | 'top-left' | 'top-right' | 'centre-left' | 'centre-right';

export const ANCHORS: readonly Anchor[] = ['bottom-centre', 'centre', 'top-centre', 'bottom-left', 'bottom-right', 'top-left', 'top-right', 'centre-left', 'centre-right'];

export interface CorrectOptions extends Omit<AuditSvgOptions, 'givenLengths'> {
  /** The reading to make honest; default: the one the geometry suggests. */
  reading?: Exclude<ReadingName, 'count'>;
  /** Fixed point of each mark's rescaling; default bottom-centre (marks stay on their baseline). */
  anchor?: Anchor;
}

export interface MarkCorrection {
  mark: string;
  value: number;
  /** Scale along x and y in root units (1 for the kept mark). */
  scaleX: number;
  scaleY: number;
  anchorXUnits: number;
  anchorYUnits: number;
}

export interface CorrectionResult {
  svg: string;
  reading: Exclude<ReadingName, 'count'>;
  anchor: Anchor;
  /** The mark with the largest value, left at its size. */
  keptMark: string;
  corrections: MarkCorrection[];
  before: AuditReport;
  /** The corrected file audited again with the same values. */
  after: AuditReport;
  /** Layout problems the rescaling caused: marks now past the page edge or overlapping. */
  warnings: Warning[];
}

export function parseAnchor(text: string): Anchor {
  const t = text.trim().toLowerCase().replace(/center/g, 'centre').replace(/middle/g, 'centre');
  const norm = t === 'bottom' ? 'bottom-centre' : t === 'top' ? 'top-centre' : t === 'left' ? 'centre-left' : t === 'right' ? 'centre-right' : t;
  if ((ANCHORS as readonly string[]).includes(norm)) return norm as Anchor;
  throw new TallyError('usage', `Unknown anchor "${text.slice(0, 30)}"; use one of ${ANCHORS.join(', ')}.`);
}

function anchorPoint(m: SvgMark, anchor: Anchor): { x: number; y: number } {
  const b = m.box;
  const [v, h] = anchor === 'centre' ? ['centre', 'centre'] : anchor.split('-');
  const x = h === 'left' ? b.x : h === 'right' ? b.x + b.width : b.x + b.width / 2;
  const y = v === 'top' ? b.y : v === 'bottom' ? b.y + b.height : b.y + b.height / 2;
  return { x, y };
}

function invert(m: Matrix): Matrix {
  const [a, b, c, d, e, f] = m;
  const det = a * d - b * c;
  if (!(Math.abs(det) > 1e-300)) throw new TallyError('svg-malformed', 'A mark sits inside a transform that flattens it to nothing, so it cannot be rescaled.');
  return [d / det, -b / det, -c / det, a / det, (c * f - d * e) / det, (b * e - a * f) / det];
}

function transformAttr(el: XmlElement): string | undefined {
  const st = el.attrs.style;
  if (st) {
    for (const decl of st.split(';')) {
      const i = decl.indexOf(':');
      if (i > 0 && decl.slice(0, i).trim().toLowerCase() === 'transform') return decl.slice(i + 1).trim();
    }
  }
  return el.attrs.transform;
}

/** The map from an element's parent's user space to root units, following the rendering chain. */
function parentCtm(chain: readonly XmlElement[], upTo: number): Matrix {
  let m: Matrix = IDENTITY;
  for (let i = 0; i < upTo; i++) {
    const el = chain[i];
    m = multiply(m, parseTransform(transformAttr(el)));
    if (el.name === 'svg' && i > 0) m = multiply(m, translation(Number(el.attrs.x ?? 0) || 0, Number(el.attrs.y ?? 0) || 0));
  }
  return m;
}

function num(n: number): string {
  if (Math.abs(n) < 1e-12) return '0';
  const s = n.toPrecision(12);
  return String(Number(s));
}

export function correctSvg(text: string, opts: CorrectOptions = {}): CorrectionResult {
  const source = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const { report: before, marks, imported } = auditSvgDetailed(source, opts);
  const owners = marks.flatMap((m) => m.elements);
  if (new Set(owners).size < owners.length) {
    // Rows split out of one path share that path: rescaling one row would rescale them all.
    throw new TallyError('usage', 'Several marks are pieces of one path (a unit chart merged into a single shape), so they cannot be rescaled one by one. Redraw the data as a unit chart instead (correct --rebuild repeat, or Redraw in the app).');
  }
  const asked: ReadingName = opts.reading ?? before.suggested;
  if (asked === 'count') {
    throw new TallyError('usage', 'These marks are read by counting pictures; rescaling cannot fix a count. Redraw them with one picture per fixed amount.');
  }
  if (!['area', 'length', 'volume'].includes(asked)) throw new TallyError('usage', `Unknown reading "${String(asked)}"; use area, length or volume.`);
  const reading = asked;
  const anchor = opts.anchor ?? 'bottom-centre';
  const values = before.marks.map((m) => m.value);
  const bad = before.marks.find((m) => !(m.value > 0));
  if (bad) {
    throw new TallyError('data-invalid', `Mark ${bad.id} has the value ${bad.value}; only positive values can be shown by a mark's size. A zero should be drawn as nothing: remove that mark and correct the rest.`);
  }
  const r = before.readings[reading];
  const measured = r.measured as number[];
  const empty = before.marks.find((_, i) => !(measured[i] > 0));
  if (empty) throw new TallyError('glyph-empty', `Mark ${empty.id} measures nothing under the ${reading} reading, so it cannot be rescaled.`);
  const dimension = before.readings.length.dimension;
  let keep = 0;
  values.forEach((v, i) => {
    if (v > values[keep]) keep = i;
  });

  const wanted = new Set<number>();
  const plans: { mark: SvgMark; correction: MarkCorrection; rootMatrix: Matrix }[] = [];
  marks.forEach((m, i) => {
    const target = (measured[keep] * values[i]) / values[keep];
    const f = target / measured[i];
    let sx = 1, sy = 1;
    if (reading === 'area') sx = sy = Math.sqrt(f);
    else if (reading === 'volume') sx = sy = Math.cbrt(f);
    else if (dimension === 'width') sx = f;
    else sy = f;
    if (i === keep) sx = sy = 1;
    const a = anchorPoint(m, anchor);
    const rootMatrix: Matrix = [sx, 0, 0, sy, a.x - sx * a.x, a.y - sy * a.y];
    plans.push({ mark: m, correction: { mark: m.id, value: values[i], scaleX: sx, scaleY: sy, anchorXUnits: a.x, anchorYUnits: a.y }, rootMatrix });
  });

  const imports = new Map<XmlElement, { index: number; matrix: Matrix; id: string }>();
  for (const plan of plans) {
    for (const el of plan.mark.elements) {
      const shape = plan.mark.shapes.find((s) => s.chain.includes(el));
      if (!shape) continue;
      const at = shape.chain.indexOf(el);
      const path = shape.chain.slice(0, at);
      if (path.some((p) => p.name === 'use')) {
        throw new TallyError('usage', `Mark ${plan.mark.id} is drawn through a <use> reference, so rescaling it would change every copy; correct the referenced drawing instead.`);
      }
      // Document order from the same parse that found the marks locates the element in the text.
      const index = imported.order.get(el);
      if (index === undefined) throw new TallyError('usage', `Mark ${plan.mark.id} is drawn from a referenced symbol, so it cannot be rescaled in place.`);
      const p = parentCtm(shape.chain, at);
      imports.set(el, { index, matrix: multiply(multiply(invert(p), plan.rootMatrix), p), id: plan.mark.id });
      wanted.add(index);
    }
  }
  const spans = elementSpans(source, wanted);
  const edits = [...imports.entries()]
    .map(([el, w]) => ({ el, w, span: spans.get(w.index) as { start: number; end: number } }))
    .sort((a, b) => a.span.start - b.span.start);
  const parts: string[] = [];
  let at = 0;
  for (const e of edits) {
    const colon = e.el.qname.indexOf(':');
    const g = colon > 0 ? `${e.el.qname.slice(0, colon)}:g` : 'g';
    const m = e.w.matrix;
    const identity = m.every((v, k) => Math.abs(v - IDENTITY[k]) < 1e-12);
    const transform = identity ? '' : ` transform="matrix(${m.map(num).join(' ')})"`;
    parts.push(source.slice(at, e.span.start), `<${g} ${MARK_ATTRIBUTE}="${escapeAttr(e.w.id)}"${transform}>`, source.slice(e.span.start, e.span.end), `</${g}>`);
    at = e.span.end;
  }
  parts.push(source.slice(at));
  // The corrected file goes to a client: nothing in it may fetch or run anything (checked again inside).
  const stripped = stripOutsideReferences(parts.join(''));
  const svg = stripped.svg;

  const named: Record<string, number> = {};
  before.marks.forEach((m) => (named[m.id] = m.value));
  const { report: after } = auditSvgDetailed(svg, { ...opts, values: { kind: 'named', values: named }, markIds: undefined });
  const check = after.readings[reading];
  if (after.marks.length !== before.marks.length || check.pass !== true) {
    throw new TallyError('gate-refused', `The corrected file did not pass its own check under the ${reading} reading (worst lie factor ${formatFactor(check.lieFactor.worst)}); it was not written.`);
  }
  const warnings = layoutWarnings(before, after);
  const note = removalNote(stripped.removed, 'The corrected file');
  if (note) warnings.push(note);
  return { svg, reading, anchor, keptMark: before.marks[keep].id, corrections: plans.map((p) => p.correction), before, after, warnings };
}

function escapeAttr(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/"/g, '&quot;').replace(/</g, '&lt;');
}

function overlaps(a: Box, b: Box): boolean {
  return a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;
}

const boxOfMark = (m: AuditReport['marks'][number]): Box => ({ x: m.xUnits, y: m.yUnits, width: m.widthUnits, height: m.heightUnits });

/** What the rescaling did to the layout, for the designer to fix by hand (labels are never moved). */
function layoutWarnings(before: AuditReport, after: AuditReport): Warning[] {
  const out: Warning[] = [];
  const wasOutside = new Set(before.warnings.filter((w) => w.code === 'mark-outside-page').map((w) => w.message));
  for (const w of after.warnings) if (w.code === 'mark-outside-page' && !wasOutside.has(w.message)) out.push(w);
  for (let i = 0; i < after.marks.length; i++) {
    for (let j = i + 1; j < after.marks.length; j++) {
      const now = overlaps(boxOfMark(after.marks[i]), boxOfMark(after.marks[j]));
      const then = overlaps(boxOfMark(before.marks[i]), boxOfMark(before.marks[j]));
      if (now && !then) out.push({ code: 'marks-overlap', message: `After rescaling, marks ${after.marks[i].id} and ${after.marks[j].id} overlap; move them apart.` });
    }
  }
  if (after.marks.some((m, i) => m.widthUnits !== before.marks[i].widthUnits || m.heightUnits !== before.marks[i].heightUnits) && before.pairings.length + (before.unpairedLabels?.length ?? 0) > 0) {
    out.push({ code: 'labels-not-moved', message: 'Text labels were left where they were; check they still sit well against the rescaled marks.' });
  }
  return out;
}
