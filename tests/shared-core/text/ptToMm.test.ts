import { describe, expect, it } from 'vitest';
import { mmToPt, ptToMm } from '../../../shared-core/text';

// CSS Values and Units Level 3, section 5.2 (absolute lengths): 1in = 25.4mm = 72pt.
describe('ptToMm / mmToPt', () => {
  it('72 pt is one inch, 25.4 mm', () => {
    expect(ptToMm(72)).toBeCloseTo(25.4, 12);
    expect(mmToPt(25.4)).toBeCloseTo(72, 12);
  });

  it('6 pt (a common minimum print text size) is 2.1167 mm', () => {
    // 6 x 25.4 / 72 = 2.11666...
    expect(ptToMm(6)).toBeCloseTo(2.1167, 4);
  });

  it('1 pc = 12 pt = 1/6 in', () => {
    expect(ptToMm(12)).toBeCloseTo(25.4 / 6, 12);
  });

  it('round-trips', () => {
    for (const mm of [0, 0.1, 3, 297, -5]) expect(ptToMm(mmToPt(mm))).toBeCloseTo(mm, 12);
  });
});
