// The refusal for a chart that cannot fit its page at a legible size. Layout throws it before anything is
// written or verified, so a designer hears "no room" instead of a later, unrelated-sounding failure.
import type { ChartSpec } from '../document';
import { TallyError } from '../errors';
import { formatValue } from './labels';

export interface NoRoomDetails {
  /** What did not fit, e.g. "The stacks". */
  what: string;
  /** Room the margins leave for it, and what it needs at the smallest legible size (mm), when known. */
  neededMm?: { width: number; height: number };
  roomMm?: { width: number; height: number };
  /** A readable unit at which the marks would fit, for repeat and stack. */
  suggestedUnit?: number;
}

/** Advice for the case at hand: bigger page, larger unit (only where a unit exists), fewer rows, smaller margins. */
export function noRoomError(spec: ChartSpec, details: NoRoomDetails): TallyError {
  const { widthMm, heightMm } = spec.page;
  const counted = spec.encoding.mode === 'repeat' || spec.encoding.mode === 'stack';
  const room = details.roomMm && details.neededMm
    ? ` They need about ${formatValue(details.neededMm.width)} x ${formatValue(details.neededMm.height)} mm; the margins leave ${formatValue(details.roomMm.width)} x ${formatValue(details.roomMm.height)} mm.`
    : '';
  const unit = counted
    ? details.suggestedUnit !== undefined
      ? `a larger unit (${formatValue(details.suggestedUnit)} or more per glyph), `
      : 'a larger unit (more per glyph), '
    : '';
  return new TallyError(
    'layout-no-room',
    `${details.what} do not fit on this ${formatValue(widthMm)} x ${formatValue(heightMm)} mm page at a legible size, so nothing was drawn.${room} ` +
      `Use a bigger page, ${unit}fewer rows, or smaller margins.`,
    details,
  );
}
