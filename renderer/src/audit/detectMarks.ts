// The audit split in two so the designer can confirm the data in between: first find and measure the
// marks (and read number labels beside them), then audit those marks against the values on screen.
// Pure: the same shared-core steps the `audit` command chains in auditSvgDetailed.
import { auditMarks, pageEdgeWarnings, type AuditReport } from '../../../shared-core/audit/auditReport';
import { auditLimits } from '../../../shared-core/audit/auditLimits';
import { findRasterMarks } from '../../../shared-core/audit/findRasterMarks';
import { findSvgMarks, type SvgMark } from '../../../shared-core/audit/findSvgMarks';
import { importSvg, type ImportedSvg } from '../../../shared-core/audit/importSvg';
import { pairLabels, type LabelPairing } from '../../../shared-core/audit/pairLabels';
import type { ResolvedValue } from '../../../shared-core/audit/parseValues';
import type { RasterImage } from '../../../shared-core/audit/rasterHeaders';
import type { MeasuredMark, SetAside, SourceUnit } from '../../../shared-core/audit/types';
import type { Warning } from '../../../shared-core/errors';
import type { Box } from '../../../shared-core/geometry/region';
import { parseViewBox } from '../../../shared-core/glyph/collectShapes';

export interface Prefill {
  value: number | null;
  from: 'label' | 'file' | null;
  labelText?: string;
}

export interface Detection {
  source: 'svg' | 'raster';
  unit: SourceUnit;
  marks: MeasuredMark[];
  /** What a designer calls each mark: its own label, the number printed beside it, or its place. */
  names: string[];
  prefill: Prefill[];
  /** The drawing's coordinate frame, for outlining the marks over it. */
  frame: Box;
  pairings: LabelPairing[];
  unpairedLabels: string[];
  setAside: SetAside[];
  warnings: Warning[];
  imported: ImportedSvg | null;
}

function svgFrame(imp: ImportedSvg, marks: readonly MeasuredMark[]): Box {
  if (imp.viewBox) return imp.viewBox;
  const vb = parseViewBox(imp.root.attrs.viewBox);
  if (vb) return vb;
  const w = Number.parseFloat(imp.root.attrs.width ?? ''), h = Number.parseFloat(imp.root.attrs.height ?? '');
  if (w > 0 && h > 0) return { x: 0, y: 0, width: w, height: h };
  // No declared size: the marks' own extent, so the outlines still land on them.
  const x0 = Math.min(...marks.map((m) => m.box.x)), y0 = Math.min(...marks.map((m) => m.box.y));
  const x1 = Math.max(...marks.map((m) => m.box.x + m.box.width)), y1 = Math.max(...marks.map((m) => m.box.y + m.box.height));
  return { x: x0, y: y0, width: x1 - x0 || 1, height: y1 - y0 || 1 };
}

function namesOf(marks: readonly MeasuredMark[], prefill: readonly Prefill[]): string[] {
  return marks.map((m, i) => {
    if (m.label && m.label !== m.id) return m.label;
    if (prefill[i].labelText) return `Mark ${i + 1} (“${prefill[i].labelText}”)`;
    return `Mark ${i + 1}`;
  });
}

/** Finds the marks of a supplied SVG through the hostile-safe import. Throws TallyError on refusal. */
export function detectSvg(text: string): Detection {
  const imp = importSvg(text, auditLimits());
  const found = findSvgMarks(imp);
  const marks: SvgMark[] = found.marks;
  const paired = pairLabels(marks, imp.labels);
  const byMark = new Map(paired.pairs.map((p) => [p.mark, p]));
  const prefill: Prefill[] = marks.map((m) => {
    // A value the file records on the mark itself is exact; a label is only paired by distance.
    if (m.fileValue !== undefined) return { value: m.fileValue, from: 'file' };
    const p = byMark.get(m.id);
    return p ? { value: p.value, from: 'label', labelText: p.text } : { value: null, from: null };
  });
  return {
    source: 'svg',
    unit: 'user unit',
    marks,
    names: namesOf(marks, prefill),
    prefill,
    frame: svgFrame(imp, marks),
    pairings: paired.pairs,
    unpairedLabels: paired.unpaired,
    setAside: found.setAside,
    warnings: [...imp.warnings, ...pageEdgeWarnings(marks, imp.viewBox)],
    imported: imp,
  };
}

/** Finds the marks of a decoded PNG or JPEG as connected regions of colour; values must be typed. */
export function detectRaster(image: RasterImage): Detection {
  const found = findRasterMarks(image);
  const prefill: Prefill[] = found.marks.map(() => ({ value: null, from: null }));
  return {
    source: 'raster',
    unit: 'pixel',
    marks: found.marks,
    names: namesOf(found.marks, prefill),
    prefill,
    frame: { x: 0, y: 0, width: image.widthPx, height: image.heightPx },
    pairings: [],
    unpairedLabels: [],
    setAside: found.setAside,
    warnings: [],
    imported: null,
  };
}

/** Audits the detected marks against the values on screen; a value differing from its prefill counts as typed. */
export function auditDetection(detection: Detection, values: readonly number[], solid = false): AuditReport {
  const resolved: ResolvedValue[] = values.map((value, i) => {
    const p = detection.prefill[i];
    if (p.from !== null && p.value === value) return p.labelText !== undefined ? { value, from: p.from, labelText: p.labelText } : { value, from: p.from };
    return { value, from: 'user' };
  });
  const used = detection.pairings.filter((p) => resolved[detection.marks.findIndex((m) => m.id === p.mark)]?.from === 'label');
  return auditMarks({
    source: detection.source,
    unit: detection.unit,
    marks: detection.marks,
    values: resolved,
    pairings: used,
    unpairedLabels: detection.unpairedLabels,
    setAside: detection.setAside,
    warnings: detection.warnings,
    solid,
  });
}
