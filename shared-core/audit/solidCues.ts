// Signs that a drawing depicts a solid object, which invites readers to judge its volume:
// faces drawn as slanted parallelograms (the top and side of a box), an elliptical cap on a body
// of the same width (the top of a barrel or cylinder), or touching faces in tones of one hue.
import { TallyError } from '../errors';
import { boxOf, type Box } from '../geometry/region';
import { flattenPathData, newBudget } from '../glyph/flattenPath';
import type { PaintedShape } from '../glyph/collectShapes';
import { colourKey, fillColourOf, toHsl, type Rgb } from './paintColour';
import type { SolidCue } from './types';

/** Shapes looked at per mark; a solid-looking picture needs only a few faces. */
const MAX_SHAPES = 64;
/** A face counts as slanted when its corner angle is more than 10° from square. Common practice, no source. */
const MIN_SKEW_COS = Math.sin((10 * Math.PI) / 180);

interface Face {
  box: Box;
  parallelogram: boolean;
  elliptic: boolean;
  polygonal: boolean;
  colour: Rgb | null;
}

type Pt = { x: number; y: number };

function simplify(points: Pt[], eps: number): Pt[] {
  const pts = points.filter((p, i) => i === 0 || Math.hypot(p.x - points[i - 1].x, p.y - points[i - 1].y) > eps);
  if (pts.length > 1 && Math.hypot(pts[0].x - pts[pts.length - 1].x, pts[0].y - pts[pts.length - 1].y) <= eps) pts.pop();
  // Drop vertices on a straight line between their neighbours.
  let changed = true;
  while (changed && pts.length > 3) {
    changed = false;
    for (let i = 0; i < pts.length; i++) {
      const a = pts[(i + pts.length - 1) % pts.length], b = pts[i], c = pts[(i + 1) % pts.length];
      const cross = (b.x - a.x) * (c.y - a.y) - (b.y - a.y) * (c.x - a.x);
      const len = Math.hypot(c.x - a.x, c.y - a.y);
      if (len === 0 || Math.abs(cross) / len <= eps) {
        pts.splice(i, 1);
        changed = true;
        break;
      }
    }
  }
  return pts;
}

/** Four corners whose diagonals bisect each other, with a corner clearly off square. */
export function isSlantedParallelogram(quad: readonly Pt[], eps: number): boolean {
  if (quad.length !== 4) return false;
  const [a, b, c, d] = quad;
  if (Math.hypot(a.x + c.x - b.x - d.x, a.y + c.y - b.y - d.y) > 4 * eps) return false;
  const u = { x: b.x - a.x, y: b.y - a.y }, v = { x: d.x - a.x, y: d.y - a.y };
  const lu = Math.hypot(u.x, u.y), lv = Math.hypot(v.x, v.y);
  if (lu <= eps || lv <= eps) return false;
  const cos = Math.abs((u.x * v.x + u.y * v.y) / (lu * lv));
  return cos > MIN_SKEW_COS && cos < 0.99;
}

function faceOf(s: PaintedShape, extent: number): Face | null {
  const eps = extent * 1e-4;
  let lines;
  try {
    lines = flattenPathData(s.d, s.ctm, extent * 1e-3, newBudget(20_000, 50_000));
  } catch (e) {
    if (e instanceof TallyError) return null;
    throw e;
  }
  const pts = lines.flatMap((l) => l.points);
  if (!pts.length) return null;
  const box = boxOf([pts]);
  const curved = s.tag === 'circle' || s.tag === 'ellipse' || (s.tag === 'path' && /[CcSsQqTtAa]/.test(s.d));
  const closed = lines.filter((l) => l.closed || s.tag === 'rect' || s.tag === 'polygon');
  const parallelogram = !curved && closed.length === 1 && isSlantedParallelogram(simplify(closed[0].points, eps), eps);
  const aspect = box.height > 0 ? box.width / box.height : 0;
  const elliptic = (s.tag === 'ellipse' || s.tag === 'circle') && aspect >= 1.6;
  return { box, parallelogram, elliptic, polygonal: !curved, colour: s.fill ? fillColourOf(s.chain) : null };
}

function touch(a: Box, b: Box, gap: number): boolean {
  return a.x <= b.x + b.width + gap && b.x <= a.x + a.width + gap && a.y <= b.y + b.height + gap && b.y <= a.y + a.height + gap;
}

function sameHueFamily(colours: Rgb[]): boolean {
  const hsl = colours.map(toHsl);
  const grey = hsl.every((c) => c.s < 0.08);
  if (grey) return true;
  if (hsl.some((c) => c.s < 0.08)) return false;
  const h0 = hsl[0].h;
  return hsl.every((c) => Math.min(Math.abs(c.h - h0), 360 - Math.abs(c.h - h0)) <= 20);
}

/** Cues of a solid drawing among one mark's shapes (in root units). */
export function solidCuesOf(shapes: readonly PaintedShape[]): SolidCue[] {
  if (shapes.length < 2 || shapes.length > MAX_SHAPES) return [];
  const rough = shapes.map((s) => faceOf(s, 1));
  const all = rough.filter((f): f is Face => f !== null);
  if (all.length < 2) return [];
  const extent = Math.max(...all.map((f) => Math.max(f.box.width, f.box.height)), 1e-9);
  const faces = shapes.map((s) => faceOf(s, extent)).filter((f): f is Face => f !== null);
  const gap = extent * 1e-3;
  const cues: SolidCue[] = [];
  const touchingOthers = (f: Face) => faces.some((g) => g !== f && touch(f.box, g.box, gap));
  if (faces.some((f) => f.parallelogram && touchingOthers(f))) cues.push('parallelogram-faces');
  const cap = faces.some((e) => {
    if (!e.elliptic) return false;
    const cy = e.box.y + e.box.height / 2;
    return faces.some((b) => {
      if (b === e || b.elliptic) return false;
      // A barrel's body bulges a little past its top; a cylinder's matches it.
      const sameWidth = b.box.width >= 0.95 * e.box.width && b.box.width <= 1.2 * e.box.width;
      const atEdge = Math.abs(b.box.y - cy) <= 0.25 * e.box.height || Math.abs(b.box.y + b.box.height - cy) <= 0.25 * e.box.height;
      return sameWidth && atEdge;
    });
  });
  if (cap) cues.push('elliptic-cap');
  const toned = faces.filter((f) => f.colour && touchingOthers(f));
  const tones = new Map<string, Rgb>();
  for (const f of toned) tones.set(colourKey(f.colour as Rgb), f.colour as Rgb);
  const colours = [...tones.values()];
  if (colours.length >= 2 && sameHueFamily(colours)) {
    const light = colours.map((c) => toHsl(c).l);
    const spreadL = Math.max(...light) - Math.min(...light);
    // Tones of one hue on touching faces read as light and shade; alone they need three faces.
    if (spreadL >= 0.08 && (cues.length > 0 || (colours.length >= 3 && toned.length >= 3))) cues.push('shaded-faces');
  }
  return cues;
}
