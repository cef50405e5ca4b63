// `tallyglyph correct`: rescale each mark of a supplied SVG so the reading its geometry suggests becomes honest.
import path from 'node:path';
import { parseArgs } from 'node:util';
import { correctSvg } from '../../../shared-core/audit/correctSvg';
import { formatFactor, formatRatio } from '../../../shared-core/audit/formatNumbers';
import { TallyError } from '../../../shared-core/errors';
import { CORRECTION_OPTIONS, readCorrectionRequest, sameFile } from '../../audit/cliOptions';
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
      options: { ...CORRECTION_OPTIONS, json: { type: 'boolean' } },
    });
    if (positionals.length !== 1 || !values.output) {
      io.stderr(`tallyglyph correct: give one SVG file and an output file (-o fixed.svg).\n${usage}`);
      return EXIT.usage;
    }
    const input = path.resolve(io.cwd, positionals[0]);
    const output = path.resolve(io.cwd, values.output);
    if (sameFile(input, output)) throw new TallyError('usage', 'The output would overwrite the supplied file; choose another name so the original stays as it was.');
    const request = readCorrectionRequest(values, input, 'correct works on SVG files; an image mock-up cannot be rescaled in place. Audit it with `tallyglyph audit`.');
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

