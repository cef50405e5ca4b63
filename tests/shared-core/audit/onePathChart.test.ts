// A unit chart whose glyphs were merged into ONE path: its rows (or columns) of equal pieces are read as
// marks, so the count reading applies. Expected figures follow from the drawn squares (a 10 x 10 glyph,
// a half glyph cut 5 wide) and Tufte's lie factor (1983, p. 57): (drawn ratio - 1) / (data ratio - 1).
import { describe, expect, it } from 'vitest';
import { auditSvg, correctSvg } from '../../../shared-core/audit';

const square = (x: number, y: number, w = 10) => `M${x} ${y}h${w}v10h-${w}z`;
const page = (d: string) => `<svg xmlns="http://www.w3.org/2000/svg" width="200" height="100" viewBox="0 0 200 100"><path id="glyphs" d="${d}" fill="#2b4c7e"/></svg>`;

// Row 1: 3 glyphs; row 2: 5 glyphs and a half glyph (5.5).
const ROWS = page([0, 1, 2].map((i) => square(10 + 15 * i, 10)).join(' ') + ' ' + [0, 1, 2, 3, 4].map((i) => square(10 + 15 * i, 40)).join(' ') + ' ' + square(85, 40, 5));

describe('one path holding a whole unit chart', () => {
  it('reads each row as a mark by count: 3 and 5.5 glyphs for 3 and 5.5 is faithful', () => {
    const report = auditSvg(ROWS, { values: [3, 5.5] });
    expect(report.marks.map((m) => m.id)).toEqual(['glyphs-row-1', 'glyphs-row-2']);
    expect(report.marks.map((m) => m.count)).toEqual([3, 5.5]);
    expect(report.suggested).toBe('count');
    expect(report.readings.count.lieFactor.worst).toBeCloseTo(1, 9);
  });

  it('finds the distortion: 3 and 5.5 glyphs for 3 and 4 is (5.5/3 - 1) / (4/3 - 1) = 2.5', () => {
    const report = auditSvg(ROWS, { values: [3, 4] });
    expect(report.readings.count.lieFactor.worst).toBeCloseTo((5.5 / 3 - 1) / (4 / 3 - 1), 9);
    expect(report.readings.count.pass).toBe(false);
  });

  it('reads stacked columns standing in one row as marks, left to right', () => {
    const columns = page([0, 1].map((k) => square(20, 80 - 12 * k)).join(' ') + ' ' + [0, 1, 2, 3].map((k) => square(60, 80 - 12 * k)).join(' '));
    const report = auditSvg(columns, { values: [2, 4] });
    expect(report.marks.map((m) => m.id)).toEqual(['glyphs-column-1', 'glyphs-column-2']);
    expect(report.marks.map((m) => m.count)).toEqual([2, 4]);
  });

  it('leaves one path of unequal pieces as one mark (not a unit chart)', () => {
    const bars = page(`${square(10, 10, 10)} M40 10h30v10h-30z`);
    expect(() => auditSvg(bars, { values: [1, 3] })).toThrow(/2 value\(s\) were given but the graphic has 1 mark/);
  });

  it('correcting in place is refused with a sentence (rows of one path cannot be rescaled apart); redrawing is the way', () => {
    expect(() => correctSvg(ROWS, { values: [3, 4], reading: 'area' })).toThrow(/pieces of one path .* Redraw the data as a unit chart instead/);
  });
});
