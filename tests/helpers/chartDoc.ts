// A small chart document for pipeline and export tests: two streets, repeat mode, bikes of 10 each.

/** The document as a user would write it (before parseChart), with `over` replacing top-level fields. */
export function chartDoc(over: Record<string, unknown> = {}) {
  return {
    format: 'tallyglyph.chart/1',
    title: 'Test chart',
    data: [
      { label: 'Alder Street', value: 30 },
      { label: 'Birch Road', value: 55 },
    ],
    encoding: { mode: 'repeat', glyph: 'bike', unit: 10 },
    page: { width: 150, height: 100, unit: 'mm' },
    ...over,
  };
}
