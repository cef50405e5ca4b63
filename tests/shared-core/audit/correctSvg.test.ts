// Corrections checked from outside: the corrected file is rendered by rsvg-convert (librsvg, not the
// code that measured it) with each mark isolated, and the rendered ink must stand in proportion to
// the data within Tufte's 0.95–1.05 (1983, p. 57), as judged by the same lie-factor arithmetic.
import { describe, expect, it } from 'vitest';
import { correctSvg, findSvgMarks, importSvg, MARK_ATTRIBUTE } from '../../../shared-core/audit';
import { gate, lieFactors } from '../../../shared-core/integrity';
import { BARRELS_AREA, BOXES_3D, DERRICKS, STRETCHED_3X, UNIFORM_3X, personRows } from '../../fixtures/audit/scenes';
import { hasRsvg, rsvgMarkCoverages } from '../../helpers/independent';

/** The original text back from a corrected one: drop each inserted wrapper's start and end tag. */
function unwrap(svg: string): string {
  let out = svg;
  for (;;) {
    const start = out.indexOf(`<g ${MARK_ATTRIBUTE}=`);
    if (start < 0) return out;
    const open = out.indexOf('>', start) + 1;
    // Wrappers hold exactly one element: find its matching end by counting nested <g>.
    let depth = 1, i = open;
    while (depth > 0) {
      const nextOpen = out.indexOf('<g', i);
      const nextClose = out.indexOf('</g>', i);
      if (nextOpen >= 0 && nextOpen < nextClose) {
        const end = out.indexOf('>', nextOpen);
        if (out[end - 1] !== '/') depth++;
        i = end + 1;
      } else {
        depth--;
        i = nextClose + 4;
      }
    }
    out = out.slice(0, start) + out.slice(open, i - 4) + out.slice(i);
  }
}

describe('correctSvg', () => {
  it('leaves every byte outside the inserted wrappers as it was', () => {
    const svg = BARRELS_AREA.svg(true);
    const fixed = correctSvg(svg, { values: BARRELS_AREA.values });
    expect(fixed.svg).not.toBe(svg);
    expect(unwrap(fixed.svg)).toBe(svg);
  });

  it('keeps the mark with the largest value and the anchor (bottom centre) of every mark in place', () => {
    const fixed = correctSvg(UNIFORM_3X.svg(), { values: UNIFORM_3X.values });
    expect(fixed.keptMark).toBe('large');
    const before = findSvgMarks(importSvg(UNIFORM_3X.svg())).marks;
    const after = findSvgMarks(importSvg(fixed.svg)).marks;
    before.forEach((b, i) => {
      const a = after[i];
      expect(a.box.x + a.box.width / 2).toBeCloseTo(b.box.x + b.box.width / 2, 6);
      expect(a.box.y + a.box.height).toBeCloseTo(b.box.y + b.box.height, 6);
    });
    expect(after[1].box.width).toBeCloseTo(before[1].box.width, 9);
    // Area honest for values 10 and 30: the small glyph grows by sqrt(9/3) = 1.732 on each side.
    expect(Math.abs(fixed.corrections[0].scaleX / Math.sqrt(3) - 1)).toBeLessThan(1e-5);
  });

  it('other anchors keep their own point; length corrections touch one side only', () => {
    const top = correctSvg(UNIFORM_3X.svg(), { values: UNIFORM_3X.values, anchor: 'top-left' });
    const b = findSvgMarks(importSvg(UNIFORM_3X.svg())).marks[0].box;
    const a = findSvgMarks(importSvg(top.svg)).marks[0].box;
    expect([a.x, a.y]).toEqual([expect.closeTo(b.x, 6), expect.closeTo(b.y, 6)]);
    const len = correctSvg(STRETCHED_3X.svg(), { values: [10, 45] });
    expect(len.reading).toBe('length');
    expect(len.corrections[0].scaleX).toBe(1);
    expect(len.corrections[0].scaleY).toBeCloseTo(3 / 4.5, 9);
  });

  it('the corrected file passes its own audit; a count chart or a zero value is refused with a reason', () => {
    const fixed = correctSvg(DERRICKS.svg(), { values: DERRICKS.values });
    expect(fixed.before.readings.area.pass).toBe(false);
    expect(fixed.after.readings.area.pass).toBe(true);
    expect(() => correctSvg(personRows().svg, { values: [3, 4] })).toThrow(/rescaling cannot fix a count/);
    expect(() => correctSvg(UNIFORM_3X.svg(), { values: [0, 30] })).toThrow(/only positive values/);
  });

  it('a mark nested inside transformed groups is rescaled in root units (the wrapper undoes the parent transform)', () => {
    const svg =
      '<svg xmlns="http://www.w3.org/2000/svg" width="100mm" height="100mm" viewBox="0 0 100 100"><g transform="translate(5 5) rotate(90 40 40) scale(2 1)">' +
      '<rect id="s" x="5" y="5" width="5" height="10"/><rect id="t" x="20" y="5" width="5" height="20"/></g></svg>';
    const fixed = correctSvg(svg, { values: [1, 4], reading: 'area' });
    const marks = findSvgMarks(importSvg(fixed.svg)).marks;
    // 1 : 4 in ink, whatever the parent transform.
    expect(marks[1].inkAreaUnits2 / marks[0].inkAreaUnits2).toBeCloseTo(4, 6);
  });
});

describe.skipIf(!hasRsvg)('correctSvg checked by rsvg-convert', () => {
  const rendered = (svg: string, ids: string[]) => rsvgMarkCoverages(svg, ids, 1600).map((c) => c.mm2);
  const judged = (ids: string[], values: number[], ink: number[]) =>
    gate(lieFactors(ids.map((id, i) => ({ label: id, data: values[i], graphic: ink[i] }))));

  it('area corrections: barrels and derricks render with ink in proportion to the values', () => {
    for (const [scene, values] of [
      [BARRELS_AREA.svg(true), BARRELS_AREA.values],
      [DERRICKS.svg(), DERRICKS.values],
    ] as const) {
      const fixed = correctSvg(scene, { values: [...values] });
      const ids = fixed.after.marks.map((m) => m.id);
      const before = judged(ids, [...values], rendered(scene, ids));
      const after = judged(ids, [...values], rendered(fixed.svg, ids));
      expect(before.pass).toBe(false);
      expect(after.pass).toBe(true);
      expect(Math.abs((after.worst?.lieFactor as number) - 1)).toBeLessThan(0.01);
    }
  });

  it('a length correction renders with heights (here: ink of a fixed-width glyph) in proportion', () => {
    const fixed = correctSvg(STRETCHED_3X.svg(), { values: [10, 45] });
    const ids = ['short', 'tall'];
    const ink = rendered(fixed.svg, ids);
    // Width unchanged, so ink scales with height: ink ratio must be 4.5.
    expect(judged(ids, [10, 45], ink).pass).toBe(true);
  });

  it('a volume correction renders with ink ∝ value^(2/3) (uniform scale ∝ value^(1/3))', () => {
    const fixed = correctSvg(BOXES_3D.svg(), { values: [1, 27], reading: 'volume' });
    const ink = rendered(fixed.svg, ['box-a', 'box-b']);
    // 27^(2/3) = 9.
    expect(judged(['box-a', 'box-b'], [1, 9], ink).pass).toBe(true);
  });
});

describe('correctSvg layout warnings', () => {
  it('says when a grown mark now reaches past the page edge (the labels are never moved)', () => {
    // The small barrel sits 10 units from the left edge; grown ×2.81 about its bottom centre it needs 31.
    const svg = BARRELS_AREA.svg(true).replace('translate(40 200)', 'translate(10 200)');
    const fixed = correctSvg(svg, { values: BARRELS_AREA.values });
    expect(fixed.warnings.map((w) => w.code)).toContain('mark-outside-page');
    expect(correctSvg(BARRELS_AREA.svg(), { values: BARRELS_AREA.values }).warnings.map((w) => w.code)).not.toContain('mark-outside-page');
  });
});
