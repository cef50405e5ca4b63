// Checks a chart again after rasterising: each mark's ink as the renderer's pixels hold it, the lie factor
// recomputed from that pixel coverage, and whether the smallest glyph has enough pixels to stay honest.
import { SaxesParser } from 'saxes';
import { TallyError, type Warning } from '../../shared-core/errors';
import { DISTORTION_LIMITS, gate, lieFactors, summariseLieFactors, type VerifyReport } from '../../shared-core/integrity/index';
import { markCoveragesByRegion } from '../raster/index';

export interface RasterMarkCheck {
  id: string;
  label: string;
  value: number;
  vectorInkMm2: number;
  /** The mark's ink in the raster: sum of alpha / 255 over its pixels, in mm² of the page. */
  rasterInkMm2: number;
  /** rasterInkMm2 / vectorInkMm2 (1 when the raster keeps the ink exactly); null for a mark without ink. */
  inkRatio: number | null;
  /** The reading's quantity recomputed from pixels (same unit as the vector report's graphic). */
  graphic: number;
  areaPx: number;
  perimeterPx: number;
  /** Estimated relative area error of the mark once its edge pixels are reproduced imprecisely (see estimateEdgeError). */
  edgeErrorEstimate: number | null;
}

export interface RasterCheck {
  pass: boolean;
  ppi: number;
  lieFactor: VerifyReport['lieFactor'];
  spread: number | null;
  marks: RasterMarkCheck[];
  /** The smallest single glyph in pixels, with its estimated edge error. */
  smallestGlyph: { markId: string; label: string; areaPx: number; perimeterPx: number; edgeErrorEstimate: number } | null;
  /** Lowest resolution (in steps of 50 ppi) at which every glyph keeps its edge error estimates within bounds, when this one does not. */
  suggestedPpi: number | null;
  problems: string[];
  warnings: Warning[];
  suggestions: string[];
  reason?: string;
}

export interface RasterCheckOptions {
  ppi?: number;
  /** Edge error estimate that refuses the raster; default the gate's own tolerance, 0.05. */
  maxEdgeError?: number;
  /** Edge error estimate that warns; default half the tolerance (two marks' errors meet in one ratio). */
  warnEdgeError?: number;
}

const MM_PER_INCH = 25.4;
/** Containers whose children are not drawn in place. */
const NOT_DRAWN = new Set(['defs', 'symbol', 'clipPath', 'mask', 'pattern', 'marker', 'metadata', 'style', 'title', 'desc']);
const PAINTS = new Set(['path', 'rect', 'circle', 'ellipse', 'line', 'polyline', 'polygon', 'use', 'image', 'text']);
const NON_MARK_CLASSES = ['tg-text', 'tg-legend-key', 'tg-rule', 'tg-background'];

/**
 * Relative area error of a shape of `areaPx` pixels with `perimeterPx` pixels of outline once the PNG is
 * shown, resampled or printed by another program. Interior pixels are certain; each edge pixel (about one
 * per pixel of outline) holds a partial coverage that another device reproduces only approximately.
 * Model (a rule of thumb; common practice, no source): each edge pixel off by an error uniform on
 * ±0.5 px, independent of the others, so the total has a standard deviation of sqrt(E / 12) px, and three
 * standard deviations bound it: 3·sqrt(perimeterPx / 12) / areaPx. Checked in the tests against resvg's own
 * anti-aliased rendering of bundled glyphs at random sub-pixel offsets, which stays within it.
 */
export function estimateEdgeError(areaPx: number, perimeterPx: number): number {
  if (!(areaPx > 0)) return Infinity;
  return (3 * Math.sqrt(Math.max(0, perimeterPx) / 12)) / areaPx;
}

/**
 * The same for a consumer that drops anti-aliasing and snaps each edge pixel in or out (some RIPs, 1-bit
 * workflows): besides the random part, the edge shifts by about an eighth of a pixel one way, so add
 * perimeterPx / 8 / areaPx. The eighth is fitted to resvg's crispEdges rendering (no source), which it
 * bounds in the tests; the strict worst case, every edge pixel off by half a pixel, is 0.5·perimeterPx / areaPx.
 */
export function thresholdEdgeError(areaPx: number, perimeterPx: number): number {
  if (!(areaPx > 0)) return Infinity;
  return Math.max(0, perimeterPx) / 8 / areaPx + estimateEdgeError(areaPx, perimeterPx);
}

interface Span {
  start: number;
  end: number;
  prefix: string;
}

interface TagContext {
  name: string;
  attrs: Record<string, string>;
  insideMark: boolean;
}

/**
 * The SVG with every element `hide` picks wrapped in `<g display="none">` (a hidden container hides all
 * its descendants, whatever their own style says), found with a real XML parser and cut at its exact
 * character span. Descendants of a hidden element are not visited; neither are definitions.
 */
export function hideElements(svg: string, hide: (tag: TagContext) => boolean): string {
  const parser = new SaxesParser({ position: true });
  const spans: Span[] = [];
  // Per open element: whether it starts a hidden span, is inside a mark, or is a definition container.
  const open: { start: number; hidden: boolean; mark: boolean; defs: boolean; prefix: string }[] = [];
  let hiddenDepth = 0;
  let defsDepth = 0;
  let markDepth = 0;
  parser.on('opentagstart', (tag) => {
    const start = svg.lastIndexOf('<', parser.position - 1);
    const colon = tag.name.indexOf(':');
    open.push({ start, hidden: false, mark: false, defs: false, prefix: colon > 0 ? tag.name.slice(0, colon) : '' });
  });
  parser.on('opentag', (tag) => {
    const entry = open[open.length - 1];
    const colon = tag.name.indexOf(':');
    const name = colon >= 0 ? tag.name.slice(colon + 1) : tag.name;
    const attrs = tag.attributes as Record<string, string>;
    const classes = (attrs.class ?? '').split(/\s+/);
    if (NOT_DRAWN.has(name)) {
      entry.defs = true;
      defsDepth += 1;
    }
    const isMark = classes.includes('tg-mark');
    if (hiddenDepth === 0 && defsDepth === 0 && open.length > 1 && hide({ name, attrs, insideMark: markDepth > 0 })) {
      entry.hidden = true;
      hiddenDepth += 1;
    }
    if (isMark) {
      entry.mark = true;
      markDepth += 1;
    }
  });
  parser.on('closetag', () => {
    const entry = open.pop();
    if (!entry) return;
    if (entry.defs) defsDepth -= 1;
    if (entry.mark) markDepth -= 1;
    if (entry.hidden) {
      hiddenDepth -= 1;
      spans.push({ start: entry.start, end: parser.position, prefix: entry.prefix });
    }
  });
  try {
    parser.write(svg).close();
  } catch (e) {
    throw new TallyError('svg-malformed', `The SVG is not well-formed XML: ${(e as Error).message}`);
  }
  spans.sort((a, b) => a.start - b.start);
  const parts: string[] = [];
  let at = 0;
  for (const span of spans) {
    const g = span.prefix ? `${span.prefix}:g` : 'g';
    parts.push(svg.slice(at, span.start), `<${g} display="none">`, svg.slice(span.start, span.end), `</${g}>`);
    at = span.end;
  }
  parts.push(svg.slice(at));
  return parts.join('');
}

/** Only the data marks stay visible: text, legend, rules, background and any other artwork are hidden. */
export function marksOnlySvg(svg: string): string {
  return hideElements(svg, ({ name, attrs, insideMark }) => {
    if (insideMark) return false;
    const classes = (attrs.class ?? '').split(/\s+/);
    if (classes.includes('tg-mark')) return false;
    if (NON_MARK_CLASSES.some((c) => classes.includes(c))) return true;
    return PAINTS.has(name);
  });
}

/** Marks only, and of each mark only the pieces of one part (e.g. the filled share of fill glyphs). */
export function marksOnlyPartSvg(svg: string, part: 'full' | 'partial' | 'filled' | 'rest'): string {
  return hideElements(marksOnlySvg(svg), ({ attrs, insideMark }) => insideMark && attrs['data-part'] !== undefined && attrs['data-part'] !== part);
}

function round(n: number, digits = 3): string {
  return String(Number(n.toPrecision(digits)));
}

/**
 * Re-measures a verified chart in pixels at `ppi` (default 300): renders each mark alone with resvg and sums
 * its alpha, recomputes the reading and Tufte's lie factor from that coverage, and judges whether the
 * smallest glyph has enough pixels. Never throws for a failing raster: it returns pass false with reasons.
 */
export function verifyRaster(svg: string, report: VerifyReport, opts: RasterCheckOptions = {}): RasterCheck {
  const ppi = opts.ppi ?? 300;
  const maxEdge = opts.maxEdgeError ?? DISTORTION_LIMITS.high - 1;
  const warnEdge = opts.warnEdgeError ?? maxEdge / 2;
  const pxPerMm = ppi / MM_PER_INCH;
  // Each mark's pixels on the full page, exactly as in the PNG (a crop of the page to the mark's box would
  // make resvg round its edges a little differently: about 1e-3 off, measured). Marks whose boxes lie apart
  // share one render and are summed over their own boxes (see markCoveragesByRegion).
  const boxes = report.marks.map((m) => ({ id: m.id, boxMm: m.boxMm }));
  const byRegion = { ppi, bleedMm: report.page.bleedMm };
  const whole = markCoveragesByRegion(marksOnlySvg(svg), boxes, byRegion).map((c) => c.mm2);
  const filled = report.reading === 'fill' ? markCoveragesByRegion(marksOnlyPartSvg(svg, 'filled'), boxes, byRegion).map((c) => c.mm2) : null;

  const marks: RasterMarkCheck[] = report.marks.map((m, i) => {
    const cov = whole[i];
    const inkRatio = m.inkMm2 > 0 ? cov / m.inkMm2 : null;
    let graphic: number;
    if (report.reading === 'area') graphic = cov;
    else if (report.reading === 'fill') graphic = cov > 0 ? (filled as number[])[i] / cov : 0;
    // Count and length are proportional to the mark's ink at a fixed glyph and pitch, so the raster scales them by its ink ratio.
    else graphic = inkRatio === null ? cov : m.graphic * inkRatio;
    const areaPx = m.inkMm2 * pxPerMm * pxPerMm;
    const perimeterPx = m.perimeterMm * pxPerMm;
    return {
      id: m.id,
      label: m.label,
      value: m.value,
      vectorInkMm2: m.inkMm2,
      rasterInkMm2: cov,
      inkRatio,
      graphic,
      areaPx,
      perimeterPx,
      edgeErrorEstimate: m.inkMm2 > 0 ? estimateEdgeError(areaPx, perimeterPx) : null,
    };
  });

  const problems: string[] = [];
  const warnings: Warning[] = [];
  const suggestions: string[] = [];

  const lf = lieFactors(marks.map((m, i) => ({ label: lieLabel(report, i), data: m.value, graphic: m.graphic })));
  const verdict = gate(lf, { low: report.limits.low, high: report.limits.high, mode: report.mode, reading: report.reading });
  for (const p of verdict.problems) problems.push(`In the ${ppi} ppi raster: ${p}`);

  // The smallest single glyph in pixels, for the report.
  let smallestGlyph: RasterCheck['smallestGlyph'] = null;
  if (report.smallestGlyph) {
    const areaPx = report.smallestGlyph.inkMm2 * pxPerMm * pxPerMm;
    const perimeterPx = report.smallestGlyph.perimeterMm * pxPerMm;
    smallestGlyph = { markId: report.smallestGlyph.markId, label: report.smallestGlyph.label, areaPx, perimeterPx, edgeErrorEstimate: estimateEdgeError(areaPx, perimeterPx) };
  }
  // The smallest glyph and the worst mark against the edge error budget: refuse when even an anti-aliased
  // copy may miss the tolerance, warn when one that drops anti-aliasing may.
  const candidates: { label: string; areaPx: number; perimeterPx: number; what: string }[] = [];
  if (smallestGlyph) candidates.push({ label: smallestGlyph.label, areaPx: smallestGlyph.areaPx, perimeterPx: smallestGlyph.perimeterPx, what: 'the smallest glyph' });
  for (const m of marks) if (m.value > 0 && m.areaPx > 0) candidates.push({ label: m.label, areaPx: m.areaPx, perimeterPx: m.perimeterPx, what: 'the mark' });
  const worstBy = (f: (a: number, p: number) => number) =>
    candidates.reduce<{ c: (typeof candidates)[number]; error: number } | null>((w, c) => {
      const error = f(c.areaPx, c.perimeterPx);
      return !w || error > w.error ? { c, error } : w;
    }, null);
  const aa = worstBy(estimateEdgeError);
  const th = worstBy(thresholdEdgeError);
  let suggestedPpi: number | null = null;
  const fits = (scale: number) =>
    candidates.every((c) => estimateEdgeError(c.areaPx * scale * scale, c.perimeterPx * scale) <= warnEdge && thresholdEdgeError(c.areaPx * scale * scale, c.perimeterPx * scale) <= maxEdge);
  if ((aa && aa.error > warnEdge) || (th && th.error > maxEdge)) {
    // The smallest resolution, in steps of 50 ppi, at which every glyph keeps both estimates within bounds.
    for (let p = Math.ceil(ppi / 50) * 50; p <= 4800; p += 50) {
      if (p > ppi && fits(p / ppi)) {
        suggestedPpi = p;
        break;
      }
    }
  }
  const pct = (x: number) => `${round(x * 100, 2)}%`;
  if (aa && aa.error > maxEdge) {
    problems.push(
      `At ${ppi} ppi ${aa.c.what} ("${aa.c.label}") is only ${round(aa.c.areaPx)} pixels of ink with about ${round(aa.c.perimeterPx)} edge pixels: ` +
        `its area could be off by about ${pct(aa.error)} once the PNG is resampled or printed (rule of thumb), more than the gate's ${pct(maxEdge)}.`,
    );
    suggestions.push(`Export at ${suggestedPpi ?? Math.ceil((2 * ppi) / 50) * 50} ppi or more, or draw the glyphs larger.`);
  } else if (aa && aa.error > warnEdge) {
    warnings.push({
      code: 'raster-small-glyph',
      message: `At ${ppi} ppi ${aa.c.what} ("${aa.c.label}") is ${round(aa.c.areaPx)} pixels of ink; resampling could change its area by about ${pct(aa.error)} (rule of thumb). ${suggestedPpi ? `Consider ${suggestedPpi} ppi.` : ''}`.trim(),
    });
  } else if (th && th.error > maxEdge) {
    warnings.push({
      code: 'raster-threshold',
      message:
        `At ${ppi} ppi "${th.c.label}" has ${round(th.c.perimeterPx)} edge pixels for ${round(th.c.areaPx)} pixels of ink: a printer or program that drops anti-aliasing could change its area by about ${pct(th.error)} ` +
        `(rule of thumb). ${suggestedPpi ? `${suggestedPpi} ppi would keep it within ${pct(maxEdge)}.` : 'Use the SVG for print.'}`,
    });
  }
  for (const m of marks) {
    if (m.inkRatio !== null && Math.abs(m.inkRatio - 1) > maxEdge) {
      warnings.push({ code: 'raster-ink-drift', message: `"${m.label}" keeps ${round(m.inkRatio * 100, 4)}% of its ink in the raster.` });
    }
  }
  if (!verdict.pass) {
    // The vector file passed, so the raster lost ink: cut off at the page edge, or too few pixels per glyph.
    const cut = marks.filter((m) => m.inkRatio !== null && m.inkRatio < 1 - maxEdge);
    const higher = Math.max(300, Math.ceil((2 * ppi) / 50) * 50);
    suggestions.unshift(`Export at ${higher} ppi or more, so the pixels along each glyph's edge change its ink less; or draw the glyphs larger.`);
    if (cut.length) suggestions.unshift(`Part of "${cut[0].label}" lies outside the page and is cut off in the PNG: keep every mark inside the page.`);
  }

  const out: RasterCheck = {
    pass: problems.length === 0,
    ppi,
    lieFactor: summariseLieFactors(lf),
    spread: lf.spread,
    marks,
    smallestGlyph,
    suggestedPpi,
    problems,
    warnings,
    suggestions: problems.length ? suggestions : [],
  };
  if (problems.length) out.reason = problems[0];
  return out;
}

function lieLabel(report: VerifyReport, i: number): string {
  const m = report.marks[i];
  return report.marks.findIndex((o) => o.label === m.label) === i ? m.label : `${m.label} (${m.id})`;
}
