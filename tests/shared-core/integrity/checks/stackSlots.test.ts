// stack-slots: a stack's length counts its glyphs only when they follow one another from the baseline, one per
// slot (Isotype: each symbol a fixed quantity; paraphrase of secondary sources).
import { describe, expect, it } from 'vitest';
import { stackSlots } from '../../../../shared-core/integrity/checks/stackSlots';
import { expectFindings, runCheck } from './checkHarness';
import { slots, stackSvg } from './stackHand';

describe('check stack-slots', () => {
  it('refuses a stack whose glyphs sit in slots 0, 1 and 3', () => {
    const svg = stackSvg([
      { label: 'A', value: 2, fulls: slots(2) },
      { label: 'B', value: 3, fulls: [{ slot: 0 }, { slot: 1 }, { slot: 3 }] },
    ]);
    const findings = runCheck(stackSlots, svg);
    expectFindings(stackSlots, findings);
    expect(stackSlots.category).toBe('consistency');
    expect(findings[0].category).toBe('B');
    expect(findings[0].message).toMatch(/skips or repeats slots \(0, 1, 3\)/);
  });

  it('passes slots 0, 1, 2', () => {
    expect(runCheck(stackSlots, stackSvg([{ label: 'A', value: 2, fulls: slots(2) }, { label: 'B', value: 3, fulls: slots(3) }]))).toEqual([]);
  });
});
