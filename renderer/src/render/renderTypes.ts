// What one layout-and-check run hands back to the UI, as plain data that survives postMessage.

export interface HonestyRow {
  label: string;
  value: number;
  /** The measured quantity under the chart's reading. */
  graphic: number;
  graphicUnit: 'glyphs' | 'mm' | 'mm2' | 'share';
  /** Against the reference (the smallest positive value); null for the reference itself or when not measurable. */
  lieFactor: number | null;
  basis: 'effect' | 'ratio' | null;
  problem: string | null;
  /** False only when the row has no ink at all: "not drawn" is said of this row and no other. */
  drawn: boolean;
  isReference: boolean;
  isWorst: boolean;
}

/** One problem of the check with its own fix, as the verifier reports it (shared-core/integrity/check.ts). */
export interface HonestyFinding {
  code: string;
  severity: 'blocking' | 'warning' | 'advice';
  message: string;
  fix: string;
  category?: string;
  action?: { kind: string; label: string; payload?: Record<string, unknown> };
}

export interface HonestyView {
  pass: boolean;
  mode: 'repeat' | 'stack' | 'scale' | 'fill';
  reading: 'count' | 'length' | 'area' | 'fill';
  limits: { low: number; high: number };
  reference: { label: string; value: number } | null;
  rows: HonestyRow[];
  worst: { label: string; reference: string; lieFactor: number | null } | null;
  spread: number | null;
  reason: string | null;
  problems: string[];
  /** Every problem with its code and its own fix, blocking ones first. */
  findings: HonestyFinding[];
  suggestions: string[];
  notes: string[];
  preflight: { code: string; message: string }[];
  warnings: { code: string; message: string }[];
  smallestGlyph: { label: string; inkMm2: number } | null;
}

/**
 * One finding of the chart rules (shared-core/integrity/rules), run on the same spec and scene that were
 * verified. A finding the designer set aside is kept, marked with the reason, never dropped.
 */
export interface RuleFindingView extends HonestyFinding {
  /** The rule's short name ("Money over time not adjusted for prices"). */
  ruleName: string;
  /** The source the rule rests on, or "common practice, no source". */
  basis?: string;
  /** Present when a dismissal in the document covers this finding: the reason it was set aside. */
  dismissedReason?: string;
}

export type RenderOutcome =
  /**
   * Laid out, written and re-measured. svg is null only when a refusal came without the file. rules: the
   * chart rules' findings, open ones first (absent when the chart could not be laid out for them).
   */
  | { kind: 'checked'; svg: string | null; honesty: HonestyView; unit: { value: number; chosen: boolean } | null; offers?: FixOffers; rules?: RuleFindingView[] }
  /** The document itself is wrong: each problem names its field path (data[2].value...). */
  | { kind: 'invalid'; message: string; problems: { path: string; message: string }[] }
  | { kind: 'failed'; code: string; message: string };

/**
 * One-click remedies for a refused chart, each tried through the whole export chain first: offered
 * only when the changed document really passes.
 */
export interface FixOffers {
  /** Remainders cut by ink pass where whole glyphs were refused. */
  inkCut?: boolean;
  /** The largest readable unit below the current one that passes with the current rounding. */
  unit?: number;
}

export interface DemoChart {
  id: string;
  name: string;
  document: unknown;
}
