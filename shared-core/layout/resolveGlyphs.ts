// Turns the document's glyph references (catalog names, inline markup) into measured ink, once per
// distinct glyph, and refuses glyphs that cannot carry a quantity.
import type { ChartSpec, GlyphRef } from '../document';
import { TallyError, isTallyError, type Warning } from '../errors';
import type { Box, Region } from '../geometry/region';
import { checkGlyphDetail, measureGlyph } from '../glyph';

/**
 * Flattening tolerance for glyphs placed in charts, as a share of the glyph's extent. Written charts
 * carry polygons, so this sets how far an outline may depart from the original curves, not how
 * honest the chart is: verification measures the very polygons written. 1e-4 is 1 µm on a 10 mm
 * glyph (a 300 ppi pixel is 85 µm) and keeps files about three times smaller than the 1e-5 used for
 * measuring glyphs on their own.
 */
export const LAYOUT_FLATTEN_TOLERANCE = 1e-4;
import { getGlyph } from '../glyph/catalog';

export interface ResolvedGlyph {
  /** Catalog name, or `inline:<n>` numbering inline glyphs in order of first use. */
  name: string;
  /** Ink in the glyph's own units (y down), a clean nonzero region. */
  region: Region;
  areaUnits2: number;
  /** Bounding box of the ink, glyph units. */
  bbox: Box;
}

export interface ResolvedGlyphs {
  /** encoding.glyph: the legend key and every row without its own glyph. */
  chart: ResolvedGlyph;
  /** One per data row, in row order. */
  rows: ResolvedGlyph[];
  /** Each distinct glyph once, in order of first use. */
  distinct: ResolvedGlyph[];
  warnings: Warning[];
}

function located(where: string, e: unknown): TallyError {
  if (isTallyError(e)) return new TallyError(e.code, `${where}: ${e.message}`, e.details);
  return new TallyError('svg-malformed', `${where}: the glyph could not be read (${e instanceof Error ? e.message : String(e)}).`);
}

/** Measures every glyph the chart uses. Throws TallyError naming the field for unknown names, bad markup or glyphs without ink. */
export function resolveGlyphs(spec: ChartSpec): ResolvedGlyphs {
  const byKey = new Map<string, ResolvedGlyph>();
  const distinct: ResolvedGlyph[] = [];
  const warnings: Warning[] = [];
  let inlineCount = 0;

  const resolve = (ref: GlyphRef, where: string): ResolvedGlyph => {
    const inline = typeof ref !== 'string';
    const key = inline ? `svg\n${ref.svg}` : `name\n${ref.trim().toLowerCase()}`;
    const known = byKey.get(key);
    if (known) return known;
    let svg: string;
    let name: string;
    try {
      const own = inline ? undefined : spec.glyphs?.[ref.trim()];
      if (inline) {
        svg = ref.svg;
        name = `inline:${inlineCount + 1}`;
      } else if (own) {
        // A glyph of the designer's own, kept in the document by name (document field "glyphs").
        svg = own.svg;
        name = ref.trim();
      } else {
        const entry = getGlyph(ref);
        svg = entry.svg;
        name = entry.name;
      }
    } catch (e) {
      throw located(where, e);
    }
    let ink;
    try {
      ink = measureGlyph(svg, { relativeTolerance: LAYOUT_FLATTEN_TOLERANCE });
    } catch (e) {
      throw located(where, inline ? new TallyError(isTallyError(e) ? e.code : 'svg-malformed', `the inline glyph is not usable SVG: ${e instanceof Error ? e.message : String(e)}`) : e);
    }
    if (!(ink.areaUnits2 > 0) || !Number.isFinite(ink.areaUnits2)) {
      throw new TallyError('glyph-empty', `${where}: the glyph${inline ? '' : ` "${name}"`} paints no ink (zero area), so it cannot stand for a quantity. Give it a filled shape.`);
    }
    checkGlyphDetail(ink.region, where);
    if (inline) inlineCount += 1;
    for (const w of ink.warnings) warnings.push({ code: w.code, message: `${where} (${name}): ${w.message}` });
    const glyph: ResolvedGlyph = { name, region: ink.region, areaUnits2: ink.areaUnits2, bbox: ink.bbox };
    byKey.set(key, glyph);
    distinct.push(glyph);
    return glyph;
  };

  const chart = resolve(spec.encoding.glyph, 'encoding.glyph');
  const rows = spec.data.map((row, i) => (row.glyph === undefined ? chart : resolve(row.glyph, `data[${i}].glyph ("${row.label}")`)));
  return { chart, rows, distinct, warnings };
}
