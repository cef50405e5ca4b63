// Re-measures a written chart from its SVG text alone (docs/chart-svg.md): the ink of every mark under the
// chart's reading, Tufte's lie factor for every pair, the gate, and print preflight. It never sees the
// layout that produced the file. Beyond geometry it checks that marks show (not in the page's colour, not
// painted over, fill parts told apart); effects it cannot see (clip paths, masks) are warned about.
import { TallyError, type Warning } from '../errors';
import { boxOf, intersectRegions, regionArea, unionRegions, type Box, type Region } from '../geometry/region';
import { collectShapes, inkOfShapes, newBudget, type PaintedShape } from '../glyph/index';
import type { ChartSummary, Reading } from '../scene/types';
import type { XmlElement } from '../svg/parseXml';
import { readChartSvg, type ChartSvgFile, type ChartSvgMark, type ChartSvgPiece } from '../svg/readChartSvg';
import { measureText } from '../text/measureText';
import { DISTORTION_LIMITS, gate, type GateMode, type GateRounding } from './gate';
import { lieFactors, type LieFactorPair, type LieFactorReport } from './lieFactor';
import type { IntegrityFinding } from './check';
import { preflight, type Finding, type PartialGlyph, type PreflightOptions } from './preflight';
import { createShapeInkCache } from './shapeInk';

export interface VerifyOptions {
  /** Distortion limits; default Tufte's 0.95 and 1.05. */
  low?: number;
  high?: number;
  /**
   * Distance inside the trim edge that content should keep clear of. Default: the file's
   * data-safe-margin-mm, else 3 mm (a printer's usual safe zone; common practice, no source).
   */
  safeMarginMm?: number;
  preflight?: PreflightOptions;
  /** How the document rounds remainders; only sharpens the suggestions, never the verdict. */
  rounding?: GateRounding;
}

export interface MarkMeasurement {
  id: string;
  label: string;
  value: number;
  reading: Reading;
  /** The quantity the lie factor compares: glyphs (count), mm (length), mm² (area) or a share (fill). */
  graphic: number;
  graphicUnit: 'glyphs' | 'mm' | 'mm2' | 'share';
  /** All of the mark's ink (the union of its pieces), in mm². */
  inkMm2: number;
  /** Whether the mark has any ink: "not drawn" belongs on this row only when this is false. */
  drawn: boolean;
  /** Length of the ink's outline (outer rings and holes), in mm; used to judge raster precision. */
  perimeterMm: number;
  /** Glyphs drawn, partial ink included (count and length readings). */
  glyphs?: number;
  /** Ink of one of this mark's full glyphs, the unit of count (count and length readings). */
  unitInkMm2?: number;
  /** Stack pitch used for this mark's length. */
  pitchMm?: number;
  /** filled ink / (filled + rest ink) (fill reading). */
  fillShare?: number;
  pieces: { full: number; partial: number; filled: number; rest: number; other: number };
  /** Bounding box of the ink in page millimetres (origin at the top-left trim corner); null when empty. */
  boxMm: Box | null;
}

/** One lie-factor pair as it is reported and printed (no infinities, so it survives JSON). */
export type PairSummary = Pick<
  LieFactorPair,
  'label' | 'reference' | 'data' | 'graphic' | 'referenceData' | 'referenceGraphic' | 'dataRatio' | 'graphicRatio' | 'lieFactor' | 'basis' | 'problem'
>;

export interface VerifyReport {
  pass: boolean;
  mode: GateMode;
  reading: Reading;
  lieFactor: { worst: number | null; worstPair: { label: string; reference: string } | null; pairs: PairSummary[] };
  /** max(g/d) / min(g/d) over categories with a positive value: 1 when one scale serves them all. */
  spread: number | null;
  marks: MarkMeasurement[];
  /** The main reason for a refusal. */
  reason?: string;
  /** Every reason to refuse, most serious first; empty when the chart passes. */
  problems: string[];
  /** The same reasons with a stable code and the fix for each (blocking findings first). */
  findings: IntegrityFinding[];
  suggestions: string[];
  notes: string[];
  preflight: Finding[];
  warnings: Warning[];
  limits: { low: number; high: number };
  page: { widthMm: number; heightMm: number; bleedMm: number };
  /** The smallest single glyph (a full piece, or the smallest mark where marks are single glyphs). */
  smallestGlyph: { markId: string; label: string; inkMm2: number; perimeterMm: number } | null;
  /** The smallest ink actually drawn as one piece: partial glyphs included (what print preflight should name). */
  smallestInk: { markId: string; label: string; inkMm2: number; perimeterMm: number; part: 'full' | 'partial' | 'glyph' } | null;
  /** The summary embedded in the file, as found. */
  summary: ChartSummary | null;
}

/** Glyphs meant to be one and the same must agree this closely in ink (1%, far above measuring noise of ~1e-4). */
const SAME_GLYPH_TOLERANCE = 0.01;
/** Flattening tolerance in mm: marks are polygons already; this only matters for curves (text, hand-written files). */
const TOLERANCE_MM = 1e-4;
/** For ink that is only located and sized (text, rules): 10 µm, far below any preflight threshold. */
const ROUGH_TOLERANCE_MM = 0.01;
const DEFAULT_SAFE_MARGIN_MM = 3;
/** Below this much ink (a 0.3 mm square) a mark's area is at the mercy of coordinate rounding. */
const TINY_INK_MM2 = 0.1;

const MODE_OF_READING: Record<Reading, GateMode> = { count: 'repeat', length: 'stack', area: 'scale', fill: 'fill' };
const UNIT_OF_READING: Record<Reading, MarkMeasurement['graphicUnit']> = { count: 'glyphs', length: 'mm', area: 'mm2', fill: 'share' };

interface Ink {
  region: Region;
  areaMm2: number;
  perimeterMm: number;
  boxMm: Box | null;
}

type Owner =
  | { kind: 'mark'; mark: ChartSvgMark; piece: ChartSvgPiece | null }
  | { kind: 'legend'; index: number }
  | { kind: 'text'; index: number }
  | { kind: 'rule' }
  | { kind: 'background' }
  | { kind: 'other' };

/** Problems found in the file, each with its own stable code and the fix for that problem. */
class ProblemList {
  readonly findings: IntegrityFinding[] = [];
  get length(): number {
    return this.findings.length;
  }
  add(code: string, message: string, fix: string, category?: string): void {
    const finding: IntegrityFinding = { code, severity: 'blocking', message, fix };
    if (category !== undefined) finding.category = category;
    this.findings.push(finding);
  }
  messages(): string[] {
    return this.findings.map((f) => f.message);
  }
}

/** The one fix for a file whose own records disagree with its marks: only a hand edit (or a broken writer) does that. */
const REEXPORT_FIX = 'Export the chart again from its document; a file edited by hand no longer matches its data.';

function num(n: number): string {
  if (!Number.isFinite(n)) return String(n);
  if (Number.isInteger(n)) return String(n);
  return String(Number(n.toPrecision(4)));
}

function ringLength(ring: Region[number]): number {
  let s = 0;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) s += Math.hypot(ring[i].x - ring[j].x, ring[i].y - ring[j].y);
  return s;
}

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 ? s[mid] : (s[mid - 1] + s[mid]) / 2;
}

function relDiff(a: number, b: number): number {
  return Math.abs(a / b - 1);
}

/** Groups every painted shape by what it belongs to, using the chain of elements it is drawn through. */
function classify(file: ChartSvgFile, shapes: PaintedShape[]): Map<PaintedShape, Owner> {
  const markByEl = new Map<XmlElement, ChartSvgMark>();
  const pieceByEl = new Map<XmlElement, ChartSvgPiece>();
  for (const m of file.marks) {
    markByEl.set(m.element, m);
    for (const p of m.pieces) pieceByEl.set(p.element, p);
  }
  const legendByEl = new Map(file.legendKeys.map((k, i) => [k.element, i] as const));
  const textByEl = new Map(file.texts.map((t, i) => [t.element, i] as const));
  const rules = new Set(file.rules);
  const backgrounds = new Set(file.backgrounds);
  const out = new Map<PaintedShape, Owner>();
  for (const shape of shapes) {
    let owner: Owner = { kind: 'other' };
    let piece: ChartSvgPiece | null = null;
    for (let i = shape.chain.length - 1; i >= 0; i--) {
      const el = shape.chain[i];
      const p = pieceByEl.get(el);
      if (p && !piece) piece = p;
      const m = markByEl.get(el);
      if (m) {
        owner = { kind: 'mark', mark: m, piece };
        break;
      }
      const li = legendByEl.get(el);
      if (li !== undefined) {
        owner = { kind: 'legend', index: li };
        break;
      }
      const ti = textByEl.get(el);
      if (ti !== undefined) {
        owner = { kind: 'text', index: ti };
        break;
      }
      if (rules.has(el)) {
        owner = { kind: 'rule' };
        break;
      }
      if (backgrounds.has(el)) {
        owner = { kind: 'background' };
        break;
      }
    }
    out.set(shape, owner);
  }
  return out;
}

/**
 * Verifies a chart SVG that Tallyglyph wrote, from the text alone. Throws TallyError 'document-invalid'
 * for an SVG without Tallyglyph marks ("not a Tallyglyph chart; use audit"), 'svg-malformed' for an
 * unreadable file; everything measurable becomes a report with pass or refuse.
 */
export function verifySvg(svgText: string, opts: VerifyOptions = {}): VerifyReport {
  const low = opts.low ?? DISTORTION_LIMITS.low;
  const high = opts.high ?? DISTORTION_LIMITS.high;
  const file = readChartSvg(svgText);
  const { page, summary, reading } = file;
  const s = page.mmPerUnit;
  const collected = collectShapes(file.root);
  const warnings: Warning[] = [...file.warnings, ...collected.warnings];
  const owners = classify(file, collected.shapes);
  const budget = newBudget(2_000_000, 20_000_000);
  const tolUnits = TOLERANCE_MM / s;

  // Each distinct shape is measured once; its copies (every `use` of a glyph) are exact translates of it.
  const shapeInk = createShapeInkCache(budget);
  const inkOf = (shapes: PaintedShape[], tolerance = tolUnits): Ink => {
    if (shapes.length === 0) return { region: [], areaMm2: 0, perimeterMm: 0, boxMm: null };
    if (shapes.length === 1) {
      const one = shapeInk(shapes[0], tolerance);
      const b = one.boxUnits;
      return {
        get region() {
          return one.region();
        },
        areaMm2: one.areaUnits2 * s * s,
        perimeterMm: one.perimeterUnits * s,
        boxMm: b ? { x: b.x * s, y: b.y * s, width: b.width * s, height: b.height * s } : null,
      };
    }
    const region = inkOfShapes(shapes, tolerance, budget);
    return inkOfRegion(region);
  };
  // Text, rules and artwork are only placed and sized, never compared: a coarse outline is plenty.
  const roughInkOf = (shapes: PaintedShape[]): Ink => inkOf(shapes, ROUGH_TOLERANCE_MM / s);
  const inkOfRegion = (region: Region): Ink => {
    const area = regionArea(region);
    let perimeter = 0;
    for (const ring of region) perimeter += ringLength(ring);
    const b = boxOf(region);
    const boxMm = region.length && area > 0 ? { x: b.x * s, y: b.y * s, width: b.width * s, height: b.height * s } : null;
    return { region, areaMm2: area * s * s, perimeterMm: perimeter * s, boxMm };
  };

  // Shapes per mark piece, per legend key, per text; everything else is kept for the content box.
  const byPiece = new Map<ChartSvgPiece, PaintedShape[]>();
  const looseByMark = new Map<ChartSvgMark, PaintedShape[]>();
  const byLegend = new Map<number, PaintedShape[]>();
  const byText = new Map<number, PaintedShape[]>();
  const rest: { shape: PaintedShape; kind: Owner['kind'] }[] = [];
  const push = <K>(map: Map<K, PaintedShape[]>, key: K, shape: PaintedShape) => {
    const list = map.get(key);
    if (list) list.push(shape);
    else map.set(key, [shape]);
  };
  const markStrokes: string[] = [];
  for (const shape of collected.shapes) {
    const owner = owners.get(shape) as Owner;
    if (owner.kind === 'mark') {
      if (shape.stroke && !markStrokes.includes(owner.mark.id)) markStrokes.push(owner.mark.id);
      if (owner.piece) push(byPiece, owner.piece, shape);
      else push(looseByMark, owner.mark, shape);
    } else if (owner.kind === 'legend') push(byLegend, owner.index, shape);
    else if (owner.kind === 'text') push(byText, owner.index, shape);
    else rest.push({ shape, kind: owner.kind });
  }
  if (markStrokes.length) {
    warnings.push({ code: 'mark-stroked', message: `Marks ${markStrokes.slice(0, 5).join(', ')} are stroked; strokes are measured as ink, but the format expects filled pieces only.` });
  }

  const problems = new ProblemList();
  const suggestions: string[] = [];
  const notes: string[] = [];

  // ---- ink of every piece and every mark
  interface MarkInk {
    mark: ChartSvgMark;
    ink: Ink;
    pieces: { piece: ChartSvgPiece; ink: Ink }[];
    other: number;
  }
  const markInks: MarkInk[] = file.marks.map((mark) => {
    const pieces = mark.pieces.map((piece) => ({ piece, ink: inkOf(byPiece.get(piece) ?? []) }));
    const loose = looseByMark.get(mark) ?? [];
    const inks = pieces.map((p) => p.ink);
    if (loose.length) inks.push(inkOf(loose));
    return { mark, ink: unionInks(inks, inkOfRegion), pieces, other: loose.length };
  });
  const legendInks = file.legendKeys.map((_, i) => inkOf(byLegend.get(i) ?? []));
  checkInkShows(file, collected.shapes, owners, markInks, reading, problems, roughInkOf);

  const fulls = (mi: { pieces: PieceInk[] }) => mi.pieces.filter((p) => p.piece.part === 'full' && p.ink.areaMm2 > 0);

  // ---- the unit of count: each mark's own full glyphs, checked to be one size
  const unitByMark = new Map<ChartSvgMark, number>();
  if (reading === 'count' || reading === 'length') {
    for (const mi of markInks) {
      const f = fulls(mi);
      if (!f.length) continue;
      const inks = f.map((p) => p.ink.areaMm2);
      const mean = inks.reduce((a, b) => a + b, 0) / inks.length;
      const lo = Math.min(...inks);
      const hi = Math.max(...inks);
      if (hi / lo - 1 > SAME_GLYPH_TOLERANCE) {
        problems.add(
          'glyph-size-varies',
          `The glyphs of "${mi.mark.label}" are not all one size (ink from ${num(lo)} to ${num(hi)} mm²); every glyph must stand for the same amount.`,
          `Draw every whole glyph of "${mi.mark.label}" at one size, so each carries the same ink.`,
          mi.mark.label,
        );
      }
      unitByMark.set(mi.mark, mean);
    }
    checkSameShapeSameSize(markInks, fulls, legendInks, file, problems);
  }
  const chartUnit = unitByMark.size
    ? median([...unitByMark.values()])
    : legendInks.find((l) => l.areaMm2 > 0)?.areaMm2 ?? null;
  if ((reading === 'count' || reading === 'length') && chartUnit === null) {
    notes.push('No whole glyph is drawn anywhere (no full piece and no legend key), so counts are compared by ink alone.');
  }

  // ---- stack pitch, measured from the positions of successive slots
  const pitchByMark = new Map<ChartSvgMark, { pitch: number; start: number; axis: 'x' | 'y' } | null>();
  let chartPitch: number | null = null;
  if (reading === 'length') chartPitch = measurePitches(markInks, fulls, pitchByMark, problems, notes, summary, stackGrouping(file, problems));

  // ---- measure each mark under the reading
  const marks: MarkMeasurement[] = markInks.map((mi) => {
    const { mark, ink } = mi;
    const counts = { full: 0, partial: 0, filled: 0, rest: 0, other: mi.other };
    for (const p of mi.pieces) counts[p.piece.part] += 1;
    const m: MarkMeasurement = {
      id: mark.id,
      label: mark.label,
      value: mark.value,
      reading,
      graphic: 0,
      graphicUnit: UNIT_OF_READING[reading],
      inkMm2: ink.areaMm2,
      drawn: ink.areaMm2 > 0,
      perimeterMm: ink.perimeterMm,
      pieces: counts,
      boxMm: ink.boxMm,
    };
    if (reading === 'count' || reading === 'length') {
      const unit = unitByMark.get(mark) ?? chartUnit;
      const glyphs = unit ? ink.areaMm2 / unit : ink.areaMm2;
      m.glyphs = glyphs;
      if (unit) m.unitInkMm2 = unit;
      if (reading === 'count') m.graphic = glyphs;
      else {
        const pitch = pitchByMark.get(mark)?.pitch ?? chartPitch;
        if (pitch) m.pitchMm = pitch;
        m.graphic = pitch ? glyphs * pitch : glyphs;
      }
    } else if (reading === 'area') {
      m.graphic = ink.areaMm2;
    } else {
      let filled = 0;
      let unfilled = 0;
      for (const p of mi.pieces) {
        if (p.piece.part === 'filled') filled += p.ink.areaMm2;
        else if (p.piece.part === 'rest') unfilled += p.ink.areaMm2;
      }
      const share = filled + unfilled > 0 ? filled / (filled + unfilled) : 0;
      m.fillShare = share;
      m.graphic = share;
    }
    return m;
  });

  // ---- what the file says about itself: summary and legend against the marks
  checkSummary(file, marks, problems);
  checkAbsoluteScale(file, marks, problems, high);
  if (reading === 'area') checkScaleKeys(file, legendInks, marks, problems, high);

  // ---- Tufte's lie factor and the gate
  const labels = new Set<string>();
  const items = marks.map((m) => {
    const label = labels.has(m.label) ? `${m.label} (${m.id})` : m.label;
    labels.add(label);
    return { label, data: m.value, graphic: m.graphic };
  });
  const lf = lieFactors(items);
  const mode: GateMode = MODE_OF_READING[reading];
  const verdict = gate(lf, { low, high, mode, reading, ...(opts.rounding ? { rounding: opts.rounding } : {}) });
  const allProblems = [...verdict.problems, ...problems.messages()];
  if (!verdict.pass) {
    // Close values: the effect form divides the drawing's small error by a small data effect.
    const w = lf.worst;
    if (w && w.basis === 'effect' && w.lieFactor !== null && Math.abs(w.dataEffect) < 0.1) {
      suggestions.push(
        `"${w.label}" and "${w.reference}" differ by only ${num(Math.abs(w.dataEffect) * 100)}% in value, so the lie factor magnifies any drawing error ` +
          `${num(1 / Math.abs(w.dataEffect))}x: draw the glyphs larger (less rounding per glyph), or give such close values as text.`,
      );
    }
    // A sliver of ink cannot be drawn to within a few percent (coordinates are written to a micrometre).
    const ref = lf.reference !== null ? marks.find((m) => m.label === lf.reference) : undefined;
    const unitInk = ref?.unitInkMm2 ?? null;
    if (ref && ref.inkMm2 > 0 && (ref.inkMm2 < TINY_INK_MM2 || (unitInk !== null && ref.inkMm2 < 0.01 * unitInk))) {
      suggestions.push(
        `"${ref.label}" is drawn with only ${num(ref.inkMm2)} mm² of ink, too little to draw within a few percent: ` +
          'use a smaller unit or larger glyphs so every category gets more ink, or give the smallest values as text.',
      );
    }
  }
  for (const sgg of verdict.suggestions) if (!suggestions.includes(sgg)) suggestions.push(sgg);
  // Each problem's own fix, after the gate's, for the CLI's and the app's list of what to try.
  for (const f of problems.findings) if (!suggestions.includes(f.fix)) suggestions.push(f.fix);
  notes.push(...verdict.notes);

  const measured = summary?.measured;
  if (measured && measured.lieFactorWorst !== null && lf.worst?.lieFactor != null && Math.abs(measured.lieFactorWorst - lf.worst.lieFactor) > 0.005) {
    notes.push(`The file records a worst lie factor of ${num(measured.lieFactorWorst)}, but it measures ${num(lf.worst.lieFactor)} now.`);
  }

  // ---- preflight from the file's own geometry
  // Partial glyphs as measured: each partial piece's ink against its mark's full-glyph ink, for preflight's slivers.
  const partials: PartialGlyph[] = [];
  markInks.forEach((mi, i) => {
    const unit = marks[i].unitInkMm2;
    if (!unit || !(unit > 0)) return;
    for (const p of mi.pieces) {
      if (p.piece.part !== 'partial' || !(p.ink.areaMm2 > 0) || !p.ink.boxMm) continue;
      partials.push({ owner: `"${mi.mark.label}"`, share: p.ink.areaMm2 / unit, shortSideMm: Math.min(p.ink.boxMm.width, p.ink.boxMm.height) });
    }
  });
  const preflightFindings = preflightFromFile(file, collected.shapes, owners, markInks, legendInks, byText, rest, roughInkOf, opts, partials);

  const smallestGlyph = findSmallestGlyph(markInks, fulls, reading);
  const smallestInk = findSmallestInk(markInks, reading);

  const pass = allProblems.length === 0;
  const report: VerifyReport = {
    pass,
    mode,
    reading,
    lieFactor: summariseLieFactors(lf),
    spread: lf.spread,
    marks,
    problems: allProblems,
    findings: [...verdict.findings, ...problems.findings],
    suggestions: pass ? [] : suggestions,
    notes,
    preflight: preflightFindings,
    warnings,
    limits: { low, high },
    page: { widthMm: page.widthMm, heightMm: page.heightMm, bleedMm: page.bleedMm },
    smallestGlyph,
    smallestInk,
    summary,
  };
  if (!pass) report.reason = allProblems[0];
  return report;
}

/** A CSS colour as lower-case #rrggbb where it is a plain colour we can read; otherwise as written. */
export function normaliseColour(paint: string | undefined): string {
  const p = (paint ?? '#000000').trim().toLowerCase();
  const named: Record<string, string> = { white: '#ffffff', black: '#000000' };
  if (named[p]) return named[p];
  const short = /^#([0-9a-f])([0-9a-f])([0-9a-f])$/.exec(p);
  if (short) return `#${short[1]}${short[1]}${short[2]}${short[2]}${short[3]}${short[3]}`;
  const rgb = /^rgb\(\s*(\d+)\s*,\s*(\d+)\s*,\s*(\d+)\s*\)$/.exec(p);
  if (rgb) return '#' + rgb.slice(1, 4).map((n) => Math.min(255, Number(n)).toString(16).padStart(2, '0')).join('');
  return p;
}

/**
 * Geometry alone does not make a chart honest: the ink must also show. Refuses marks painted in the
 * paper's colour, fill charts whose filled and unfilled parts share one colour, and anything painted
 * over a mark after it (which would hide ink the measurement still counts).
 */
function checkInkShows(
  file: ChartSvgFile,
  shapes: PaintedShape[],
  owners: Map<PaintedShape, Owner>,
  markInks: { mark: ChartSvgMark; ink: Ink }[],
  reading: Reading,
  problems: ProblemList,
  roughInkOf: (shapes: PaintedShape[]) => Ink,
): void {
  const paper = file.backgrounds.length ? normaliseColour(backgroundPaint(file.backgrounds[file.backgrounds.length - 1])) : '#ffffff';
  const paints = new Map<ChartSvgMark, { all: Set<string>; filled: Set<string>; rest: Set<string> }>();
  shapes.forEach((shape) => {
    const owner = owners.get(shape);
    if (owner?.kind !== 'mark') return;
    const entry = paints.get(owner.mark) ?? { all: new Set<string>(), filled: new Set<string>(), rest: new Set<string>() };
    paints.set(owner.mark, entry);
    const colour = shape.fill ? normaliseColour(shape.fill.paint) : shape.stroke ? 'stroke' : paper;
    entry.all.add(colour);
    if (owner.piece?.part === 'filled') entry.filled.add(colour);
    if (owner.piece?.part === 'rest') entry.rest.add(colour);
  });
  for (const [mark, p] of paints) {
    if (p.all.size === 1 && p.all.has(paper)) {
      problems.add(
        'ink-page-coloured',
        `"${mark.label}" is painted in the colour of the page (${paper}), so a reader sees nothing of it; give it a colour that shows.`,
        `Give "${mark.label}" a colour that stands out from the page (${paper}).`,
        mark.label,
      );
    }
    if (reading === 'fill' && p.filled.size && p.rest.size && [...p.filled].every((c) => p.rest.has(c))) {
      problems.add(
        'fill-parts-same-colour',
        `The filled and unfilled parts of "${mark.label}" are the same colour, so the fill cannot be seen; paint the unfilled part paler.`,
        `Paint the unfilled part of "${mark.label}" in a paler colour than its filled part.`,
        mark.label,
      );
    }
  }
  // Anything painted after a mark that lands on its ink hides part of it.
  const firstMarkAt = shapes.findIndex((sh) => owners.get(sh)?.kind === 'mark');
  if (firstMarkAt < 0) return;
  const seen: { mark: ChartSvgMark; ink: Ink }[] = [];
  const inkByMark = new Map(markInks.map((mi) => [mi.mark, mi] as const));
  const reported = new Set<ChartSvgMark>();
  for (let i = firstMarkAt; i < shapes.length; i++) {
    const owner = owners.get(shapes[i]);
    if (owner?.kind === 'mark') {
      const mi = inkByMark.get(owner.mark);
      if (mi && !seen.includes(mi)) seen.push(mi);
      continue;
    }
    const over = roughInkOf([shapes[i]]);
    if (!over.boxMm) continue;
    for (const mi of seen) {
      if (reported.has(mi.mark) || !mi.ink.boxMm || !boxesMeet(over.boxMm, mi.ink.boxMm)) continue;
      const s = file.page.mmPerUnit;
      const hidden = regionArea(intersectRegions(over.region, mi.ink.region)) * s * s;
      if (hidden > 1e-6 * Math.max(mi.ink.areaMm2, 1e-9)) {
        reported.add(mi.mark);
        const what = OVER_NAMES[owner?.kind ?? 'other'];
        problems.add(
          'painted-over',
          `Something painted after "${mi.mark.label}" covers ${num(hidden)} mm² of its ink (${what}), so the reader sees less than is measured; nothing may be drawn over a mark.`,
          `Make room so that nothing overlaps "${mi.mark.label}": a larger page, a larger unit (fewer glyphs) or fewer rows, so the marks, labels, key and text each fit in their own place.`,
          mi.mark.label,
        );
      }
    }
  }
}

/** What covered a mark, in words, by the kind of element it belongs to. */
const OVER_NAMES: Record<Owner['kind'], string> = {
  mark: 'another mark',
  legend: 'the key',
  text: 'text (a title, label or source line)',
  rule: 'a rule or baseline',
  background: 'a background',
  other: 'artwork',
};

function backgroundPaint(el: XmlElement): string | undefined {
  const style = /(?:^|;)\s*fill\s*:\s*([^;]+)/.exec(el.attrs.style ?? '')?.[1];
  return style ?? el.attrs.fill;
}

function boxesMeet(a: { x: number; y: number; width: number; height: number }, b: { x: number; y: number; width: number; height: number }): boolean {
  return a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;
}

/**
 * The union of several inks, running the (costly) polygon union only within groups whose bounding boxes
 * meet (boxes that merely touch count as meeting): inks in different groups cannot overlap, so the union
 * is their rings side by side, its area the sum of theirs.
 */
function unionInks(inks: Ink[], inkOfRegion: (region: Region) => Ink): Ink {
  const drawn = inks.filter((ink) => ink.boxMm !== null);
  if (drawn.length === 0) return { region: [], areaMm2: 0, perimeterMm: 0, boxMm: null };
  if (drawn.length === 1) return drawn[0];
  // Union-find over box overlaps. Boxes are binned on a grid of cells as large as the largest box, so each
  // box meets only boxes filed in the cells it covers (at most four): linear in the number of pieces.
  const boxes = drawn.map((ink) => ink.boxMm as Box);
  const cell = Math.max(...boxes.map((b) => Math.max(b.width, b.height))) || 1;
  const parent = drawn.map((_, i) => i);
  const find = (i: number): number => {
    while (parent[i] !== i) i = parent[i] = parent[parent[i]];
    return i;
  };
  const bins = new Map<string, number[]>();
  boxes.forEach((a, i) => {
    const x0 = Math.floor(a.x / cell);
    const x1 = Math.floor((a.x + a.width) / cell);
    const y0 = Math.floor(a.y / cell);
    const y1 = Math.floor((a.y + a.height) / cell);
    for (let cx = x0; cx <= x1; cx++) {
      for (let cy = y0; cy <= y1; cy++) {
        const key = `${cx},${cy}`;
        const bin = bins.get(key);
        if (!bin) {
          bins.set(key, [i]);
          continue;
        }
        for (const j of bin) {
          const b = boxes[j];
          if (b.x <= a.x + a.width && a.x <= b.x + b.width && b.y <= a.y + a.height && a.y <= b.y + b.height) parent[find(j)] = find(i);
        }
        bin.push(i);
      }
    }
  });
  const groups = new Map<number, Ink[]>();
  drawn.forEach((ink, i) => {
    const root = find(i);
    const list = groups.get(root);
    if (list) list.push(ink);
    else groups.set(root, [ink]);
  });
  const parts = [...groups.values()].map((group) => (group.length === 1 ? group[0] : inkOfRegion(unionRegions(group.map((g) => g.region)))));
  let areaMm2 = 0;
  let perimeterMm = 0;
  let x0 = Infinity, y0 = Infinity, x1 = -Infinity, y1 = -Infinity;
  for (const p of parts) {
    areaMm2 += p.areaMm2;
    perimeterMm += p.perimeterMm;
    const b = p.boxMm;
    if (!b) continue;
    x0 = Math.min(x0, b.x);
    y0 = Math.min(y0, b.y);
    x1 = Math.max(x1, b.x + b.width);
    y1 = Math.max(y1, b.y + b.height);
  }
  let region: Region | null = null;
  return {
    get region() {
      return (region ??= parts.flatMap((p) => p.region));
    },
    areaMm2,
    perimeterMm,
    boxMm: x0 <= x1 ? { x: x0, y: y0, width: x1 - x0, height: y1 - y0 } : null,
  };
}

/** The lie factors as a report gives them: the worst, its pair, and every pair; the raster check uses it too. */
export function summariseLieFactors(lf: LieFactorReport): VerifyReport['lieFactor'] {
  return {
    worst: lf.worst?.lieFactor ?? null,
    worstPair: lf.worst ? { label: lf.worst.label, reference: lf.worst.reference } : null,
    pairs: lf.pairs.map(summarisePair),
  };
}

function summarisePair(p: LieFactorPair): PairSummary {
  const out: PairSummary = {
    label: p.label,
    reference: p.reference,
    data: p.data,
    graphic: p.graphic,
    referenceData: p.referenceData,
    referenceGraphic: p.referenceGraphic,
    dataRatio: p.dataRatio,
    graphicRatio: p.graphicRatio,
    lieFactor: p.lieFactor,
    basis: p.basis,
  };
  if (p.problem) out.problem = p.problem;
  return out;
}

interface PieceInk {
  piece: ChartSvgPiece;
  ink: Ink;
}

/** Shape signature independent of size: ink / box area and box aspect. Equal signatures mean one glyph at two sizes. */
function signature(ink: Ink): { fill: number; aspect: number } | null {
  const b = ink.boxMm;
  if (!b || !(b.width > 0) || !(b.height > 0)) return null;
  return { fill: ink.areaMm2 / (b.width * b.height), aspect: b.width / b.height };
}

function sameShape(a: Ink, b: Ink): boolean {
  const sa = signature(a);
  const sb = signature(b);
  return !!sa && !!sb && relDiff(sa.fill, sb.fill) <= SAME_GLYPH_TOLERANCE && relDiff(sa.aspect, sb.aspect) <= SAME_GLYPH_TOLERANCE;
}

/**
 * One glyph drawn at two sizes in one chart makes count and ink disagree: a reader sees the bigger glyphs
 * as more. Different glyphs (a bus and a bike) legitimately differ in ink, so only the same shape is compared.
 */
function checkSameShapeSameSize(
  markInks: { mark: ChartSvgMark; pieces: PieceInk[] }[],
  fulls: (mi: { mark: ChartSvgMark; pieces: PieceInk[] }) => PieceInk[],
  legendInks: Ink[],
  file: ChartSvgFile,
  problems: ProblemList,
): void {
  const firsts = markInks.map((mi) => ({ mark: mi.mark, ink: fulls(mi)[0]?.ink })).filter((x): x is { mark: ChartSvgMark; ink: Ink } => !!x.ink);
  for (let i = 0; i < firsts.length; i++) {
    for (let j = i + 1; j < firsts.length; j++) {
      const a = firsts[i];
      const b = firsts[j];
      if (!sameShape(a.ink, b.ink)) continue;
      const ratio = b.ink.areaMm2 / a.ink.areaMm2;
      if (Math.abs(ratio - 1) > SAME_GLYPH_TOLERANCE) {
        problems.add(
          'same-glyph-two-sizes',
          `The glyphs of "${b.mark.label}" carry ${num(ratio)}x the ink of those of "${a.mark.label}" although they are the same glyph; ` +
            'every glyph in the chart must be drawn at one size.',
          'Draw the glyph at one size throughout the chart, so each copy stands for the same amount.',
          b.mark.label,
        );
        return;
      }
    }
  }
  legendInks.forEach((key, k) => {
    if (!(key.areaMm2 > 0)) return;
    const match = firsts.find((f) => sameShape(f.ink, key));
    if (match && relDiff(match.ink.areaMm2, key.areaMm2) > SAME_GLYPH_TOLERANCE) {
      const name = file.legendKeys[k].glyph ? ` (${file.legendKeys[k].glyph})` : '';
      problems.add(
        'key-glyph-size',
        `The legend's key glyph${name} carries ${num(key.areaMm2)} mm² of ink but the same glyph in "${match.mark.label}" carries ${num(match.ink.areaMm2)} mm²; ` +
          'the key must show the unit glyph at the size the chart uses.',
        'Draw the key\'s glyph at the size the marks use.',
      );
    }
  });
}

/** Group sizes a stack may be drawn in: fives and tens, as the chart document allows. */
const GROUP_SIZES = [5, 10];

/**
 * The stack grouping the file declares on its marks (data-group-every, data-group-gap-mm): one extra gap after
 * every 5 or 10 slots. Read from the file only; a value outside what the writer can produce is a problem, and
 * then no grouping is allowed for, so the glyphs must be evenly spaced.
 */
function stackGrouping(file: ChartSvgFile, problems: ProblemList): StackGrouping | null {
  const g = file.grouping;
  if (!g) return null;
  if (!GROUP_SIZES.includes(g.every) || !(Number.isFinite(g.gapMm) && g.gapMm > 0 && g.gapMm <= 100)) {
    problems.add(
      'uneven-pitch',
      `The file groups its stacks every ${num(g.every)} glyphs with a ${num(g.gapMm)} mm gap; only groups of 5 or 10 with a gap of up to one glyph pitch are allowed.`,
      'Group the glyphs in fives or tens with a gap no wider than one glyph pitch, or space them evenly.',
    );
    return null;
  }
  return { gapMm: g.gapMm, shiftMm: (slot) => Math.floor(slot / g.every) * g.gapMm };
}

interface StackGrouping {
  gapMm: number;
  /** How much further out than an even pitch a slot stands. */
  shiftMm: (slot: number) => number;
}

/** Pitch of each stack from the centres of its full glyphs against their slots; checks even spacing and one baseline. */
function measurePitches(
  markInks: { mark: ChartSvgMark; pieces: PieceInk[] }[],
  fulls: (mi: { mark: ChartSvgMark; pieces: PieceInk[] }) => PieceInk[],
  out: Map<ChartSvgMark, { pitch: number; start: number; axis: 'x' | 'y' } | null>,
  problems: ProblemList,
  notes: string[],
  summary: ChartSummary | null,
  grouping: StackGrouping | null = null,
): number | null {
  const groupShiftMm = grouping?.shiftMm ?? null;
  const centres = new Map<ChartSvgMark, { slot: number; x: number; y: number; box: Box }[]>();
  let missingSlots = false;
  for (const mi of markInks) {
    const pts: { slot: number; x: number; y: number; box: Box }[] = [];
    for (const p of fulls(mi)) {
      if (p.piece.slot === null) {
        missingSlots = true;
        continue;
      }
      const b = p.ink.boxMm as Box;
      pts.push({ slot: p.piece.slot, x: b.x + b.width / 2, y: b.y + b.height / 2, box: b });
    }
    centres.set(mi.mark, pts);
    // The stack must be contiguous from the baseline: slots 0..n-1 for the full glyphs, n for a partial one.
    const slots = pts.map((p) => p.slot).sort((a, b) => a - b);
    if (slots.some((sl, i) => sl !== i)) {
      problems.add(
        'stack-slots',
        `The stack of "${mi.mark.label}" skips or repeats slots (${slots.join(', ')}); its glyphs must follow one another from the baseline.`,
        `Stack the glyphs of "${mi.mark.label}" one per slot from the baseline, without gaps or repeats.`,
        mi.mark.label,
      );
    }
    const partial = mi.pieces.find((p) => p.piece.part === 'partial');
    if (partial && partial.piece.slot !== null && partial.piece.slot !== slots.length) {
      problems.add(
        'stack-partial-slot',
        `The partial glyph of "${mi.mark.label}" sits in slot ${partial.piece.slot}, but the stack has ${slots.length} whole glyphs below it.`,
        `Put the partial glyph of "${mi.mark.label}" directly on top of its whole glyphs.`,
        mi.mark.label,
      );
    }
  }
  if (missingSlots) notes.push('Some stack glyphs have no data-slot, so their positions could not be checked.');

  // Least-squares line through (slot, centre) on each axis; the stack runs along the axis that changes.
  for (const [mark, pts] of centres) {
    const distinct = new Set(pts.map((p) => p.slot)).size;
    if (distinct < 2) {
      out.set(mark, null);
      continue;
    }
    const line = (value: (p: (typeof pts)[number]) => number) => {
      const n = pts.length;
      const mx = pts.reduce((a, p) => a + p.slot, 0) / n;
      const my = pts.reduce((a, p) => a + value(p), 0) / n;
      let sxy = 0;
      let sxx = 0;
      for (const p of pts) {
        sxy += (p.slot - mx) * (value(p) - my);
        sxx += (p.slot - mx) ** 2;
      }
      const slope = sxy / sxx;
      return { slope, start: my - slope * mx };
    };
    // A grouped stack: each slot stands one group gap further out per group below it, along the stack's axis
    // and in its direction (the sign of the uncorrected slope); that is taken out before the even-pitch fit.
    const rx = line((p) => p.x);
    const ry = line((p) => p.y);
    const axis: 'x' | 'y' = Math.abs(ry.slope) >= Math.abs(rx.slope) ? 'y' : 'x';
    const sign = Math.sign((axis === 'y' ? ry : rx).slope);
    const at = (p: (typeof pts)[number], key: 'x' | 'y') => (groupShiftMm && key === axis ? p[key] - sign * groupShiftMm(p.slot) : p[key]);
    const along = groupShiftMm ? line((p) => at(p, axis)) : axis === 'y' ? ry : rx;
    const across = axis === 'y' ? rx : ry;
    const pitch = Math.abs(along.slope);
    const slack = SAME_GLYPH_TOLERANCE * pitch + 1e-3;
    const off = Math.max(
      ...pts.map((p) => Math.abs(at(p, axis) - (along.start + along.slope * p.slot))),
      ...pts.map((p) => Math.abs(at(p, axis === 'y' ? 'x' : 'y') - (across.start + across.slope * p.slot))),
    );
    if (off > slack) {
      problems.add(
        'uneven-pitch',
        `The glyphs in the stack of "${mark.label}" are not evenly spaced along one line (off by up to ${num(off)} mm); each glyph takes one pitch.`,
        `Space the glyphs of "${mark.label}" at one pitch (glyph size plus gap) along one line.`,
        mark.label,
      );
    }
    out.set(mark, { pitch, start: along.start, axis });
  }
  const measured = [...out.values()].filter((v): v is { pitch: number; start: number; axis: 'x' | 'y' } => v !== null);
  let chartPitch: number | null = measured.length ? median(measured.map((m) => m.pitch)) : null;
  if (chartPitch === null) {
    if (summary?.pitchMm && summary.pitchMm > 0) {
      chartPitch = summary.pitchMm;
      notes.push('No stack has two whole glyphs, so the pitch is taken from the file\'s summary; lengths are compared at that pitch.');
    } else {
      notes.push('No stack has two whole glyphs and the file records no pitch, so stacks are compared by glyph count.');
    }
  }
  if (grouping && chartPitch && grouping.gapMm > chartPitch * (1 + SAME_GLYPH_TOLERANCE)) {
    problems.add(
      'uneven-pitch',
      `The stacks are grouped with a ${num(grouping.gapMm)} mm gap, wider than one glyph pitch (${num(chartPitch)} mm); such gaps would lengthen the stacks.`,
      'Group the glyphs with a gap no wider than one glyph pitch, or space them evenly.',
    );
  }
  // Every stack starts from one baseline: the edge of slot 0 that faces the baseline lies at the same place
  // along the stack axis. Edges, not centres, so stacks of different glyphs (ink-matched, so of different
  // heights) standing on one baseline agree.
  if (chartPitch) {
    const axis = measured[0]?.axis ?? 'y';
    const dir = measured.length ? directionOf(centres, out) : -1;
    const starts: { mark: ChartSvgMark; start: number }[] = [];
    for (const [mark, pts] of centres) {
      if (!pts.length) continue;
      const first = pts.reduce((a, b) => (b.slot < a.slot ? b : a));
      const lo = axis === 'y' ? first.box.y : first.box.x;
      const hi = axis === 'y' ? first.box.y + first.box.height : first.box.x + first.box.width;
      const edge = dir < 0 ? hi : lo;
      const pitch = out.get(mark)?.pitch ?? chartPitch;
      starts.push({ mark, start: edge - dir * (pitch * first.slot + (groupShiftMm ? groupShiftMm(first.slot) : 0)) });
    }
    if (starts.length > 1) {
      const ref = starts[0];
      const worst = starts.reduce((w, st) => (Math.abs(st.start - ref.start) > Math.abs(w.start - ref.start) ? st : w), ref);
      if (Math.abs(worst.start - ref.start) > SAME_GLYPH_TOLERANCE * chartPitch + 1e-3) {
        problems.add(
          'baseline-mismatch',
          `The stack of "${worst.mark.label}" starts ${num(Math.abs(worst.start - ref.start))} mm away from that of "${ref.mark.label}"; every stack must start on the same baseline.`,
          `Start the stack of "${worst.mark.label}" on the same baseline as the others.`,
          worst.mark.label,
        );
      }
    }
  }
  return chartPitch;
}

/** +1 when slots grow along the axis (left to right, top to bottom), -1 when they grow against it (upward). */
function directionOf(
  centres: Map<ChartSvgMark, { slot: number; x: number; y: number; box: Box }[]>,
  fits: Map<ChartSvgMark, { pitch: number; start: number; axis: 'x' | 'y' } | null>,
): number {
  for (const [mark, pts] of centres) {
    const f = fits.get(mark);
    if (!f || pts.length < 2) continue;
    const a = pts.reduce((m, p) => (p.slot < m.slot ? p : m));
    const b = pts.reduce((m, p) => (p.slot > m.slot ? p : m));
    return Math.sign(b[f.axis] - a[f.axis]) || 1;
  }
  return -1;
}

/** The summary's data must be the marks' data: same ids, labels and values. */
function checkSummary(file: ChartSvgFile, marks: MarkMeasurement[], problems: ProblemList): void {
  const summary = file.summary;
  if (!summary) return;
  if (summary.mode && MODE_OF_READING[file.reading] !== summary.mode) {
    problems.add('summary-mismatch', `The file's summary says mode "${summary.mode}" but its marks are read by ${file.reading}.`, REEXPORT_FIX);
  }
  if (!Array.isArray(summary.data)) return;
  const byId = new Map(summary.data.map((d) => [d.id, d]));
  for (const m of marks) {
    const d = byId.get(m.id);
    if (!d) {
      problems.add('summary-mismatch', `Mark "${m.id}" ("${m.label}") is not in the file's summary of its data.`, REEXPORT_FIX, m.label);
      continue;
    }
    if (d.label !== m.label || !(Math.abs(d.value - m.value) <= 1e-9 * Math.max(1, Math.abs(d.value)))) {
      problems.add('summary-mismatch', `The file's summary records "${d.label}" = ${num(d.value)}, but mark "${m.id}" carries "${m.label}" = ${num(m.value)}.`, REEXPORT_FIX, m.label);
    }
  }
  const markIds = new Set(marks.map((m) => m.id));
  const lost = summary.data.filter((d) => !markIds.has(d.id));
  if (lost.length) problems.add('summary-mismatch', `The file's summary lists ${lost.map((d) => `"${d.label}"`).join(', ')}, which the file does not draw.`, REEXPORT_FIX);
}

/**
 * The lie factor compares categories with each other; the legend makes an absolute claim too ("one glyph =
 * 50 rides"). A chart drawn at twice the stated unit throughout has lie factor 1 but still misleads.
 */
function checkAbsoluteScale(file: ChartSvgFile, marks: MarkMeasurement[], problems: ProblemList, high: number): void {
  const summary = file.summary;
  const reading = file.reading;
  const tolerance = high - 1;
  const keyUnit = file.legendKeys.find((k) => k.unitValue !== null)?.unitValue ?? null;
  const unit = reading === 'count' || reading === 'length' ? (keyUnit ?? summary?.unit ?? null) : (summary?.unit ?? null);
  if (!(unit !== null && unit > 0 && Number.isFinite(unit))) return;
  const unitName = summary?.unitName ? ` ${summary.unitName}` : '';
  for (const m of marks) {
    if (!(m.value > 0)) continue;
    if ((reading === 'count' || reading === 'length') && m.glyphs !== undefined && m.unitInkMm2 !== undefined) {
      const shown = m.glyphs * unit;
      if (relDiff(shown, m.value) > tolerance + 1e-9) {
        problems.add(
          'key-unit-mismatch',
          `"${m.label}" is drawn as ${num(m.glyphs)} glyphs, which the key reads as ${num(shown)}${unitName} at ${num(unit)} per glyph, but its value is ${num(m.value)}.`,
          `Make the key state the amount one glyph is drawn for, or draw "${m.label}" at the key's ${num(unit)} per glyph.`,
          m.label,
        );
        return;
      }
    } else if (reading === 'fill' && m.fillShare !== undefined) {
      const expected = m.value / unit;
      if (relDiff(m.fillShare, expected) > tolerance + 1e-9) {
        problems.add(
          'key-unit-mismatch',
          `"${m.label}" is filled to ${num(m.fillShare * 100)}% of its glyph's ink, but its value ${num(m.value)} of ${num(unit)} is ${num(expected * 100)}%.`,
          `Fill "${m.label}" to ${num(expected * 100)}% of its glyph's ink, or state the whole it is a share of.`,
          m.label,
        );
        return;
      }
    } else if (reading === 'area') {
      const shown = m.inkMm2 * unit;
      if (relDiff(shown, m.value) > tolerance + 1e-9) {
        problems.add(
          'key-unit-mismatch',
          `"${m.label}" carries ${num(m.inkMm2)} mm² of ink, which the file's scale (${num(unit)} per mm²) reads as ${num(shown)}, but its value is ${num(m.value)}.`,
          `Scale "${m.label}" to the chart's stated ink per unit of value, or state the scale it is drawn at.`,
          m.label,
        );
        return;
      }
    }
  }
}

/**
 * A scale chart's key ("this much ink = 250 trees") must follow the marks' own ink per unit of value, or a
 * reader comparing a mark with the key misjudges it by the same factor. Scale-free: marks against key.
 */
function checkScaleKeys(file: ChartSvgFile, legendInks: Ink[], marks: MarkMeasurement[], problems: ProblemList, high: number): void {
  const perValue = marks.filter((m) => m.value > 0 && m.inkMm2 > 0).map((m) => m.inkMm2 / m.value);
  if (!perValue.length) return;
  const chart = median(perValue);
  file.legendKeys.forEach((key, i) => {
    const ink = legendInks[i];
    if (key.unitValue === null || !(ink.areaMm2 > 0)) return;
    const ratio = ink.areaMm2 / key.unitValue / chart;
    if (Math.abs(ratio - 1) > high - 1 + 1e-9) {
      problems.add(
        'key-glyph-size',
        `The key glyph for ${num(key.unitValue)} carries ${num(ink.areaMm2)} mm² of ink, ${num(ratio)}x what the marks carry for that value; ` +
          'a reader comparing a mark with the key would misjudge it.',
        `Draw the key glyph for ${num(key.unitValue)} with the ink per unit of value that the marks use.`,
      );
    }
  });
}

function findSmallestGlyph(
  markInks: { mark: ChartSvgMark; ink: Ink; pieces: PieceInk[] }[],
  fulls: (mi: { mark: ChartSvgMark; pieces: PieceInk[] }) => PieceInk[],
  reading: Reading,
): VerifyReport['smallestGlyph'] {
  let best: VerifyReport['smallestGlyph'] = null;
  const consider = (mark: ChartSvgMark, ink: Ink) => {
    if (!(ink.areaMm2 > 0)) return;
    // Copies of one glyph agree to rounding noise: only a real difference moves the choice off the first.
    if (!best || ink.areaMm2 < best.inkMm2 * (1 - 1e-9)) best = { markId: mark.id, label: mark.label, inkMm2: ink.areaMm2, perimeterMm: ink.perimeterMm };
  };
  for (const mi of markInks) {
    if (reading === 'area') consider(mi.mark, mi.ink);
    else if (reading === 'fill') {
      const whole = mi.pieces.filter((p) => p.piece.part === 'filled' || p.piece.part === 'rest');
      const area = whole.reduce((a, p) => a + p.ink.areaMm2, 0);
      const perimeter = whole.reduce((a, p) => a + p.ink.perimeterMm, 0);
      if (area > 0) consider(mi.mark, { region: [], areaMm2: area, perimeterMm: perimeter, boxMm: null });
    } else for (const p of fulls(mi)) consider(mi.mark, p.ink);
  }
  return best;
}

/** The smallest piece of ink drawn: every full and partial glyph, or each mark's whole glyph in scale and fill charts. */
function findSmallestInk(markInks: { mark: ChartSvgMark; ink: Ink; pieces: PieceInk[] }[], reading: Reading): VerifyReport['smallestInk'] {
  let best: VerifyReport['smallestInk'] = null;
  const consider = (mark: ChartSvgMark, areaMm2: number, perimeterMm: number, part: 'full' | 'partial' | 'glyph') => {
    if (!(areaMm2 > 0)) return;
    if (!best || areaMm2 < best.inkMm2 * (1 - 1e-9)) best = { markId: mark.id, label: mark.label, inkMm2: areaMm2, perimeterMm, part };
  };
  for (const mi of markInks) {
    if (reading === 'area') consider(mi.mark, mi.ink.areaMm2, mi.ink.perimeterMm, 'glyph');
    else if (reading === 'fill') {
      const whole = mi.pieces.filter((p) => p.piece.part === 'filled' || p.piece.part === 'rest');
      consider(mi.mark, whole.reduce((a, p) => a + p.ink.areaMm2, 0), whole.reduce((a, p) => a + p.ink.perimeterMm, 0), 'glyph');
    } else {
      for (const p of mi.pieces) if (p.piece.part === 'full' || p.piece.part === 'partial') consider(mi.mark, p.ink.areaMm2, p.ink.perimeterMm, p.piece.part);
    }
  }
  return best;
}

// ---- preflight

/** Cap height of the bundled font per millimetre of font size, for reading a text size off outlined text. */
let capPerEm: number | null = null;
function capHeightPerEm(): number {
  capPerEm ??= measureText('H', { sizeMm: 1 }).capHeightMm;
  return capPerEm;
}

/**
 * Font size of outlined text, in pt, when the writer did not record it: the glyphs standing on the most
 * common baseline reach up to about the cap height (ascenders a little more, so this errs a few percent
 * large; lower-case-only text such as "some cars" errs small). Good enough for a 6 pt warning.
 */
function estimateTextSizePt(ink: Ink, mmPerUnit: number): number | null {
  const rings = ink.region
    .map((r) => boxOf([r]))
    .filter((b) => b.height > 0);
  if (!rings.length) return null;
  const bottoms = new Map<number, number>();
  const grain = Math.max(...rings.map((b) => b.height)) * 0.02;
  for (const b of rings) {
    const key = Math.round((b.y + b.height) / grain);
    bottoms.set(key, (bottoms.get(key) ?? 0) + 1);
  }
  let baselineKey = 0;
  let most = -1;
  for (const [k, n] of bottoms) if (n > most || (n === most && k > baselineKey)) [baselineKey, most] = [k, n];
  const standing = rings.filter((b) => Math.abs(Math.round((b.y + b.height) / grain) - baselineKey) <= 1);
  const baseline = Math.max(...standing.map((b) => b.y + b.height));
  const top = Math.min(...standing.map((b) => b.y));
  const capMm = (baseline - top) * mmPerUnit;
  return ((capMm / capHeightPerEm()) * 72) / 25.4;
}

function preflightFromFile(
  file: ChartSvgFile,
  shapes: PaintedShape[],
  owners: Map<PaintedShape, Owner>,
  markInks: { mark: ChartSvgMark; ink: Ink }[],
  legendInks: Ink[],
  byText: Map<number, PaintedShape[]>,
  rest: { shape: PaintedShape; kind: Owner['kind'] }[],
  inkOf: (shapes: PaintedShape[]) => Ink,
  opts: VerifyOptions,
  partials: PartialGlyph[],
): Finding[] {
  const { page } = file;
  const s = page.mmPerUnit;
  const strokes: { widthPt: number; owner: string }[] = [];
  for (const shape of shapes) {
    if (!shape.stroke) continue;
    const m = shape.ctm;
    const scale = Math.sqrt(Math.abs(m[0] * m[3] - m[1] * m[2]));
    const owner = owners.get(shape) as Owner;
    const name =
      owner.kind === 'mark' ? `"${owner.mark.label}"` : owner.kind === 'text' ? `${file.texts[owner.index].role} text` : owner.kind === 'rule' ? 'baseline or rule' : owner.kind === 'legend' ? 'legend' : 'artwork';
    strokes.push({ widthPt: (shape.stroke.width * scale * s * 72) / 25.4, owner: name });
  }

  const boxes: Box[] = [];
  for (const mi of markInks) if (mi.ink.boxMm) boxes.push(mi.ink.boxMm);
  for (const l of legendInks) if (l.boxMm) boxes.push(l.boxMm);
  const texts: { sizePt: number; owner: string }[] = [];
  file.texts.forEach((t, i) => {
    const ink = inkOf(byText.get(i) ?? []);
    if (ink.boxMm) boxes.push(ink.boxMm);
    const sizePt = t.sizePt ?? (ink.boxMm ? estimateTextSizePt(ink, s) : null);
    if (sizePt !== null) texts.push({ sizePt, owner: `${t.role} text` });
  });

  // Background: marked as such, or unmarked artwork that covers the whole trim box.
  const trim = { x: 0, y: 0, width: page.widthMm, height: page.heightMm };
  const bleedBox = { x: -page.bleedMm, y: -page.bleedMm, width: page.widthMm + 2 * page.bleedMm, height: page.heightMm + 2 * page.bleedMm };
  let backgroundCoversBleed = false;
  const covers = (b: Box, target: Box) => {
    const e = 1e-6 * Math.max(target.width, target.height);
    return b.x <= target.x + e && b.y <= target.y + e && b.x + b.width >= target.x + target.width - e && b.y + b.height >= target.y + target.height - e;
  };
  for (const { shape, kind } of rest) {
    const ink = inkOf([shape]);
    if (!ink.boxMm) continue;
    const isBackground = kind === 'background' || covers(ink.boxMm, trim);
    if (isBackground) {
      if (covers(ink.boxMm, bleedBox)) backgroundCoversBleed = true;
    } else boxes.push(ink.boxMm);
  }
  let contentBoxMm: Box;
  if (boxes.length) {
    const x0 = Math.min(...boxes.map((b) => b.x));
    const y0 = Math.min(...boxes.map((b) => b.y));
    const x1 = Math.max(...boxes.map((b) => b.x + b.width));
    const y1 = Math.max(...boxes.map((b) => b.y + b.height));
    contentBoxMm = { x: x0, y: y0, width: x1 - x0, height: y1 - y0 };
  } else contentBoxMm = { x: page.widthMm / 2, y: page.heightMm / 2, width: 0, height: 0 };

  const declared = Number(file.root.attrs['data-safe-margin-mm']);
  const safeMarginMm = opts.safeMarginMm ?? (Number.isFinite(declared) && declared >= 0 && file.root.attrs['data-safe-margin-mm'] !== undefined ? declared : DEFAULT_SAFE_MARGIN_MM);
  return preflight(
    { page: { widthMm: page.widthMm, heightMm: page.heightMm }, bleedMm: page.bleedMm, safeMarginMm, strokes, texts, contentBoxMm, backgroundCoversBleed, partials },
    opts.preflight,
  );
}

/** Throws TallyError('gate-refused') for a failing report, naming the reason and the first thing to try. */
export function assertVerified(report: VerifyReport, what = 'The chart'): void {
  if (report.pass) return;
  const fix = report.suggestions[0] ? ` Try: ${report.suggestions[0]}` : '';
  throw new TallyError('gate-refused', `${what} was refused: ${report.reason ?? 'it did not pass verification.'}${fix}`, report);
}
