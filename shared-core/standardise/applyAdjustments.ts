// Adjustments as edits of a chart: applying one keeps the original data in the document, so it can be
// undone, replayed and checked; the footnote is derived from the recorded steps.
import { TallyError } from '../errors';
import { perCapitaPhrase } from './perCapita';
import { baseNameOf, runStep } from './runStep';
import type { AdjustmentStep, LabelledValue, Standardisation } from './types';

/** The parts of a chart document or ChartSpec that adjustments read and write. */
export interface AdjustableChart {
  data: { label: string; value: number }[];
  encoding: { unitName?: string };
  standardise?: Standardisation;
}

export interface ReplayResult {
  values: LabelledValue[];
  unitName: string | undefined;
  notes: string[];
}

/** Runs every recorded step from the original values. Throws TallyError('data-invalid') naming the step and the rows at fault. */
export function replayAdjustments(std: Standardisation): ReplayResult {
  const applied = std.adjustments;
  if (!applied) return { values: [], unitName: undefined, notes: [] };
  let values: LabelledValue[] = Object.entries(applied.original.values).map(([label, value]) => ({ label, value }));
  let unitName = applied.original.unitName;
  const notes: string[] = [];
  for (const step of applied.steps) {
    const out = runStep(values, unitName, step, std);
    values = out.values;
    unitName = out.unitName;
    notes.push(out.note);
  }
  return { values, unitName, notes };
}

/** The footnote words of one step, from the record alone (no values needed), matching what runStep says. */
export function stepNote(step: AdjustmentStep, std: Standardisation | undefined): string {
  switch (step.kind) {
    case 'per-capita':
      return perCapitaPhrase(step.per, baseNameOf(step, std));
    case 'price-index':
      return `adjusted to ${step.basePeriod.trim()} money with ${!step.indexColumn && std?.priceIndex?.name ? std.priceIndex.name : 'the supplied price index'}`;
    case 'share-of-total':
      return 'shown as a percentage of the total';
    case 'index-to-base':
      return `indexed to ${step.basePeriod.trim()} = 100`;
  }
}

/** "Figures adjusted to 2020 money with the supplied price index; per 100,000 residents." or null when nothing was adjusted. */
export function adjustmentFootnote(std: Standardisation | undefined): string | null {
  const steps = std?.adjustments?.steps ?? [];
  if (steps.length === 0) return null;
  return `Figures ${steps.map((s) => stepNote(s, std)).join('; ')}.`;
}

/**
 * The chart with one more adjustment applied: its values and unit name replaced by the adjusted ones, the
 * original values kept (from the first adjustment on) and the step recorded. Pure; throws TallyError
 * ('data-invalid') with every row at fault and leaves the chart as it was.
 */
export function applyAdjustment<T extends AdjustableChart>(chart: T, step: AdjustmentStep): T {
  const std: Standardisation = { ...chart.standardise };
  const original = std.adjustments?.original ?? {
    ...(chart.encoding.unitName !== undefined ? { unitName: chart.encoding.unitName } : {}),
    values: Object.fromEntries(chart.data.map((r) => [r.label, r.value])),
  };
  const steps = [...(std.adjustments?.steps ?? []), step];
  const recorded: Standardisation = { ...std, adjustments: { original, steps } };
  const replay = replayAdjustments(recorded);
  const byLabel = new Map(replay.values.map((v) => [v.label, v.value]));
  const missing = chart.data.filter((r) => !byLabel.has(r.label)).map((r) => r.label);
  if (missing.length > 0) {
    throw new TallyError('data-invalid', `The recorded original data has no value for ${missing.map((l) => `"${l}"`).join(', ')}: rows were added or renamed after the first adjustment. Remove the adjustments and apply them again.`);
  }
  const encoding = { ...chart.encoding };
  if (replay.unitName !== undefined) encoding.unitName = replay.unitName;
  return { ...chart, data: chart.data.map((r) => ({ ...r, value: byLabel.get(r.label) as number })), encoding, standardise: recorded };
}

/** The chart as it was before any adjustment: original values and unit name back, the steps removed. */
export function removeAdjustments<T extends AdjustableChart>(chart: T): T {
  const applied = chart.standardise?.adjustments;
  if (!applied) return chart;
  const rest: Standardisation = { ...chart.standardise };
  delete rest.adjustments;
  const encoding = { ...chart.encoding };
  if (applied.original.unitName !== undefined) encoding.unitName = applied.original.unitName;
  else delete encoding.unitName;
  const data = chart.data.map((r) => (Object.prototype.hasOwnProperty.call(applied.original.values, r.label) ? { ...r, value: applied.original.values[r.label] } : { ...r }));
  const out = { ...chart, data, encoding };
  if (Object.keys(rest).length > 0) out.standardise = rest;
  else delete out.standardise;
  return out;
}
