// Stacks are compared by length only when they stand on one baseline: position on a common scale is read most
// accurately (Cleveland and McGill 1984, JASA 79(387)); a lifted stack looks longer than it is.
import type { FileCheck } from '../measureFile';
import { blockingFinding, num, SAME_GLYPH_TOLERANCE } from './fileFinding';

export const baselineMismatch: FileCheck = {
  code: 'baseline-mismatch',
  name: 'Stacks off one baseline',
  severity: 'blocking',
  category: 'consistency',
  basis: 'Cleveland and McGill (1984), JASA 79(387): position on a common scale is read most accurately',
  run(m) {
    const pitch = m.chartPitchMm;
    const starts = m.stacks.flatMap((st) => (st.baselineMm === null ? [] : [{ mark: st.mark, start: st.baselineMm }]));
    if (!pitch || starts.length < 2) return [];
    const ref = starts[0];
    const worst = starts.reduce((w, st) => (Math.abs(st.start - ref.start) > Math.abs(w.start - ref.start) ? st : w), ref);
    if (Math.abs(worst.start - ref.start) <= SAME_GLYPH_TOLERANCE * pitch + 1e-3) return [];
    return [
      blockingFinding(
        'baseline-mismatch',
        `The stack of "${worst.mark.label}" starts ${num(Math.abs(worst.start - ref.start))} mm away from that of "${ref.mark.label}"; every stack must start on the same baseline.`,
        `Start the stack of "${worst.mark.label}" on the same baseline as the others.`,
        worst.mark.label,
      ),
    ];
  },
};
