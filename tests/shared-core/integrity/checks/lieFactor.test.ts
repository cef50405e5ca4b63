// lie-factor: Tufte, The Visual Display of Quantitative Information (1983), p. 57: lie factor = (graphic ratio - 1)
// / (data ratio - 1), allowed 0.95-1.05. A right-pointing triangle cut at a share t of its width keeps 2t - t² of
// its ink (closed form, similar triangles).
import { describe, expect, it } from 'vitest';
import { lieFactor } from '../../../../shared-core/integrity/checks/lieFactor';
import { triangleRepeatChart } from '../chartSvgFixtures';
import { expectFindings, runCheck } from './checkHarness';

const VALUES = [
  { label: 'A', value: 2.5 },
  { label: 'B', value: 3.3 },
];

describe('check lie-factor', () => {
  it('refuses remainders cut by width: A shows 2.75 glyphs, B 3.51, lie factor (3.51/2.75 - 1) / (3.3/2.5 - 1) = 0.8636', () => {
    const findings = runCheck(lieFactor, triangleRepeatChart(VALUES, 'width'));
    expectFindings(lieFactor, findings);
    expect(lieFactor.category).toBe('lie-factor');
    expect(findings[0].severity).toBe('blocking');
    expect(findings[0].category).toBe('B');
    expect(findings[0].message).toMatch(/lie factor 0\.86,/);
    expect(findings[0].basis).toMatch(/1983\), p\. 57/);
  });

  it('passes the same values cut by ink', () => {
    expect(runCheck(lieFactor, triangleRepeatChart(VALUES, 'ink'))).toEqual([]);
  });
});
