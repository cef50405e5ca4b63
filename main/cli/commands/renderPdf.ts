// The PDF branch of `tallyglyph render chart.json -o chart.pdf`: verified SVG, drawn into a vector PDF,
// re-checked from poppler's pixels, written only when every check passes.
import fs from 'node:fs/promises';
import path from 'node:path';
import { isTallyError } from '../../../shared-core/errors';
import { parsePpi } from '../../export/index';
import { exportPdf, PDF_COLOUR_NOTE } from '../../export/pdfExport';
import { EXIT, type CliIO } from '../types';

function fixed(n: number | null): string {
  return n === null ? 'not defined' : n.toFixed(4);
}

export async function runPdf(input: string, output: string, shownPath: string, ppiText: string | undefined, json: boolean, io: CliIO): Promise<number> {
  let ppi: number | undefined;
  try {
    ppi = parsePpi(ppiText);
  } catch (e) {
    io.stderr(`tallyglyph render: ${(e as Error).message}\n`);
    return EXIT.usage;
  }
  let text: string;
  try {
    text = await fs.readFile(input, 'utf8');
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    const message = `Could not read "${path.basename(input)}": ${code === 'ENOENT' ? 'there is no such file' : (e as Error).message}.`;
    io.stderr(`tallyglyph render: ${message}\n`);
    if (json) io.stdout(JSON.stringify({ ok: false, error: { code: 'io-error', message } }, null, 2) + '\n');
    return EXIT.usage;
  }
  try {
    const result = await exportPdf(text, output, ppi !== undefined ? { ppi } : {});
    const r = result.report;
    const { widthMm, heightMm, bleedMm } = result.page;
    if (json) {
      io.stdout(JSON.stringify({ ok: true, path: output, format: 'pdf', report: r, pdf: result.pdfCheck, page: result.page, warnings: result.warnings }, null, 2) + '\n');
    } else {
      io.stdout(
        `Wrote ${shownPath}: ${r.marks.length} marks read by ${r.reading}, worst lie factor ${fixed(r.lieFactor.worst)} (allowed ${r.limits.low}-${r.limits.high}). ` +
          `PDF page ${widthMm} x ${heightMm} mm${bleedMm > 0 ? ` including ${bleedMm} mm bleed` : ''}, lie factor from poppler's pixels at ${result.pdfCheck.ppi} ppi ${fixed(result.pdfCheck.lieFactor.worst)}.\n`,
      );
      io.stderr(`tallyglyph render: note: ${PDF_COLOUR_NOTE}\n`);
      for (const w of result.warnings) io.stderr(`tallyglyph render: warning: ${w.message}\n`);
    }
    return EXIT.ok;
  } catch (e) {
    if (!isTallyError(e)) throw e;
    io.stderr(`tallyglyph render: ${e.message.replace(/\s*\n\s*/g, ' ')}\n`);
    if (json) {
      const d = e.details as { report?: unknown; pdf?: unknown; pass?: unknown } | undefined;
      const report = d && typeof d === 'object' ? ('pass' in d ? d : (d.report ?? null)) : null;
      io.stdout(JSON.stringify({ ok: false, error: { code: e.code, message: e.message }, report, pdf: d && typeof d === 'object' && 'pdf' in d ? d.pdf : null }, null, 2) + '\n');
    }
    return e.code === 'gate-refused' ? EXIT.refused : EXIT.usage;
  }
}
