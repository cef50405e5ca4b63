// Groups pieces of ink that belong to one picture: pieces whose boxes overlap or touch are one mark,
// except a piece that spans several separate pieces (a baseline, a frame, a background), which
// belongs to none of them.
import type { Box } from '../geometry/region';

export interface MergeResult {
  /** Indices of the input boxes, one list per merged mark, each list ascending, lists by first index. */
  groups: number[][];
  /** Indices set aside as connectors (axes, frames, backgrounds joining separate marks). */
  connectors: number[];
}

function touches(a: Box, b: Box, gap: number): boolean {
  return a.x <= b.x + b.width + gap && b.x <= a.x + a.width + gap && a.y <= b.y + b.height + gap && b.y <= a.y + a.height + gap;
}

/** True when `c` covers both `a` and `b` along an axis on which `a` and `b` are apart. */
function spans(c: Box, a: Box, b: Box, gap: number): boolean {
  const apartX = a.x + a.width + gap < b.x || b.x + b.width + gap < a.x;
  const apartY = a.y + a.height + gap < b.y || b.y + b.height + gap < a.y;
  const coversX = c.x <= Math.min(a.x, b.x) + gap && c.x + c.width >= Math.max(a.x + a.width, b.x + b.width) - gap;
  const coversY = c.y <= Math.min(a.y, b.y) + gap && c.y + c.height >= Math.max(a.y + a.height, b.y + b.height) - gap;
  return (apartX && coversX) || (apartY && coversY);
}

/** `gap` is how far apart two boxes may be and still touch, in the boxes' units. */
export function mergeTouching(boxes: readonly Box[], gap: number): MergeResult {
  const n = boxes.length;
  // Sweep by x so the pair test stays near-linear for charts of many small marks.
  const byX = [...boxes.keys()].sort((i, j) => boxes[i].x - boxes[j].x);
  const neighbours: number[][] = boxes.map(() => []);
  for (let a = 0; a < n; a++) {
    const i = byX[a];
    const right = boxes[i].x + boxes[i].width + gap;
    for (let b = a + 1; b < n; b++) {
      const j = byX[b];
      if (boxes[j].x > right) break;
      if (touches(boxes[i], boxes[j], gap)) {
        neighbours[i].push(j);
        neighbours[j].push(i);
      }
    }
  }
  const connector = new Set<number>();
  for (let i = 0; i < n; i++) {
    const nb = neighbours[i];
    if (nb.length < 2 || nb.length > 400) {
      if (nb.length > 400) connector.add(i);
      continue;
    }
    search: for (let p = 0; p < nb.length; p++) {
      for (let q = p + 1; q < nb.length; q++) {
        const a = boxes[nb[p]], b = boxes[nb[q]];
        if (!touches(a, b, gap) && spans(boxes[i], a, b, gap)) {
          connector.add(i);
          break search;
        }
      }
    }
  }
  const parent = boxes.map((_, i) => i);
  const find = (i: number): number => {
    while (parent[i] !== i) {
      parent[i] = parent[parent[i]];
      i = parent[i];
    }
    return i;
  };
  for (let i = 0; i < n; i++) {
    if (connector.has(i)) continue;
    for (const j of neighbours[i]) if (!connector.has(j)) parent[find(i)] = find(j);
  }
  const byRoot = new Map<number, number[]>();
  for (let i = 0; i < n; i++) {
    if (connector.has(i)) continue;
    const r = find(i);
    const list = byRoot.get(r);
    if (list) list.push(i);
    else byRoot.set(r, [i]);
  }
  const groups = [...byRoot.values()].sort((a, b) => a[0] - b[0]);
  return { groups, connectors: [...connector].sort((a, b) => a - b) };
}

export function unionBox(boxes: readonly Box[]): Box {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const b of boxes) {
    minX = Math.min(minX, b.x);
    minY = Math.min(minY, b.y);
    maxX = Math.max(maxX, b.x + b.width);
    maxY = Math.max(maxY, b.y + b.height);
  }
  if (minX === Infinity) return { x: 0, y: 0, width: 0, height: 0 };
  return { x: minX, y: minY, width: maxX - minX, height: maxY - minY };
}
