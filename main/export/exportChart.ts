// Export a chart document to SVG or PNG: everything is verified in memory first, and the file is written
// (atomically) only once every check has passed, so a refused chart never replaces a good file.
import path from 'node:path';
import { TallyError, type Warning } from '../../shared-core/errors';
import type { VerifyReport } from '../../shared-core/integrity/index';
import { renderChart, type RenderOptions, type RenderResult } from '../../shared-core/pipeline/index';
import { writeFileAtomic } from '../io/atomicWrite';
import { ppiToPpm, rasterizeSvg, readPhysChunk, readPngSize } from '../raster/index';
import { verifyRaster, type RasterCheck, type RasterCheckOptions } from './verifyRaster';

export type ExportFormat = 'svg' | 'png';

export interface ExportOptions extends RenderOptions {
  /** Default: from the output file's extension. */
  format?: ExportFormat;
  /** PNG resolution in pixels per inch; default 300 (common practice for print). */
  ppi?: number;
  raster?: Omit<RasterCheckOptions, 'ppi'>;
}

export interface BuiltExport {
  format: ExportFormat;
  /** The file's bytes (UTF-8 text for SVG). */
  bytes: Uint8Array;
  /** The verified SVG (also the source of a PNG). */
  svg: string;
  report: VerifyReport;
  /** PNG only: the pixel re-check. */
  raster?: RasterCheck;
  png?: { widthPx: number; heightPx: number; ppi: number };
  warnings: Warning[];
}

export interface ExportResult extends BuiltExport {
  path: string;
}

export const DEFAULT_PPI = 300;

/** The export format for a file name; refuses anything but .svg and .png. */
export function formatFromPath(file: string): ExportFormat {
  const ext = path.extname(file).toLowerCase();
  if (ext === '.svg') return 'svg';
  if (ext === '.png') return 'png';
  throw new TallyError('usage', `Cannot tell the format of "${path.basename(file)}": name the output file .svg or .png.`);
}

/** The --ppi flag of every command: a plain positive decimal number of pixels per inch, or nothing. */
export function parsePpi(text: string | undefined): number | undefined {
  if (text === undefined) return undefined;
  const ppi = Number(text);
  if (!/^\s*\d+(\.\d+)?\s*$/.test(text) || !(ppi > 0)) throw new TallyError('usage', `--ppi must be a positive number of pixels per inch, not "${text}".`);
  return ppi;
}

function checkPpi(ppi: number): number {
  if (typeof ppi !== 'number' || !Number.isFinite(ppi) || ppi <= 0) {
    throw new TallyError('usage', `The resolution must be a positive number of pixels per inch (got ${String(ppi)}).`);
  }
  return ppi;
}

/** Turns a rendered, verified chart into file bytes; a PNG is rasterised and re-verified from its pixels. */
export function exportFromRender(rendered: Pick<RenderResult, 'svg' | 'report' | 'warnings'>, format: ExportFormat, opts: Pick<ExportOptions, 'ppi' | 'raster'> = {}): BuiltExport {
  const { svg, report } = rendered;
  const warnings: Warning[] = [...rendered.warnings];
  for (const f of report.preflight) warnings.push({ code: f.code, message: f.message });
  if (format === 'svg') {
    return { format, bytes: new TextEncoder().encode(svg), svg, report, warnings };
  }
  const ppi = checkPpi(opts.ppi ?? DEFAULT_PPI);
  const raster = verifyRaster(svg, report, { ...opts.raster, ppi });
  if (!raster.pass) {
    const fix = raster.suggestions[0] ? ` Try: ${raster.suggestions[0]}` : '';
    throw new TallyError('gate-refused', `The PNG was refused: ${raster.reason}${fix}`, { report, raster });
  }
  warnings.push(...raster.warnings);
  const image = rasterizeSvg(svg, { ppi });
  // The file must say its resolution (PNG spec, pHYs): otherwise a layout program places it at 72 or 96 ppi.
  const phys = readPhysChunk(image.png);
  const ppm = ppiToPpm(ppi);
  if (!phys || phys.unit !== 1 || phys.ppmX !== ppm || phys.ppmY !== ppm) {
    throw new TallyError('raster-invalid', `The PNG does not record its resolution of ${ppi} ppi; nothing was written.`);
  }
  const size = readPngSize(image.png);
  return { format, bytes: image.png, svg, report, raster, png: { widthPx: size.widthPx, heightPx: size.heightPx, ppi }, warnings };
}

/** Renders and verifies in memory; throws TallyError on refusal. Nothing touches the disk. */
export function buildExport(doc: unknown, opts: ExportOptions & { format: ExportFormat }): BuiltExport {
  const rendered = renderChart(doc, opts);
  return exportFromRender(rendered, opts.format, opts);
}

/**
 * Writes `doc` to `outPath` as SVG or PNG after every check has passed. On any refusal or error it throws
 * and leaves whatever was at `outPath` untouched.
 */
export async function exportChart(doc: unknown, outPath: string, opts: ExportOptions = {}): Promise<ExportResult> {
  const format = opts.format ?? formatFromPath(outPath);
  if (opts.ppi !== undefined) checkPpi(opts.ppi);
  const built = buildExport(doc, { ...opts, format });
  await writeFileAtomic(outPath, built.bytes);
  return { ...built, path: outPath };
}
