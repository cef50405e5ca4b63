// Walk an SVG element tree and list every painted shape with its resolved style and transform.
// Anything that would paint ink we cannot measure becomes a warning, never a silent wrong number.
import { TallyError, type Warning } from '../errors';
import { IDENTITY, multiply, parseTransform, translation, type Matrix } from '../geometry/matrix';
import type { Box } from '../geometry/region';
import { walkElements, type XmlElement } from '../svg/parseXml';
import type { LineCap, LineJoin, StrokeStyle } from './strokeOutline';

export interface PaintedShape {
  tag: string;
  /** Path data in the element's own user space. */
  d: string;
  /** Current transformation matrix: element user space to root (viewBox) units. */
  ctm: Matrix;
  /** `paint` is the fill as written (a colour, `url(...)`, `currentColor`), for checks that care what shows. */
  fill: { rule: 'nonzero' | 'evenodd'; paint?: string } | null;
  stroke: StrokeStyle | null;
  /** Identifier of the nearest ancestor (or self) carrying an id, for reporting. */
  id?: string;
  /**
   * The elements from the root down to this shape, as drawn: through a `use`, the chain runs
   * root → … → use → referenced element → … → shape. Lets readers group ink by the mark it belongs to.
   */
  chain: readonly XmlElement[];
}

export interface CollectedGlyph {
  shapes: PaintedShape[];
  viewBox: Box | null;
  warnings: Warning[];
}

interface Style {
  fill: string;
  fillRule: 'nonzero' | 'evenodd';
  fillOpacity: number;
  stroke: string;
  strokeOpacity: number;
  strokeWidth: number;
  join: LineJoin;
  cap: LineCap;
  miterLimit: number;
  visible: boolean;
}

const ROOT_STYLE: Style = {
  fill: '#000',
  fillRule: 'nonzero',
  fillOpacity: 1,
  stroke: 'none',
  strokeOpacity: 1,
  strokeWidth: 1,
  join: 'miter',
  cap: 'butt',
  miterLimit: 4,
  visible: true,
};

const NOT_RENDERED = new Set(['defs', 'symbol', 'clipPath', 'mask', 'pattern', 'marker', 'linearGradient', 'radialGradient', 'filter', 'title', 'desc', 'metadata', 'script', 'style', 'font', 'font-face', 'cursor', 'view', 'animate', 'animateTransform', 'animateMotion', 'set', 'switch']);
const UNMEASURED = new Set(['text', 'image', 'foreignObject', 'tspan', 'textPath']);
const SHAPES = new Set(['path', 'rect', 'circle', 'ellipse', 'line', 'polyline', 'polygon']);

export interface CollectOptions {
  /** How deep `use` may nest before the file is refused. */
  maxUseDepth?: number;
  /** Most shapes after resolving `use`. */
  maxShapes?: number;
}

export function collectShapes(root: XmlElement, opts: CollectOptions = {}): CollectedGlyph {
  const warnings: Warning[] = [];
  const warned = new Set<string>();
  const warn = (code: string, message: string) => {
    if (warned.has(code + message)) return;
    warned.add(code + message);
    warnings.push({ code, message });
  };
  if (root.name !== 'svg') throw new TallyError('svg-malformed', `The file's root element is <${root.qname}>, not <svg>.`);
  const maxUseDepth = opts.maxUseDepth ?? 32;
  const maxShapes = opts.maxShapes ?? 200_000;

  const ids = new Map<string, XmlElement>();
  for (const el of walkElements(root)) if (el.attrs.id) ids.set(el.attrs.id, el);
  if (root.children.some((c) => c.name === 'style')) {
    warn('style-sheet', 'The file has a <style> sheet; its rules are not applied, so fills set only there are read as the default (black).');
  }

  const viewBox = parseViewBox(root.attrs.viewBox);
  const shapes: PaintedShape[] = [];

  const visit = (el: XmlElement, parentCtm: Matrix, parent: Style, useStack: string[], parentChain: readonly XmlElement[], nearestId?: string) => {
    const chain = [...parentChain, el];
    const name = el.name;
    if (NOT_RENDERED.has(name)) return;
    const attrs = readAttributes(el);
    if (attrs.display === 'none') return;
    const opacity = num(attrs.opacity, 1, 'opacity');
    if (opacity <= 0) return;
    if (opacity < 1) warn('partial-opacity', 'Some ink is partly transparent; it is counted as full ink.');
    for (const k of ['clip-path', 'mask', 'filter']) {
      if (attrs[k] && attrs[k] !== 'none') warn('unsupported-' + k, `A ${k} is ignored; the measured ink may be larger than what shows.`);
    }
    if (attrs['vector-effect'] === 'non-scaling-stroke') warn('non-scaling-stroke', 'A non-scaling stroke is measured as if it scaled with its shape.');
    const style = inherit(parent, attrs, warn);
    let ctm = multiply(parentCtm, parseTransform(attrs.transform));
    const id = el.attrs.id ?? nearestId;

    if (UNMEASURED.has(name)) {
      warn('unsupported-' + name, `A <${name}> element is not measured as ink (convert text to outlines and embed images as shapes).`);
      return;
    }
    if (name === 'svg' && el !== root) {
      ctm = multiply(ctm, translation(num(attrs.x, 0, 'x'), num(attrs.y, 0, 'y')));
      if (attrs.viewBox) warn('nested-viewbox', 'A nested <svg> viewBox is ignored; only its x and y offset are applied.');
    }
    if (name === 'use') {
      const href = el.attrs['xlink:href'] ?? el.attrs.href ?? '';
      if (!href.startsWith('#')) {
        warn('external-reference', `A <use> pointing outside the file (${href.slice(0, 80) || 'empty'}) is ignored; nothing is fetched.`);
        return;
      }
      const target = ids.get(href.slice(1));
      if (!target) {
        warn('missing-reference', `A <use> points to ${href.slice(0, 80)}, which the file does not contain.`);
        return;
      }
      if (useStack.includes(href)) throw new TallyError('svg-limit', `The file's <use> references form a cycle through ${href.slice(0, 80)} (reference cycle).`);
      if (useStack.length >= maxUseDepth) throw new TallyError('svg-limit', `<use> references nest deeper than ${maxUseDepth} levels (use depth limit).`);
      const useCtm = multiply(ctm, translation(num(attrs.x, 0, 'x'), num(attrs.y, 0, 'y')));
      const inner = target.name === 'symbol' ? { ...target, name: 'g' } : target;
      if (target.name === 'symbol' && target.attrs.viewBox) warn('symbol-viewbox', 'A <symbol> viewBox is ignored; the symbol is drawn in its own units.');
      visit(inner, useCtm, style, [...useStack, href], chain, id);
      return;
    }
    if (SHAPES.has(name)) {
      const d = shapeToPathData(el.name, attrs);
      if (d) {
        const fillOn = style.fill !== 'none' && style.fillOpacity > 0 && style.visible;
        const strokeOn = style.stroke !== 'none' && style.strokeOpacity > 0 && style.strokeWidth > 0 && style.visible;
        if (fillOn && /^url\(/.test(style.fill)) warn('paint-server', 'A gradient or pattern fill is counted as solid ink over its whole shape.');
        if (strokeOn && /^url\(/.test(style.stroke)) warn('paint-server', 'A gradient or pattern stroke is counted as solid ink over its whole outline.');
        const fill = fillOn && name !== 'line' ? { rule: style.fillRule, paint: style.fill } : null;
        const stroke = strokeOn ? { width: style.strokeWidth, join: style.join, cap: style.cap, miterLimit: style.miterLimit } : null;
        if (fill || stroke) {
          shapes.push({ tag: name, d, ctm, fill, stroke, id, chain });
          if (shapes.length > maxShapes) throw new TallyError('svg-limit', `The file paints more than ${maxShapes} shapes (shape count limit).`);
        }
      }
      return;
    }
    if (name === 'g' || name === 'svg' || name === 'a') {
      for (const c of el.children) visit(c, ctm, style, useStack, chain, id);
      return;
    }
    warn('unknown-element', `An unknown element <${el.qname}> is ignored.`);
  };

  visit(root, IDENTITY, ROOT_STYLE, [], []);
  return { shapes, viewBox, warnings };
}

export function parseViewBox(v: string | undefined): Box | null {
  if (!v) return null;
  const n = v.trim().split(/[\s,]+/).map(Number);
  if (n.length !== 4 || n.some((x) => !Number.isFinite(x))) throw new TallyError('svg-malformed', `The viewBox "${v.slice(0, 60)}" cannot be read.`);
  if (n[2] <= 0 || n[3] <= 0) throw new TallyError('svg-malformed', 'The viewBox has a zero or negative width or height.');
  return { x: n[0], y: n[1], width: n[2], height: n[3] };
}

/**
 * Presentation attributes overlaid with the `style` attribute (which wins, per CSS cascade). Read-only: without
 * a `style` attribute this is the element's own attributes, not a copy (one copy per element was a large part
 * of reading a 100,000-glyph chart).
 */
export function readAttributes(el: XmlElement): Readonly<Record<string, string>> {
  const st = el.attrs.style;
  if (!st) return el.attrs;
  const out: Record<string, string> = { ...el.attrs };
  for (const decl of st.split(';')) {
    const i = decl.indexOf(':');
    if (i > 0) out[decl.slice(0, i).trim().toLowerCase()] = decl.slice(i + 1).replace(/!important/i, '').trim();
  }
  return out;
}

function num(v: string | undefined, dflt: number, what: string): number {
  if (v === undefined || v.trim() === '') return dflt;
  const s = v.trim();
  const m = /^([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)(px|%)?$/.exec(s);
  if (!m) {
    if (/nan|infinity/i.test(s)) throw new TallyError('number-invalid', `The attribute ${what}="${s.slice(0, 30)}" is not a finite number.`);
    throw new TallyError('svg-malformed', `The attribute ${what}="${s.slice(0, 30)}" is not a number Tallyglyph can read (use plain user units).`);
  }
  const n = Number(m[1]);
  if (!Number.isFinite(n)) throw new TallyError('number-invalid', `The attribute ${what}="${s.slice(0, 30)}" is not a finite number.`);
  if (m[2] === '%') {
    if (what === 'opacity' || what.endsWith('opacity')) return n / 100;
    throw new TallyError('svg-malformed', `The attribute ${what}="${s}" uses a percentage; give it in user units.`);
  }
  return n;
}

/** Whether a presentation attribute sets a value (not absent, empty or `inherit`). */
function keep(v: string | undefined): v is string {
  return v !== undefined && v !== 'inherit' && v !== '';
}

function inherit(p: Style, a: Readonly<Record<string, string>>, warn: (c: string, m: string) => void): Style {
  const s = { ...p };
  if (keep(a.fill)) s.fill = a.fill.trim();
  if (keep(a['fill-rule'])) s.fillRule = a['fill-rule'].trim() === 'evenodd' ? 'evenodd' : 'nonzero';
  if (keep(a['fill-opacity'])) s.fillOpacity = num(a['fill-opacity'], 1, 'fill-opacity');
  if (keep(a.stroke)) s.stroke = a.stroke.trim();
  if (keep(a['stroke-opacity'])) s.strokeOpacity = num(a['stroke-opacity'], 1, 'stroke-opacity');
  if (keep(a['stroke-width'])) s.strokeWidth = num(a['stroke-width'], 1, 'stroke-width');
  if (keep(a['stroke-linejoin'])) {
    const j = a['stroke-linejoin'].trim();
    if (j === 'round' || j === 'bevel' || j === 'miter') s.join = j;
    else {
      s.join = 'miter';
      warn('linejoin', `stroke-linejoin "${j}" is measured as miter.`);
    }
  }
  if (keep(a['stroke-linecap'])) {
    const c = a['stroke-linecap'].trim();
    s.cap = c === 'round' || c === 'square' ? c : 'butt';
  }
  if (keep(a['stroke-miterlimit'])) s.miterLimit = Math.max(1, num(a['stroke-miterlimit'], 4, 'stroke-miterlimit'));
  if (keep(a.visibility)) s.visible = a.visibility.trim() === 'visible';
  if (keep(a['stroke-dasharray']) && a['stroke-dasharray'].trim() !== 'none') warn('dasharray', 'A dashed stroke is measured as a solid stroke.');
  if (s.fillOpacity < 1 && s.fillOpacity > 0) warn('partial-opacity', 'Some ink is partly transparent; it is counted as full ink.');
  return s;
}

/** Basic shapes as path data, per the equivalent paths in SVG 1.1 §9. */
export function shapeToPathData(tag: string, a: Readonly<Record<string, string>>): string | null {
  const n = (k: string, d = 0) => num(a[k], d, k);
  switch (tag) {
    case 'path':
      return a.d && a.d.trim() ? a.d : null;
    case 'rect': {
      const x = n('x'), y = n('y'), w = n('width'), h = n('height');
      if (w < 0 || h < 0) throw new TallyError('svg-malformed', 'A <rect> has a negative width or height.');
      if (w === 0 || h === 0) return null;
      let rx = a.rx !== undefined && a.rx !== 'auto' ? n('rx') : NaN;
      let ry = a.ry !== undefined && a.ry !== 'auto' ? n('ry') : NaN;
      if (Number.isNaN(rx)) rx = Number.isNaN(ry) ? 0 : ry;
      if (Number.isNaN(ry)) ry = rx;
      rx = Math.min(Math.abs(rx), w / 2);
      ry = Math.min(Math.abs(ry), h / 2);
      if (rx === 0 || ry === 0) return `M${x} ${y}H${x + w}V${y + h}H${x}Z`;
      return `M${x + rx} ${y}H${x + w - rx}A${rx} ${ry} 0 0 1 ${x + w} ${y + ry}V${y + h - ry}A${rx} ${ry} 0 0 1 ${x + w - rx} ${y + h}H${x + rx}A${rx} ${ry} 0 0 1 ${x} ${y + h - ry}V${y + ry}A${rx} ${ry} 0 0 1 ${x + rx} ${y}Z`;
    }
    case 'circle': {
      const cx = n('cx'), cy = n('cy'), r = n('r');
      if (r < 0) throw new TallyError('svg-malformed', 'A <circle> has a negative radius.');
      if (r === 0) return null;
      return `M${cx + r} ${cy}A${r} ${r} 0 0 1 ${cx} ${cy + r}A${r} ${r} 0 0 1 ${cx - r} ${cy}A${r} ${r} 0 0 1 ${cx} ${cy - r}A${r} ${r} 0 0 1 ${cx + r} ${cy}Z`;
    }
    case 'ellipse': {
      const cx = n('cx'), cy = n('cy'), rx = n('rx'), ry = n('ry');
      if (rx < 0 || ry < 0) throw new TallyError('svg-malformed', 'An <ellipse> has a negative radius.');
      if (rx === 0 || ry === 0) return null;
      return `M${cx + rx} ${cy}A${rx} ${ry} 0 0 1 ${cx} ${cy + ry}A${rx} ${ry} 0 0 1 ${cx - rx} ${cy}A${rx} ${ry} 0 0 1 ${cx} ${cy - ry}A${rx} ${ry} 0 0 1 ${cx + rx} ${cy}Z`;
    }
    case 'line':
      return `M${n('x1')} ${n('y1')}L${n('x2')} ${n('y2')}`;
    case 'polyline':
    case 'polygon': {
      const pts = (a.points ?? '').trim().split(/[\s,]+/).filter(Boolean).map(Number);
      if (pts.some((v) => !Number.isFinite(v))) throw new TallyError('number-invalid', `A <${tag}> has a point that is not a finite number.`);
      if (pts.length < 4) return null;
      const usable = pts.length % 2 ? pts.slice(0, -1) : pts;
      let d = `M${usable[0]} ${usable[1]}`;
      for (let i = 2; i < usable.length; i += 2) d += `L${usable[i]} ${usable[i + 1]}`;
      return tag === 'polygon' ? d + 'Z' : d;
    }
    default:
      return null;
  }
}
