import type { Warning } from '../errors';
import { TallyError } from '../errors';
import { layoutLine } from './layoutLine';
import { loadFontFace } from './loadFont';
import { verticalMetricsMm } from './measureText';
import { commandsBounds, commandsToPathData, type OutlineCommand } from './outlinePath';
import { placeLine } from './textOutline';
import { checkPlacement, type RectMm, type TextPlacement } from './textOptions';

export interface TextLinesOptions extends TextPlacement {
  /** Baseline-to-baseline distance; default the font's own line spacing (about 1.36 x sizeMm for Noto Sans). */
  lineHeightMm?: number;
}

export interface TextLine {
  text: string;
  baselineYMm: number;
  advanceMm: number;
  startXMm: number;
  /** Ink bounds of this line, or undefined for a line with no ink. */
  bbox: RectMm | undefined;
}

export interface TextLinesOutline {
  /** All lines in one SVG path data string, page millimetres. */
  pathData: string;
  /** Ink bounds of all lines; zero-sized at the first line's pen start when nothing has ink. */
  bbox: RectMm;
  /** The widest line's advance. */
  advanceMm: number;
  lines: TextLine[];
  warnings: Warning[];
}

/**
 * Multi-line text: splits on CR LF, LF, CR, U+2028 and U+2029, anchors every line on xMm (as
 * SVG text-anchor does per line) and puts the first baseline on yMm, each next one lineHeightMm lower.
 */
export function textLines(text: string, options: TextLinesOptions): TextLinesOutline {
  const placement = checkPlacement(options);
  const face = loadFontFace(placement.weight, placement.family);
  const lineHeightMm = options.lineHeightMm ?? verticalMetricsMm(face, placement.sizeMm).lineHeightMm;
  if (!Number.isFinite(lineHeightMm)) {
    throw new TallyError('number-invalid', `Line height must be a finite number of millimetres, not ${String(lineHeightMm)}.`);
  }

  const warnings = new Map<string, Warning>();
  const lines: TextLine[] = [];
  const allCommands: OutlineCommand[] = [];
  let advanceMm = 0;
  for (const [i, lineText] of text.split(/\r\n|[\r\n\u2028\u2029]/).entries()) {
    const baselineYMm = placement.yMm + i * lineHeightMm;
    const placed = placeLine(face, layoutLine(face, lineText), placement, baselineYMm);
    for (const w of placed.warnings) warnings.set(`${w.code}\n${w.message}`, w);
    allCommands.push(...placed.commands);
    advanceMm = Math.max(advanceMm, placed.advanceMm);
    lines.push({ text: lineText, baselineYMm, advanceMm: placed.advanceMm, startXMm: placed.startXMm, bbox: commandsBounds(placed.commands) });
  }
  const first = lines[0];
  const bbox = commandsBounds(allCommands) ?? { x: first.startXMm, y: first.baselineYMm, width: 0, height: 0 };
  return { pathData: commandsToPathData(allCommands), bbox, advanceMm, lines, warnings: [...warnings.values()] };
}
