// The sheet for a drawing answered by a redrawn unit chart (any supplied SVG, PNG or JPEG): the
// supplied drawing and the verified chart side by side, each fitted to fill its own frame (their
// coordinates differ), with the lie factor, a one-line explanation and the data under each, captions
// outlined in the bundled font so the sheet prints the same anywhere.
import { TallyError, type Warning } from '../errors';
import type { Box } from '../geometry/region';
import { parseViewBox } from '../glyph/collectShapes';
import { escapeXmlAttr, escapeXmlText } from '../svg/writeSvg';
import { textOutline } from '../text';
import type { AuditReport } from './auditReport';
import { formatFactor, formatMeasure, formatRatio } from './formatNumbers';
import { importSvg } from './importSvg';
import { sanitizedCopy } from './sanitizedCopy';
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
  /** What a designer calls each mark, in mark order, for the data line. */
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

const PANEL_MM = 120;
const MARGIN_MM = 12;
const GAP_MM = 14;
const CAPTION_MM = 30;
const INK = '#1d1d1b';

/** A PNG or JPEG as an SVG of its own pixel size, so it can be placed like any supplied drawing. */
export function imageAsSvg(base64: string, mime: 'image/png' | 'image/jpeg', widthPx: number, heightPx: number): string {
  if (!/^[A-Za-z0-9+/]*={0,2}$/.test(base64)) throw new TallyError('raster-invalid', 'The image data is not valid base64.');
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${widthPx}" height="${heightPx}" viewBox="0 0 ${widthPx} ${heightPx}"><image width="${widthPx}" height="${heightPx}" href="data:${mime};base64,${base64}"/></svg>`;
}

function frameOf(text: string): { box: Box; root: ReturnType<typeof importSvg>['root'] } {
  const root = importSvg(text).root;
  const vb = parseViewBox(root.attrs.viewBox);
  if (vb) return { box: vb, root };
  const w = Number.parseFloat(root.attrs.width ?? ''), h = Number.parseFloat(root.attrs.height ?? '');
  if (w > 0 && h > 0) return { box: { x: 0, y: 0, width: w, height: h }, root };
  throw new TallyError('svg-malformed', 'The supplied SVG has neither a viewBox nor a plain width and height, so it cannot be placed on a sheet.');
}

function caption(text: string, xMm: number, yMm: number, sizeMm: number, maxWidthMm: number, weight: 400 | 700 = 400): string {
  let size = sizeMm;
  let out = textOutline(text, { xMm, yMm, sizeMm: size, weight });
  if (out.advanceMm > maxWidthMm) {
    size = Math.max(2.2, (size * maxWidthMm) / out.advanceMm);
    out = textOutline(text, { xMm, yMm, sizeMm: size, weight });
  }
  return out.pathData ? `<path d="${out.pathData}" fill="${INK}"/>` : '';
}

function readingLine(report: AuditReport, reading: ReadingName): string {
  const r = report.readings[reading];
  const pair = r.lieFactor.pairs.find((p) => r.lieFactor.worstPair && p.mark === r.lieFactor.worstPair.mark);
  if (!pair || pair.graphicRatio === null) return r.problems[0] ?? r.unavailableReason ?? 'Nothing to compare.';
  const what = reading === 'length' ? 'the length' : reading === 'volume' ? 'the volume' : reading === 'count' ? 'the glyph count' : 'the area';
  return `${formatRatio(pair.dataRatio)}× the value is drawn with ${formatRatio(pair.graphicRatio)}× ${what}${r.pass ? ': in proportion.' : '.'}`;
}

export function buildRedrawSheet(input: RedrawSheetInput): RedrawSheet {
  const titleH = input.title ? 12 : 0;
  const widthMm = 2 * MARGIN_MM + 2 * PANEL_MM + GAP_MM;
  const heightMm = 2 * MARGIN_MM + titleH + PANEL_MM + CAPTION_MM;
  const warnings: Warning[] = [];
  const parts: string[] = [];
  const captions: string[] = [];
  if (input.title) captions.push(caption(input.title, MARGIN_MM, MARGIN_MM + 7, 6, widthMm - 2 * MARGIN_MM, 700));
  const names = input.names ?? input.before.marks.map((m) => m.label);
  const dataLine = 'Data: ' + input.before.marks.map((m, i) => `${names[i] ?? m.label} ${formatMeasure(m.value)}`).join(', ');
  const r = input.before.readings[input.reading];
  const redrawnPass = input.redrawnLieFactor !== null && input.redrawnLieFactor >= input.before.limits.low && input.redrawnLieFactor <= input.before.limits.high;
  const panels = [
    { text: input.supplied, prefix: 'supplied-', heading: 'As supplied', lines: [`Lie factor ${formatFactor(r.lieFactor.worst)} (${input.reading} reading): ${r.verdict}`, readingLine(input.before, input.reading)] },
    { text: input.redrawn, prefix: 'redrawn-', heading: 'Redrawn as a unit chart', lines: [`Lie factor ${formatFactor(input.redrawnLieFactor)} (verified from the written file): ${redrawnPass ? 'faithful' : 'distorted'}`, 'Each glyph stands for the same amount; remainders hold their share of ink.'] },
  ];
  const placed: Box[] = [];
  panels.forEach((panel, i) => {
    const { box, root } = frameOf(panel.text);
    const copy = sanitizedCopy(root, panel.prefix);
    if (i === 0) warnings.push(...copy.warnings);
    // Each drawing fills its frame at its own proportions.
    const scale = PANEL_MM / Math.max(box.width, box.height);
    const w = box.width * scale, h = box.height * scale;
    const x0 = MARGIN_MM + i * (PANEL_MM + GAP_MM);
    const y0 = MARGIN_MM + titleH;
    const x = x0 + (PANEL_MM - w) / 2, y = y0 + (PANEL_MM - h) / 2;
    placed.push({ x, y, width: w, height: h });
    captions.push(`<rect x="${x0}" y="${y0}" width="${PANEL_MM}" height="${PANEL_MM}" fill="none" stroke="#b5b5b0" stroke-width="0.25"/>`);
    parts.push(
      `<svg id="${escapeXmlAttr(panel.prefix)}panel" x="${x}" y="${y}" width="${w}" height="${h}" viewBox="${box.x} ${box.y} ${box.width} ${box.height}" overflow="hidden"><g${copy.rootAttributes}>${copy.markup}</g></svg>`,
    );
    const cy = y0 + PANEL_MM + 7;
    captions.push(caption(panel.heading, x0, cy, 4.2, PANEL_MM, 700));
    captions.push(caption(panel.lines[0], x0, cy + 6.5, 3.6, PANEL_MM));
    captions.push(caption(panel.lines[1], x0, cy + 12, 3.2, PANEL_MM));
    captions.push(caption(dataLine, x0, cy + 17.5, 3.2, PANEL_MM));
  });
  const svg =
    '<?xml version="1.0" encoding="UTF-8"?>\n' +
    `<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" version="1.1" width="${widthMm}mm" height="${heightMm}mm" viewBox="0 0 ${widthMm} ${heightMm}">\n` +
    `<title>${escapeXmlText(input.title ?? 'Supplied graphic and redrawn chart')}</title>\n` +
    `<rect id="sheet-background" width="${widthMm}" height="${heightMm}" fill="#ffffff"/>\n` +
    parts.join('\n') +
    `\n<g id="sheet-captions">${captions.join('')}</g>` +
    '\n</svg>\n';
  return { svg, widthMm, heightMm, panels: { supplied: placed[0], redrawn: placed[1] }, warnings };
}
