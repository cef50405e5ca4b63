// `tallyglyph audit`: how honest is a supplied graphic? Lie factor under each reading, and which one applies.
import path from 'node:path';
import { parseArgs } from 'node:util';
import { formatAuditReport } from '../../../shared-core/audit/formatReport';
import { auditFile } from '../../audit/auditFile';
import { MARK_OPTIONS, parseIdList, parseLengths, parseNumberFlag, parseSeeds } from '../../audit/cliOptions';
import { EXIT, type CliCommand } from '../types';

const usage = `Usage: tallyglyph audit <file.svg|file.png|file.jpg> [options]

Measures every mark of a supplied graphic (width, height, box and ink area, repeated glyphs) and
reports Tufte's lie factor under each reading (length, area, volume, count), the reading the
drawing suggests, and why, in words a client can follow.

Options:
  --values <list>     the data: in mark order (18,27.5) or by mark id (mark-a=18,mark-b=27.5);
                      without it, numbers in text labels near the marks are used
  --marks <ids>       the ids of the elements that are the marks (SVG), in value order
  --seed <x,y>        a point inside a mark, in pixels (PNG/JPEG); repeat once per mark
  --length <x1,y1,x2,y2>  a mark's length given by two points; repeat once per mark (or id=...)
  --tolerance <0-254> colour difference from the background still read as background (images; default 24)
  --gap <px>          pieces this close belong to one picture (images)
  --solid             the drawing is 3-D: flag the volume reading
  --json              print the report as JSON

Exit status: 0 the suggested reading is faithful (lie factor within 0.95-1.05) or cannot be judged
(the report says why), 1 the graphic distorts the data under the suggested reading, 2 the file or
an option could not be used, 3 unexpected failure.
`;

export const command: CliCommand = {
  name: 'audit',
  summary: 'Audit a supplied SVG, PNG or JPEG: lie factor under each reading, and which reading applies.',
  usage,
  async run(argv, io) {
    const { values, positionals } = parseArgs({
      args: argv,
      allowPositionals: true,
      options: {
        ...MARK_OPTIONS,
        seed: { type: 'string', multiple: true },
        length: { type: 'string', multiple: true },
        tolerance: { type: 'string' },
        gap: { type: 'string' },
        solid: { type: 'boolean' },
        json: { type: 'boolean' },
      },
    });
    if (positionals.length !== 1) {
      io.stderr(`tallyglyph audit: give exactly one file to audit.\n${usage}`);
      return EXIT.usage;
    }
    const file = path.resolve(io.cwd, positionals[0]);
    const tolerance = parseNumberFlag(values.tolerance, '--tolerance');
    const gap = parseNumberFlag(values.gap, '--gap');
    const seeds = parseSeeds(values.seed);
    const { report } = auditFile(file, {
      values: values.values,
      markIds: parseIdList(values.marks),
      givenLengths: parseLengths(values.length),
      solid: values.solid,
      rasterMarks: { ...(tolerance !== undefined ? { tolerance } : {}), ...(gap !== undefined ? { mergeGapPx: gap } : {}), ...(seeds ? { seeds } : {}) },
    });
    if (values.json) io.stdout(JSON.stringify(report, null, 2) + '\n');
    else io.stdout(formatAuditReport(report, path.basename(file)));
    // Like verify: a distorted verdict is a failed check, so scripts and CI can stop on it.
    return report.verdict.pass === false ? EXIT.refused : EXIT.ok;
  },
};
