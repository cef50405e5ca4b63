// One scale for every category: the same amount per glyph, the same glyph size, the same spacing and, for
// stacks, one baseline. Read from the laid-out scene, so a hand-edited or third-party scene is caught too.
import { boxOf, regionArea } from '../../geometry/index';
import type { Scene, SceneGlyph, SceneMark } from '../../scene/index';
import { findingOf, relativeSpread, shown, type ChartRule } from './ruleInput';
import type { IntegrityFinding } from '../check';

/** Differences smaller than these are drawing noise (geometry is baked to micrometres). Common practice, no source. */
const UNIT_TOLERANCE = 1e-6;
const SIZE_TOLERANCE = 0.01;
const GAP_TOLERANCE = 0.01;
const BASELINE_TOLERANCE_MM = 0.05;

function fullPieces(mark: SceneMark): SceneGlyph[] {
  return mark.glyphs.filter((g) => g.part === 'full');
}

/** Distance between neighbouring whole glyphs of one mark along its run (x in rows, y in stacks), or null. */
function pitchOf(mark: SceneMark, stacked: boolean): number | null {
  const boxes = fullPieces(mark).map((g) => boxOf(g.region));
  if (boxes.length < 2) return null;
  const along = (b: { x: number; y: number }) => (stacked ? b.y : b.x);
  const across = (b: { x: number; y: number }) => (stacked ? b.x : b.y);
  let best: number | null = null;
  for (let i = 1; i < boxes.length; i++) {
    if (Math.abs(across(boxes[i]) - across(boxes[i - 1])) > 1e-3) continue;
    const d = Math.abs(along(boxes[i]) - along(boxes[i - 1]));
    if (d > 1e-6 && (best === null || d < best)) best = d;
  }
  return best;
}

function spreadFinding(rule: ChartRule, code: string, what: string, per: { label: string; value: number }[], unit: string, fix: string): IntegrityFinding {
  const low = per.reduce((a, b) => (b.value < a.value ? b : a));
  const high = per.reduce((a, b) => (b.value > a.value ? b : a));
  return findingOf(rule, {
    code,
    message: `${what} differs between categories: "${high.label}" ${shown(high.value)}${unit}, "${low.label}" ${shown(low.value)}${unit}; readers assume one scale for the whole chart.`,
    fix,
    category: high.label,
    basis: 'Isotype practice: each symbol stands for a fixed quantity (Neurath, secondary sources)',
  });
}

function check(rule: ChartRule, scene: Scene): IntegrityFinding[] {
  const out: IntegrityFinding[] = [];
  const mode = scene.summary.mode;
  const marks = scene.marks.filter((m) => m.value > 0 && m.intended > 0);

  const perUnit = marks.map((m) => ({ label: m.label, value: m.value / m.intended }));
  if (relativeSpread(perUnit.map((p) => p.value)) > UNIT_TOLERANCE) {
    out.push(spreadFinding(rule, 'scale-inconsistent-unit', 'The amount one unit of drawing stands for', perUnit, '', 'Draw every category with the same unit: one glyph (or one mm², or one full glyph) must mean the same amount everywhere.'));
  }
  const keyUnits = mode === 'repeat' || mode === 'stack' ? [...new Set(scene.legendKeys.map((k) => k.unitValue))] : [];
  if (keyUnits.length > 1 || (keyUnits.length === 1 && Math.abs(keyUnits[0] - scene.summary.unit) > UNIT_TOLERANCE * scene.summary.unit)) {
    out.push(
      findingOf(rule, {
        code: 'scale-inconsistent-unit',
        message: `The legend says one glyph stands for ${keyUnits.map(shown).join(' and ')}, but the chart is drawn at ${shown(scene.summary.unit)} per glyph.`,
        fix: 'Make the legend and the marks use one unit.',
        basis: 'Isotype practice: each symbol stands for a fixed quantity (Neurath, secondary sources)',
      }),
    );
  }

  if (mode !== 'scale') {
    // Whole glyphs of one kind must carry the same ink; fill mode compares each whole glyph (filled + rest).
    const byGlyph = new Map<string, { label: string; value: number }[]>();
    for (const m of marks) {
      const areas = mode === 'fill' ? [m.glyphs.reduce((s, g) => s + regionArea(g.region), 0)] : fullPieces(m).map((g) => regionArea(g.region));
      if (areas.length === 0) continue;
      const name = m.glyphs[0].glyph;
      byGlyph.set(name, [...(byGlyph.get(name) ?? []), { label: m.label, value: Math.max(...areas) }]);
      if (relativeSpread(areas) > SIZE_TOLERANCE) out.push(spreadFinding(rule, 'scale-inconsistent-size', `The size of whole glyphs within "${m.label}"`, areas.map((a, i) => ({ label: `${m.label} #${i + 1}`, value: a })), ' mm² of ink', 'Draw every whole glyph at one size.'));
    }
    for (const per of byGlyph.values()) {
      if (relativeSpread(per.map((p) => p.value)) > SIZE_TOLERANCE) out.push(spreadFinding(rule, 'scale-inconsistent-size', 'The ink of one whole glyph', per, ' mm²', 'Draw every whole glyph at one size, so one glyph reads as the same amount in every category.'));
    }
  }

  if (mode === 'repeat' || mode === 'stack') {
    const pitches = marks.map((m) => ({ label: m.label, value: pitchOf(m, mode === 'stack') })).filter((p): p is { label: string; value: number } => p.value !== null);
    if (relativeSpread(pitches.map((p) => p.value)) > GAP_TOLERANCE) {
      out.push(spreadFinding(rule, 'scale-inconsistent-gap', 'The spacing of glyphs (glyph plus gap)', pitches, ' mm', 'Use one gap for every category: in a row or a stack, spacing is part of the length the eye reads.'));
    }
  }
  if (mode === 'stack') {
    const bottoms = marks
      .map((m) => ({ label: m.label, piece: m.glyphs.find((g) => g.slot === 0) }))
      .filter((b): b is { label: string; piece: SceneGlyph } => b.piece !== undefined)
      .map((b) => {
        const box = boxOf(b.piece.region);
        return { label: b.label, value: box.y + box.height };
      });
    if (bottoms.length > 1) {
      const low = Math.min(...bottoms.map((b) => b.value));
      const high = Math.max(...bottoms.map((b) => b.value));
      if (high - low > BASELINE_TOLERANCE_MM) {
        // The odd one out is the stack farthest from the median baseline.
        const sorted = bottoms.map((b) => b.value).sort((a, b) => a - b);
        const median = sorted[Math.floor(sorted.length / 2)];
        const off = bottoms.reduce((a, b) => (Math.abs(b.value - median) > Math.abs(a.value - median) ? b : a));
        out.push(
          findingOf(rule, {
            code: 'scale-inconsistent-baseline',
            message: `The stacks do not start on one baseline: "${off.label}" starts ${shown(high - low)} mm away from the others, so its height cannot be compared with theirs.`,
            fix: 'Start every stack on the same baseline.',
            category: off.label,
            basis: 'Cleveland and McGill (1984): position on a common scale is read most accurately',
          }),
        );
      }
    }
  }
  return out;
}

export const scaleInconsistent: ChartRule = {
  code: 'scale-inconsistent',
  name: 'One scale for every category',
  severity: 'warning',
  run({ scene }) {
    return check(this, scene);
  },
};
