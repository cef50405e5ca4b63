// Errors that reach a designer: a stable code for scripts and a plain sentence for people.

export type ProblemCode =
  | 'svg-malformed'
  | 'svg-limit'
  | 'path-malformed'
  | 'number-invalid'
  | 'glyph-empty'
  | 'glyph-unknown'
  | 'geometry-limit'
  | 'time-limit'
  | 'document-invalid'
  | 'document-version'
  | 'data-invalid'
  | 'gate-refused'
  | 'raster-invalid'
  | 'pdf-unsupported'
  | 'pdf-invalid'
  | 'checker-missing'
  | 'io-error'
  | 'usage'
  /** The chart cannot fit its page at a legible size: refused before anything is written. */
  | 'layout-no-room';

/** A failure with a code and a sentence a designer understands. Thrown inside the core, caught at the edges. */
export class TallyError extends Error {
  readonly code: ProblemCode;
  readonly details?: unknown;
  constructor(code: ProblemCode, message: string, details?: unknown) {
    super(message);
    this.name = 'TallyError';
    this.code = code;
    this.details = details;
  }
}

/** Something worth telling the user that does not stop the work. */
export interface Warning {
  code: string;
  message: string;
}

export function isTallyError(e: unknown): e is TallyError {
  return e instanceof TallyError;
}
