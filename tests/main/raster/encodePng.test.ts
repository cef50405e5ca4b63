// The PNG writer replaced resvg's own encoder (for speed): the pixels must be exactly the ones resvg's
// encoder writes, anti-aliased edges with partial alpha included, and the file must be a valid PNG.
import { Resvg } from '@resvg/resvg-js';
import { PNG } from 'pngjs';
import { describe, expect, it } from 'vitest';
import { DEMO_CHARTS } from '../../../shared-core/demo/demoCharts';
import { renderChart } from '../../../shared-core/pipeline/index';
import { encodePng, rasterizeSvg } from '../../../main/raster/index';
import { hasPngcheck, pngcheckPhys, pngcheckRun } from '../../helpers/independent';

describe('encodePng', () => {
  it.each(DEMO_CHARTS.slice(0, 3).map((c) => [c.name, c] as const))('%s: the same RGBA as resvg asPng, decoded by pngjs', (_name, chart) => {
    const svg = renderChart(chart.document).svg;
    const image = new Resvg(svg, { fitTo: { mode: 'width', value: 900 } }).render();
    const premultiplied = image.pixels;
    // The reference: resvg's own PNG encoder (it un-premultiplies the same pixels), decoded by pngjs.
    const theirs = PNG.sync.read(image.asPng());
    const ours = PNG.sync.read(encodePng(premultiplied, image.width, image.height));
    expect([ours.width, ours.height]).toEqual([theirs.width, theirs.height]);
    let partial = 0;
    for (let i = 3; i < premultiplied.length; i += 4) if (premultiplied[i] > 0 && premultiplied[i] < 255) partial += 1;
    expect(partial).toBeGreaterThan(1000); // the comparison covers anti-aliased edges, not only opaque pixels
    expect(Buffer.from(ours.data).equals(Buffer.from(theirs.data))).toBe(true);
  });

  it('refuses a buffer that does not match the size', () => {
    expect(() => encodePng(new Uint8Array(12), 2, 2)).toThrow(/does not match a 2 x 2 RGBA image/);
  });

  it.skipIf(!hasPngcheck)('writes a PNG that pngcheck accepts, with the resolution in pHYs', () => {
    const { png } = rasterizeSvg(renderChart(DEMO_CHARTS[0].document).svg, { ppi: 150 });
    expect(pngcheckRun(png).ok).toBe(true);
    // 150 ppi = 150 / 0.0254 = 5905.5 px per metre, rounded (PNG spec, pHYs unit 1 = metre).
    expect(pngcheckPhys(png)).toEqual({ ppmX: 5906, ppmY: 5906, unit: 1 });
  });
});

describe('encodePng in bands', () => {
  it('a raster of many bands decodes to the same RGBA as resvg asPng (zlib inflate checks the Adler-32 too)', () => {
    const svg = renderChart(DEMO_CHARTS[0].document).svg;
    // 3000 px wide: 12,001 bytes a filtered row, so about 350 rows a band and six bands in all.
    const image = new Resvg(svg, { fitTo: { mode: 'width', value: 3000 } }).render();
    const theirs = PNG.sync.read(image.asPng());
    const ours = PNG.sync.read(encodePng(image.pixels, image.width, image.height));
    expect(image.height * (image.width * 4 + 1)).toBeGreaterThan(5 * 4 * 1024 * 1024);
    expect(Buffer.from(ours.data).equals(Buffer.from(theirs.data))).toBe(true);
  });
});
