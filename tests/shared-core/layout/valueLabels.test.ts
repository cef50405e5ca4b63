// Value labels sit right after the ink of their row of glyphs, like bar-end labels (common practice, no source),
// not after the empty rest of a partial glyph's slot.
import { describe, expect, it } from 'vitest';
import { parseChart } from '../../../shared-core/document';
import { layoutChart } from '../../../shared-core/layout';

describe('repeat value labels', () => {
  it('start 2 mm after the right edge of the last glyph\'s ink, partial glyphs included', () => {
    // 40.3 / 10 = 4.03 glyphs: the fifth is a 3% ink-true cut, so its ink ends near the slot's left side.
    const scene = layoutChart(parseChart({
      format: 'tallyglyph.chart/1',
      data: [{ label: 'Kiln Lane', value: 40.3 }, { label: 'Bell Yard', value: 70 }],
      encoding: { mode: 'repeat', glyph: 'bike', unit: 10 },
      page: { width: 180, height: 120, unit: 'mm' },
    }));
    for (const mark of scene.marks) {
      // A category that wraps (here 7 bikes in rows of 5) is labelled after the ink of its last grid row.
      const bottomMm = (g: (typeof mark.glyphs)[number]) => Math.max(...g.region.flatMap((ring) => ring.map((pt) => pt.y)));
      const lastRowBottom = Math.max(...mark.glyphs.map(bottomMm));
      // A sliver of a partial glyph may end above the row's bottom: half a glyph's height tells the rows apart.
      const halfMm = Math.max(...mark.glyphs.map((g) => bottomMm(g) - Math.min(...g.region.flatMap((ring) => ring.map((pt) => pt.y))))) / 2;
      const lastRow = mark.glyphs.filter((g) => bottomMm(g) > lastRowBottom - halfMm);
      const inkRightMm = Math.max(...lastRow.flatMap((g) => g.region.flatMap((ring) => ring.map((pt) => pt.x))));
      const label = scene.texts.find((t) => t.role === 'value-label' && t.owner === mark.id)!;
      // VALUE_PAD_MM = 2 in repeatLayout.ts.
      expect(label.xMm - inkRightMm).toBeCloseTo(2, 6);
    }
    // The partial glyph really is short: its ink ends well before a full glyph's would.
    const kiln = scene.marks[0].glyphs;
    const partial = kiln.find((g) => g.part === 'partial')!;
    const full = kiln.find((g) => g.part === 'full')!;
    const width = (r: typeof full.region) => Math.max(...r.flatMap((ring) => ring.map((pt) => pt.x))) - Math.min(...r.flatMap((ring) => ring.map((pt) => pt.x)));
    expect(width(partial.region)).toBeLessThan(0.5 * width(full.region));
  });
});
