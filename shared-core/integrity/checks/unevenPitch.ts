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
    // A declared grouping (data-group-every, data-group-gap-mm) is allowed for only as the writer produces it:
    // groups of 5 or 10 with a gap no wider than one pitch, so grouping can never lengthen a stack by more.
    const g = m.stackGrouping;
    if (g && !g.allowed) {
      out.push(
        blockingFinding(
          'uneven-pitch',
          `The file groups its stacks every ${num(g.every)} glyphs with a ${num(g.gapMm)} mm gap; only groups of 5 or 10 with a gap of up to one glyph pitch are allowed.`,
          'Group the glyphs in fives or tens with a gap no wider than one glyph pitch, or space them evenly.',
        ),
      );
    } else if (g && m.chartPitchMm && g.gapMm > m.chartPitchMm * (1 + SAME_GLYPH_TOLERANCE)) {
      out.push(
        blockingFinding(
          'uneven-pitch',
          `The stacks are grouped with a ${num(g.gapMm)} mm gap, wider than one glyph pitch (${num(m.chartPitchMm)} mm); such gaps would lengthen the stacks.`,
          'Group the glyphs with a gap no wider than one glyph pitch, or space them evenly.',
        ),
      );
    }
    return out;
  },
};
