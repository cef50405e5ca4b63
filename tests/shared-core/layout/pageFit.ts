// Test helper: everything a chart draws lies inside the page's content area (inside the margins, which
// themselves lie inside the printer's safe area), and nothing drawn sits on anything else. Boxes come from
// the scene's own polygons and the text outlines' ink bounds, computed here without the layout's helpers.
import type { ChartSpec } from '../../../shared-core/document';
import type { Region } from '../../../shared-core/geometry/region';
import type { Scene } from '../../../shared-core/scene';

export interface Box {
  x: number;
  y: number;
  width: number;
  height: number;
}

interface Drawn {
  what: string;
  box: Box;
  /** A cut piece (partial, filled or rest): pieces of one split glyph share its box without sharing ink. */
  splitPiece?: boolean;
}

const SLACK_MM = 1e-6;

function regionBox(region: Region): Box | null {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const ring of region) for (const p of ring) {
    minX = Math.min(minX, p.x); maxX = Math.max(maxX, p.x);
    minY = Math.min(minY, p.y); maxY = Math.max(maxY, p.y);
  }
  return Number.isFinite(minX) && maxX > minX && maxY > minY ? { x: minX, y: minY, width: maxX - minX, height: maxY - minY } : null;
}

function overlap(a: Box, b: Box): boolean {
  return a.x < b.x + b.width - SLACK_MM && b.x < a.x + a.width - SLACK_MM && a.y < b.y + b.height - SLACK_MM && b.y < a.y + a.height - SLACK_MM;
}

/** Every box the scene draws: glyph pieces, legend keys, texts (ink bounds) and rules (with their width). */
export function drawnBoxes(scene: Scene): Drawn[] {
  const out: Drawn[] = [];
  for (const m of scene.marks) {
    m.glyphs.forEach((g, k) => {
      const box = regionBox(g.region);
      if (box) out.push({ what: `mark "${m.label}" piece ${k}`, box, splitPiece: g.part !== 'full' });
    });
  }
  scene.legendKeys.forEach((key, k) => {
    const box = regionBox(key.region);
    if (box) out.push({ what: `legend key ${k} (${key.glyph})`, box });
  });
  for (const t of scene.texts) if (t.bboxMm && t.bboxMm.width > 0) out.push({ what: `${t.role} text "${t.text}"`, box: t.bboxMm });
  for (const l of scene.lines) {
    // Butt caps (the SVG default): the stroke widens the line across its direction only.
    const horizontal = l.y1Mm === l.y2Mm;
    const padX = horizontal ? 0 : l.widthMm / 2;
    const padY = horizontal ? l.widthMm / 2 : 0;
    out.push({ what: `${l.role} line`, box: { x: Math.min(l.x1Mm, l.x2Mm) - padX, y: Math.min(l.y1Mm, l.y2Mm) - padY, width: Math.abs(l.x2Mm - l.x1Mm) + 2 * padX, height: Math.abs(l.y2Mm - l.y1Mm) + 2 * padY } });
  }
  return out;
}

/**
 * Problems found, as sentences (empty when the chart fits): anything outside the content area, and any two
 * drawn things whose boxes overlap. A rule under the stacks may touch the glyphs it carries, so lines are
 * checked against texts only.
 */
export function pageFitProblems(scene: Scene, spec: ChartSpec): string[] {
  const m = spec.layout.margins;
  const area = { left: m.left, top: m.top, right: spec.page.widthMm - m.right, bottom: spec.page.heightMm - m.bottom };
  const problems: string[] = [];
  const drawn = drawnBoxes(scene);
  for (const d of drawn) {
    const b = d.box;
    if (b.x < area.left - SLACK_MM || b.y < area.top - SLACK_MM || b.x + b.width > area.right + SLACK_MM || b.y + b.height > area.bottom + SLACK_MM) {
      problems.push(`${d.what} lies outside the content area (${b.x.toFixed(2)}, ${b.y.toFixed(2)}, ${b.width.toFixed(2)} x ${b.height.toFixed(2)} mm)`);
    }
  }
  const isLine = (d: Drawn) => d.what.endsWith(' line');
  const isText = (d: Drawn) => d.what.includes(' text "');
  for (let i = 0; i < drawn.length; i++) {
    for (let j = i + 1; j < drawn.length; j++) {
      const a = drawn[i];
      const b = drawn[j];
      if ((isLine(a) && !isText(b)) || (isLine(b) && !isText(a))) continue;
      if (a.splitPiece && b.splitPiece) continue;
      if (overlap(a.box, b.box)) problems.push(`${a.what} overlaps ${b.what}`);
      if (problems.length > 20) return problems;
    }
  }
  return problems;
}
