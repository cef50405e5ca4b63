// Raster mock-ups: images drawn here with pngjs (and jpeg-js) from shapes of known area, with
// anti-aliased edges computed by 8 × 8 supersampling, measured back by the raster mark finder.
import { PNG } from 'pngjs';
import jpeg from 'jpeg-js';
import { describe, expect, it } from 'vitest';
import { auditSupplied } from '../../../main/audit/auditFile';
import { decodeRaster } from '../../../main/audit/decodeRaster';
import { findRasterMarks } from '../../../main/audit/rasterMarks';

type Inside = (x: number, y: number) => boolean;
type Shape = { inside: Inside; rgb: [number, number, number] };

/** RGBA of shapes on white; each pixel's colour mixed by the share of 8 × 8 subsamples inside a shape. */
function draw(widthPx: number, heightPx: number, shapes: Shape[]): Uint8Array {
  const rgba = new Uint8Array(widthPx * heightPx * 4);
  const n = 8;
  for (let y = 0; y < heightPx; y++) {
    for (let x = 0; x < widthPx; x++) {
      let r = 0, g = 0, b = 0;
      for (let sy = 0; sy < n; sy++) for (let sx = 0; sx < n; sx++) {
        const px = x + (sx + 0.5) / n, py = y + (sy + 0.5) / n;
        const s = shapes.find((k) => k.inside(px, py));
        const c = s ? s.rgb : [255, 255, 255];
        r += c[0]; g += c[1]; b += c[2];
      }
      const i = (y * widthPx + x) * 4;
      rgba[i] = Math.round(r / (n * n));
      rgba[i + 1] = Math.round(g / (n * n));
      rgba[i + 2] = Math.round(b / (n * n));
      rgba[i + 3] = 255;
    }
  }
  return rgba;
}

function png(widthPx: number, heightPx: number, rgba: Uint8Array): Uint8Array {
  const p = new PNG({ width: widthPx, height: heightPx });
  p.data = Buffer.from(rgba);
  return PNG.sync.write(p);
}

const rect = (x0: number, y0: number, w: number, h: number): Inside => (x, y) => x >= x0 && x < x0 + w && y >= y0 && y < y0 + h;
const disc = (cx: number, cy: number, r: number): Inside => (x, y) => (x - cx) ** 2 + (y - cy) ** 2 < r * r;

describe('findRasterMarks', () => {
  it('two filled shapes of known area are measured within 0.5% (a 203.5 × 151.25 px rectangle, a disc of radius 61.3 px)', () => {
    const rectArea = 203.5 * 151.25;
    const discArea = Math.PI * 61.3 ** 2; // πr²
    const rgba = draw(480, 220, [
      { inside: rect(20.25, 30.5, 203.5, 151.25), rgb: [200, 40, 30] },
      { inside: disc(360, 110, 61.3), rgb: [20, 60, 160] },
    ]);
    const img = decodeRaster(png(480, 220, rgba));
    const { marks, background } = findRasterMarks(img);
    expect(background).toEqual({ r: 255, g: 255, b: 255 });
    expect(marks.length).toBe(2);
    expect(Math.abs(marks[0].inkAreaUnits2 - rectArea) / rectArea).toBeLessThan(0.005);
    expect(Math.abs(marks[1].inkAreaUnits2 - discArea) / discArea).toBeLessThan(0.005);
    // The box spans the partly covered edge pixels: 20.25..223.75 touches columns 20..223.
    expect(marks[0].box).toEqual({ x: 20, y: 30, width: 204, height: 152 });
  });

  it('seed points pick the marks and their order; a seed on the background is refused', () => {
    const rgba = draw(200, 100, [
      { inside: rect(10, 10, 40, 80), rgb: [0, 0, 0] },
      { inside: rect(120, 50, 40, 40), rgb: [0, 0, 0] },
    ]);
    const img = decodeRaster(png(200, 100, rgba));
    const picked = findRasterMarks(img, { seeds: [{ xPx: 140, yPx: 70 }, { xPx: 30, yPx: 50 }] });
    expect(picked.marks.map((m) => Math.round(m.inkAreaUnits2))).toEqual([1600, 3200]);
    expect(() => findRasterMarks(img, { seeds: [{ xPx: 90, yPx: 20 }] })).toThrow(/lands on the background/);
  });

  it('a picture made of pieces a few pixels apart is one mark; a thin baseline joining bars is set aside', () => {
    const rgba = draw(300, 140, [
      { inside: disc(40, 20, 10), rgb: [0, 0, 0] },
      { inside: rect(30, 33, 20, 60), rgb: [0, 0, 0] },
      { inside: rect(150, 60, 20, 33), rgb: [0, 0, 0] },
      { inside: rect(5, 93, 290, 2), rgb: [0, 0, 0] },
    ]);
    const img = decodeRaster(png(300, 140, rgba));
    // The head ends at y = 30 and the body starts at y = 33: 3 px of background between them.
    const found = findRasterMarks(img, { mergeGapPx: 4 });
    expect(found.marks.length).toBe(2);
    expect(found.marks[0].parts.length).toBe(2);
    expect(found.setAside.some((s) => s.kind === 'connector' && /horizontal/.test(s.description))).toBe(true);
    // Bars alone, without the 2 px baseline (rows 93-94) they stood on: 20 × 60 + πr² and 20 × 33.
    expect(Math.abs(found.marks[0].inkAreaUnits2 - (1200 + Math.PI * 100)) / 1514).toBeLessThan(0.005);
    expect(Math.abs(found.marks[1].inkAreaUnits2 - 660) / 660).toBeLessThan(0.005);
    expect(findRasterMarks(img, { mergeGapPx: 1 }).marks.length).toBe(3);
  });

  it('audits a raster of a ×3 uniformly scaled square: area lie factor (9-1)/(3-1) = 4, lengths from two points', () => {
    const rgba = draw(260, 160, [
      { inside: rect(10, 110, 30, 30), rgb: [30, 30, 30] },
      { inside: rect(80, 50, 90, 90), rgb: [30, 30, 30] },
    ]);
    const image = decodeRaster(png(260, 160, rgba));
    const report = auditSupplied({ kind: 'raster', image, path: 'mock.png', bytes: 0 }, { values: [1, 3] });
    expect(report.unit).toBe('pixel');
    expect(report.suggested).toBe('area');
    expect(report.readings.area.lieFactor.worst).toBeCloseTo(4, 2);
    // Two-point lengths, as a user would click them: 30 and 90 px → length lie factor 1.
    const given = auditSupplied({ kind: 'raster', image, path: 'mock.png', bytes: 0 }, { values: [1, 3], givenLengths: [30, 90] });
    expect(given.readings.length.dimension).toBe('given');
    expect(given.readings.length.lieFactor.worst).toBeCloseTo(1, 9);
  });

  it('reads a JPEG mock-up too (lossy: area within 2%, common practice for quality-90 JPEG, no source)', () => {
    const rgba = draw(200, 120, [{ inside: rect(20, 20, 100, 80), rgb: [20, 20, 20] }]);
    const encoded = jpeg.encode({ width: 200, height: 120, data: Buffer.from(rgba) }, 90).data;
    const img = decodeRaster(new Uint8Array(encoded));
    expect(img.format).toBe('jpeg');
    const { marks } = findRasterMarks(img, { tolerance: 48 });
    expect(marks.length).toBe(1);
    expect(Math.abs(marks[0].inkAreaUnits2 - 8000) / 8000).toBeLessThan(0.02);
  });
});
