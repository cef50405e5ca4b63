// Finds the data marks of a supplied SVG and measures them: top-level shapes and groups (under any
// single wrapper group), with touching pieces of one picture merged and backgrounds, baselines and
// frames set aside. Files that name their marks (a Tallyglyph chart's `tg-mark` groups, a corrected
// file's `data-tallyglyph-mark` wrappers, or ids the user lists) are taken at their word.
import { TallyError } from '../errors';
import { boxOf, regionArea, unionRegions, type Box, type Region } from '../geometry/region';
import type { PaintedShape } from '../glyph/collectShapes';
import { flattenPathData, newBudget, type FlattenBudget } from '../glyph/flattenPath';
import { inkOfShapes } from '../glyph/measureGlyph';
import type { XmlElement } from '../svg/parseXml';
import type { ImportedSvg } from './importSvg';
import { mergeTouching, unionBox } from './mergeTouching';
import { colourKey, fillColourOf } from './paintColour';
import { solidCuesOf } from './solidCues';
import { splitComponents } from './splitComponents';
import { shortenText } from './shortenText';
import { splitGlyphRows } from './splitGlyphRows';
import type { MarkPart, MeasuredMark, SetAside } from './types';

/** Attribute a corrected file puts on the wrapper of each mark, so a re-audit finds the same marks. */
export const MARK_ATTRIBUTE = 'data-tallyglyph-mark';

export interface SvgMark extends MeasuredMark {
  /** Elements as written that make up the mark, in document order (several when pieces were merged). */
  elements: XmlElement[];
  shapes: PaintedShape[];
  region: Region;
}

export interface FindMarksOptions {
  /** Ids of the elements that are the marks, in the order values are given. */
  markIds?: readonly string[];
  /** Marks with less ink than this share of the largest are set aside as text or decoration (default 0.001). */
  minInkFraction?: number;
  now?: () => number;
}

export interface FoundMarks {
  marks: SvgMark[];
  setAside: SetAside[];
  /** Flattening tolerance used, in root units. */
  toleranceUnits: number;
}

interface Candidate {
  elements: XmlElement[];
  /** Chain index of the candidate's element in each of its shapes' chains. */
  depth: number;
  shapes: PaintedShape[];
  explicitId?: string;
}

interface MeasuredCandidate extends Candidate {
  region: Region;
  box: Box;
  inkAreaUnits2: number;
  parts: MarkPart[];
}

const CONTAINERS = new Set(['g', 'svg', 'a', 'use', 'switch']);

function hasClass(el: XmlElement, name: string): boolean {
  return (el.attrs.class ?? '').split(/\s+/).includes(name);
}

function describe(el: XmlElement): string {
  const id = el.attrs.id ? ` id="${el.attrs.id.slice(0, 60)}"` : '';
  return `<${el.qname}${id}>`;
}

function deadline(limitMs: number, now: () => number): () => void {
  const start = now();
  return () => {
    if (now() - start > limitMs) {
      throw new TallyError('time-limit', `Measuring the marks took longer than ${Math.round(limitMs / 1000)} s (time limit); simplify the drawing.`);
    }
  };
}

/** A rough box from curve end points only: enough to spot a background, cheap for any file. */
function coarseBox(s: PaintedShape, budget: FlattenBudget): Box {
  const pts = flattenPathData(s.d, s.ctm, Infinity, budget).flatMap((l) => l.points);
  return boxOf([pts]);
}

function groupAt(shapes: readonly PaintedShape[], index: number): Map<XmlElement, PaintedShape[]> {
  const out = new Map<XmlElement, PaintedShape[]>();
  for (const s of shapes) {
    const el = s.chain[index];
    if (!el) continue;
    const list = out.get(el);
    if (list) list.push(s);
    else out.set(el, [s]);
  }
  return out;
}

function contains(outer: Box, inner: Box, gap: number): boolean {
  return outer.x <= inner.x + gap && outer.y <= inner.y + gap && outer.x + outer.width >= inner.x + inner.width - gap && outer.y + outer.height >= inner.y + inner.height - gap;
}

/** Explicit marks: listed ids, a corrected file's wrappers, or a Tallyglyph chart's mark groups. */
function explicitCandidates(imp: ImportedSvg, opts: FindMarksOptions, setAside: SetAside[]): Candidate[] | null {
  let pick: ((el: XmlElement) => string | null) | null = null;
  if (opts.markIds && opts.markIds.length) {
    const wanted = new Set(opts.markIds);
    if (wanted.size !== opts.markIds.length) throw new TallyError('usage', 'The same mark id is listed twice.');
    pick = (el) => (el.attrs.id && wanted.has(el.attrs.id) ? el.attrs.id : null);
  } else if ([...imp.order.keys()].some((el) => el.attrs[MARK_ATTRIBUTE] !== undefined)) {
    pick = (el) => el.attrs[MARK_ATTRIBUTE] ?? null;
  } else if ([...imp.order.keys()].some((el) => hasClass(el, 'tg-mark'))) {
    pick = (el) => (hasClass(el, 'tg-mark') ? el.attrs.id ?? `mark-${imp.order.get(el)}` : null);
  }
  if (!pick) return null;
  const byKey = new Map<string, Candidate>();
  let outside = 0;
  for (const s of imp.shapes) {
    let found: { key: string; index: number } | null = null;
    for (let i = 0; i < s.chain.length && !found; i++) {
      const key = pick(s.chain[i]);
      if (key !== null) found = { key, index: i };
    }
    if (!found) {
      outside += 1;
      continue;
    }
    const el = s.chain[found.index];
    let c = byKey.get(found.key);
    if (!c) {
      c = { elements: [], depth: found.index, shapes: [], explicitId: found.key };
      byKey.set(found.key, c);
    }
    if (!c.elements.includes(el)) c.elements.push(el);
    c.shapes.push(s);
  }
  if (opts.markIds) {
    const missing = opts.markIds.filter((id) => !byKey.has(id));
    if (missing.length) throw new TallyError('usage', `The file has no painted element with the id "${missing[0].slice(0, 80)}".`);
  }
  if (outside) setAside.push({ kind: 'not-a-mark', description: `${outside} shape(s) outside the named marks (labels, legend, rules) were not measured as marks.` });
  const list = [...byKey.values()];
  if (opts.markIds) return opts.markIds.map((id) => byKey.get(id) as Candidate);
  return list.sort((a, b) => (imp.order.get(a.elements[0]) ?? 0) - (imp.order.get(b.elements[0]) ?? 0));
}

/** Descend through single wrapper groups (and past a full-page background) to the level holding the marks. */
function structuralCandidates(imp: ImportedSvg, setAside: SetAside[]): Candidate[] {
  const budget = newBudget(imp.limits.maxPathCommands, imp.limits.maxVertices);
  const boxes = new Map<PaintedShape, Box>();
  const boxOfShapes = (shapes: PaintedShape[]) =>
    unionBox(
      shapes.map((s) => {
        let b = boxes.get(s);
        if (!b) {
          b = coarseBox(s, budget);
          boxes.set(s, b);
        }
        return b;
      }),
    );
  const vb = imp.viewBox;
  let shapes = imp.shapes;
  let index = 1;
  for (;;) {
    const groups = groupAt(shapes, index);
    const entries = [...groups.entries()];
    const all = boxOfShapes(shapes);
    const gap = Math.max(all.width, all.height) * 1e-6;
    const backgrounds = new Set<XmlElement>();
    if (entries.length >= 2) {
      for (const [el, sh] of entries) {
        if (sh.length !== 1 || !(el.name === 'rect' || el.name === 'path' || el.name === 'polygon')) continue;
        const b = boxOfShapes(sh);
        const coversAll = entries.every(([o, osh]) => o === el || contains(b, boxOfShapes(osh), gap));
        const coversPage = vb ? b.width * b.height >= 0.9 * vb.width * vb.height : entries.length >= 3;
        if (coversAll && coversPage) backgrounds.add(el);
      }
    }
    for (const el of backgrounds) setAside.push({ kind: 'background', description: `${describe(el)} covers the whole drawing: read as a background, not a mark.` });
    const rest = entries.filter(([el]) => !backgrounds.has(el));
    if (rest.length === 1) {
      const [el, sh] = rest[0];
      const deeper = sh.some((s) => s.chain.length > index + 1);
      if (CONTAINERS.has(el.name) && deeper && !hasMarkAttributes(el)) {
        shapes = sh;
        index += 1;
        continue;
      }
    }
    return rest.map(([el, sh]) => ({ elements: [el], depth: index, shapes: sh }));
  }
}

function hasMarkAttributes(el: XmlElement): boolean {
  return el.attrs['data-value'] !== undefined || el.attrs['data-label'] !== undefined;
}

/** Sub-glyphs of one candidate: the elements where its shapes' chains first part ways, else pieces of ink. */
function partsOf(c: Candidate, tol: number, budget: FlattenBudget, check: () => void): { region: Region; parts: MarkPart[] } {
  let common = c.depth + 1;
  const chains = c.shapes.map((s) => s.chain);
  const shortest = Math.min(...chains.map((ch) => ch.length));
  while (common < shortest && chains.every((ch) => ch[common] === chains[0][common])) common += 1;
  // Chains that agree to their very end belong to a single shape: its pieces of ink are the parts.
  const lists = common < shortest ? [...groupAt(c.shapes, common).values()] : [];
  if (lists.length >= 2) {
    const regions = lists.map((list) => inkOfShapes(list, tol, budget, check));
    const parts = regions.map((r) => ({ box: boxOf(r), inkAreaUnits2: regionArea(r) })).filter((p) => p.inkAreaUnits2 > 0);
    check();
    return { region: unionRegions(regions), parts };
  }
  const region = inkOfShapes(c.shapes, tol, budget, check);
  const pieces = splitComponents(region);
  const parts = pieces && pieces.length > 1 ? pieces.map((p) => ({ box: p.box, inkAreaUnits2: p.areaUnits2 })) : [{ box: boxOf(region), inkAreaUnits2: regionArea(region) }];
  return { region, parts };
}

function labelOf(el: XmlElement): string | undefined {
  const dl = el.attrs['data-label'] ?? el.attrs['aria-label'];
  // Cut at a grapheme boundary: a cut by UTF-16 units can split an emoji into a lone surrogate.
  if (dl && dl.trim()) return shortenText(dl.trim(), 80).text;
  const title = el.children.find((c) => c.name === 'title');
  if (title && title.text.trim()) return shortenText(title.text.trim(), 80).text;
  return undefined;
}

function fileValueOf(els: readonly XmlElement[]): number | undefined {
  for (const el of els) {
    const v = el.attrs['data-value'];
    if (v !== undefined && /^\s*[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?\s*$/.test(v)) return Number(v);
  }
  return undefined;
}

/**
 * The only mark is one element holding copies of one glyph in several rows (or columns): a unit chart
 * whose glyphs were merged into one path. Each row becomes a mark, so the chart can be read by count.
 */
function splitOnePathChart(mark: SvgMark, setAside: SetAside[]): SvgMark[] {
  const split = splitGlyphRows(mark.region);
  if (!split) return [mark];
  setAside.push({
    kind: 'not-a-mark',
    description: `${describe(mark.elements[0])} holds ${split.lines.reduce((n, l) => n + l.pieces.length, 0)} copies of one glyph in ${split.lines.length} ${split.axis}s: each ${split.axis} is read as a mark.`,
  });
  return split.lines.map((line, k) => {
    const id = `${mark.id}-${split.axis}-${k + 1}`;
    return {
      ...mark,
      id,
      label: id,
      box: boxOf(line.region),
      inkAreaUnits2: regionArea(line.region),
      parts: line.pieces.map((p) => ({ box: p.box, inkAreaUnits2: p.areaUnits2 })),
      region: line.region,
    };
  });
}

/** Find and measure the marks of an imported SVG, in document order (or in `markIds` order). */
export function findSvgMarks(imp: ImportedSvg, opts: FindMarksOptions = {}): FoundMarks {
  const setAside: SetAside[] = [];
  if (!imp.shapes.length) throw new TallyError('glyph-empty', 'The SVG paints nothing Tallyglyph can measure: there are no filled or stroked shapes.');
  const candidates = explicitCandidates(imp, opts, setAside) ?? structuralCandidates(imp, setAside);
  const check = deadline(imp.limits.timeLimitMs, opts.now ?? (() => Date.now()));
  const budget = newBudget(imp.limits.maxPathCommands, imp.limits.maxVertices);
  const extentBudget = newBudget(imp.limits.maxPathCommands, imp.limits.maxVertices);
  const extentBox = imp.viewBox ?? unionBox(imp.shapes.map((s) => coarseBox(s, extentBudget)));
  const extent = Math.max(extentBox.width, extentBox.height) || 1;
  const tol = extent * 1e-5;

  const measured: MeasuredCandidate[] = [];
  for (const c of candidates) {
    check();
    // Tolerance tied to the mark's own size, so small and large marks are flattened equally finely
    // and their ratios do not drift with their size on the page.
    const own = unionBox(c.shapes.map((s) => coarseBox(s, extentBudget)));
    const ownExtent = Math.max(own.width, own.height);
    const markTol = ownExtent > 0 ? ownExtent * 1e-5 : tol;
    const { region, parts } = partsOf(c, markTol, budget, check);
    const inkAreaUnits2 = regionArea(region);
    if (!(inkAreaUnits2 > 0) && !c.explicitId) {
      setAside.push({ kind: 'small', description: `${describe(c.elements[0])} paints no ink.` });
      continue;
    }
    measured.push({ ...c, region, box: boxOf(region), inkAreaUnits2, parts });
  }

  let groups: MeasuredCandidate[][];
  if (candidates.length && candidates[0].explicitId !== undefined) {
    groups = measured.map((m) => [m]);
  } else {
    const merge = mergeTouching(measured.map((m) => m.box), extent * 1e-6);
    for (const i of merge.connectors) {
      setAside.push({ kind: 'connector', description: `${describe(measured[i].elements[0])} touches and spans several separate marks: read as an axis, frame or background, not a mark.` });
    }
    groups = merge.groups.map((g) => g.map((i) => measured[i]));
  }

  const used = new Set<string>();
  let marks: SvgMark[] = groups.map((g, k) => {
    const elements = g.flatMap((c) => c.elements);
    const shapes = g.flatMap((c) => c.shapes);
    const region = g.length === 1 ? g[0].region : unionRegions(g.map((c) => c.region));
    const parts = g.length === 1 ? g[0].parts : g.map((c) => ({ box: c.box, inkAreaUnits2: c.inkAreaUnits2 }));
    let id = g[0].explicitId ?? elements.find((e) => e.attrs.id)?.attrs.id ?? `mark-${k + 1}`;
    while (used.has(id)) id = `${id}-${k + 1}`;
    used.add(id);
    const colours = [...new Set(shapes.filter((s) => s.fill).map((s) => fillColourOf(s.chain)).filter((c) => c !== null).map((c) => colourKey(c)))];
    const mark: SvgMark = {
      id,
      label: elements.map(labelOf).find((l) => l !== undefined) ?? id,
      box: boxOf(region),
      inkAreaUnits2: regionArea(region),
      parts,
      solidCues: solidCuesOf(shapes),
      colours: colours.slice(0, 8),
      elements,
      shapes,
      region,
    };
    const fv = fileValueOf(elements);
    if (fv !== undefined) mark.fileValue = fv;
    return mark;
  });

  if (!opts.markIds) {
    const largest = Math.max(0, ...marks.map((m) => m.inkAreaUnits2));
    const min = (opts.minInkFraction ?? 0.001) * largest;
    const small = marks.filter((m) => m.inkAreaUnits2 < min && !m.elements.some((e) => e.attrs[MARK_ATTRIBUTE] !== undefined || hasClass(e, 'tg-mark')));
    for (const m of small) setAside.push({ kind: 'small', description: `${describe(m.elements[0])} has under ${((opts.minInkFraction ?? 0.001) * 100).toFixed(1)}% of the largest mark's ink: read as text or decoration, not a mark.` });
    marks = marks.filter((m) => !small.includes(m));
  }
  if (!marks.length) throw new TallyError('glyph-empty', 'No marks were found in the SVG: nothing painted stands apart from the background.');
  const explicit = candidates.length > 0 && candidates[0].explicitId !== undefined;
  if (!explicit && marks.length === 1 && marks[0].elements.length === 1) marks = splitOnePathChart(marks[0], setAside);
  return { marks, setAside, toleranceUnits: tol };
}
