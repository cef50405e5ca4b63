// Recording the measured lie factor reuses the summary verification read instead of parsing the file again;
// these cases show that the shortcut still refuses everything the full re-parse refused.
import { describe, expect, it } from 'vitest';
import { DEMO_CHARTS } from '../../../shared-core/demo/demoCharts';
import { parseChart } from '../../../shared-core/document/index';
import { verifySvg } from '../../../shared-core/integrity/index';
import { layoutChart } from '../../../shared-core/layout/index';
import { embedMeasured } from '../../../shared-core/pipeline/index';
import { readChartSvg, writeSvg } from '../../../shared-core/svg/index';

const spec = parseChart(DEMO_CHARTS[0].document);
const written = writeSvg(layoutChart(spec), { useReferences: spec.useReferences, outlineText: spec.outlineText });
const report = verifySvg(written, { rounding: spec.encoding.rounding });
const measured = { lieFactorWorst: report.lieFactor.worst, spread: report.spread, pass: report.pass };

describe('embedMeasured with the summary verification read', () => {
  it('writes the same bytes as with a full re-parse, and the whole file reads back with the figures', () => {
    const fast = embedMeasured(written, measured, report.summary);
    expect(fast).toBe(embedMeasured(written, measured));
    // Read back by the full chart reader (docs/chart-svg.md: the summary lives in <metadata id="tallyglyph-summary">).
    const back = readChartSvg(fast).summary;
    expect(back?.measured).toEqual(measured);
    expect({ ...back, measured: undefined }).toEqual({ ...report.summary, measured: undefined });
  });

  it('refuses when the summary in the text is not the one verification read', () => {
    const other = { ...(report.summary as NonNullable<typeof report.summary>), unit: (report.summary?.unit ?? 1) * 2 };
    expect(() => embedMeasured(written, measured, other)).toThrow(/not the one verification read/);
    expect(() => embedMeasured(written, measured, null)).toThrow(/no readable summary/);
  });

  it('refuses a file whose summary element is missing or is not JSON', () => {
    expect(() => embedMeasured(written.replace('id="tallyglyph-summary"', 'id="other"'), measured, report.summary)).toThrow(/no readable summary/);
    const broken = written.replace(/(<metadata id="tallyglyph-summary">)\{/, '$1[');
    expect(() => embedMeasured(broken, measured, report.summary)).toThrow(/no readable summary/);
  });
});
