// One chart, one unit: glyphs that stand for euros in one row and dollars or kilograms in the next cannot be compared.
import { currencyOfText } from '../../standardise/index';
import { findingOf, listed, type ChartRule } from './ruleInput';

const UNIT_COLUMNS = ['unit', 'units'];

export const mixedUnits: ChartRule = {
  code: 'units-mixed',
  name: 'Values in different units',
  severity: 'warning',
  run({ spec }) {
    const columns = spec.standardise?.columns ?? {};
    const out = [];
    for (const [name, normalise, what] of [
      [UNIT_COLUMNS.find((c) => columns[c]), (t: string) => t.trim().toLowerCase(), 'units'],
      [columns.currency ? 'currency' : undefined, currencyOfText, 'currencies'],
    ] as const) {
      if (!name) continue;
      const groups = new Map<string, string[]>();
      for (const row of spec.data) {
        const cell = columns[name].values[row.label];
        if (cell === undefined || String(cell).trim() === '') continue;
        const key = normalise(String(cell));
        groups.set(key, [...(groups.get(key) ?? []), row.label]);
      }
      if (groups.size < 2) continue;
      const parts = [...groups.entries()].map(([unit, labels]) => `${unit} (${listed(labels, 2)})`);
      out.push(
        findingOf(this, {
          message: `The rows are in different ${what}: ${parts.join(', ')}; one glyph cannot stand for the same amount of each.`,
          fix: what === 'currencies' ? 'Convert every amount to one currency (say which rate was used), or chart each currency separately.' : 'Convert the values to one unit, or make one chart per unit.',
          category: [...groups.values()][1][0],
          basis: 'common practice, no source',
        }),
      );
    }
    return out;
  },
};
