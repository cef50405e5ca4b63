// The sheet for a drawing answered by a redrawn unit chart (any supplied SVG, PNG or JPEG): the
// supplied drawing and the verified chart side by side, each fitted to fill its own frame (their
// coordinates differ), with the lie factor, a one-line explanation and the data under each, captions
// outlined in the bundled font so the sheet prints the same anywhere.
import { TallyError, type Warning } from '../errors';
import type { Box } from '../geometry/region';
import type { AuditReport } from './auditReport';
import { formatFactor } from './formatNumbers';
import { importSvg } from './importSvg';
import { dataLine, drawingBox, frameSheet, readingLine, type SheetPanel } from './sheetFrame';
import type { ReadingName } from './types';

export interface RedrawSheetInput {
  /** The supplied drawing as SVG text (an image is first wrapped by `imageAsSvg`). */
  supplied: string;
  /** The redrawn chart, as written and verified by the chart pipeline. */
  redrawn: string;
  before: AuditReport;
  /** The reading the supplied drawing is judged by. */
  reading: ReadingName;
  /** The redrawn chart's worst lie factor, measured from its written file. */
  redrawnLieFactor: number | null;
  /** What a designer calls each mark, in mark order, for the data line (default: its label, else its value alone). */
  names?: readonly string[];
  title?: string;
}

export interface RedrawSheet {
  svg: string;
  widthMm: number;
  heightMm: number;
  /** Where each panel's drawing sits on the sheet, in mm: for checks that measure one panel alone. */
  panels: { supplied: Box; redrawn: Box };
  warnings: Warning[];
}

/** A PNG or JPEG as an SVG of its own pixel size, so it can be placed like any supplied drawing. */
export function imageAsSvg(base64: string, mime: 'image/png' | 'image/jpeg', widthPx: number, heightPx: number): string {
  if (!/^[A-Za-z0-9+/]*={0,2}$/.test(base64)) throw new TallyError('raster-invalid', 'The image data is not valid base64.');
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${widthPx}" height="${heightPx}" viewBox="0 0 ${widthPx} ${heightPx}"><image width="${widthPx}" height="${heightPx}" href="data:${mime};base64,${base64}"/></svg>`;
}

export function buildRedrawSheet(input: RedrawSheetInput): RedrawSheet {
  const names = input.names;
  const r = input.before.readings[input.reading];
  const redrawnPass = input.redrawnLieFactor !== null && input.redrawnLieFactor >= input.before.limits.low && input.redrawnLieFactor <= input.before.limits.high;
  const line = dataLine(input.before, names);
  const panel = (text: string, prefix: string, heading: string, lines: readonly [string, string]): SheetPanel => {
    // Each drawing fills its frame at its own proportions: their coordinates differ.
    const root = importSvg(text).root;
    return { root, box: drawingBox(root), prefix, heading, lines, dataLine: line };
  };
  const framed = frameSheet(
    [
      panel(input.supplied, 'supplied-', 'As supplied', [`Lie factor ${formatFactor(r.lieFactor.worst)} (${input.reading} reading): ${r.verdict}`, readingLine(input.before, input.reading)]),
      panel(input.redrawn, 'redrawn-', 'Redrawn as a unit chart', [
        `Lie factor ${formatFactor(input.redrawnLieFactor)} (verified from the written file): ${redrawnPass ? 'faithful' : 'distorted'}`,
        'Each glyph stands for the same amount; remainders hold their share of ink.',
      ]),
    ],
    input.title,
    'Supplied graphic and redrawn chart',
  );
  return { svg: framed.svg, widthMm: framed.widthMm, heightMm: framed.heightMm, panels: { supplied: framed.placed[0], redrawn: framed.placed[1] }, warnings: framed.warnings };
}
