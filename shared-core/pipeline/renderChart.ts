// The whole export chain in one place: parse the document, lay it out, write the SVG, re-measure the written
// text, gate it, and only then record the measured lie factor in the file's summary.
import { describeKinds, findOutsideReferences } from '../audit/index';
import { parseChart, type ChartSpec } from '../document/index';
import { checkChartDetail } from '../glyph/index';
import { TallyError, type Warning } from '../errors';
import { assertVerified, verifySvg, type VerifyOptions, type VerifyReport } from '../integrity/index';
import { layoutChart } from '../layout/index';
import { refuseAllZero } from './refuseAllZero';
import type { ChartSummary, Scene } from '../scene/types';
import { readChartSvg, SUMMARY_ID } from '../svg/index';
import { DEFAULT_XML_LIMITS, escapeXmlText, writeSvg } from '../svg/index';

export interface RenderOptions extends VerifyOptions {
  /** Write a chart whose values are all zero (nothing to compare), as the document's allowAllZero does. */
  allowAllZero?: boolean;
}

export interface RenderResult {
  /** The file to write: verified, with the measured lie factor in its summary. */
  svg: string;
  /** What verification measured on that very text. */
  report: VerifyReport;
  spec: ChartSpec;
  scene: Scene;
  /** Layout and verification warnings together (none of them stops the export). */
  warnings: Warning[];
}

const SUMMARY_ELEMENT = new RegExp(`(<metadata\\b[^>]*\\bid="${SUMMARY_ID}"[^>]*>)([\\s\\S]*?)(</metadata>)`);

/** The file with everything outside the summary's text: the part embedding must leave alone. */
function outsideSummary(svg: string): string {
  return svg.replace(SUMMARY_ELEMENT, '$1$3');
}

/**
 * Writes `measured` into the file's summary by replacing that element's text and nothing else, then proves
 * it: the file outside the summary is byte-for-byte what was verified, and the summary reads back as written.
 */
export function embedMeasured(svg: string, measured: NonNullable<ChartSummary['measured']>): string {
  const found = SUMMARY_ELEMENT.exec(svg);
  const summary = readChartSvg(svg).summary;
  if (!found || !summary) {
    throw new TallyError('svg-malformed', 'The written SVG has no readable summary to record the measured lie factor in; the writer broke the file format.');
  }
  const next: ChartSummary = { ...summary, measured };
  const out = svg.replace(SUMMARY_ELEMENT, (_m, open: string, _text: string, close: string) => open + escapeXmlText(JSON.stringify(next)) + close);
  if (outsideSummary(out) !== outsideSummary(svg)) {
    throw new TallyError('svg-malformed', 'Recording the measured lie factor changed more than the summary; nothing was exported.');
  }
  const back = readChartSvg(out).summary?.measured;
  if (!back || back.pass !== measured.pass || back.lieFactorWorst !== measured.lieFactorWorst || back.spread !== measured.spread) {
    throw new TallyError('svg-malformed', 'The measured lie factor did not read back from the file\'s summary; nothing was exported.');
  }
  return out;
}

/**
 * parseChart → layoutChart → writeSvg → verifySvg → gate, then the measured figures go into the summary.
 * Throws TallyError: 'document-version' / 'document-invalid' for a bad document (negative values included),
 * 'data-invalid' / 'glyph-unknown' / 'svg-malformed' from layout, and 'gate-refused' (details: the report)
 * when the written file misstates the data, naming the worst pair and a fix.
 */
export function renderChart(doc: unknown, opts: RenderOptions = {}): RenderResult {
  const spec = parseChart(doc);
  refuseAllZero(spec, opts.allowAllZero === true);
  const scene = layoutChart(spec);
  checkChartDetail([...scene.marks.flatMap((m) => m.glyphs), ...scene.legendKeys]);
  const written = writeSvg(scene, { useReferences: spec.useReferences, outlineText: spec.outlineText });
  if (written.length > DEFAULT_XML_LIMITS.maxChars) {
    const mb = (written.length / 1e6).toFixed(0);
    throw new TallyError('data-invalid', `The chart would be a ${mb} MB file, more than Tallyglyph can verify (${DEFAULT_XML_LIMITS.maxChars / 1e6} MB). Use fewer categories or a larger unit, turn on "useReferences" to write each glyph once, or split the chart.`);
  }
  // The writer emits no outside reference; this proves it on the written text, whatever the glyphs held.
  const outside = findOutsideReferences(written);
  if (outside.length) {
    throw new TallyError('svg-malformed', `The written chart would refer outside itself (${describeKinds(outside)}); nothing was exported.`);
  }
  const { allowAllZero: _allowAllZero, ...verifyOpts } = opts;
  const report = verifySvg(written, { rounding: spec.encoding.rounding, ...verifyOpts });
  assertVerified(report);
  const svg = embedMeasured(written, { lieFactorWorst: report.lieFactor.worst, spread: report.spread, pass: report.pass });
  // embedMeasured has read the summary back from the file; record the same figures in the report.
  if (report.summary) report.summary = { ...report.summary, measured: { lieFactorWorst: report.lieFactor.worst, spread: report.spread, pass: report.pass } };
  const warnings = [...scene.warnings, ...report.warnings];
  return { svg, report, spec, scene, warnings };
}
