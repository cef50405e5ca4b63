// Preflight: partial glyphs so small a reader sees a 1-2 mm dash rather than a piece of the glyph. The cut
// stays ink-true (the share is right); the finding names the category and its share so the designer can pick
// another unit.
import type { Finding, PartialGlyph } from '../preflight';
import { mm, preflightCheck, preflightFinding } from './preflightShared';

/** A partial glyph holding less than this share of a glyph's ink reads as a dash, not as the glyph (common practice, no source). */
export const SLIVER_SHARE = 0.1;

export function sliverFindings(partials: readonly PartialGlyph[]): Finding[] {
  const out: Finding[] = [];
  for (const p of partials) {
    // A share of 0.1 computed as 0.0999999999 (4.1 - 4 in binary floating point) is a tenth, not a sliver.
    if (!(p.share > 0) || p.share >= SLIVER_SHARE - 1e-9) continue;
    const pct = String(Number((p.share * 100).toPrecision(2)));
    out.push(
      preflightFinding(
        'sliver',
        `${p.owner}: the last glyph holds only ${pct}% of a glyph's ink, a ${mm(p.shortSideMm)} mm sliver that may not read as the glyph (common practice).`,
        p.owner,
      ),
    );
  }
  return out;
}

export const sliver = preflightCheck({
  code: 'sliver',
  name: 'Sliver of a glyph',
  fix: () => 'Choose a unit that leaves every category a larger last piece, or larger glyphs; keep the cut by ink.',
  findIn: (input) => sliverFindings(input.partials ?? []),
});
