// One recorded adjustment step run on a set of values, with its inputs taken from the document's columns
// and price index: the single place that turns a step record into numbers.
import { throwIfProblems } from './problems';
import { indexToBase } from './indexToBase';
import { perCapita } from './perCapita';
import { adjustForPrices } from './priceIndex';
import { shareOfTotal } from './shareOfTotal';
import type { AdjustedValues, AdjustmentStep, LabelledValue, Standardisation } from './types';

/** The column's cells, or a TallyError naming the missing column (a step must never silently use nothing). */
function columnValues(std: Standardisation | undefined, name: string, forWhat: string): Record<string, number | string> {
  const column = std?.columns?.[name];
  if (!column) {
    const known = Object.keys(std?.columns ?? {});
    throwIfProblems(`Cannot ${forWhat}`, [{ message: `there is no column "${name}"${known.length ? ` (columns: ${known.join(', ')})` : ''}` }]);
  }
  return (column as { values: Record<string, number | string> }).values;
}

/** What a per-capita base counts, plural: the step's own word, else the column's unit name, else the column's name. */
export function baseNameOf(step: { column: string; baseName?: string }, std: Standardisation | undefined): string {
  return step.baseName ?? std?.columns?.[step.column]?.unitName ?? step.column;
}

export function runStep(rows: readonly LabelledValue[], unitName: string | undefined, step: AdjustmentStep, std: Standardisation | undefined): AdjustedValues {
  switch (step.kind) {
    case 'per-capita':
      return perCapita(rows, columnValues(std, step.column, 'compute a rate'), { per: step.per, baseName: baseNameOf(step, std), unitName });
    case 'price-index': {
      const currency = std?.columns?.currency?.values;
      return adjustForPrices(rows, {
        basePeriod: step.basePeriod,
        periodOf: step.periodColumn ? columnValues(std, step.periodColumn, 'find each row\'s period') : undefined,
        index: step.indexColumn ? undefined : (std?.priceIndex?.values ?? {}),
        indexByLabel: step.indexColumn ? columnValues(std, step.indexColumn, 'adjust for prices') : undefined,
        indexName: step.indexColumn ? undefined : std?.priceIndex?.name,
        unitName,
        currencyOf: currency,
      });
    }
    case 'share-of-total': {
      const share = shareOfTotal(rows);
      return unitName ? { ...share, unitName: `% of total ${unitName}` } : share;
    }
    case 'index-to-base':
      return indexToBase(rows, { basePeriod: step.basePeriod, periodOf: step.periodColumn ? columnValues(std, step.periodColumn, 'find each row\'s period') : undefined });
  }
}
