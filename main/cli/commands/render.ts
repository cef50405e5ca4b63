// `tallyglyph render chart.json -o out.svg|out.png`: export a chart, written only after every check passes.
import fs from 'node:fs/promises';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { isTallyError, TallyError } from '../../../shared-core/errors';
import { exportChart, formatFromPath, parsePpi, type ExportResult } from '../../export/index';
import { EXIT, type CliCommand, type CliIO } from '../types';
import { ruleReportOf } from './check';
import { runPdf } from './renderPdf';

const USAGE = `Usage: tallyglyph render <chart.json> -o <out.svg|out.png|out.pdf> [--ppi 300] [--json]

Lays out the chart, re-measures the written file and writes it only if every lie factor lies within
0.95-1.05 (Tufte). A refused chart leaves any existing output file untouched. Findings of the rules
beyond the lie factor (see \`tallyglyph check\`) are printed as warnings and advice; they do not stop the export.
A PDF is vector, at the page size with bleed, and is checked again from poppler's pixels (pdftoppm);
it is sRGB, not CMYK.

Options:
  -o, --output <file>  where to write; .svg, .png or .pdf
      --ppi <n>        PNG resolution in pixels per inch (default 300); for a PDF, the resolution
                       of poppler's pixel check
      --json           print the full verification report as JSON on stdout
      --allow-all-zero write a chart whose values are all zero (it compares nothing,
                       so it is refused without this flag or "allowAllZero": true)
`;

/** A number as the report prints it: four decimals, enough that a failing factor never reads as passing. */
function fixed(n: number): string {
  return n.toFixed(4);
}

function usageError(io: CliIO, message: string): number {
  io.stderr(`tallyglyph render: ${message}\n${USAGE}`);
  return EXIT.usage;
}

async function readTextFile(file: string): Promise<string> {
  try {
    return await fs.readFile(file, 'utf8');
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    const why = code === 'ENOENT' ? 'there is no such file' : code === 'EISDIR' ? 'it is a folder' : code === 'EACCES' ? 'permission was denied' : (e as Error).message;
    throw new TallyError('io-error', `Could not read "${path.basename(file)}": ${why}.`);
  }
}

/** The refusal in one line: the reason, and for a gate refusal the first suggested fix is already in it. */
function describeFailure(e: TallyError): string {
  return e.message.replace(/\s*\n\s*/g, ' ');
}

function successText(result: ExportResult, shownPath: string): string {
  const r = result.report;
  const worst = r.lieFactor.worst === null ? 'not defined (nothing to compare)' : fixed(r.lieFactor.worst);
  let line = `Wrote ${shownPath}: ${r.marks.length} marks read by ${r.reading}, worst lie factor ${worst} (allowed ${r.limits.low}-${r.limits.high}).`;
  if (result.png && result.raster) {
    const raster = result.raster.lieFactor.worst === null ? 'not defined' : fixed(result.raster.lieFactor.worst);
    line += ` PNG ${result.png.widthPx} x ${result.png.heightPx} px at ${result.png.ppi} ppi, lie factor from pixels ${raster}.`;
  }
  return line + '\n';
}

async function run(argv: string[], io: CliIO): Promise<number> {
  let parsed;
  try {
    parsed = parseArgs({
      args: argv,
      options: { output: { type: 'string', short: 'o' }, ppi: { type: 'string' }, json: { type: 'boolean', default: false }, 'allow-all-zero': { type: 'boolean', default: false } },
      allowPositionals: true,
      strict: true,
    });
  } catch (e) {
    return usageError(io, (e as Error).message);
  }
  const { values, positionals } = parsed;
  const json = values.json === true;
  if (positionals.length !== 1) return usageError(io, positionals.length ? 'give exactly one chart document.' : 'which chart document? Give a .json file.');
  if (!values.output) return usageError(io, 'where to? Give -o out.svg or -o out.png.');
  const input = path.resolve(io.cwd, positionals[0]);
  const output = path.resolve(io.cwd, values.output);
  if (!/\.(svg|png|pdf)$/i.test(output)) return usageError(io, `Cannot tell the format of "${path.basename(output)}": name the output file .svg, .png or .pdf.`);
  if (path.extname(output).toLowerCase() === '.pdf') return runPdf(input, output, values.output, values.ppi, json, io);
  let ppi: number | undefined;
  try {
    const format = formatFromPath(output);
    ppi = parsePpi(values.ppi);
    if (ppi !== undefined && format === 'svg') io.stderr('tallyglyph render: note: --ppi applies to PNG files only; the SVG is resolution-free.\n');
  } catch (e) {
    return usageError(io, (e as Error).message);
  }

  let text: string;
  try {
    text = await readTextFile(input);
  } catch (e) {
    io.stderr(`tallyglyph render: ${(e as Error).message}\n`);
    if (json) io.stdout(JSON.stringify({ ok: false, error: { code: 'io-error', message: (e as Error).message } }, null, 2) + '\n');
    return EXIT.usage;
  }
  try {
    const result = await exportChart(text, output, { ...(ppi !== undefined ? { ppi } : {}), ...(values['allow-all-zero'] ? { allowAllZero: true } : {}) });
    // The chart passed the gate; the rules beyond the lie factor travel with it as warnings and advice.
    const rules = ruleReportOf(text);
    if (json) {
      io.stdout(JSON.stringify({ ok: true, path: output, format: result.format, report: result.report, raster: result.raster ?? null, png: result.png ?? null, warnings: result.warnings, findings: rules.findings, dismissed: rules.dismissed }, null, 2) + '\n');
    } else {
      io.stdout(successText(result, values.output));
      for (const w of result.warnings) io.stderr(`tallyglyph render: warning: ${w.message}\n`);
      for (const f of rules.findings) io.stderr(`tallyglyph render: ${f.severity} ${f.code}: ${f.message} Fix: ${f.fix}\n`);
    }
    return EXIT.ok;
  } catch (e) {
    if (!isTallyError(e)) throw e;
    io.stderr(`tallyglyph render: ${describeFailure(e)}\n`);
    if (json) {
      const d = e.details as { pass?: unknown; report?: unknown; raster?: unknown } | undefined;
      let report: unknown = null;
      let raster: unknown = null;
      let details: unknown;
      if (e.code === 'gate-refused' && d && typeof d === 'object') {
        if ('pass' in d) report = d;
        else {
          report = d.report ?? null;
          raster = d.raster ?? null;
        }
      } else details = d;
      io.stdout(JSON.stringify({ ok: false, error: { code: e.code, message: e.message }, report, raster, details }, null, 2) + '\n');
    }
    // A refused or invalid chart was not written; whatever was at the output path is untouched.
    return e.code === 'gate-refused' ? EXIT.refused : EXIT.usage;
  }
}

export const command: CliCommand = {
  name: 'render',
  summary: 'Lay out a chart document and write a verified SVG or PNG.',
  usage: USAGE,
  run,
};
