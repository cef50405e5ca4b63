// A hand-made stack chart: 6 mm squares upward from a baseline at y = 130 mm, one 7.5 mm pitch per slot, with the
// slots, positions and partial glyph each test needs.
import { chartSvg, rect, type HandPiece } from '../chartSvgFixtures';

export interface HandStack {
  label: string;
  value: number;
  /** Slot written on each full glyph, and the slot whose position it is drawn at (default the same). */
  fulls: { slot: number; drawnAt?: number; dxMm?: number }[];
  /** Share of a glyph kept by a partial glyph, and its slot. */
  partial?: { share: number; slot: number };
  liftMm?: number;
}

export const STACK_PITCH_MM = 7.5;
const SIDE_MM = 6;
const BASE_Y = 130;

export function stackSvg(stacks: HandStack[], unit = 1): string {
  return chartSvg({
    reading: 'length',
    mode: 'stack',
    unit,
    baselineY: BASE_Y,
    summary: { pitchMm: STACK_PITCH_MM, baselineYMm: BASE_Y },
    marks: stacks.map((st, col) => {
      const x = 20 + col * 15;
      const lift = st.liftMm ?? 0;
      const pieces: HandPiece[] = st.fulls.map((f) => ({
        ring: rect(x + (f.dxMm ?? 0), BASE_Y - lift - (f.drawnAt ?? f.slot) * STACK_PITCH_MM - SIDE_MM, SIDE_MM, SIDE_MM),
        part: 'full',
        slot: f.slot,
      }));
      if (st.partial) {
        const h = SIDE_MM * st.partial.share;
        pieces.push({ ring: rect(x, BASE_Y - lift - st.partial.slot * STACK_PITCH_MM - h, SIDE_MM, h), part: 'partial', slot: st.partial.slot });
      }
      return { id: `mark-${col + 1}`, label: st.label, value: st.value, pieces };
    }),
  });
}

export const slots = (n: number) => Array.from({ length: n }, (_, slot) => ({ slot }));
