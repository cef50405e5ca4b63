// Audit of a supplied file from disk: an SVG goes through the core's safe import; a PNG or JPEG
// mock-up through raster marks; both end in the same report.
import { applyGivenLengths, auditMarks, auditSvg, toValueSpec, type AuditReport, type AuditSvgOptions } from '../../shared-core/audit/auditReport';
import { resolveValues } from '../../shared-core/audit/parseValues';
import { TallyError } from '../../shared-core/errors';
import { findRasterMarks, type RasterMarkOptions } from './rasterMarks';
import { readSuppliedFile, type ReadSuppliedOptions, type SuppliedFile } from './readSupplied';

export interface AuditFileOptions extends AuditSvgOptions, ReadSuppliedOptions {
  raster?: ReadSuppliedOptions['raster'];
  rasterMarks?: RasterMarkOptions;
}

export interface FileAudit {
  report: AuditReport;
  file: SuppliedFile;
}

export function auditSupplied(file: SuppliedFile, opts: AuditFileOptions = {}): AuditReport {
  if (file.kind === 'svg') return auditSvg(file.text, opts);
  if (opts.markIds && opts.markIds.length) throw new TallyError('usage', 'Mark ids (--marks) only apply to SVG files; pick marks in an image with seed points (--seed x,y).');
  const found = findRasterMarks(file.image, opts.rasterMarks);
  const marks = applyGivenLengths(found.marks, opts.givenLengths);
  // An image has no element ids: the advice names the options that pick marks in pixels.
  const values = resolveValues(marks, toValueSpec(opts.values), [], 'image-seeds');
  return auditMarks({ source: 'raster', unit: 'pixel', marks, values, setAside: found.setAside, solid: opts.solid, warnings: [] });
}

export function auditFile(path: string, opts: AuditFileOptions = {}): FileAudit {
  const file = readSuppliedFile(path, opts);
  return { report: auditSupplied(file, opts), file };
}
