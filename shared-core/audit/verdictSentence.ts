// One sentence a designer can forward: which mark is most out of proportion, by how much, and what
// the lie factor means.
import { DISTORTION_LIMITS } from '../integrity';
import { formatFactor, formatRatio } from './formatNumbers';
import type { ReadingResult } from './readings';
import type { ReadingName } from './types';

const DRAWN: Record<ReadingName, (r: string) => string> = {
  length: (r) => `drawn ${r} times as long`,
  area: (r) => `drawn with ${r} times the area`,
  volume: (r) => `drawn with ${r} times the volume`,
  count: (r) => `drawn with ${r} times as many pictures`,
};

const READ_AS: Record<ReadingName, string> = {
  length: 'length',
  area: 'area',
  volume: 'volume',
  count: 'number of pictures',
};

/**
 * The lie factor written out as it is computed, so a reader can redo it: Tufte's effect form
 * (The Visual Display of Quantitative Information, 1983, p. 57), (drawn ratio − 1) ÷ (data ratio − 1),
 * or drawn ratio ÷ data ratio where the values differ by less than 2% (the ratio form, labelled).
 */
export function lieFactorFormula(pair: { graphicRatio: number | null; dataRatio: number; basis: 'effect' | 'ratio'; lieFactor: number | null }): string | null {
  if (pair.graphicRatio === null || pair.lieFactor === null || !Number.isFinite(pair.graphicRatio) || !Number.isFinite(pair.dataRatio)) return null;
  const shown = formatFactor(pair.lieFactor);
  const form = (g: number, d: number) => (pair.basis === 'ratio' ? g / d : (g - 1) / (d - 1));
  // The ratios as the report rounds them, with more significant digits where the division written
  // out with fewer would not give the figure shown.
  let g = formatRatio(pair.graphicRatio);
  let d = formatRatio(pair.dataRatio);
  for (let digits = 4; digits <= 8 && formatFactor(form(Number(g), Number(d))) !== shown; digits++) {
    g = String(Number(pair.graphicRatio.toPrecision(digits)));
    d = String(Number(pair.dataRatio.toPrecision(digits)));
  }
  if (pair.basis === 'ratio') return `${g} ÷ ${d} = ${shown} (ratio form: the values differ by less than 2%)`;
  return `(${g} − 1) ÷ (${d} − 1) = ${shown}`;
}

export function verdictSentence(result: ReadingResult, marks: readonly { id: string; label: string; value: number }[]): string {
  const band = `${DISTORTION_LIMITS.low.toFixed(2)}–${DISTORTION_LIMITS.high.toFixed(2)}`;
  if (!result.available) return `The marks cannot be read by ${READ_AS[result.reading]}: ${result.unavailableReason ?? ''}`.trim();
  const pair = result.lieFactor.pairs.find((p) => result.lieFactor.worstPair && p.mark === result.lieFactor.worstPair.mark);
  if (!pair) {
    if (result.problems.length) return result.problems[0];
    return `There is only one mark with a positive value, so there is nothing to compare it with.`;
  }
  const name = (id: string) => {
    const m = marks.find((x) => x.id === id);
    return m && m.label !== m.id ? `"${m.label}"` : id;
  };
  const lf = pair.lieFactor;
  if (pair.problem === 'reference-not-drawn' || pair.problem === 'not-drawn' || lf === null) {
    return result.problems[0] ?? `${name(pair.mark)} cannot be compared with ${name(pair.reference)}.`;
  }
  const formula = lieFactorFormula(pair);
  const factor = formula ? `lie factor ${formula}, the growth drawn over the growth in the data` : `lie factor ${formatFactor(lf)}`;
  const shown = `${name(pair.mark)} stands for ${formatRatio(pair.dataRatio)} times the value of ${name(pair.reference)} and is ${DRAWN[result.reading](formatRatio(pair.graphicRatio))}`;
  if (result.pass) {
    return `Read by ${READ_AS[result.reading]}, the marks are in proportion to the data: ${shown}, a lie factor of ${formula ?? formatFactor(lf)}, within the ${band} that Tufte accepts as faithful.`;
  }
  if (lf > 1) {
    return `Read by ${READ_AS[result.reading]}, the drawing exaggerates: ${shown}, so it shows the difference ${formatFactor(lf)} times as big as the data does (${factor}; Tufte counts anything outside ${band} as substantial distortion).`;
  }
  if (lf > 0) {
    return `Read by ${READ_AS[result.reading]}, the drawing understates: ${shown}, so it shows only ${Math.round(lf * 100)}% of the difference in the data (${factor}; Tufte counts anything outside ${band} as substantial distortion).`;
  }
  return `Read by ${READ_AS[result.reading]}, the drawing contradicts the data: ${shown} (${factor}).`;
}
