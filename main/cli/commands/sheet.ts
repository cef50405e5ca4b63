// `tallyglyph sheet`: the supplied SVG and its correction side by side, each with its lie factor, a
// one-line explanation and the data, written as SVG or PNG (resolution recorded, as export does).
import path from 'node:path';
import { parseArgs } from 'node:util';
import { buildSheet } from '../../../shared-core/audit/buildSheet';
import { correctSvg } from '../../../shared-core/audit/correctSvg';
import { formatFactor } from '../../../shared-core/audit/formatNumbers';
import { TallyError } from '../../../shared-core/errors';
import { CORRECTION_OPTIONS, readCorrectionRequest, sameFile } from '../../audit/cliOptions';
import { DEFAULT_PPI, formatFromPath, parsePpi } from '../../export/exportChart';
import { writeFileAtomicSync } from '../../io/atomicWrite';
import { ppiToPpm, rasterizeSvg, readPhysChunk } from '../../raster/index';
import { EXIT, type CliCommand } from '../types';

const usage = `Usage: tallyglyph sheet <file.svg> --values <list> -o <sheet.svg|sheet.png> [options]

Puts the supplied drawing and its correction (see \`tallyglyph correct\`) side by side, each with its
lie factor, a one-line explanation and the data: a page to send to a client.

Options:
  --values <list>    the data, in mark order (18,27.5) or by mark id (mark-a=18,mark-b=27.5)
  --marks <ids>      the ids of the elements that are the marks, in value order
  --reading <name>   area, length or volume (default: the one the geometry suggests)
  --anchor <where>   the point each mark is rescaled about (default bottom-centre)
  --title <text>     a heading for the sheet
  --ppi <n>          PNG resolution (default ${DEFAULT_PPI})
  -o, --output <file>  sheet.svg or sheet.png
`;

export const command: CliCommand = {
  name: 'sheet',
  summary: 'Write the supplied SVG and its correction side by side, with lie factors and the data.',
  usage,
  async run(argv, io) {
    const { values, positionals } = parseArgs({
      args: argv,
      allowPositionals: true,
      options: { ...CORRECTION_OPTIONS, title: { type: 'string' }, ppi: { type: 'string' } },
    });
    if (positionals.length !== 1 || !values.output) {
      io.stderr(`tallyglyph sheet: give one SVG file and an output file (-o sheet.svg or sheet.png).\n${usage}`);
      return EXIT.usage;
    }
    const ppi = parsePpi(values.ppi) ?? DEFAULT_PPI;
    const input = path.resolve(io.cwd, positionals[0]);
    const output = path.resolve(io.cwd, values.output);
    const format = formatFromPath(output);
    if (sameFile(input, output)) throw new TallyError('usage', 'The output would overwrite the supplied file; choose another name so the original stays as it was.');
    const request = readCorrectionRequest(values, input, 'sheet works on SVG files; an image mock-up cannot be corrected in place.');
    const fixed = correctSvg(request.text, request.options);
    const sheet = buildSheet({ supplied: request.text, corrected: fixed.svg, before: fixed.before, after: fixed.after, reading: fixed.reading, title: values.title });
    let bytes: Uint8Array;
    if (format === 'svg') bytes = new TextEncoder().encode(sheet.svg);
    else {
      const image = rasterizeSvg(sheet.svg, { ppi, background: '#ffffff' });
      // As chart export does: a PNG that does not say its resolution is placed at the wrong size.
      const phys = readPhysChunk(image.png);
      if (!phys || phys.unit !== 1 || phys.ppmX !== ppiToPpm(ppi)) throw new TallyError('raster-invalid', `The PNG does not record its resolution of ${ppi} ppi; nothing was written.`);
      bytes = image.png;
    }
    writeFileAtomicSync(output, bytes);
    const r = fixed.reading;
    const lines = [
      `Sheet: supplied (${r} lie factor ${formatFactor(fixed.before.readings[r].lieFactor.worst)}) beside corrected (${formatFactor(fixed.after.readings[r].lieFactor.worst)}).`,
      ...[...fixed.warnings, ...sheet.warnings].map((w) => `Note: ${w.message}`),
      `Wrote ${values.output}.`,
    ];
    io.stdout(lines.join('\n') + '\n');
    return EXIT.ok;
  },
};
