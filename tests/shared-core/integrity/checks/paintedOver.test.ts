// painted-over: SVG paints in document order (SVG 1.1, 3.3 "Rendering Order", from memory), so a shape after a mark hides the
// ink under it. Covered area is closed-form: a 4 x 8 mm strip over an 8 x 8 mm square hides 32 mm².
import { describe, expect, it } from 'vitest';
import { paintedOver } from '../../../../shared-core/integrity/checks/paintedOver';
import { chartSvg, rect, ringPath } from '../chartSvgFixtures';
import { expectFindings, runCheck } from './checkHarness';

const chart = (extra: string) =>
  chartSvg({
    reading: 'count',
    mode: 'repeat',
    unit: 1,
    marks: [{ id: 'mark-1', label: 'A', value: 1, pieces: [{ ring: rect(20, 20, 8, 8), part: 'full' }] }],
    extra,
  });

describe('check painted-over', () => {
  it('refuses a strip painted over the mark, naming the 32 mm² it hides', () => {
    const findings = runCheck(paintedOver, chart(`<path d="${ringPath(rect(24, 10, 4, 30))}" fill="#333333"/>`));
    expectFindings(paintedOver, findings);
    expect(paintedOver.category).toBe('visibility');
    expect(findings[0].category).toBe('A');
    expect(findings[0].message).toMatch(/covers 32 mm² of its ink \(artwork\)/);
  });

  it('passes artwork that touches nothing', () => {
    expect(runCheck(paintedOver, chart(`<path d="${ringPath(rect(100, 10, 4, 30))}" fill="#333333"/>`))).toEqual([]);
  });

  // The check intersects only the pieces whose boxes meet the covering shape, unioned first: this must equal
  // the covered part of the whole mark's ink, so a piece overlapping another is counted once (closed form).
  it('counts the ink hidden under a strip across several pieces once, overlapping pieces included', () => {
    const pieces = [];
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) pieces.push({ ring: rect(20 + 10 * i, 20 + 10 * j, 8, 8), part: 'full' as const });
    // A small piece lying on the first square: the union's area is unchanged, a sum of per-piece areas would not be.
    pieces.push({ ring: rect(22, 22, 4, 4), part: 'partial' as const });
    const svg = chartSvg({
      reading: 'count',
      mode: 'repeat',
      unit: 1,
      marks: [{ id: 'mark-1', label: 'A', value: 9, pieces }],
      // x 24..28 over the first column (x 20..28) of three 8 mm rows: 3 x 4 x 8 = 96 mm²; the small piece adds 0.
      extra: `<path d="${ringPath(rect(24, 10, 4, 50))}" fill="#333333"/>`,
    });
    const findings = runCheck(paintedOver, svg);
    expect(findings).toHaveLength(1);
    expect(findings[0].message).toMatch(/covers 96 mm² of its ink \(artwork\)/);
  });
});
