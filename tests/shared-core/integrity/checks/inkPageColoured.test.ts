// ink-page-coloured: ink in the page's own colour is measured but cannot be seen (our own rule, common
// practice, no source). CSS Color: #fff is #ffffff with each digit doubled.
import { describe, expect, it } from 'vitest';
import { inkPageColoured } from '../../../../shared-core/integrity/checks/inkPageColoured';
import { chartSvg, rect } from '../chartSvgFixtures';
import { expectFindings, runCheck } from './checkHarness';

const chart = (fillA: string) =>
  chartSvg({
    reading: 'count',
    mode: 'repeat',
    unit: 1,
    marks: [
      { id: 'mark-1', label: 'A', value: 1, pieces: [{ ring: rect(20, 20, 8, 8), part: 'full', fill: fillA }] },
      { id: 'mark-2', label: 'B', value: 1, pieces: [{ ring: rect(20, 40, 8, 8), part: 'full' }] },
    ],
  });

describe('check ink-page-coloured', () => {
  it('refuses a mark painted #fff on a page with no background (white paper)', () => {
    const findings = runCheck(inkPageColoured, chart('#fff'));
    expectFindings(inkPageColoured, findings);
    expect(inkPageColoured.category).toBe('visibility');
    expect(findings[0].category).toBe('A');
    expect(findings[0].message).toMatch(/"A" is painted in the colour of the page \(#ffffff\)/);
  });

  it('passes a mark in a colour that shows', () => {
    expect(runCheck(inkPageColoured, chart('#2f6f8f'))).toEqual([]);
  });
});
