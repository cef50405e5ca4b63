// Apparent-magnitude scaling (Flannery 1971) enlarges large symbols on purpose, so their ink grows faster than
// the value: allowed only when the chart says so.
import { regionArea } from '../../geometry/index';
import { findingOf, type ChartRule } from './ruleInput';

/** Flannery's exponent for radius is 0.5716, so ink area grows as value^1.1432 (Flannery 1971, secondary sources). */
export const APPARENT_MAGNITUDE_AREA_EXPONENT = 2 * 0.5716;
/** How close a measured exponent must be to be read as apparent-magnitude scaling. Common practice, no source. */
const EXPONENT_TOLERANCE = 0.02;
const DISCLOSURE = /apparent|perceptual|perceived|Flannery/i;

/** The area exponent between the smallest and the largest positive marks: log(ink ratio) / log(value ratio). */
export function areaExponent(marks: readonly { value: number; inkMm2: number }[]): number | null {
  const usable = marks.filter((m) => m.value > 0 && m.inkMm2 > 0);
  if (usable.length < 2) return null;
  const lo = usable.reduce((a, b) => (b.value < a.value ? b : a));
  const hi = usable.reduce((a, b) => (b.value > a.value ? b : a));
  // Below a 5% value difference the exponent is too unstable to tell scalings apart.
  if (hi.value / lo.value < 1.05) return null;
  return Math.log(hi.inkMm2 / lo.inkMm2) / Math.log(hi.value / lo.value);
}

export const perceptualUndisclosed: ChartRule = {
  code: 'perceptual-undisclosed',
  name: 'Apparent-size scaling not disclosed',
  severity: 'warning',
  run({ scene }) {
    if (scene.summary.mode !== 'scale') return [];
    const exponent = areaExponent(scene.marks.map((m) => ({ value: m.value, inkMm2: m.glyphs.reduce((s, g) => s + regionArea(g.region), 0) })));
    if (exponent === null || Math.abs(exponent - APPARENT_MAGNITUDE_AREA_EXPONENT) > EXPONENT_TOLERANCE) return [];
    if (scene.texts.some((t) => DISCLOSURE.test(t.text))) return [];
    return [
      findingOf(this, {
        message: `The glyph areas grow as value^${exponent.toFixed(3)}, the apparent-magnitude scaling, not in proportion to the values, and the chart does not say so.`,
        fix: 'Add a note on the chart that sizes are enlarged for perceived size (apparent-magnitude scaling), or scale areas in proportion to the values.',
        basis: 'Flannery (1971), The Canadian Cartographer 8(2): radius proportional to value^0.5716 (secondary sources)',
      }),
    ];
  },
};
