// The built-in demo: one invented town, Wrenfield, charted once in every mode. All figures are made up for
// the demo; the town does not exist. Used by `tallyglyph demo` and the benchmarks.
import type { ChartDocument } from '../document/index';

export interface DemoChart {
  /** File name without extension, e.g. "repeat-bike-share". */
  name: string;
  /** What the chart shows and why this mode suits it, for the progress line and the docs. */
  description: string;
  document: ChartDocument;
}

const SOURCE = 'Source: invented demo data (Wrenfield is a made-up town).';
const PAGE = { width: 180, height: 120, unit: 'mm' } as const;

export const DEMO_CHARTS: readonly DemoChart[] = Object.freeze([
  {
    name: 'repeat-bike-share',
    description: 'repeat: bike-share rides per station in one week, one bike per 50 rides',
    document: {
      format: 'tallyglyph.chart/1',
      title: 'Wrenfield bike share: rides in one week',
      source: SOURCE,
      data: [
        { label: 'Harbour Gate', value: 420 },
        { label: 'Mill Lane', value: 275 },
        { label: 'Old Market', value: 610 },
        { label: 'Station Square', value: 135 },
      ],
      encoding: { mode: 'repeat', glyph: 'bike', unit: 50, unitName: 'rides' },
      page: PAGE,
    },
  },
  {
    name: 'stack-cafe-cups',
    description: 'stack: cups sold per day at one café, one cup per 20 cups',
    document: {
      format: 'tallyglyph.chart/1',
      title: 'Cups sold at the Lantern Café, one week',
      source: SOURCE,
      data: [
        { label: 'Mon', value: 86 },
        { label: 'Tue', value: 94 },
        { label: 'Wed', value: 112 },
        { label: 'Thu', value: 105 },
        { label: 'Fri', value: 148 },
        { label: 'Sat', value: 173 },
        { label: 'Sun', value: 131 },
      ],
      encoding: { mode: 'stack', glyph: 'coffee', unit: 20, unitName: 'cups' },
      page: PAGE,
    },
  },
  {
    name: 'scale-trees-planted',
    description: 'scale: trees planted per district, glyph ink area proportional to the count',
    document: {
      format: 'tallyglyph.chart/1',
      title: 'Trees planted in 2025, by district',
      source: SOURCE,
      data: [
        { label: 'Northside', value: 340 },
        { label: 'Riverside', value: 1250 },
        { label: 'Hilltop', value: 610 },
        { label: 'Eastfield', value: 95 },
      ],
      encoding: { mode: 'scale', glyph: 'tree', unitName: 'trees' },
      page: PAGE,
    },
  },
  {
    name: 'fill-planting-target',
    description: 'fill: share of each district\'s planting target reached, filled by ink',
    document: {
      format: 'tallyglyph.chart/1',
      title: 'Share of the 2025 planting target reached',
      source: SOURCE,
      data: [
        { label: 'Northside', value: 0.82 },
        { label: 'Riverside', value: 0.47 },
        { label: 'Hilltop', value: 0.66 },
        { label: 'Eastfield', value: 0.23 },
      ],
      encoding: { mode: 'fill', glyph: 'sprout', fillTo: 'share', unitName: 'of target' },
      page: PAGE,
    },
  },
  {
    name: 'icon-array-commute',
    description: 'parts of a whole: how 100 commuters travel, one person glyph each in one shared grid',
    document: {
      format: 'tallyglyph.chart/1',
      title: 'How 100 Wrenfield commuters get to work',
      source: SOURCE,
      data: [
        { label: 'Bus', value: 31 },
        { label: 'Car', value: 28 },
        { label: 'Bike', value: 23 },
        { label: 'On foot', value: 18 },
      ],
      encoding: { mode: 'repeat', glyph: 'person', unit: 1, unitName: 'commuters', arrangement: 'shared-grid' },
      page: PAGE,
    },
  },
  {
    name: 'repeat-library-per-resident',
    description: 'standardised: library loans per 1,000 residents, so districts of different size compare fairly; the footnote says so',
    document: {
      format: 'tallyglyph.chart/1',
      title: 'Wrenfield library loans per 1,000 residents, 2025',
      source: SOURCE,
      // The values are the loans below divided by each district's residents, x 1,000 (as applyAdjustment records them).
      data: [
        { label: 'Northside', value: 450 },
        { label: 'Riverside', value: 350 },
        { label: 'Hilltop', value: 420 },
        { label: 'Eastfield', value: 240 },
      ],
      encoding: { mode: 'repeat', glyph: 'book', unit: 50, unitName: 'loans per 1,000 residents' },
      page: PAGE,
      standardise: {
        columns: { population: { unitName: 'residents', values: { Northside: 12_000, Riverside: 26_000, Hilltop: 5_000, Eastfield: 15_000 } } },
        adjustments: {
          original: { unitName: 'loans', values: { Northside: 5_400, Riverside: 9_100, Hilltop: 2_100, Eastfield: 3_600 } },
          steps: [{ kind: 'per-capita', column: 'population', per: 1_000 }],
        },
      },
    },
  },
]);
