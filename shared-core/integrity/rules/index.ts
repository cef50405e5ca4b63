// The registry of chart rules beyond the lie factor, and the one call the app, the gate and the command line
// use: runRules(spec, scene). Each rule lives in its own file named after it.
import type { ChartSpec } from '../../document/index';
import { isTallyError } from '../../errors';
import type { Scene } from '../../scene/index';
import type { DismissedFinding } from '../../standardise/index';
import type { IntegrityFinding } from '../check';
import { adjustmentStale } from './adjustmentStale';
import { contextThin } from './contextThin';
import { decorationHeavy } from './dataInk';
import { glyphsUnnormalised } from './glyphsUnnormalised';
import { groupSizeIgnored } from './groupSizeIgnored';
import { mixedUnits } from './mixedUnits';
import { moneyNominal } from './moneyNominal';
import { perceptualUndisclosed } from './perceptualUndisclosed';
import type { ChartRule } from './ruleInput';
import { roundingError } from './roundingError';
import { scaleInconsistent } from './scaleInconsistent';
import { sourceUnstated } from './sourceUnstated';
import { timeUneven } from './timeUneven';
import { unitUnstated } from './unitUnstated';
import { volumeCue } from './volumeCue';

/** Every rule, in the order findings are listed: data first, then drawing, then labelling. */
export const CHART_RULES: readonly ChartRule[] = Object.freeze([
  moneyNominal,
  groupSizeIgnored,
  mixedUnits,
  adjustmentStale,
  scaleInconsistent,
  glyphsUnnormalised,
  perceptualUndisclosed,
  volumeCue,
  roundingError,
  timeUneven,
  contextThin,
  unitUnstated,
  sourceUnstated,
  decorationHeavy,
]);

export interface DismissedResult {
  finding: IntegrityFinding;
  reason: string;
}

export interface RuleReport {
  /** Findings still open, in rule order. */
  findings: IntegrityFinding[];
  /** Warnings and advice the designer set aside, with the reason kept in the document. */
  dismissed: DismissedResult[];
}

const SEVERITY_ORDER = { blocking: 0, warning: 1, advice: 2 } as const;

/** A dismissal matches a finding by code (or the rule code its sub-code starts with) and, when it names one, by category. */
function dismissalFor(finding: IntegrityFinding, dismissed: readonly DismissedFinding[]): DismissedFinding | undefined {
  if (finding.severity === 'blocking') return undefined;
  return dismissed.find((d) => (finding.code === d.code || finding.code.startsWith(`${d.code}-`)) && (d.category === undefined || d.category === finding.category));
}

/** Runs every rule; a rule that fails is reported as a finding of its own rather than dropped. */
export function checkChart(spec: ChartSpec, scene: Scene, rules: readonly ChartRule[] = CHART_RULES): RuleReport {
  const all: IntegrityFinding[] = [];
  for (const rule of rules) {
    try {
      all.push(...rule.run({ spec, scene }));
    } catch (e) {
      all.push({
        code: `${rule.code}-not-run`,
        severity: 'advice',
        message: `The check "${rule.name}" could not run: ${isTallyError(e) ? e.message : e instanceof Error ? e.message : String(e)}`,
        fix: 'Check the data this rule reads; the other checks ran as usual.',
        basis: 'common practice, no source',
      });
    }
  }
  const findings: IntegrityFinding[] = [];
  const dismissed: DismissedResult[] = [];
  for (const f of all) {
    const d = dismissalFor(f, spec.dismissed ?? []);
    if (d) dismissed.push({ finding: f, reason: d.reason });
    else findings.push(f);
  }
  findings.sort((a, b) => SEVERITY_ORDER[a.severity] - SEVERITY_ORDER[b.severity]);
  return { findings, dismissed };
}

/** The open findings of every rule for a chart and its laid-out scene (dismissed ones left out). Pure. */
export function runRules(spec: ChartSpec, scene: Scene): IntegrityFinding[] {
  return checkChart(spec, scene).findings;
}

export { measureDataInk, type DataInkMeasure } from './dataInk';
export { areaExponent, APPARENT_MAGNITUDE_AREA_EXPONENT } from './perceptualUndisclosed';
export { unitWithinLimit, ROUNDING_LIMIT } from './roundingError';
export { SIZE_RATIO_LIMIT } from './groupSizeIgnored';
export type { ChartRule, RuleInput } from './ruleInput';
export {
  adjustmentStale,
  contextThin,
  decorationHeavy,
  glyphsUnnormalised,
  groupSizeIgnored,
  mixedUnits,
  moneyNominal,
  perceptualUndisclosed,
  roundingError,
  scaleInconsistent,
  sourceUnstated,
  timeUneven,
  unitUnstated,
  volumeCue,
};
