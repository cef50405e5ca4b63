// The one place where the UI calls the export chain (shared-core/pipeline): it turns the chain's
// result or its TallyError into plain data for the panels, and keeps the preview on exactly the
// string that export writes. It runs in the render worker (and on the main thread only as a fallback).

import { parseChart } from '../../shared-core/document';
import { isTallyError } from '../../shared-core/errors';
import type { IntegrityFinding, VerifyReport } from '../../shared-core/integrity';
import { CHART_RULES, checkChart } from '../../shared-core/integrity/rules/index';
import type { ChartSpec } from '../../shared-core/document';
import { layoutChart } from '../../shared-core/layout';
import type { Scene } from '../../shared-core/scene';
import { renderChart } from '../../shared-core/pipeline';
import { writeSvg } from '../../shared-core/svg';
import type { FixOffers, HonestyRow, HonestyView, RenderOutcome, RuleFindingView } from './render/renderTypes';

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
      drawn: m.drawn,
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
    findings: (report.findings ?? []).map((f) => ({
      code: f.code,
      severity: f.severity,
      message: f.message,
      fix: f.fix,
      ...(f.category !== undefined ? { category: f.category } : {}),
      ...(f.action ? { action: { kind: f.action.kind, label: f.action.label, ...(f.action.payload ? { payload: { ...f.action.payload } } : {}) } } : {}),
    })),
    suggestions: [...report.suggestions],
    notes: [...report.notes],
    preflight: report.preflight.map((f) => ({ code: f.code, message: f.message })),
    warnings: report.warnings.map((w) => ({ code: w.code, message: w.message })),
    // The smallest ink actually drawn (partial glyphs included), which is what print legibility depends on.
    smallestGlyph: report.smallestInk ? { label: report.smallestInk.label, inkMm2: report.smallestInk.inkMm2 } : null,
  };
}

/** The rule's short name for a finding's code (a sub-code starts with its rule's code). */
function ruleNameOf(code: string): string {
  const rule = CHART_RULES.find((r) => code === r.code || code.startsWith(`${r.code}-`));
  return rule?.name ?? code;
}

function ruleFindingView(f: IntegrityFinding, dismissedReason?: string): RuleFindingView {
  return {
    code: f.code,
    severity: f.severity,
    message: f.message,
    fix: f.fix,
    ruleName: ruleNameOf(f.code),
    ...(f.category !== undefined ? { category: f.category } : {}),
    ...(f.basis !== undefined ? { basis: f.basis } : {}),
    ...(f.action ? { action: { kind: f.action.kind, label: f.action.label, ...(f.action.payload ? { payload: JSON.parse(JSON.stringify(f.action.payload)) as Record<string, unknown> } : {}) } } : {}),
    ...(dismissedReason !== undefined ? { dismissedReason } : {}),
  };
}

/**
 * The chart rules on the very spec and scene that were verified: open findings first (as checkChart orders
 * them), then the dismissed ones marked with their reason. checkChart reports a failing rule as a finding.
 */
export function ruleFindingsOf(spec: ChartSpec, scene: Scene): RuleFindingView[] {
  const report = checkChart(spec, scene);
  return [...report.findings.map((f) => ruleFindingView(f)), ...report.dismissed.map((d) => ruleFindingView(d.finding, d.reason))];
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
    const honesty = honestyOf(result.report);
    // The layout's own warnings too (a glyph size that did not fit, two categories in one colour), not only the verifier's.
    honesty.warnings = result.warnings.map((w) => ({ code: w.code, message: w.message }));
    return { kind: 'checked', svg: result.svg, honesty, unit: unitOf(result.scene), rules: ruleFindingsOf(result.spec, result.scene) };
  } catch (e) {
    if (isTallyError(e) && e.code === 'gate-refused' && isVerifyReport(e.details)) {
      let svg: string | null = null;
      let unit: ReturnType<typeof unitOf> = null;
      let rules: RuleFindingView[] | undefined;
      try {
        // The refusal carries the measurements but not the file; write it again for the preview.
        const spec = parseChart(doc);
        const scene = layoutChart(spec);
        // The same writer options as renderChart, so the preview is the file export would write.
        svg = writeSvg(scene, { useReferences: spec.useReferences, outlineText: spec.outlineText });
        unit = unitOf(scene);
        rules = ruleFindingsOf(spec, scene);
      } catch {
        // Then there is nothing to show, only the report.
      }
      const honesty = honestyOf(e.details);
      const offers = fixOffers(doc, honesty, unit);
      return { kind: 'checked', svg, honesty, unit, ...(offers ? { offers } : {}), ...(rules ? { rules } : {}) };
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

/** Readable units (1, 2, 2.5 or 5 times a power of ten) below `unit`, largest first. */
export function readableUnitsBelow(unit: number, count: number): number[] {
  const out: number[] = [];
  for (let k = Math.floor(Math.log10(unit)) + 1; out.length < count && k > -12; k -= 1) {
    for (const m of [5, 2.5, 2, 1]) {
      const u = k >= 0 ? m * 10 ** k : m / 10 ** -k;
      if (u < unit * (1 - 1e-9) && out.length < count) out.push(u);
    }
  }
  return out;
}

/** How many smaller units are tried: each try is a whole layout, write and verification. */
const UNIT_TRIES = 6;
/** The refusal waits for the offers, so the search stops once it has cost this long (a smaller unit means more glyphs to verify). */
const OFFER_BUDGET_MS = 2500;

function passes(doc: unknown): boolean {
  try {
    return renderChart(doc).report.pass;
  } catch {
    return false;
  }
}

/**
 * Remedies for a chart refused on its lie factor in a counted mode: partial glyphs cut by ink, and
 * the largest readable unit below the current one. Each is run through the same export chain and
 * offered only when it passes, so a click never leads to a second refusal.
 */
function fixOffers(doc: unknown, honesty: HonestyView, unit: { value: number } | null): FixOffers | null {
  if (honesty.mode !== 'repeat' && honesty.mode !== 'stack') return null;
  if (!honesty.findings.some((f) => f.severity === 'blocking' && f.code.startsWith('lie-factor'))) return null;
  const base = doc as { encoding?: Record<string, unknown> };
  if (!base.encoding || typeof base.encoding !== 'object') return null;
  const offers: FixOffers = {};
  if (base.encoding.rounding === 'whole' && passes({ ...base, encoding: { ...base.encoding, rounding: 'ink-cut' } })) offers.inkCut = true;
  const current = typeof base.encoding.unit === 'number' ? base.encoding.unit : unit?.value;
  const started = performance.now();
  if (current !== undefined && current > 0) {
    for (const candidate of readableUnitsBelow(current, UNIT_TRIES)) {
      if (performance.now() - started > OFFER_BUDGET_MS) break;
      if (passes({ ...base, encoding: { ...base.encoding, unit: candidate } })) {
        offers.unit = candidate;
        break;
      }
    }
  }
  return offers.inkCut || offers.unit !== undefined ? offers : null;
}
