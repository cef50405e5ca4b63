export {
  rasterizeSvg,
  encodePng,
  renderSvgPixels,
  readSvgPageSize,
  rasterSizePx,
  RASTER_LIMITS,
  type RasterOptions,
  type RasterResult,
  type RasterPixels,
  type SvgPageSize,
} from './rasterizeSvg';
export {
  withPhysChunk,
  readPhysChunk,
  validatePngChunks,
  readPngSize,
  ppiToPpm,
  pngCrc32,
  type PhysChunk,
  type PngChunk,
} from './physChunk';
export {
  alphaCoverage,
  coverageMm2,
  markCoverages,
  markCoveragesByRegion,
  isolateMark,
  isolateEachMark,
  type PixelRegion,
  type MarkCoverage,
  type MarkBox,
} from './coverage';
