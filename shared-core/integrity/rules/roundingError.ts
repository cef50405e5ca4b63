// Whole glyphs round each category; when the rounding moves a category by more than the lie-factor tolerance,
// say so and name a unit that keeps every category within it.
import { READABLE_MANTISSAS } from '../../layout/index';
import { findingOf, shown, type ChartRule } from './ruleInput';

/** Largest rounding error allowed per category: the same 5% as the lie-factor limits (Tufte 1983, p. 57). */
export const ROUNDING_LIMIT = 0.05;
/** The chart's own glyph budget (see assertGlyphBudget). */
const MAX_GLYPHS_TOTAL = 2000;

function worstError(values: readonly number[], unit: number): number {
  let worst = 0;
  for (const v of values) {
    if (v <= 0) continue;
    const exact = v / unit;
    worst = Math.max(worst, Math.abs(Math.round(exact) - exact) / exact);
  }
  return worst;
}

/** The largest readable unit (1, 2, 2.5, 5 x 10^k) below the current one that keeps every category within the limit. */
export function unitWithinLimit(values: readonly number[], current: number, limit = ROUNDING_LIMIT): number | null {
  const top = Math.floor(Math.log10(current));
  for (let k = top; k >= top - 8; k--) {
    for (const m of [...READABLE_MANTISSAS].reverse()) {
      const unit = Number((m * 10 ** k).toPrecision(12));
      if (unit >= current) continue;
      const total = values.reduce((s, v) => s + Math.round(v / unit), 0);
      if (total > MAX_GLYPHS_TOTAL) return null;
      if (worstError(values, unit) <= limit) return unit;
    }
  }
  return null;
}

export const roundingError: ChartRule = {
  code: 'rounding-error',
  name: 'Rounding to whole glyphs',
  severity: 'warning',
  run({ spec, scene }) {
    const choice = scene.unitChoice;
    if (!choice || choice.rounding !== 'whole') return [];
    const over = choice.categories.filter((c) => c.exact > 0 && Math.abs(c.relativeError) > ROUNDING_LIMIT);
    if (over.length === 0) return [];
    const worst = over.reduce((a, b) => (Math.abs(b.relativeError) > Math.abs(a.relativeError) ? b : a));
    const unit = unitWithinLimit(spec.data.map((r) => r.value), choice.unit);
    const pct = (x: number) => `${shown(Math.abs(x) * 100)}%`;
    const name = spec.encoding.unitName ? ` ${spec.encoding.unitName}` : '';
    return [
      findingOf(this, {
        message: `Rounding to whole glyphs of ${shown(choice.unit)}${name} ${worst.error > 0 ? 'adds' : 'removes'} ${pct(worst.relativeError)} of "${worst.label}" (${shown(worst.exact)} glyphs drawn as ${worst.drawn})${over.length > 1 ? `, and more than ${pct(ROUNDING_LIMIT)} of ${over.length - 1} other categor${over.length === 2 ? 'y' : 'ies'}` : ''}.`,
        fix: unit !== null ? `Use a unit of ${shown(unit)}${name} per glyph (every category then within ${pct(ROUNDING_LIMIT)}), or cut remainders by ink.` : 'Cut remainders by ink so each glyph shows its exact share.',
        category: worst.label,
        basis: 'Tufte 1983, p. 57: distortion beyond 0.95-1.05 is substantial',
        action: unit !== null ? { kind: 'set-unit', label: `Use ${shown(unit)} per glyph`, payload: { unit } } : { kind: 'set-rounding', label: 'Cut remainders by ink', payload: { rounding: 'ink-cut' } },
      }),
    ];
  },
};
