// Preflight: lines so thin they may break up or vanish in print (printers' common practice, no source).
import { plural, preflightCheck, preflightFinding, pt, thinnestByOwner } from './preflightShared';

export const strokeThin = preflightCheck({
  code: 'stroke-thin',
  name: 'Hairline strokes',
  fix: (o) => `Draw lines at least ${pt(o.minStrokePt)} pt wide, or leave them out.`,
  findIn(input, { minStrokePt }) {
    // A zero width paints no stroke at all in SVG ("A zero value causes no stroke to be painted",
    // SVG 2, stroke-width), so it is not a hairline.
    const thin = thinnestByOwner(
      input.strokes.filter((s) => s.widthPt > 0 && s.widthPt < minStrokePt),
      (s) => s.widthPt,
      (s) => s.owner,
    );
    return [...thin].map(([owner, { size, count }]) =>
      preflightFinding(
        'stroke-thin',
        `${owner}: ${plural(count, 'line')} as thin as ${pt(size)} pt; lines under about ${pt(minStrokePt)} pt may break up or vanish in print (common practice).`,
        owner,
      ),
    );
  },
});
