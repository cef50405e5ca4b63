// Node side of the audit: reading supplied files safely, decoding raster mock-ups, finding marks in pixels.
export { auditFile, auditSupplied, type AuditFileOptions, type FileAudit } from './auditFile';
export { readSuppliedFile, decodeSvgBytes, type SuppliedFile, type ReadSuppliedOptions } from './readSupplied';
export { decodeRaster, readJpegSize, sniffKind, RASTER_IMPORT_LIMITS, type RasterImage, type RasterLimits, type SuppliedKind } from './decodeRaster';
export { findRasterMarks, type RasterMarkOptions, type RasterMarks, type Rgb } from './rasterMarks';
