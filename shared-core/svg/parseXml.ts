// A small, safe XML reader for SVG: well-formedness from saxes, no DTD or entity expansion,
// no external fetches, and hard limits on size, element count and depth so hostile files stay cheap.
import { SaxesParser } from 'saxes';
import { TallyError } from '../errors';

export interface XmlElement {
  /** Local name without namespace prefix (`svg`, `path`, ...). */
  name: string;
  /** Qualified name as written (`svg:path`, `path`). */
  qname: string;
  /** Attributes by qualified name, as written (`xlink:href`, `fill`). */
  attrs: Record<string, string>;
  children: XmlElement[];
  /** Concatenated character data directly inside this element. */
  text: string;
}

export interface XmlLimits {
  maxChars: number;
  maxElements: number;
  maxDepth: number;
}

export const DEFAULT_XML_LIMITS: XmlLimits = {
  maxChars: 20_000_000,
  maxElements: 200_000,
  maxDepth: 256,
};

const PREDEFINED_ENTITY = /&(?!(?:amp|lt|gt|quot|apos|#\d+|#x[0-9a-fA-F]+);)([A-Za-z_][\w.-]*);/;

/** Parse SVG/XML text into an element tree. Throws TallyError('svg-malformed' | 'svg-limit'). */
export function parseXml(text: string, limits: Partial<XmlLimits> = {}): XmlElement {
  const lim = { ...DEFAULT_XML_LIMITS, ...limits };
  if (typeof text !== 'string') throw new TallyError('svg-malformed', 'The SVG is not text.');
  if (text.length > lim.maxChars) {
    throw new TallyError('svg-limit', `The SVG is ${text.length} characters long; the limit is ${lim.maxChars} (file size limit).`);
  }
  if (text.includes('\uFFFD')) {
    throw new TallyError('svg-malformed', 'The SVG contains bytes that are not valid UTF-8 text.');
  }
  // Entities declared in a DTD are never expanded (no billion-laughs, no external entities):
  // a reference to one is refused with a sentence instead of saxes' generic error.
  const declared = /<!ENTITY/i.test(text);
  const custom = PREDEFINED_ENTITY.exec(text);
  if (declared || custom) {
    throw new TallyError('svg-malformed', 'The SVG declares or uses XML entities' + (custom ? ` (&${custom[1]};)` : '') + '; Tallyglyph does not expand DTD entities, for safety. Export the file again without a DTD.');
  }

  const parser = new SaxesParser({ xmlns: false, position: true });
  const stack: XmlElement[] = [];
  let root: XmlElement | null = null;
  let count = 0;
  let failure: TallyError | null = null;

  parser.on('error', (err) => {
    failure ??= new TallyError('svg-malformed', `The SVG is not well-formed XML: ${String(err.message).split('\n')[0]}`);
    throw failure;
  });
  parser.on('opentag', (tag) => {
    count += 1;
    if (count > lim.maxElements) {
      failure = new TallyError('svg-limit', `The SVG has more than ${lim.maxElements} elements (element count limit).`);
      throw failure;
    }
    if (stack.length >= lim.maxDepth) {
      failure = new TallyError('svg-limit', `The SVG nests elements deeper than ${lim.maxDepth} levels (depth limit).`);
      throw failure;
    }
    // Without namespaces saxes hands each tag a fresh null-prototype object of string values: kept as it is
    // (no copy per element), and no attribute name (`__proto__`, `constructor`) can reach a prototype.
    const attrs = tag.attributes as Record<string, string>;
    const qname = tag.name;
    const colon = qname.indexOf(':');
    const el: XmlElement = { name: colon >= 0 ? qname.slice(colon + 1) : qname, qname, attrs, children: [], text: '' };
    if (stack.length) stack[stack.length - 1].children.push(el);
    else if (!root) root = el;
    stack.push(el);
  });
  parser.on('closetag', () => {
    stack.pop();
  });
  parser.on('text', (t) => {
    if (stack.length) stack[stack.length - 1].text += t;
  });
  parser.on('cdata', (t) => {
    if (stack.length) stack[stack.length - 1].text += t;
  });

  try {
    parser.write(text).close();
  } catch (e) {
    if (failure) throw failure;
    throw new TallyError('svg-malformed', `The SVG is not well-formed XML: ${e instanceof Error ? e.message.split('\n')[0] : String(e)}`);
  }
  if (failure) throw failure;
  if (!root) throw new TallyError('svg-malformed', 'The file holds no XML element.');
  return root;
}

/** Depth-first walk. */
export function* walkElements(el: XmlElement): Generator<XmlElement> {
  yield el;
  for (const c of el.children) yield* walkElements(c);
}
