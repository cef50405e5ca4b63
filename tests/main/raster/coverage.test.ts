import { describe, expect, it } from 'vitest';
import { alphaCoverage, coverageMm2, isolateEachMark, isolateMark, markCoverages, markCoveragesByRegion, renderSvgPixels } from '../../../main/raster';
import { caught } from '../../helpers/errors';
import { hasRsvg, resvgAlphaSum, rsvgAlphaSum, rsvgMarkCoverages } from '../../helpers/independent';
import { mmPage, SVG_NS as NS } from '../../helpers/svgPage';

const RECT_20x10 = mmPage('<rect x="40" y="20" width="20" height="10"/>');

// Two marks that overlap, so measuring each one alone is the only way to get both areas right.
const CIRCLE_R5 = '<g id="m-circle" data-label="a" data-value="1"><circle cx="30" cy="25" r="5"/></g>';
const RECT_10x20 = '<g id="m-rect" data-label="b" data-value="2"><rect x="32" y="15" width="10" height="20"/></g>';
const TWO_MARKS = mmPage(CIRCLE_R5 + RECT_10x20);
const CIRCLE_MM2 = Math.PI * 5 * 5; // pi r^2 = 78.54 mm^2
const RECT_MM2 = 10 * 20;

const relativeError = (measured: number, expected: number) => Math.abs(measured / expected - 1);

describe('alphaCoverage', () => {
  it('sums alpha / 255 over the image and over a region', () => {
    // 4 x 2 image: alpha 255 and 51 (0.2) in row 0, nothing in row 1 except one 255.
    const pixels = new Uint8Array(4 * 2 * 4);
    pixels[3] = 255;
    pixels[7] = 51;
    pixels[(1 * 4 + 3) * 4 + 3] = 255;
    expect(alphaCoverage(pixels, 4, 2)).toBeCloseTo(2.2, 12);
    expect(alphaCoverage(pixels, 4, 2, { x: 0, y: 0, width: 2, height: 1 })).toBeCloseTo(1.2, 12);
    expect(alphaCoverage(pixels, 4, 2, { x: 3, y: 1, width: 5, height: 5 })).toBe(1);
    expect(alphaCoverage(pixels, 4, 2, { x: 1.5, y: 0, width: 0.2, height: 1 })).toBeCloseTo(0.2, 12);
  });

  it('refuses a buffer that does not match the size', () => {
    expect(caught(() => alphaCoverage(new Uint8Array(15), 2, 2)).code).toBe('raster-invalid');
  });

  it('measures one of two shapes through a region', () => {
    const svg = mmPage('<rect x="5" y="5" width="20" height="10"/><rect x="60" y="5" width="30" height="30"/>');
    const raster = renderSvgPixels(svg, { ppi: 150 });
    const left = alphaCoverage(raster.pixels, raster.widthPx, raster.heightPx, { x: 0, y: 0, width: raster.widthPx / 2, height: raster.heightPx });
    // Area of a rectangle = width x height (20 x 10 mm); tolerance covers edge anti-aliasing at 150 ppi.
    expect(relativeError(left * raster.mmPerPx ** 2, 200)).toBeLessThan(0.005);
  });
});

describe('coverageMm2', () => {
  it('measures a filled 20 x 10 mm rect as 200 mm² within 0.2%', () => {
    // Area of a rectangle = width x height.
    expect(relativeError(coverageMm2(RECT_20x10, { ppi: 300 }), 200)).toBeLessThan(0.002);
  });

  it('gives the same area when the page is written in other absolute units', () => {
    // CSS absolute units: 100 mm = 10 cm; the rect in page px is 20 mm x 96 / 25.4.
    const k = 96 / 25.4;
    const svg = `<svg ${NS} width="10cm" height="5cm"><rect x="${40 * k}" y="${20 * k}" width="${20 * k}" height="${10 * k}"/></svg>`;
    expect(relativeError(coverageMm2(svg, { ppi: 300 }), 200)).toBeLessThan(0.002);
  });

  it('agrees with rsvg-convert (an independent renderer) on the 20 x 10 mm rect within 0.2%', { skip: !hasRsvg }, () => {
    const widthPx = 1181;
    const mm2 = rsvgAlphaSum(RECT_20x10, widthPx) * (100 / widthPx) ** 2;
    expect(relativeError(mm2, 200)).toBeLessThan(0.002);
  });

  it('agrees with a direct resvg call', () => {
    const widthPx = 1181;
    expect(relativeError(resvgAlphaSum(RECT_20x10, widthPx) * (100 / widthPx) ** 2, coverageMm2(RECT_20x10, { ppi: 300 }))).toBeLessThan(1e-9);
  });
});

describe('markCoverages', () => {
  it('measures each of two overlapping marks alone within 0.5% (pi r² = 78.54 mm², 10 x 20 = 200 mm²)', () => {
    const [circle, rect] = markCoverages(TWO_MARKS, ['m-circle', 'm-rect'], { ppi: 300 });
    expect(circle.id).toBe('m-circle');
    expect(rect.id).toBe('m-rect');
    expect(relativeError(circle.mm2, CIRCLE_MM2)).toBeLessThan(0.005);
    expect(relativeError(rect.mm2, RECT_MM2)).toBeLessThan(0.005);
    // px and mm2 describe the same ink: mm2 = px x (page width / pixel width)^2.
    expect(relativeError(rect.px * (100 / 1181) ** 2, rect.mm2)).toBeLessThan(1e-12);
    // The marks overlap, so the whole page holds less ink than the two marks measured apart.
    expect(coverageMm2(TWO_MARKS, { ppi: 300 })).toBeLessThan(circle.mm2 + rect.mm2 - 5);
  });

  it('agrees with rsvg-convert measuring the same isolated marks within 0.5%', { skip: !hasRsvg }, () => {
    const [circle, rect] = rsvgMarkCoverages(TWO_MARKS, ['m-circle', 'm-rect'], 1181);
    expect(relativeError(circle.mm2, CIRCLE_MM2)).toBeLessThan(0.005);
    expect(relativeError(rect.mm2, RECT_MM2)).toBeLessThan(0.005);
  });

  it('still hides marks that set their own display or style', () => {
    const stubborn = mmPage(
      '<g id="a" display="inline" style="display:inline"><rect width="10" height="10"/></g>' +
        '<g id="b" visibility="visible"><rect x="50" width="20" height="10"/></g>',
    );
    const [a, b] = markCoverages(stubborn, ['a', 'b'], { ppi: 96 });
    // Squares of 10 x 10 and 20 x 10 mm; at 96 ppi edges cost at most a pixel row (0.26 mm).
    expect(relativeError(a.mm2, 100)).toBeLessThan(0.03);
    expect(relativeError(b.mm2, 200)).toBeLessThan(0.03);
  });
});

describe('isolateMark', () => {
  it('wraps only the other marks and leaves ids in comments and attribute values alone', () => {
    const svg = mmPage(`<!-- <g id="m-rect"> --><desc data-note='id="m-rect"'>x</desc>${CIRCLE_R5}${RECT_10x20}`);
    const isolated = isolateMark(svg, 'm-circle', ['m-circle', 'm-rect']);
    expect(isolated).toBe(svg.replace(RECT_10x20, `<g display="none">${RECT_10x20}</g>`));
  });

  it('handles self-closing marks and prefixed SVG elements', () => {
    const svg = `<s:svg xmlns:s="http://www.w3.org/2000/svg" width="10mm" height="10mm"><s:rect id="r" width="5" height="5"/><s:g id="k"/></s:svg>`;
    expect(isolateMark(svg, 'k', ['r', 'k'])).toBe(svg.replace('<s:rect id="r" width="5" height="5"/>', '<s:g display="none"><s:rect id="r" width="5" height="5"/></s:g>'));
    expect(renderSvgPixels(isolateMark(svg, 'k', ['r', 'k']), { ppi: 96 }).pixels.every((v) => v === 0)).toBe(true);
  });

  it('gives every listed mark its own variant', () => {
    const variants = [...isolateEachMark(TWO_MARKS, ['m-circle', 'm-rect'])];
    expect(variants.map((v) => v.id)).toEqual(['m-circle', 'm-rect']);
    expect(variants[1].svg).toBe(TWO_MARKS.replace(CIRCLE_R5, `<g display="none">${CIRCLE_R5}</g>`));
  });

  it('refuses missing, duplicated and nested mark ids', () => {
    expect(caught(() => isolateMark(TWO_MARKS, 'm-circle', ['m-circle', 'nope'])).message).toMatch(/no element with the id "nope"/);
    expect(caught(() => isolateMark(mmPage(CIRCLE_R5 + CIRCLE_R5), 'm-circle', ['m-circle'])).message).toMatch(/More than one/);
    const nested = mmPage('<g id="outer"><g id="inner"><rect width="1" height="1"/></g></g>');
    expect(caught(() => isolateMark(nested, 'outer', ['outer', 'inner'])).message).toMatch(/inside mark "outer"/);
    expect(caught(() => isolateMark(mmPage('<g id="x">'), 'x', ['x'])).code).toBe('svg-malformed');
  });
});

describe('markCoveragesByRegion', () => {
  it('gives each mark exactly the alpha sum of rendering it alone, with fewer renders (resvg per mark as reference)', async () => {
    const { renderChart } = await import('../../../shared-core/pipeline/index');
    const { chartDoc } = await import('../../helpers/chartDoc');
    const { marksOnlySvg } = await import('../../../main/export/index');
    const doc = chartDoc({
      data: [
        { label: 'Alder Street', value: 30 },
        { label: 'Birch Road', value: 55 },
        { label: 'Cedar Lane', value: 12.5 },
      ],
      layout: { bleedMm: 3 },
    });
    const { svg, report } = renderChart(doc);
    const marksOnly = marksOnlySvg(svg);
    const ids = report.marks.map((m) => m.id);
    // Reference: resvg renders each mark alone on the whole page (every other mark hidden).
    const alone = markCoverages(marksOnly, ids, { ppi: 150 });
    const shared = markCoveragesByRegion(marksOnly, report.marks.map((m) => ({ id: m.id, boxMm: m.boxMm })), { ppi: 150, bleedMm: report.page.bleedMm });
    expect(shared.map((c) => c.id)).toEqual(ids);
    shared.forEach((c, i) => {
      expect(c.px).toBeGreaterThan(100);
      // The same pixels, so the same integer alpha sum: equal to the last bit.
      expect(c.px).toBe(alone[i].px);
    });
  });

  it('renders overlapping marks in separate layers, so each keeps its own ink (pi r^2 and w x h)', () => {
    const shared = markCoveragesByRegion(
      TWO_MARKS,
      [
        { id: 'm-circle', boxMm: { x: 25, y: 20, width: 10, height: 10 } },
        { id: 'm-rect', boxMm: { x: 32, y: 15, width: 10, height: 20 } },
      ],
      { ppi: 300, bleedMm: 0 },
    );
    const alone = markCoverages(TWO_MARKS, ['m-circle', 'm-rect'], { ppi: 300 });
    expect(shared[0].px).toBe(alone[0].px);
    expect(shared[1].px).toBe(alone[1].px);
    expect(relativeError(shared[0].mm2, CIRCLE_MM2)).toBeLessThan(0.005);
    expect(relativeError(shared[1].mm2, RECT_MM2)).toBeLessThan(0.005);
  });
});
