// The side-by-side sheet: the supplied drawing and its correction next to each other, each with its
// lie factor, a one-line explanation and the data, with every caption outlined in the bundled font so
// the sheet prints the same anywhere.
import { TallyError, type Warning } from '../errors';
import type { Box } from '../geometry/region';
import type { XmlElement } from '../svg/parseXml';
import { TEXT_LIMITS } from '../document/chartSchema';
import type { AuditReport } from './auditReport';
import { formatFactor } from './formatNumbers';
import { importSvg } from './importSvg';
import { removalNote, stripOutsideReferences } from './outsideReferences';
import { dataLine, drawingBox, frameSheet, readingLine, type SheetPanel } from './sheetFrame';
import type { ReadingName } from './types';

export interface SheetInput {
  supplied: string;
  corrected: string;
  before: AuditReport;
  after: AuditReport;
  /** The reading the correction made honest. */
  reading: Exclude<ReadingName, 'count'>;
  title?: string;
}

export interface Sheet {
  svg: string;
  widthMm: number;
  heightMm: number;
  /** Id prefixes of the two panels' copies (mark ids inside are prefixed the same way). */
  prefixes: { supplied: string; corrected: string };
  /** Where each panel's drawing sits on the sheet, in mm: for checks that measure one panel alone. */
  panels: { supplied: Box; corrected: Box };
  warnings: Warning[];
}

/** The union of two boxes. */
function union(a: Box, b: Box): Box {
  const x = Math.min(a.x, b.x), y = Math.min(a.y, b.y);
  return { x, y, width: Math.max(a.x + a.width, b.x + b.width) - x, height: Math.max(a.y + a.height, b.y + b.height) - y };
}

export function buildSheet(input: SheetInput): Sheet {
  const titleLength = input.title === undefined ? 0 : [...input.title].length;
  if (titleLength > TEXT_LIMITS.title) {
    throw new TallyError('usage', `The sheet title is ${titleLength.toLocaleString('en')} characters long; a title may have at most ${TEXT_LIMITS.title} characters, so it can be read on the sheet.`);
  }
  const suppliedRoot = importSvg(input.supplied).root;
  const correctedRoot = importSvg(input.corrected).root;
  // Both panels share one box and so one scale, so the correction's change of size shows; the box also
  // takes in any mark the correction grew past the page, so no panel cuts a mark off.
  let box = drawingBox(suppliedRoot);
  for (const m of [...input.before.marks, ...input.after.marks]) box = union(box, { x: m.xUnits, y: m.yUnits, width: m.widthUnits, height: m.heightUnits });
  const prefixes = { supplied: 'supplied-', corrected: 'corrected-' };
  const panel = (root: XmlElement, prefix: string, report: AuditReport, heading: string): SheetPanel => {
    const r = report.readings[input.reading];
    return {
      root,
      box,
      prefix,
      heading,
      lines: [`Lie factor ${formatFactor(r.lieFactor.worst)} (${input.reading} reading): ${r.pass ? 'faithful' : 'distorted'}`, readingLine(report, input.reading)],
      dataLine: dataLine(report),
    };
  };
  const framed = frameSheet(
    [panel(suppliedRoot, prefixes.supplied, input.before, 'As supplied'), panel(correctedRoot, prefixes.corrected, input.after, `Corrected for the ${input.reading} reading`)],
    input.title,
    'Supplied and corrected graphic',
  );
  const warnings: Warning[] = [...framed.warnings];
  // The copies are already cleaned; this pass proves it on the whole sheet and catches what they missed.
  const stripped = stripOutsideReferences(framed.svg);
  const note = removalNote(stripped.removed, "The sheet's copy");
  if (note) warnings.push(note);
  return { svg: stripped.svg, widthMm: framed.widthMm, heightMm: framed.heightMm, prefixes, panels: { supplied: framed.placed[0], corrected: framed.placed[1] }, warnings };
}
