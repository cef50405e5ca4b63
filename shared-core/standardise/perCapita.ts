// Rates per head: value / base x per, so places of different size compare fairly.
import { groupedNumber, singular } from './formatting';
import { numberFromCell, throwIfProblems } from './problems';
import type { AdjustedValues, AdjustmentProblem, LabelledValue } from './types';

export interface PerCapitaOptions {
  /** The base of the rate: 1, 1,000, 100,000 or another positive number. */
  per: number;
  /** What the base counts, plural ("residents"). */
  baseName: string;
  /** The unit of the values before the step ("cases"); absent: the unit names only the rate. */
  unitName?: string;
}

/** "per 100,000 residents", "per resident". */
export function perCapitaPhrase(per: number, baseName: string): string {
  return per === 1 ? `per ${singular(baseName)}` : `per ${groupedNumber(per)} ${baseName}`;
}

/**
 * value / base(label) x per for every row. Throws TallyError('data-invalid') listing every row whose base is
 * missing, not a number, zero or negative: such a row has no rate, and dropping it would hide a category.
 */
export function perCapita(rows: readonly LabelledValue[], base: Readonly<Record<string, unknown>>, opts: PerCapitaOptions): AdjustedValues {
  const problems: AdjustmentProblem[] = [];
  if (!(Number.isFinite(opts.per) && opts.per > 0)) problems.push({ message: `the rate base must be a positive number such as 1,000 or 100,000, got ${String(opts.per)}` });
  const values: LabelledValue[] = [];
  for (const row of rows) {
    const has = Object.prototype.hasOwnProperty.call(base, row.label);
    const n = has ? numberFromCell(base[row.label]) : null;
    if (!has) problems.push({ label: row.label, message: `has no ${opts.baseName} figure; give one for every category` });
    else if (n === null) problems.push({ label: row.label, message: `its ${opts.baseName} figure ${JSON.stringify(base[row.label])} is not a number` });
    else if (n <= 0) problems.push({ label: row.label, message: `its ${opts.baseName} figure is ${n}; a rate needs a base above 0` });
    else values.push({ label: row.label, value: (row.value / n) * opts.per });
  }
  throwIfProblems(`Cannot compute values ${perCapitaPhrase(opts.per, opts.baseName)}`, problems);
  const phrase = perCapitaPhrase(opts.per, opts.baseName);
  return { values, unitName: opts.unitName ? `${opts.unitName} ${phrase}` : phrase, note: phrase };
}
