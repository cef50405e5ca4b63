import type { Warning } from '../errors';
import { layoutLine, type LineLayout } from './layoutLine';
import { loadFontFace, type FontFace } from './loadFont';
import { commandsBounds, commandsToPathData, outlineCommands, type OutlineCommand } from './outlinePath';
import { checkPlacement, rejectLineBreaks, type CheckedPlacement, type RectMm, type TextPlacement } from './textOptions';

export interface TextOutline {
  /** SVG path data in page millimetres (absolute M/L/Q/Z commands); fill it with the default nonzero rule. */
  pathData: string;
  /** Bounds of the ink itself. With no ink (empty or blank text) it is zero-sized at the pen start on the baseline. */
  bbox: RectMm;
  /** Advance width with kerning. */
  advanceMm: number;
  /** Where the advance starts after anchoring (equals xMm for anchor 'start'). */
  startXMm: number;
  warnings: Warning[];
}

/**
 * One line of text as filled outlines, so print files do not depend on installed fonts.
 * Line breaks are refused; use textLines for multi-line text.
 */
export function textOutline(text: string, options: TextPlacement): TextOutline {
  const placement = checkPlacement(options);
  rejectLineBreaks(text);
  const face = loadFontFace(placement.weight, placement.family);
  const { commands: _commands, ...outline } = placeLine(face, layoutLine(face, text), placement, placement.yMm);
  return outline;
}

export function placeLine(face: FontFace, line: LineLayout, placement: CheckedPlacement, baselineYMm: number): TextOutline & { commands: OutlineCommand[] } {
  const { sizeMm, xMm, anchor, decimals } = placement;
  const advanceMm = (line.advanceUnits * sizeMm) / face.unitsPerEm;
  const startXMm = anchor === 'start' ? xMm : anchor === 'middle' ? xMm - advanceMm / 2 : xMm - advanceMm;
  const commands = outlineCommands(face, line, startXMm, baselineYMm, sizeMm, decimals);
  const bbox = commandsBounds(commands) ?? { x: startXMm, y: baselineYMm, width: 0, height: 0 };
  return { pathData: commandsToPathData(commands), bbox, advanceMm, startXMm, warnings: line.warnings, commands };
}
