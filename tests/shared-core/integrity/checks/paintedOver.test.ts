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
});
