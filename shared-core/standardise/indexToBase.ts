// A series relative to one base period, base = 100: shows change over time without the level.
import { throwIfProblems } from './problems';
import type { AdjustedValues, LabelledValue } from './types';

export interface IndexToBaseOptions {
  basePeriod: string;
  /** Each row's period by label; absent for a row: its label. */
  periodOf?: Readonly<Record<string, unknown>>;
}

/** value / value(base period) x 100. Throws TallyError('data-invalid') when the base period is not a row or its value is 0. */
export function indexToBase(rows: readonly LabelledValue[], opts: IndexToBaseOptions): AdjustedValues {
  const base = opts.basePeriod.trim();
  const periodOf = (label: string) => {
    const p = opts.periodOf?.[label];
    return p === undefined || p === null ? label.trim() : String(p).trim();
  };
  const baseRows = rows.filter((r) => periodOf(r.label) === base);
  const problem =
    baseRows.length === 0
      ? `the base period "${base}" is not one of the rows (${rows.slice(0, 6).map((r) => periodOf(r.label)).join(', ')}${rows.length > 6 ? ', ...' : ''})`
      : baseRows.length > 1
        ? `the base period "${base}" appears in ${baseRows.length} rows; it must be exactly one`
        : !(baseRows[0].value > 0)
          ? `the base period "${base}" has the value ${baseRows[0].value}; an index needs a base above 0`
          : null;
  throwIfProblems(`Cannot index to ${base} = 100`, problem ? [{ message: problem }] : []);
  const baseValue = baseRows[0].value;
  return { values: rows.map((r) => ({ label: r.label, value: (r.value / baseValue) * 100 })), unitName: `index, ${base} = 100`, note: `indexed to ${base} = 100` };
}
