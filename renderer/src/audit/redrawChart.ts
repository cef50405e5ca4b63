// The other honest answer to a distorted drawing: the same data as a unit chart, laid out, written and
// verified from the written file by the chart pipeline, exactly as `tallyglyph correct --rebuild` does.
import { TallyError } from '../../../shared-core/errors';
import { renderChart, type RenderResult } from '../../../shared-core/pipeline';

export interface RedrawRequest {
  names: readonly string[];
  values: readonly number[];
  mode: 'repeat' | 'stack';
  glyph: string;
  title?: string;
}

export interface Redrawn {
  document: unknown;
  result: RenderResult;
}

export function redrawAsUnitChart(request: RedrawRequest): Redrawn {
  if (request.values.length === 0) throw new TallyError('data-invalid', 'There are no values to redraw.');
  const document = {
    format: 'tallyglyph.chart/1',
    ...(request.title ? { title: request.title } : {}),
    source: 'Redrawn by Tallyglyph from a supplied graphic; values as confirmed in the audit.',
    data: request.values.map((value, i) => ({ label: (request.names[i] ?? `Mark ${i + 1}`).slice(0, 80), value })),
    encoding: { mode: request.mode, glyph: request.glyph },
    page: { width: 180, height: 120, unit: 'mm' },
  };
  const result = renderChart(document);
  if (!result.report.pass) {
    throw new TallyError('gate-refused', `The redrawn chart did not pass its own check: ${result.report.reason ?? 'its lie factor is outside 0.95–1.05.'}`);
  }
  return { document, result };
}
