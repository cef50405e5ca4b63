// What in an SVG reaches outside the file or runs code when a browser or layout program opens it, and
// the same text with all of it removed. Output files (corrected drawings, sheets, charts) must carry
// none of it: a file handed to a client should show what it shows, fetch nothing and run nothing.
// Edits are made on the text, so every other byte of the file stays as it was.
import { SaxesParser, type SaxesTagPlain } from 'saxes';
import { TallyError, type Warning } from '../errors';

export type OutsideKind =
  | 'link' // href, xlink:href, src or xml:base to anything but a fragment (#id) or an embedded raster image
  | 'css-url' // url() (or image-set()) in CSS or a presentation attribute pointing outside the file
  | 'css-import' // @import in a style sheet
  | 'script' // <script>
  | 'event-handler' // on... attributes
  | 'foreign-object' // <foreignObject> (HTML inside SVG: frames, forms, links)
  | 'animation' // <set>/<animate> that writes an href, a style or an event handler
  | 'style-sheet-link' // <?xml-stylesheet href=...?>
  | 'doctype' // a DOCTYPE naming a DTD other than the W3C's SVG DTDs
  | 'metadata-address'; // rdf:resource or sodipodi:absref in editor metadata naming anything but a fragment

export interface OutsideReference {
  kind: OutsideKind;
  /** The element (or "document") it sits on. */
  element: string;
}

export interface StrippedSvg {
  svg: string;
  removed: OutsideReference[];
}

const REMOVED_ELEMENTS = new Set(['script', 'foreignobject', 'iframe', 'handler', 'listener']);
const ANIMATIONS = new Set(['set', 'animate', 'animatemotion', 'animatetransform', 'animatecolor']);
/** Embedded raster images are inside the file; an embedded SVG or HTML could carry its own references. */
const SAFE_DATA_URL = /^data:image\/(png|jpeg|jpg|gif|webp)[;,]/i;

/**
 * Namespaced attributes that hold an address without being an href: RDF's rdf:resource (RDF/XML syntax
 * §2.4, the object of a statement, e.g. a licence URL) and Inkscape's sodipodi:absref (the absolute path
 * of a linked image, which the editor falls back to loading and which tells the reader a local folder).
 * rdf:about only names what the metadata describes and loads nothing, so it stays.
 */
const ADDRESS_ATTRIBUTES: ReadonlyArray<{ namespace: string; local: string; usualPrefix: string }> = [
  { namespace: 'http://www.w3.org/1999/02/22-rdf-syntax-ns#', local: 'resource', usualPrefix: 'rdf' },
  { namespace: 'http://sodipodi.sourceforge.net/DTD/sodipodi-0.dtd', local: 'absref', usualPrefix: 'sodipodi' },
];

/** The qualified names those attributes go by in this file: their usual prefixes and any the file binds to their namespaces. */
function addressAttributeNames(text: string): Set<string> {
  const names = new Set(ADDRESS_ATTRIBUTES.map((a) => `${a.usualPrefix}:${a.local}`));
  for (const m of text.matchAll(/xmlns:([^\s=/>]+)\s*=\s*(?:"([^"]*)"|'([^']*)')/g)) {
    const bound = ADDRESS_ATTRIBUTES.find((a) => a.namespace === (m[2] ?? m[3]));
    if (bound) names.add(`${m[1]}:${bound.local}`);
  }
  return names;
}

const localName = (qname: string) => qname.slice(qname.indexOf(':') + 1).toLowerCase();

function isInsideTarget(target: string): boolean {
  const t = target.trim();
  return t.startsWith('#') || SAFE_DATA_URL.test(t);
}

/** CSS escapes (\75 rl, \@import) decoded, so an escaped reference is still seen (CSS Syntax 3, 4.3.7). */
function unescapeCss(css: string): string {
  return css.replace(/\\([0-9a-fA-F]{1,6})\s?|\\([^\n])/g, (_m, hex: string | undefined, ch: string | undefined) => {
    if (hex === undefined) return ch ?? '';
    const cp = parseInt(hex, 16);
    return cp > 0 && cp <= 0x10ffff ? String.fromCodePoint(cp) : '\ufffd';
  });
}

const URL_FUNCTION = /url\(\s*(?:"([^"]*)"|'([^']*)'|([^)"'\s]*))\s*\)/gi;
const IMAGE_FUNCTION = /(?:-webkit-)?image(?:-set)?\([^()]*\)/gi;
const IMPORT_RULE = /@import\b(?:"[^"]*"|'[^']*'|[^;"'])*;?/gi;
/** After the known forms are removed, any of these left means CSS we cannot clean piecemeal. */
const LEFTOVER = /@import|url\(|image(?:-set)?\(/i;

/** CSS with every outside url(), image-set() and @import removed, and how many of each went. */
export function cleanCss(css: string): { css: string; urls: number; imports: number } {
  let urls = 0;
  let imports = 0;
  let out = css.replace(IMPORT_RULE, () => {
    imports += 1;
    return '';
  });
  out = out.replace(URL_FUNCTION, (m, a: string | undefined, b: string | undefined, c: string | undefined) => {
    if (isInsideTarget(a ?? b ?? c ?? '')) return m;
    urls += 1;
    return 'none';
  });
  out = out.replace(IMAGE_FUNCTION, (m) => {
    if (!/["']|url\(/i.test(m)) return m;
    urls += 1;
    return 'none';
  });
  // What is left, read with escapes decoded: a fragment url() is fine, anything else drops the whole text.
  const decoded = unescapeCss(out).replace(URL_FUNCTION, (m, a: string | undefined, b: string | undefined, c: string | undefined) => (isInsideTarget(a ?? b ?? c ?? '') ? '' : m));
  if (LEFTOVER.test(decoded)) {
    urls += 1;
    out = '';
  }
  return { css: out, urls, imports };
}

function cssFindings(css: string, element: string): OutsideReference[] {
  const c = cleanCss(css);
  const out: OutsideReference[] = [];
  for (let i = 0; i < c.imports; i++) out.push({ kind: 'css-import', element });
  for (let i = 0; i < c.urls; i++) out.push({ kind: 'css-url', element });
  return out;
}

function escapeAttr(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/"/g, '&quot;').replace(/</g, '&lt;');
}

function escapeText(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;');
}

/**
 * A DOCTYPE whose system identifier a validating reader might fetch. The W3C's own SVG DTD identifiers
 * (SVG 1.0, 1.1, Tiny, Basic) are resolved from local catalogs, never fetched, and Tallyglyph's charts
 * carry the SVG 1.1 one so that validators can check them.
 */
function outsideDtd(doctype: string): boolean {
  const external = /\b(?:SYSTEM\s+("[^"]*"|'[^']*')|PUBLIC\s+(?:"[^"]*"|'[^']*')\s+("[^"]*"|'[^']*'))/.exec(doctype);
  if (!external) return false;
  const system = (external[1] ?? external[2]).slice(1, -1).trim();
  return !/^http:\/\/www\.w3\.org\/(?:TR\/2001\/REC-SVG-20010904\/DTD\/svg10\.dtd|Graphics\/SVG\/1\.1\/DTD\/svg11(?:-tiny|-basic)?\.dtd)$/.test(system);
}

interface Edit {
  start: number;
  end: number;
  text: string;
}

/** An attribute as written in a start tag: its name and the span from the blank before it to its closing quote. */
const ATTRIBUTE = /\s+([^\s=/>]+)\s*=\s*(?:"[^"]*"|'[^']*')/g;

/** The test the attribute loop below applies to a value before reading it as CSS. */
const MAY_HOLD_CSS_REFERENCE = /url\(|@import|image(?:-set)?\(|\\/i;

/**
 * False only when the attribute loop in scan would find nothing on this tag: every attribute it reads is
 * one of these, and each fails the loop's own tests (the CSS one taken before cleaning, so a maybe counts
 * as a yes). Lets the common tag (a path, a use of a fragment) skip slicing its text and matching spans.
 */
function anyAttributeMayReachOutside(attrs: Record<string, string>, addressNames: Set<string>): boolean {
  for (const qname in attrs) {
    if (qname === 'xmlns' || qname.startsWith('xmlns:')) continue;
    const value = attrs[qname];
    const local = localName(qname);
    if (local.startsWith('on') || qname === 'xml:base' || addressNames.has(qname)) return true;
    if ((local === 'href' || local === 'src') && !isInsideTarget(value)) return true;
    if (MAY_HOLD_CSS_REFERENCE.test(value)) return true;
  }
  return false;
}

function scan(text: string): { found: OutsideReference[]; edits: Edit[] } {
  const found: OutsideReference[] = [];
  const edits: Edit[] = [];
  const parser = new SaxesParser({ xmlns: false, position: true });
  const open: Array<{ start: number; name: string; remove: boolean; styleStart?: number; css?: string }> = [];
  let removing = 0; // depth inside an element being removed whole
  const addressNames = addressAttributeNames(text);

  parser.on('opentagstart', () => {
    open.push({ start: text.lastIndexOf('<', parser.position - 1), name: '', remove: false });
  });
  parser.on('opentag', (tag: SaxesTagPlain) => {
    const entry = open[open.length - 1];
    entry.name = localName(tag.name);
    const startTagEnd = parser.position;
    // Self-closing elements leave the stack at once; closetag (which saxes also sends for them) skips them.
    if (tag.isSelfClosing) open.pop();
    if (removing > 0) {
      if (!tag.isSelfClosing) removing += 1;
      entry.remove = true;
      return;
    }
    const attrs = tag.attributes as Record<string, string>;
    let wholeKind: OutsideKind | null = null;
    if (REMOVED_ELEMENTS.has(entry.name)) wholeKind = entry.name === 'script' ? 'script' : entry.name === 'foreignobject' ? 'foreign-object' : 'script';
    else if (ANIMATIONS.has(entry.name)) {
      const target = localName(attrs.attributeName ?? '');
      const values = ['from', 'to', 'by', 'values'].map((k) => attrs[k] ?? '').join(' ');
      if (target === 'href' || target === 'src' || target === 'style' || target.startsWith('on') || /url\(|@import/i.test(unescapeCss(values))) wholeKind = 'animation';
    }
    if (wholeKind) {
      found.push({ kind: wholeKind, element: tag.name });
      entry.remove = true;
      removing = 1;
      if (tag.isSelfClosing) {
        edits.push({ start: entry.start, end: startTagEnd, text: '' });
        removing = 0;
      }
      return;
    }
    if (entry.name === 'style' && !tag.isSelfClosing) {
      entry.styleStart = startTagEnd;
      entry.css = '';
    }
    if (!anyAttributeMayReachOutside(attrs, addressNames)) return;
    const startTag = text.slice(entry.start, startTagEnd);
    ATTRIBUTE.lastIndex = 0;
    for (let m = ATTRIBUTE.exec(startTag); m; m = ATTRIBUTE.exec(startTag)) {
      const qname = m[1];
      const value = attrs[qname];
      if (value === undefined || qname === 'xmlns' || qname.startsWith('xmlns:')) continue;
      const local = localName(qname);
      const span = { start: entry.start + m.index, end: entry.start + m.index + m[0].length };
      let kind: OutsideKind | null = null;
      if (local.startsWith('on')) kind = 'event-handler';
      else if (local === 'href' || local === 'src') kind = isInsideTarget(value) ? null : 'link';
      else if (qname === 'xml:base') kind = 'link';
      else if (addressNames.has(qname)) kind = value.trim() === '' || value.trim().startsWith('#') ? null : 'metadata-address';
      if (kind) {
        found.push({ kind, element: tag.name });
        edits.push({ ...span, text: '' });
        continue;
      }
      if (!MAY_HOLD_CSS_REFERENCE.test(value)) continue;
      const cleaned = cleanCss(value);
      if (cleaned.urls + cleaned.imports === 0) continue;
      found.push(...cssFindings(value, tag.name));
      // A style attribute keeps its other declarations; any other attribute goes, falling back to its default.
      const keep = local === 'style' && cleaned.css.trim() !== '';
      edits.push({ ...span, text: keep ? ` ${qname}="${escapeAttr(cleaned.css)}"` : '' });
    }
  });
  const addText = (t: string) => {
    const entry = open[open.length - 1];
    if (entry && entry.css !== undefined && removing === 0) entry.css += t;
  };
  parser.on('text', addText);
  parser.on('cdata', addText);
  parser.on('closetag', (tag) => {
    if (tag.isSelfClosing) return; // handled at opentag
    const entry = open.pop();
    if (!entry) return;
    if (removing > 0) {
      removing -= 1;
      if (removing === 0) edits.push({ start: entry.start, end: parser.position, text: '' });
      return;
    }
    if (entry.css !== undefined && entry.styleStart !== undefined) {
      const cleaned = cleanCss(entry.css);
      if (cleaned.urls + cleaned.imports > 0) {
        found.push(...cssFindings(entry.css, tag.name));
        const contentEnd = text.lastIndexOf('</', parser.position - 1);
        edits.push({ start: entry.styleStart, end: contentEnd, text: escapeText(cleaned.css) });
      }
    }
  });
  parser.on('processinginstruction', (pi) => {
    if (pi.target.toLowerCase() !== 'xml-stylesheet') return;
    found.push({ kind: 'style-sheet-link', element: 'document' });
    edits.push({ start: text.lastIndexOf('<?', parser.position - 1), end: parser.position, text: '' });
  });
  parser.on('doctype', (doctype) => {
    if (!outsideDtd(doctype)) return;
    found.push({ kind: 'doctype', element: 'document' });
    edits.push({ start: text.lastIndexOf('<!DOCTYPE', parser.position - 1), end: parser.position, text: '' });
  });
  try {
    parser.write(text).close();
  } catch (e) {
    throw new TallyError('svg-malformed', `The SVG is not well-formed XML: ${e instanceof Error ? e.message.split('\n')[0] : String(e)}`);
  }
  return { found, edits };
}

/** Everything in the file that reaches outside it or runs code, in document order. */
export function findOutsideReferences(svg: string): OutsideReference[] {
  return scan(svg).found;
}

/**
 * The file with every outside reference, script, event handler and foreignObject removed (see
 * OutsideKind), and what went. The result is scanned again: it must hold none, or this throws.
 */
export function stripOutsideReferences(svg: string): StrippedSvg {
  const { found, edits } = scan(svg);
  if (!edits.length) return { svg, removed: [] };
  edits.sort((a, b) => a.start - b.start);
  const parts: string[] = [];
  let at = 0;
  for (const e of edits) {
    if (e.start < at) continue; // inside a span already removed
    parts.push(svg.slice(at, e.start), e.text);
    at = e.end;
  }
  parts.push(svg.slice(at));
  const out = parts.join('');
  const left = scan(out).found;
  if (left.length) {
    throw new TallyError('svg-malformed', `The file still refers outside itself after cleaning (${describeKinds(left)}); nothing was written.`);
  }
  return { svg: out, removed: found };
}

const KIND_WORDS: Record<OutsideKind, [string, string]> = {
  link: ['link to an outside file or address', 'links to outside files or addresses'],
  'css-url': ['CSS url() to an outside file', 'CSS url()s to outside files'],
  'css-import': ['CSS @import', 'CSS @imports'],
  script: ['script', 'scripts'],
  'event-handler': ['event handler (on...)', 'event handlers (on...)'],
  'foreign-object': ['<foreignObject>', '<foreignObject>s'],
  animation: ['animation that sets a link, style or handler', 'animations that set links, styles or handlers'],
  'style-sheet-link': ['linked style sheet', 'linked style sheets'],
  doctype: ['DOCTYPE naming an outside DTD', 'DOCTYPEs naming outside DTDs'],
  'metadata-address': ['address in editor metadata', 'addresses in editor metadata'],
};

/** "2 links to outside files or addresses, 1 CSS @import": counts by kind, never the addresses themselves. */
export function describeKinds(refs: readonly OutsideReference[]): string {
  const counts = new Map<OutsideKind, number>();
  for (const r of refs) counts.set(r.kind, (counts.get(r.kind) ?? 0) + 1);
  // A fixed order (links first), whatever order the file had them in.
  const kinds = (Object.keys(KIND_WORDS) as OutsideKind[]).filter((k) => counts.has(k));
  return kinds.map((kind) => `${counts.get(kind)} ${KIND_WORDS[kind][counts.get(kind) === 1 ? 0 : 1]}`).join(', ');
}

/** The note that travels with a cleaned output file, or null when nothing was removed. */
export function removalNote(removed: readonly OutsideReference[], what: string): Warning | null {
  if (!removed.length) return null;
  return {
    code: 'outside-references-removed',
    message: `${what} leaves out ${describeKinds(removed)} from the supplied file: a delivered file must not fetch or run anything.`,
  };
}
