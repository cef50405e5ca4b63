// sliver: a partial glyph under a tenth of a glyph's ink reads as a dash (common practice, no source). Square
// glyphs 8 mm wide at 10 per glyph: 50.5 leaves 0.05 of a glyph, a 0.4 mm strip; 52.5 leaves a quarter.
import { describe, expect, it } from 'vitest';
import { sliver } from '../../../../shared-core/integrity/checks/sliver';
import { repeatChart } from '../chartSvgFixtures';
import { expectFindings, runCheck } from './checkHarness';

const chart = (b: number) =>
  repeatChart([
    { label: 'A', value: 30 },
    { label: 'B', value: b },
  ]);

describe('check sliver', () => {
  it('warns about a last glyph holding 5% of a glyph\'s ink, naming the category', () => {
    const findings = runCheck(sliver, chart(50.5));
    expectFindings(sliver, findings);
    expect(sliver.category).toBe('preflight');
    expect(findings[0].owner).toBe('"B"');
    expect(findings[0].message).toBe('"B": the last glyph holds only 5% of a glyph\'s ink, a 0.4 mm sliver that may not read as the glyph (common practice).');
  });

  it('says nothing of a quarter glyph', () => {
    expect(runCheck(sliver, chart(52.5))).toEqual([]);
  });
});
