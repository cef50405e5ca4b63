// The lie factor's arithmetic in words, for the worst pair of one reading: Tufte's effect form
// (size of effect shown ÷ size of effect in data, each effect being ratio − 1; The Visual Display of
// Quantitative Information, 1983, p. 57), or the plain ratio form where the data differ by under 2%.
import type { AuditReport } from '../../../shared-core/audit/auditReport';
import { formatFactor, formatMeasure } from '../../../shared-core/audit/formatNumbers';
import type { ReadingResult } from '../../../shared-core/audit/readings';

export function readingArithmetic(r: ReadingResult, report: AuditReport, names: readonly string[]): string {
  if (!r.available) return r.unavailableReason ?? 'This reading cannot be measured here.';
  const worst = r.lieFactor.worstPair;
  const pair = worst ? r.lieFactor.pairs.find((p) => p.mark === worst.mark && p.reference === worst.reference) : undefined;
  if (!pair || pair.graphicRatio === null || pair.lieFactor === null) return r.problems[0] ?? 'Nothing to compare: every value is the same or zero.';
  const nameOf = (id: string) => names[report.marks.findIndex((m) => m.id === id)] ?? id;
  const a = pair.graphicRatio, b = pair.dataRatio;
  const who = `${nameOf(pair.mark)} against ${nameOf(pair.reference)}`;
  if (pair.basis === 'ratio') {
    return `${who}: drawn ${formatMeasure(a)}×, data ${formatMeasure(b)}×; the values differ by under 2%, so the ratio form is used: ${formatMeasure(a)} ÷ ${formatMeasure(b)} = ${formatFactor(pair.lieFactor)}.`;
  }
  return `${who}: (${formatMeasure(a)} − 1) ÷ (${formatMeasure(b)} − 1) = ${formatMeasure(a - 1)} ÷ ${formatMeasure(b - 1)} = ${formatFactor(pair.lieFactor)}.`;
}
