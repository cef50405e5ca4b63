// The recorded adjustment must still produce the values drawn: a value edited by hand after "per 100,000
// residents" was applied would be printed under a footnote that no longer describes it.
import { isTallyError } from '../../errors';
import { replayAdjustments } from '../../standardise/index';
import { findingOf, listed, type ChartRule } from './ruleInput';

/** Relative difference treated as the same value (adjusted values are stored as computed). */
const SAME = 1e-9;

export const adjustmentStale: ChartRule = {
  code: 'adjustment-stale',
  name: 'Adjustment out of date',
  severity: 'warning',
  run({ spec }) {
    const std = spec.standardise;
    if (!std?.adjustments) return [];
    let replay;
    try {
      replay = replayAdjustments(std);
    } catch (e) {
      if (!isTallyError(e)) throw e;
      return [
        findingOf(this, {
          message: `The recorded adjustment can no longer be repeated: ${e.message}`,
          fix: 'Remove the adjustments and apply them again with complete data.',
          basis: 'common practice, no source',
          action: { kind: 'remove-adjustments', label: 'Remove the adjustments' },
        }),
      ];
    }
    const byLabel = new Map(replay.values.map((v) => [v.label, v.value]));
    const off = spec.data.filter((r) => {
      const expected = byLabel.get(r.label);
      return expected === undefined || Math.abs(r.value - expected) > SAME * Math.max(1, Math.abs(expected));
    });
    if (off.length === 0) return [];
    return [
      findingOf(this, {
        message: `The values of ${listed(off.map((r) => r.label))} are not what the recorded adjustment gives from the original data, so the footnote does not describe them.`,
        fix: 'Edit the original data and apply the adjustment again, or remove the adjustment.',
        category: off[0].label,
        basis: 'common practice, no source',
        action: { kind: 'reapply-adjustments', label: 'Apply the adjustments again' },
      }),
    ];
  },
};
