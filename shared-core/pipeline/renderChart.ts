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
import { DEFAULT_XML_LIMITS, escapeXmlText, parseXml, writeSvg } from '../svg/index';

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

/** The text of one summary element, read by the same XML reader as the whole file (entities and all). */
function elementText(open: string, text: string, close: string): { text: string; children: number } {
  const el = parseXml(open + text + close);
  return { text: el.text, children: el.children.length };
}

function readSummaryText(text: string): ChartSummary | null {
  try {
    const s = JSON.parse(text) as Partial<ChartSummary> | null;
    return s && typeof s === 'object' && s.format === 'tallyglyph.summary/1' ? (s as ChartSummary) : null;
  } catch {
    return null;
  }
}

/**
 * Writes `measured` into the file's summary by replacing that element's text and nothing else, then proves
 * it: the file outside the summary is byte-for-byte what was verified, and the summary reads back as written.
 *
 * `verifiedSummary` is the summary verification read from this very text (VerifyReport.summary). Given it,
 * the file is not parsed again: the summary element found here must hold exactly that summary (so it is the
 * element verification read), the new text must be plain character data (no markup, so every other node of
 * the verified file is unchanged), and it must read back, through the same XML reader, as the new summary.
 * Without it the whole file is parsed once to find the summary.
 */
export function embedMeasured(svg: string, measured: NonNullable<ChartSummary['measured']>, verifiedSummary?: ChartSummary | null): string {
  const found = SUMMARY_ELEMENT.exec(svg);
  const noSummary = () => new TallyError('svg-malformed', 'The written SVG has no readable summary to record the measured lie factor in; the writer broke the file format.');
  if (!found) throw noSummary();
  const [, open, oldText, close] = found;
  const here = readSummaryText(elementText(open, oldText, close).text);
  const summary = verifiedSummary === undefined ? readChartSvg(svg).summary : verifiedSummary;
  if (!summary || !here) throw noSummary();
  if (JSON.stringify(here) !== JSON.stringify(summary)) {
    throw new TallyError('svg-malformed', 'The summary found in the written SVG is not the one verification read; nothing was exported.');
  }
  const next: ChartSummary = { ...summary, measured };
  const nextText = escapeXmlText(JSON.stringify(next));
  const out = svg.slice(0, found.index) + open + nextText + close + svg.slice(found.index + found[0].length);
  if (outsideSummary(out) !== outsideSummary(svg)) {
    throw new TallyError('svg-malformed', 'Recording the measured lie factor changed more than the summary; nothing was exported.');
  }
  const back = elementText(open, nextText, close);
  const read = readSummaryText(back.text);
  if (nextText.includes('<') || back.children !== 0 || !read || JSON.stringify(read) !== JSON.stringify(next)) {
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
  // A piece placed by reference has its shape's points: count those, not a translated copy built for counting.
  const shapes = scene.shapes ?? {};
  checkChartDetail([...scene.marks.flatMap((m) => m.glyphs.map((g) => (g.ref && shapes[g.ref.shape] ? { region: shapes[g.ref.shape], glyph: g.glyph } : g))), ...scene.legendKeys]);
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
  const svg = embedMeasured(written, { lieFactorWorst: report.lieFactor.worst, spread: report.spread, pass: report.pass }, report.summary);
  // embedMeasured has read the summary back from the file; record the same figures in the report.
  if (report.summary) report.summary = { ...report.summary, measured: { lieFactorWorst: report.lieFactor.worst, spread: report.spread, pass: report.pass } };
  const warnings = [...scene.warnings, ...report.warnings];
  return { svg, report, spec, scene, warnings };
}
