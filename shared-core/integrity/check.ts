// One shape for every integrity check, so that verification of the written file, print preflight and the
// rules about units and context are peers: each has a stable code, a severity, and findings that say what
// is wrong and what to change.

/** Only blocking findings stop an export; warnings and advice travel with the result. */
export type Severity = 'blocking' | 'warning' | 'advice';

/** A remedy the app can offer as one click; the command line prints its label. */
export interface FixAction {
  /** What to do, e.g. 'set-unit', 'set-rounding', 'apply-per-capita'. */
  kind: string;
  /** The words on the button, in the app's own vocabulary. */
  label: string;
  /** What the action needs (the unit to set, the column to divide by...). */
  payload?: Record<string, unknown>;
}

export interface IntegrityFinding {
  /** Stable, for scripts and tests, e.g. 'lie-factor', 'ink-page-coloured'. */
  code: string;
  severity: Severity;
  /** What is wrong, in plain words. */
  message: string;
  /** What to change so the chart passes: specific to the code, never a generic hint. */
  fix: string;
  /** The data row concerned, when there is one. */
  category?: string;
  /** The source the rule rests on, or "common practice, no source". */
  basis?: string;
  action?: FixAction;
  /** Who or what on the page the finding is about when that is not a data row (print preflight: "title text", "baseline or rule"). */
  owner?: string;
}

/**
 * What a check of the written file looks at: the lie factor itself, whether the ink can be seen, whether the
 * file keeps one scale and agrees with its own records, or print practice. Chart rules leave it unset.
 */
export type CheckCategory = 'lie-factor' | 'visibility' | 'consistency' | 'preflight';

export interface IntegrityCheck<Input> {
  /** The check's own code; its findings use it, or a sub-code that starts with it. */
  code: string;
  /** A short name of our own, shown to users. */
  name: string;
  /** The severity of its findings unless a finding says otherwise. */
  severity: Severity;
  /** What the check looks at (checks of the written file); a finding's own `category` is a data row, not this. */
  category?: CheckCategory;
  /** The source the check rests on, or "common practice, no source". */
  basis?: string;
  run(input: Input): IntegrityFinding[];
}
