// Bounds on a supplied (untrusted) graphic, so a hostile file costs seconds and megabytes, never more.

/** Every limit a supplied SVG is held to; each breach is refused with a sentence naming the limit. */
export interface AuditLimits {
  /** Characters of SVG text (the file size limit, checked again by the caller on bytes). */
  maxChars: number;
  /** Elements in the file as written. */
  maxElements: number;
  /** Nesting depth of elements as written. */
  maxDepth: number;
  /** Path commands in the whole file (path data plus polygon/polyline points). */
  maxPathCommands: number;
  /** How deep `<use>` may refer to `<use>`. */
  maxUseDepth: number;
  /** Elements after every `<use>` is expanded: stops a fan-out of references that paints nothing. */
  maxExpandedElements: number;
  /** Nesting depth after `<use>` expansion. */
  maxExpandedDepth: number;
  /** Painted shapes after `<use>` expansion. */
  maxShapes: number;
  /** Outline points after flattening curves, for the whole file. */
  maxVertices: number;
  /** Wall-clock budget for measuring every mark, in milliseconds. */
  timeLimitMs: number;
}

/** Generous for real infographics (a few thousand elements), small enough to stay fast. Common practice, no source. */
export const DEFAULT_AUDIT_LIMITS: Readonly<AuditLimits> = Object.freeze({
  maxChars: 16_000_000,
  maxElements: 200_000,
  maxDepth: 256,
  maxPathCommands: 500_000,
  maxUseDepth: 32,
  maxExpandedElements: 500_000,
  maxExpandedDepth: 1_000,
  maxShapes: 100_000,
  maxVertices: 3_000_000,
  timeLimitMs: 20_000,
});

export function auditLimits(overrides: Partial<AuditLimits> = {}): AuditLimits {
  return { ...DEFAULT_AUDIT_LIMITS, ...overrides };
}
