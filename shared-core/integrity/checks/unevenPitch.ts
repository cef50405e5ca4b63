// In a stack each glyph takes one pitch along one line, so length stays in proportion to the count.
import type { IntegrityFinding } from '../check';
import type { FileCheck } from '../measureFile';
import { blockingFinding, num, SAME_GLYPH_TOLERANCE } from './fileFinding';
import { ISOTYPE_BASIS } from './glyphSizeVaries';

export const unevenPitch: FileCheck = {
  code: 'uneven-pitch',
  name: 'Stack unevenly spaced',
  severity: 'blocking',
  category: 'consistency',
  basis: ISOTYPE_BASIS,
  run(m) {
    const out: IntegrityFinding[] = [];
    for (const { mark, fit } of m.stacks) {
      // 1% of the pitch (as for glyph sizes) plus a micrometre of coordinate rounding.
      if (!fit || fit.offMm <= SAME_GLYPH_TOLERANCE * fit.pitchMm + 1e-3) continue;
      out.push(
        blockingFinding(
          'uneven-pitch',
          `The glyphs in the stack of "${mark.label}" are not evenly spaced along one line (off by up to ${num(fit.offMm)} mm); each glyph takes one pitch.`,
          `Space the glyphs of "${mark.label}" at one pitch (glyph size plus gap) along one line.`,
          mark.label,
        ),
      );
    }
    return out;
  },
};
