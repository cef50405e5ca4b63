// Within one mark, every whole glyph must carry the same ink: each glyph stands for the same amount.
import type { IntegrityFinding } from '../check';
import type { FileCheck } from '../measureFile';
import { blockingFinding, num, SAME_GLYPH_TOLERANCE } from './fileFinding';

/** Isotype: each symbol stands for a fixed quantity, so every copy is drawn at one size. */
export const ISOTYPE_BASIS = 'Isotype (Neurath): each symbol stands for a fixed quantity, drawn at one size (paraphrase of secondary sources)';

export const glyphSizeVaries: FileCheck = {
  code: 'glyph-size-varies',
  name: 'Glyphs of one row differ in size',
  severity: 'blocking',
  category: 'consistency',
  basis: ISOTYPE_BASIS,
  run(m) {
    if (m.reading !== 'count' && m.reading !== 'length') return [];
    const out: IntegrityFinding[] = [];
    for (const mi of m.markInks) {
      const inks = mi.fulls.map((p) => p.ink.areaMm2);
      if (!inks.length) continue;
      const lo = Math.min(...inks);
      const hi = Math.max(...inks);
      if (hi / lo - 1 <= SAME_GLYPH_TOLERANCE) continue;
      out.push(
        blockingFinding(
          'glyph-size-varies',
          `The glyphs of "${mi.mark.label}" are not all one size (ink from ${num(lo)} to ${num(hi)} mm²); every glyph must stand for the same amount.`,
          `Draw every whole glyph of "${mi.mark.label}" at one size, so each carries the same ink.`,
          mi.mark.label,
        ),
      );
    }
    return out;
  },
};
