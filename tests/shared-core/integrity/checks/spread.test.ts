// spread: max(g/d) / min(g/d) over the categories. Against the reference A (1 mm² for 1), B is drawn at lie factor
// 1.049 and C at 0.951, both inside Tufte's 0.95-1.05 (1983, p. 57), yet B carries 1.0485 mm² per unit of value
// and C 0.95125: 1.0485 / 0.95125 = 1.1022, two scales in one chart. Rectangle areas are closed-form.
import { describe, expect, it } from 'vitest';
import { lieFactor } from '../../../../shared-core/integrity/checks/lieFactor';
import { spread } from '../../../../shared-core/integrity/checks/spread';
import { measureFile } from '../../../../shared-core/integrity/measureFile';
import { chartSvg, rect } from '../chartSvgFixtures';
import { expectFindings, runCheck } from './checkHarness';

/** One rectangle per category, 10 mm tall, with the ink area given (scale reading: ink area against value). */
const chart = (areas: [number, number, number]) =>
  chartSvg({
    reading: 'area',
    mode: 'scale',
    unit: 1,
    widthMm: 300,
    marks: [
      { id: 'mark-1', label: 'A', value: 1, pieces: [{ ring: rect(10, 20, areas[0] / 10, 10), part: 'full' }] },
      { id: 'mark-2', label: 'B', value: 100, pieces: [{ ring: rect(10, 40, areas[1] / 10, 10), part: 'full' }] },
      { id: 'mark-3', label: 'C', value: 200, pieces: [{ ring: rect(10, 60, areas[2] / 10, 10), part: 'full' }] },
    ],
  });

describe('check spread', () => {
  const skewed = chart([1, 1 + 99 * 1.049, 1 + 199 * 0.951]);

  it('refuses two scales in one chart although every pair against the reference passes', () => {
    expect(runCheck(lieFactor, skewed)).toEqual([]);
    expect(measureFile(skewed).lieFactors.spread).toBeCloseTo((1 + 99 * 1.049) / 100 / ((1 + 199 * 0.951) / 200), 9);
    const findings = runCheck(spread, skewed);
    expectFindings(spread, findings);
    expect(spread.category).toBe('lie-factor');
    expect(findings[0].category).toBe('B');
    expect(findings[0].message).toMatch(/B is drawn 1\.10x as large as C \(allowed up to 1\.05\)/);
  });

  it('passes one scale throughout (1 mm² per unit of value)', () => {
    expect(runCheck(spread, chart([1, 100, 200]))).toEqual([]);
  });
});
