// stack-partial-slot: a stack's partial glyph sits directly on its whole glyphs (slot n over n whole glyphs), or
// its length is not whole glyphs plus the partial share.
import { describe, expect, it } from 'vitest';
import { stackPartialSlot } from '../../../../shared-core/integrity/checks/stackPartialSlot';
import { expectFindings, runCheck } from './checkHarness';
import { slots, stackSvg } from './stackHand';

const chart = (partialSlot: number) =>
  stackSvg([
    { label: 'A', value: 2, fulls: slots(2) },
    { label: 'B', value: 2.5, fulls: slots(2), partial: { share: 0.5, slot: partialSlot } },
  ]);

describe('check stack-partial-slot', () => {
  it('refuses a half glyph in slot 3 over two whole glyphs', () => {
    const findings = runCheck(stackPartialSlot, chart(3));
    expectFindings(stackPartialSlot, findings);
    expect(stackPartialSlot.category).toBe('consistency');
    expect(findings[0].category).toBe('B');
    expect(findings[0].message).toMatch(/sits in slot 3, but the stack has 2 whole glyphs below it/);
  });

  it('passes the half glyph in slot 2', () => {
    expect(runCheck(stackPartialSlot, chart(2))).toEqual([]);
  });
});
