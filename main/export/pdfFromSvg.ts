// Turns a written chart SVG into a vector PDF with pdfkit: the same path data, the same fills and
// rules, on a page of the SVG's exact physical size, with the trim box inside the bleed. Only the
// subset the chart writer emits (docs/chart-svg.md) is drawn; anything else is refused, never dropped,
// so no ink can go missing between the checked SVG and the PDF.
import { createRequire } from 'node:module';
import fs from 'node:fs';
import PDFDocument from 'pdfkit';
import svgpath from 'svgpath';
import { TallyError } from '../../shared-core/errors';
import { parseXml, walkElements, type XmlElement } from '../../shared-core/svg';
import { readSvgPageSize } from '../raster/index';

/** PostScript points per millimetre: 72 pt to the inch, 25.4 mm to the inch (CSS Values 4, absolute lengths). */
export const PT_PER_MM = 72 / 25.4;

/** One filled or stroked path, in the SVG's user units, translated by (dx, dy) (from `<use x y>`). */
export interface PaintOp {
  d: string;
  dx: number;
  dy: number;
  fill: string | null;
  fillRule: 'nonzero' | 'evenodd';
  stroke: string | null;
  strokeWidth: number;
  /** The id of the data mark this ink belongs to, or null for text, legend, rules and background. */
  markId: string | null;
  /** data-part of the piece inside a mark (full, partial, filled, rest), or null. */
  part: string | null;
}

export interface SvgPaint {
  widthMm: number;
  heightMm: number;
  /** viewBox of the root, in user units. */
  viewBox: { x: number; y: number; width: number; height: number };
  ops: PaintOp[];
  title: string | null;
}

export interface BoxMm {
  x: number;
  y: number;
  width: number;
  height: number;
}

interface Style {
  fill: string | null;
  fillRule: 'nonzero' | 'evenodd';
  stroke: string | null;
  strokeWidth: number;
}

const HEX = /^#([0-9a-f]{3}|[0-9a-f]{6})$/i;
/** Containers never drawn in place (SVG 1.1: their content is only referenced, or is not graphics). */
const NOT_DRAWN = new Set(['defs', 'symbol', 'clipPath', 'mask', 'pattern', 'marker', 'metadata', 'style', 'title', 'desc', 'linearGradient', 'radialGradient']);

function unsupported(what: string): TallyError {
  return new TallyError('pdf-unsupported', `The chart SVG has ${what}, which the PDF writer does not draw; nothing was written.`);
}

function paint(value: string | undefined, inherited: string | null, what: string): string | null {
  if (value === undefined || value === 'inherit') return inherited;
  const v = value.trim();
  if (v === 'none') return null;
  if (!HEX.test(v)) throw unsupported(`a ${what} "${v.slice(0, 24)}" (only #rrggbb colours are drawn)`);
  return v.length === 4 ? `#${v[1]}${v[1]}${v[2]}${v[2]}${v[3]}${v[3]}`.toLowerCase() : v.toLowerCase();
}

function num(value: string | undefined, fallback: number, what: string): number {
  if (value === undefined) return fallback;
  const n = Number(value.trim().replace(/px$/, ''));
  if (!Number.isFinite(n)) throw unsupported(`a ${what} of "${value.slice(0, 24)}"`);
  return n;
}

function checkNoOpacity(el: XmlElement): void {
  for (const key of ['opacity', 'fill-opacity', 'stroke-opacity']) {
    const v = el.attrs[key];
    if (v !== undefined && Number(v) !== 1) throw unsupported(`${key}="${v}" on <${el.name}>`);
  }
  if (el.attrs.transform !== undefined) throw unsupported(`a transform on <${el.name}> (the chart writer bakes all geometry)`);
  if (el.attrs.style !== undefined) throw unsupported(`a style attribute on <${el.name}>`);
  if (el.attrs['clip-path'] !== undefined || el.attrs.mask !== undefined || el.attrs.filter !== undefined) throw unsupported(`clipping, masking or a filter on <${el.name}>`);
}

/**
 * Everything the SVG paints, in document order, with inherited fill and stroke resolved. Throws
 * TallyError('pdf-unsupported') for anything outside the chart writer's subset (text left as <text>,
 * transforms, opacity, images, other shapes), so a PDF can never silently lose a piece of the chart.
 */
export function collectPaint(svg: string): SvgPaint {
  const root = parseXml(svg);
  if (root.name !== 'svg') throw new TallyError('svg-malformed', 'The chart is not an SVG document.');
  const page = readSvgPageSize(svg);
  const vb = (root.attrs.viewBox ?? '').trim().split(/[\s,]+/).map(Number);
  const viewBox = vb.length === 4 && vb.every(Number.isFinite) && vb[2] > 0 && vb[3] > 0 ? { x: vb[0], y: vb[1], width: vb[2], height: vb[3] } : { x: 0, y: 0, width: page.widthMm, height: page.heightMm };
  const byId = new Map<string, XmlElement>();
  for (const el of walkElements(root)) if (el.attrs.id) byId.set(el.attrs.id, el);
  const title = root.children.find((c) => c.name === 'title')?.text.trim() || null;

  const ops: PaintOp[] = [];
  const visit = (el: XmlElement, style: Style, markId: string | null, inheritedPart: string | null, dx: number, dy: number, useDepth: number): void => {
    if (NOT_DRAWN.has(el.name)) return;
    if (el.attrs.display === 'none' || el.attrs.visibility === 'hidden') return;
    checkNoOpacity(el);
    const own: Style = {
      fill: paint(el.attrs.fill, style.fill, 'fill'),
      fillRule: el.attrs['fill-rule'] === 'evenodd' ? 'evenodd' : el.attrs['fill-rule'] === 'nonzero' ? 'nonzero' : style.fillRule,
      stroke: paint(el.attrs.stroke, style.stroke, 'stroke'),
      strokeWidth: num(el.attrs['stroke-width'], style.strokeWidth, 'stroke width'),
    };
    const classes = (el.attrs.class ?? '').split(/\s+/);
    const mark = classes.includes('tg-mark') ? (el.attrs.id ?? null) : markId;
    const part = el.attrs['data-part'] ?? inheritedPart;
    switch (el.name) {
      case 'svg':
      case 'g':
        for (const child of el.children) visit(child, own, mark, part, dx, dy, useDepth);
        return;
      case 'path': {
        const d = el.attrs.d ?? '';
        if (d.trim()) ops.push({ d, dx, dy, ...own, markId: mark, part });
        return;
      }
      case 'rect': {
        const x = num(el.attrs.x, 0, 'rect x');
        const y = num(el.attrs.y, 0, 'rect y');
        const w = num(el.attrs.width, 0, 'rect width');
        const h = num(el.attrs.height, 0, 'rect height');
        if (el.attrs.rx !== undefined || el.attrs.ry !== undefined) throw unsupported('a rounded rectangle');
        if (w > 0 && h > 0) ops.push({ d: `M${x} ${y}H${x + w}V${y + h}H${x}Z`, dx, dy, ...own, markId: mark, part });
        return;
      }
      case 'use': {
        const href = (el.attrs['xlink:href'] ?? el.attrs.href ?? '').trim();
        const target = href.startsWith('#') ? byId.get(href.slice(1)) : undefined;
        if (!target) throw unsupported(`a <use> that points to "${href.slice(0, 40)}", not to a shape in the file`);
        if (useDepth > 4) throw unsupported('<use> references nested too deep');
        const ux = num(el.attrs.x, 0, 'use x');
        const uy = num(el.attrs.y, 0, 'use y');
        // SVG 1.1 'use': the referenced element is drawn as if inside a <g> carrying the use's
        // attributes and a translation by (x, y); a definition inside <defs> is drawn all the same.
        const drawTarget: XmlElement = NOT_DRAWN.has(target.name) ? { ...target, name: 'g' } : target;
        visit(drawTarget, own, mark, part, dx + ux, dy + uy, useDepth + 1);
        return;
      }
      case 'text':
      case 'tspan':
        throw unsupported('text that is not converted to outlines');
      default:
        throw unsupported(`a <${el.name}> element`);
    }
  };
  visit(root, { fill: '#000000', fillRule: 'nonzero', stroke: null, strokeWidth: 1 }, null, null, 0, 0, 0);
  return { widthMm: page.widthMm, heightMm: page.heightMm, viewBox, ops, title };
}

/** Bounding box of some paint ops in user units (control points included, so never too small); null when empty. */
export function paintBounds(ops: readonly PaintOp[]): BoxMm | null {
  let x0 = Infinity;
  let y0 = Infinity;
  let x1 = -Infinity;
  let y1 = -Infinity;
  for (const op of ops) {
    const grow = op.stroke ? op.strokeWidth * 2 : 0;
    svgpath(op.d)
      .abs()
      .unarc()
      .iterate((segment) => {
        for (let i = 1; i + 1 < segment.length; i += 2) {
          const x = Number(segment[i]) + op.dx;
          const y = Number(segment[i + 1]) + op.dy;
          if (x - grow < x0) x0 = x - grow;
          if (y - grow < y0) y0 = y - grow;
          if (x + grow > x1) x1 = x + grow;
          if (y + grow > y1) y1 = y + grow;
        }
      });
  }
  return Number.isFinite(x0) ? { x: x0, y: y0, width: x1 - x0, height: y1 - y0 } : null;
}

export interface PdfPageSpec {
  ops: readonly PaintOp[];
  /** Page size in mm. */
  widthMm: number;
  heightMm: number;
  /** The user-unit point drawn at the page's top-left corner, and user units per mm. */
  originX: number;
  originY: number;
  unitsPerMm: number;
  /** Trim box inset from each edge, in mm (the bleed); 0 for none. */
  bleedMm: number;
  /** Paint every fill and stroke in this colour instead (the pixel probe draws ink in black on white). */
  paintOverride?: string;
}

export interface PdfMeta {
  title?: string | null;
  /** Fixed creation date, so the same chart gives the same bytes (tests, reproducible builds). */
  creationDate?: Date;
}

let iccProfile: Buffer | null = null;
/** The sRGB IEC 61966-2.1 ICC profile that pdfkit ships for its PDF/A output intents. */
function srgbProfile(): Buffer {
  if (!iccProfile) {
    const require = createRequire(import.meta.url);
    const pdfkitMain = require.resolve('pdfkit');
    iccProfile = fs.readFileSync(new URL('./data/sRGB_IEC61966_2_1.icc', `file://${pdfkitMain}`));
  }
  return iccProfile;
}

interface PdfDocInternals {
  _root: { data: Record<string, unknown> };
  page: { dictionary: { data: Record<string, unknown> } };
}

/**
 * Writes pages of paint ops as a PDF (PDF 1.7 through pdfkit). Colours are DeviceRGB values of the
 * SVG's sRGB colours, and the document carries an sRGB output intent (the ICC profile), so a
 * consumer knows which RGB is meant. Each page has its MediaBox and BleedBox at the full size and its
 * TrimBox inset by the bleed (ISO 32000-1, 14.11.2 page boundaries).
 */
export function writePdfPages(pages: readonly PdfPageSpec[], meta: PdfMeta = {}): Promise<Uint8Array> {
  if (pages.length === 0) throw new TallyError('usage', 'A PDF needs at least one page.');
  const doc = new PDFDocument({
    autoFirstPage: false,
    pdfVersion: '1.7',
    compress: true,
    info: { Title: meta.title ?? 'Chart', Creator: 'Tallyglyph', Producer: 'Tallyglyph with PDFKit', ...(meta.creationDate ? { CreationDate: meta.creationDate, ModDate: meta.creationDate } : {}) },
  });
  const chunks: Buffer[] = [];
  const done = new Promise<Uint8Array>((resolve, reject) => {
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(new Uint8Array(Buffer.concat(chunks))));
    doc.on('error', reject);
  });
  const internals = doc as unknown as PdfDocInternals;
  const profile = srgbProfile();
  const profileRef = doc.ref({ Length: profile.length, N: 3 });
  profileRef.end(profile);
  const intentRef = doc.ref({ Type: 'OutputIntent', S: 'GTS_PDFX', Info: new String('sRGB IEC61966-2.1'), OutputConditionIdentifier: new String('sRGB IEC61966-2.1'), DestOutputProfile: profileRef });
  intentRef.end(undefined);
  internals._root.data.OutputIntents = [intentRef];

  for (const spec of pages) {
    const wPt = spec.widthMm * PT_PER_MM;
    const hPt = spec.heightMm * PT_PER_MM;
    doc.addPage({ size: [wPt, hPt], margin: 0 });
    const b = spec.bleedMm * PT_PER_MM;
    const dict = internals.page.dictionary.data;
    dict.BleedBox = [0, 0, wPt, hPt];
    dict.TrimBox = [b, b, wPt - b, hPt - b];
    doc.save();
    // pdfkit's own page space is top-left, y down, in points: like SVG, so one scale and one shift.
    const k = PT_PER_MM / spec.unitsPerMm;
    doc.transform(k, 0, 0, k, -spec.originX * k, -spec.originY * k);
    // SVG's stroke defaults (SVG 1.1, 11.4): butt caps, miter joins, miter limit 4.
    doc.lineCap('butt').lineJoin('miter').miterLimit(4);
    for (const op of spec.ops) {
      const fill = op.fill ? (spec.paintOverride ?? op.fill) : null;
      const stroke = op.stroke && op.strokeWidth > 0 ? (spec.paintOverride ?? op.stroke) : null;
      if (!fill && !stroke) continue;
      doc.save();
      if (op.dx !== 0 || op.dy !== 0) doc.translate(op.dx, op.dy);
      doc.path(op.d);
      if (stroke) doc.lineWidth(op.strokeWidth);
      if (fill && stroke) doc.fillAndStroke(fill, stroke, op.fillRule === 'evenodd' ? 'even-odd' : 'non-zero');
      else if (fill) doc.fill(fill, op.fillRule === 'evenodd' ? 'even-odd' : 'non-zero');
      else if (stroke) doc.stroke(stroke);
      doc.restore();
    }
    doc.restore();
  }
  doc.end();
  return done;
}

/** The whole chart as one PDF page of the SVG's physical size, trim box inset by `bleedMm`. */
export function chartPdf(svg: string, options: { bleedMm: number } & PdfMeta): Promise<Uint8Array> {
  const painted = collectPaint(svg);
  return writePdfPages(
    [
      {
        ops: painted.ops,
        widthMm: painted.widthMm,
        heightMm: painted.heightMm,
        originX: painted.viewBox.x,
        originY: painted.viewBox.y,
        unitsPerMm: painted.viewBox.width / painted.widthMm,
        bleedMm: options.bleedMm,
      },
    ],
    { title: options.title ?? painted.title, creationDate: options.creationDate },
  );
}
