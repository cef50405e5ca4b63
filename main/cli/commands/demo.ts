// `tallyglyph demo -o dir/`: the built-in invented demo in every mode, as SVG and PNG, every file verified.
import fs from 'node:fs/promises';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { DEMO_CHARTS } from '../../../shared-core/demo/demoCharts';
import { isTallyError, TallyError } from '../../../shared-core/errors';
import { verifySvg } from '../../../shared-core/integrity/index';
import { renderChart } from '../../../shared-core/pipeline/index';
import { DEFAULT_PPI, exportFromRender, parsePpi } from '../../export/index';
import { writeFileAtomic } from '../../io/atomicWrite';
import { ppiToPpm, readPhysChunk } from '../../raster/index';
import { EXIT, type CliCommand, type CliIO } from '../types';

const USAGE = `Usage: tallyglyph demo -o <folder> [--ppi 300]

Writes the built-in demo (an invented town's figures) in every mode - repeat, stack, scale, fill and a
parts-of-whole icon array - as SVG and PNG into <folder>, verifying each file before and after writing.

Options:
  -o, --output <folder>  folder to write into (created if missing)
      --ppi <n>          PNG resolution in pixels per inch (default 300)
`;

function usageError(io: CliIO, message: string): number {
  io.stderr(`tallyglyph demo: ${message}\n${USAGE}`);
  return EXIT.usage;
}

/** Reads a written SVG back and verifies it from the disk copy, so what passed is what is on disk. */
async function reverifySvg(file: string): Promise<number | null> {
  const report = verifySvg(await fs.readFile(file, 'utf8'));
  if (!report.pass) throw new TallyError('gate-refused', `${path.basename(file)} failed when read back: ${report.reason}`);
  return report.lieFactor.worst;
}

async function recheckPng(file: string, ppi: number): Promise<void> {
  const phys = readPhysChunk(await fs.readFile(file));
  const ppm = ppiToPpm(ppi);
  if (!phys || phys.unit !== 1 || phys.ppmX !== ppm || phys.ppmY !== ppm) {
    throw new TallyError('raster-invalid', `${path.basename(file)} does not record ${ppi} ppi when read back.`);
  }
}

function lf(n: number | null): string {
  return n === null ? 'n/a' : n.toFixed(4);
}

async function run(argv: string[], io: CliIO): Promise<number> {
  let parsed;
  try {
    parsed = parseArgs({ args: argv, options: { output: { type: 'string', short: 'o' }, ppi: { type: 'string' } }, allowPositionals: false, strict: true });
  } catch (e) {
    return usageError(io, (e as Error).message);
  }
  const { values } = parsed;
  if (!values.output) return usageError(io, 'where to? Give -o <folder>.');
  let ppi: number;
  try {
    ppi = parsePpi(values.ppi) ?? DEFAULT_PPI;
  } catch (e) {
    return usageError(io, (e as Error).message);
  }
  const dir = path.resolve(io.cwd, values.output);
  try {
    await fs.mkdir(dir, { recursive: true });
  } catch (e) {
    io.stderr(`tallyglyph demo: could not create the folder "${values.output}": ${(e as Error).message}\n`);
    return EXIT.usage;
  }

  const total = DEMO_CHARTS.length;
  let failures = 0;
  for (const [i, chart] of DEMO_CHARTS.entries()) {
    const step = `[${i + 1}/${total}]`;
    try {
      const rendered = renderChart(chart.document);
      const svgFile = path.join(dir, `${chart.name}.svg`);
      const svg = exportFromRender(rendered, 'svg');
      await writeFileAtomic(svgFile, svg.bytes);
      const onDisk = await reverifySvg(svgFile);
      io.stdout(`${step} ${chart.name}.svg  ${chart.description}; verified from the file: worst lie factor ${lf(onDisk)}\n`);

      const png = exportFromRender(rendered, 'png', { ppi });
      const pngFile = path.join(dir, `${chart.name}.png`);
      await writeFileAtomic(pngFile, png.bytes);
      await recheckPng(pngFile, ppi);
      const size = png.png ? `${png.png.widthPx} x ${png.png.heightPx} px` : '';
      io.stdout(`${step} ${chart.name}.png  ${size} at ${ppi} ppi; lie factor from pixels ${lf(png.raster?.lieFactor.worst ?? null)}\n`);
      for (const w of png.warnings) io.stderr(`${step} warning: ${w.message}\n`);
    } catch (e) {
      if (!isTallyError(e)) throw e;
      failures += 1;
      io.stderr(`${step} ${chart.name}: ${e.message}\n`);
    }
  }
  if (failures) {
    io.stderr(`tallyglyph demo: ${failures} of ${total} charts were refused; a refused file was not written (see above).\n`);
    return EXIT.refused;
  }
  io.stdout(`Wrote ${total * 2} verified files to ${values.output}.\n`);
  return EXIT.ok;
}

export const command: CliCommand = {
  name: 'demo',
  summary: 'Write the built-in demo in every mode as verified SVG and PNG.',
  usage: USAGE,
  run,
};
