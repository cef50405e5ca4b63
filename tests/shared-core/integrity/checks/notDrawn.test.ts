// not-drawn: a positive value with no ink cannot be compared at all (Tufte 1983, p. 57: the effect shown is 0).
import { describe, expect, it } from 'vitest';
import { notDrawn } from '../../../../shared-core/integrity/checks/notDrawn';
import { chartSvg, rect } from '../chartSvgFixtures';
import { expectFindings, runCheck } from './checkHarness';

const chart = (bDrawn: boolean) =>
  chartSvg({
    reading: 'count',
    mode: 'repeat',
    unit: 1,
    marks: [
      { id: 'mark-1', label: 'A', value: 1, pieces: [{ ring: rect(20, 20, 8, 8), part: 'full' }] },
      { id: 'mark-2', label: 'B', value: 2, pieces: bDrawn ? [{ ring: rect(20, 40, 8, 8), part: 'full' }, { ring: rect(30, 40, 8, 8), part: 'full' }] : [] },
    ],
  });

describe('check not-drawn', () => {
  it('refuses a row with a value of 2 and no ink, naming that row', () => {
    const findings = runCheck(notDrawn, chart(false));
    expectFindings(notDrawn, findings);
    expect(notDrawn.category).toBe('lie-factor');
    expect(findings[0].category).toBe('B');
    expect(findings[0].message).toMatch(/B \(value 2\) is not drawn at all, although A \(value 1\) is/);
  });

  it('passes when every positive row is drawn', () => {
    expect(runCheck(notDrawn, chart(true))).toEqual([]);
  });
});
