// Safe import of a supplied SVG: parse without entities or fetches, hold the file to size and count
// limits, refuse reference cycles and reference fan-outs, then list painted shapes and numeric text.
import { TallyError, type Warning } from '../errors';
import { IDENTITY, determinant, multiply, parseTransform, translation, type Matrix } from '../geometry/matrix';
import type { Box } from '../geometry/region';
import { collectShapes, readAttributes, type PaintedShape } from '../glyph/collectShapes';
import { parseXml, walkElements, type XmlElement } from '../svg/parseXml';
import { auditLimits, type AuditLimits } from './auditLimits';
import { countPathCommands, countPoints } from './countPathCommands';

/** A piece of text in the file, placed in root (viewBox) units: a candidate value label. */
export interface TextLabel {
  text: string;
  /** Anchor point of the text (its first x, y) in root units. */
  xUnits: number;
  yUnits: number;
  /** Font size in root units, for judging what counts as "near". */
  sizeUnits: number;
  element: XmlElement;
  chain: readonly XmlElement[];
}

export interface ImportedSvg {
  root: XmlElement;
  shapes: PaintedShape[];
  viewBox: Box | null;
  labels: TextLabel[];
  /** Document order of every element as written, for string-level edits and stable mark order. */
  order: ReadonlyMap<XmlElement, number>;
  /** Parent of every element as written. */
  parents: ReadonlyMap<XmlElement, XmlElement>;
  warnings: Warning[];
  limits: AuditLimits;
}

const NOT_RENDERED = new Set(['defs', 'symbol', 'clipPath', 'mask', 'pattern', 'marker', 'linearGradient', 'radialGradient', 'filter', 'title', 'desc', 'metadata', 'script', 'style', 'font', 'font-face', 'cursor', 'view', 'switch']);

/** Parse and vet a supplied SVG. Throws TallyError('svg-malformed' | 'svg-limit' | ...) naming the broken rule. */
export function importSvg(text: string, limitOverrides: Partial<AuditLimits> = {}): ImportedSvg {
  const limits = auditLimits(limitOverrides);
  if (typeof text !== 'string') throw new TallyError('svg-malformed', 'The SVG is not text.');
  if (text.length > limits.maxChars) {
    throw new TallyError('svg-limit', `The SVG is ${text.length.toLocaleString('en')} characters long; the file size limit is ${limits.maxChars.toLocaleString('en')}.`);
  }
  const source = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const root = parseXml(source, { maxChars: limits.maxChars, maxElements: limits.maxElements, maxDepth: limits.maxDepth });
  if (root.name !== 'svg') throw new TallyError('svg-malformed', `The file's root element is <${root.qname}>, not <svg>.`);

  const warnings: Warning[] = [];
  const order = new Map<XmlElement, number>();
  const parents = new Map<XmlElement, XmlElement>();
  const ids = new Map<string, XmlElement>();
  let n = 0;
  for (const el of walkElements(root)) {
    order.set(el, n++);
    for (const c of el.children) parents.set(c, el);
    if (el.attrs.id && !ids.has(el.attrs.id)) ids.set(el.attrs.id, el);
  }
  scanForHostileContent(root, limits, warnings);
  checkUseExpansion(root, ids, limits);

  const collected = collectShapes(root, { maxUseDepth: limits.maxUseDepth, maxShapes: limits.maxShapes });
  const labels = collectLabels(root);
  for (const w of collected.warnings) {
    // Text is read as labels here, not as ink: the glyph reader's advice to outline it does not apply.
    if (w.code === 'unsupported-text' || w.code === 'unsupported-tspan' || w.code === 'unsupported-textPath') continue;
    warnings.push(w);
  }
  if (labels.length) {
    warnings.push({ code: 'text-as-labels', message: `${labels.length} text element(s) were read as labels, not measured as ink.` });
  }
  return { root, shapes: collected.shapes, viewBox: collected.viewBox, labels, order, parents, warnings, limits };
}

/** Counts what a browser would run or fetch (none of it is run or fetched here) and the path commands. */
function scanForHostileContent(root: XmlElement, limits: AuditLimits, warnings: Warning[]): void {
  let scripts = 0;
  let handlers = 0;
  let foreign = 0;
  let external = 0;
  let commands = 0;
  for (const el of walkElements(root)) {
    if (el.name === 'script') scripts += 1;
    if (el.name === 'foreignObject') foreign += 1;
    for (const [k, v] of Object.entries(el.attrs)) {
      if (/^on[a-z]+$/i.test(k)) handlers += 1;
      if ((k === 'href' || k.endsWith(':href')) && el.name !== 'a' && !v.trim().startsWith('#')) external += 1;
    }
    if (el.name === 'path' && el.attrs.d) commands += countPathCommands(el.attrs.d);
    else if ((el.name === 'polygon' || el.name === 'polyline') && el.attrs.points) commands += countPoints(el.attrs.points);
    if (commands > limits.maxPathCommands) {
      throw new TallyError('svg-limit', `The SVG has more than ${limits.maxPathCommands.toLocaleString('en')} path commands (path command limit); simplify its outlines.`);
    }
  }
  if (scripts) warnings.push({ code: 'script-ignored', message: `The file contains ${scripts} <script> element(s); they were not run.` });
  if (handlers) warnings.push({ code: 'event-handler-ignored', message: `The file has ${handlers} event-handler attribute(s) (onload, onclick, ...); they were ignored.` });
  if (foreign) warnings.push({ code: 'foreign-object-ignored', message: `The file has ${foreign} <foreignObject> element(s); their content was ignored.` });
  if (external) warnings.push({ code: 'external-reference-ignored', message: `The file refers to ${external} outside resource(s) (images or references to other files); nothing was fetched and they were not measured.` });
}

interface Expansion {
  /** Elements in the subtree once every `use` is expanded. */
  size: number;
  /** Depth of that expanded subtree. */
  height: number;
  /** Most `use` steps along any path in it. */
  useHeight: number;
}

/**
 * Size and depth of the tree once every `<use>` is expanded, memoised per element so the check is
 * linear in the file; refuses cycles, deep chains and fan-outs (10 uses of 10 uses of ... paints
 * nothing but costs 10^k visits) before the shape walker sees them.
 */
function checkUseExpansion(root: XmlElement, ids: ReadonlyMap<string, XmlElement>, limits: AuditLimits): void {
  const memo = new Map<XmlElement, Expansion>();
  const active = new Set<XmlElement>();
  const tooDeep = () => new TallyError('svg-limit', `Elements nest deeper than ${limits.maxExpandedDepth} levels once <use> references are expanded (expanded depth limit).`);
  const tooManyUses = () => new TallyError('svg-limit', `<use> references nest deeper than ${limits.maxUseDepth} levels (use depth limit).`);
  const visit = (el: XmlElement, depth: number, useDepth: number): Expansion => {
    const known = memo.get(el);
    if (known) {
      if (depth + known.height > limits.maxExpandedDepth) throw tooDeep();
      if (useDepth + known.useHeight > limits.maxUseDepth) throw tooManyUses();
      return known;
    }
    if (depth > limits.maxExpandedDepth) throw tooDeep();
    active.add(el);
    let size = 1;
    let height = 1;
    let useHeight = 0;
    for (const c of el.children) {
      const e = visit(c, depth + 1, useDepth);
      size += e.size;
      height = Math.max(height, e.height + 1);
      useHeight = Math.max(useHeight, e.useHeight);
      if (size > limits.maxExpandedElements) break;
    }
    if (el.name === 'use') {
      const href = (el.attrs['xlink:href'] ?? el.attrs.href ?? '').trim();
      const target = href.startsWith('#') ? ids.get(href.slice(1)) : undefined;
      if (target) {
        if (active.has(target)) throw new TallyError('svg-limit', `The file's <use> references form a cycle through ${href.slice(0, 80)} (reference cycle).`);
        if (useDepth + 1 > limits.maxUseDepth) throw tooManyUses();
        const e = visit(target, depth + 1, useDepth + 1);
        size += e.size;
        height = Math.max(height, e.height + 1);
        useHeight = Math.max(useHeight, e.useHeight + 1);
      }
    }
    active.delete(el);
    if (size > limits.maxExpandedElements) {
      throw new TallyError('svg-limit', `Expanding the file's <use> references gives more than ${limits.maxExpandedElements.toLocaleString('en')} elements (expanded element limit).`);
    }
    const e = { size, height, useHeight };
    memo.set(el, e);
    return e;
  };
  visit(root, 0, 0);
}

function firstNumber(v: string | undefined): number | null {
  if (!v) return null;
  const m = /^\s*([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)/.exec(v);
  if (!m) return null;
  const x = Number(m[1]);
  return Number.isFinite(x) ? x : null;
}

function fontSizeUnits(v: string | undefined, inherited: number): number {
  const m = v ? /^\s*([+-]?(?:\d+\.?\d*|\.\d+))(px|pt)?\s*$/.exec(v) : null;
  if (!m) return inherited;
  const x = Number(m[1]) * (m[2] === 'pt' ? 96 / 72 : 1);
  return x > 0 && Number.isFinite(x) ? x : inherited;
}

function gatherText(el: XmlElement): string {
  let s = el.text;
  for (const c of el.children) if (c.name === 'tspan' || c.name === 'textPath' || c.name === 'a') s += ' ' + gatherText(c);
  return s;
}

/** Every rendered `<text>` with its anchor point in root units (same transform rules as the shape walker). */
function collectLabels(root: XmlElement): TextLabel[] {
  const out: TextLabel[] = [];
  const visit = (el: XmlElement, parentCtm: Matrix, chain: readonly XmlElement[], fontSize: number) => {
    if (NOT_RENDERED.has(el.name) || el.name === 'foreignObject' || el.name === 'use') return;
    const a = readAttributes(el);
    if (a.display === 'none' || a.visibility === 'hidden') return;
    let ctm: Matrix;
    try {
      ctm = multiply(parentCtm, parseTransform(a.transform));
    } catch {
      return;
    }
    if (el.name === 'svg' && chain.length) ctm = multiply(ctm, translation(firstNumber(a.x) ?? 0, firstNumber(a.y) ?? 0));
    const size = fontSizeUnits(a['font-size'], fontSize);
    const here = [...chain, el];
    if (el.name === 'text') {
      const text = gatherText(el).replace(/\s+/g, ' ').trim();
      if (!text) return;
      const span = el.children.find((c) => c.name === 'tspan');
      const x = firstNumber(a.x) ?? firstNumber(span?.attrs.x) ?? 0;
      const y = firstNumber(a.y) ?? firstNumber(span?.attrs.y) ?? 0;
      const p = { x: ctm[0] * x + ctm[2] * y + ctm[4], y: ctm[1] * x + ctm[3] * y + ctm[5] };
      out.push({ text: text.slice(0, 200), xUnits: p.x, yUnits: p.y, sizeUnits: size * Math.sqrt(Math.abs(determinant(ctm))), element: el, chain: here });
      return;
    }
    for (const c of el.children) visit(c, ctm, here, size);
  };
  visit(root, IDENTITY, [], 16);
  return out;
}
