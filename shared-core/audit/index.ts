// Public door of the audit of supplied graphics: safe import, marks, readings, suggestion, correction, report.

export { auditSvg, auditSvgDetailed, auditMarks, applyGivenLengths, toValueSpec } from './auditReport';
export type { AuditReport, AuditedMark, AuditSvgOptions, MarksAuditInput, SvgAudit, ValuesInput } from './auditReport';
export { DEFAULT_AUDIT_LIMITS, auditLimits, type AuditLimits } from './auditLimits';
export { importSvg, type ImportedSvg, type TextLabel } from './importSvg';
export { countPathCommands } from './countPathCommands';
export { findSvgMarks, MARK_ATTRIBUTE, type SvgMark, type FindMarksOptions, type FoundMarks } from './findSvgMarks';
export { mergeTouching, unionBox, type MergeResult } from './mergeTouching';
export { splitComponents, type InkComponent } from './splitComponents';
export { findRepeatUnit, SAME_GLYPH_TOLERANCE, type RepeatUnit } from './findRepeatUnit';
export { solidCuesOf, isSlantedParallelogram } from './solidCues';
export { measureReadings, varyingDimension, type ReadingResult, type ReadingResults, type ReadingPair } from './readings';
export { suggestReading, type ReadingSuggestion } from './suggestReading';
export { pairLabels, parseLabelNumber, type LabelPairing, type LabelPairs, type LabelCandidate, type PairableMark } from './pairLabels';
export { parseValueSpec, resolveValues, type ValueSpec, type ResolvedValue, type ValueSource } from './parseValues';
export { correctSvg, parseAnchor, ANCHORS, type Anchor, type CorrectOptions, type CorrectionResult, type MarkCorrection } from './correctSvg';
export { formatAuditReport } from './formatReport';
export { formatFactor, formatMeasure, formatRatio } from './formatNumbers';
export { verdictSentence } from './verdictSentence';
export { READING_NAMES, type ReadingName, type MeasuredMark, type MarkPart, type SolidCue, type SourceUnit, type SetAside } from './types';
export { buildSheet, type Sheet, type SheetInput } from './buildSheet';
export { sanitizedCopy, type SanitizedCopy } from './sanitizedCopy';
export { cleanCss, describeKinds, findOutsideReferences, removalNote, stripOutsideReferences, type OutsideKind, type OutsideReference, type StrippedSvg } from './outsideReferences';
