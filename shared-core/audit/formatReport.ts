// The audit as plain text a designer can forward to a client: what a reader compares, how far the
// drawing is from the data under each reading, the data and the measurements, and what to do.
import type { AuditReport } from './auditReport';
import { formatFactor, formatMeasure } from './formatNumbers';
import { lieFactorFormula } from './verdictSentence';
import { READING_NAMES, type ReadingName } from './types';

const SQUARE: Record<string, string> = { 'user unit': 'units²', pixel: 'px²' };

function pad(s: string, n: number): string {
  return s.length >= n ? s + ' ' : s + ' '.repeat(n - s.length);
}

function table(rows: string[][]): string[] {
  const widths = rows[0].map((_, c) => Math.max(...rows.map((r) => (r[c] ?? '').length)) + 2);
  return rows.map((r) => '  ' + r.map((cell, c) => (c === r.length - 1 ? cell : pad(cell, widths[c]))).join('').trimEnd());
}

function advice(report: AuditReport): string[] {
  const r = report.readings[report.suggested];
  const out: string[] = [];
  if (r.pass) out.push(`Read by ${report.suggested}, nothing needs to change.`);
  else if (report.suggested === 'area') {
    out.push('Scale each picture so that its area, not its height, is in proportion to its value (`tallyglyph correct` does this and keeps the largest picture as it is).');
    out.push('Or show each value as a number of identical small pictures, each standing for a fixed amount: counts are read more accurately than areas.');
  } else if (report.suggested === 'length') {
    const side = report.readings.length.dimension === 'width' ? 'width' : 'height';
    out.push(`Make each mark's ${side} proportional to its value, leaving the other side alone (\`tallyglyph correct\` does this and keeps the largest mark as it is).`);
  } else if (report.suggested === 'count') {
    out.push('Redraw the marks with one picture per fixed amount, the last one cut by its share of ink; rescaling cannot fix a count.');
  } else {
    out.push('Scale each picture so that its volume is in proportion to its value, or better, draw it flat.');
  }
  if (report.volumeReadable && report.suggested !== 'volume') {
    out.push('Because the pictures look solid, a flat version avoids a reader judging volumes, which would exaggerate the differences further.');
  }
  return out;
}

/** Plain-text report. `title` names the graphic (a file name, say). */
export function formatAuditReport(report: AuditReport, title?: string): string {
  const lines: string[] = [];
  const n = report.marks.length;
  lines.push(`Tallyglyph audit${title ? ` of ${title}` : ''}`);
  lines.push(`${n} mark${n === 1 ? '' : 's'}, measured in ${report.unit}s of the ${report.source === 'svg' ? 'drawing' : 'image'}.`);
  lines.push('');
  lines.push('What a reader compares');
  for (const r of report.reasons) lines.push(`  ${r}`);
  lines.push('');
  lines.push('Verdict');
  lines.push(`  ${report.verdict.sentence}`);
  lines.push('');
  lines.push(`Lie factor under each reading (Tufte: size of the effect shown ÷ size of the effect in the data; 1.00 is faithful, ${report.limits.low.toFixed(2)}–${report.limits.high.toFixed(2)} acceptable)`);
  const rows: string[][] = [['reading', 'worst lie factor', 'worst pair', 'spread', 'verdict']];
  for (const name of READING_NAMES) {
    const r = report.readings[name];
    const tag = name === report.suggested ? ' (suggested)' : name === 'volume' && report.volumeReadable ? ' (looks solid)' : '';
    const reading = name === 'length' && r.dimension ? `length (${r.dimension})` : name;
    if (!r.available) {
      rows.push([reading + tag, 'n/a', '', '', 'not judged']);
      continue;
    }
    const pair = r.lieFactor.worstPair ? `${r.lieFactor.worstPair.mark} vs ${r.lieFactor.worstPair.reference}` : '';
    rows.push([reading + tag, formatFactor(r.lieFactor.worst), pair, r.spread === null ? 'n/a' : formatFactor(r.spread), r.verdict]);
  }
  lines.push(...table(rows));
  const countReading = report.readings.count;
  if (!countReading.available && countReading.unavailableReason) lines.push(`  count: ${countReading.unavailableReason}`);
  // Each worst figure written out, so a reader can redo the division (Tufte's effect form, p. 57).
  const formulas: string[] = [];
  for (const name of READING_NAMES) {
    const r = report.readings[name];
    if (!r.available || !r.lieFactor.worstPair) continue;
    const worst = r.lieFactor.worstPair;
    const pair = r.lieFactor.pairs.find((p) => p.mark === worst.mark && p.reference === worst.reference);
    const formula = pair ? lieFactorFormula(pair) : null;
    if (formula) formulas.push(`    ${name}: ${formula}`);
  }
  if (formulas.length) lines.push('  Worst pair written out, (drawn ratio − 1) ÷ (value ratio − 1), each ratio against the smallest value:', ...formulas);
  lines.push('');
  lines.push('The data and the marks');
  const sq = SQUARE[report.unit] ?? 'units²';
  const markRows: string[][] = [['mark', 'value', 'value from', 'width', 'height', `box area (${sq})`, `ink area (${sq})`, 'count']];
  for (const m of report.marks) {
    const from = m.valueFrom === 'label' ? `label "${(m.labelText ?? '').slice(0, 24)}"` : m.valueFrom === 'file' ? 'the file' : 'you';
    markRows.push([m.id, formatMeasure(m.value), from, formatMeasure(m.widthUnits), formatMeasure(m.heightUnits), formatMeasure(m.bboxAreaUnits2), formatMeasure(m.inkAreaUnits2), m.count === null ? '-' : formatMeasure(m.count)]);
  }
  lines.push(...table(markRows));
  const measuredRows: string[][] = [['mark', ...READING_NAMES.map((r) => r as string)]];
  report.marks.forEach((m, i) => {
    measuredRows.push([m.id, ...READING_NAMES.map((r: ReadingName) => formatMeasure(report.readings[r].measured[i]))]);
  });
  lines.push('  Measured under each reading (length in units, area in units², volume as width² × height, count in pictures):');
  lines.push(...table(measuredRows).map((l) => '  ' + l));
  if (report.pairings.length) {
    lines.push('');
    lines.push('Values read from labels (give --values to override)');
    for (const p of report.pairings) lines.push(`  "${p.text.slice(0, 40)}" → ${p.mark} (value ${formatMeasure(p.value)})`);
  }
  if (report.setAside.length) {
    lines.push('');
    lines.push('Not counted as marks');
    for (const s of report.setAside) lines.push(`  ${s.description}`);
  }
  if (report.warnings.length) {
    lines.push('');
    lines.push('Warnings');
    for (const w of report.warnings) lines.push(`  ${w.message}`);
  }
  lines.push('');
  lines.push('What to do');
  for (const a of advice(report)) lines.push(`  ${a}`);
  return lines.join('\n') + '\n';
}
