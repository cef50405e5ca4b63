// The audit of a supplied graphic, as one chain of pure steps:
// importSvg → findSvgMarks → values (user, file, labels) → readings → suggestion → report.
import { TallyError, type Warning } from '../errors';
import type { Box } from '../geometry/region';
import { DISTORTION_LIMITS } from '../integrity';
import { auditLimits, type AuditLimits } from './auditLimits';
import { findRepeatUnit } from './findRepeatUnit';
import { findSvgMarks, type SvgMark } from './findSvgMarks';
import { importSvg, type ImportedSvg } from './importSvg';
import { pairLabels, type LabelCandidate, type LabelPairing } from './pairLabels';
import { parseValueSpec, resolveValues, type ResolvedValue, type ValueSource, type ValueSpec } from './parseValues';
import { measureReadings, type ReadingResult, type ReadingResults } from './readings';
import { suggestReading } from './suggestReading';
import { verdictSentence } from './verdictSentence';
import type { MeasuredMark, ReadingName, SetAside, SolidCue, SourceUnit } from './types';

export interface AuditedMark {
  id: string;
  label: string;
  value: number;
  valueFrom: ValueSource;
  /** The label a value was read from. */
  labelText?: string;
  xUnits: number;
  yUnits: number;
  widthUnits: number;
  heightUnits: number;
  bboxAreaUnits2: number;
  inkAreaUnits2: number;
  /** Ink over the repeated glyph's ink; null when no glyph repeats or the mark holds other pieces. */
  count: number | null;
  /** Whole copies of the repeated glyph in the mark. */
  repeats: number;
  /** Sub-glyphs found in the mark. */
  parts: number;
  givenLengthUnits?: number;
  solid: boolean;
  solidCues: SolidCue[];
  colours: string[];
}

export interface AuditReport {
  format: 'tallyglyph.audit/1';
  source: 'svg' | 'raster';
  /** Unit of every length (areas in its square, volumes in its cube). */
  unit: SourceUnit;
  marks: AuditedMark[];
  readings: ReadingResults;
  /** The reading the geometry suggests; corrections make this one honest. */
  suggested: ReadingName;
  volumeReadable: boolean;
  /** Plain sentences on why the suggested reading applies. */
  reasons: string[];
  /** One sentence on the suggested reading's worst lie factor, for a client. */
  verdict: { reading: ReadingName; pass: boolean | null; worst: number | null; sentence: string };
  pairings: LabelPairing[];
  unpairedLabels: string[];
  setAside: SetAside[];
  warnings: Warning[];
  /** Tufte's band of acceptable lie factors. */
  limits: { low: number; high: number };
}

export type ValuesInput = string | readonly number[] | Readonly<Record<string, number>> | ValueSpec;

export function toValueSpec(values: ValuesInput | undefined): ValueSpec | null {
  if (values === undefined) return null;
  if (typeof values === 'string') return parseValueSpec(values);
  if (Array.isArray(values)) return { kind: 'ordered', values: [...(values as readonly number[])] };
  const v = values as ValueSpec | Readonly<Record<string, number>>;
  if ('kind' in v && (v.kind === 'ordered' || v.kind === 'named') && 'values' in v) return v as ValueSpec;
  return { kind: 'named', values: { ...(v as Record<string, number>) } };
}

export interface AuditSvgOptions {
  values?: ValuesInput;
  /** Ids of the elements that are the marks (in value order), instead of finding them. */
  markIds?: readonly string[];
  /** Lengths measured by the user (two points), in mark order or by mark id, in root units. */
  givenLengths?: readonly number[] | Readonly<Record<string, number>>;
  /** The user says the drawing is 3-D. */
  solid?: boolean;
  minInkFraction?: number;
  limits?: Partial<AuditLimits>;
  now?: () => number;
}

export interface MarksAuditInput {
  source: 'svg' | 'raster';
  unit: SourceUnit;
  marks: readonly MeasuredMark[];
  values: readonly ResolvedValue[];
  pairings?: readonly LabelPairing[];
  unpairedLabels?: readonly string[];
  setAside?: readonly SetAside[];
  warnings?: readonly Warning[];
  solid?: boolean;
}

export function applyGivenLengths<T extends MeasuredMark>(marks: T[], given: AuditSvgOptions['givenLengths']): T[] {
  if (!given) return marks;
  if (Array.isArray(given)) {
    const list = given as readonly number[];
    if (list.length !== marks.length) throw new TallyError('usage', `${list.length} length(s) were given but the graphic has ${marks.length} mark(s); give one per mark.`);
    return marks.map((m, i) => ({ ...m, givenLengthUnits: checkLength(list[i]) }));
  }
  const named = given as Readonly<Record<string, number>>;
  const unknown = Object.keys(named).filter((id) => !marks.some((m) => m.id === id));
  if (unknown.length) throw new TallyError('usage', `There is no mark "${unknown[0].slice(0, 60)}" to give a length to.`);
  if (Object.keys(named).length !== marks.length) throw new TallyError('usage', 'Give a length for every mark, or for none: the length reading compares them with each other.');
  return marks.map((m) => ({ ...m, givenLengthUnits: checkLength(named[m.id]) }));
}

function checkLength(v: number): number {
  if (!Number.isFinite(v) || v < 0) throw new TallyError('usage', `A given length must be a finite number of at least 0 (got ${v}).`);
  return v;
}

/** Audit marks measured anywhere (SVG or raster) against their values. */
export function auditMarks(input: MarksAuditInput): AuditReport {
  const { marks, values } = input;
  if (!marks.length) throw new TallyError('glyph-empty', 'There are no marks to audit.');
  if (values.length !== marks.length) throw new TallyError('usage', `There are ${marks.length} marks but ${values.length} values.`);
  const unit = findRepeatUnit(marks);
  const readings = measureReadings(marks, values.map((v) => v.value), unit);
  const suggestion = suggestReading(marks, unit, { solid: input.solid });
  const audited: AuditedMark[] = marks.map((m, i) => {
    const a: AuditedMark = {
      id: m.id,
      label: m.label,
      value: values[i].value,
      valueFrom: values[i].from,
      xUnits: m.box.x,
      yUnits: m.box.y,
      widthUnits: m.box.width,
      heightUnits: m.box.height,
      bboxAreaUnits2: m.box.width * m.box.height,
      inkAreaUnits2: m.inkAreaUnits2,
      count: unit ? unit.perMark[i].count : null,
      repeats: unit ? unit.perMark[i].repeats : 0,
      parts: m.parts.length,
      solid: m.solidCues.length > 0 || Boolean(input.solid),
      solidCues: input.solid && !m.solidCues.includes('declared') ? [...m.solidCues, 'declared'] : [...m.solidCues],
      colours: m.colours,
    };
    if (values[i].labelText !== undefined) a.labelText = values[i].labelText;
    if (m.givenLengthUnits !== undefined) a.givenLengthUnits = m.givenLengthUnits;
    return a;
  });
  const chosen: ReadingResult = readings[suggestion.suggested];
  return {
    format: 'tallyglyph.audit/1',
    source: input.source,
    unit: input.unit,
    marks: audited,
    readings,
    suggested: suggestion.suggested,
    volumeReadable: suggestion.volumeReadable,
    reasons: suggestion.reasons,
    verdict: { reading: suggestion.suggested, pass: chosen.pass, worst: chosen.lieFactor.worst, sentence: verdictSentence(chosen, audited) },
    pairings: [...(input.pairings ?? [])],
    unpairedLabels: [...(input.unpairedLabels ?? [])],
    setAside: [...(input.setAside ?? [])],
    warnings: [...(input.warnings ?? [])],
    limits: { ...DISTORTION_LIMITS },
  };
}

export interface SvgAudit {
  report: AuditReport;
  /** The marks as found, with their elements, for correcting the file. */
  marks: SvgMark[];
  imported: ImportedSvg;
}

/** Audit a supplied SVG (text already decoded; see main/audit for files). Throws TallyError on refusal. */
export function auditSvgDetailed(text: string, opts: AuditSvgOptions = {}): SvgAudit {
  const imp = importSvg(text, auditLimits(opts.limits));
  const found = findSvgMarks(imp, { markIds: opts.markIds, minInkFraction: opts.minInkFraction, now: opts.now });
  const marks = applyGivenLengths(found.marks, opts.givenLengths);
  const labels: LabelCandidate[] = imp.labels;
  const paired = pairLabels(marks, labels);
  const values = resolveValues(marks, toValueSpec(opts.values), paired.pairs);
  // Only pairings that supplied a value are worth reporting as "paired".
  const used = paired.pairs.filter((p) => values[marks.findIndex((m) => m.id === p.mark)]?.from === 'label');
  const warnings = [...imp.warnings, ...pageEdgeWarnings(marks, imp.viewBox)];
  // A Tallyglyph fill chart shows a share of each glyph's ink, a reading this audit does not measure.
  if (marks.some((m) => m.elements.some((e) => e.attrs['data-reading'] === 'fill'))) {
    warnings.push({ code: 'fill-reading', message: 'This is a Tallyglyph fill chart, read by the filled share of each glyph\'s ink; `tallyglyph verify` checks that reading, which this audit does not measure.' });
  }
  const report = auditMarks({
    source: 'svg',
    unit: 'user unit',
    marks,
    values,
    pairings: used,
    unpairedLabels: paired.unpaired,
    setAside: found.setAside,
    warnings,
    solid: opts.solid,
  });
  return { report, marks, imported: imp };
}

export function auditSvg(text: string, opts: AuditSvgOptions = {}): AuditReport {
  return auditSvgDetailed(text, opts).report;
}

/** Marks reaching past the viewBox: the part outside does not show, though it is measured. */
export function pageEdgeWarnings(marks: readonly MeasuredMark[], viewBox: Box | null): Warning[] {
  if (!viewBox) return [];
  const slack = Math.max(viewBox.width, viewBox.height) * 1e-6;
  return marks
    .filter((m) => m.box.x < viewBox.x - slack || m.box.y < viewBox.y - slack || m.box.x + m.box.width > viewBox.x + viewBox.width + slack || m.box.y + m.box.height > viewBox.y + viewBox.height + slack)
    .map((m) => ({ code: 'mark-outside-page', message: `Mark ${m.id} reaches past the edge of the page: the part outside does not show, but it is measured.` }));
}
