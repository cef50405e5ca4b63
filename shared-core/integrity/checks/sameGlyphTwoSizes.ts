// One glyph drawn at two sizes in one chart makes count and ink disagree: a reader sees the bigger glyphs as
// more. Different glyphs (a bus and a bike) legitimately differ in ink, so only the same shape is compared.
import type { ChartSvgMark } from '../../svg/readChartSvg';
import type { FileCheck, Ink } from '../measureFile';
import { blockingFinding, num, SAME_GLYPH_TOLERANCE } from './fileFinding';
import { sameShape } from './glyphShape';
import { ISOTYPE_BASIS } from './glyphSizeVaries';

/** Each mark's first full glyph, for comparing glyphs across marks. */
export function firstGlyphs(m: Parameters<FileCheck['run']>[0]): { mark: ChartSvgMark; ink: Ink }[] {
  return m.markInks.map((mi) => ({ mark: mi.mark, ink: mi.fulls[0]?.ink })).filter((x): x is { mark: ChartSvgMark; ink: Ink } => !!x.ink);
}

export const sameGlyphTwoSizes: FileCheck = {
  code: 'same-glyph-two-sizes',
  name: 'One glyph at two sizes',
  severity: 'blocking',
  category: 'consistency',
  basis: ISOTYPE_BASIS,
  run(m) {
    if (m.reading !== 'count' && m.reading !== 'length') return [];
    const firsts = firstGlyphs(m);
    for (let i = 0; i < firsts.length; i++) {
      for (let j = i + 1; j < firsts.length; j++) {
        const a = firsts[i];
        const b = firsts[j];
        if (!sameShape(a.ink, b.ink)) continue;
        const ratio = b.ink.areaMm2 / a.ink.areaMm2;
        if (Math.abs(ratio - 1) > SAME_GLYPH_TOLERANCE) {
          // One finding is enough: the fix (one size throughout) is the same for every pair.
          return [
            blockingFinding(
              'same-glyph-two-sizes',
              `The glyphs of "${b.mark.label}" carry ${num(ratio)}x the ink of those of "${a.mark.label}" although they are the same glyph; ` +
                'every glyph in the chart must be drawn at one size.',
              'Draw the glyph at one size throughout the chart, so each copy stands for the same amount.',
              b.mark.label,
            ),
          ];
        }
      }
    }
    return [];
  },
};
