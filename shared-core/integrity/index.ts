// Public door of the integrity checks: lie factor, gate, print preflight, verification of a written file and
// the registries of checks (FILE_CHECKS for the written file; the chart rules live in ./rules).

export { lieFactors, RATIO_BASIS_BELOW } from './lieFactor';
export type { LieFactorItem, LieFactorBasis, LieFactorOptions, LieFactorPair, LieFactorReport, PairProblem, ZeroCategory } from './lieFactor';
export { gate, DISTORTION_LIMITS } from './gate';
export type { GateMode, GateOptions, GateReading, GateResult, GateRounding } from './gate';
export { preflight, PREFLIGHT_CHECKS, PREFLIGHT_DEFAULTS } from './preflight';
export type { Finding, PreflightCode, PreflightInput, PreflightOptions } from './preflight';
export { verifySvg, assertVerified, summariseLieFactors } from './verifySvg';
export type { MarkMeasurement, PairSummary, VerifyOptions, VerifyReport } from './verifySvg';
export { measureFile } from './measureFile';
export type { FileCheck, MeasuredFile } from './measureFile';
export { FILE_CHECKS } from './checks/index';
export { checkOfCode, listChecks } from './checkList';
export type { CheckListing } from './checkList';
export type { CheckCategory, FixAction, IntegrityCheck, IntegrityFinding, Severity } from './check';
