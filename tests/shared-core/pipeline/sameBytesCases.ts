// Charts whose written SVG must stay byte-for-byte the same when layout, writing or embedding is made
// faster: the demos in every mode (with and without references) and repeat charts of 1,000 and 10,000 glyphs.
import { DEMO_CHARTS } from '../../../shared-core/demo/demoCharts';

export interface SameBytesCase {
  name: string;
  doc: Record<string, unknown>;
  /** 'render': the whole export chain (verified, summary embedded); 'write': layout + SVG only (too big to verify unreferenced). */
  stage: 'render' | 'write';
}

function repeatDoc(glyphs: number, extra: Record<string, unknown> = {}): Record<string, unknown> {
  const weights = [0.6, 0.8, 1, 1.2, 1.4];
  const total = weights.reduce((a, b) => a + b, 0);
  const data = weights.map((w, i) => ({ label: `Depot ${String.fromCharCode(65 + i)}`, value: Math.max(1, Math.round((glyphs * w) / total)) + 0.35 }));
  return {
    format: 'tallyglyph.chart/1',
    title: 'Parcels sorted per hour',
    source: 'Invented benchmark data',
    data,
    encoding: { mode: 'repeat', glyph: 'person', unit: 1 },
    page: { width: 420, height: 297, unit: 'mm' },
    ...extra,
  };
}

export const SAME_BYTES_CASES: SameBytesCase[] = [
  ...DEMO_CHARTS.flatMap((d) => [
    { name: `demo ${d.name}`, doc: { ...(d.document as unknown as Record<string, unknown>), useReferences: false }, stage: 'render' as const },
    { name: `demo ${d.name} with references`, doc: { ...(d.document as unknown as Record<string, unknown>), useReferences: true }, stage: 'render' as const },
  ]),
  { name: 'repeat 1,000 with references', doc: repeatDoc(1_000, { useReferences: true }), stage: 'render' },
  { name: 'repeat 1,000 without references', doc: repeatDoc(1_000, { useReferences: false }), stage: 'render' },
  { name: 'repeat 1,000 shared grid', doc: repeatDoc(1_000, { useReferences: true, encoding: { mode: 'repeat', glyph: 'person', unit: 1, arrangement: 'shared-grid' } }), stage: 'render' },
  { name: 'repeat 1,000 right to left', doc: repeatDoc(1_000, { useReferences: true, layout: { direction: 'rtl' } }), stage: 'render' },
  { name: 'repeat 10,000 with references', doc: repeatDoc(10_000, { useReferences: true }), stage: 'write' },
  { name: 'repeat 10,000 without references', doc: repeatDoc(10_000, { useReferences: false }), stage: 'write' },
];
