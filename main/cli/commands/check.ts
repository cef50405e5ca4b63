// `tallyglyph check chart.json`: every integrity finding for a chart document, from the lie factor measured on
// the file it would write to the rules about units, scale, context and labelling; nothing is written.
import fs from 'node:fs/promises';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { parseChart } from '../../../shared-core/document/index';
import { isTallyError, TallyError } from '../../../shared-core/errors';
import { listChecks, verifySvg, type CheckListing, type IntegrityFinding } from '../../../shared-core/integrity/index';
import { checkChart, measureDataInk, type DataInkMeasure, type DismissedResult, type RuleReport } from '../../../shared-core/integrity/rules/index';
import { layoutChart } from '../../../shared-core/layout/index';
import { DEFAULT_XML_LIMITS, writeSvg } from '../../../shared-core/svg/index';
import { countsText, dismissedText, findingText } from '../findingsText';
import { EXIT, type CliCommand, type CliIO } from '../types';

const USAGE = `Usage: tallyglyph check <chart.json> [--json] [--strict]
       tallyglyph check --list [--json]

Lays out the chart, measures the SVG it would write (Tufte's lie factor, allowed 0.95-1.05) and runs the
rules beyond the lie factor: money not adjusted for prices, totals of groups of different size, mixed
units, one scale, uneven time steps, too little context, unit and source stated, rounding, mixed glyphs,
solid-looking glyphs, data-ink share. Prints each finding with its fix; writes nothing.
Exit status: 0 nothing blocks export, 1 a finding blocks export (with --strict: any open warning too),
2 the document could not be read.

Options:
  --json     print { ok, file, lieFactor, ink, findings, dismissed } as JSON
  --strict   treat open warnings like blocking findings for the exit status
  --list     print every check of the written file and every chart rule (code, severity, name) and exit;
             with --json, { checks: [{ code, name, severity, registry, category, basis }] }
`;

/** Largest chart document read; far above any real chart, and the same order as the XML reader's limit. */
const MAX_BYTES = 20_000_000;

export interface ChartCheck {
  findings: IntegrityFinding[];
  dismissed: DismissedResult[];
  lieFactor: { worst: number | null; pass: boolean };
  /** Ink of data marks, reading aids and decoration, measured from the laid-out geometry. */
  ink: DataInkMeasure;
}

/** Every finding for a chart document: verification of the file it would write, then the rules. */
export function checkDocument(doc: unknown): ChartCheck {
  const spec = parseChart(doc);
  const scene = layoutChart(spec);
  const written = writeSvg(scene, { useReferences: spec.useReferences, outlineText: spec.outlineText });
  if (written.length > DEFAULT_XML_LIMITS.maxChars) {
    throw new TallyError('data-invalid', `The chart would be a ${(written.length / 1e6).toFixed(0)} MB file, more than Tallyglyph can verify; use fewer categories or a larger unit.`);
  }
  const report = verifySvg(written, { rounding: spec.encoding.rounding });
  const rules = checkChart(spec, scene);
  return { findings: [...report.findings, ...rules.findings], dismissed: rules.dismissed, lieFactor: { worst: report.lieFactor.worst, pass: report.pass }, ink: measureDataInk(scene) };
}

/** The rule findings alone (no verification), for commands that verify on their own, such as render. */
export function ruleReportOf(doc: unknown): RuleReport {
  const spec = parseChart(doc);
  return checkChart(spec, layoutChart(spec));
}

async function readDocument(file: string, shown: string): Promise<string> {
  try {
    const stat = await fs.stat(file);
    if (stat.isDirectory()) throw Object.assign(new Error('is a folder'), { code: 'EISDIR' });
    if (stat.size > MAX_BYTES) throw new TallyError('io-error', `"${shown}" is ${stat.size} bytes, more than the ${MAX_BYTES}-byte limit for a chart document.`);
    return await fs.readFile(file, 'utf8');
  } catch (e) {
    if (isTallyError(e)) throw e;
    const code = (e as NodeJS.ErrnoException).code;
    const why = code === 'ENOENT' ? 'there is no such file' : code === 'EISDIR' ? 'it is a folder' : code === 'EACCES' ? 'permission was denied' : (e as Error).message;
    throw new TallyError('io-error', `Could not read "${shown}": ${why}.`);
  }
}

/** The data-ink line: each kind of ink as a share of all ink, whole percent. */
function inkText(ink: DataInkMeasure): string {
  const total = ink.dataMm2 + ink.readingAidMm2 + ink.decorationMm2;
  if (!(total > 0)) return 'Ink: nothing is drawn.';
  const pct = (x: number) => `${Math.round((x / total) * 100)}%`;
  return `Ink: data marks ${pct(ink.dataMm2)}, reading aids ${pct(ink.readingAidMm2)}, decoration ${pct(ink.decorationMm2)} (${total.toFixed(0)} mm² in all).`;
}

/** The registries as a table: checks of the written file, then the chart rules, in the order they run. */
export function checksListText(checks: readonly CheckListing[] = listChecks()): string {
  const codeWidth = Math.max(...checks.map((c) => c.code.length));
  const row = (c: CheckListing) => `  ${c.code.padEnd(codeWidth)}  ${c.severity.padEnd(8)}  ${(c.category ?? 'rule').padEnd(11)}  ${c.name}`;
  const file = checks.filter((c) => c.registry === 'file');
  const rules = checks.filter((c) => c.registry === 'rule');
  return [
    `Checks of the written file (${file.length}; verify, render and export run them; blocking findings stop an export, preflight only warns):`,
    ...file.map(row),
    '',
    `Chart rules (${rules.length}; check and render run them on the document; each can be dismissed with a reason):`,
    ...rules.map(row),
    '',
    'Codes, triggers and fixes: docs/integrity-rules.md',
  ].join('\n');
}

function usageError(io: CliIO, message: string): number {
  io.stderr(`tallyglyph check: ${message}\n${USAGE}`);
  return EXIT.usage;
}

async function run(argv: string[], io: CliIO): Promise<number> {
  let parsed;
  try {
    parsed = parseArgs({
      args: argv,
      options: { json: { type: 'boolean', default: false }, strict: { type: 'boolean', default: false }, list: { type: 'boolean', default: false } },
      allowPositionals: true,
      strict: true,
    });
  } catch (e) {
    return usageError(io, (e as Error).message);
  }
  const { values, positionals } = parsed;
  if (values.list) {
    if (positionals.length || values.strict) return usageError(io, '--list takes no chart document and no --strict.');
    io.stdout((values.json ? JSON.stringify({ checks: listChecks() }, null, 2) : checksListText()) + '\n');
    return EXIT.ok;
  }
  if (positionals.length !== 1) return usageError(io, positionals.length ? 'give exactly one chart document.' : 'which chart document? Give a .json file.');
  const shown = positionals[0];
  let result: ChartCheck;
  try {
    result = checkDocument(await readDocument(path.resolve(io.cwd, shown), shown));
  } catch (e) {
    if (!isTallyError(e)) throw e;
    io.stderr(`tallyglyph check: ${e.code === 'io-error' ? '' : `${shown}: `}${e.message}\n`);
    if (values.json) io.stdout(JSON.stringify({ ok: false, file: shown, error: { code: e.code, message: e.message, details: e.details ?? null } }, null, 2) + '\n');
    return EXIT.usage;
  }
  const blocking = result.findings.filter((f) => f.severity === 'blocking' || (values.strict && f.severity === 'warning'));
  const ok = blocking.length === 0;
  if (values.json) {
    io.stdout(JSON.stringify({ ok, file: shown, lieFactor: result.lieFactor, ink: result.ink, findings: result.findings, dismissed: result.dismissed }, null, 2) + '\n');
  } else {
    const worst = result.lieFactor.worst === null ? 'not defined' : result.lieFactor.worst.toFixed(4);
    const lines = [`${shown}: ${countsText(result.findings)}; worst lie factor ${worst} (allowed 0.95-1.05).`, inkText(result.ink)];
    for (const f of result.findings) lines.push(findingText(f));
    lines.push(...dismissedText(result.dismissed));
    lines.push(ok ? (result.findings.length ? 'Nothing blocks export; read the warnings above before publishing.' : 'No findings.') : `Export is blocked: fix the ${values.strict ? 'blocking findings and warnings' : 'blocking findings'} above.`);
    io.stdout(lines.join('\n') + '\n');
  }
  return ok ? EXIT.ok : EXIT.refused;
}

export const command: CliCommand = {
  name: 'check',
  summary: 'List every integrity finding for a chart document, with fixes; writes nothing.',
  usage: USAGE,
  run,
};
