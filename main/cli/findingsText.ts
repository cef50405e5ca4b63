// Integrity findings as the command line prints them: one block per finding (severity, code, name, what is
// wrong, the fix, the one-click action's label and the basis), shared by `check` and `render`.
import { checkOfCode, type IntegrityFinding } from '../../shared-core/integrity/index';
import type { DismissedResult } from '../../shared-core/integrity/rules/index';

/** The name of the check or rule a code belongs to (from the registries): the code itself or the one its sub-code starts with. */
function ruleName(code: string): string | undefined {
  return checkOfCode(code)?.name;
}

export function findingText(f: IntegrityFinding, indent = ''): string {
  const name = ruleName(f.code);
  const lines = [`${indent}${f.severity.toUpperCase()} ${f.code}${name ? ` (${name})` : ''}${f.category ? ` [${f.category}]` : ''}`];
  lines.push(`${indent}  ${f.message}`);
  lines.push(`${indent}  Fix: ${f.fix}`);
  if (f.action) lines.push(`${indent}  One-click fix in the app: ${f.action.label}`);
  if (f.basis) lines.push(`${indent}  Basis: ${f.basis}`);
  return lines.join('\n');
}

export function countsText(findings: readonly IntegrityFinding[]): string {
  const n = (s: IntegrityFinding['severity']) => findings.filter((f) => f.severity === s).length;
  const plural = (k: number, word: string) => `${k} ${word}${k === 1 ? '' : 's'}`;
  return `${plural(n('blocking'), 'blocking finding')}, ${plural(n('warning'), 'warning')}, ${n('advice')} advice`;
}

export function dismissedText(dismissed: readonly DismissedResult[]): string[] {
  return dismissed.map((d) => `Dismissed ${d.finding.code}${d.finding.category ? ` [${d.finding.category}]` : ''}: ${d.reason}`);
}
