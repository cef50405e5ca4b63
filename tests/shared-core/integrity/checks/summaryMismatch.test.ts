// summary-mismatch: a written file carries its data on each mark and in its <metadata> summary
// (docs/chart-svg.md); a value changed in one place only is a hand edit.
import { describe, expect, it } from 'vitest';
import { summaryMismatch } from '../../../../shared-core/integrity/checks/summaryMismatch';
import { repeatChart } from '../chartSvgFixtures';
import { expectFindings, runCheck } from './checkHarness';

const honest = repeatChart([
  { label: 'A', value: 30 },
  { label: 'B', value: 50 },
]);

describe('check summary-mismatch', () => {
  it('refuses a mark whose data-value no longer matches the summary, and says to export again', () => {
    const tampered = honest.replace('data-value="50"', 'data-value="55"');
    expect(tampered).not.toBe(honest);
    const findings = runCheck(summaryMismatch, tampered);
    expectFindings(summaryMismatch, findings);
    expect(summaryMismatch.category).toBe('consistency');
    expect(findings[0].category).toBe('B');
    expect(findings[0].message).toBe('The file\'s summary records "B" = 50, but mark "mark-2" carries "B" = 55.');
    expect(findings[0].fix).toMatch(/edited by hand/);
  });

  it('passes the file as written', () => {
    expect(runCheck(summaryMismatch, honest)).toEqual([]);
  });
});
