// Browsing glyphs by category as well as by search: the bundled set's own categories, plus the
// document's own glyphs ("yours"), each with the share of its ink box its ink fills.
import { findGlyphs, GLYPH_CATEGORIES, measureGlyph, type GlyphCategory } from '../../../shared-core/glyph';
import { ownGlyphEntries } from './ownGlyphImages';

export type BrowseCategory = 'all' | 'yours' | GlyphCategory;

export const BROWSE_CATEGORIES: readonly BrowseCategory[] = ['all', 'yours', ...GLYPH_CATEGORIES];

export interface BrowsedGlyph {
  name: string;
  category: BrowseCategory;
  tags: readonly string[];
  /** Ink area / ink bounding-box area, 0–1; null when it cannot be measured. */
  boxFraction: number | null;
}

const ownShare = new Map<string, number | null>();

function shareOf(svg: string): number | null {
  if (!ownShare.has(svg)) {
    try {
      ownShare.set(svg, measureGlyph(svg).boxFraction);
    } catch {
      ownShare.set(svg, null);
    }
  }
  return ownShare.get(svg) ?? null;
}

/** Glyphs in a category matching the search words (every word must match), own glyphs first. */
export function browseGlyphs(query: string, category: BrowseCategory): BrowsedGlyph[] {
  const words = query.toLowerCase().split(/[\s,]+/).filter(Boolean);
  const own: BrowsedGlyph[] =
    category === 'all' || category === 'yours'
      ? ownGlyphEntries()
          .filter(([name, g]) => words.every((w) => name.includes(w) || (g.from ?? '').toLowerCase().includes(w)))
          .map(([name, g]) => ({ name, category: 'yours', tags: g.from ? [g.from] : [], boxFraction: shareOf(g.svg) }))
      : [];
  if (category === 'yours') return own;
  const bundled = findGlyphs(query)
    .filter((g) => category === 'all' || g.category === category)
    .map((g): BrowsedGlyph => ({ name: g.name, category: g.category, tags: g.tags, boxFraction: g.boxFraction }));
  return [...own, ...bundled];
}

export function sharePercent(boxFraction: number | null): string {
  return boxFraction === null ? '–' : `${Math.round(boxFraction * 100)}%`;
}
