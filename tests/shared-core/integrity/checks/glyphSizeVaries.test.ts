// glyph-size-varies: Isotype (Neurath): each symbol stands for a fixed quantity, so its copies are one size
// (paraphrase of secondary sources). An 8 x 8.4 mm square carries 5% more ink than an 8 x 8 one.
import { describe, expect, it } from 'vitest';
import { glyphSizeVaries } from '../../../../shared-core/integrity/checks/glyphSizeVaries';
import { chartSvg, rect } from '../chartSvgFixtures';
import { expectFindings, runCheck } from './checkHarness';

const chart = (secondHeightMm: number) =>
  chartSvg({
    reading: 'count',
    mode: 'repeat',
    unit: 1,
    marks: [
      { id: 'mark-1', label: 'A', value: 1, pieces: [{ ring: rect(20, 20, 8, 8), part: 'full' }] },
      { id: 'mark-2', label: 'B', value: 2, pieces: [{ ring: rect(20, 40, 8, 8), part: 'full' }, { ring: rect(30, 40, 8, secondHeightMm), part: 'full' }] },
    ],
  });

describe('check glyph-size-varies', () => {
  it('refuses whole glyphs of 64 and 67.2 mm² in one row', () => {
    const findings = runCheck(glyphSizeVaries, chart(8.4));
    expectFindings(glyphSizeVaries, findings);
    expect(glyphSizeVaries.category).toBe('consistency');
    expect(findings[0].category).toBe('B');
    expect(findings[0].message).toMatch(/ink from 64 to 67\.2 mm²/);
  });

  it('passes glyphs within 1% (8 x 8.04 mm, +0.5%)', () => {
    expect(runCheck(glyphSizeVaries, chart(8.04))).toEqual([]);
  });
});
