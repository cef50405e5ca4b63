// Verifies a written chart from its SVG text alone (docs/chart-svg.md): measures it once (measureFile.ts), runs
// every check in the registry (./checks: the lie factor, whether the ink shows, one scale and the file's own
// records, print preflight) and assembles the report. It never sees the layout that produced the file.
import { TallyError, type Warning } from '../errors';
import type { ChartSummary, Reading } from '../scene/types';
import type { IntegrityFinding } from './check';
import { FILE_CHECKS } from './checks/index';
import { num } from './checks/fileFinding';
import { asPreflightFinding } from './checks/preflightShared';
import type { GateMode } from './gate';
import type { LieFactorPair, LieFactorReport } from './lieFactor';
import { measureFile, type MarkInk, type MarkMeasurement, type MeasuredFile, type VerifyOptions } from './measureFile';
import type { Finding } from './preflight';

export { normaliseColour } from './measureFile';
export type { MarkMeasurement, VerifyOptions } from './measureFile';

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

/** Below this much ink (a 0.3 mm square) a mark's area is at the mercy of coordinate rounding. */
const TINY_INK_MM2 = 0.1;

/**
 * Verifies a chart SVG that Tallyglyph wrote, from the text alone. Throws TallyError 'document-invalid'
 * for an SVG without Tallyglyph marks ("not a Tallyglyph chart; use audit"), 'svg-malformed' for an
 * unreadable file; everything measurable becomes a report with pass or refuse.
 */
export function verifySvg(svgText: string, opts: VerifyOptions = {}): VerifyReport {
  const m = measureFile(svgText, opts);
  const { file, marks, verdict } = m;
  const lf = m.lieFactors;

  // Every check runs on the one measurement; a check that throws stops verification (nothing passes unchecked).
  const lieFactorFindings: IntegrityFinding[] = [];
  const otherBlocking: IntegrityFinding[] = [];
  const preflightFindings: Finding[] = [];
  for (const check of FILE_CHECKS) {
    for (const f of check.run(m)) {
      if (check.category === 'preflight') preflightFindings.push(asPreflightFinding(f));
      else if (check.category === 'lie-factor') lieFactorFindings.push(f);
      else otherBlocking.push(f);
    }
  }
  // The gate ranks failing pairs worst first across its codes: keep its ranking.
  const rank = new Map(verdict.findings.map((f, i) => [f, i] as const));
  lieFactorFindings.sort((a, b) => (rank.get(a) ?? Infinity) - (rank.get(b) ?? Infinity));
  const findings = [...lieFactorFindings, ...otherBlocking];
  const problems = findings.map((f) => f.message);

  const suggestions: string[] = [];
  const notes = [...m.notes];
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
    const ref = lf.reference !== null ? marks.find((mk) => mk.label === lf.reference) : undefined;
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
  for (const f of otherBlocking) if (!suggestions.includes(f.fix)) suggestions.push(f.fix);
  notes.push(...verdict.notes);

  const measured = m.file.summary?.measured;
  if (measured && measured.lieFactorWorst !== null && lf.worst?.lieFactor != null && Math.abs(measured.lieFactorWorst - lf.worst.lieFactor) > 0.005) {
    notes.push(`The file records a worst lie factor of ${num(measured.lieFactorWorst)}, but it measures ${num(lf.worst.lieFactor)} now.`);
  }

  const pass = problems.length === 0;
  const report: VerifyReport = {
    pass,
    mode: m.mode,
    reading: m.reading,
    lieFactor: summariseLieFactors(lf),
    spread: lf.spread,
    marks,
    problems,
    findings,
    suggestions: pass ? [] : suggestions,
    notes,
    preflight: preflightFindings,
    warnings: m.warnings,
    limits: { ...m.limits },
    page: { widthMm: file.page.widthMm, heightMm: file.page.heightMm, bleedMm: file.page.bleedMm },
    smallestGlyph: findSmallestGlyph(m),
    smallestInk: findSmallestInk(m.markInks, m.reading),
    summary: file.summary,
  };
  if (!pass) report.reason = problems[0];
  return report;
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

function findSmallestGlyph(m: MeasuredFile): VerifyReport['smallestGlyph'] {
  let best: VerifyReport['smallestGlyph'] = null;
  const consider = (mark: MarkInk['mark'], areaMm2: number, perimeterMm: number) => {
    if (!(areaMm2 > 0)) return;
    // Copies of one glyph agree to rounding noise: only a real difference moves the choice off the first.
    if (!best || areaMm2 < best.inkMm2 * (1 - 1e-9)) best = { markId: mark.id, label: mark.label, inkMm2: areaMm2, perimeterMm };
  };
  for (const mi of m.markInks) {
    if (m.reading === 'area') consider(mi.mark, mi.ink.areaMm2, mi.ink.perimeterMm);
    else if (m.reading === 'fill') {
      const whole = mi.pieces.filter((p) => p.piece.part === 'filled' || p.piece.part === 'rest');
      const area = whole.reduce((a, p) => a + p.ink.areaMm2, 0);
      const perimeter = whole.reduce((a, p) => a + p.ink.perimeterMm, 0);
      if (area > 0) consider(mi.mark, area, perimeter);
    } else for (const p of mi.fulls) consider(mi.mark, p.ink.areaMm2, p.ink.perimeterMm);
  }
  return best;
}

/** The smallest piece of ink drawn: every full and partial glyph, or each mark's whole glyph in scale and fill charts. */
function findSmallestInk(markInks: MarkInk[], reading: Reading): VerifyReport['smallestInk'] {
  let best: VerifyReport['smallestInk'] = null;
  const consider = (mark: MarkInk['mark'], areaMm2: number, perimeterMm: number, part: 'full' | 'partial' | 'glyph') => {
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

/** Throws TallyError('gate-refused') for a failing report, naming the reason and the first thing to try. */
export function assertVerified(report: VerifyReport, what = 'The chart'): void {
  if (report.pass) return;
  const fix = report.suggestions[0] ? ` Try: ${report.suggestions[0]}` : '';
  throw new TallyError('gate-refused', `${what} was refused: ${report.reason ?? 'it did not pass verification.'}${fix}`, report);
}
