import { describe, expect, it } from 'vitest';
import { DEMO_CHARTS } from '../../shared-core/demo/demoCharts';
import { renderChart } from '../../shared-core/pipeline';
import { renderDocument } from '../../renderer/src/pipelineAdapter';

const count = (svg: string, re: RegExp) => (svg.match(re) ?? []).length;

describe('renderDocument on a refused chart', () => {
  const base = DEMO_CHARTS[0].document;
  for (const useReferences of [false, true]) {
    for (const outlineText of [false, true]) {
      it(`previews the file with the document's writer options (useReferences ${useReferences}, outlineText ${outlineText})`, () => {
        const honest = { ...base, useReferences, outlineText };
        // Whole glyphs of 100 rides: 275 rides drawn as 3 glyphs and 135 as 1 cannot pass the gate.
        const refused = { ...honest, encoding: { ...base.encoding, unit: 100, rounding: 'whole' as const } };
        const written = renderChart(honest).svg;
        const outcome = renderDocument(refused);
        expect(outcome.kind).toBe('checked');
        if (outcome.kind !== 'checked') return;
        expect(outcome.honesty.pass).toBe(false);
        const preview = outcome.svg!;
        // Same title, source and labels as the honest file, so outlined text leaves the same number of <text> elements (none when outlined).
        expect(count(preview, /<text\b/g)).toBe(count(written, /<text\b/g));
        if (outlineText) expect(count(preview, /<text\b/g)).toBe(0);
        // Glyphs written once and referenced (<use>, SVG 2 §5.6) exactly when the document asks for it.
        expect(count(preview, /<use\b/g) > 0).toBe(useReferences);
        expect(count(written, /<use\b/g) > 0).toBe(useReferences);
      });
    }
  }
});
