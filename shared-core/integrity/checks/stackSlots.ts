// A stack must be contiguous from the baseline: slots 0..n-1 for its whole glyphs, so its length counts them.
import type { IntegrityFinding } from '../check';
import type { FileCheck } from '../measureFile';
import { blockingFinding } from './fileFinding';
import { ISOTYPE_BASIS } from './glyphSizeVaries';

export const stackSlots: FileCheck = {
  code: 'stack-slots',
  name: 'Stack skips or repeats a slot',
  severity: 'blocking',
  category: 'consistency',
  basis: ISOTYPE_BASIS,
  run(m) {
    const out: IntegrityFinding[] = [];
    for (const { mark, slots } of m.stacks) {
      if (!slots.some((sl, i) => sl !== i)) continue;
      out.push(
        blockingFinding(
          'stack-slots',
          `The stack of "${mark.label}" skips or repeats slots (${slots.join(', ')}); its glyphs must follow one another from the baseline.`,
          `Stack the glyphs of "${mark.label}" one per slot from the baseline, without gaps or repeats.`,
          mark.label,
        ),
      );
    }
    return out;
  },
};
