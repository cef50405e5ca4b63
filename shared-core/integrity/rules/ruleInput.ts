// What every chart rule reads, and the small facts several rules share (periods, units, adjustments applied).
import type { ChartSpec } from '../../document/index';
import type { Scene } from '../../scene/index';
import { groupedNumber, periodSeries, type AdjustmentKind, type Period } from '../../standardise/index';
import type { IntegrityCheck, IntegrityFinding } from '../check';

/** The chart as written (spec) and as laid out (scene): rules about data read the first, rules about drawing the second. */
export interface RuleInput {
  spec: ChartSpec;
  scene: Scene;
}

export type ChartRule = IntegrityCheck<RuleInput>;

/** Column names that hold each row's period, checked in this order. */
const PERIOD_COLUMNS = ['period', 'year', 'date'];

/** The rows' periods when the chart is a series over time (from a period column, else the labels), else null. */
export function periodsOf(spec: ChartSpec): Period[] | null {
  const columns = spec.standardise?.columns ?? {};
  const name = PERIOD_COLUMNS.find((c) => columns[c] !== undefined);
  const labels = spec.data.map((r) => (name ? String(columns[name].values[r.label] ?? r.label) : r.label));
  return periodSeries(labels);
}

export function adjustedBy(spec: ChartSpec, kind: AdjustmentKind): boolean {
  return (spec.standardise?.adjustments?.steps ?? []).some((s) => s.kind === kind);
}

/** A finding of a rule, with the rule's code and severity unless given. */
export function findingOf(rule: Pick<ChartRule, 'code' | 'severity'>, f: Omit<IntegrityFinding, 'code' | 'severity'> & Partial<Pick<IntegrityFinding, 'code' | 'severity'>>): IntegrityFinding {
  return { code: rule.code, severity: rule.severity, ...f };
}

/** Relative spread of positive numbers: max / min - 1 (0 for fewer than two). */
export function relativeSpread(values: readonly number[]): number {
  const positive = values.filter((v) => v > 0);
  if (positive.length < 2) return 0;
  return Math.max(...positive) / Math.min(...positive) - 1;
}

/** A list of labels for a sentence: "A", "A and B", "A, B and 3 more". */
export function listed(labels: readonly string[], max = 3): string {
  const q = labels.map((l) => `"${l}"`);
  if (q.length <= 1) return q.join('');
  if (q.length <= max) return `${q.slice(0, -1).join(', ')} and ${q[q.length - 1]}`;
  return `${q.slice(0, max).join(', ')} and ${q.length - max} more`;
}

/** A number for a message: at most 4 significant digits, thousands grouped. */
export function shown(n: number): string {
  const rounded = Number(n.toPrecision(4));
  return rounded >= 1000 ? groupedNumber(rounded) : String(rounded);
}
