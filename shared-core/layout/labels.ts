// Text for charts: default sizes, measuring, wrapping, number formats, and SceneText with ink bounds.
import type { Box } from '../geometry/region';
import type { SceneText } from '../scene';
import { breakLines, measureText, textOutline, type FontWeight, type TextFamily } from '../text';
import { INK_COLORS } from './palette';

/** Default text sizes in mm (common practice for print charts, no source); 1 pt = 25.4 / 72 mm (CSS Values and Units). */
export const TEXT_SIZE_MM = Object.freeze({
  title: 5,
  label: 3.2,
  valueLabel: 3,
  legend: 3,
  source: 2.5,
});

/**
 * The text family of the chart being laid out. Every measure and outline in layout goes through the helpers
 * below, so the family is set once for the whole (synchronous) layout rather than threaded through each mode.
 */
let currentFamily: TextFamily = 'sans';

/** Runs a layout with every text measured and outlined in `family`, restoring the previous family after. */
export function withTextFamily<T>(family: TextFamily, run: () => T): T {
  const before = currentFamily;
  currentFamily = family;
  try {
    return run();
  } finally {
    currentFamily = before;
  }
}

/** The family field a SceneText carries: absent for sans, so sans scenes stay as they were. */
function familyOf(): { family?: 'serif' } {
  return currentFamily === 'serif' ? { family: 'serif' } : {};
}

/** Text is never shrunk below this: a little above 6 pt (ptToMm(6) = 2.117 mm), the printers' usual minimum. */
export const MIN_TEXT_SIZE_MM = 2.2;

export interface LineMetricsMm {
  ascentMm: number;
  descentMm: number;
  capHeightMm: number;
  /** Baseline-to-baseline distance for stacked lines. */
  lineHeightMm: number;
  /** Vertical room one line needs: ascent + descent. */
  boxHeightMm: number;
}

export function lineMetrics(sizeMm: number, weight: FontWeight = 400): LineMetricsMm {
  const m = measureText('', { sizeMm, weight, family: currentFamily });
  return { ascentMm: m.ascentMm, descentMm: m.descentMm, capHeightMm: m.capHeightMm, lineHeightMm: m.lineHeightMm, boxHeightMm: m.ascentMm + m.descentMm };
}

export function textWidthMm(text: string, sizeMm: number, weight: FontWeight = 400): number {
  return measureText(text, { sizeMm, weight, family: currentFamily }).widthMm;
}

/** A label as one line: line breaks and runs of blanks become single spaces. */
export function oneLine(text: string): string {
  return text.replace(/\s+/g, ' ').trim();
}

/** Greedy word wrap to a width; a word wider than the width keeps a line of its own. Explicit line breaks are kept. */
export function wrapText(text: string, maxWidthMm: number, sizeMm: number, weight: FontWeight = 400): string[] {
  // Linear in the text (shared-core/text/breakLines): re-measuring the line for every word was quadratic.
  return breakLines(text, maxWidthMm, { sizeMm, weight, family: currentFamily });
}

/** Numbers as a reader wants them: grouped thousands, at most 2 decimals from 1 up, 3 significant digits below 1. */
export function formatValue(value: number): string {
  if (value === 0) return '0';
  if (Math.abs(value) >= 1) return value.toLocaleString('en-US', { maximumFractionDigits: 2 });
  return value.toLocaleString('en-US', { maximumSignificantDigits: 3 });
}

/** A value label: the number, then the document's unit suffix where it sets one ("12 L"). */
export function valueLabelText(value: number, layout: { valueUnit?: string }): string {
  const suffix = layout.valueUnit?.trim() ?? '';
  return suffix ? `${formatValue(value)} ${oneLine(suffix)}` : formatValue(value);
}

export function formatShare(share: number): string {
  return `${(share * 100).toLocaleString('en-US', { maximumFractionDigits: 1 })}%`;
}

export interface TextSpec {
  role: SceneText['role'];
  text: string;
  xMm: number;
  yMm: number;
  sizeMm: number;
  weight?: FontWeight;
  anchor?: SceneText['anchor'];
  color?: string;
  owner?: string;
}

/** A SceneText with the ink bounds of its outline. */
export function makeText(spec: TextSpec): SceneText {
  const weight = spec.weight ?? 400;
  const anchor = spec.anchor ?? 'start';
  const outline = textOutline(spec.text, { xMm: spec.xMm, yMm: spec.yMm, sizeMm: spec.sizeMm, weight, anchor, family: currentFamily });
  const text: SceneText = {
    role: spec.role,
    text: spec.text,
    xMm: spec.xMm,
    yMm: spec.yMm,
    sizeMm: spec.sizeMm,
    weight,
    anchor,
    color: spec.color ?? INK_COLORS.text,
    bboxMm: outline.bbox,
    ...familyOf(),
  };
  if (spec.owner !== undefined) text.owner = spec.owner;
  return text;
}

/** The same text at another size, re-measured; anchor and baseline stay put. */
export function resizeText(text: SceneText, sizeMm: number): SceneText {
  const outline = textOutline(text.text, { xMm: text.xMm, yMm: text.yMm, sizeMm, weight: text.weight, anchor: text.anchor, family: text.family ?? 'sans' });
  return { ...text, sizeMm, bboxMm: outline.bbox };
}

/** Ink bounds of a text, measuring it if layout did not. */
export function textBox(text: SceneText): Box {
  if (text.bboxMm) return text.bboxMm;
  return textOutline(text.text, { xMm: text.xMm, yMm: text.yMm, sizeMm: text.sizeMm, weight: text.weight, anchor: text.anchor, family: text.family ?? 'sans' }).bbox;
}

/** A label broken into lines no wider than `maxWidthMm` where it has spaces; a single long word stays whole. */
export function labelLines(label: string, maxWidthMm: number, sizeMm: number, weight: FontWeight = 400): string[] {
  if (textWidthMm(label, sizeMm, weight) <= maxWidthMm) return [label];
  const lines = wrapText(label, maxWidthMm, sizeMm, weight);
  return lines.length > 0 ? lines : [label];
}

export function linesWidthMm(lines: readonly string[], sizeMm: number, weight: FontWeight = 400): number {
  return Math.max(0, ...lines.map((l) => textWidthMm(l, sizeMm, weight)));
}

/** Vertical room for a block of lines: one line box plus a line height per further line. */
export function linesHeightMm(count: number, m: LineMetricsMm): number {
  return count <= 0 ? 0 : m.boxHeightMm + (count - 1) * m.lineHeightMm;
}

/** One SceneText per line, the first baseline at `yMm`. */
export function makeLines(spec: TextSpec, lines: readonly string[], lineHeightMm: number): SceneText[] {
  return lines.map((text, i) => makeText({ ...spec, text, yMm: spec.yMm + i * lineHeightMm }));
}
