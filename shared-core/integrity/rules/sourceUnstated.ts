// Numbers without a source cannot be checked, and an honest chart says where its figures come from.
import { findingOf, type ChartRule } from './ruleInput';

export const sourceUnstated: ChartRule = {
  code: 'source-unstated',
  name: 'Source not stated',
  severity: 'warning',
  run({ spec }) {
    if ((spec.source ?? '').trim()) return [];
    return [
      findingOf(this, {
        message: 'The chart does not say where its figures come from.',
        fix: 'Name the source of the data (organisation, publication and year) in the source field; it is printed at the foot of the chart.',
        basis: 'common practice, no source',
        action: { kind: 'set-source', label: 'Add the source' },
      }),
    ];
  },
};
