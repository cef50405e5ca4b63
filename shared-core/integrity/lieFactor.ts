// Tufte's lie factor for every category of a chart, measured against the smallest value.
//
// Tufte (The Visual Display of Quantitative Information, 1983, ch. 2, p. 57):
//   lie factor = size of effect shown in graphic / size of effect in data,
//   effect = (second - first) / first.
// The caller measures one quantity per category under one reading (glyph count with
// partial ink, ink area, length, filled share...) and passes it as `graphic`; this module
// only does the arithmetic, so it can be checked against the book's own figures.

import { TallyError } from '../errors';

export interface LieFactorItem {
  label: string;
  /** The value in the data table (any unit; only ratios matter). */
  data: number;
  /** The measured size of the mark under one reading (any unit; only ratios matter). */
  graphic: number;
}

/**
 * 'effect' is Tufte's definition. 'ratio' is the ratio variant, (g/g_ref) / (d/d_ref),
 * argued for in commentary on the book rather than in the book itself; it is used only
 * where the effect form has nothing stable to divide by (see RATIO_BASIS_BELOW).
 */
export type LieFactorBasis = 'effect' | 'ratio';

/** Why a pair cannot be judged by its number alone. */
export type PairProblem =
  /** The reference has data but no graphic: nothing in the chart can be scaled against it. */
  | 'reference-not-drawn'
  /** This category has data but no graphic. */
  | 'not-drawn'
  /** The data grow from the reference but the graphic shrinks (negative lie factor). */
  | 'wrong-direction'
  /** The data differ from the reference but the graphic shows no difference (lie factor 0). */
  | 'no-difference';

export interface LieFactorPair {
  label: string;
  reference: string;
  data: number;
  graphic: number;
  referenceData: number;
  referenceGraphic: number;
  /** data / referenceData; at least 1 because the reference is the smallest positive value. */
  dataRatio: number;
  /** graphic / referenceGraphic; null when the reference is drawn as nothing. */
  graphicRatio: number | null;
  /** (data - referenceData) / referenceData. */
  dataEffect: number;
  /** (graphic - referenceGraphic) / referenceGraphic: the graphic's own relative difference. */
  graphicEffect: number | null;
  /** graphicEffect / dataEffect on the 'effect' basis, graphicRatio / dataRatio on the 'ratio' basis. */
  lieFactor: number | null;
  /** The ratio variant, always given for comparison: graphicRatio / dataRatio. */
  ratioLieFactor: number | null;
  basis: LieFactorBasis;
  /** |ln lieFactor|: how far from faithful, symmetric in log terms. Infinity when no positive factor exists. */
  severity: number;
  problem?: PairProblem;
}

export interface ZeroCategory {
  label: string;
  graphic: number;
  /** A zero value must be drawn as nothing; false is a finding. */
  drawnAsZero: boolean;
}

export interface LieFactorReport {
  /** Label of the category with the smallest positive value; null when no value is positive. */
  reference: string | null;
  referenceData: number | null;
  referenceGraphic: number | null;
  /** Every other category with a positive value, in input order. */
  pairs: LieFactorPair[];
  /** The pair farthest from 1 in log terms; null when there is no pair. */
  worst: LieFactorPair | null;
  /**
   * max(g/d) / min(g/d) over categories with d > 0: 1 when one scale serves every category.
   * Scale-free, so it also catches two non-reference categories that disagree with each other.
   * null when a category with a positive value is drawn as nothing (the ratio is unbounded).
   */
  spread: number | null;
  /** The categories with the highest and lowest g/d, when spread is a number and there are two or more. */
  spreadBetween: { highest: string; lowest: string } | null;
  zeros: ZeroCategory[];
  /** Labels of categories with a positive value but no graphic at all. */
  notDrawn: string[];
  /** Plain sentences about what could not be compared, e.g. a single category. */
  notes: string[];
}

export interface LieFactorOptions {
  /** Below this |data effect| the ratio basis is used. Default RATIO_BASIS_BELOW. */
  ratioBasisBelow?: number;
  /**
   * A zero category counts as drawn as nothing when its graphic is at most this fraction of the
   * largest graphic in the chart. Default 1e-9: anything a reader could see is a finding.
   */
  zeroTolerance?: number;
}

/**
 * Below |data effect| 0.02 the effect-based lie factor is numerically unstable, so the ratio
 * basis is used instead.
 *
 * Arithmetic: measured ink carries a relative error e (outlines flattened and unioned agree with
 * a high-resolution raster to about e = 1e-4, i.e. 0.01%). Two measured values make the graphic
 * ratio g/g_ref uncertain by about 2e, so the graphic effect is off by up to 2e in absolute terms,
 * and the lie factor graphicEffect / dataEffect by 2e / dataEffect. Keeping that wobble at or
 * below 0.01, a fifth of the 0.05 tolerance, so that noise alone cannot push a faithful chart out
 * of the band, needs dataEffect >= 2e / 0.01 = 2 * 1e-4 / 0.01 = 0.02. The ratio form is stable
 * there: its error stays about 2e whatever the data difference.
 */
export const RATIO_BASIS_BELOW = 0.02;

const DEFAULT_ZERO_TOLERANCE = 1e-9;

function describeNumber(value: unknown): string {
  if (typeof value !== 'number') return `a ${typeof value}`;
  if (Number.isNaN(value)) return 'NaN (not a number)';
  return value > 0 ? 'infinite' : 'minus infinity';
}

function validate(items: readonly LieFactorItem[]): void {
  if (!Array.isArray(items) || items.length === 0) {
    throw new TallyError('data-invalid', 'There is nothing to compare: the chart has no categories.');
  }
  items.forEach((item, index) => {
    const name = typeof item?.label === 'string' && item.label !== '' ? `"${item.label}"` : `Category ${index + 1}`;
    if (typeof item?.data !== 'number' || !Number.isFinite(item.data)) {
      throw new TallyError('data-invalid', `${name} has a value that is ${describeNumber(item?.data)}; every value must be a finite number.`);
    }
    if (item.data < 0) {
      throw new TallyError(
        'data-invalid',
        `${name} has the negative value ${item.data}. No count, area or length of ink can show a negative amount, ` +
          'so its lie factor cannot be measured; show gains and losses as separate positive amounts.',
      );
    }
    if (typeof item.graphic !== 'number' || !Number.isFinite(item.graphic)) {
      throw new TallyError('number-invalid', `The measured size of ${name} is ${describeNumber(item.graphic)}; a measurement must be a finite number.`);
    }
    if (item.graphic < 0) {
      throw new TallyError('number-invalid', `The measured size of ${name} is negative (${item.graphic}); an amount of ink cannot be negative.`);
    }
  });
}

function severityOf(lieFactor: number | null): number {
  if (lieFactor === null || !(lieFactor > 0) || !Number.isFinite(lieFactor)) return Infinity;
  return Math.abs(Math.log(lieFactor));
}

function comparePair(
  item: LieFactorItem,
  ref: LieFactorItem,
  ratioBasisBelow: number,
): LieFactorPair {
  const dataRatio = item.data / ref.data;
  const dataEffect = (item.data - ref.data) / ref.data;
  const basis: LieFactorBasis = Math.abs(dataEffect) < ratioBasisBelow ? 'ratio' : 'effect';
  const base = {
    label: item.label,
    reference: ref.label,
    data: item.data,
    graphic: item.graphic,
    referenceData: ref.data,
    referenceGraphic: ref.graphic,
    dataRatio,
    dataEffect,
    basis,
  };
  if (ref.graphic === 0) {
    // Nothing to scale against: every graphic ratio would divide by zero.
    return { ...base, graphicRatio: null, graphicEffect: null, lieFactor: null, ratioLieFactor: null, severity: Infinity, problem: 'reference-not-drawn' };
  }
  const graphicRatio = item.graphic / ref.graphic;
  const graphicEffect = (item.graphic - ref.graphic) / ref.graphic;
  const ratioLieFactor = graphicRatio / dataRatio;
  const lieFactor = basis === 'ratio' ? ratioLieFactor : graphicEffect / dataEffect;
  let problem: PairProblem | undefined;
  if (item.graphic === 0) problem = 'not-drawn';
  else if (basis === 'effect' && lieFactor < 0) problem = 'wrong-direction';
  else if (basis === 'effect' && lieFactor === 0) problem = 'no-difference';
  const pair: LieFactorPair = { ...base, graphicRatio, graphicEffect, lieFactor, ratioLieFactor, severity: severityOf(lieFactor) };
  if (problem) pair.problem = problem;
  return pair;
}

/**
 * Lie factor of every category against the one with the smallest positive value.
 *
 * "Worst" is the pair whose lie factor is farthest from 1 in log terms, |ln LF|, so a graphic
 * that shows half the effect (0.5) and one that shows double (2) are equally bad; on a linear
 * scale |LF - 1| would rank 2 (off by 1) far worse than 0.5 (off by 0.5), which would let
 * understatement pass as milder than it is. Ties keep the first in input order.
 *
 * Refuses (TallyError 'data-invalid') negative, NaN or infinite values and an empty list;
 * refuses (TallyError 'number-invalid') a negative or non-finite measurement.
 */
export function lieFactors(items: readonly LieFactorItem[], opts: LieFactorOptions = {}): LieFactorReport {
  validate(items);
  const ratioBasisBelow = opts.ratioBasisBelow ?? RATIO_BASIS_BELOW;
  const zeroTolerance = opts.zeroTolerance ?? DEFAULT_ZERO_TOLERANCE;
  if (!(ratioBasisBelow >= 0) || !Number.isFinite(ratioBasisBelow)) {
    throw new TallyError('usage', `ratioBasisBelow must be a finite number of at least 0 (got ${ratioBasisBelow}).`);
  }
  if (!(zeroTolerance >= 0) || !Number.isFinite(zeroTolerance)) {
    throw new TallyError('usage', `zeroTolerance must be a finite number of at least 0 (got ${zeroTolerance}).`);
  }

  const notes: string[] = [];
  const maxGraphic = Math.max(...items.map((item) => item.graphic));
  const zeros: ZeroCategory[] = items
    .filter((item) => item.data === 0)
    .map((item) => ({ label: item.label, graphic: item.graphic, drawnAsZero: item.graphic <= zeroTolerance * maxGraphic }));

  const positive = items.filter((item) => item.data > 0);
  const notDrawn = positive.filter((item) => item.graphic === 0).map((item) => item.label);

  if (positive.length === 0) {
    notes.push('Every value is zero: there is no positive value to scale against, so no lie factor is defined.');
    return { reference: null, referenceData: null, referenceGraphic: null, pairs: [], worst: null, spread: 1, spreadBetween: null, zeros, notDrawn, notes };
  }

  let ref = positive[0];
  for (const item of positive) if (item.data < ref.data) ref = item;

  const pairs = positive.filter((item) => item !== ref).map((item) => comparePair(item, ref, ratioBasisBelow));
  let worst: LieFactorPair | null = null;
  for (const pair of pairs) if (worst === null || pair.severity > worst.severity) worst = pair;

  if (positive.length === 1) {
    notes.push(
      `Only "${ref.label}" has a positive value: there is no second value to compare it with, so a lie factor is not defined.`,
    );
  }

  let spread: number | null = null;
  let spreadBetween: LieFactorReport['spreadBetween'] = null;
  if (notDrawn.length === 0) {
    let highest = positive[0];
    let lowest = positive[0];
    for (const item of positive) {
      if (item.graphic / item.data > highest.graphic / highest.data) highest = item;
      if (item.graphic / item.data < lowest.graphic / lowest.data) lowest = item;
    }
    spread = highest.graphic / highest.data / (lowest.graphic / lowest.data);
    if (positive.length > 1) spreadBetween = { highest: highest.label, lowest: lowest.label };
  }

  return { reference: ref.label, referenceData: ref.data, referenceGraphic: ref.graphic, pairs, worst, spread, spreadBetween, zeros, notDrawn, notes };
}
