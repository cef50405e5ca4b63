// The standardisation block of a chart document: extra columns beside the values, a supplied price index,
// the adjustments applied (with the values before them, so nothing is lost), and warnings dismissed with a reason.

/** One extra column of the data table, by row label: a population, a period, a currency, a unit... */
export interface DataColumn {
  /** What one entry counts, for unit names and footnotes: "residents". */
  unitName?: string;
  values: Record<string, number | string>;
}

/** A price index table by period, e.g. a consumer price index with 1982-84 = 100. */
export interface PriceIndexTable {
  /** Named in the footnote: "the consumer price index (1982-84 = 100)". */
  name?: string;
  values: Record<string, number>;
}

/** Convert money to the money of one base period: value x index(base) / index(period). */
export interface PriceIndexStep {
  kind: 'price-index';
  basePeriod: string;
  /** Column holding each row's period; absent: the row label is the period. */
  periodColumn?: string;
  /** Column holding each row's index value; absent: the document's price index table. */
  indexColumn?: string;
}
/** Divide by a base column (population, households...) and multiply by `per`. */
export interface PerCapitaStep {
  kind: 'per-capita';
  column: string;
  /** 1, 1,000, 100,000 or any chosen base. */
  per: number;
  /** What the base counts, plural: "residents". Absent: the column's unitName, else its name. */
  baseName?: string;
}
/** Each value as a percentage of the total of all rows. */
export interface ShareOfTotalStep {
  kind: 'share-of-total';
}
/** Each value relative to the value of a base period, base = 100. */
export interface IndexToBaseStep {
  kind: 'index-to-base';
  basePeriod: string;
  periodColumn?: string;
}
export type AdjustmentStep = PriceIndexStep | PerCapitaStep | ShareOfTotalStep | IndexToBaseStep;
export type AdjustmentKind = AdjustmentStep['kind'];

export interface AppliedAdjustments {
  /** The data as given, before any step: restoring it undoes every adjustment. */
  original: { unitName?: string; values: Record<string, number> };
  steps: AdjustmentStep[];
}

export interface Standardisation {
  columns?: Record<string, DataColumn>;
  priceIndex?: PriceIndexTable;
  adjustments?: AppliedAdjustments;
}

/** A warning or advice the designer has read and set aside, with the reason kept in the document. */
export interface DismissedFinding {
  code: string;
  /** Only this category's finding; absent: every finding with the code. */
  category?: string;
  reason: string;
}

/** The optional fields a chart document and a ChartSpec carry for standardisation and dismissals. */
export interface ChartExtras {
  standardise?: Standardisation;
  dismissed?: DismissedFinding[];
}

export interface LabelledValue {
  label: string;
  value: number;
}

/** Values after one step, the unit name they now have, and the words the footnote uses for the step. */
export interface AdjustedValues {
  values: LabelledValue[];
  unitName: string;
  note: string;
}

/** One problem with one row (or with the step as a whole when label is absent). */
export interface AdjustmentProblem {
  label?: string;
  message: string;
}
