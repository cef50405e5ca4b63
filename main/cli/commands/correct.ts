// `tallyglyph correct`: rescale each mark of a supplied SVG so the reading its geometry suggests becomes honest.
import path from 'node:path';
import { parseArgs } from 'node:util';
import { auditSvg } from '../../../shared-core/audit/auditReport';
import { correctSvg } from '../../../shared-core/audit/correctSvg';
import { formatFactor, formatRatio } from '../../../shared-core/audit/formatNumbers';
import { shortenText } from '../../../shared-core/audit/shortenText';
import { TEXT_LIMITS } from '../../../shared-core/document/chartSchema';
import { TallyError } from '../../../shared-core/errors';
import { CORRECTION_OPTIONS, readCorrectionRequest, sameFile } from '../../audit/cliOptions';
import { exportChart } from '../../export/exportChart';
import { writeFileAtomicSync } from '../../io/atomicWrite';
import { EXIT, type CliCommand } from '../types';

const usage = `Usage: tallyglyph correct <file.svg> --values <list> -o <fixed.svg> [options]

Rescales each mark about an anchor so that the reading the drawing suggests (or --reading) becomes
honest, keeping the mark with the largest value at its size and every other part of the file as it
was. The corrected file is audited again and written only if it passes (lie factor 0.95-1.05).

Options:
  --values <list>    the data, in mark order (18,27.5) or by mark id (mark-a=18,mark-b=27.5);
                     without it, numbers in text labels near the marks are used
  --marks <ids>      the ids of the elements that are the marks, in value order
  --reading <name>   area, length or volume (default: the one the geometry suggests)
  --anchor <where>   the point that stays put: bottom-centre (default), centre, top-centre,
                     bottom-left, bottom-right, top-left, top-right, centre-left, centre-right
  -o, --output <file>  where to write the corrected SVG (never the supplied file itself)
  --rebuild <mode>   instead of rescaling, redraw the data as a Tallyglyph chart: repeat (rows of
                     unit glyphs) or stack (columns on one baseline); -o may then be .svg or .png
  --glyph <name>     the bundled glyph for --rebuild (default: square)
  --unit <amount>    what one glyph stands for with --rebuild (default: chosen for you)
  --unit-name <name> what is counted, for the legend ("barrels")
  --json             print the corrections and both audits as JSON
`;

export const command: CliCommand = {
  name: 'correct',
  summary: 'Rescale the marks of a supplied SVG so its suggested reading is honest, and write the result.',
  usage,
  async run(argv, io) {
    const { values, positionals } = parseArgs({
      args: argv,
      allowPositionals: true,
      options: { ...CORRECTION_OPTIONS, json: { type: 'boolean' }, rebuild: { type: 'string' }, glyph: { type: 'string' }, unit: { type: 'string' }, 'unit-name': { type: 'string' } },
    });
    if (positionals.length !== 1 || !values.output) {
      io.stderr(`tallyglyph correct: give one SVG file and an output file (-o fixed.svg).\n${usage}`);
      return EXIT.usage;
    }
    const input = path.resolve(io.cwd, positionals[0]);
    const output = path.resolve(io.cwd, values.output);
    if (sameFile(input, output)) throw new TallyError('usage', 'The output would overwrite the supplied file; choose another name so the original stays as it was.');
    const request = readCorrectionRequest(values, input, 'correct works on SVG files; an image mock-up cannot be rescaled in place. Audit it with `tallyglyph audit`.');
    if (values.rebuild !== undefined) return rebuildAsChart(request.text, request.options, values, output, io);
    const result = correctSvg(request.text, request.options);
    writeFileAtomicSync(output, result.svg);
    if (values.json) {
      io.stdout(JSON.stringify({ output, reading: result.reading, anchor: result.anchor, keptMark: result.keptMark, corrections: result.corrections, warnings: result.warnings, before: result.before, after: result.after }, null, 2) + '\n');
      return EXIT.ok;
    }
    const r = result.reading;
    const lines = [`Corrected ${result.corrections.length} marks for the ${r} reading, keeping ${result.keptMark} (the largest value) at its size; each mark was rescaled about its ${result.anchor.replace('-', ' ')}.`];
    for (const c of result.corrections) {
      if (c.mark === result.keptMark) continue;
      const how = c.scaleX === c.scaleY ? `×${formatRatio(c.scaleX)}` : c.scaleX !== 1 ? `×${formatRatio(c.scaleX)} in width` : `×${formatRatio(c.scaleY)} in height`;
      lines.push(`  ${c.mark} (value ${c.value}): ${how}`);
    }
    lines.push(`Worst ${r} lie factor: ${formatFactor(result.before.readings[r].lieFactor.worst)} before, ${formatFactor(result.after.readings[r].lieFactor.worst)} after (0.95-1.05 is faithful).`);
    for (const w of result.warnings) lines.push(`Note: ${w.message}`);
    lines.push(`Wrote ${values.output}.`);
    io.stdout(lines.join('\n') + '\n');
    return EXIT.ok;
  },
};


/**
 * The other honest answer to a distorted picture: the same data as repeated unit glyphs or stacks,
 * laid out, verified and written through the normal chart export (which refuses anything dishonest).
 */
function shortenedNote(shortened: readonly string[]): string {
  const which = shortened.length === 1 ? `1 label was` : `${shortened.length} labels were`;
  return `${which} longer than a chart label may be (${TEXT_LIMITS.label} characters) and shortened at a character boundary: ${shortened.join(', ')}. Give shorter names in the supplied file if these do not read well.`;
}

async function rebuildAsChart(
  text: string,
  options: Parameters<typeof auditSvg>[1],
  flags: { rebuild?: string; glyph?: string; unit?: string; 'unit-name'?: string; json?: boolean; output?: string },
  output: string,
  io: Parameters<CliCommand['run']>[1],
): Promise<number> {
  const mode = flags.rebuild;
  if (mode !== 'repeat' && mode !== 'stack') throw new TallyError('usage', `--rebuild takes repeat or stack, not "${mode}".`);
  const unit = flags.unit === undefined ? undefined : Number(flags.unit);
  if (unit !== undefined && !(unit > 0 && Number.isFinite(unit))) throw new TallyError('usage', `--unit must be a positive number, not "${flags.unit}".`);
  const report = auditSvg(text, options);
  const marks = report.marks.filter((m) => m.value !== null && m.value !== undefined);
  if (marks.length === 0) throw new TallyError('data-invalid', 'No mark has a value to rebuild from; give them with --values.');
  const rawTitle = /<title[^>]*>([^<]{1,200})<\/title>/i.exec(text)?.[1]?.trim();
  // XML's five predefined entities and numeric references; the safe reader refuses any other entity.
  const title = rawTitle
    ?.replace(/&#x([0-9a-f]+);/gi, (_m, h: string) => String.fromCodePoint(Math.min(0x10ffff, parseInt(h, 16))))
    .replace(/&#(\d+);/g, (_m, d: string) => String.fromCodePoint(Math.min(0x10ffff, Number(d))))
    .replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&quot;/g, '"').replace(/&apos;/g, "'").replace(/&amp;/g, '&');
  // A supplied label (or, without one, an element id) can run past a chart label's limit: shorten it, and say so.
  const labels = marks.map((m) => shortenText(m.label || m.id, TEXT_LIMITS.label));
  const shortened = labels.filter((l) => l.shortened).map((l) => `"${shortenText(l.text, 40).text}"`);
  const doc = {
    format: 'tallyglyph.chart/1',
    ...(title ? { title } : {}),
    source: 'Redrawn by Tallyglyph from a supplied graphic; values as given for the audit.',
    data: marks.map((m, i) => ({ label: labels[i].text, value: Number(m.value) })),
    encoding: { mode, glyph: flags.glyph ?? 'square', ...(unit !== undefined ? { unit } : {}), ...(flags['unit-name'] ? { unitName: flags['unit-name'] } : {}) },
    page: { width: 180, height: 120, unit: 'mm' },
  };
  const result = await exportChart(doc, output);
  const worst = result.report.lieFactor.worst;
  if (flags.json) {
    const warnings = shortened.length ? [{ code: 'label-shortened', message: shortenedNote(shortened) }] : [];
    io.stdout(JSON.stringify({ output, rebuilt: mode, document: doc, warnings, before: report.readings, lieFactor: result.report.lieFactor, pass: result.report.pass }, null, 2) + '\n');
    return EXIT.ok;
  }
  io.stdout(
    [
      `Rebuilt ${marks.length} values as a ${mode} chart of ${doc.encoding.glyph} glyphs; verified from the written file: worst lie factor ${worst === null ? 'n/a' : worst.toFixed(4)} (0.95-1.05 is faithful).`,
      `The supplied drawing read by ${report.suggested}: worst lie factor ${formatFactor(report.readings[report.suggested as 'area'].lieFactor.worst)}.`,
      ...(shortened.length ? [`Note: ${shortenedNote(shortened)}`] : []),
      `Wrote ${flags.output}.`,
    ].join('\n') + '\n',
  );
  return EXIT.ok;
}
