// Measures a written chart once, from its SVG text alone (docs/chart-svg.md): every painted shape and whom it
// belongs to, the ink of every piece, mark and legend key, the unit of count, stack pitches, each mark under the
// chart's reading, the lie factors and the gate's verdict, and what print preflight needs. The checks in
// ./checks read this and nothing else; verifySvg runs them and assembles the report.
import type { Warning } from '../errors';
import { boxOf, regionArea, unionRegions, type Box, type Region } from '../geometry/region';
import { collectShapes, inkOfShapes, newBudget, type PaintedShape } from '../glyph/index';
import type { ChartSummary, Reading } from '../scene/types';
import type { XmlElement } from '../svg/parseXml';
import { readChartSvg, type ChartSvgFile, type ChartSvgMark, type ChartSvgPiece } from '../svg/readChartSvg';
import { measureText } from '../text/measureText';
import { fullsOf, median } from './checks/fileFinding';
import type { IntegrityCheck } from './check';
import { DISTORTION_LIMITS, gate, type GateMode, type GateResult, type GateRounding } from './gate';
import { lieFactors, type LieFactorReport } from './lieFactor';
import { PREFLIGHT_DEFAULTS, validatePreflightInput, type PartialGlyph, type PreflightInput, type PreflightOptions } from './preflight';
import { createShapeInkCache, type ShapeInk } from './shapeInk';

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

export interface Ink {
  region: Region;
  areaMm2: number;
  perimeterMm: number;
  boxMm: Box | null;
}

export type Owner =
  | { kind: 'mark'; mark: ChartSvgMark; piece: ChartSvgPiece | null }
  | { kind: 'legend'; index: number }
  | { kind: 'text'; index: number }
  | { kind: 'rule' }
  | { kind: 'background' }
  | { kind: 'other' };

export interface PieceInk {
  piece: ChartSvgPiece;
  ink: Ink;
}

export interface MarkInk {
  mark: ChartSvgMark;
  /** The union of the mark's pieces and any loose shapes. */
  ink: Ink;
  pieces: PieceInk[];
  /** The full glyphs that carry ink, found once for every check that compares glyph sizes. */
  fulls: PieceInk[];
  /** Shapes of the mark outside any piece. */
  other: number;
}

/** One stack of a length chart, as measured from the centres of its full glyphs against their slots. */
export interface StackMeasure {
  mark: ChartSvgMark;
  /** Slots of the full glyphs, in ascending order. */
  slots: number[];
  /** Slot of the first partial glyph, when it has one. */
  partialSlot: number | null;
  /** Least-squares line through (slot, centre): pitch, start, axis, and the farthest centre off it; null below two slots. */
  fit: { pitchMm: number; startMm: number; axis: 'x' | 'y'; offMm: number } | null;
  /** Where slot 0's edge facing the baseline lies along the stack axis; null when the chart has no pitch or the stack no full glyph. */
  baselineMm: number | null;
}

/** Colours a mark is painted in: all its shapes, its filled pieces and its unfilled ones (lower-case #rrggbb where readable). */
export interface MarkPaints {
  all: Set<string>;
  filled: Set<string>;
  rest: Set<string>;
}

/** Everything verification measured, once; every check reads this. */
export interface MeasuredFile {
  file: ChartSvgFile;
  reading: Reading;
  mode: GateMode;
  limits: { low: number; high: number };
  options: VerifyOptions;
  /** Every painted shape in painting order, and what each belongs to. */
  shapes: PaintedShape[];
  owners: Map<PaintedShape, Owner>;
  markInks: MarkInk[];
  legendInks: Ink[];
  /** Mean ink of each mark's full glyphs (count and length readings). */
  unitByMark: Map<ChartSvgMark, number>;
  /** Stacks of a length chart, in mark order (empty for other readings). */
  stacks: StackMeasure[];
  chartPitchMm: number | null;
  /**
   * The stack grouping the file declares (data-group-every, data-group-gap-mm): one extra gap after every 5 or
   * 10 slots. `allowed` is false when the declared values are outside what the writer can produce; then no
   * grouping is taken out and the glyphs must be evenly spaced.
   */
  stackGrouping: { every: number; gapMm: number; allowed: boolean } | null;
  marks: MarkMeasurement[];
  lieFactors: LieFactorReport;
  /** The gate's verdict on the lie factors: its findings are the lie-factor checks' findings. */
  verdict: GateResult;
  /** The page's colour (the last background's paint, else white) and each mark's paints. */
  paperColour: string;
  paints: Map<ChartSvgMark, MarkPaints>;
  preflight: PreflightInput;
  preflightOptions: Required<PreflightOptions>;
  /** Ink of shapes that are only located and sized (text, rules, artwork), at a coarse tolerance. */
  roughInkOf(shapes: PaintedShape[]): Ink;
  notes: string[];
  warnings: Warning[];
}

/** A check of the written file: one code, one severity, one category, in its own file under ./checks. */
export type FileCheck = IntegrityCheck<MeasuredFile>;

/** Flattening tolerance in mm: marks are polygons already; this only matters for curves (text, hand-written files). */
const TOLERANCE_MM = 1e-4;
/** For ink that is only located and sized (text, rules): 10 µm, far below any preflight threshold. */
const ROUGH_TOLERANCE_MM = 0.01;
const DEFAULT_SAFE_MARGIN_MM = 3;

export const MODE_OF_READING: Record<Reading, GateMode> = { count: 'repeat', length: 'stack', area: 'scale', fill: 'fill' };
const UNIT_OF_READING: Record<Reading, MarkMeasurement['graphicUnit']> = { count: 'glyphs', length: 'mm', area: 'mm2', fill: 'share' };

function ringLength(ring: Region[number]): number {
  let s = 0;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) s += Math.hypot(ring[i].x - ring[j].x, ring[i].y - ring[j].y);
  return s;
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

function backgroundPaint(el: XmlElement): string | undefined {
  const style = /(?:^|;)\s*fill\s*:\s*([^;]+)/.exec(el.attrs.style ?? '')?.[1];
  return style ?? el.attrs.fill;
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
 * Reads and measures a chart SVG that Tallyglyph wrote, from the text alone. Throws TallyError
 * 'document-invalid' for an SVG without Tallyglyph marks, 'svg-malformed' for an unreadable file.
 */
export function measureFile(svgText: string, opts: VerifyOptions = {}): MeasuredFile {
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
    if (shapes.length === 1) return new SingleShapeInk(shapeInk(shapes[0], tolerance), s);
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

  const notes: string[] = [];

  // ---- ink of every piece and every mark
  const markInks: MarkInk[] = file.marks.map((mark) => {
    const pieces = mark.pieces.map((piece) => ({ piece, ink: inkOf(byPiece.get(piece) ?? []) }));
    const loose = looseByMark.get(mark) ?? [];
    const inks = pieces.map((p) => p.ink);
    if (loose.length) inks.push(inkOf(loose));
    return { mark, ink: unionInks(inks, inkOfRegion), pieces, fulls: fullsOf({ pieces }), other: loose.length };
  });
  const legendInks = file.legendKeys.map((_, i) => inkOf(byLegend.get(i) ?? []));
  const paperColour = file.backgrounds.length ? normaliseColour(backgroundPaint(file.backgrounds[file.backgrounds.length - 1])) : '#ffffff';
  const paints = paintsOf(collected.shapes, owners, paperColour);

  // ---- the unit of count: the mean ink of each mark's own full glyphs (the checks judge whether they agree)
  const unitByMark = new Map<ChartSvgMark, number>();
  if (reading === 'count' || reading === 'length') {
    for (const mi of markInks) {
      const f = mi.fulls;
      if (!f.length) continue;
      unitByMark.set(mi.mark, f.reduce((a, p) => a + p.ink.areaMm2, 0) / f.length);
    }
  }
  const chartUnit = unitByMark.size ? median([...unitByMark.values()]) : (legendInks.find((l) => l.areaMm2 > 0)?.areaMm2 ?? null);
  if ((reading === 'count' || reading === 'length') && chartUnit === null) {
    notes.push('No whole glyph is drawn anywhere (no full piece and no legend key), so counts are compared by ink alone.');
  }

  // ---- stack pitch, measured from the positions of successive slots
  const stacks: StackMeasure[] = [];
  let chartPitch: number | null = null;
  const stackGrouping = reading === 'length' ? groupingOf(file) : null;
  if (reading === 'length') chartPitch = measureStacks(markInks, stacks, notes, summary, stackGrouping?.allowed ? stackGrouping : null);
  const pitchByMark = new Map(stacks.map((st) => [st.mark, st.fit?.pitchMm ?? null] as const));

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
        const pitch = pitchByMark.get(mark) ?? chartPitch;
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

  // ---- Tufte's lie factor and the gate's verdict on it
  const labels = new Set<string>();
  const items = marks.map((m) => {
    const label = labels.has(m.label) ? `${m.label} (${m.id})` : m.label;
    labels.add(label);
    return { label, data: m.value, graphic: m.graphic };
  });
  const lf = lieFactors(items);
  const mode: GateMode = MODE_OF_READING[reading];
  const verdict = gate(lf, { low, high, mode, reading, ...(opts.rounding ? { rounding: opts.rounding } : {}) });

  // ---- what preflight needs, from the file's own geometry
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
  const preflight = preflightInputOf(file, collected.shapes, owners, markInks, legendInks, byText, rest, roughInkOf, opts, partials);
  validatePreflightInput(preflight);

  return {
    file,
    reading,
    mode,
    limits: { low, high },
    options: opts,
    shapes: collected.shapes,
    owners,
    markInks,
    legendInks,
    unitByMark,
    stacks,
    chartPitchMm: chartPitch,
    stackGrouping,
    marks,
    lieFactors: lf,
    verdict,
    paperColour,
    paints,
    preflight,
    preflightOptions: { ...PREFLIGHT_DEFAULTS, ...opts.preflight },
    roughInkOf,
    notes,
    warnings,
  };
}

/** The ink of one shape in millimetres; its polygons are built only when a check asks for them. */
class SingleShapeInk implements Ink {
  readonly areaMm2: number;
  readonly perimeterMm: number;
  readonly boxMm: Box | null;

  constructor(
    private readonly one: ShapeInk,
    s: number,
  ) {
    const b = one.boxUnits;
    this.areaMm2 = one.areaUnits2 * s * s;
    this.perimeterMm = one.perimeterUnits * s;
    this.boxMm = b ? { x: b.x * s, y: b.y * s, width: b.width * s, height: b.height * s } : null;
  }

  get region(): Region {
    return this.one.region();
  }
}

function paintsOf(shapes: PaintedShape[], owners: Map<PaintedShape, Owner>, paper: string): Map<ChartSvgMark, MarkPaints> {
  const paints = new Map<ChartSvgMark, MarkPaints>();
  for (const shape of shapes) {
    const owner = owners.get(shape);
    if (owner?.kind !== 'mark') continue;
    const entry = paints.get(owner.mark) ?? { all: new Set<string>(), filled: new Set<string>(), rest: new Set<string>() };
    paints.set(owner.mark, entry);
    const colour = shape.fill ? normaliseColour(shape.fill.paint) : shape.stroke ? 'stroke' : paper;
    entry.all.add(colour);
    if (owner.piece?.part === 'filled') entry.filled.add(colour);
    if (owner.piece?.part === 'rest') entry.rest.add(colour);
  }
  return paints;
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
  // Cells by column, then row: number keys (no key string per cell and box on a 100,000-glyph poster).
  const bins = new Map<number, Map<number, number[]>>();
  boxes.forEach((a, i) => {
    const x0 = Math.floor(a.x / cell);
    const x1 = Math.floor((a.x + a.width) / cell);
    const y0 = Math.floor(a.y / cell);
    const y1 = Math.floor((a.y + a.height) / cell);
    for (let cx = x0; cx <= x1; cx++) {
      let column = bins.get(cx);
      if (!column) bins.set(cx, (column = new Map()));
      for (let cy = y0; cy <= y1; cy++) {
        const bin = column.get(cy);
        if (!bin) {
          column.set(cy, [i]);
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


/**
 * Pitch of each stack from the centres of its full glyphs against their slots, and where each stack starts
 * along its axis; the checks judge slots, even spacing and the shared baseline from these.
 */
/** Group sizes a stack may be drawn in: fives and tens, as the chart document allows. */
const GROUP_SIZES = [5, 10];

function groupingOf(file: ChartSvgFile): MeasuredFile['stackGrouping'] {
  const g = file.grouping;
  if (!g) return null;
  const allowed = GROUP_SIZES.includes(g.every) && Number.isFinite(g.gapMm) && g.gapMm > 0 && g.gapMm <= 100;
  return { every: g.every, gapMm: g.gapMm, allowed };
}

function measureStacks(
  markInks: MarkInk[],
  out: StackMeasure[],
  notes: string[],
  summary: ChartSummary | null,
  grouping: { every: number; gapMm: number } | null,
): number | null {
  // How much further out than an even pitch a slot stands: one group gap per finished group below it.
  const groupShiftMm = grouping ? (slot: number) => Math.floor(slot / grouping.every) * grouping.gapMm : null;
  const centres = new Map<ChartSvgMark, { slot: number; x: number; y: number; box: Box }[]>();
  let missingSlots = false;
  for (const mi of markInks) {
    const pts: { slot: number; x: number; y: number; box: Box }[] = [];
    for (const p of mi.fulls) {
      if (p.piece.slot === null) {
        missingSlots = true;
        continue;
      }
      const b = p.ink.boxMm as Box;
      pts.push({ slot: p.piece.slot, x: b.x + b.width / 2, y: b.y + b.height / 2, box: b });
    }
    centres.set(mi.mark, pts);
    const partial = mi.pieces.find((p) => p.piece.part === 'partial');
    out.push({ mark: mi.mark, slots: pts.map((p) => p.slot).sort((a, b) => a - b), partialSlot: partial?.piece.slot ?? null, fit: null, baselineMm: null });
  }
  if (missingSlots) notes.push('Some stack glyphs have no data-slot, so their positions could not be checked.');

  // Least-squares line through (slot, centre) on each axis; the stack runs along the axis that changes.
  out.forEach((stack) => {
    const pts = centres.get(stack.mark) ?? [];
    const distinct = new Set(pts.map((p) => p.slot)).size;
    if (distinct < 2) return;
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
    const off = Math.max(
      ...pts.map((p) => Math.abs(at(p, axis) - (along.start + along.slope * p.slot))),
      ...pts.map((p) => Math.abs(at(p, axis === 'y' ? 'x' : 'y') - (across.start + across.slope * p.slot))),
    );
    stack.fit = { pitchMm: Math.abs(along.slope), startMm: along.start, axis, offMm: off };
  });
  const measured = out.flatMap((st) => (st.fit ? [st.fit] : []));
  let chartPitch: number | null = measured.length ? median(measured.map((m) => m.pitchMm)) : null;
  if (chartPitch === null) {
    if (summary?.pitchMm && summary.pitchMm > 0) {
      chartPitch = summary.pitchMm;
      notes.push('No stack has two whole glyphs, so the pitch is taken from the file\'s summary; lengths are compared at that pitch.');
    } else {
      notes.push('No stack has two whole glyphs and the file records no pitch, so stacks are compared by glyph count.');
    }
  }
  // Every stack starts from one baseline: the edge of slot 0 that faces the baseline lies at the same place
  // along the stack axis. Edges, not centres, so stacks of different glyphs (ink-matched, so of different
  // heights) standing on one baseline agree.
  if (chartPitch) {
    const axis = measured[0]?.axis ?? 'y';
    const dir = measured.length ? directionOf(out, centres) : -1;
    for (const stack of out) {
      const pts = centres.get(stack.mark) ?? [];
      if (!pts.length) continue;
      const first = pts.reduce((a, b) => (b.slot < a.slot ? b : a));
      const lo = axis === 'y' ? first.box.y : first.box.x;
      const hi = axis === 'y' ? first.box.y + first.box.height : first.box.x + first.box.width;
      const edge = dir < 0 ? hi : lo;
      const pitch = stack.fit?.pitchMm ?? chartPitch;
      stack.baselineMm = edge - dir * (pitch * first.slot + (groupShiftMm ? groupShiftMm(first.slot) : 0));
    }
  }
  return chartPitch;
}

/** +1 when slots grow along the axis (left to right, top to bottom), -1 when they grow against it (upward). */
function directionOf(stacks: StackMeasure[], centres: Map<ChartSvgMark, { slot: number; x: number; y: number }[]>): number {
  for (const stack of stacks) {
    const f = stack.fit;
    const pts = centres.get(stack.mark) ?? [];
    if (!f || pts.length < 2) continue;
    const a = pts.reduce((m, p) => (p.slot < m.slot ? p : m));
    const b = pts.reduce((m, p) => (p.slot > m.slot ? p : m));
    return Math.sign(b[f.axis] - a[f.axis]) || 1;
  }
  return -1;
}

// ---- what preflight reads

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

function preflightInputOf(
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
): PreflightInput {
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
  return { page: { widthMm: page.widthMm, heightMm: page.heightMm }, bleedMm: page.bleedMm, safeMarginMm, strokes, texts, contentBoxMm, backgroundCoversBleed, partials };
}
