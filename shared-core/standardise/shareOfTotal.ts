// Each value as its share of the total, in percent: for parts of one whole.
import { throwIfProblems } from './problems';
import type { AdjustedValues, LabelledValue } from './types';

/** value / total x 100. Throws TallyError('data-invalid') when the total is 0 (no shares exist). */
export function shareOfTotal(rows: readonly LabelledValue[]): AdjustedValues {
  const total = rows.reduce((sum, r) => sum + r.value, 0);
  throwIfProblems('Cannot show shares of the total', total > 0 ? [] : [{ message: `the values add up to ${total}; shares need a total above 0` }]);
  return { values: rows.map((r) => ({ label: r.label, value: (r.value / total) * 100 })), unitName: '% of total', note: 'shown as a percentage of the total' };
}
