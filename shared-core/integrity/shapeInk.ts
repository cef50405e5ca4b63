// Ink of single painted shapes, measured once per distinct geometry. A shape's ink is fixed by its path
// data, its fill and stroke style and its transform; two shapes that agree in all of these except the
// translation part of the transform are exact translates of each other (every `use` of one glyph is), so
// one measurement serves both, moved to where each copy stands. Nothing is assumed: the key is the exact
// text of the path and the exact numbers of the linear part.
import { boxOf, regionArea, translateRegion, type Box, type Region } from '../geometry/region';
import type { Matrix } from '../geometry/matrix';
import { inkOfShapes, newBudget, type PaintedShape } from '../glyph/index';

type FlattenBudget = ReturnType<typeof newBudget>;

export interface ShapeInk {
  /** Ink area in user units squared (the same for every translate). */
  areaUnits2: number;
  /** Length of all the ink's rings in user units. */
  perimeterUnits: number;
  /** Bounding box of the ink where this copy stands; null when it paints nothing. */
  boxUnits: Box | null;
  /** The ink where this copy stands, built on first use (most copies are never needed as polygons). */
  region(): Region;
}

interface Measured {
  local: Region;
  areaUnits2: number;
  perimeterUnits: number;
  box: Box;
}

function ringLength(ring: Region[number]): number {
  let s = 0;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) s += Math.hypot(ring[i].x - ring[j].x, ring[i].y - ring[j].y);
  return s;
}

/** Everything but the path text; the path text is the outer key (one string, hashed once, shared by every copy). */
function styleKeyOf(shape: PaintedShape, tolerance: number): string {
  const m = shape.ctm;
  const fill = shape.fill ? shape.fill.rule : '-';
  const stroke = shape.stroke ? JSON.stringify(shape.stroke) : '-';
  return `${tolerance}|${m[0]},${m[1]},${m[2]},${m[3]}|${fill}|${stroke}`;
}

/**
 * A measurer of single shapes at one flattening tolerance, sharing `budget` with the rest of the
 * verification (so hostile input is bounded as before; a shape measured once costs once).
 */
export function createShapeInkCache(budget: FlattenBudget): (shape: PaintedShape, tolerance: number) => ShapeInk {
  const cache = new Map<string, Map<string, Measured>>();
  return (shape, tolerance) => {
    let byStyle = cache.get(shape.d);
    if (!byStyle) cache.set(shape.d, (byStyle = new Map()));
    const key = styleKeyOf(shape, tolerance);
    let measured = byStyle.get(key);
    if (!measured) {
      const m = shape.ctm;
      const linear: Matrix = [m[0], m[1], m[2], m[3], 0, 0];
      const local = inkOfShapes([{ ...shape, ctm: linear }], tolerance, budget);
      let perimeter = 0;
      for (const ring of local) perimeter += ringLength(ring);
      measured = { local, areaUnits2: regionArea(local), perimeterUnits: perimeter, box: boxOf(local) };
      byStyle.set(key, measured);
    }
    return new PlacedInk(measured, shape.ctm[4], shape.ctm[5]);
  };
}

/**
 * One copy of a measured shape where it stands. A class, not an object literal with a closure per copy: a
 * chart has one of these per glyph drawn (100,000 on a poster), and the polygons are built only on demand.
 */
class PlacedInk implements ShapeInk {
  readonly areaUnits2: number;
  readonly perimeterUnits: number;
  readonly boxUnits: Box | null;
  private moved: Region | null = null;

  constructor(
    private readonly measured: Measured,
    private readonly dx: number,
    private readonly dy: number,
  ) {
    const { local, box } = measured;
    this.areaUnits2 = measured.areaUnits2;
    this.perimeterUnits = measured.perimeterUnits;
    this.boxUnits = local.length && measured.areaUnits2 > 0 ? { x: box.x + dx, y: box.y + dy, width: box.width, height: box.height } : null;
  }

  region(): Region {
    return (this.moved ??= translateRegion(this.measured.local, this.dx, this.dy));
  }
}
