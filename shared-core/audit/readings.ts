// The four ways a reader may judge a mark's size, each measured on every mark and checked with
// Tufte's lie factor against the data: length, ink area, volume of a solid, and glyph count.
import { TallyError } from '../errors';
import { gate, lieFactors, type GateResult, type LieFactorPair, type LieFactorReport } from '../integrity';
import type { RepeatUnit } from './findRepeatUnit';
import type { MeasuredMark, ReadingName } from './types';

export interface ReadingPair {
  mark: string;
  reference: string;
  /** Tufte's lie factor of this mark against the reference (the mark with the smallest value). */
  lieFactor: number | null;
  dataRatio: number;
  graphicRatio: number | null;
  basis: 'effect' | 'ratio';
  problem?: string;
}

export interface ReadingResult {
  reading: ReadingName;
  available: boolean;
  /** Why the reading cannot be measured here (no repeated glyph, for count). */
  unavailableReason?: string;
  /** The measured quantity of each mark in mark order: units, units², units³ or glyphs. */
  measured: Array<number | null>;
  /** For length: which side was measured. */
  dimension?: 'height' | 'width' | 'given';
  lieFactor: {
    /** The lie factor farthest from 1 (in log terms) over every pair against the smallest value. */
    worst: number | null;
    worstPair: { mark: string; reference: string } | null;
    pairs: ReadingPair[];
  };
  /** max(g/d) / min(g/d): 1 when one scale serves every mark. */
  spread: number | null;
  /** Within Tufte's 0.95–1.05 (pairs and spread); null when nothing could be judged. */
  pass: boolean | null;
  verdict: 'faithful' | 'distorted' | 'not judged';
  /** The gate's sentences for each problem, most serious first. */
  problems: string[];
  notes: string[];
}

export type ReadingResults = Record<ReadingName, ReadingResult>;

function spreadOf(values: readonly number[]): number {
  const pos = values.filter((v) => v > 0);
  if (pos.length < 2) return 1;
  return Math.max(...pos) / Math.min(...pos);
}

/** The side that changes most across the marks (height on a tie): the one a reader compares. */
export function varyingDimension(marks: readonly MeasuredMark[]): 'height' | 'width' {
  const w = spreadOf(marks.map((m) => m.box.width));
  const h = spreadOf(marks.map((m) => m.box.height));
  return Math.log(w) > Math.log(h) * 1.01 + 1e-9 ? 'width' : 'height';
}

function judge(reading: ReadingName, marks: readonly MeasuredMark[], values: readonly number[], measured: number[], extra: Partial<ReadingResult>): ReadingResult {
  let report: LieFactorReport;
  try {
    report = lieFactors(marks.map((m, i) => ({ label: m.id, data: values[i], graphic: measured[i] })));
  } catch (e) {
    if (e instanceof TallyError && e.code === 'number-invalid') {
      return { reading, available: false, unavailableReason: e.message, measured, lieFactor: { worst: null, worstPair: null, pairs: [] }, spread: null, pass: null, verdict: 'not judged', problems: [], notes: [], ...extra };
    }
    throw e;
  }
  const g: GateResult = gate(report, { reading });
  const pairs = report.pairs.map((p: LieFactorPair) => {
    const out: ReadingPair = { mark: p.label, reference: p.reference, lieFactor: p.lieFactor, dataRatio: p.dataRatio, graphicRatio: p.graphicRatio, basis: p.basis };
    if (p.problem) out.problem = p.problem;
    return out;
  });
  const judged = report.pairs.length > 0 || report.zeros.length > 0;
  return {
    reading,
    available: true,
    measured,
    lieFactor: { worst: report.worst?.lieFactor ?? null, worstPair: report.worst ? { mark: report.worst.label, reference: report.worst.reference } : null, pairs },
    spread: report.spread,
    pass: judged ? g.pass : null,
    verdict: judged ? (g.pass ? 'faithful' : 'distorted') : 'not judged',
    problems: g.problems,
    notes: g.notes,
    ...extra,
  };
}

/**
 * Every reading of every mark against the values (same order as the marks). Volume is width² × height:
 * the depth of a drawn solid is taken to be its width (a barrel, a box or a cylinder seen from the front),
 * which equals height³ up to a constant whenever a picture is scaled uniformly, and stays right for a
 * 3-D bar whose width and depth are fixed while only its height grows.
 */
export function measureReadings(marks: readonly MeasuredMark[], values: readonly number[], unit: RepeatUnit | null): ReadingResults {
  if (marks.length !== values.length) throw new TallyError('usage', `There are ${marks.length} marks but ${values.length} values.`);
  const dimension = marks.every((m) => m.givenLengthUnits !== undefined) ? 'given' : varyingDimension(marks);
  const length = marks.map((m) => (dimension === 'given' ? (m.givenLengthUnits as number) : dimension === 'width' ? m.box.width : m.box.height));
  const area = marks.map((m) => m.inkAreaUnits2);
  const volume = marks.map((m) => m.box.width * m.box.width * m.box.height);
  const count = unit
    ? judge('count', marks, values, unit.perMark.map((p) => p.count), {})
    : {
        reading: 'count' as const,
        available: false,
        unavailableReason: 'The marks are not built from copies of one repeated picture, so there is nothing to count.',
        measured: marks.map(() => null),
        lieFactor: { worst: null, worstPair: null, pairs: [] },
        spread: null,
        pass: null,
        verdict: 'not judged' as const,
        problems: [],
        notes: [],
      };
  return {
    length: judge('length', marks, values, length, { dimension }),
    area: judge('area', marks, values, area, {}),
    volume: judge('volume', marks, values, volume, {}),
    count,
  };
}
