// The embedded demo documents and the default colours, for the demo picker and the colour controls.
// Kept apart from pipelineAdapter.ts so the window loads without the layout code, which runs in the worker.
import { DEMO_CHARTS } from '../../shared-core/demo/demoCharts';
import { PALETTE } from '../../shared-core/layout';
import type { DemoChart } from './render/renderTypes';

export function demoCharts(): DemoChart[] {
  return DEMO_CHARTS.map((d) => ({ id: d.name, name: d.document.title ?? d.name, document: d.document }));
}

/** The category colours the layout uses when a document gives none. */
export function defaultPalette(): string[] {
  return [...PALETTE];
}
