// A series with gaps (2000, 2005, 2010, 2020) drawn at equal spacing makes the last step look as fast as the others.
import { STEP_YEARS, type Period } from '../../standardise/index';
import type { Scene, SceneMark } from '../../scene/index';
import { boxOf } from '../../geometry/index';
import { findingOf, periodsOf, type ChartRule } from './ruleInput';

/** Where a category sits on the page: its label's anchor, else the middle of its glyphs. */
function positionOf(scene: Scene, mark: SceneMark): { x: number; y: number } | null {
  const label = scene.texts.find((t) => t.owner === mark.id && t.role === 'label');
  if (label) return { x: label.xMm, y: label.yMm };
  if (mark.glyphs.length === 0) return null;
  const b = boxOf(mark.glyphs.flatMap((g) => g.region));
  return { x: b.x + b.width / 2, y: b.y + b.height / 2 };
}

/** True when the categories are placed along one axis in proportion to time (within 2%). */
function drawnToTime(scene: Scene, periods: Period[]): boolean {
  const pos = scene.marks.map((m) => positionOf(scene, m));
  if (pos.some((p) => p === null) || pos.length !== periods.length) return false;
  const ps = pos as { x: number; y: number }[];
  for (const axis of ['x', 'y'] as const) {
    const span = ps[ps.length - 1][axis] - ps[0][axis];
    const time = periods[periods.length - 1].startYears - periods[0].startYears;
    if (Math.abs(span) < 1e-6 || time === 0) continue;
    const ok = ps.every((p, i) => Math.abs((p[axis] - ps[0][axis]) / span - (periods[i].startYears - periods[0].startYears) / time) <= 0.02);
    if (ok) return true;
  }
  return false;
}

export const timeUneven: ChartRule = {
  code: 'time-uneven',
  name: 'Uneven time steps drawn evenly',
  severity: 'warning',
  run({ spec, scene }) {
    const periods = periodsOf(spec);
    if (!periods || (periods.length < 3 && !periods.some((p, i) => i > 0 && p.startYears <= periods[i - 1].startYears))) return [];
    const step = STEP_YEARS[periods[0].granularity];
    const steps = periods.slice(1).map((p, i) => Math.round((p.startYears - periods[i].startYears) / step));
    if (steps.some((s) => s <= 0)) {
      return [
        findingOf(this, {
          code: 'time-uneven-order',
          message: `The periods are not in time order (${periods.map((p) => p.text).join(', ')}), so the chart does not read as a trend.`,
          fix: 'Sort the rows from the earliest period to the latest.',
          basis: 'common practice, no source',
        }),
      ];
    }
    if (steps.every((s) => s === steps[0]) || drawnToTime(scene, periods)) return [];
    const gapAt = steps.findIndex((s) => s !== Math.min(...steps));
    const unitWord = periods[0].granularity;
    return [
      findingOf(this, {
        message: `The periods are ${steps.map((s) => `${s} ${unitWord}${s === 1 ? '' : 's'}`).join(', ')} apart but drawn at equal spacing, so a ${steps[gapAt]}-${unitWord} step (${periods[gapAt].text} to ${periods[gapAt + 1].text}) looks as short as the others.`,
        fix: `Add the missing ${unitWord}s so every step is the same length, or split the chart at the gap and say so.`,
        category: periods[gapAt + 1].text,
        basis: 'common practice, no source',
      }),
    ];
  },
};
