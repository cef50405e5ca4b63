// A designer's own SVG made into a glyph the chart can carry: read through the safe XML reader,
// re-serialised without anything active or external, measured like a bundled glyph, and the geometry
// a designer should know about said plainly (strokes turned into ink, ink past the box, open paths).
import { sanitizedCopy } from '../audit/sanitizedCopy';
import { TallyError, type Warning } from '../errors';
import type { Box } from '../geometry/region';
import { parseXml } from '../svg/parseXml';
import { collectShapes, parseViewBox } from './collectShapes';
import { measureGlyph } from './measureGlyph';

/** Glyphs of one's own are referenced as "own:<slug>" so they never shadow a bundled name. */
export const OWN_GLYPH_PREFIX = 'own:';
/** The same limit as inline glyph markup in a chart document. */
export const MAX_OWN_GLYPH_CHARS = 1_000_000;

export interface OwnGlyphImport {
  /** Standalone, sanitised SVG markup with a viewBox: what the document keeps. */
  svg: string;
  inkAreaUnits2: number;
  /** Ink area / ink bounding-box area, as the bundled set lists it. */
  boxFraction: number;
  bbox: Box;
  viewBox: Box;
  warnings: Warning[];
}

function trim(n: number): string {
  return String(Number(n.toFixed(6)));
}

/** True when some subpath of the data draws a line or curve and is not closed with Z. */
function hasOpenSubpath(d: string): boolean {
  return d
    .split(/(?=[Mm])/)
    .map((s) => s.trim())
    .some((s) => /[LlHhVvCcSsQqTtAa]/.test(s) && !/[Zz]\s*$/.test(s));
}

/** A glyph name from a file name: "Studio Cup.svg" → "own:studio-cup", unique against `taken`. */
export function ownGlyphName(fileName: string, taken: Iterable<string> = []): string {
  const stem = fileName.replace(/\.[A-Za-z0-9]{1,5}$/, '').toLowerCase().normalize('NFKD').replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 40) || 'glyph';
  const used = new Set(taken);
  let name = `${OWN_GLYPH_PREFIX}${stem}`;
  for (let n = 2; used.has(name); n++) name = `${OWN_GLYPH_PREFIX}${stem}-${n}`;
  return name;
}

/** Reads, cleans and measures a supplied SVG glyph. Throws TallyError when it is unreadable or paints nothing. */
export function importOwnGlyph(text: string): OwnGlyphImport {
  const root = parseXml(text);
  if (root.name !== 'svg') throw new TallyError('svg-malformed', `The file's root element is <${root.name.slice(0, 30)}>, not <svg>.`);
  const collected = collectShapes(root);
  const declared = parseViewBox(root.attrs.viewBox);
  const copy = sanitizedCopy(root, 'g-');
  const warnings: Warning[] = copy.warnings.map((w) => ({ code: w.code, message: w.message.replace("The sheet's copy", 'The glyph') }));
  // Measured once at the declared box (or none) to find the ink, then kept with a box that holds it.
  const probe = `<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink"${declared ? ` viewBox="${trim(declared.x)} ${trim(declared.y)} ${trim(declared.width)} ${trim(declared.height)}"` : ''}><g${copy.rootAttributes}>${copy.markup}</g></svg>`;
  const ink = measureGlyph(probe);
  if (!(ink.areaUnits2 > 0)) throw new TallyError('glyph-empty', 'The SVG paints no ink (zero area), so it cannot stand for a quantity. Give it a filled shape.');
  warnings.push(...ink.warnings);

  const stroked = collected.shapes.filter((s) => s.stroke !== null).length;
  if (stroked > 0) warnings.push({ code: 'strokes-converted', message: `${stroked} stroked outline${stroked === 1 ? ' was' : 's were'} turned into filled ink at ${stroked === 1 ? 'its' : 'their'} stroke width; at chart size the strokes scale with the glyph.` });
  const open = collected.shapes.filter((s) => s.fill !== null && (s.tag === 'polyline' || (s.tag === 'path' && hasOpenSubpath(s.d)))).length;
  if (open > 0) warnings.push({ code: 'open-path', message: `${open} filled path${open === 1 ? ' is' : 's are'} open; the fill closes ${open === 1 ? 'it' : 'them'} with a straight line back to the start, as SVG does.` });
  let viewBox = declared;
  const b = ink.bbox;
  if (declared) {
    const slack = Math.max(declared.width, declared.height) * 1e-6;
    if (b.x < declared.x - slack || b.y < declared.y - slack || b.x + b.width > declared.x + declared.width + slack || b.y + b.height > declared.y + declared.height + slack) {
      warnings.push({ code: 'ink-outside-box', message: "Some ink lies outside the file's viewBox; it is kept and measured, and the glyph's box is widened to hold it." });
      const x0 = Math.min(declared.x, b.x), y0 = Math.min(declared.y, b.y);
      viewBox = { x: x0, y: y0, width: Math.max(declared.x + declared.width, b.x + b.width) - x0, height: Math.max(declared.y + declared.height, b.y + b.height) - y0 };
    }
  } else {
    warnings.push({ code: 'no-viewbox', message: 'The file has no viewBox; the box is taken from the ink itself.' });
    viewBox = { ...b };
  }
  const box = viewBox as Box;
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" viewBox="${trim(box.x)} ${trim(box.y)} ${trim(box.width)} ${trim(box.height)}"><g${copy.rootAttributes}>${copy.markup}</g></svg>`;
  if (svg.length > MAX_OWN_GLYPH_CHARS) throw new TallyError('svg-limit', `The cleaned glyph is ${Math.round(svg.length / 1000)} thousand characters; a glyph kept in a chart may have at most ${MAX_OWN_GLYPH_CHARS / 1000} thousand. Simplify its outlines.`);
  const seen = new Set<string>();
  const unique = warnings.filter((w) => (seen.has(w.message) ? false : (seen.add(w.message), true)));
  return { svg, inkAreaUnits2: ink.areaUnits2, boxFraction: ink.boxFraction, bbox: ink.bbox, viewBox: box, warnings: unique };
}
