// Where elements sit in the source text, by document order, so a correction can wrap them without
// re-serialising (and so changing) anything else in the file.
import { SaxesParser } from 'saxes';
import { TallyError } from '../errors';

export interface ElementSpan {
  /** Index of the start tag's '<'. */
  start: number;
  /** Index just after the end tag's '>' (or a self-closing tag's '/>'). */
  end: number;
}

/** Spans of the elements whose document-order index (0 = root, as importSvg numbers them) is wanted. */
export function elementSpans(text: string, wanted: ReadonlySet<number>): Map<number, ElementSpan> {
  const parser = new SaxesParser({ xmlns: false, position: true });
  const open: Array<{ index: number; start: number }> = [];
  const found = new Map<number, ElementSpan>();
  let count = 0;
  parser.on('opentagstart', () => {
    // saxes has read the '<' and the name; nothing in a name can be '<'.
    open.push({ index: count++, start: text.lastIndexOf('<', parser.position - 1) });
  });
  parser.on('closetag', () => {
    const entry = open.pop();
    if (entry && wanted.has(entry.index)) found.set(entry.index, { start: entry.start, end: parser.position });
  });
  try {
    parser.write(text).close();
  } catch (e) {
    throw new TallyError('svg-malformed', `The SVG is not well-formed XML: ${e instanceof Error ? e.message.split('\n')[0] : String(e)}`);
  }
  for (const i of wanted) if (!found.has(i)) throw new TallyError('svg-malformed', 'An element to correct could not be located in the file text.');
  return found;
}
