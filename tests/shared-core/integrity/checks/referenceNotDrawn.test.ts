// reference-not-drawn: every lie factor is taken against the smallest category (Tufte 1983, p. 57, effect
// relative to the first value); with no ink there, nothing can be compared.
import { describe, expect, it } from 'vitest';
import { referenceNotDrawn } from '../../../../shared-core/integrity/checks/referenceNotDrawn';
import { chartSvg, rect } from '../chartSvgFixtures';
import { expectFindings, runCheck } from './checkHarness';

const chart = (aDrawn: boolean) =>
  chartSvg({
    reading: 'count',
    mode: 'repeat',
    unit: 1,
    marks: [
      { id: 'mark-1', label: 'A', value: 1, pieces: aDrawn ? [{ ring: rect(20, 20, 8, 8), part: 'full' }] : [] },
      { id: 'mark-2', label: 'B', value: 2, pieces: [{ ring: rect(20, 40, 8, 8), part: 'full' }, { ring: rect(30, 40, 8, 8), part: 'full' }] },
      { id: 'mark-3', label: 'C', value: 3, pieces: [0, 1, 2].map((i) => ({ ring: rect(20 + 10 * i, 60, 8, 8), part: 'full' as const })) },
    ],
  });

describe('check reference-not-drawn', () => {
  it('refuses once (not once per pair) when the smallest row has no ink', () => {
    const findings = runCheck(referenceNotDrawn, chart(false));
    expectFindings(referenceNotDrawn, findings);
    expect(referenceNotDrawn.category).toBe('lie-factor');
    expect(findings[0].category).toBe('A');
  });

  it('passes when the smallest row is drawn', () => {
    expect(runCheck(referenceNotDrawn, chart(true))).toEqual([]);
  });
});
