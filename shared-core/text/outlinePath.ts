// Glyph outlines placed on the page: commands first (rounded to the chosen decimals), then SVG
// path text and the ink bounds taken from those same rounded commands, so they always agree.

import type { FontFace } from './loadFont';
import type { LineLayout } from './layoutLine';
import type { RectMm } from './textOptions';

/** Absolute path commands in page millimetres, y downward. */
export type OutlineCommand =
  | { type: 'M' | 'L'; x: number; y: number }
  | { type: 'Q'; x1: number; y1: number; x: number; y: number }
  | { type: 'C'; x1: number; y1: number; x2: number; y2: number; x: number; y: number }
  | { type: 'Z' };

/** Places a laid-out line with its pen start at (startXMm, baselineYMm). */
export function outlineCommands(
  face: FontFace,
  line: LineLayout,
  startXMm: number,
  baselineYMm: number,
  sizeMm: number,
  decimals: number,
): OutlineCommand[] {
  const mmPerUnit = sizeMm / face.unitsPerEm;
  const factor = 10 ** decimals;
  const round = (v: number) => {
    const r = Math.round(v * factor) / factor;
    return r === 0 ? 0 : r; // no "-0" in the output
  };
  const out: OutlineCommand[] = [];
  for (const { glyph, xUnits } of line.glyphs) {
    // Font units grow upward from the baseline; page millimetres grow downward.
    const px = (x: number) => round(startXMm + (xUnits + x) * mmPerUnit);
    const py = (y: number) => round(baselineYMm - y * mmPerUnit);
    for (const c of glyph.path.commands) {
      switch (c.type) {
        case 'M':
        case 'L':
          out.push({ type: c.type, x: px(c.x), y: py(c.y) });
          break;
        case 'Q':
          out.push({ type: 'Q', x1: px(c.x1), y1: py(c.y1), x: px(c.x), y: py(c.y) });
          break;
        case 'C':
          out.push({ type: 'C', x1: px(c.x1), y1: py(c.y1), x2: px(c.x2), y2: py(c.y2), x: px(c.x), y: py(c.y) });
          break;
        case 'Z':
          out.push({ type: 'Z' });
          break;
      }
    }
  }
  return out;
}

export function commandsToPathData(commands: readonly OutlineCommand[]): string {
  const parts: string[] = [];
  for (const c of commands) {
    switch (c.type) {
      case 'M':
      case 'L':
        parts.push(`${c.type}${c.x} ${c.y}`);
        break;
      case 'Q':
        parts.push(`Q${c.x1} ${c.y1} ${c.x} ${c.y}`);
        break;
      case 'C':
        parts.push(`C${c.x1} ${c.y1} ${c.x2} ${c.y2} ${c.x} ${c.y}`);
        break;
      case 'Z':
        parts.push('Z');
        break;
    }
  }
  return parts.join('');
}

/**
 * Tight bounds of the painted outline: end points plus the curve extrema (where the derivative of
 * the Bezier polynomial is zero), not the control points, which may lie outside the ink.
 */
export function commandsBounds(commands: readonly OutlineCommand[]): RectMm | undefined {
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  const add = (x: number, y: number) => {
    if (x < minX) minX = x;
    if (x > maxX) maxX = x;
    if (y < minY) minY = y;
    if (y > maxY) maxY = y;
  };
  let cx = 0;
  let cy = 0;
  let sx = 0;
  let sy = 0;
  for (const c of commands) {
    if (c.type === 'Z') {
      cx = sx;
      cy = sy;
      continue;
    }
    if (c.type === 'M') {
      sx = c.x;
      sy = c.y;
    } else if (c.type === 'Q') {
      for (const t of quadraticExtrema(cx, c.x1, c.x)) add(quadratic(cx, c.x1, c.x, t), quadratic(cy, c.y1, c.y, t));
      for (const t of quadraticExtrema(cy, c.y1, c.y)) add(quadratic(cx, c.x1, c.x, t), quadratic(cy, c.y1, c.y, t));
    } else if (c.type === 'C') {
      for (const t of [...cubicExtrema(cx, c.x1, c.x2, c.x), ...cubicExtrema(cy, c.y1, c.y2, c.y)]) {
        add(cubic(cx, c.x1, c.x2, c.x, t), cubic(cy, c.y1, c.y2, c.y, t));
      }
    }
    add(c.x, c.y);
    cx = c.x;
    cy = c.y;
  }
  if (minX > maxX) return undefined;
  return { x: minX, y: minY, width: maxX - minX, height: maxY - minY };
}

function quadratic(p0: number, p1: number, p2: number, t: number): number {
  const u = 1 - t;
  return u * u * p0 + 2 * u * t * p1 + t * t * p2;
}

function quadraticExtrema(p0: number, p1: number, p2: number): number[] {
  const denominator = p0 - 2 * p1 + p2;
  if (denominator === 0) return [];
  const t = (p0 - p1) / denominator;
  return t > 0 && t < 1 ? [t] : [];
}

function cubic(p0: number, p1: number, p2: number, p3: number, t: number): number {
  const u = 1 - t;
  return u * u * u * p0 + 3 * u * u * t * p1 + 3 * u * t * t * p2 + t * t * t * p3;
}

function cubicExtrema(p0: number, p1: number, p2: number, p3: number): number[] {
  // Derivative / 3 = a t^2 + b t + c.
  const a = -p0 + 3 * p1 - 3 * p2 + p3;
  const b = 2 * (p0 - 2 * p1 + p2);
  const c = p1 - p0;
  const roots: number[] = [];
  if (Math.abs(a) < 1e-12) {
    if (b !== 0) roots.push(-c / b);
  } else {
    const discriminant = b * b - 4 * a * c;
    if (discriminant >= 0) {
      const root = Math.sqrt(discriminant);
      roots.push((-b + root) / (2 * a), (-b - root) / (2 * a));
    }
  }
  return roots.filter((t) => t > 0 && t < 1);
}
