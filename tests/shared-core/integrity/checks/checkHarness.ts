// Runs one check of the written file on a hand-made chart SVG (../chartSvgFixtures.ts, docs/chart-svg.md to the
// letter), so each check is tested on its own, and states what every finding of a check must carry.
import { expect } from 'vitest';
import type { IntegrityFinding } from '../../../../shared-core/integrity/check';
import { FILE_CHECKS } from '../../../../shared-core/integrity/checks/index';
import { measureFile, type FileCheck, type VerifyOptions } from '../../../../shared-core/integrity/measureFile';

export function runCheck(check: FileCheck, svg: string, opts: VerifyOptions = {}): IntegrityFinding[] {
  return check.run(measureFile(svg, opts));
}

/** The check is in the registry under its code, and each finding has its code, the check's severity, a message and a fix. */
export function expectFindings(check: FileCheck, findings: IntegrityFinding[], count = 1): void {
  expect(FILE_CHECKS).toContain(check);
  expect(findings).toHaveLength(count);
  for (const f of findings) {
    expect(f.code).toBe(check.code);
    expect(f.severity).toBe(check.severity);
    expect(f.message.length).toBeGreaterThan(20);
    expect(f.fix.length).toBeGreaterThan(15);
  }
}
