// `tallyglyph glyph <file.svg | bundled-name>`: a glyph's ink area, box, ink share of the box, warnings.
import { readFileSync, statSync } from 'node:fs';
import { resolve } from 'node:path';
import { parseArgs } from 'node:util';
import { TallyError } from '../../../shared-core/errors';
import { measureGlyph } from '../../../shared-core/glyph';
import { EXIT, type CliCommand } from '../types';

const MAX_GLYPH_FILE_BYTES = 20 * 1024 * 1024;

export const command: CliCommand = {
  name: 'glyph',
  summary: 'Measure a glyph: ink area, bounding box, ink share of the box, warnings.',
  usage: [
    'Usage: tallyglyph glyph <file.svg | bundled glyph name> [--json]',
    '',
    'Reports the glyph\'s ink (the union of everything it paints, in its viewBox units),',
    'its ink bounding box, the share of that box the ink fills, and anything that could',
    'not be measured. --json prints the same as one JSON object.',
  ].join('\n'),
  async run(argv, io) {
    const { values, positionals } = parseArgs({ args: argv, options: { json: { type: 'boolean', default: false } }, allowPositionals: true });
    if (positionals.length !== 1) {
      io.stderr(this.usage + '\n');
      return EXIT.usage;
    }
    const { svg, source } = await readGlyphSource(positionals[0], io.cwd);
    const ink = measureGlyph(svg);
    const out = {
      source,
      inkArea: ink.areaUnits2,
      bbox: ink.bbox,
      boxFraction: ink.boxFraction,
      centroid: ink.centroid,
      viewBox: ink.viewBox,
      shapes: ink.shapeCount,
      warnings: ink.warnings,
    };
    if (values.json) {
      io.stdout(JSON.stringify(out, null, 2) + '\n');
      return EXIT.ok;
    }
    const r = (n: number, d = 4) => Number(n.toFixed(d)).toString();
    io.stdout(
      [
        `glyph      ${source}`,
        `ink area   ${r(ink.areaUnits2)} units²`,
        `ink box    x ${r(ink.bbox.x)}, y ${r(ink.bbox.y)}, ${r(ink.bbox.width)} × ${r(ink.bbox.height)} units`,
        `box filled ${(ink.boxFraction * 100).toFixed(2)}% (ink area ÷ ink box area)`,
        `shapes     ${ink.shapeCount}`,
        ...(ink.warnings.length ? ink.warnings.map((w) => `warning    ${w.message}`) : ['warnings   none']),
      ].join('\n') + '\n',
    );
    return EXIT.ok;
  },
};

async function readGlyphSource(arg: string, cwd: string): Promise<{ svg: string; source: string }> {
  const path = resolve(cwd, arg);
  let isFile: boolean;
  try {
    isFile = statSync(path).isFile();
  } catch {
    isFile = false;
  }
  if (isFile) {
    if (statSync(path).size > MAX_GLYPH_FILE_BYTES) throw new TallyError('svg-limit', `${arg} is larger than ${MAX_GLYPH_FILE_BYTES / 1024 / 1024} MB (file size limit).`);
    const bytes = readFileSync(path);
    let text: string;
    try {
      text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
    } catch {
      throw new TallyError('svg-malformed', `${arg} is not UTF-8 text.`);
    }
    return { svg: text, source: arg };
  }
  if (/[/\\]|\.svg$/i.test(arg)) throw new TallyError('io-error', `Cannot read ${arg}: no such file.`);
  // Not a file: a bundled glyph name.
  const { getGlyph } = await import('../../../shared-core/glyph/catalog');
  const entry = getGlyph(arg);
  return { svg: entry.svg, source: `${arg} (bundled)` };
}
