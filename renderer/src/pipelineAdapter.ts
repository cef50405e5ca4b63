// The one place where the UI calls the export chain (shared-core/pipeline): it turns the chain's
// result or its TallyError into plain data for the panels, and keeps the preview on exactly the
// string that export writes. It runs in the render worker (and on the main thread only as a fallback).

import { parseChart } from '../../shared-core/document';
import { isTallyError } from '../../shared-core/errors';
import type { VerifyReport } from '../../shared-core/integrity';
import { layoutChart } from '../../shared-core/layout';
import { renderChart } from '../../shared-core/pipeline';
import { writeSvg } from '../../shared-core/svg';
import type { HonestyRow, HonestyView, RenderOutcome } from './render/renderTypes';

function honestyOf(report: VerifyReport): HonestyView {
  const pairs = new Map(report.lieFactor.pairs.map((p) => [p.label, p]));
  const worst = report.lieFactor.worstPair;
  const referenceLabel = report.lieFactor.pairs[0]?.reference ?? null;
  const rows: HonestyRow[] = report.marks.map((m) => {
    const pair = pairs.get(m.label);
    return {
      label: m.label,
      value: m.value,
      graphic: m.graphic,
      graphicUnit: m.graphicUnit,
      lieFactor: pair?.lieFactor ?? null,
      basis: pair?.basis ?? null,
      problem: pair?.problem ?? null,
      isReference: referenceLabel !== null && m.label === referenceLabel,
      isWorst: worst !== null && m.label === worst.label,
    };
  });
  const referenceMark = referenceLabel !== null ? report.marks.find((m) => m.label === referenceLabel) : undefined;
  return {
    pass: report.pass,
    mode: report.mode,
    reading: report.reading,
    limits: { ...report.limits },
    reference: referenceMark ? { label: referenceMark.label, value: referenceMark.value } : null,
    rows,
    worst: worst ? { label: worst.label, reference: worst.reference, lieFactor: report.lieFactor.worst } : null,
    spread: report.spread,
    reason: report.reason ?? null,
    problems: [...report.problems],
    suggestions: [...report.suggestions],
    notes: [...report.notes],
    preflight: report.preflight.map((f) => ({ code: f.code, message: f.message })),
    warnings: report.warnings.map((w) => ({ code: w.code, message: w.message })),
    // The smallest ink actually drawn (partial glyphs included), which is what print legibility depends on.
    smallestGlyph: report.smallestInk ? { label: report.smallestInk.label, inkMm2: report.smallestInk.inkMm2 } : null,
  };
}

function isVerifyReport(value: unknown): value is VerifyReport {
  return typeof value === 'object' && value !== null && 'lieFactor' in value && 'marks' in value && 'pass' in value;
}

/**
 * Lays out, writes, re-measures and gates one chart document. A refused chart still comes back
 * with its written SVG so the designer can see what is wrong; the UI never exports it.
 */
export function renderDocument(doc: unknown): RenderOutcome {
  try {
    const result = renderChart(doc);
    return { kind: 'checked', svg: result.svg, honesty: honestyOf(result.report), unit: unitOf(result.scene) };
  } catch (e) {
    if (isTallyError(e) && e.code === 'gate-refused' && isVerifyReport(e.details)) {
      let svg: string | null = null;
      let unit: ReturnType<typeof unitOf> = null;
      try {
        // The refusal carries the measurements but not the file; write it again for the preview.
        const spec = parseChart(doc);
        const scene = layoutChart(spec);
        // The same writer options as renderChart, so the preview is the file export would write.
        svg = writeSvg(scene, { useReferences: spec.useReferences, outlineText: spec.outlineText });
        unit = unitOf(scene);
      } catch {
        // Then there is nothing to show, only the report.
      }
      return { kind: 'checked', svg, honesty: honestyOf(e.details), unit };
    }
    if (isTallyError(e) && (e.code === 'document-invalid' || e.code === 'document-version')) {
      const problems = Array.isArray(e.details) ? (e.details as { path: string; message: string }[]).map((p) => ({ path: String(p.path), message: String(p.message) })) : [];
      return { kind: 'invalid', message: e.message, problems };
    }
    if (isTallyError(e)) return { kind: 'failed', code: e.code, message: e.message };
    return { kind: 'failed', code: 'internal', message: `Something went wrong while drawing the chart: ${e instanceof Error ? e.message : String(e)}` };
  }
}

function unitOf(scene: { unitChoice?: { unit: number; chosen: boolean } }): { value: number; chosen: boolean } | null {
  return scene.unitChoice ? { value: scene.unitChoice.unit, chosen: scene.unitChoice.chosen } : null;
}
