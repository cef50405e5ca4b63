// 2-D affine matrices in SVG order [a, b, c, d, e, f]: x' = a x + c y + e, y' = b x + d y + f.
import { TallyError } from '../errors';

export type Matrix = readonly [number, number, number, number, number, number];

export const IDENTITY: Matrix = [1, 0, 0, 1, 0, 0];

/** m1 · m2: apply m2 first, then m1 (as nested SVG transforms compose). */
export function multiply(m1: Matrix, m2: Matrix): Matrix {
  const [a1, b1, c1, d1, e1, f1] = m1;
  const [a2, b2, c2, d2, e2, f2] = m2;
  return [
    a1 * a2 + c1 * b2,
    b1 * a2 + d1 * b2,
    a1 * c2 + c1 * d2,
    b1 * c2 + d1 * d2,
    a1 * e2 + c1 * f2 + e1,
    b1 * e2 + d1 * f2 + f1,
  ];
}

export function determinant(m: Matrix): number {
  return m[0] * m[3] - m[1] * m[2];
}

export function applyToPoint(m: Matrix, x: number, y: number): { x: number; y: number } {
  return { x: m[0] * x + m[2] * y + m[4], y: m[1] * x + m[3] * y + m[5] };
}

export const translation = (tx: number, ty = 0): Matrix => [1, 0, 0, 1, tx, ty];
export const scaling = (sx: number, sy = sx): Matrix => [sx, 0, 0, sy, 0, 0];

const TRANSFORM_FN = /\s*(matrix|translate|scale|rotate|skewX|skewY)\s*\(([^)]*)\)\s*,?/y;

/** Parse an SVG `transform` attribute (SVG 1.1 §7.6). Throws on malformed lists or non-finite numbers. */
export function parseTransform(text: string | undefined): Matrix {
  if (!text || !text.trim()) return IDENTITY;
  let m: Matrix = IDENTITY;
  TRANSFORM_FN.lastIndex = 0;
  let pos = 0;
  const src = text.trim();
  while (pos < src.length) {
    TRANSFORM_FN.lastIndex = pos;
    const match = TRANSFORM_FN.exec(src);
    if (!match) throw new TallyError('svg-malformed', `The transform "${src.slice(0, 60)}" cannot be read.`);
    pos = TRANSFORM_FN.lastIndex;
    const args = match[2].trim() === '' ? [] : match[2].trim().split(/[\s,]+/).map(Number);
    if (args.some((n) => !Number.isFinite(n))) {
      throw new TallyError('number-invalid', `The transform "${match[0].trim()}" has a number that is not finite.`);
    }
    m = multiply(m, transformMatrix(match[1], args, match[0]));
  }
  return m;
}

function transformMatrix(fn: string, a: number[], raw: string): Matrix {
  const need = (ok: boolean) => {
    if (!ok) throw new TallyError('svg-malformed', `The transform "${raw.trim()}" has the wrong number of values.`);
  };
  switch (fn) {
    case 'matrix':
      need(a.length === 6);
      return [a[0], a[1], a[2], a[3], a[4], a[5]];
    case 'translate':
      need(a.length === 1 || a.length === 2);
      return translation(a[0], a[1] ?? 0);
    case 'scale':
      need(a.length === 1 || a.length === 2);
      return scaling(a[0], a[1] ?? a[0]);
    case 'rotate': {
      need(a.length === 1 || a.length === 3);
      const r = (a[0] * Math.PI) / 180;
      const rot: Matrix = [Math.cos(r), Math.sin(r), -Math.sin(r), Math.cos(r), 0, 0];
      if (a.length === 3) return multiply(multiply(translation(a[1], a[2]), rot), translation(-a[1], -a[2]));
      return rot;
    }
    case 'skewX':
      need(a.length === 1);
      return [1, 0, Math.tan((a[0] * Math.PI) / 180), 1, 0, 0];
    default:
      need(a.length === 1);
      return [1, Math.tan((a[0] * Math.PI) / 180), 0, 1, 0, 0];
  }
}
