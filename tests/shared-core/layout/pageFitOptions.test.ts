// The page-fit rule holds with the layout and style options too: bigger titles and source lines, labels above
// their rows, wider group gaps, value units, the serif font, sorting and a long key wording keep marks, labels,
// key, title and source inside the margins without overlaps, or are refused before export with a sentence
// saying what to change. Sheet sizes from ISO 216 (A4 210 x 297 mm, A5 148 x 210 mm).
import { describe, expect, it } from 'vitest';
import { parseChart, type ChartDocument } from '../../../shared-core/document';
import { isTallyError } from '../../../shared-core/errors';
import { layoutChart } from '../../../shared-core/layout';
import type { Scene } from '../../../shared-core/scene';
import { pageFitProblems } from './pageFit';

// Invented stations of an invented town; values chosen to give remainders and a wide range.
const LABELS = ['Harbour Gate', 'Mill Lane', 'Old Market', 'Station Square', 'Quarry Hill', 'Ferry Steps', 'Tanners Row', 'Bell Yard', 'Copper Street', 'Lantern Walk', 'North Pier', 'Rope Walk', 'Saltmarsh', 'Weavers Close', 'Kiln Lane', 'Orchard End'];
const VALUES = [42, 27.5, 61, 13.5, 35, 8, 52, 19, 30, 4.5, 47, 23, 16, 39, 11, 26];
const PAGES: Record<string, { width: number; height: number }> = {
  'A5 landscape': { width: 210, height: 148 },
  'A4 portrait': { width: 210, height: 297 },
  '180 x 120 mm': { width: 180, height: 120 },
};
const MODES: Record<string, ChartDocument['encoding']> = {
  repeat: { mode: 'repeat', glyph: 'bike', unitName: 'rides' },
  'shared grid': { mode: 'repeat', glyph: 'person', arrangement: 'shared-grid', unitName: 'people' },
  stack: { mode: 'stack', glyph: 'coffee', unitName: 'cups' },
  scale: { mode: 'scale', glyph: 'tree', unitName: 'trees' },
  fill: { mode: 'fill', glyph: 'drop', unitName: 'litres' },
};
const OPTIONS: Record<string, NonNullable<ChartDocument['layout']>> = {
  'big title and source, serif, value units': { titleSizePt: 36, sourceSizePt: 14, font: 'serif', valueUnit: 'litres' },
  'labels above, flush right, groups of 5, long key wording': { labelPosition: 'above', labelAlign: 'end', groupEvery: 5, keyWording: 'Each glyph in this chart stands for {amount} {unit}' },
  '72 pt title, groups of 10, sorted, labels flush against the marks': { titleSizePt: 72, groupEvery: 10, sort: 'descending', labelAlign: 'end' },
};

function chart(encoding: ChartDocument['encoding'], page: { width: number; height: number }, n: number, layout: ChartDocument['layout']): ChartDocument {
  return {
    format: 'tallyglyph.chart/1',
    title: `Rides per station (${n})`,
    source: 'Invented demo data',
    data: LABELS.slice(0, n).map((label, i) => ({ label, value: VALUES[i] })),
    encoding,
    layout,
    page: { ...page, unit: 'mm' },
  };
}

describe('with layout and style options, every mode fits the page or is refused before export', () => {
  for (const [optionName, layout] of Object.entries(OPTIONS)) {
    for (const [pageName, page] of Object.entries(PAGES)) {
      for (const [modeName, encoding] of Object.entries(MODES)) {
        for (const n of [3, 10]) {
          it(`${optionName}: ${modeName}, ${n} categories, ${pageName}`, { timeout: 60_000 }, () => {
            const spec = parseChart(chart(encoding, page, n, layout));
            let scene: Scene;
            try {
              scene = layoutChart(spec);
            } catch (e) {
              expect(isTallyError(e)).toBe(true);
              const err = e as { code: string; message: string };
              if (modeName === 'shared grid' && n > 9) {
                expect(err.code).toBe('data-invalid');
                return;
              }
              // Only a poster-size title, or ten rows each with a line of label above it on the short 180 x 120 mm
              // page, may leave no room at a legible size; the refusal says what to change.
              const crowded = optionName.startsWith('72 pt') || (optionName.startsWith('labels above') && n === 10 && pageName === '180 x 120 mm');
              expect(crowded, err.message).toBe(true);
              expect(err.code).toBe('layout-no-room');
              expect(err.message).toMatch(/bigger page/);
              return;
            }
            expect(pageFitProblems(scene, spec)).toEqual([]);
          });
        }
      }
    }
  }
});
