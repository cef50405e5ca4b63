// Slivers: a partial glyph of a few per cent is warned about with its category and share, and a unit without
// slivers is offered; the ink-true cut itself is kept.
import { describe, expect, it } from 'vitest';
import { parseChart } from '../../../shared-core/document';
import { regionArea } from '../../../shared-core/geometry/region';
import { preflight } from '../../../shared-core/integrity/preflight';
import { layoutChart } from '../../../shared-core/layout';
import { unitWithoutSlivers } from '../../../shared-core/layout/slivers';

const doc = (mode: 'repeat' | 'stack') => ({
  format: 'tallyglyph.chart/1',
  data: [{ label: 'Quarry Hill', value: 40.5 }, { label: 'Mill Lane', value: 70 }],
  encoding: { mode, glyph: 'bike', unit: 10 },
  page: { width: 180, height: 120, unit: 'mm' },
});

describe('slivers', () => {
  it('warns for a 5% remainder in repeat and stack, naming the category and share, and offers a unit of 5', () => {
    // 40.5 / 10 = 4.05 glyphs: the last holds 5% of a glyph's ink. At 5 per glyph: 8.1 and 14 (10% and none).
    for (const mode of ['repeat', 'stack'] as const) {
      const scene = layoutChart(parseChart(doc(mode)));
      const sliver = scene.warnings.filter((w) => w.code === 'sliver');
      expect(sliver).toHaveLength(1);
      expect(sliver[0].message).toMatch(/^"Quarry Hill": the last glyph holds only 5% of a glyph's ink, a [\d.]+ mm sliver/);
      expect(sliver[0].message).toMatch(/A unit of 5 per glyph avoids slivers\./);
      // The cut stays ink-true: the partial piece holds 0.05 of the unit glyph's ink.
      const partial = scene.marks[0].glyphs.find((g) => g.part === 'partial')!;
      expect(regionArea(partial.region) / (scene.summary.unitGlyphInkMm2 as number)).toBeCloseTo(0.05, 3);
    }
  });

  it('gives no warning when every remainder is at least a tenth of a glyph', () => {
    const scene = layoutChart(parseChart({ ...doc('repeat'), data: [{ label: 'A', value: 41 }, { label: 'B', value: 70 }] }));
    expect(scene.warnings.map((w) => w.code)).not.toContain('sliver');
  });

  it('is a preflight finding when partial glyphs are given to preflight', () => {
    const findings = preflight({
      page: { widthMm: 100, heightMm: 100 },
      bleedMm: 0,
      safeMarginMm: 3,
      strokes: [],
      texts: [],
      contentBoxMm: { x: 10, y: 10, width: 80, height: 80 },
      backgroundCoversBleed: false,
      partials: [{ owner: '"Kiln Lane"', share: 0.03, shortSideMm: 0.4 }, { owner: '"Bell Yard"', share: 0.5, shortSideMm: 4 }],
    });
    expect(findings.map((f) => [f.code, f.owner])).toEqual([['sliver', '"Kiln Lane"']]);
    expect(findings[0].message).toMatch(/3% of a glyph's ink, a 0.4 mm sliver/);
  });

  it('offers the nearest readable unit without slivers', () => {
    expect(unitWithoutSlivers([40.5, 70], 10)).toBe(5);
    expect(unitWithoutSlivers([3, 4], 1)).not.toBeNull();
  });
});
