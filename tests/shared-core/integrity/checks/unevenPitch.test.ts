// uneven-pitch: each glyph of a stack takes one pitch along one line (Isotype: a fixed quantity per symbol, so
// a fixed length; paraphrase of secondary sources). The least-squares line through slots 0, 1, 2 at 0, 7.5 and
// 16.5 mm has slope 8.25; the centres stray from it by 0.5 mm (arithmetic by hand), over 1% of the pitch.
import { describe, expect, it } from 'vitest';
import { unevenPitch } from '../../../../shared-core/integrity/checks/unevenPitch';
import { expectFindings, runCheck } from './checkHarness';
import { slots, stackSvg } from './stackHand';

const chart = (lastAtSlot: number) =>
  stackSvg([
    { label: 'A', value: 3, fulls: slots(3) },
    { label: 'B', value: 3, fulls: [{ slot: 0 }, { slot: 1 }, { slot: 2, drawnAt: lastAtSlot }] },
  ]);

describe('check uneven-pitch', () => {
  it('refuses a third glyph drawn 1.2 pitches above the second', () => {
    const findings = runCheck(unevenPitch, chart(2.2));
    expectFindings(unevenPitch, findings);
    expect(unevenPitch.category).toBe('consistency');
    expect(findings[0].category).toBe('B');
    expect(findings[0].message).toMatch(/off by up to 0\.5 mm/);
  });

  it('passes glyphs one pitch apart', () => {
    expect(runCheck(unevenPitch, chart(2))).toEqual([]);
  });
});
