// The frame both audit sheets share: page size, two panels side by side, each drawing fitted to fill
// its panel, a caption block under each, captions outlined in the bundled font so the sheet prints the
// same anywhere, and the words that name each mark by its label or its value (never an element id).
import { TallyError, type Warning } from '../errors';
import type { Box } from '../geometry/region';
import { parseViewBox } from '../glyph/collectShapes';
import type { XmlElement } from '../svg/parseXml';
import { escapeXmlAttr, escapeXmlText } from '../svg/writeSvg';
import { textOutline } from '../text';
import type { AuditReport } from './auditReport';
import { formatMeasure, formatRatio } from './formatNumbers';
import { sanitizedCopy } from './sanitizedCopy';
import type { ReadingName } from './types';

export const PANEL_MM = 120;
const MARGIN_MM = 12;
const GAP_MM = 14;
const CAPTION_MM = 32;
const TITLE_MM = 12;
const INK = '#1d1d1b';

/** The drawing's own frame in its user units: its viewBox, else a plain width and height. */
export function drawingBox(root: XmlElement): Box {
  const vb = parseViewBox(root.attrs.viewBox);
  if (vb) return vb;
  const w = Number.parseFloat(root.attrs.width ?? ''), h = Number.parseFloat(root.attrs.height ?? '');
  if (w > 0 && h > 0) return { x: 0, y: 0, width: w, height: h };
  throw new TallyError('svg-malformed', 'The supplied SVG has neither a viewBox nor a plain width and height, so it cannot be placed on a sheet.');
}

/** A caption line outlined at `sizeMm`, shrunk (to no less than 2.2 mm) to fit `maxWidthMm`. */
export function sheetCaption(text: string, xMm: number, yMm: number, sizeMm: number, maxWidthMm: number, weight: 400 | 700 = 400): string {
  let size = sizeMm;
  let out = textOutline(text, { xMm, yMm, sizeMm: size, weight });
  if (out.advanceMm > maxWidthMm) {
    size = Math.max(2.2, (size * maxWidthMm) / out.advanceMm);
    out = textOutline(text, { xMm, yMm, sizeMm: size, weight });
  }
  return out.pathData ? `<path d="${out.pathData}" fill="${INK}"/>` : '';
}

/** What the sheet calls a mark: its label where the file gives one, else nothing (the value speaks for it). */
export function markName(mark: AuditReport['marks'][number]): string | null {
  return mark.label && mark.label !== mark.id ? mark.label : null;
}

/** "Data: 1973 1, 1979 5.54", or "Data: 1, 5.54" for marks without labels. */
export function dataLine(report: AuditReport, names?: readonly string[]): string {
  return 'Data: ' + report.marks.map((m, i) => [names?.[i] ?? markName(m), formatMeasure(m.value)].filter((s) => s !== null).join(' ')).join(', ');
}

/** "5.54× the value is drawn with 43.8× the area." for the worst pair of a reading. */
export function readingLine(report: AuditReport, reading: ReadingName): string {
  const r = report.readings[reading];
  const pair = r.lieFactor.pairs.find((p) => r.lieFactor.worstPair && p.mark === r.lieFactor.worstPair.mark);
  if (!pair || pair.graphicRatio === null) return r.problems[0] ?? r.unavailableReason ?? 'Nothing to compare.';
  const what = reading === 'length' ? 'the length' : reading === 'volume' ? 'the volume' : reading === 'count' ? 'the glyph count' : 'the area';
  return `${formatRatio(pair.dataRatio)}× the value is drawn with ${formatRatio(pair.graphicRatio)}× ${what}${r.pass ? ': in proportion.' : '.'}`;
}

export interface SheetPanel {
  /** The drawing's parsed root. */
  root: XmlElement;
  /** The part of the drawing to show, in its user units. */
  box: Box;
  /** Prefix of the copy's ids (mark ids inside are prefixed the same way). */
  prefix: string;
  heading: string;
  /** Two lines under the heading: the lie factor and what it means. */
  lines: readonly [string, string];
  dataLine: string;
}

export interface FramedSheet {
  svg: string;
  widthMm: number;
  heightMm: number;
  /** Where each panel's drawing sits on the sheet, in mm, in panel order. */
  placed: Box[];
  /** Notes from the first panel's copy (the supplied drawing): what was left out of it. */
  warnings: Warning[];
}

/**
 * Two panels side by side under an optional title. Each drawing fills its panel at its own proportions
 * (its longer side spans the panel), centred, with the frame drawn tight around it.
 */
export function frameSheet(panels: readonly [SheetPanel, SheetPanel], title: string | undefined, fallbackTitle: string): FramedSheet {
  const titleH = title ? TITLE_MM : 0;
  const widthMm = 2 * MARGIN_MM + 2 * PANEL_MM + GAP_MM;
  // Each drawing's longer side spans the panel; the row is as tall as the taller drawing, so the
  // captions sit right under the drawings rather than under an empty square.
  const sizes = panels.map(({ box }) => {
    const scale = PANEL_MM / Math.max(box.width, box.height);
    return { w: box.width * scale, h: box.height * scale };
  });
  const rowMm = Math.max(...sizes.map((z) => z.h));
  const heightMm = 2 * MARGIN_MM + titleH + rowMm + CAPTION_MM;
  const warnings: Warning[] = [];
  // Panels and captions apart, so a checker can hide the captions and measure the marks alone.
  const parts: string[] = [];
  const captions: string[] = [];
  const placed: Box[] = [];
  if (title) captions.push(sheetCaption(title, MARGIN_MM, MARGIN_MM + 7, 6, widthMm - 2 * MARGIN_MM, 700));
  panels.forEach((panel, i) => {
    const copy = sanitizedCopy(panel.root, panel.prefix, { outlineText: true });
    if (i === 0) warnings.push(...copy.warnings);
    const { box } = panel;
    const { w, h } = sizes[i];
    const x0 = MARGIN_MM + i * (PANEL_MM + GAP_MM);
    const y0 = MARGIN_MM + titleH;
    const x = x0 + (PANEL_MM - w) / 2, y = y0 + (rowMm - h) / 2;
    placed.push({ x, y, width: w, height: h });
    captions.push(`<rect x="${x}" y="${y}" width="${w}" height="${h}" fill="none" stroke="#b5b5b0" stroke-width="0.25"/>`);
    parts.push(
      `<svg id="${escapeXmlAttr(panel.prefix)}panel" x="${x}" y="${y}" width="${w}" height="${h}" viewBox="${box.x} ${box.y} ${box.width} ${box.height}" overflow="hidden"><g${copy.rootAttributes}>${copy.markup}</g></svg>`,
    );
    const cy = y0 + rowMm + 9;
    captions.push(sheetCaption(panel.heading, x0, cy, 4.2, PANEL_MM, 700));
    captions.push(sheetCaption(panel.lines[0], x0, cy + 6.5, 3.6, PANEL_MM));
    captions.push(sheetCaption(panel.lines[1], x0, cy + 12, 3.2, PANEL_MM));
    captions.push(sheetCaption(panel.dataLine, x0, cy + 17.5, 3.2, PANEL_MM));
  });
  const svg =
    '<?xml version="1.0" encoding="UTF-8"?>\n' +
    `<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" version="1.1" width="${widthMm}mm" height="${heightMm}mm" viewBox="0 0 ${widthMm} ${heightMm}">\n` +
    `<title>${escapeXmlText(title ?? fallbackTitle)}</title>\n` +
    `<rect id="sheet-background" width="${widthMm}" height="${heightMm}" fill="#ffffff"/>\n` +
    parts.join('\n') +
    `\n<g id="sheet-captions">${captions.join('')}</g>` +
    '\n</svg>\n';
  return { svg, widthMm, heightMm, placed, warnings };
}
