// Public door of the pure PNG helpers: chunk walking and the pHYs resolution chunk.
export { withPhysChunk, readPhysChunk, validatePngChunks, readPngSize, ppiToPpm, pngCrc32, type PhysChunk, type PngChunk } from './physChunk';
