// Glyphs at chart size: each glyph scaled uniformly so its INK area (never its box) equals the
// requested area, cuts taken by ink, and pieces placed by their ink box. One book per layout call;
// it only caches work within that call.
import { differenceRegions, transformRegion, type Region } from '../geometry/region';
import { translation, type Matrix } from '../geometry/matrix';
import { cutInk, type CutDirection } from '../glyph';
import type { SceneGlyph } from '../scene';
import type { ResolvedGlyph } from './resolveGlyphs';

export interface ChartShape {
  /** Key in Scene.shapes; unique per glyph and ink area. */
  key: string;
  glyph: ResolvedGlyph;
  /** Millimetres per glyph unit: sqrt(inkMm2 / ink area in glyph units). */
  mmPerUnit: number;
  inkMm2: number;
  /** Ink box size at this scale. */
  widthMm: number;
  heightMm: number;
  /** The ink in page mm with the ink box's top-left corner at (0, 0). */
  region: Region;
}

export interface GlyphBook {
  /** The glyph scaled so its ink covers `inkMm2` square millimetres. */
  shape(glyph: ResolvedGlyph, inkMm2: number): ChartShape;
  /** A full piece with its ink box's top-left at (xMm, yMm). */
  full(shape: ChartShape, xMm: number, yMm: number): Pick<SceneGlyph, 'region' | 'ref'>;
  /**
   * A whole scene piece at (xMm, yMm), the same as `{ ...full(shape, xMm, yMm), ...fields }`, except that
   * its region (the shape translated) is computed on first read: a chart of 100,000 glyphs written with
   * references never needs 100,000 copies of the outline.
   */
  fullPiece(shape: ChartShape, xMm: number, yMm: number, fields: Omit<SceneGlyph, 'region' | 'ref'>): SceneGlyph;
  /**
   * Extremes of a piece's ink in page mm, the same numbers a scan of its region gives: for a piece placed by
   * reference they are the shape's extremes (scanned once per shape) plus the offset, exact because rounding
   * a sum is monotone, so the largest of (x + dx) is (largest x) + dx. Null for a piece with no ink.
   */
  pieceBounds(piece: SceneGlyph): Bounds | null;
  /**
   * The ink between the cuts holding `from` and `to` of the glyph's ink, counted in `direction`
   * (0..to is a plain ink-true cut; from..1 its complement), placed like `full`.
   */
  band(shape: ChartShape, from: number, to: number, direction: CutDirection, xMm: number, yMm: number): Region;
  /** Every shape handed out, for Scene.shapes. */
  shapes(): Record<string, Region>;
}

const FULL_TOLERANCE = 1e-12;

function placement(shape: ChartShape, xMm: number, yMm: number): Matrix {
  const s = shape.mmPerUnit;
  return [s, 0, 0, s, xMm - s * shape.glyph.bbox.x, yMm - s * shape.glyph.bbox.y];
}

/** Scale at which a glyph's ink covers `inkMm2`: s = sqrt(A / a). */
export function mmPerGlyphUnit(glyph: ResolvedGlyph, inkMm2: number): number {
  return Math.sqrt(inkMm2 / glyph.areaUnits2);
}

/** Smallest and largest x and y of a piece's ink, page mm. */
export interface Bounds {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

/** Extremes of every point of a region, or null when it has none. */
export function regionBounds(region: Region): Bounds | null {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const ring of region) {
    for (const pt of ring) {
      if (pt.x < minX) minX = pt.x;
      if (pt.y < minY) minY = pt.y;
      if (pt.x > maxX) maxX = pt.x;
      if (pt.y > maxY) maxY = pt.y;
    }
  }
  return minX === Infinity ? null : { minX, minY, maxX, maxY };
}

/**
 * A plain-data piece whose `region` is an own, enumerable accessor: spread, JSON and structured cloning see
 * the same translated outline `full` returns, built only when first read (and kept).
 */
function lazyFullPiece(shapeRegion: Region, ref: NonNullable<SceneGlyph['ref']>, fields: Omit<SceneGlyph, 'region' | 'ref'>): SceneGlyph {
  let region: Region | undefined;
  return {
    get region(): Region {
      region ??= transformRegion(shapeRegion, translation(ref.xMm, ref.yMm));
      return region;
    },
    set region(value: Region) {
      region = value;
    },
    ref,
    ...fields,
  };
}

export function createGlyphBook(): GlyphBook {
  const shapes = new Map<string, ChartShape>();
  const cuts = new Map<string, Region>();
  const names = new Map<string, number>();
  const bounds = new Map<string, Bounds | null>();
  const byKey = new Map<string, ChartShape>();

  const cut = (glyph: ResolvedGlyph, fraction: number, direction: CutDirection): Region => {
    if (fraction <= 0) return [];
    if (fraction >= 1) return glyph.region;
    const key = `${glyph.name}\n${direction}\n${fraction}`;
    let region = cuts.get(key);
    if (!region) {
      region = cutInk(glyph.region, fraction, direction).region;
      cuts.set(key, region);
    }
    return region;
  };

  return {
    shape(glyph, inkMm2) {
      const id = `${glyph.name}\n${inkMm2}`;
      const known = shapes.get(id);
      if (known) return known;
      const s = mmPerGlyphUnit(glyph, inkMm2);
      const base = glyph.name.replace(/[^A-Za-z0-9_-]+/g, '-');
      const n = (names.get(base) ?? 0) + 1;
      names.set(base, n);
      const shape: ChartShape = {
        key: `${base}-${n}`,
        glyph,
        mmPerUnit: s,
        inkMm2,
        widthMm: s * glyph.bbox.width,
        heightMm: s * glyph.bbox.height,
        region: transformRegion(glyph.region, [s, 0, 0, s, -s * glyph.bbox.x, -s * glyph.bbox.y]),
      };
      shapes.set(id, shape);
      byKey.set(shape.key, shape);
      return shape;
    },
    full(shape, xMm, yMm) {
      return { region: transformRegion(shape.region, translation(xMm, yMm)), ref: { shape: shape.key, xMm, yMm } };
    },
    fullPiece(shape, xMm, yMm, fields) {
      return lazyFullPiece(shape.region, { shape: shape.key, xMm, yMm }, fields);
    },
    pieceBounds(piece) {
      const shape = piece.ref ? byKey.get(piece.ref.shape) : undefined;
      if (!piece.ref || !shape) return regionBounds(piece.region);
      let b = bounds.get(shape.key);
      if (b === undefined) {
        b = regionBounds(shape.region);
        bounds.set(shape.key, b);
      }
      if (!b) return null;
      const { xMm, yMm } = piece.ref;
      return { minX: b.minX + xMm, minY: b.minY + yMm, maxX: b.maxX + xMm, maxY: b.maxY + yMm };
    },
    band(shape, from, to, direction, xMm, yMm) {
      const lo = Math.max(0, from);
      const hi = Math.min(1, to);
      if (!(hi > lo)) return [];
      let units: Region;
      if (lo <= FULL_TOLERANCE) units = cut(shape.glyph, hi, direction);
      else if (hi >= 1 - FULL_TOLERANCE) units = differenceRegions(shape.glyph.region, cut(shape.glyph, lo, direction));
      else units = differenceRegions(cut(shape.glyph, hi, direction), cut(shape.glyph, lo, direction));
      return transformRegion(units, placement(shape, xMm, yMm));
    },
    shapes() {
      const out: Record<string, Region> = {};
      for (const s of shapes.values()) out[s.key] = s.region;
      return out;
    },
  };
}

