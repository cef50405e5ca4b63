// `tallyglyph verify file.svg`: re-measure a chart SVG from the file alone and print its lie factors and verdict.
import fs from 'node:fs/promises';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { isTallyError } from '../../../shared-core/errors';
import { verifySvg, type VerifyReport } from '../../../shared-core/integrity/index';
import { EXIT, type CliCommand, type CliIO } from '../types';

const USAGE = `Usage: tallyglyph verify <file.svg> [--json]

Re-measures every mark of a chart SVG written by Tallyglyph from the file itself and prints Tufte's
lie factor for each category against the smallest one, the worst pair and the verdict (0.95-1.05).
Exit status: 0 passes, 1 fails, 2 the file could not be read or is not a Tallyglyph chart.

Options:
  --json   print the report as JSON (pass, lieFactor, spread, marks, reason, suggestions, preflight)
`;

/** Largest SVG read: far above any chart Tallyglyph writes, and the XML reader's own limit. */
const MAX_BYTES = 20_000_000;

function usageError(io: CliIO, message: string): number {
  io.stderr(`tallyglyph verify: ${message}\n${USAGE}`);
  return EXIT.usage;
}

function fixed(n: number | null): string {
  return n === null ? 'n/a' : n.toFixed(4);
}

function measuredText(m: VerifyReport['marks'][number]): string {
  switch (m.graphicUnit) {
    case 'glyphs':
      return `${m.graphic.toFixed(4)} glyphs`;
    case 'mm':
      return `${m.graphic.toFixed(3)} mm (${(m.glyphs ?? 0).toFixed(4)} glyphs x ${(m.pitchMm ?? 0).toFixed(3)} mm)`;
    case 'mm2':
      return `${m.graphic.toFixed(3)} mm² of ink`;
    default:
      return `${(m.graphic * 100).toFixed(2)}% of its glyph's ink filled`;
  }
}

/** A ratio for the formula: 4 decimals, trailing zeros dropped. */
function ratioText(v: number): string {
  return String(Number(v.toFixed(4)));
}

/**
 * The lie factor written out the way it is computed, so a reader can redo it: Tufte's effect form
 * (1983, p. 57), (drawn ratio − 1) ÷ (value ratio − 1), or the ratio form for values within 2%.
 */
function formulaText(p: VerifyReport['lieFactor']['pairs'][number]): string {
  if (p.problem || p.lieFactor === null || p.graphicRatio === null || p.graphicRatio === undefined) return '';
  return p.basis === 'ratio' ? ` = ${ratioText(p.graphicRatio)} ÷ ${ratioText(p.dataRatio)}` : ` = (${ratioText(p.graphicRatio)} − 1) ÷ (${ratioText(p.dataRatio)} − 1)`;
}

/** The report as a designer reads it: what was measured, each lie factor, the verdict and what to do. */
export function reportText(name: string, r: VerifyReport): string {
  const lines: string[] = [];
  lines.push(`${name}: ${r.marks.length} marks, read by ${r.reading} (mode ${r.mode})`);
  const width = Math.min(28, Math.max(...r.marks.map((m) => m.label.length)));
  for (const m of r.marks) lines.push(`  ${m.label.padEnd(width)}  value ${String(m.value).padStart(10)}  drawn ${measuredText(m)}`);
  if (r.lieFactor.pairs.length) {
    lines.push(`Lie factor against "${r.lieFactor.pairs[0].reference}" (the smallest value), (drawn ratio − 1) ÷ (value ratio − 1):`);
    for (const p of r.lieFactor.pairs) {
      const note = p.problem ? `  (${p.problem})` : p.basis === 'ratio' ? '  (ratio basis)' : '';
      lines.push(`  ${p.label.padEnd(width)}  ${fixed(p.lieFactor)}${formulaText(p)}${note}`);
    }
  }
  const worst = r.lieFactor.worstPair ? ` (${r.lieFactor.worstPair.label} against ${r.lieFactor.worstPair.reference})` : '';
  lines.push(`Worst lie factor ${fixed(r.lieFactor.worst)}${worst}; spread ${fixed(r.spread)}; allowed ${r.limits.low}-${r.limits.high}.`);
  for (const n of r.notes) lines.push(`Note: ${n}`);
  if (r.pass) lines.push('PASS: every mark shows its value faithfully.');
  else {
    lines.push(`FAIL: ${r.reason}`);
    for (const p of r.problems.slice(1)) lines.push(`  also: ${p}`);
    for (const s of r.suggestions) lines.push(`  try: ${s}`);
  }
  for (const f of r.preflight) lines.push(`Preflight (${f.basis}): ${f.message}`);
  for (const w of r.warnings) lines.push(`Warning: ${w.message}`);
  return lines.join('\n') + '\n';
}

async function run(argv: string[], io: CliIO): Promise<number> {
  let parsed;
  try {
    parsed = parseArgs({ args: argv, options: { json: { type: 'boolean', default: false } }, allowPositionals: true, strict: true });
  } catch (e) {
    return usageError(io, (e as Error).message);
  }
  const { values, positionals } = parsed;
  if (positionals.length !== 1) return usageError(io, positionals.length ? 'give exactly one SVG file.' : 'which file? Give a chart .svg.');
  const file = path.resolve(io.cwd, positionals[0]);
  const shown = positionals[0];
  let text: string;
  try {
    const stat = await fs.stat(file);
    if (stat.isDirectory()) throw Object.assign(new Error('is a folder'), { code: 'EISDIR' });
    if (stat.size > MAX_BYTES) {
      io.stderr(`tallyglyph verify: "${shown}" is ${stat.size} bytes, more than the ${MAX_BYTES}-byte limit.\n`);
      return EXIT.usage;
    }
    text = await fs.readFile(file, 'utf8');
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    const why = code === 'ENOENT' ? 'there is no such file' : code === 'EISDIR' ? 'it is a folder' : code === 'EACCES' ? 'permission was denied' : (e as Error).message;
    io.stderr(`tallyglyph verify: could not read "${shown}": ${why}.\n`);
    return EXIT.usage;
  }
  let report: VerifyReport;
  try {
    report = verifySvg(text);
  } catch (e) {
    if (!isTallyError(e)) throw e;
    io.stderr(`tallyglyph verify: ${shown}: ${e.message}\n`);
    if (values.json) io.stdout(JSON.stringify({ pass: false, error: { code: e.code, message: e.message } }, null, 2) + '\n');
    return EXIT.usage;
  }
  if (values.json) io.stdout(JSON.stringify(report, null, 2) + '\n');
  else io.stdout(reportText(shown, report));
  if (!report.pass) {
    if (values.json) io.stderr(`tallyglyph verify: ${shown}: ${report.reason}\n`);
    return EXIT.refused;
  }
  return EXIT.ok;
}

export const command: CliCommand = {
  name: 'verify',
  summary: 'Re-measure a chart SVG from the file alone: lie factors and verdict.',
  usage: USAGE,
  run,
};
