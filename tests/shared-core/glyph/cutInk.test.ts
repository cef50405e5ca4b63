// Ink-true cuts on real glyphs, checked by rasterising the kept geometry with an independent renderer.
import { describe, expect, it } from 'vitest';
import { cutByWidth, cutInk, getGlyph, measureGlyph, type CutDirection } from '../../../shared-core/glyph';
import { regionArea, regionToPathData } from '../../../shared-core/geometry/region';
import { resvgAlphaSum } from '../../helpers/independent';

const FRACTIONS = [0.1, 0.25, 0.5, 0.75, 0.9];
const GLYPHS = ['person', 'bike', 'tree', 'heart', 'house'];
const RENDER_PX = 2048;

/** Ink of path data in a 256-unit viewBox, from resvg's alpha sum. */
function rasterInk(pathData: string): number {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" viewBox="-8 -8 272 272"><path d="${pathData}"/></svg>`;
  return resvgAlphaSum(svg, RENDER_PX) * (272 / RENDER_PX) ** 2;
}

describe('cutInk keeps the asked share of ink (checked by resvg, an independent rasteriser)', () => {
  for (const name of GLYPHS) {
    it(`${name}: kept part holds f of the ink within 0.002 for f in ${FRACTIONS.join(', ')}`, () => {
      const ink = measureGlyph(getGlyph(name).svg);
      const whole = rasterInk(regionToPathData(ink.region, 4));
      const dirs: CutDirection[] = ['ltr', 'btt', 'rtl', 'ttb'];
      FRACTIONS.forEach((f, i) => {
        const cut = cutInk(ink.region, f, dirs[i % dirs.length]);
        // Exact polygon area of the kept geometry.
        expect(Math.abs(cut.keptAreaUnits2 / ink.areaUnits2 - f)).toBeLessThan(1e-6);
        const kept = rasterInk(regionToPathData(cut.region, 4));
        expect(Math.abs(kept / whole - f), `${name} f=${f} ${dirs[i % dirs.length]}`).toBeLessThan(0.002);
      });
    });
  }

  it('a cut at f of the width is not f of the ink for a person-shaped glyph (documents the difference)', () => {
    const ink = measureGlyph(getGlyph('person').svg);
    // Left to right: the arms are thin at the sides, the body carries most ink in the middle.
    // Measured on the bundled person (ink share kept by a cut at f of the width):
    // f 0.10 → 0.027, 0.25 → 0.126, 0.50 → 0.500, 0.75 → 0.874, 0.90 → 0.973.
    const differences = FRACTIONS.map((f) => cutByWidth(ink.region, f, 'ltr').fraction - f);
    const worst = Math.max(...differences.map(Math.abs));
    expect(worst).toBeGreaterThan(0.1);
    const quarter = cutByWidth(ink.region, 0.25, 'ltr').fraction;
    expect(quarter).toBeLessThan(0.15);
    // Cut by height (as a fill rises) it is off too: half the height holds about 64% of the ink.
    expect(cutByWidth(ink.region, 0.5, 'btt').fraction).toBeGreaterThan(0.6);
    // And the ink-true cut position differs from the naive one by a visible amount.
    const trueCut = cutInk(ink.region, 0.25, 'ltr').cutAt;
    const naiveCut = cutByWidth(ink.region, 0.25, 'ltr').cutAt;
    expect(Math.abs(trueCut - naiveCut)).toBeGreaterThan(5); // glyph units out of 256
  });

  it('f = 0 keeps nothing, f = 1 keeps everything, out-of-range f is refused', () => {
    const ink = measureGlyph(getGlyph('heart').svg);
    expect(regionArea(cutInk(ink.region, 0).region)).toBe(0);
    expect(regionArea(cutInk(ink.region, 1).region)).toBeCloseTo(ink.areaUnits2, 6);
    expect(() => cutInk(ink.region, 1.2)).toThrow(/between 0 and 1/);
    expect(() => cutInk(ink.region, Number.NaN)).toThrow(/between 0 and 1/);
    expect(() => cutInk([], 0.5)).toThrow(/no ink/);
  });

  it('complementary cuts partition the ink: ltr at f plus rtl at 1 − f is the whole', () => {
    const ink = measureGlyph(getGlyph('bike').svg);
    const a = cutInk(ink.region, 0.3, 'ltr').keptAreaUnits2;
    const b = cutInk(ink.region, 0.7, 'rtl').keptAreaUnits2;
    expect((a + b) / ink.areaUnits2).toBeCloseTo(1, 6);
  });
});
