// Ink of a glyph: the union of every painted fill and stroke, measured exactly as polygons.
import { TallyError, type Warning } from '../errors';
import { determinant, IDENTITY, type Matrix } from '../geometry/matrix';
import { boxOf, regionArea, regionCentroid, transformRegion, unionPaths, unionRegions, type Box, type Region } from '../geometry/region';
import { parseXml, type XmlLimits } from '../svg/parseXml';
import { collectShapes, type CollectOptions, type PaintedShape } from './collectShapes';
import { flattenPathData, newBudget, type FlattenBudget } from './flattenPath';
import { strokeRegion } from './strokeOutline';

export interface GlyphInk {
  /** The ink as a clean region in the glyph's own (viewBox) units, read under nonzero. */
  region: Region;
  /** Ink area in glyph units squared. */
  areaUnits2: number;
  /** Bounding box of the ink (not of the viewBox). */
  bbox: Box;
  centroid: { x: number; y: number };
  /** Ink area / bounding-box area: a circle gives π/4. */
  boxFraction: number;
  viewBox: Box | null;
  shapeCount: number;
  /** Flattening tolerance used, in glyph units. */
  toleranceUnits: number;
  warnings: Warning[];
}

export interface MeasureOptions extends CollectOptions {
  /** Flattening tolerance as a fraction of the glyph's extent (default 1e-5). */
  relativeTolerance?: number;
  xmlLimits?: Partial<XmlLimits>;
  maxCommands?: number;
  maxVertices?: number;
  /** Wall-clock budget for the whole measurement, in milliseconds (checked between shapes). */
  timeLimitMs?: number;
  now?: () => number;
}

export function measureGlyph(svg: string, opts: MeasureOptions = {}): GlyphInk {
  const root = parseXml(svg, opts.xmlLimits);
  const collected = collectShapes(root, opts);
  const warnings = [...collected.warnings];
  const extent = estimateExtent(collected.shapes, collected.viewBox);
  const tol = extent * (opts.relativeTolerance ?? 1e-5);
  const region = inkOfShapes(collected.shapes, tol, newBudget(opts.maxCommands, opts.maxVertices), deadline(opts));
  return summarise(region, collected.viewBox, collected.shapes.length, tol, warnings);
}

export function summarise(region: Region, viewBox: Box | null, shapeCount: number, tol: number, warnings: Warning[]): GlyphInk {
  const area = regionArea(region);
  const bbox = boxOf(region);
  if (!(area > 0)) {
    warnings.push({ code: 'empty-glyph', message: 'The glyph paints no ink (zero area): it cannot stand for a quantity.' });
  }
  const outside = inkOutsideViewBox(bbox, viewBox);
  if (outside) warnings.push(outside);
  return {
    region,
    areaUnits2: area,
    bbox,
    centroid: regionCentroid(region),
    boxFraction: bbox.width * bbox.height > 0 ? area / (bbox.width * bbox.height) : 0,
    viewBox,
    shapeCount,
    toleranceUnits: tol,
    warnings,
  };
}

function deadline(opts: MeasureOptions): () => void {
  const now = opts.now ?? (() => Date.now());
  const limit = opts.timeLimitMs ?? 20_000;
  const start = now();
  return () => {
    if (now() - start > limit) throw new TallyError('time-limit', `Measuring the glyph took longer than ${Math.round(limit / 1000)} s (time limit); simplify its outline.`);
  };
}

/** The union of all painted regions of a list of shapes, in root units. */
export function inkOfShapes(shapes: PaintedShape[], tol: number, budget: FlattenBudget, check: () => void = () => {}): Region {
  const parts: Region[] = [];
  for (const s of shapes) {
    check();
    if (s.fill) {
      const lines = flattenPathData(s.d, s.ctm, tol, budget);
      parts.push(unionPaths(lines.map((l) => l.points), s.fill.rule));
    }
    if (s.stroke) {
      // Stroke in the shape's own space, then transform: exact under non-uniform scale and skew.
      const scale = Math.sqrt(Math.abs(determinant(s.ctm))) || 1;
      const local = flattenPathData(s.d, IDENTITY, tol / scale, budget);
      parts.push(transformRegion(strokeRegion(local, s.stroke, tol / scale), s.ctm as Matrix));
    }
    check();
  }
  if (parts.length === 1) return parts[0];
  return unionRegions(parts);
}

function estimateExtent(shapes: PaintedShape[], viewBox: Box | null): number {
  if (viewBox) return Math.max(viewBox.width, viewBox.height);
  // No viewBox: a coarse flattening gives the size.
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  const budget = newBudget();
  for (const s of shapes) {
    for (const l of flattenPathData(s.d, s.ctm, Infinity, budget)) for (const p of l.points) {
      minX = Math.min(minX, p.x); maxX = Math.max(maxX, p.x);
      minY = Math.min(minY, p.y); maxY = Math.max(maxY, p.y);
    }
  }
  const e = Math.max(maxX - minX, maxY - minY);
  return Number.isFinite(e) && e > 0 ? e : 1;
}

function units(n: number): string {
  return String(Number(n.toPrecision(4)));
}

/**
 * A glyph whose ink runs past its viewBox is cut off wherever the SVG is shown in its own box (a browser, an
 * icon picker), while Tallyglyph measures and draws all of its ink: the designer should know the two differ.
 * Excursions under a thousandth of the box (under a pixel with the glyph shown 1000 px wide: stroke joins,
 * flattening) are ignored; four bundled glyphs reach 0.05 units past a 256-unit box that way.
 */
export function inkOutsideViewBox(bbox: Box, viewBox: Box | null): Warning | null {
  if (!viewBox || !(bbox.width > 0) || !(bbox.height > 0)) return null;
  const slack = 1e-3 * Math.max(viewBox.width, viewBox.height);
  const sides: string[] = [];
  const left = viewBox.x - bbox.x;
  const top = viewBox.y - bbox.y;
  const right = bbox.x + bbox.width - (viewBox.x + viewBox.width);
  const bottom = bbox.y + bbox.height - (viewBox.y + viewBox.height);
  if (left > slack) sides.push(`${units(left)} units past the left edge`);
  if (right > slack) sides.push(`${units(right)} units past the right edge`);
  if (top > slack) sides.push(`${units(top)} units above the top`);
  if (bottom > slack) sides.push(`${units(bottom)} units below the bottom`);
  if (sides.length === 0) return null;
  const vb = `${units(viewBox.x)} ${units(viewBox.y)} ${units(viewBox.width)} ${units(viewBox.height)}`;
  return {
    code: 'ink-outside-viewbox',
    message:
      `The ink reaches outside the glyph's viewBox (${vb}): ${sides.join(', ')}. Shown in its own box that part is cut off, ` +
      'but charts measure and draw all of it; redraw the glyph inside its box or widen the viewBox.',
  };
}
