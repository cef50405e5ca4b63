// same-glyph-two-sizes: Isotype (Neurath): one symbol, one size, one quantity (paraphrase of secondary sources).
// Squares 1.1x as wide carry 1.1² = 1.21x the ink.
import { describe, expect, it } from 'vitest';
import { sameGlyphTwoSizes } from '../../../../shared-core/integrity/checks/sameGlyphTwoSizes';
import { repeatChart } from '../chartSvgFixtures';
import { expectFindings, runCheck } from './checkHarness';

const VALUES = [
  { label: 'A', value: 30 },
  { label: 'B', value: 50 },
];

describe('check same-glyph-two-sizes', () => {
  it('refuses the same square at 8 mm in one row and 8.8 mm in another (1.21x the ink)', () => {
    const findings = runCheck(sameGlyphTwoSizes, repeatChart(VALUES, { scaleOf: (i) => (i === 1 ? 1.1 : 1), legend: false }));
    expectFindings(sameGlyphTwoSizes, findings);
    expect(sameGlyphTwoSizes.category).toBe('consistency');
    expect(findings[0].category).toBe('B');
    expect(findings[0].message).toMatch(/carry 1\.21x the ink of those of "A"/);
  });

  it('passes one size throughout', () => {
    expect(runCheck(sameGlyphTwoSizes, repeatChart(VALUES, { legend: false }))).toEqual([]);
  });
});
