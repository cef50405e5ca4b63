// Ink area of analytic shapes against closed-form areas, and of stroked shapes against an
// independent rasteriser (resvg, summing alpha), which follows the SVG stroke rules on its own.
import { describe, expect, it } from 'vitest';
import { measureGlyph } from '../../../shared-core/glyph';
import { resvgAlphaSum } from '../../helpers/independent';

const svg = (body: string, vb = '0 0 100 100') => `<svg xmlns="http://www.w3.org/2000/svg" viewBox="${vb}">${body}</svg>`;
const area = (body: string, vb?: string) => measureGlyph(svg(body, vb)).areaUnits2;
const rel = (a: number, b: number) => Math.abs(a - b) / b;

/** Area in viewBox units² from an independent render: alpha sum × (units per pixel)². */
function rasterArea(body: string, widthPx = 2048, vbWidth = 100) {
  return resvgAlphaSum(svg(body), widthPx) * (vbWidth / widthPx) ** 2;
}

describe('measureGlyph: filled shapes against closed-form areas', () => {
  it('circle area is πr² (Euclid XII.2 / Archimedes)', () => {
    expect(rel(area('<circle cx="50" cy="50" r="40"/>'), Math.PI * 40 ** 2)).toBeLessThan(1e-4);
  });
  it('ellipse area is πab (standard formula)', () => {
    expect(rel(area('<ellipse cx="50" cy="50" rx="45" ry="20"/>'), Math.PI * 45 * 20)).toBeLessThan(1e-4);
  });
  it('rounded rect area is wh − (4 − π) rx ry (a rectangle less four corner squares plus four quarter ellipses)', () => {
    expect(rel(area('<rect x="10" y="20" width="80" height="50" rx="10" ry="6"/>'), 80 * 50 - (4 - Math.PI) * 10 * 6)).toBeLessThan(1e-4);
    // SVG 1.1 §9.2: ry defaults to rx when only rx is given, and radii clamp to half the side.
    expect(rel(area('<rect x="0" y="0" width="40" height="20" rx="30"/>'), 40 * 20 - (4 - Math.PI) * 20 * 10)).toBeLessThan(1e-4);
  });
  it('polygon and polyline fill by the shoelace formula; polyline fills as if closed (SVG 1.1 §9.6)', () => {
    expect(area('<polygon points="0,0 60,0 0,40"/>')).toBeCloseTo(1200, 6);
    expect(area('<polyline points="0,0 60,0 0,40"/>')).toBeCloseTo(1200, 6);
  });
  it('a square with a hole: nonzero depends on the hole direction, evenodd does not (SVG 1.1 §11.3 fill-rule)', () => {
    const sameDir = 'M0 0H100V100H0Z M25 25H75V75H25Z';
    const oppositeDir = 'M0 0H100V100H0Z M25 25V75H75V25Z';
    expect(area(`<path d="${sameDir}" fill-rule="nonzero"/>`)).toBeCloseTo(10000, 6);
    expect(area(`<path d="${oppositeDir}" fill-rule="nonzero"/>`)).toBeCloseTo(7500, 6);
    expect(area(`<path d="${sameDir}" fill-rule="evenodd"/>`)).toBeCloseTo(7500, 6);
    expect(area(`<path d="${oppositeDir}" fill-rule="evenodd"/>`)).toBeCloseTo(7500, 6);
    // fill-rule is inherited (SVG 1.1 property index).
    expect(area(`<g fill-rule="evenodd"><path d="${sameDir}"/></g>`)).toBeCloseTo(7500, 6);
  });
  it('overlapping shapes count their shared ink once (ink is a union, not a sum)', () => {
    expect(area('<rect x="0" y="0" width="60" height="60"/><rect x="30" y="30" width="60" height="60"/>')).toBeCloseTo(2 * 3600 - 900, 6);
  });
  it('transforms scale area by |det| (linear algebra: area of the image of a unit square)', () => {
    const base = 10 * 20;
    expect(area('<rect width="10" height="20" transform="scale(2 3)"/>')).toBeCloseTo(base * 6, 6);
    expect(area('<rect width="10" height="20" transform="skewX(30)"/>')).toBeCloseTo(base, 6);
    expect(area('<rect width="10" height="20" transform="skewY(-50) rotate(33 5 5)"/>')).toBeCloseTo(base, 6);
    const [a, b, c, d] = [2, 0.5, 0.3, 1.5];
    expect(area(`<rect width="10" height="20" transform="matrix(${a} ${b} ${c} ${d} 7 -3)"/>`)).toBeCloseTo(base * (a * d - b * c), 6);
    expect(area('<g transform="translate(5 5) scale(0.5)"><g transform="scale(4 1)"><rect width="10" height="20"/></g></g>')).toBeCloseTo(base * 0.25 * 4, 6);
    // A circle under a shear stays an ellipse of the same area (det 1).
    expect(rel(area('<circle cx="50" cy="50" r="20" transform="skewX(40)"/>'), Math.PI * 400)).toBeLessThan(1e-4);
  });
  it('reports bbox of the ink, not of the viewBox, and box fraction π/4 for a circle', () => {
    const g = measureGlyph(svg('<circle cx="30" cy="40" r="10"/>'));
    expect(g.bbox.x).toBeCloseTo(20, 6);
    expect(g.bbox.width).toBeCloseTo(20, 6);
    expect(g.boxFraction).toBeCloseTo(Math.PI / 4, 3);
    expect(g.centroid.x).toBeCloseTo(30, 6);
    expect(g.centroid.y).toBeCloseTo(40, 6);
  });
  it('nothing painted when fill="none", opacity 0, fill-opacity 0, display="none" or visibility="hidden"', () => {
    for (const hidden of ['fill="none"', 'opacity="0"', 'fill-opacity="0"', 'display="none"', 'visibility="hidden"', 'style="fill:none"']) {
      expect(area(`<rect width="10" height="10" ${hidden}/><rect x="50" width="10" height="20"/>`)).toBeCloseTo(200, 6);
    }
    expect(area('<g display="none"><rect width="10" height="10"/></g>')).toBe(0);
    expect(area('<g visibility="hidden"><rect width="10" height="10" visibility="visible"/></g>')).toBeCloseTo(100, 6);
  });
  it('arcs, shorthand curves and relative commands are all read (SVG 1.1 §8.3)', () => {
    // A half disc drawn with a relative arc: πr²/2.
    expect(rel(area('<path d="m10 50 a40 40 0 0 1 80 0 z"/>'), Math.PI * 1600 / 2)).toBeLessThan(1e-4);
    // A quadratic whose area against its chord is 2/3 of the triangle (Archimedes' quadrature of the parabola).
    expect(rel(area('<path d="M0 50 Q50 0 100 50 Z"/>'), (2 / 3) * (100 * 50) / 2)).toBeLessThan(1e-4);
    // T reflects the previous control point (SVG 1.1 §8.3.7): a second lobe below the chord, each lobe
    // 2/3 of its control triangle (50 × 50 / 2); opposite windings are still both nonzero.
    expect(rel(area('<path d="M0 50 Q25 0 50 50 T100 50 Z"/>'), 2 * (2 / 3) * (50 * 50) / 2)).toBeLessThan(1e-4);
    // S reflects the previous cubic control point: a symmetric S-curve closed to its chord has two equal lobes.
    const s1 = area('<path d="M0 50 C0 0 50 0 50 50 S100 100 100 50 Z"/>');
    const c1 = area('<path d="M0 50 C0 0 50 0 50 50 Z"/>');
    expect(rel(s1, 2 * c1)).toBeLessThan(1e-6);
  });
});

describe('measureGlyph: strokes (SVG 1.1 §11.4 stroke properties)', () => {
  const L = 80, w = 10, h = w / 2;
  const line = (cap: string) => `<line x1="10" y1="50" x2="90" y2="50" stroke="#000" stroke-width="${w}" stroke-linecap="${cap}"/>`;
  it('butt, round and square caps add 0, a disc and a w×w square', () => {
    expect(area(line('butt'))).toBeCloseTo(L * w, 6);
    expect(rel(area(line('round')), L * w + Math.PI * h * h)).toBeLessThan(1e-4);
    expect(area(line('square'))).toBeCloseTo((L + w) * w, 6);
  });
  // A right-angle corner (0,0)→(L,0)→(L,L): the two segment rectangles overlap in an h×h square;
  // the outer corner square h×h is filled fully by a miter, half by a bevel, a quarter disc by a round join.
  const corner = (join: string, extra = '') => `<polyline points="10,10 90,10 90,90" fill="none" stroke="#000" stroke-width="${w}" stroke-linejoin="${join}" ${extra}/>`;
  const base = 2 * L * w - h * h;
  it('miter, bevel and round joins add h², h²/2 and πh²/4 at a right angle', () => {
    expect(area(corner('miter'))).toBeCloseTo(base + h * h, 6);
    expect(area(corner('bevel'))).toBeCloseTo(base + h * h / 2, 6);
    expect(rel(area(corner('round')), base + Math.PI * h * h / 4)).toBeLessThan(1e-5);
  });
  it('a miter beyond stroke-miterlimit falls back to a bevel (limit √2 at 90°)', () => {
    expect(area(corner('miter', 'stroke-miterlimit="1.4"'))).toBeCloseTo(base + h * h / 2, 6);
    expect(area(corner('miter', 'stroke-miterlimit="1.42"'))).toBeCloseTo(base + h * h, 6);
  });
  it('a stroke transforms with its shape: scale(3 2) on a horizontal line gives 3L × 2w', () => {
    expect(area(`<g transform="scale(3 2)"><line x1="0" y1="10" x2="${L}" y2="10" stroke="#000" stroke-width="${w}"/></g>`, '0 0 300 100')).toBeCloseTo(3 * L * 2 * w, 4);
  });
  it('fill and stroke of one shape union: a stroked square is (s + w)² with a miter corner', () => {
    expect(area(`<rect x="20" y="20" width="50" height="50" stroke="#000" stroke-width="${w}"/>`)).toBeCloseTo((50 + w) ** 2, 6);
    expect(area(`<rect x="20" y="20" width="50" height="50" fill="none" stroke="#000" stroke-width="${w}"/>`)).toBeCloseTo((50 + w) ** 2 - (50 - w) ** 2, 6);
  });
  it('sharp joins, curves and caps agree with resvg within 0.1%', () => {
    const cases = [
      '<polyline points="10,90 50,10 90,90" fill="none" stroke="#000" stroke-width="10" stroke-linejoin="miter"/>',
      '<polyline points="10,90 50,10 90,90" fill="none" stroke="#000" stroke-width="10" stroke-linejoin="round" stroke-linecap="round"/>',
      '<polyline points="10,90 50,10 90,90" fill="none" stroke="#000" stroke-width="10" stroke-linejoin="bevel" stroke-linecap="square"/>',
      '<polyline points="10,60 80,50 10,40" fill="none" stroke="#000" stroke-width="6" stroke-linejoin="miter" stroke-miterlimit="10"/>',
      '<path d="M10 80 C 30 10, 70 10, 90 80" fill="none" stroke="#000" stroke-width="8"/>',
      '<path d="M20 20 Q 50 90 80 20" fill="none" stroke="#000" stroke-width="12" stroke-linecap="round"/>',
      '<circle cx="50" cy="50" r="30" fill="none" stroke="#000" stroke-width="7"/>',
      '<path d="M20 50 A 30 15 30 1 1 80 50" fill="#000" stroke="#000" stroke-width="4" stroke-linejoin="round"/>',
    ];
    for (const c of cases) {
      const ours = area(c);
      const theirs = rasterArea(c);
      expect(rel(ours, theirs), c).toBeLessThan(1e-3);
    }
  });
});
