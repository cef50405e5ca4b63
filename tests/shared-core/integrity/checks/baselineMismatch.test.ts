// baseline-mismatch: stacks are compared by length only from a common baseline; position on a common scale is
// read most accurately (Cleveland and McGill 1984, JASA 79(387)).
import { describe, expect, it } from 'vitest';
import { baselineMismatch } from '../../../../shared-core/integrity/checks/baselineMismatch';
import { expectFindings, runCheck } from './checkHarness';
import { slots, stackSvg } from './stackHand';

const chart = (liftMm: number) =>
  stackSvg([
    { label: 'A', value: 2, fulls: slots(2) },
    { label: 'B', value: 3, fulls: slots(3), liftMm },
  ]);

describe('check baseline-mismatch', () => {
  it('refuses a stack lifted 4 mm off the others\' baseline', () => {
    const findings = runCheck(baselineMismatch, chart(4));
    expectFindings(baselineMismatch, findings);
    expect(baselineMismatch.category).toBe('consistency');
    expect(findings[0].category).toBe('B');
    expect(findings[0].message).toMatch(/starts 4 mm away from that of "A"/);
  });

  it('passes stacks on one baseline', () => {
    expect(runCheck(baselineMismatch, chart(0))).toEqual([]);
  });
});
