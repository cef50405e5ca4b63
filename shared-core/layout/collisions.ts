// Labels must not sit on data ink, on legend keys or on each other. Layouts reserve room for their
// text, so this is the safety net: find overlaps by ink bounding boxes, shrink the text that
// overlaps (never below the print minimum), and warn about whatever still does.
import type { Warning } from '../errors';
import { boxOf, type Box } from '../geometry/region';
import type { Scene, SceneText } from '../scene';
import { MIN_TEXT_SIZE_MM, resizeText, textBox } from './labels';

export interface LabelCollision {
  /** Index in scene.texts. */
  text: number;
  with: 'mark' | 'legend-key' | 'text';
  /** Mark id, legend key index or text index. */
  other: string | number;
}

/** True when two boxes share interior area; touching edges and zero-size boxes do not count. */
export function boxesOverlap(a: Box, b: Box, clearanceMm = 0): boolean {
  if (a.width <= 0 || a.height <= 0 || b.width <= 0 || b.height <= 0) return false;
  return a.x < b.x + b.width + clearanceMm && b.x < a.x + a.width + clearanceMm && a.y < b.y + b.height + clearanceMm && b.y < a.y + a.height + clearanceMm;
}

/** Ink box of each mark (all its pieces together); marks with no ink are left out. */
export function markBoxes(scene: Pick<Scene, 'marks'>): { id: string; box: Box }[] {
  const out: { id: string; box: Box }[] = [];
  for (const mark of scene.marks) {
    const box = boxOf(mark.glyphs.flatMap((g) => g.region));
    if (box.width > 0 && box.height > 0) out.push({ id: mark.id, box });
  }
  return out;
}

function obstacles(scene: Pick<Scene, 'marks' | 'legendKeys'>): { kind: 'mark' | 'legend-key'; other: string | number; box: Box }[] {
  return [
    ...markBoxes(scene).map((m) => ({ kind: 'mark' as const, other: m.id, box: m.box })),
    ...scene.legendKeys.map((k, i) => ({ kind: 'legend-key' as const, other: i, box: boxOf(k.region) })),
  ];
}

/** Every overlap of a text's ink box with a mark, a legend key or another text. */
export function findLabelCollisions(scene: Pick<Scene, 'marks' | 'legendKeys' | 'texts'>): LabelCollision[] {
  const obs = obstacles(scene);
  const boxes = scene.texts.map(textBox);
  const out: LabelCollision[] = [];
  boxes.forEach((box, t) => {
    for (const o of obs) if (boxesOverlap(box, o.box)) out.push({ text: t, with: o.kind, other: o.other });
    for (let u = t + 1; u < boxes.length; u++) if (boxesOverlap(box, boxes[u])) out.push({ text: t, with: 'text', other: u });
  });
  return out;
}

const SHRINK_STEP = 0.9;

/**
 * Texts that overlap something are shrunk step by step around their anchor until they clear it or
 * reach the print minimum; any overlap left is reported as a warning. Earlier texts win over later ones.
 */
export function resolveLabelCollisions(scene: Pick<Scene, 'marks' | 'legendKeys' | 'texts'>): { texts: SceneText[]; warnings: Warning[] } {
  // A mark's box is checked first; only a text inside it is checked against the mark's pieces, so a value label
  // beside the last glyph of a wrapped row (inside the mark's box, clear of its ink) is not taken for a clash.
  const pieceBoxes = new Map<string, Box[]>();
  const piecesOf = (id: string): Box[] => {
    let list = pieceBoxes.get(id);
    if (!list) {
      const mark = scene.marks.find((m) => m.id === id);
      list = (mark?.glyphs ?? []).map((g) => boxOf(g.region));
      pieceBoxes.set(id, list);
    }
    return list;
  };
  const obs = obstacles(scene);
  const hits = (box: Box, o: (typeof obs)[number]) => boxesOverlap(box, o.box) && (o.kind !== 'mark' || piecesOf(String(o.other)).some((p) => boxesOverlap(box, p)));
  const placed: Box[] = [];
  const texts: SceneText[] = [];
  const warnings: Warning[] = [];
  const clashes = (box: Box) => obs.some((o) => hits(box, o)) || placed.some((p) => boxesOverlap(box, p));
  for (const original of scene.texts) {
    let text = original;
    let box = textBox(text);
    while (clashes(box) && text.sizeMm > MIN_TEXT_SIZE_MM + 1e-9) {
      text = resizeText(text, Math.max(MIN_TEXT_SIZE_MM, text.sizeMm * SHRINK_STEP));
      box = textBox(text);
    }
    if (clashes(box)) {
      warnings.push({ code: 'label-overlap', message: `The ${text.role} "${text.text.slice(0, 60)}" overlaps other marks or text even at the smallest size; shorten it or give the chart more room.` });
    }
    placed.push(box);
    texts.push(text);
  }
  return { texts, warnings };
}
