// The exported SVG of every mode, measured by two renderers that share no code with Tallyglyph's geometry:
// resvg (called directly) and Debian's rsvg-convert (librsvg). Each mark is rendered alone and its alpha
// summed; Tufte's lie factor recomputed from those sums must stay within 0.01 of 1.
import { describe, expect, it } from 'vitest';
import { marksOnlyPartSvg, marksOnlySvg } from '../../../main/export/index';
import { isolateEachMark } from '../../../main/raster/index';
import { DEMO_CHARTS } from '../../../shared-core/demo/demoCharts';
import { renderChart } from '../../../shared-core/pipeline/index';
import { hasRsvg, resvgAlphaSum, rsvgMarkCoverages } from '../../helpers/independent';

/** Tufte's lie factor (1983, p. 57) of every category against the smallest value, computed here from the definition. */
function tufteFactors(data: number[], graphic: number[]): number[] {
  const ref = data.indexOf(Math.min(...data));
  return data.flatMap((d, i) => (i === ref ? [] : [(graphic[i] - graphic[ref]) / graphic[ref] / ((d - data[ref]) / data[ref])]));
}

// 180 mm pages at 300 ppi: 2126 px wide.
const WIDTH_PX = 2126;

const charts = DEMO_CHARTS.map((c) => {
  const { svg, report } = renderChart(c.document);
  return { name: c.name, svg, report };
});

/** The reading's quantity from per-mark alpha sums: ink for count, length and area (one glyph, one pitch); filled ÷ whole for fill. */
function graphicFrom(reading: string, whole: number[], filled: number[] | null): number[] {
  return reading === 'fill' ? whole.map((w, i) => (filled as number[])[i] / w) : whole;
}

describe('independent renderers reproduce the lie factor of each exported mode', () => {
  it.each(charts.map((c) => [c.name, c] as const))('%s: resvg, each mark alone, within 0.01 of 1', (_name, { svg, report }) => {
    const ids = report.marks.map((m) => m.id);
    const sums = (source: string) => [...isolateEachMark(source, ids)].map((v) => resvgAlphaSum(v.svg, WIDTH_PX));
    const whole = sums(marksOnlySvg(svg));
    const filled = report.reading === 'fill' ? sums(marksOnlyPartSvg(svg, 'filled')) : null;
    const factors = tufteFactors(report.marks.map((m) => m.value), graphicFrom(report.reading, whole, filled));
    expect(factors.length).toBe(report.marks.length - 1);
    for (const lf of factors) expect(Math.abs(lf - 1)).toBeLessThanOrEqual(0.01);
    // And the ink itself: pixels per mm² at this width are (2126 / 180)².
    const pxPerMm2 = (WIDTH_PX / 180) ** 2;
    whole.forEach((px, i) => expect(px / pxPerMm2 / report.marks[i].inkMm2).toBeCloseTo(1, 2));
  });

  it.skipIf(!hasRsvg).each(charts.map((c) => [c.name, c] as const))('%s: rsvg-convert, each mark alone, within 0.01 of 1', (_name, { svg, report }) => {
    const ids = report.marks.map((m) => m.id);
    const whole = rsvgMarkCoverages(marksOnlySvg(svg), ids, WIDTH_PX).map((c) => c.mm2);
    const filled = report.reading === 'fill' ? rsvgMarkCoverages(marksOnlyPartSvg(svg, 'filled'), ids, WIDTH_PX).map((c) => c.mm2) : null;
    const factors = tufteFactors(report.marks.map((m) => m.value), graphicFrom(report.reading, whole, filled));
    for (const lf of factors) expect(Math.abs(lf - 1)).toBeLessThanOrEqual(0.01);
    whole.forEach((mm2, i) => expect(mm2 / report.marks[i].inkMm2).toBeCloseTo(1, 2));
  });
});
