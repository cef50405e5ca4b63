// Mixed glyphs (a bus beside a bike) must carry equal ink per unit of value; matching their boxes instead makes
// a bulky glyph count for more than a slender one.
import { regionArea } from '../../geometry/index';
import { findingOf, relativeSpread, shown, type ChartRule } from './ruleInput';

/** Ink differences below 1% are drawing noise. Common practice, no source. */
const INK_TOLERANCE = 0.01;

export const glyphsUnnormalised: ChartRule = {
  code: 'glyphs-unnormalised',
  name: 'Mixed glyphs not matched by ink',
  severity: 'warning',
  run({ scene }) {
    const mode = scene.summary.mode;
    // Ink per unit of value for each glyph kind: a whole glyph (repeat, stack, fill) or ink per value (scale).
    const byGlyph = new Map<string, number[]>();
    for (const m of scene.marks) {
      if (!(m.value > 0) || m.glyphs.length === 0) continue;
      const name = m.glyphs[0].glyph;
      let ink: number;
      if (mode === 'scale') ink = m.glyphs.reduce((s, g) => s + regionArea(g.region), 0) / m.value;
      else if (mode === 'fill') ink = m.glyphs.reduce((s, g) => s + regionArea(g.region), 0);
      else {
        const whole = m.glyphs.filter((g) => g.part === 'full').map((g) => regionArea(g.region));
        if (whole.length === 0) continue;
        ink = whole.reduce((a, b) => a + b, 0) / whole.length;
      }
      byGlyph.set(name, [...(byGlyph.get(name) ?? []), ink]);
    }
    if (byGlyph.size < 2) return [];
    const perGlyph = [...byGlyph.entries()].map(([name, inks]) => ({ name, ink: inks.reduce((a, b) => a + b, 0) / inks.length }));
    if (relativeSpread(perGlyph.map((g) => g.ink)) <= INK_TOLERANCE) return [];
    const low = perGlyph.reduce((a, b) => (b.ink < a.ink ? b : a));
    const high = perGlyph.reduce((a, b) => (b.ink > a.ink ? b : a));
    const unit = mode === 'scale' ? ' mm² per unit of value' : ' mm² per whole glyph';
    return [
      findingOf(this, {
        message: `The glyphs carry different ink for the same amount: "${high.name}" ${shown(high.ink)}${unit}, "${low.name}" ${shown(low.ink)}${unit} (${shown(high.ink / low.ink)} times as much), so the eye over-reads the heavier glyph.`,
        fix: 'Size each glyph by its ink area, not its box, so every glyph carries the same ink per unit (Tallyglyph\'s own layouts do this).',
        basis: 'area scaling by ink: every glyph\'s ink proportional to its value (DESIGN note; Tufte 1983, p. 57)',
      }),
    ];
  },
};
