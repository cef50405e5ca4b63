// Moved to shared-core so the app and the command line find raster marks with the same code.
export { findRasterMarks, type RasterMarkOptions, type RasterMarks, type Rgb } from '../../shared-core/audit/findRasterMarks';
