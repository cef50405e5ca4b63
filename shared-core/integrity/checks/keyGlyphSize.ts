// The key must show the unit at the size the marks use, or a reader comparing a mark with the key misjudges
// it by the same factor. Count and length charts: the key's glyph against the same glyph in the marks. Scale
// charts: the key's ink per unit of value against the marks' own (scale-free: marks against key).
import type { IntegrityFinding } from '../check';
import type { FileCheck } from '../measureFile';
import { blockingFinding, median, num, relDiff, SAME_GLYPH_TOLERANCE } from './fileFinding';
import { sameShape } from './glyphShape';
import { ISOTYPE_BASIS } from './glyphSizeVaries';
import { firstGlyphs } from './sameGlyphTwoSizes';

export const keyGlyphSize: FileCheck = {
  code: 'key-glyph-size',
  name: 'Key glyph at another size',
  severity: 'blocking',
  category: 'consistency',
  basis: ISOTYPE_BASIS,
  run(m) {
    const out: IntegrityFinding[] = [];
    if (m.reading === 'count' || m.reading === 'length') {
      const firsts = firstGlyphs(m);
      m.legendInks.forEach((key, k) => {
        if (!(key.areaMm2 > 0)) return;
        const match = firsts.find((f) => sameShape(f.ink, key));
        if (!match || relDiff(match.ink.areaMm2, key.areaMm2) <= SAME_GLYPH_TOLERANCE) return;
        const name = m.file.legendKeys[k].glyph ? ` (${m.file.legendKeys[k].glyph})` : '';
        out.push(
          blockingFinding(
            'key-glyph-size',
            `The legend's key glyph${name} carries ${num(key.areaMm2)} mm² of ink but the same glyph in "${match.mark.label}" carries ${num(match.ink.areaMm2)} mm²; ` +
              'the key must show the unit glyph at the size the chart uses.',
            'Draw the key\'s glyph at the size the marks use.',
          ),
        );
      });
    } else if (m.reading === 'area') {
      const perValue = m.marks.filter((mk) => mk.value > 0 && mk.inkMm2 > 0).map((mk) => mk.inkMm2 / mk.value);
      if (!perValue.length) return out;
      const chart = median(perValue);
      m.file.legendKeys.forEach((key, i) => {
        const ink = m.legendInks[i];
        if (key.unitValue === null || !(ink.areaMm2 > 0)) return;
        const ratio = ink.areaMm2 / key.unitValue / chart;
        if (Math.abs(ratio - 1) <= m.limits.high - 1 + 1e-9) return;
        out.push(
          blockingFinding(
            'key-glyph-size',
            `The key glyph for ${num(key.unitValue)} carries ${num(ink.areaMm2)} mm² of ink, ${num(ratio)}x what the marks carry for that value; ` +
              'a reader comparing a mark with the key would misjudge it.',
            `Draw the key glyph for ${num(key.unitValue)} with the ink per unit of value that the marks use.`,
          ),
        );
      });
    }
    return out;
  },
};
