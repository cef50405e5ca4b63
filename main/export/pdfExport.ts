// PDF export: the verified chart SVG drawn into a vector PDF, re-checked by poppler from the PDF's own
// pixels, and written (atomically) only when that check passes too.
import { TallyError, type Warning } from '../../shared-core/errors';
import type { VerifyReport } from '../../shared-core/integrity/index';
import { renderChart, type RenderOptions, type RenderResult } from '../../shared-core/pipeline/index';
import { writeFileAtomic } from '../io/atomicWrite';
import { chartPdf } from './pdfFromSvg';
import { verifyPdf, type PdfCheck, type PdfCheckOptions } from './verifyPdf';

export interface BuiltPdf {
  format: 'pdf';
  bytes: Uint8Array;
  svg: string;
  report: VerifyReport;
  pdfCheck: PdfCheck;
  page: { widthMm: number; heightMm: number; bleedMm: number };
  warnings: Warning[];
}

/** Said wherever a PDF is offered: the file is RGB, and press colour is the printer's call. */
export const PDF_COLOUR_NOTE =
  'The PDF is in sRGB (the chart\'s own colours, with an sRGB output intent). CMYK conversion is out of scope: ask your printer for their profile and let them, or your layout program, convert it.';

/** Turns a rendered, verified chart into checked PDF bytes; throws TallyError('gate-refused') when poppler's pixels disagree. */
export async function pdfFromRender(rendered: Pick<RenderResult, 'svg' | 'report' | 'warnings'>, opts: PdfCheckOptions & { creationDate?: Date } = {}): Promise<BuiltPdf> {
  const { svg, report } = rendered;
  if (!report.pass) throw new TallyError('gate-refused', `The PDF was refused: ${report.reason ?? 'the chart did not pass the honesty check.'}`, report);
  const warnings: Warning[] = [...rendered.warnings];
  for (const f of report.preflight) warnings.push({ code: f.code, message: f.message });
  const bytes = await chartPdf(svg, { bleedMm: report.page.bleedMm, creationDate: opts.creationDate });
  const pdfCheck = await verifyPdf(bytes, svg, report, opts);
  if (!pdfCheck.pass) throw new TallyError('gate-refused', `The PDF was refused: ${pdfCheck.reason}`, { report, pdf: pdfCheck });
  warnings.push(...pdfCheck.warnings);
  return { format: 'pdf', bytes, svg, report, pdfCheck, page: { ...report.page }, warnings };
}

/** Renders, verifies and re-checks in memory, then writes `outPath` atomically; a refusal leaves it untouched. */
export async function exportPdf(doc: unknown, outPath: string, opts: RenderOptions & PdfCheckOptions = {}): Promise<BuiltPdf & { path: string }> {
  const rendered = renderChart(doc, opts);
  const built = await pdfFromRender(rendered, opts);
  await writeFileAtomic(outPath, built.bytes);
  return { ...built, path: outPath };
}
