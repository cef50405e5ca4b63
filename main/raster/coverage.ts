// Ink measured by a rasteriser: the sum of alpha over pixels, a check on geometric area computations.

import { SaxesParser } from 'saxes';
import { TallyError } from '../../shared-core/errors';
import { rasterSizePx, readSvgPageSize, renderSvgPixels } from './rasterizeSvg';

/** A rectangle of whole pixels; fractional edges widen to whole pixels, and it is clipped to the image. */
export interface PixelRegion {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface MarkCoverage {
  id: string;
  /** Ink in pixel units (sum of alpha / 255). */
  px: number;
  /** The same ink in square millimetres of the page. */
  mm2: number;
}

/**
 * Sum of alpha / 255 over the image or a region, in pixel units. Summing coverage rather than counting
 * pixels with any ink keeps anti-aliased edges honest (counting over-counts every edge).
 * `pixels` is RGBA with alpha in every fourth byte (premultiplied or not: alpha is the same).
 */
export function alphaCoverage(pixels: Uint8Array, widthPx: number, heightPx: number, region?: PixelRegion): number {
  if (!Number.isInteger(widthPx) || !Number.isInteger(heightPx) || widthPx < 0 || heightPx < 0 || pixels.length !== widthPx * heightPx * 4) {
    throw new TallyError('raster-invalid', `The pixel buffer (${pixels.length} bytes) does not match a ${widthPx} x ${heightPx} RGBA image.`);
  }
  let x0 = 0;
  let y0 = 0;
  let x1 = widthPx;
  let y1 = heightPx;
  if (region) {
    x0 = Math.max(0, Math.floor(region.x));
    y0 = Math.max(0, Math.floor(region.y));
    x1 = Math.min(widthPx, Math.ceil(region.x + region.width));
    y1 = Math.min(heightPx, Math.ceil(region.y + region.height));
  }
  // Integer sum, divided once: exact up to 2^53 / 255 pixels.
  let alphaTotal = 0;
  for (let y = y0; y < y1; y++) {
    const rowStart = (y * widthPx + x0) * 4 + 3;
    const rowEnd = (y * widthPx + x1) * 4;
    for (let i = rowStart; i < rowEnd; i += 4) alphaTotal += pixels[i];
  }
  return alphaTotal / 255;
}

/** Total ink of an SVG in square millimetres of its page, rendered by resvg at `ppi` (default 300). */
export function coverageMm2(svg: string, options: { ppi?: number } = {}): number {
  const raster = renderSvgPixels(svg, { ppi: options.ppi ?? 300 });
  // The true scale (page width / pixel width) rather than 25.4 / ppi: the width was rounded to whole pixels.
  return alphaCoverage(raster.pixels, raster.widthPx, raster.heightPx) * raster.mmPerPx * raster.mmPerPx;
}

interface ElementSpan {
  id: string;
  /** Index of the start tag's '<'. */
  start: number;
  /** Index just after the end tag's '>' (or the self-closing tag's). */
  end: number;
  /** Namespace prefix of the element, reused for the wrapper so it lands in the same namespace. */
  prefix: string;
}

/**
 * Finds each element whose id is in `ids`, with its exact character span in the source text.
 * Uses a real XML parser (saxes) so ids inside comments, CDATA or attribute values are never matched.
 */
function findElementSpans(svg: string, ids: readonly string[]): ElementSpan[] {
  const wanted = new Set(ids);
  if (wanted.size !== ids.length) throw new TallyError('svg-malformed', 'The same mark id is listed twice.');
  const parser = new SaxesParser({ position: true });
  const open: Array<{ id: string | null; start: number; prefix: string }> = [];
  const found = new Map<string, ElementSpan>();
  let insideMark: string | null = null;
  parser.on('opentagstart', (tag) => {
    // saxes has consumed the name and one following character; the '<' is the last one before them.
    const start = svg.lastIndexOf('<', parser.position - 1);
    const colon = tag.name.indexOf(':');
    open.push({ id: null, start, prefix: colon > 0 ? tag.name.slice(0, colon) : '' });
  });
  parser.on('opentag', (tag) => {
    const entry = open[open.length - 1];
    const id = tag.attributes.id;
    if (typeof id === 'string' && wanted.has(id)) {
      if (found.has(id)) throw new TallyError('svg-malformed', `More than one element has the id "${id}".`);
      if (insideMark !== null) throw new TallyError('svg-malformed', `Mark "${id}" sits inside mark "${insideMark}", so the two cannot be measured apart.`);
      entry.id = id;
      insideMark = id;
    }
  });
  parser.on('closetag', () => {
    const entry = open.pop();
    if (entry?.id) {
      found.set(entry.id, { id: entry.id, start: entry.start, end: parser.position, prefix: entry.prefix });
      insideMark = null;
    }
  });
  try {
    parser.write(svg).close();
  } catch (e) {
    if (e instanceof TallyError) throw e;
    throw new TallyError('svg-malformed', `The SVG is not well-formed XML: ${(e as Error).message}`);
  }
  const missing = ids.filter((id) => !found.has(id));
  if (missing.length > 0) throw new TallyError('svg-malformed', `The SVG has no element with the id "${missing[0]}".`);
  return [...found.values()].sort((a, b) => a.start - b.start);
}

function hideSpans(svg: string, spans: readonly ElementSpan[], keep: string | ReadonlySet<string>): string {
  const kept = typeof keep === 'string' ? (id: string) => id === keep : (id: string) => keep.has(id);
  const parts: string[] = [];
  let at = 0;
  for (const span of spans) {
    if (kept(span.id)) continue;
    const g = span.prefix ? `${span.prefix}:g` : 'g';
    parts.push(svg.slice(at, span.start), `<${g} display="none">`, svg.slice(span.start, span.end), `</${g}>`);
    at = span.end;
  }
  parts.push(svg.slice(at));
  return parts.join('');
}

/**
 * The SVG with every element listed in `markIds` hidden except `keepId`. Each hidden element is wrapped in
 * `<g display="none">`: a hidden container hides all its descendants whatever their own display or style
 * says, and no attribute of the mark is touched, so nothing can clash with an existing `display` or `style`.
 * Limits: a `<use>` elsewhere that points at a hidden mark still draws it; selectors that depend on the
 * exact parent (`svg > g`) see the wrapper. Ink outside the listed marks (a background, labels) stays;
 * list its id too to hide it.
 */
export function isolateMark(svg: string, keepId: string, markIds: readonly string[]): string {
  const ids = markIds.includes(keepId) ? markIds : [...markIds, keepId];
  return hideSpans(svg, findElementSpans(svg, ids), keepId);
}

/** One isolated variant per mark (see isolateMark), built lazily from a single parse. */
export function* isolateEachMark(svg: string, markIds: readonly string[]): Generator<{ id: string; svg: string }> {
  const spans = findElementSpans(svg, markIds);
  for (const id of markIds) yield { id, svg: hideSpans(svg, spans, id) };
}

/** Ink of each mark measured alone (every other listed mark hidden), by resvg at `ppi` (default 300). */
export function markCoverages(svg: string, markIds: readonly string[], options: { ppi?: number } = {}): MarkCoverage[] {
  const ppi = options.ppi ?? 300;
  const out: MarkCoverage[] = [];
  for (const variant of isolateEachMark(svg, markIds)) {
    const raster = renderSvgPixels(variant.svg, { ppi });
    const px = alphaCoverage(raster.pixels, raster.widthPx, raster.heightPx);
    out.push({ id: variant.id, px, mm2: px * raster.mmPerPx * raster.mmPerPx });
  }
  return out;
}

/** A mark for markCoveragesByRegion: its id and the bounding box of its ink in page millimetres (origin at the trim corner). */
export interface MarkBox {
  id: string;
  boxMm: { x: number; y: number; width: number; height: number } | null;
}

/**
 * Pixels around a box that anti-aliasing may touch: a rasteriser colours a pixel only where the shape
 * covers part of it, so one pixel each way is enough; two leave room for float rounding of the box.
 */
const EDGE_PX = 2;

/**
 * The same figures as markCoverages (each mark's ink as if rendered alone on the page), with far fewer
 * renders: marks whose pixel boxes (grown by EDGE_PX) do not meet share one render, and each mark's alpha
 * is summed over its own box. No other mark of that render touches those pixels, so the sum is exactly the
 * one a render of the mark alone gives. The boxes come from the vector verification of the same file;
 * a mark with no box is rendered alone over the whole page, as before.
 */
export function markCoveragesByRegion(svg: string, marks: readonly MarkBox[], options: { ppi?: number; bleedMm: number }): MarkCoverage[] {
  const ppi = options.ppi ?? 300;
  const ids = marks.map((m) => m.id);
  const spans = findElementSpans(svg, ids);
  // The scale resvg renders at: the page width over its whole-pixel width (see renderSvgPixels).
  const page = readSvgPageSize(svg);
  const mmPerPx = page.widthMm / rasterSizePx(page, ppi).widthPx;
  const pixelBox = (b: NonNullable<MarkBox['boxMm']>): PixelRegion => {
    const x0 = Math.floor((b.x + options.bleedMm) / mmPerPx) - EDGE_PX;
    const y0 = Math.floor((b.y + options.bleedMm) / mmPerPx) - EDGE_PX;
    const x1 = Math.ceil((b.x + b.width + options.bleedMm) / mmPerPx) + EDGE_PX;
    const y1 = Math.ceil((b.y + b.height + options.bleedMm) / mmPerPx) + EDGE_PX;
    return { x: x0, y: y0, width: x1 - x0, height: y1 - y0 };
  };
  const meet = (a: PixelRegion, b: PixelRegion) => a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;
  // Greedy layers: each mark joins the first layer none of whose boxes it meets.
  const layers: { ids: Set<string>; boxes: Map<string, PixelRegion> }[] = [];
  const alone: string[] = [];
  for (const m of marks) {
    if (!m.boxMm) {
      alone.push(m.id);
      continue;
    }
    const box = pixelBox(m.boxMm);
    let layer = layers.find((l) => ![...l.boxes.values()].some((b) => meet(b, box)));
    if (!layer) layers.push((layer = { ids: new Set(), boxes: new Map() }));
    layer.ids.add(m.id);
    layer.boxes.set(m.id, box);
  }
  const out = new Map<string, MarkCoverage>();
  for (const layer of layers) {
    const raster = renderSvgPixels(hideSpans(svg, spans, layer.ids), { ppi });
    for (const [id, box] of layer.boxes) {
      const px = alphaCoverage(raster.pixels, raster.widthPx, raster.heightPx, box);
      out.set(id, { id, px, mm2: px * raster.mmPerPx * raster.mmPerPx });
    }
  }
  for (const id of alone) {
    const raster = renderSvgPixels(hideSpans(svg, spans, id), { ppi });
    const px = alphaCoverage(raster.pixels, raster.widthPx, raster.heightPx);
    out.set(id, { id, px, mm2: px * raster.mmPerPx * raster.mmPerPx });
  }
  return ids.map((id) => out.get(id) as MarkCoverage);
}
