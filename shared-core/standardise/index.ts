// Public door of standardisation: per capita, price-index adjustment, share of total, index to a base period,
// the recorded steps with their footnote, and the period and money readers the rules share.

export { perCapita, perCapitaPhrase, type PerCapitaOptions } from './perCapita';
export { adjustForPrices, type PriceIndexOptions } from './priceIndex';
export { shareOfTotal } from './shareOfTotal';
export { indexToBase, type IndexToBaseOptions } from './indexToBase';
export { runStep, baseNameOf } from './runStep';
export { applyAdjustment, removeAdjustments, replayAdjustments, adjustmentFootnote, stepNote, type AdjustableChart, type ReplayResult } from './applyAdjustments';
export { parsePeriod, periodSeries, STEP_YEARS, type Period, type PeriodGranularity } from './periods';
export { moneyUnitOf, currencyOfText, type MoneyUnit } from './money';
export { groupedNumber, singular } from './formatting';
export { numberFromCell } from './problems';
export { CHART_EXTRA_FIELDS, chartExtrasOf } from './documentFields';
export type * from './types';
