// One listing of every check Tallyglyph runs, read from the two registries: the checks of a written file
// (FILE_CHECKS) and the chart rules beyond the lie factor (CHART_RULES). The command line prints it and
// docs/integrity-rules.md is tested against it.
import type { CheckCategory, Severity } from './check';
import { FILE_CHECKS } from './checks/index';
import { CHART_RULES } from './rules/index';

export interface CheckListing {
  code: string;
  name: string;
  severity: Severity;
  /** 'file': run on the written SVG by verifySvg; 'rule': run on the chart document and its layout by checkChart. */
  registry: 'file' | 'rule';
  category?: CheckCategory;
  basis?: string;
}

/** Every check and rule, file checks first, each in its registry's order. */
export function listChecks(): CheckListing[] {
  const entry = (registry: CheckListing['registry']) => (c: (typeof FILE_CHECKS)[number] | (typeof CHART_RULES)[number]): CheckListing => {
    const out: CheckListing = { code: c.code, name: c.name, severity: c.severity, registry };
    if (c.category) out.category = c.category;
    if (c.basis) out.basis = c.basis;
    return out;
  };
  return [...FILE_CHECKS.map(entry('file')), ...CHART_RULES.map(entry('rule'))];
}

/** The check a finding's code belongs to: the code itself, or the check whose code its sub-code starts with (longest first). */
export function checkOfCode(code: string): CheckListing | undefined {
  let best: CheckListing | undefined;
  for (const c of listChecks()) {
    if (code !== c.code && !code.startsWith(`${c.code}-`)) continue;
    if (!best || c.code.length > best.code.length) best = c;
  }
  return best;
}
