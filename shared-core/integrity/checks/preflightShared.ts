// What the print preflight checks share: their defaults, how they word sizes, and how a preflight finding
// becomes a peer of the other checks (a warning with its fix) and back into the report's preflight list.
import type { IntegrityFinding } from '../check';
import type { FileCheck, MeasuredFile } from '../measureFile';
import type { Finding, PreflightCode, PreflightInput, PreflightOptions } from '../preflight';

/** Printer guidance, common practice, no source: lines under about 0.25 pt break up; text under about 6 pt is hard to read (some printers say 8 pt). */
export const PREFLIGHT_DEFAULTS: Readonly<Required<PreflightOptions>> = Object.freeze({ minStrokePt: 0.25, minTextPt: 6 });

/** What every preflight finding rests on. */
export const PRINT_PRACTICE = 'common practice, no source';

/** Geometry in millimetres comes out of float arithmetic; a nanometre is far below anything printable. */
export const EDGE_SLACK_MM = 1e-6;

export function mm(value: number): string {
  return String(Number(value.toFixed(2)));
}

export function pt(value: number): string {
  return String(Number(value.toPrecision(3)));
}

export function plural(count: number, word: string): string {
  return `${count} ${word}${count === 1 ? '' : 's'}`;
}

/** Smallest value per owner, so 2,000 thin glyph strokes make one finding, not 2,000. */
export function thinnestByOwner<T>(items: readonly T[], size: (item: T) => number, owner: (item: T) => string): Map<string, { size: number; count: number }> {
  const out = new Map<string, { size: number; count: number }>();
  for (const item of items) {
    const key = owner(item);
    const seen = out.get(key);
    if (!seen) out.set(key, { size: size(item), count: 1 });
    else {
      seen.size = Math.min(seen.size, size(item));
      seen.count += 1;
    }
  }
  return out;
}

export function preflightFinding(code: PreflightCode, message: string, owner?: string): Finding {
  const finding: Finding = { code, message, severity: 'warning', basis: 'common practice' };
  if (owner !== undefined) finding.owner = owner;
  return finding;
}

/** A preflight check reads the page's facts (PreflightInput), so `preflight()` can run it without an SVG file too. */
export interface PreflightCheck extends FileCheck {
  code: PreflightCode;
  findIn(input: PreflightInput, options: Required<PreflightOptions>): Finding[];
}

/** Builds a preflight check: its findings on a measured file are warnings carrying `fix`. */
export function preflightCheck(spec: { code: PreflightCode; name: string; fix: (options: Required<PreflightOptions>) => string; findIn: PreflightCheck['findIn'] }): PreflightCheck {
  return {
    code: spec.code,
    name: spec.name,
    severity: 'warning',
    category: 'preflight',
    basis: PRINT_PRACTICE,
    findIn: spec.findIn,
    run(m: MeasuredFile): IntegrityFinding[] {
      const fix = spec.fix(m.preflightOptions);
      return spec.findIn(m.preflight, m.preflightOptions).map((f) => {
        const out: IntegrityFinding = { code: f.code, severity: 'warning', message: f.message, fix, basis: PRINT_PRACTICE };
        if (f.owner !== undefined) out.owner = f.owner;
        return out;
      });
    },
  };
}

/** A preflight check's finding as the report's preflight list carries it (no fix: the message says what to do). */
export function asPreflightFinding(f: IntegrityFinding): Finding {
  return preflightFinding(f.code as PreflightCode, f.message, f.owner);
}
