import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { PNG } from 'pngjs';
import { alphaCoverage, rasterizeSvg, rasterSizePx, readPhysChunk, readSvgPageSize, renderSvgPixels } from '../../../main/raster';
import { caught } from '../../helpers/errors';
import { hasPngcheck, hasRsvg, pngcheckPhys, rsvgRender } from '../../helpers/independent';
import { SVG_NS as NS, svgPage as page } from '../../helpers/svgPage';

describe('rasterizeSvg pixel size', () => {
  it('renders a 100 x 50 mm page at 300 ppi as 1181 x 591 px', () => {
    // px = mm x ppi / 25.4 (CSS absolute units: 1 in = 25.4 mm): 1181.10 x 590.55, rounded to nearest.
    const result = rasterizeSvg(page('width="100mm" height="50mm"'), { ppi: 300 });
    expect([result.widthPx, result.heightPx]).toEqual([1181, 591]);
    // pngjs: an independent decoder reads the same size.
    const decoded = PNG.sync.read(result.png);
    expect([decoded.width, decoded.height]).toEqual([1181, 591]);
    expect(readPhysChunk(result.png)).toEqual({ ppmX: 11811, ppmY: 11811, unit: 1 });
    if (hasPngcheck) expect(pngcheckPhys(result.png)).toEqual({ ppmX: 11811, ppmY: 11811, unit: 1 });
  });

  it('agrees with rsvg-convert on the pixel height for the same width', { skip: !hasRsvg }, () => {
    const svg = page('width="100mm" height="50mm"');
    const ours = rasterizeSvg(svg, { ppi: 300 });
    expect(rsvgRender(svg, { widthPx: ours.widthPx }).heightPx).toBe(ours.heightPx);
  });

  // CSS Values and Units: 1in = 2.54cm = 25.4mm = 96px = 72pt = 6pc; unitless SVG lengths are px.
  it.each([
    ['1in', '0.5in'],
    ['2.54cm', '1.27cm'],
    ['25.4mm', '12.7mm'],
    ['72pt', '36pt'],
    ['6pc', '3pc'],
    ['96px', '48px'],
    ['96', '48'],
  ])('reads %s x %s as one inch by half an inch (300 x 150 px at 300 ppi)', (w, h) => {
    const result = rasterizeSvg(page(`width="${w}" height="${h}"`), { ppi: 300 });
    expect([result.widthPx, result.heightPx]).toEqual([300, 150]);
  });

  it('falls back to the viewBox (in px) when width and height are absent or percentages', () => {
    expect(readSvgPageSize(page('viewBox="0 0 96 48"')).widthMm).toBeCloseTo(25.4, 10);
    const half = readSvgPageSize(page('width="50%" height="50%" viewBox="0 0 192 96"'));
    expect([half.widthMm, half.heightMm].map((v) => Math.round(v * 1e9) / 1e9)).toEqual([25.4, 12.7]);
    const result = rasterizeSvg(page('viewBox="0 0 96 48"'), { ppi: 600 });
    expect([result.widthPx, result.heightPx]).toEqual([600, 300]);
  });

  it('keeps the width at round(mm x ppi / 25.4), the height at the same scale within a pixel, and pHYs at round(ppi / 0.0254)', () => {
    // Width: CSS absolute units. Height: one scale for both axes (widthPx / widthMm), so the page keeps its
    // aspect ratio; at small sizes that can differ from round(heightMm x ppi / 25.4). pHYs: PNG spec §11.3.5.3.
    fc.assert(
      fc.property(
        fc.double({ min: 5, max: 60, noNaN: true }),
        fc.double({ min: 5, max: 60, noNaN: true }),
        fc.integer({ min: 36, max: 300 }),
        (widthMm, heightMm, ppi) => {
          const result = rasterizeSvg(page(`width="${widthMm}mm" height="${heightMm}mm"`), { ppi });
          expect(result.widthPx).toBe(Math.round((widthMm * ppi) / 25.4));
          expect(Math.abs(result.heightPx - (heightMm * result.widthPx) / widthMm)).toBeLessThan(1);
          expect(readPhysChunk(result.png)?.ppmX).toBe(Math.round(ppi / 0.0254));
        },
      ),
      { numRuns: 25 },
    );
  });

  it('refuses a raster beyond the size limit and names a resolution that fits', () => {
    const svg = page('width="2000mm" height="1000mm"');
    const error = caught(() => rasterizeSvg(svg, { ppi: 300 }));
    expect(error.code).toBe('geometry-limit');
    expect(error.message).toMatch(/lower resolution/);
    const suggested = Number(/at most (\d+) ppi/.exec(error.message)?.[1]);
    const size = rasterSizePx(readSvgPageSize(svg), suggested);
    expect(Math.max(size.widthPx, size.heightPx)).toBeLessThanOrEqual(20_000);
    expect(rasterSizePx(readSvgPageSize(svg), suggested + 1).widthPx).toBeGreaterThan(20_000);
    // A pixel-count limit applies as well as the side limit.
    expect(caught(() => rasterizeSvg(page('width="210mm" height="297mm"'), { ppi: 300, maxPixels: 1_000_000 })).code).toBe('geometry-limit');
  });

  it('refuses a page smaller than a pixel, and resolutions that are not positive', () => {
    expect(caught(() => rasterizeSvg(page('width="0.01mm" height="0.01mm"'), { ppi: 72 })).code).toBe('raster-invalid');
    expect(caught(() => rasterizeSvg(page('width="10mm" height="10mm"'), { ppi: 0 })).code).toBe('raster-invalid');
  });

  it('refuses sizes it cannot read rather than guessing', () => {
    for (const attrs of ['width="10mm"', 'width="10mm" height="50%" viewBox="0 0 1 1"', 'width=" 10mm" height="10mm"', 'width="1em" height="1em"', '']) {
      expect(caught(() => readSvgPageSize(page(attrs))).code).toBe('raster-invalid');
    }
  });

  it('refuses documents that are not SVG or not well-formed XML', () => {
    expect(caught(() => rasterizeSvg('<svg width="10mm" height="10mm"/>')).code).toBe('svg-malformed');
    expect(caught(() => rasterizeSvg(`<svg ${NS} width="10mm" height="10mm"><rect</svg>`)).code).toBe('svg-malformed');
  });

  it('refuses images that name a file on disk, but renders embedded ones', () => {
    const xlink = 'xmlns:xlink="http://www.w3.org/1999/xlink"';
    for (const href of ['/etc/hostname', 'file:///etc/hostname', 'picture.png', 'https://example.org/a.png']) {
      const svg = `<svg ${NS} ${xlink} width="10mm" height="10mm"><image width="10" height="10" xlink:href="${href}"/></svg>`;
      expect(caught(() => rasterizeSvg(svg, { ppi: 72 })).message).toMatch(/outside file/);
    }
    // A hyperlink loads nothing, so it is allowed.
    expect(rasterizeSvg(`<svg ${NS} ${xlink} width="10mm" height="10mm"><a xlink:href="https://example.org/"><rect width="5" height="5"/></a></svg>`, { ppi: 72 }).widthPx).toBe(28);
    // A 1 x 1 opaque PNG made with pngjs, embedded as a data URL: it must render (full coverage).
    const dot = new PNG({ width: 1, height: 1 });
    dot.data.set([0, 0, 0, 255]);
    const dataUrl = `data:image/png;base64,${PNG.sync.write(dot).toString('base64')}`;
    const svg = `<svg ${NS} ${xlink} width="96" height="96"><image width="96" height="96" xlink:href="${dataUrl}"/></svg>`;
    const raster = renderSvgPixels(svg, { ppi: 96 });
    expect(alphaCoverage(raster.pixels, raster.widthPx, raster.heightPx)).toBeCloseTo(96 * 96, 6);
  });

  it('paints the background colour under the drawing when asked, and nothing otherwise', () => {
    const svg = page('width="20mm" height="10mm"');
    const plain = rasterizeSvg(svg, { ppi: 72, keepPixels: true });
    const white = rasterizeSvg(svg, { ppi: 72, keepPixels: true, background: '#ffffff' });
    expect(alphaCoverage(plain.pixels!, plain.widthPx, plain.heightPx)).toBe(0);
    expect(alphaCoverage(white.pixels!, white.widthPx, white.heightPx)).toBe(white.widthPx * white.heightPx);
    expect(Array.from(white.pixels!.subarray(0, 4))).toEqual([255, 255, 255, 255]);
  });
});
