// Nominal money to the money of one base period with a price index: amount_B = amount_A x index_B / index_A
// (the usual consumer price index conversion; see Moore, Statistics: Concepts and Controversies, ch. 16).
import { currencyOfText } from './money';
import { numberFromCell, throwIfProblems } from './problems';
import type { AdjustedValues, AdjustmentProblem, LabelledValue } from './types';

export interface PriceIndexOptions {
  basePeriod: string;
  /** Each row's period; absent for a row means its label is its period. */
  periodOf?: Readonly<Record<string, unknown>>;
  /** The index by period (a supplied table)... */
  index?: Readonly<Record<string, unknown>>;
  /** ...or each row's own index value by label (an index column). The base period is then looked up among the rows' periods. */
  indexByLabel?: Readonly<Record<string, unknown>>;
  /** Named in the footnote; absent: "the supplied price index". */
  indexName?: string;
  /** Unit before the step ("euros"). */
  unitName?: string;
  /** Each row's currency by label, when the table says; rows in different currencies cannot share one index. */
  currencyOf?: Readonly<Record<string, unknown>>;
}

function positiveIndex(cell: unknown): number | null {
  const n = numberFromCell(cell);
  return n !== null && n > 0 ? n : null;
}

/**
 * Every value converted to money of `basePeriod`. Throws TallyError('data-invalid') when the base period is not
 * in the index, when a row's period has no index value (or a zero, negative or non-numeric one), or when the
 * rows are in different currencies; the error lists every such row.
 */
export function adjustForPrices(rows: readonly LabelledValue[], opts: PriceIndexOptions): AdjustedValues {
  const problems: AdjustmentProblem[] = [];
  const base = opts.basePeriod.trim();
  const periodOf = (label: string): string => {
    const p = opts.periodOf?.[label];
    return p === undefined || p === null ? label.trim() : String(p).trim();
  };

  if (opts.currencyOf) {
    const seen = new Map<string, string[]>();
    for (const row of rows) {
      const cell = opts.currencyOf[row.label];
      if (cell === undefined) continue;
      const code = currencyOfText(String(cell));
      seen.set(code, [...(seen.get(code) ?? []), row.label]);
    }
    if (seen.size > 1) {
      const listed = [...seen.entries()].map(([code, labels]) => `${code} (${labels.slice(0, 3).join(', ')}${labels.length > 3 ? ', ...' : ''})`).join(', ');
      problems.push({ message: `the rows are in different currencies: ${listed}; convert them to one currency first` });
    }
  }

  let baseIndex: number | null = null;
  let indexOf: (row: LabelledValue) => unknown;
  if (opts.indexByLabel) {
    const byLabel = opts.indexByLabel;
    const baseRow = rows.find((r) => periodOf(r.label) === base);
    if (!baseRow) problems.push({ message: `the base period "${base}" is not among the rows' periods, so its index value is unknown` });
    else {
      baseIndex = positiveIndex(byLabel[baseRow.label]);
      if (baseIndex === null) problems.push({ label: baseRow.label, message: `the base period's index value ${JSON.stringify(byLabel[baseRow.label] ?? null)} is not a positive number` });
    }
    indexOf = (row) => byLabel[row.label];
  } else {
    const table = opts.index ?? {};
    const periods = Object.keys(table);
    if (periods.length === 0) problems.push({ message: 'no price index was supplied; give an index table or an index column' });
    else if (!Object.prototype.hasOwnProperty.call(table, base)) {
      const shown = periods.length > 6 ? `${periods.slice(0, 3).join(', ')}, ..., ${periods.slice(-2).join(', ')}` : periods.join(', ');
      problems.push({ message: `the base period "${base}" is not in the price index (it has ${shown})` });
    } else {
      baseIndex = positiveIndex(table[base]);
      if (baseIndex === null) problems.push({ message: `the index value for the base period "${base}" is ${JSON.stringify(table[base])}, not a positive number` });
    }
    indexOf = (row) => (Object.prototype.hasOwnProperty.call(table, periodOf(row.label)) ? table[periodOf(row.label)] : undefined);
  }

  const values: LabelledValue[] = [];
  for (const row of rows) {
    const cell = indexOf(row);
    const period = periodOf(row.label);
    if (cell === undefined || cell === null) {
      problems.push({ label: row.label, message: `the price index has no value for its period "${period}"` });
      continue;
    }
    const index = positiveIndex(cell);
    if (index === null) {
      problems.push({ label: row.label, message: `the index value for "${period}" is ${JSON.stringify(cell)}, not a positive number` });
      continue;
    }
    if (baseIndex !== null) values.push({ label: row.label, value: (row.value * baseIndex) / index });
  }
  throwIfProblems(`Cannot adjust to ${base} money`, problems);
  const money = `${base} money`;
  return {
    values,
    unitName: opts.unitName ? `${opts.unitName} (${money})` : money,
    note: `adjusted to ${money} with ${opts.indexName ? opts.indexName : 'the supplied price index'}`,
  };
}
