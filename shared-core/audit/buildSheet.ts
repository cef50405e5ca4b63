// The side-by-side sheet: the supplied drawing and its correction next to each other, each with its
// lie factor, a one-line explanation and the data, with every caption outlined in the bundled font so
// the sheet prints the same anywhere.
import { TallyError, type Warning } from '../errors';
import type { Box } from '../geometry/region';
import { parseViewBox } from '../glyph/collectShapes';
import { escapeXmlText } from '../svg/writeSvg';
import { walkElements } from '../svg/parseXml';
import { textOutline } from '../text';
import type { AuditReport } from './auditReport';
import { formatFactor, formatMeasure, formatRatio } from './formatNumbers';
import { importSvg } from './importSvg';
import { removalNote, stripOutsideReferences } from './outsideReferences';
import { TEXT_LIMITS } from '../document/chartSchema';
import { sanitizedCopy } from './sanitizedCopy';
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
  warnings: Warning[];
}

const PANEL_MM = 120;
const MARGIN_MM = 12;
const GAP_MM = 14;
const CAPTION_MM = 30;
const INK = '#1d1d1b';

function drawingBox(text: string): Box {
  const root = importSvg(text).root;
  const vb = parseViewBox(root.attrs.viewBox);
  if (vb) return vb;
  const w = Number.parseFloat(root.attrs.width ?? ''), h = Number.parseFloat(root.attrs.height ?? '');
  if (w > 0 && h > 0) return { x: 0, y: 0, width: w, height: h };
  throw new TallyError('svg-malformed', 'The supplied SVG has neither a viewBox nor a plain width and height, so it cannot be placed on a sheet.');
}

/** A caption line outlined at `sizeMm`, shrunk (to no less than 2.2 mm) to fit `maxWidthMm`. */
function caption(text: string, xMm: number, yMm: number, sizeMm: number, maxWidthMm: number, weight: 400 | 700 = 400): string {
  let size = sizeMm;
  let out = textOutline(text, { xMm, yMm, sizeMm: size, weight });
  if (out.advanceMm > maxWidthMm) {
    size = Math.max(2.2, (size * maxWidthMm) / out.advanceMm);
    out = textOutline(text, { xMm, yMm, sizeMm: size, weight });
  }
  return out.pathData ? `<path d="${out.pathData}" fill="${INK}"/>` : '';
}

function oneLine(report: AuditReport, reading: ReadingName): string {
  const r = report.readings[reading];
  const pair = r.lieFactor.pairs.find((p) => r.lieFactor.worstPair && p.mark === r.lieFactor.worstPair.mark);
  if (!pair || pair.graphicRatio === null) return r.problems[0] ?? 'Nothing to compare.';
  const what = reading === 'length' ? 'the length' : reading === 'volume' ? 'the volume' : 'the area';
  return `${formatRatio(pair.dataRatio)}× the value is drawn with ${formatRatio(pair.graphicRatio)}× ${what}${r.pass ? ': in proportion.' : '.'}`;
}

function dataLine(report: AuditReport): string {
  return 'Data: ' + report.marks.map((m) => `${m.label} ${formatMeasure(m.value)}`).join(', ');
}

export function buildSheet(input: SheetInput): Sheet {
  const titleLength = input.title === undefined ? 0 : [...input.title].length;
  if (titleLength > TEXT_LIMITS.title) {
    throw new TallyError('usage', `The sheet title is ${titleLength.toLocaleString('en')} characters long; a title may have at most ${TEXT_LIMITS.title} characters, so it can be read on the sheet.`);
  }
  const box = drawingBox(input.supplied);
  const scale = PANEL_MM / Math.max(box.width, box.height);
  const panelW = box.width * scale, panelH = box.height * scale;
  const titleH = input.title ? 12 : 0;
  const widthMm = 2 * MARGIN_MM + 2 * PANEL_MM + GAP_MM;
  const heightMm = 2 * MARGIN_MM + titleH + PANEL_MM + CAPTION_MM;
  const prefixes = { supplied: 'supplied-', corrected: 'corrected-' };
  const warnings: Warning[] = [];
  // Panels and captions apart, so a checker can hide the captions and measure the marks alone.
  const parts: string[] = [];
  const captions: string[] = [];
  if (input.title) captions.push(caption(input.title, MARGIN_MM, MARGIN_MM + 7, 6, widthMm - 2 * MARGIN_MM, 700));
  const panels: Array<[string, string, AuditReport, string]> = [
    [input.supplied, prefixes.supplied, input.before, 'As supplied'],
    [input.corrected, prefixes.corrected, input.after, `Corrected for the ${input.reading} reading`],
  ];
  panels.forEach(([text, prefix, report, heading], i) => {
    const root = importSvg(text).root;
    const copy = sanitizedCopy(root, prefix);
    if (i === 0) {
      warnings.push(...copy.warnings);
      if ([...walkElements(root)].some((el) => el.name === 'text')) {
        warnings.push({ code: 'sheet-live-text', message: "The supplied drawing's own text is copied as text, not outlines: it needs its fonts, and the sheet's PNG leaves it out." });
      }
    }
    const x0 = MARGIN_MM + i * (PANEL_MM + GAP_MM);
    const y0 = MARGIN_MM + titleH;
    const x = x0 + (PANEL_MM - panelW) / 2, y = y0 + (PANEL_MM - panelH) / 2;
    captions.push(`<rect x="${x0}" y="${y0}" width="${PANEL_MM}" height="${PANEL_MM}" fill="none" stroke="#b5b5b0" stroke-width="0.25"/>`);
    parts.push(
      `<svg id="${prefix}panel" x="${x}" y="${y}" width="${panelW}" height="${panelH}" viewBox="${box.x} ${box.y} ${box.width} ${box.height}" overflow="hidden"><g${copy.rootAttributes}>${copy.markup}</g></svg>`,
    );
    const r = report.readings[input.reading];
    const verdict = r.pass ? 'faithful' : 'distorted';
    const cy = y0 + PANEL_MM + 7;
    captions.push(caption(heading, x0, cy, 4.2, PANEL_MM, 700));
    captions.push(caption(`Lie factor ${formatFactor(r.lieFactor.worst)} (${input.reading} reading): ${verdict}`, x0, cy + 6.5, 3.6, PANEL_MM));
    captions.push(caption(oneLine(report, input.reading), x0, cy + 12, 3.2, PANEL_MM));
    captions.push(caption(dataLine(report), x0, cy + 17.5, 3.2, PANEL_MM));
  });
  const written =
    '<?xml version="1.0" encoding="UTF-8"?>\n' +
    `<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" version="1.1" width="${widthMm}mm" height="${heightMm}mm" viewBox="0 0 ${widthMm} ${heightMm}">\n` +
    `<title>${escapeXmlText(input.title ?? 'Supplied and corrected graphic')}</title>\n` +
    `<rect id="sheet-background" width="${widthMm}" height="${heightMm}" fill="#ffffff"/>\n` +
    parts.join('\n') +
    `\n<g id="sheet-captions">${captions.join('')}</g>` +
    '\n</svg>\n';
  // The copies are already cleaned; this pass proves it on the whole sheet and catches what they missed.
  const stripped = stripOutsideReferences(written);
  const note = removalNote(stripped.removed, "The sheet's copy");
  if (note) warnings.push(note);
  return { svg: stripped.svg, widthMm, heightMm, prefixes, warnings };
}
