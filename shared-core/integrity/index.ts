// Public door of the integrity checks: lie factor, gate and print preflight.

export { lieFactors, RATIO_BASIS_BELOW } from './lieFactor';
export type { LieFactorItem, LieFactorBasis, LieFactorOptions, LieFactorPair, LieFactorReport, PairProblem, ZeroCategory } from './lieFactor';
export { gate, DISTORTION_LIMITS } from './gate';
export type { GateMode, GateOptions, GateReading, GateResult, GateRounding } from './gate';
export { preflight, PREFLIGHT_DEFAULTS } from './preflight';
export type { Finding, PreflightCode, PreflightInput, PreflightOptions } from './preflight';
export { verifySvg, assertVerified, summariseLieFactors } from './verifySvg';
export type { MarkMeasurement, PairSummary, VerifyOptions, VerifyReport } from './verifySvg';
export type { FixAction, IntegrityCheck, IntegrityFinding, Severity } from './check';
