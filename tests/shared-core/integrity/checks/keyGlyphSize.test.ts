// key-glyph-size: the key shows what one glyph (or one unit of ink) stands for; drawn at another size it makes a
// reader misjudge every mark by that factor. Isotype (Neurath): one symbol, one size (paraphrase of secondary
// sources). Areas are closed-form: squares, and a regular 256-gon (n/2) r² sin(2π/n).
import { describe, expect, it } from 'vitest';
import { keyGlyphSize } from '../../../../shared-core/integrity/checks/keyGlyphSize';
import { chartSvg, polygon, polygonArea, rect } from '../chartSvgFixtures';
import { expectFindings, runCheck } from './checkHarness';

const countChart = (keySideMm: number) =>
  chartSvg({
    reading: 'count',
    mode: 'repeat',
    unit: 1,
    marks: [{ id: 'mark-1', label: 'A', value: 2, pieces: [{ ring: rect(20, 20, 8, 8), part: 'full' }, { ring: rect(30, 20, 8, 8), part: 'full' }] }],
    legend: { ring: rect(20, 120, keySideMm, keySideMm), glyph: 'square', unitValue: 1 },
  });

/** Circles at 2 mm² per unit of value; the key for 10 drawn with `keyFactor` times the ink it should carry. */
const scaleChart = (keyFactor: number) => {
  const r = (value: number) => Math.sqrt((2 * value) / polygonArea(1));
  return chartSvg({
    reading: 'area',
    mode: 'scale',
    unit: 0.5,
    marks: [
      { id: 'mark-1', label: 'A', value: 20, pieces: [{ ring: polygon(30, 60, r(20)), part: 'full' }] },
      { id: 'mark-2', label: 'B', value: 45, pieces: [{ ring: polygon(60, 60, r(45)), part: 'full' }] },
    ],
    legend: { ring: polygon(120, 60, r(10 * keyFactor)), glyph: 'circle', unitValue: 10 },
  });
};

describe('check key-glyph-size', () => {
  it('refuses a count chart whose key square is 10 mm (100 mm²) beside 8 mm marks (64 mm²)', () => {
    const findings = runCheck(keyGlyphSize, countChart(10));
    expectFindings(keyGlyphSize, findings);
    expect(keyGlyphSize.category).toBe('consistency');
    expect(findings[0].message).toMatch(/key glyph \(square\) carries 100 mm² of ink but the same glyph in "A" carries 64 mm²/);
  });

  it('passes a key square the size of the marks', () => {
    expect(runCheck(keyGlyphSize, countChart(8))).toEqual([]);
  });

  it('refuses a scale chart whose key carries 1.44x the marks\' ink per unit of value, and passes one that matches', () => {
    const findings = runCheck(keyGlyphSize, scaleChart(1.44));
    expectFindings(keyGlyphSize, findings);
    expect(findings[0].message).toMatch(/1\.44x what the marks carry for that value/);
    expect(runCheck(keyGlyphSize, scaleChart(1))).toEqual([]);
  });
});
