// Images of the document's own glyphs for thumbnails, by "own:…" name. The markup was sanitised on
// import and is shown only as an <img> (no script runs in an image), like the bundled glyphs.
import type { OwnGlyph } from '../../../shared-core/document';

const PREVIEW_INK = '#27332e';
let current: Record<string, OwnGlyph> = {};
const urls = new Map<string, string>();

/** Called when the document's own glyphs change, so thumbnails anywhere can show them. */
export function setOwnGlyphs(glyphs: Record<string, OwnGlyph> | undefined): void {
  current = glyphs ?? {};
}

export function ownGlyphImageUrl(name: string): string | null {
  const glyph = current[name];
  if (!glyph) return null;
  const key = `${name}\n${glyph.svg}`;
  const known = urls.get(key);
  if (known) return known;
  const url = `data:image/svg+xml;charset=utf-8,${encodeURIComponent(glyph.svg.replace(/currentColor/g, PREVIEW_INK))}`;
  urls.set(key, url);
  return url;
}

/** The document's own glyphs as [name, glyph] pairs, in the document's order. */
export function ownGlyphEntries(): Array<[string, OwnGlyph]> {
  return Object.entries(current);
}
