// A written file carries its data twice, on each mark and in its summary (docs/chart-svg.md); where they
// disagree the file was edited by hand and no reader can tell which to believe.
import type { IntegrityFinding } from '../check';
import { MODE_OF_READING, type FileCheck } from '../measureFile';
import { blockingFinding, num, REEXPORT_FIX } from './fileFinding';

export const summaryMismatch: FileCheck = {
  code: 'summary-mismatch',
  name: 'Summary disagrees with the marks',
  severity: 'blocking',
  category: 'consistency',
  basis: 'the written-file contract, docs/chart-svg.md (our own)',
  run(m) {
    const summary = m.file.summary;
    const out: IntegrityFinding[] = [];
    if (!summary) return out;
    if (summary.mode && MODE_OF_READING[m.reading] !== summary.mode) {
      out.push(blockingFinding('summary-mismatch', `The file's summary says mode "${summary.mode}" but its marks are read by ${m.reading}.`, REEXPORT_FIX));
    }
    if (!Array.isArray(summary.data)) return out;
    const byId = new Map(summary.data.map((d) => [d.id, d]));
    for (const mk of m.marks) {
      const d = byId.get(mk.id);
      if (!d) {
        out.push(blockingFinding('summary-mismatch', `Mark "${mk.id}" ("${mk.label}") is not in the file's summary of its data.`, REEXPORT_FIX, mk.label));
        continue;
      }
      if (d.label !== mk.label || !(Math.abs(d.value - mk.value) <= 1e-9 * Math.max(1, Math.abs(d.value)))) {
        out.push(blockingFinding('summary-mismatch', `The file's summary records "${d.label}" = ${num(d.value)}, but mark "${mk.id}" carries "${mk.label}" = ${num(mk.value)}.`, REEXPORT_FIX, mk.label));
      }
    }
    const markIds = new Set(m.marks.map((mk) => mk.id));
    const lost = summary.data.filter((d) => !markIds.has(d.id));
    if (lost.length) out.push(blockingFinding('summary-mismatch', `The file's summary lists ${lost.map((d) => `"${d.label}"`).join(', ')}, which the file does not draw.`, REEXPORT_FIX));
    return out;
  },
};
