// Money compared across periods in the money of each period: inflation alone makes later amounts look larger.
import { moneyUnitOf } from '../../standardise/index';
import { adjustedBy, findingOf, periodsOf, type ChartRule } from './ruleInput';

/** Unit names that already say the money is real or of one period ("2020 prices", "constant euros"). */
const ALREADY_REAL = /\b(real|constant|inflation[- ]adjusted|deflated)\b|\b\d{4}(?:[-/]\d{2,4})? (?:money|prices|dollars|euros|pounds)\b/i;

export const moneyNominal: ChartRule = {
  code: 'money-nominal',
  name: 'Money over time not adjusted for prices',
  severity: 'warning',
  run({ spec }) {
    const unitName = spec.encoding.unitName ?? '';
    const money = moneyUnitOf(unitName) ?? (spec.standardise?.columns?.currency ? { currency: null } : null);
    const periods = periodsOf(spec);
    if (!money || !periods || adjustedBy(spec, 'price-index') || ALREADY_REAL.test(unitName)) return [];
    const latest = periods.reduce((a, b) => (b.startYears > a.startYears ? b : a));
    const first = periods.reduce((a, b) => (b.startYears < a.startYears ? b : a));
    const hasIndex = Object.keys(spec.standardise?.priceIndex?.values ?? {}).length > 0;
    return [
      findingOf(this, {
        message: `The values are money (${unitName || 'a currency column'}) from ${first.text} to ${latest.text} in the money of each period; rising prices alone make later amounts look larger.`,
        fix: hasIndex
          ? `Adjust every amount to ${latest.text} money with the supplied price index; the chart then says so in a footnote.`
          : `Supply a price index for every period (for example the consumer price index) and adjust to one period's money, or state on the chart that the amounts are nominal.`,
        basis: 'Moore, Statistics: Concepts and Controversies, ch. 16 (comparing money across years with a price index)',
        ...(hasIndex ? { action: { kind: 'apply-price-index', label: `Adjust to ${latest.text} money`, payload: { step: { kind: 'price-index', basePeriod: latest.text } } } } : {}),
      }),
    ];
  },
};
