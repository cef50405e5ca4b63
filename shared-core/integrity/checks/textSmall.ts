// Preflight: text too small to read in print (printers' common practice, no source).
import { plural, preflightCheck, preflightFinding, pt, thinnestByOwner } from './preflightShared';

export const textSmall = preflightCheck({
  code: 'text-small',
  name: 'Text too small for print',
  fix: (o) => `Set every text at ${pt(o.minTextPt)} pt or larger (a larger page leaves room for it).`,
  findIn(input, { minTextPt }) {
    const small = thinnestByOwner(
      input.texts.filter((t) => t.sizePt > 0 && t.sizePt < minTextPt),
      (t) => t.sizePt,
      (t) => t.owner,
    );
    return [...small].map(([owner, { size, count }]) =>
      preflightFinding(
        'text-small',
        `${owner}: ${plural(count, 'text')} as small as ${pt(size)} pt; text under about ${pt(minTextPt)} pt is hard to read in print (common practice).`,
        owner,
      ),
    );
  },
});
