// Checks a chart's PDF before it is written, with an independent renderer (poppler's pdftoppm): each
// mark's ink as poppler's pixels hold it, the lie factor recomputed from that coverage, and the whole
// page as poppler draws it against resvg's drawing of the verified SVG.
import { TallyError, type Warning } from '../../shared-core/errors';
import { DISTORTION_LIMITS, gate, lieFactors, summariseLieFactors, type VerifyReport } from '../../shared-core/integrity/index';
import { renderSvgPixels } from '../raster/index';
import { collectPaint, paintBounds, writePdfPages, type PaintOp, type PdfPageSpec, type SvgPaint } from './pdfFromSvg';
import { grayInkPx, renderPdfPages, type PopplerPage } from './pdfRasterize';

export interface PdfMarkCheck {
  id: string;
  label: string;
  value: number;
  vectorInkMm2: number;
  /** The mark's ink in poppler's rendering: sum of (255 − gray) / 255 over its pixels, in mm². */
  pdfInkMm2: number;
  inkRatio: number | null;
  /** The reading's quantity recomputed from poppler's pixels (same unit as the vector report's graphic). */
  graphic: number;
}

export interface PdfPageMatch {
  ppi: number;
  widthPx: number;
  heightPx: number;
  /** Mean absolute difference per colour sample between poppler's page and resvg's, 0–255. */
  meanDifference: number;
  /** Share of pixels where some sample differs by more than 64 of 255 (a visibly different pixel). */
  differentShare: number;
}

export interface PdfCheck {
  pass: boolean;
  ppi: number;
  lieFactor: VerifyReport['lieFactor'];
  spread: number | null;
  marks: PdfMarkCheck[];
  page: PdfPageMatch | null;
  problems: string[];
  warnings: Warning[];
  reason?: string;
}

export interface PdfCheckOptions {
  /** Resolution of the per-mark ink check; default 300 ppi. */
  ppi?: number;
  /** Resolution of the whole-page comparison; default 72 ppi (it checks colour and placement, not area). */
  pagePpi?: number;
  /** Largest mean sample difference between poppler's and resvg's page; default 4 of 255. */
  maxMeanDifference?: number;
  /** Largest share of visibly different pixels; default 1%. */
  maxDifferentShare?: number;
}

const MM_PER_INCH = 25.4;
/** Blank paper around each mark on its probe page, so anti-aliased edges are never cut off. */
const PROBE_MARGIN_MM = 1;

interface Probe {
  markIndex: number;
  part: 'whole' | 'filled';
  page: PdfPageSpec;
}

function probePage(ops: readonly PaintOp[], painted: SvgPaint): PdfPageSpec | null {
  const box = paintBounds(ops);
  if (!box) return null;
  const unitsPerMm = painted.viewBox.width / painted.widthMm;
  return {
    ops,
    widthMm: box.width / unitsPerMm + 2 * PROBE_MARGIN_MM,
    heightMm: box.height / unitsPerMm + 2 * PROBE_MARGIN_MM,
    originX: box.x - PROBE_MARGIN_MM * unitsPerMm,
    originY: box.y - PROBE_MARGIN_MM * unitsPerMm,
    unitsPerMm,
    bleedMm: 0,
    paintOverride: '#000000',
  };
}

/**
 * The ink of each mark as poppler renders it, in mm². Each mark is drawn alone, in black on white, on a
 * page cropped to it, through the same PDF writer as the chart's own PDF (only the colour differs).
 */
async function markInks(painted: SvgPaint, report: VerifyReport, ppi: number): Promise<{ whole: number[]; filled: number[] | null }> {
  const probes: Probe[] = [];
  report.marks.forEach((m, i) => {
    const ops = painted.ops.filter((op) => op.markId === m.id);
    const whole = probePage(ops, painted);
    if (whole) probes.push({ markIndex: i, part: 'whole', page: whole });
    if (report.reading === 'fill') {
      const filled = probePage(ops.filter((op) => op.part === 'filled'), painted);
      if (filled) probes.push({ markIndex: i, part: 'filled', page: filled });
    }
  });
  const whole = report.marks.map(() => 0);
  const filled = report.reading === 'fill' ? report.marks.map(() => 0) : null;
  if (probes.length === 0) return { whole, filled };
  const pdf = await writePdfPages(probes.map((p) => p.page));
  const pages = await renderPdfPages(pdf, { ppi, gray: true });
  if (pages.length !== probes.length) throw new TallyError('pdf-invalid', `The PDF renderer drew ${pages.length} pages of ${probes.length}.`);
  // pdftoppm scales by exactly ppi / 72 per point whatever the rounding of the image size.
  const mm2PerPx = (MM_PER_INCH / ppi) ** 2;
  probes.forEach((p, k) => {
    const mm2 = grayInkPx(pages[k]) * mm2PerPx;
    if (p.part === 'whole') whole[p.markIndex] = mm2;
    else (filled as number[])[p.markIndex] = mm2;
  });
  return { whole, filled };
}

/** Poppler's rendering of the chart PDF against resvg's rendering of the SVG on white paper, pixel by pixel. */
export function comparePages(poppler: PopplerPage, resvg: { widthPx: number; heightPx: number; pixels: Uint8Array }): Omit<PdfPageMatch, 'ppi'> {
  if (poppler.channels !== 3) throw new TallyError('raster-invalid', 'Pages are compared in colour.');
  const w = Math.min(poppler.widthPx, resvg.widthPx);
  const h = Math.min(poppler.heightPx, resvg.heightPx);
  let total = 0;
  let different = 0;
  for (let y = 0; y < h; y++) {
    for (let x = 0; x < w; x++) {
      const p = (y * poppler.widthPx + x) * 3;
      const r = (y * resvg.widthPx + x) * 4;
      let worst = 0;
      for (let c = 0; c < 3; c++) {
        // resvg's pixels are premultiplied over transparency: composite on white paper.
        const alpha = resvg.pixels[r + 3];
        const onWhite = resvg.pixels[r + c] + (255 - alpha);
        const diff = Math.abs(poppler.samples[p + c] - onWhite);
        total += diff;
        if (diff > worst) worst = diff;
      }
      if (worst > 64) different += 1;
    }
  }
  const n = Math.max(1, w * h);
  return { widthPx: poppler.widthPx, heightPx: poppler.heightPx, meanDifference: total / (3 * n), differentShare: different / n };
}

function round(n: number, digits = 3): string {
  return String(Number(n.toPrecision(digits)));
}

/**
 * Re-checks the chart's PDF with poppler. `pdf` is the exact file about to be written; `svg` and `report`
 * are the verified chart it came from. Never throws for a failing PDF: it returns pass false with reasons
 * (it throws TallyError only when the check itself cannot run, e.g. pdftoppm is missing).
 */
export async function verifyPdf(pdf: Uint8Array, svg: string, report: VerifyReport, opts: PdfCheckOptions = {}): Promise<PdfCheck> {
  const ppi = opts.ppi ?? 300;
  const pagePpi = opts.pagePpi ?? 72;
  const maxMean = opts.maxMeanDifference ?? 4;
  const maxShare = opts.maxDifferentShare ?? 0.01;
  const tolerance = DISTORTION_LIMITS.high - 1;
  const painted = collectPaint(svg);
  const problems: string[] = [];
  const warnings: Warning[] = [];

  // 1. Each mark's ink from poppler's pixels, and the lie factor from it.
  const inks = await markInks(painted, report, ppi);
  const marks: PdfMarkCheck[] = report.marks.map((m, i) => {
    const cov = inks.whole[i];
    const inkRatio = m.inkMm2 > 0 ? cov / m.inkMm2 : null;
    let graphic: number;
    if (report.reading === 'area') graphic = cov;
    else if (report.reading === 'fill') graphic = cov > 0 ? (inks.filled as number[])[i] / cov : 0;
    // Count and length are proportional to the mark's ink at a fixed glyph and pitch (as in the PNG check).
    else graphic = inkRatio === null ? cov : m.graphic * inkRatio;
    return { id: m.id, label: m.label, value: m.value, vectorInkMm2: m.inkMm2, pdfInkMm2: cov, inkRatio, graphic };
  });
  const lf = lieFactors(marks.map((m, i) => ({ label: report.marks.findIndex((o) => o.label === m.label) === i ? m.label : `${m.label} (${m.id})`, data: m.value, graphic: m.graphic })));
  const verdict = gate(lf, { low: report.limits.low, high: report.limits.high, mode: report.mode, reading: report.reading });
  for (const p of verdict.problems) problems.push(`In the PDF as poppler draws it: ${p}`);
  for (const m of marks) {
    if (m.inkRatio !== null && Math.abs(m.inkRatio - 1) > tolerance) {
      problems.push(`In the PDF "${m.label}" has ${round(m.inkRatio * 100, 4)}% of the ink the checked SVG gives it.`);
    }
  }

  // 2. The page itself: poppler's drawing of the PDF against resvg's drawing of the SVG.
  let page: PdfPageMatch | null = null;
  const [drawn] = await renderPdfPages(pdf, { ppi: pagePpi, gray: false });
  if (!drawn) problems.push('The PDF has no page.');
  else {
    const reference = renderSvgPixels(svg, { ppi: pagePpi });
    if (Math.abs(drawn.widthPx - reference.widthPx) > 1 || Math.abs(drawn.heightPx - reference.heightPx) > 1) {
      problems.push(`The PDF page is ${drawn.widthPx} x ${drawn.heightPx} px at ${pagePpi} ppi; the chart's page is ${reference.widthPx} x ${reference.heightPx} px.`);
    }
    page = { ppi: pagePpi, ...comparePages(drawn, reference) };
    if (page.meanDifference > maxMean || page.differentShare > maxShare) {
      problems.push(
        `The PDF does not look like the checked chart: ${round(page.differentShare * 100, 2)}% of its pixels differ visibly from the SVG's (mean difference ${round(page.meanDifference, 2)} of 255).`,
      );
    }
  }

  const out: PdfCheck = { pass: problems.length === 0, ppi, lieFactor: summariseLieFactors(lf), spread: lf.spread, marks, page, problems, warnings };
  if (problems.length) out.reason = problems[0];
  return out;
}
