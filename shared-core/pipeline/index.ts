// Public door of the export chain.
export { renderChart, embedMeasured, type RenderOptions, type RenderResult } from './renderChart';
