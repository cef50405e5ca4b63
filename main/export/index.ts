// Public door of export: verified SVG and PNG files, and the pixel re-check behind PNG export.
export { exportChart, buildExport, exportFromRender, formatFromPath, parsePpi, DEFAULT_PPI, type ExportFormat, type ExportOptions, type ExportResult, type BuiltExport } from './exportChart';
export {
  verifyRaster,
  estimateEdgeError,
  thresholdEdgeError,
  hideElements,
  marksOnlySvg,
  marksOnlyPartSvg,
  type RasterCheck,
  type RasterCheckOptions,
  type RasterMarkCheck,
} from './verifyRaster';
