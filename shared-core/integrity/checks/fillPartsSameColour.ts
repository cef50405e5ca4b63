// In a fill chart the reader compares the filled part with the rest; in one colour the fill cannot be seen
// (common practice, no source).
import type { IntegrityFinding } from '../check';
import type { FileCheck } from '../measureFile';
import { blockingFinding } from './fileFinding';

export const fillPartsSameColour: FileCheck = {
  code: 'fill-parts-same-colour',
  name: 'Fill not told apart',
  severity: 'blocking',
  category: 'visibility',
  basis: 'common practice, no source',
  run(m) {
    if (m.reading !== 'fill') return [];
    const out: IntegrityFinding[] = [];
    for (const [mark, p] of m.paints) {
      if (!p.filled.size || !p.rest.size || ![...p.filled].every((c) => p.rest.has(c))) continue;
      out.push(
        blockingFinding(
          'fill-parts-same-colour',
          `The filled and unfilled parts of "${mark.label}" are the same colour, so the fill cannot be seen; paint the unfilled part paler.`,
          `Paint the unfilled part of "${mark.label}" in a paler colour than its filled part.`,
          mark.label,
        ),
      );
    }
    return out;
  },
};
