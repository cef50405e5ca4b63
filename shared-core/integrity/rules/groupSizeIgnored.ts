// Totals of places or groups of very different size: the biggest group wins by size alone unless the
// values are rates per head.
import { numberFromCell, perCapitaPhrase } from '../../standardise/index';
import { adjustedBy, findingOf, listed, periodsOf, shown, type ChartRule } from './ruleInput';

/** A column holding group sizes, by its name or its unit. */
const SIZE_WORDS = /population|residents|inhabitants|people|persons|households|pupils|students|members|employees|staff|visitors|size/i;
/** Largest group / smallest group from which totals mislead. Common practice, no source. */
export const SIZE_RATIO_LIMIT = 2;
/** Units that are already rates or shares. */
const ALREADY_RATE = /\bper\b|%|percent|\bshare\b|\brate\b|\baverage\b|\bmean\b|\bmedian\b|\bindex\b/i;
const RATE_BASES = [1, 10, 100, 1_000, 10_000, 100_000, 1_000_000];

export const groupSizeIgnored: ChartRule = {
  code: 'size-unadjusted',
  name: 'Totals of groups of very different size',
  severity: 'warning',
  run({ spec }) {
    const columns = spec.standardise?.columns ?? {};
    const name = Object.keys(columns).find((c) => SIZE_WORDS.test(c) || SIZE_WORDS.test(columns[c].unitName ?? ''));
    if (!name || adjustedBy(spec, 'per-capita') || adjustedBy(spec, 'share-of-total') || adjustedBy(spec, 'index-to-base')) return [];
    if (ALREADY_RATE.test(spec.encoding.unitName ?? '') || (spec.encoding.mode === 'fill' && spec.encoding.fillTo === 'share')) return [];
    // One group over time is not a comparison between groups.
    if (periodsOf(spec)) return [];
    const column = columns[name];
    const baseName = column.unitName ?? name;
    const sizes = spec.data.map((r) => ({ label: r.label, size: numberFromCell(column.values[r.label]) }));
    const unusable = sizes.filter((s) => s.size === null || s.size <= 0).map((s) => s.label);
    if (unusable.length > 0) {
      return [
        findingOf(this, {
          code: 'size-unadjusted-base-incomplete',
          message: `The "${name}" column has no usable figure (missing, zero or not a number) for ${listed(unusable)}, so the groups cannot be compared per head.`,
          fix: `Give a ${baseName} figure above 0 for every category.`,
          category: unusable[0],
          basis: 'common practice, no source',
        }),
      ];
    }
    const known = sizes as { label: string; size: number }[];
    const smallest = known.reduce((a, b) => (b.size < a.size ? b : a));
    const largest = known.reduce((a, b) => (b.size > a.size ? b : a));
    const ratio = largest.size / smallest.size;
    if (ratio < SIZE_RATIO_LIMIT) return [];
    // The smallest rate base that gives every category a rate of at least 1, so the chart counts whole things.
    const rates = spec.data.map((r, i) => r.value / known[i].size).filter((v) => v > 0);
    const lowest = rates.length ? Math.min(...rates) : 1;
    const per = RATE_BASES.find((b) => lowest * b >= 1) ?? RATE_BASES[RATE_BASES.length - 1];
    const phrase = perCapitaPhrase(per, baseName);
    return [
      findingOf(this, {
        message: `The values are totals for groups whose ${baseName} differ ${shown(ratio)}-fold ("${largest.label}" ${shown(largest.size)}, "${smallest.label}" ${shown(smallest.size)}); the largest groups lead by size alone.`,
        fix: `Show the values ${phrase} (divide by the "${name}" column), or state why the totals themselves matter.`,
        basis: 'common practice, no source (rates per head; a rate per 100,000 = count / population x 100,000)',
        action: { kind: 'apply-per-capita', label: `Show ${phrase}`, payload: { step: { kind: 'per-capita', column: name, per } } },
      }),
    ];
  },
};
