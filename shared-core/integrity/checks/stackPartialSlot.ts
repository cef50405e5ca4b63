// A stack's partial glyph belongs directly on top of its whole glyphs (slot n for n whole glyphs).
import type { IntegrityFinding } from '../check';
import type { FileCheck } from '../measureFile';
import { blockingFinding } from './fileFinding';
import { ISOTYPE_BASIS } from './glyphSizeVaries';

export const stackPartialSlot: FileCheck = {
  code: 'stack-partial-slot',
  name: 'Partial glyph off the top of its stack',
  severity: 'blocking',
  category: 'consistency',
  basis: ISOTYPE_BASIS,
  run(m) {
    const out: IntegrityFinding[] = [];
    for (const { mark, slots, partialSlot } of m.stacks) {
      if (partialSlot === null || partialSlot === slots.length) continue;
      out.push(
        blockingFinding(
          'stack-partial-slot',
          `The partial glyph of "${mark.label}" sits in slot ${partialSlot}, but the stack has ${slots.length} whole glyphs below it.`,
          `Put the partial glyph of "${mark.label}" directly on top of its whole glyphs.`,
          mark.label,
        ),
      );
    }
    return out;
  },
};
