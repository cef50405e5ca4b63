// Verification's preflight list names slivers measured from the written file itself: each partial piece's ink
// against its mark's full-glyph ink.
import { describe, expect, it } from 'vitest';
import { verifySvg } from '../../../shared-core/integrity/index';
import { renderChart } from '../../../shared-core/pipeline/renderChart';

const chart = (value: number) => ({
  format: 'tallyglyph.chart/1',
  data: [{ label: 'Kiln Lane', value }, { label: 'Bell Yard', value: 70 }],
  encoding: { mode: 'repeat', glyph: 'bike', unit: 10 },
  page: { width: 180, height: 120, unit: 'mm' },
});

describe('preflight from the file: slivers', () => {
  it('names the category and its share for a 3% partial glyph, measured from the file', { timeout: 60_000 }, () => {
    // 40.3 / 10 = 4.03 glyphs: the ink-true cut keeps 3% of a glyph's ink in the last one (arithmetic);
    // below a tenth of a glyph counts as a sliver (SLIVER_SHARE, common practice, no source).
    const { svg, report } = renderChart(chart(40.3));
    expect(report.pass).toBe(true);
    const slivers = report.preflight.filter((f) => f.code === 'sliver');
    expect(slivers.map((f) => f.owner)).toEqual(['"Kiln Lane"']);
    expect(slivers[0].message).toMatch(/^"Kiln Lane": the last glyph holds only 3% of a glyph's ink, a [\d.]+ mm sliver/);
    // The same finding from the file alone, as `verify` reads it.
    const again = verifySvg(svg);
    expect(again.preflight.filter((f) => f.code === 'sliver').map((f) => f.owner)).toEqual(['"Kiln Lane"']);
  });

  it('gives no sliver finding when the partial glyph holds at least a tenth of a glyph', { timeout: 60_000 }, () => {
    // 45 / 10 = 4.5 glyphs: the last holds half a glyph's ink.
    const { report } = renderChart(chart(45));
    expect(report.preflight.map((f) => f.code)).not.toContain('sliver');
  });
});
