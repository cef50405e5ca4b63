// The registries are the one list of checks: every check of the written file and every chart rule has a unique
// code, a file and a test named after it, and docs/integrity-rules.md lists exactly these codes.
import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { checkOfCode, FILE_CHECKS, listChecks, PREFLIGHT_CHECKS, verifySvg } from '../../../../shared-core/integrity/index';
import { CHART_RULES } from '../../../../shared-core/integrity/rules/index';
import { repeatChart, triangleRepeatChart } from '../chartSvgFixtures';

const ROOT = path.resolve(__dirname, '../../../..');
const camel = (code: string) => code.replace(/-([a-z])/g, (_, c: string) => c.toUpperCase());

/** Rows of the doc's tables whose first cell names codes: the codes, the name cell and the severity cell. */
function docRows(): { codes: string[]; name: string; severity: string }[] {
  const text = fs.readFileSync(path.join(ROOT, 'docs/integrity-rules.md'), 'utf8');
  return text
    .split('\n')
    .filter((line) => line.startsWith('| `'))
    .map((line) => {
      const cells = line.split('|').map((c) => c.trim());
      return { codes: [...cells[1].matchAll(/`([^`]+)`/g)].map((m) => m[1]), name: cells[2], severity: cells[3] };
    });
}

describe('the registries of checks', () => {
  it('give every check and rule a unique code, none a sub-code of another', () => {
    const codes = listChecks().map((c) => c.code);
    expect(codes).toHaveLength(FILE_CHECKS.length + CHART_RULES.length);
    expect(new Set(codes).size).toBe(codes.length);
    for (const a of codes) for (const b of codes) if (a !== b) expect(b.startsWith(`${a}-`)).toBe(false);
    expect(new Set(listChecks().map((c) => c.name)).size).toBe(codes.length);
  });

  it('make every file check blocking except print preflight, which only warns; each names its category and basis', () => {
    for (const c of FILE_CHECKS) {
      expect(c.category).toBeDefined();
      expect(c.basis?.length).toBeGreaterThan(10);
      expect(c.severity).toBe(c.category === 'preflight' ? 'warning' : 'blocking');
    }
    expect(FILE_CHECKS.filter((c) => c.category === 'preflight')).toEqual([...PREFLIGHT_CHECKS]);
    // The lie-factor checks rest on Tufte (1983, p. 57).
    for (const c of FILE_CHECKS.filter((x) => x.category === 'lie-factor')) expect(c.basis).toMatch(/1983\), p\. 57/);
  });

  it('keep each file check in its own file named after its code, with its own test file', () => {
    for (const c of FILE_CHECKS) {
      expect(fs.existsSync(path.join(ROOT, 'shared-core/integrity/checks', `${camel(c.code)}.ts`)), c.code).toBe(true);
      expect(fs.existsSync(path.join(__dirname, `${camel(c.code)}.test.ts`)), c.code).toBe(true);
    }
  });

  it('name every code a report carries, refused or passed', () => {
    for (const svg of [triangleRepeatChart([{ label: 'A', value: 2.5 }, { label: 'B', value: 3.3 }], 'width'), repeatChart([{ label: 'A', value: 30 }, { label: 'B', value: 50.5 }])]) {
      const report = verifySvg(svg);
      for (const f of [...report.findings, ...report.preflight]) expect(checkOfCode(f.code)?.registry, f.code).toBe('file');
    }
  });
});

describe('docs/integrity-rules.md and the registries agree', () => {
  const rows = docRows();

  it('lists every code of both registries with its name and severity', () => {
    for (const c of listChecks()) {
      const row = rows.find((r) => r.codes[0] === c.code);
      expect(row, `${c.code} is missing from docs/integrity-rules.md`).toBeDefined();
      expect(row?.name).toBe(c.name);
      expect(row?.severity).toBe(c.severity);
    }
  });

  it('lists no code the registries do not know (sub-codes start with their check\'s code)', () => {
    const codes = rows.flatMap((r) => r.codes);
    expect(codes.length).toBeGreaterThanOrEqual(listChecks().length);
    for (const code of codes) expect(checkOfCode(code), `${code} is in the doc but in no registry`).toBeDefined();
  });
});
