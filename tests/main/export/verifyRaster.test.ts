import { Resvg } from '@resvg/resvg-js';
import { describe, expect, it } from 'vitest';
import { estimateEdgeError, hideElements, marksOnlyPartSvg, marksOnlySvg, thresholdEdgeError, verifyRaster } from '../../../main/export/index';
import { measureGlyph } from '../../../shared-core/glyph/index';
import { getGlyph } from '../../../shared-core/glyph/catalog';
import { verifySvg } from '../../../shared-core/integrity/index';
import { resvgAlphaSum } from '../../helpers/independent';
import { chartSvg, fillChart, polygon, polygonArea, rect, repeatChart, scaleChart, stackChart } from '../../shared-core/integrity/chartSvgFixtures';

const STATIONS = [
  { label: 'Station A', value: 120 },
  { label: 'Station B', value: 275 },
  { label: 'Station C', value: 60 },
];

/** Tufte's lie factor from its definition (1983, p. 57), against the smallest value. */
function worstTufte(data: number[], graphic: number[]): number {
  const ref = data.indexOf(Math.min(...data));
  let worst = 1;
  data.forEach((d, i) => {
    if (i === ref) return;
    const lf = (graphic[i] - graphic[ref]) / graphic[ref] / ((d - data[ref]) / data[ref]);
    if (Math.abs(Math.log(lf)) > Math.abs(Math.log(worst))) worst = lf;
  });
  return worst;
}

const TEXT = '<g class="tg-text" data-role="title" data-size-pt="12"><path d="M20 5h120v6h-120z" fill="#111111"/></g>';
const RULE = '<g class="tg-rule" data-role="baseline"><line x1="10" y1="131" x2="190" y2="131" stroke="#333333" stroke-width="0.5"/></g>';
const BACKGROUND = '<rect class="tg-background" x="0" y="0" width="200" height="150" fill="#fff8e0"/>';

describe('marksOnlySvg', () => {
  it('hides text, rules, legend and background so only the marks\' ink remains (resvg alpha sum)', () => {
    const base = chartSvg({
      reading: 'area',
      mode: 'scale',
      unit: 1,
      marks: [
        { id: 'mark-1', label: 'a', value: 1, pieces: [{ ring: rect(20, 40, 20, 10), part: 'full' }] },
        { id: 'mark-2', label: 'b', value: 2, pieces: [{ ring: polygon(100, 60, 10), part: 'full' }] },
      ],
      legend: { ring: rect(150, 100, 8, 8), glyph: 'square', unitValue: 1 },
      under: BACKGROUND,
      extra: TEXT + RULE + '<circle cx="180" cy="20" r="5"/>',
    });
    // 200 mm at 2000 px: 10 px per mm, so 1 mm² is 100 px of alpha.
    const mm2 = resvgAlphaSum(marksOnlySvg(base), 2000) / 100;
    // Closed forms: a 20 x 10 rectangle and a regular 256-gon of radius 10.
    expect(mm2 / (200 + polygonArea(10))).toBeCloseTo(1, 3);
    // Without the filter the background alone covers the page.
    expect(resvgAlphaSum(base, 2000) / 100).toBeCloseTo(200 * 150, -1);
  });

  it('keeps only the filled pieces of fill glyphs when asked', () => {
    const svg = fillChart([{ label: 'a', value: 25 }, { label: 'b', value: 100 }], 'ink');
    const all = resvgAlphaSum(marksOnlySvg(svg), 2000);
    const filled = resvgAlphaSum(marksOnlyPartSvg(svg, 'filled'), 2000);
    // Shares 0.25 and 1 of two equal triangles: (0.25 + 1) / 2 of the ink is filled. Where the filled and
    // rest pieces meet, their anti-aliased edges overlap and alpha compounds (1 − (1 − a)(1 − b) < a + b),
    // so the whole glyph shows a little less ink than its two parts: agreement to 0.5%, not better.
    expect(filled / all).toBeCloseTo(1.25 / 2, 2);
  });

  it('never hides inside definitions, and leaves an attribute-free wrapper that parses', () => {
    const svg = '<svg xmlns="http://www.w3.org/2000/svg"><defs><path id="p" d="M0 0h1v1z"/></defs><path d="M0 0h2v2z"/></svg>';
    expect(hideElements(svg, ({ name }) => name === 'path')).toBe('<svg xmlns="http://www.w3.org/2000/svg"><defs><path id="p" d="M0 0h1v1z"/></defs><g display="none"><path d="M0 0h2v2z"/></g></svg>');
  });
});

describe('verifyRaster: the lie factor recomputed from pixel coverage', () => {
  const cases: [string, string][] = [
    ['count', repeatChart(STATIONS, { unit: 25 })],
    ['length', stackChart(STATIONS, { unit: 25 })],
    ['area', scaleChart([{ label: 'a', value: 10 }, { label: 'b', value: 25 }, { label: 'c', value: 40 }], 'area')],
    ['fill', fillChart([{ label: 'a', value: 30 }, { label: 'b', value: 55 }, { label: 'c', value: 100 }], 'ink')],
  ];
  it.each(cases)('keeps an honest %s chart within 0.01 of 1 at 300 ppi', (_reading, svg) => {
    const report = verifySvg(svg);
    const raster = verifyRaster(svg, report, { ppi: 300 });
    expect(raster.pass).toBe(true);
    expect(Math.abs((raster.lieFactor.worst ?? 1) - 1)).toBeLessThan(0.01);
    for (const m of raster.marks) expect(m.inkRatio).toBeCloseTo(1, 2);
  });

  it('sees ink the page cuts off: a stack taller than the page loses the part beyond its edge', () => {
    const svg = stackChart(STATIONS, { unit: 10 });
    const report = verifySvg(svg);
    expect(report.preflight.map((f) => f.code)).toContain('content-outside-page');
    const raster = verifyRaster(svg, report, { ppi: 150 });
    expect(raster.pass).toBe(false);
    // Station B: 27.5 glyphs at a 7.5 mm pitch reach 206 mm up from a baseline at y = 130 mm, so about the
    // top 76 mm of the stack lies above the page (y < 0) and its ink is lost.
    expect(raster.marks[1].inkRatio).toBeLessThan(0.7);
    expect(raster.suggestions[0]).toMatch(/Part of "Station B" lies outside the page/);
  });

  it('reproduces the dishonest chart\'s lie factor from pixels', () => {
    const svg = scaleChart([{ label: 'a', value: 10 }, { label: 'b', value: 40 }], 'height');
    const raster = verifyRaster(svg, verifySvg(svg), { ppi: 300 });
    // Height ∝ value: areas 1 : 16 for values 1 : 4, so (16 − 1) / (4 − 1) = 5.
    expect(raster.lieFactor.worst).toBeCloseTo(5, 2);
    expect(raster.pass).toBe(false);
    expect(raster.reason).toMatch(/^In the 300 ppi raster: b is drawn with 1[56]\.\d\dx the ink area of a but its value is only 4\.00x/);
  });

  it('agrees with its own arithmetic: raster graphic / vector graphic is the ink ratio for count', () => {
    const svg = repeatChart(STATIONS, { unit: 25 });
    const report = verifySvg(svg);
    const raster = verifyRaster(svg, report, { ppi: 150 });
    raster.marks.forEach((m, i) => expect(m.graphic / report.marks[i].graphic).toBeCloseTo(m.inkRatio as number, 12));
    expect(worstTufte(raster.marks.map((m) => m.value), raster.marks.map((m) => m.rasterInkMm2))).toBeCloseTo(raster.lieFactor.worst as number, 9);
  });
});

describe('verifyRaster: glyphs too small in pixels', () => {
  // 3 mm squares: at 300 ppi 35 px a side, at 25 ppi under 3 px.
  const tiny = chartSvg({
    reading: 'area',
    mode: 'scale',
    unit: 1,
    summary: { unit: 1 / 9 },
    marks: [
      { id: 'mark-1', label: 'small', value: 1, pieces: [{ ring: rect(20, 20, 3, 3), part: 'full' }] },
      { id: 'mark-2', label: 'large', value: 4, pieces: [{ ring: rect(40, 20, 6, 6), part: 'full' }] },
    ],
  });

  it('passes at 300 ppi and refuses at 25 ppi with the pixel counts and a resolution that would do', () => {
    const report = verifySvg(tiny);
    expect(report.pass).toBe(true);
    expect(verifyRaster(tiny, report, { ppi: 300 }).pass).toBe(true);
    const low = verifyRaster(tiny, report, { ppi: 25 });
    expect(low.pass).toBe(false);
    // 3 mm at 25 ppi: (3 · 25 / 25.4)² = 8.7 px of ink, outline 11.8 px.
    expect(low.smallestGlyph?.areaPx).toBeCloseTo(((3 * 25) / 25.4) ** 2, 6);
    expect(low.problems.join(' ')).toMatch(/smallest glyph \("small"\) is only 8\.72 pixels of ink/);
    expect(low.suggestedPpi).not.toBeNull();
    // At the suggested resolution the same chart is accepted without a small-glyph problem.
    const again = verifyRaster(tiny, report, { ppi: low.suggestedPpi as number });
    expect(again.problems.filter((p) => /pixels of ink/.test(p))).toEqual([]);
  });

  // The models checked against an independent renderer: resvg draws bundled glyphs at random sub-pixel
  // offsets, anti-aliased (the PNG as written) and with shape-rendering="crispEdges" (no anti-aliasing: every
  // pixel in or out, as a thresholding device would). The observed area errors must stay within the estimates.
  it.each(['bike', 'person'])('bounds resvg\'s observed area errors for the %s glyph from 20 to 100 px', (name) => {
    const g = getGlyph(name);
    const ink = measureGlyph(g.svg);
    let perimeterUnits = 0;
    for (const ring of ink.region) for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) perimeterUnits += Math.hypot(ring[i].x - ring[j].x, ring[i].y - ring[j].y);
    const d = /d="([^"]+)"/.exec(g.svg)?.[1] as string;
    let seed = 42;
    const rnd = () => {
      seed = (seed * 1103515245 + 12345) % 2147483648;
      return seed / 2147483648;
    };
    for (const sizePx of [20, 40, 100]) {
      const k = sizePx / ink.viewBox!.width;
      const areaPx = ink.areaUnits2 * k * k;
      const perimeterPx = perimeterUnits * k;
      let worstAa = 0;
      let worstCrisp = 0;
      for (let i = 0; i < 24; i++) {
        const dx = rnd();
        const dy = rnd();
        const w = sizePx + 4;
        const render = (crisp: boolean) => {
          const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${w}" height="${w}" viewBox="0 0 ${w} ${w}"><path transform="translate(${2 + dx} ${2 + dy}) scale(${k})" d="${d}"${crisp ? ' shape-rendering="crispEdges"' : ''}/></svg>`;
          const px = new Resvg(svg).render().pixels;
          let alpha = 0;
          for (let q = 3; q < px.length; q += 4) alpha += px[q];
          return Math.abs(alpha / 255 / areaPx - 1);
        };
        worstAa = Math.max(worstAa, render(false));
        worstCrisp = Math.max(worstCrisp, render(true));
      }
      expect(worstAa).toBeLessThan(estimateEdgeError(areaPx, perimeterPx));
      expect(worstCrisp).toBeLessThan(thresholdEdgeError(areaPx, perimeterPx));
      // And the estimates are not vacuous: within a factor of 5 of what was observed.
      expect(thresholdEdgeError(areaPx, perimeterPx)).toBeLessThan(5 * worstCrisp);
    }
  });
});
