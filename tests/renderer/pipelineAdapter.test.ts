import { describe, expect, it } from 'vitest';
import { DEMO_CHARTS } from '../../shared-core/demo/demoCharts';
import { renderChart } from '../../shared-core/pipeline';
import { readableUnitsBelow, renderDocument } from '../../renderer/src/pipelineAdapter';

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

describe('one-click offers for a refused chart', () => {
  it('lists readable units (1, 2, 2.5 or 5 times a power of ten) below a unit, largest first', () => {
    expect(readableUnitsBelow(100, 6)).toEqual([50, 25, 20, 10, 5, 2.5]);
    expect(readableUnitsBelow(10, 3)).toEqual([5, 2.5, 2]);
    expect(readableUnitsBelow(0.5, 2)).toEqual([0.25, 0.2]);
  });

  it('offers partial glyphs and a smaller unit, each of which passes when applied', () => {
    const base = DEMO_CHARTS[0].document;
    // 10 rides per whole glyph: Harbour Gate 42 glyphs against Station Square's 13.5 rounded to 14 (or 13):
    // (42 - 14) / 14 over (420 - 135) / 135 = 0.947 (1.057 with 13), outside Tufte's 0.95-1.05 (p. 57).
    const refused = { ...base, encoding: { ...base.encoding, unit: 10, rounding: 'whole' as const } };
    const outcome = renderDocument(refused);
    expect(outcome.kind).toBe('checked');
    if (outcome.kind !== 'checked') return;
    expect(outcome.honesty.pass).toBe(false);
    expect(outcome.offers?.inkCut).toBe(true);
    // 5 rides per glyph divides every value exactly (420, 275, 610, 135 -> 84, 55, 122, 27 glyphs).
    expect(outcome.offers?.unit).toBe(5);
    expect(renderChart({ ...refused, encoding: { ...refused.encoding, unit: 5 } }).report.pass).toBe(true);
    expect(renderChart({ ...refused, encoding: { ...refused.encoding, rounding: 'ink-cut' } }).report.pass).toBe(true);
  });

  it('offers nothing for a chart that passes', () => {
    const outcome = renderDocument(DEMO_CHARTS[0].document);
    expect(outcome.kind === 'checked' && outcome.offers).toBeFalsy();
  });
});

describe('the chart rules in the outcome', () => {
  // Invented: takings in the dollars of each year, with a gap between 1982 and 2000.
  const takings = {
    format: 'tallyglyph.chart/1',
    data: [
      { label: '1982', value: 10000 },
      { label: '2000', value: 20000 },
      { label: '2005', value: 25000 },
    ],
    encoding: { mode: 'repeat', glyph: 'coin', unitName: 'dollars' },
    page: { width: 180, height: 120, unit: 'mm' },
  };

  it('runs on the spec and scene that were verified, with rule names and bases, and marks a dismissed finding instead of dropping it', () => {
    const outcome = renderDocument({ ...takings, dismissed: [{ code: 'time-uneven', reason: 'No festival in between.' }] });
    expect(outcome.kind).toBe('checked');
    if (outcome.kind !== 'checked') return;
    const rules = outcome.rules ?? [];
    const money = rules.find((r) => r.code === 'money-nominal');
    expect(money?.ruleName).toBe('Money over time not adjusted for prices');
    expect(money?.basis).toMatch(/Moore/);
    expect(money?.dismissedReason).toBeUndefined();
    // No source in the document: the rule says so and offers its fix.
    expect(rules.find((r) => r.code === 'source-unstated')?.action?.kind).toBe('set-source');
    const uneven = rules.find((r) => r.code === 'time-uneven');
    expect(uneven?.dismissedReason).toBe('No festival in between.');
    // Open findings first, set-aside ones after them.
    expect(rules.findIndex((r) => r.dismissedReason !== undefined)).toBe(rules.length - 1);
    // Survives postMessage: plain data only.
    expect(structuredClone(rules)).toEqual(rules);
  });

  it('comes with a refused chart too, from the preview that was written again', () => {
    const base = DEMO_CHARTS[0].document;
    const outcome = renderDocument({ ...base, source: undefined, encoding: { ...base.encoding, unit: 100, rounding: 'whole' as const } });
    expect(outcome.kind === 'checked' && outcome.honesty.pass).toBe(false);
    if (outcome.kind !== 'checked') return;
    const codes = (outcome.rules ?? []).map((r) => r.code);
    expect(codes).toContain('source-unstated');
    // Whole glyphs of 100 rides move 135 rides by more than 5% (the rounding rule's limit).
    expect(codes).toContain('rounding-error');
  });
});
