// Turns a lie-factor report into pass or refuse, with the reason in plain words and what to try next. Its
// findings carry the codes of the lie-factor checks in the registry (./checks), which report them.

import { TallyError } from '../errors';
import type { IntegrityFinding } from './check';
import { lieFactor as lieFactorCheck } from './checks/lieFactor';
import { TUFTE_BASIS } from './checks/lieFactorBasis';
import { notDrawn } from './checks/notDrawn';
import { referenceNotDrawn } from './checks/referenceNotDrawn';
import { spread as spreadCheck } from './checks/spread';
import { zeroDrawn } from './checks/zeroDrawn';
import type { LieFactorPair, LieFactorReport } from './lieFactor';

/**
 * Tufte (The Visual Display of Quantitative Information, 1983, ch. 2, p. 57): lie factors
 * greater than 1.05 or less than 0.95 indicate substantial distortion. The ends themselves pass.
 */
export const DISTORTION_LIMITS: Readonly<{ low: number; high: number }> = Object.freeze({ low: 0.95, high: 1.05 });

/** How the chart encodes values; the same words as the document's encoding.mode. */
export type GateMode = 'repeat' | 'stack' | 'scale' | 'fill';
export type GateRounding = 'ink-cut' | 'whole';
/** What the measured `graphic` quantity was. */
export type GateReading = 'count' | 'area' | 'length' | 'volume' | 'fill';

export interface GateOptions {
  low?: number;
  high?: number;
  /** Context for the suggestions; none of it changes the verdict. */
  mode?: GateMode;
  rounding?: GateRounding;
  reading?: GateReading;
}

export interface GateResult {
  pass: boolean;
  /** The main reason for a refusal: the worst pair when it is out of bounds. */
  reason?: string;
  /** The pair farthest from faithful, pass or not. */
  worst?: LieFactorPair;
  /** Every reason to refuse, most serious first. Empty when the chart passes. */
  problems: string[];
  /** The same reasons, each with its own stable code and the fix for that problem (same order). */
  findings: IntegrityFinding[];
  suggestions: string[];
  /** What could not be judged (a single category, all zeros). */
  notes: string[];
  limits: { low: number; high: number };
}

// Floating-point slack so that a factor meant to be exactly 1.05 (e.g. 2.05 / 2 computed as
// 1.0499999999999998 or 1.0500000000000003) is judged by the intended value.
const LIMIT_SLACK = 1e-12;

function within(value: number, low: number, high: number): boolean {
  return value >= low - LIMIT_SLACK && value <= high + LIMIT_SLACK;
}

function fixed(value: number, digits: number): string {
  if (!Number.isFinite(value)) return value > 0 ? 'infinitely' : String(value);
  if (value !== 0 && Math.abs(value) < 0.01) return value.toPrecision(2);
  return value.toFixed(digits);
}

/** A ratio as the reader should see it: two decimals, more when two decimals would read as exactly 1. */
function ratioText(value: number): string {
  if (value !== 1 && Math.abs(value - 1) < 0.005) return value.toFixed(4);
  return fixed(value, 2);
}

/** A lie factor with enough decimals that a failing value never prints as a passing one. */
function factorText(value: number, low: number, high: number): string {
  let digits = 2;
  let text = fixed(value, digits);
  while (digits < 8 && !within(value, low, high) && within(Number(text), low, high)) {
    digits += 1;
    text = fixed(value, digits);
  }
  return text;
}

function numberText(value: number): string {
  return Number.isInteger(value) ? String(value) : String(Number(value.toPrecision(6)));
}

/**
 * "(3.00 − 1) / (3.75 − 1) = 0.73": the effect form of the lie factor (Tufte 1983, p. 57) with the ratios
 * written to as many decimals (2 to 6) as it takes for the sum of the printed numbers to give the printed factor.
 */
export function effectForm(graphicRatio: number, dataRatio: number, lieFactor: number, low: number, high: number): string {
  const shown = factorText(lieFactor, low, high);
  let digits = 2;
  let g = graphicRatio.toFixed(digits);
  let d = dataRatio.toFixed(digits);
  while (digits < 6) {
    const redone = (Number(g) - 1) / (Number(d) - 1);
    if (Number.isFinite(redone) && fixed(redone, shown.split('.')[1]?.length ?? 2) === shown) break;
    digits += 1;
    g = graphicRatio.toFixed(digits);
    d = dataRatio.toFixed(digits);
  }
  return `(${g} − 1) / (${d} − 1) = ${shown}`;
}

/** "drawn <phrase> <reference>" for the reading at hand. */
function drawnAs(times: string, only: boolean, reading: GateReading | undefined): string {
  const o = only ? 'only ' : '';
  switch (reading) {
    case 'count':
      return `drawn with ${o}${times}x as many glyphs as`;
    case 'area':
      return `drawn with ${o}${times}x the ink area of`;
    case 'length':
      return `drawn ${o}${times}x as long as`;
    case 'volume':
      return `drawn with ${o}${times}x the volume of`;
    case 'fill':
      return `drawn with ${o}${times}x the filled ink of`;
    default:
      return `drawn ${o}${times}x as large as`;
  }
}

function pairSentence(pair: LieFactorPair, low: number, high: number, reading: GateReading | undefined): string {
  const allowed = `allowed ${numberText(low)}–${numberText(high)}`;
  if (pair.problem === 'reference-not-drawn') {
    return `${pair.reference} (value ${numberText(pair.referenceData)}) is not drawn at all, so nothing in the chart can be compared with it.`;
  }
  if (pair.problem === 'not-drawn') {
    return `${pair.label} (value ${numberText(pair.data)}) is not drawn at all, although ${pair.reference} (value ${numberText(pair.referenceData)}) is.`;
  }
  const lf = pair.lieFactor as number;
  const gr = pair.graphicRatio as number;
  const factor = `lie factor ${factorText(lf, low, high)}`;
  // Tufte's effect form, so a reader can redo the sum: (drawn ratio - 1) / (data ratio - 1).
  const form = pair.basis === 'effect' ? `: ${effectForm(gr, pair.dataRatio, lf, low, high)}, the growth drawn over the growth in the data` : '';
  if (pair.basis === 'ratio') {
    const basisNote = 'on the ratio basis, because the values differ by less than 2%';
    if (pair.dataEffect === 0) {
      return `${pair.label} has the same value as ${pair.reference} but is ${drawnAs(ratioText(gr), false, reading)} ${pair.reference} (${factor} on the ratio basis, ${allowed}).`;
    }
    return `${pair.label} is ${drawnAs(ratioText(gr), false, reading)} ${pair.reference} but its value is ${ratioText(pair.dataRatio)}x (${factor} ${basisNote}, ${allowed}).`;
  }
  if (gr <= 1) {
    const how = gr === 1 ? 'drawn the same size as' : drawnAs(ratioText(gr), false, reading);
    return `${pair.label} is ${how} ${pair.reference} although its value is ${ratioText(pair.dataRatio)}x as large (${factor}, ${allowed})${form}.`;
  }
  if (lf > 1) {
    return `${pair.label} is ${drawnAs(ratioText(gr), false, reading)} ${pair.reference} but its value is only ${ratioText(pair.dataRatio)}x (${factor}, ${allowed})${form}.`;
  }
  return `${pair.label} is ${drawnAs(ratioText(gr), true, reading)} ${pair.reference} although its value is ${ratioText(pair.dataRatio)}x (${factor}, ${allowed})${form}.`;
}

function addSuggestions(out: Set<string>, opts: GateOptions, kinds: Set<string>): void {
  const { mode, rounding, reading } = opts;
  if (kinds.has('zero')) out.add('Draw nothing for a zero value; a value label can still say 0.');
  if (kinds.has('not-drawn')) {
    out.add('A value smaller than one unit still needs ink: use partial glyphs cut by ink (rounding "ink-cut") or a smaller unit.');
  }
  // Advice about rounding, sizes and scaling speaks to a distorted drawing, not to a missing or zero category.
  if (!kinds.has('lie-factor') && !kinds.has('spread')) return;
  if (rounding === 'whole') {
    out.add('Show remainders as partial glyphs cut by ink (rounding "ink-cut"), so half a unit shows half of a glyph\'s ink.');
    out.add('Or use a smaller unit, so rounding to whole glyphs changes each amount less.');
  }
  if (mode === 'scale') {
    if (reading === 'length') {
      out.add('These glyphs are read by height, which grows only with the square root of the value when ink area is scaled: repeat or stack glyphs of one size instead (mode "repeat" or "stack").');
    } else if (reading === 'volume') {
      out.add('A glyph that looks three-dimensional is read by volume: use a flat glyph, or repeat or stack glyphs of one size (mode "repeat" or "stack").');
    } else {
      out.add('Scale each glyph by ink area (mode "scale"), not by height: scaling height makes the area grow with the square of the value.');
      out.add('Or repeat or stack glyphs of one size (mode "repeat" or "stack"), so each glyph stands for a fixed amount.');
    }
  } else if (mode === 'repeat' || mode === 'stack') {
    // Rounding to whole glyphs already explains the distortion; advice about sizes and pitch would send the
    // designer looking for a fault the chart does not have.
    if (rounding !== 'whole') {
      out.add('Use one glyph at one size for the whole chart, so every glyph carries the same amount of ink.');
      if (mode === 'stack') out.add('In a stack, give each glyph one pitch (glyph size plus gap) of length from the baseline.');
    }
    if (reading === 'area') out.add('Different glyphs in one chart carry different ink: read the chart by count, or use one glyph throughout.');
  } else if (mode === 'fill') {
    out.add('Fill each glyph by its share of ink (cut where the ink on one side equals the share), not by a share of its height or width.');
  } else if (out.size === 0) {
    out.add('Repeat or stack glyphs of one size with partial glyphs cut by ink: count, length and ink then all stay in proportion to the data.');
  }
}

/**
 * Pass when every pair's lie factor lies within [low, high] (ends included), every zero is drawn
 * as nothing, every positive value is drawn, and the scale-free spread stays within
 * min(high, 1/low), which bounds the ratio lie factor between any two categories in either order.
 */
export function gate(report: LieFactorReport, opts: GateOptions = {}): GateResult {
  const low = opts.low ?? DISTORTION_LIMITS.low;
  const high = opts.high ?? DISTORTION_LIMITS.high;
  if (!Number.isFinite(low) || !Number.isFinite(high) || !(low > 0) || !(low <= 1) || !(high >= 1)) {
    throw new TallyError('usage', `The distortion limits must satisfy 0 < low <= 1 <= high (got low ${low}, high ${high}).`);
  }
  const reading = opts.reading;
  const problems: string[] = [];
  const found: { code: string; message: string; category?: string }[] = [];
  const kinds = new Set<string>();
  const flag = (code: string, message: string, category?: string) => {
    problems.push(message);
    found.push(category === undefined ? { code, message } : { code, message, category });
  };

  const failing = report.pairs
    .filter((pair) => pair.lieFactor === null || !within(pair.lieFactor, low, high))
    .sort((a, b) => b.severity - a.severity);
  let referenceReported = false;
  for (const pair of failing) {
    if (pair.problem === 'reference-not-drawn') {
      // One sentence for the reference, not one per pair that shares it.
      if (referenceReported) continue;
      referenceReported = true;
    }
    const sentence = pairSentence(pair, low, high, reading);
    if (pair.problem === 'reference-not-drawn') {
      kinds.add('not-drawn');
      flag(referenceNotDrawn.code, sentence, pair.reference);
    } else if (pair.problem === 'not-drawn') {
      kinds.add('not-drawn');
      flag(notDrawn.code, sentence, pair.label);
    } else {
      kinds.add('lie-factor');
      flag(lieFactorCheck.code, sentence, pair.label);
    }
  }

  if (report.pairs.length === 0 && report.notDrawn.length > 0) {
    kinds.add('not-drawn');
    flag(referenceNotDrawn.code, `${report.reference} (value ${numberText(report.referenceData ?? 0)}) is not drawn at all.`, report.reference ?? undefined);
  }

  for (const zero of report.zeros) {
    if (zero.drawnAsZero) continue;
    kinds.add('zero');
    flag(zeroDrawn.code, `${zero.label} has a value of 0 but is drawn with ink (measured ${numberText(zero.graphic)}); a zero must show nothing.`, zero.label);
  }

  const spreadLimit = Math.min(high, 1 / low);
  if (failing.length === 0 && report.spread !== null && report.spreadBetween && !within(report.spread, 1 / spreadLimit, spreadLimit)) {
    const { highest, lowest } = report.spreadBetween;
    flag(
      spreadCheck.code,
      `The chart does not keep one scale: per unit of value, ${highest} is drawn ${factorText(report.spread, 1 / spreadLimit, spreadLimit)}x as large as ${lowest} ` +
        `(allowed up to ${numberText(spreadLimit)}).`,
      highest,
    );
    kinds.add('spread');
  }

  const fixFor = (code: string): string => {
    const kind = code === referenceNotDrawn.code ? 'not-drawn' : code === zeroDrawn.code ? 'zero' : code;
    const own = new Set<string>();
    addSuggestions(own, opts, new Set([kind]));
    return [...own][0] ?? 'Repeat or stack glyphs of one size with partial glyphs cut by ink, so count, length and ink stay in proportion to the data.';
  };
  const findings: IntegrityFinding[] = found.map((f) => ({ ...f, severity: 'blocking', fix: fixFor(f.code), basis: TUFTE_BASIS }));
  const result: GateResult = { pass: problems.length === 0, problems, findings, suggestions: [], notes: [...report.notes], limits: { low, high } };
  if (report.worst) result.worst = report.worst;
  if (!result.pass) {
    result.reason = problems[0];
    const suggestions = new Set<string>();
    addSuggestions(suggestions, opts, kinds);
    result.suggestions = [...suggestions];
  }
  return result;
}
