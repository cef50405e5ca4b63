// Data-ink share measured from the geometry: how much of the printed ink shows data, how much helps reading it
// (labels, legend, axes, title, source) and how much decorates (backgrounds, frames, ornaments).
import { IDENTITY, regionArea, unionPaths, type Region } from '../../geometry/index';
import { flattenPathData, newBudget } from '../../glyph/index';
import type { Scene, SceneText } from '../../scene/index';
import { textOutline } from '../../text/index';
import { findingOf, shown, type ChartRule } from './ruleInput';

export interface DataInkMeasure {
  /** Ink of the data marks (every glyph piece, filled and unfilled). */
  dataMm2: number;
  /** Labels, value labels, legend text and keys, title, source, baselines. */
  readingAidMm2: number;
  /** Backgrounds, frames, rules and ornaments. */
  decorationMm2: number;
  /** dataMm2 / all ink; null when nothing is inked. */
  dataShare: number | null;
}

/** Paper colours that print no ink. */
const PAPER = /^#(?:fff|ffffff|ffff|ffffffff)$/i;

function textInkMm2(t: SceneText): number {
  if (!t.text.trim()) return 0;
  const outline = textOutline(t.text, { xMm: t.xMm, yMm: t.yMm, sizeMm: t.sizeMm, weight: t.weight, family: t.family ?? 'sans', anchor: t.anchor, decimals: 4 });
  if (!outline.pathData) return 0;
  const tolerance = t.sizeMm * 1e-3;
  const rings = flattenPathData(outline.pathData, IDENTITY, tolerance, newBudget()).map((p) => p.points);
  return regionArea(unionPaths(rings, 'nonzero') as Region);
}

function dataInkMm2(scene: Scene): number {
  return scene.marks.reduce((s, m) => s + m.glyphs.reduce((t, g) => t + regionArea(g.region), 0), 0);
}

function decorationInkMm2(scene: Scene): number {
  let decorationMm2 = 0;
  for (const line of scene.lines) if (line.role !== 'baseline') decorationMm2 += Math.hypot(line.x2Mm - line.x1Mm, line.y2Mm - line.y1Mm) * line.widthMm;
  if (scene.background && !PAPER.test(scene.background.trim())) {
    const b = scene.page.bleedMm;
    decorationMm2 += (scene.page.widthMm + 2 * b) * (scene.page.heightMm + 2 * b);
  }
  return decorationMm2;
}

/** Measures the three kinds of ink of a laid-out chart, in mm² of the page. */
export function measureDataInk(scene: Scene): DataInkMeasure {
  const dataMm2 = dataInkMm2(scene);
  const decorationMm2 = decorationInkMm2(scene);
  let readingAidMm2 = scene.legendKeys.reduce((s, k) => s + regionArea(k.region), 0);
  for (const t of scene.texts) readingAidMm2 += textInkMm2(t);
  for (const line of scene.lines) if (line.role === 'baseline') readingAidMm2 += Math.hypot(line.x2Mm - line.x1Mm, line.y2Mm - line.y1Mm) * line.widthMm;
  const total = dataMm2 + readingAidMm2 + decorationMm2;
  return { dataMm2, readingAidMm2, decorationMm2, dataShare: total > 0 ? dataMm2 / total : null };
}

export const decorationHeavy: ChartRule = {
  code: 'decoration-heavy',
  name: 'Decoration outweighs data',
  severity: 'advice',
  run({ scene }) {
    // Text outlines are the costly part and only matter for the message: compare data and decoration first.
    if (!(decorationInkMm2(scene) > dataInkMm2(scene))) return [];
    const ink = measureDataInk(scene);
    const total = ink.dataMm2 + ink.readingAidMm2 + ink.decorationMm2;
    const pct = (x: number) => `${shown((x / total) * 100)}%`;
    return [
      findingOf(this, {
        message: `Decoration takes more ink than the data: data marks ${pct(ink.dataMm2)} of the ink (${shown(ink.dataMm2)} mm²), reading aids ${pct(ink.readingAidMm2)}, decoration ${pct(ink.decorationMm2)} (${shown(ink.decorationMm2)} mm²).`,
        fix: 'Lighten or remove the background, frames and ornaments so the glyphs carry most of the ink.',
        basis: 'Tufte 1983, ch. 4: data-ink ratio (from memory)',
      }),
    ];
  },
};
