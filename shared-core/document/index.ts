// Public door of the chart document: its schema, parser and types.

export {
  parseChart,
  chartToDocument,
  chartDocumentSchema,
  CHART_FORMAT,
  KNOWN_CHART_FORMATS,
  PAGE_UNIT_MM,
  DEFAULT_MARGIN_MM,
  DEFAULT_GAP_RATIO,
} from './chartSchema';
export type {
  Arrangement,
  ChartDocument,
  ChartSpec,
  DataRow,
  Direction,
  DocumentProblem,
  Encoding,
  EncodingMode,
  FillEncoding,
  FillTo,
  GlyphRef,
  OwnGlyph,
  LayoutOptions,
  MarginsMm,
  PageMm,
  PageUnit,
  RepeatEncoding,
  Rounding,
  ScaleEncoding,
  StackEncoding,
} from './chartSchema';
