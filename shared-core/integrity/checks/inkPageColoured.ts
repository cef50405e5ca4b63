// A mark painted only in the page's colour is measured as ink but seen by no one: verification refuses it.
// That ink must be visible to count is our own rule (common practice, no source).
import type { IntegrityFinding } from '../check';
import type { FileCheck } from '../measureFile';
import { blockingFinding } from './fileFinding';

export const inkPageColoured: FileCheck = {
  code: 'ink-page-coloured',
  name: 'Mark in the page colour',
  severity: 'blocking',
  category: 'visibility',
  basis: 'common practice, no source',
  run(m) {
    const out: IntegrityFinding[] = [];
    const paper = m.paperColour;
    for (const [mark, p] of m.paints) {
      if (p.all.size !== 1 || !p.all.has(paper)) continue;
      out.push(
        blockingFinding(
          'ink-page-coloured',
          `"${mark.label}" is painted in the colour of the page (${paper}), so a reader sees nothing of it; give it a colour that shows.`,
          `Give "${mark.label}" a colour that stands out from the page (${paper}).`,
          mark.label,
        ),
      );
    }
    return out;
  },
};
