// zero-drawn: a value of 0 has no size, so any ink drawn for it is an effect the data does not have.
import { describe, expect, it } from 'vitest';
import { zeroDrawn } from '../../../../shared-core/integrity/checks/zeroDrawn';
import { chartSvg, rect } from '../chartSvgFixtures';
import { expectFindings, runCheck } from './checkHarness';

const chart = (zeroInk: boolean) =>
  chartSvg({
    reading: 'count',
    mode: 'repeat',
    unit: 1,
    marks: [
      { id: 'mark-1', label: 'Z', value: 0, pieces: zeroInk ? [{ ring: rect(20, 20, 4, 8), part: 'partial' }] : [] },
      { id: 'mark-2', label: 'B', value: 1, pieces: [{ ring: rect(20, 40, 8, 8), part: 'full' }] },
      { id: 'mark-3', label: 'C', value: 2, pieces: [{ ring: rect(20, 60, 8, 8), part: 'full' }, { ring: rect(30, 60, 8, 8), part: 'full' }] },
    ],
  });

describe('check zero-drawn', () => {
  it('refuses half a glyph drawn for a zero, measured as 0.5 glyphs', () => {
    const findings = runCheck(zeroDrawn, chart(true));
    expectFindings(zeroDrawn, findings);
    expect(zeroDrawn.category).toBe('lie-factor');
    expect(findings[0].category).toBe('Z');
    expect(findings[0].message).toMatch(/Z has a value of 0 but is drawn with ink \(measured 0\.5\)/);
  });

  it('passes a zero drawn as nothing', () => {
    expect(runCheck(zeroDrawn, chart(false))).toEqual([]);
  });
});
