// One glyph per category in cells along rows, each row on its own baseline with the value above
// and the label below each glyph (scale and fill). Glyph sizes scale with one parameter, so the
// layout can search for the largest that fits, and for the number of cells per row.
import { fitLargest } from './fitSize';
import { labelLines, lineMetrics, linesHeightMm, linesWidthMm, textWidthMm, TEXT_SIZE_MM } from './labels';
import type { BoxMm } from './layoutContext';

export interface CellItem {
  /** Glyph ink-box size per unit of the size parameter. */
  widthPerSize: number;
  heightPerSize: number;
  label: string;
  value: string;
}

export interface CellRowsOptions {
  columns: number | 'auto';
  labels: boolean;
  valueLabels: boolean;
  /** Height the legend needs below the rows at a size, gap included (0 without a legend). */
  legendHeightMm: (size: number) => number;
  maxSize: number;
  minSize: number;
}

export interface CellRowsPlan {
  size: number;
  fits: boolean;
  /** Item indices per row. */
  rows: number[][];
  /** Centre x of each item's cell. */
  centreXMm: number[];
  /** Baseline (glyph bottoms) of each item's row. */
  baselineYMm: number[];
  /** Bottom of the last row's labels. */
  bottomMm: number;
  /** Each item's label broken into lines (empty without labels). */
  labelLines: string[][];
  /** Room the rows and legend take at this size, before spreading over the box. */
  widthMm: number;
  heightMm: number;
}

export const CELL_GAP_MM = 4;
const ROW_GAP_MM = 5;
export const TEXT_GAP_MM = 1.5;
const EPS_MM = 1e-9;
const MOST_ROWS_TRIED = 24;
/** Labels break onto more lines beyond the larger of this and a fifth of the width. */
const LABEL_MIN_WRAP_MM = 25;

function chunk(n: number, columns: number): number[][] {
  const rows: number[][] = [];
  for (let i = 0; i < n; i += columns) rows.push(Array.from({ length: Math.min(columns, n - i) }, (_, k) => i + k));
  return rows;
}

export function planCellRows(items: readonly CellItem[], box: BoxMm, opts: CellRowsOptions): CellRowsPlan {
  const n = items.length;
  const lm = lineMetrics(TEXT_SIZE_MM.label);
  const vm = lineMetrics(TEXT_SIZE_MM.valueLabel);
  const labelMaxMm = Math.max(LABEL_MIN_WRAP_MM, box.width / 5);
  const labelText = items.map((it) => (opts.labels ? labelLines(it.label, labelMaxMm, TEXT_SIZE_MM.label) : []));
  const labelW = labelText.map((l) => linesWidthMm(l, TEXT_SIZE_MM.label));
  const valueW = items.map((it) => (opts.valueLabels ? textWidthMm(it.value, TEXT_SIZE_MM.valueLabel) : 0));
  const aboveMm = opts.valueLabels ? vm.boxHeightMm + TEXT_GAP_MM : 0;
  const belowOf = (row: readonly number[]) => {
    const most = Math.max(0, ...row.map((i) => labelText[i].length));
    return most > 0 ? TEXT_GAP_MM + linesHeightMm(most, lm) : 0;
  };
  const cellW = (i: number, size: number) => Math.max(size * items[i].widthPerSize, labelW[i], valueW[i]);

  const measure = (size: number, columns: number) => {
    const rows = chunk(n, columns);
    let widthMm = 0;
    let heightMm = 0;
    for (const row of rows) {
      let w = 0;
      let h = 0;
      for (const i of row) {
        w += cellW(i, size);
        h = Math.max(h, size * items[i].heightPerSize);
      }
      widthMm = Math.max(widthMm, w + (row.length - 1) * CELL_GAP_MM);
      heightMm += aboveMm + h + belowOf(row);
    }
    heightMm += (rows.length - 1) * ROW_GAP_MM + opts.legendHeightMm(size);
    return { rows, widthMm, heightMm };
  };
  const fitsAt = (size: number, columns: number) => {
    const m = measure(size, columns);
    return m.widthMm <= box.width + EPS_MM && m.heightMm <= box.height + EPS_MM;
  };

  let columns: number;
  let fit: { sizeMm: number; fits: boolean };
  if (opts.columns !== 'auto') {
    columns = Math.max(1, Math.min(n, opts.columns));
    fit = fitLargest(opts.maxSize, opts.minSize, (s) => fitsAt(s, columns));
  } else {
    // Candidates by number of rows: one row, two rows, ... keeps the search short for many categories.
    columns = n;
    fit = fitLargest(opts.maxSize, opts.minSize, (s) => fitsAt(s, n));
    for (let rowsWanted = 2; rowsWanted <= Math.min(n, MOST_ROWS_TRIED); rowsWanted++) {
      const c = Math.ceil(n / rowsWanted);
      if (c === columns || Math.ceil(n / c) !== rowsWanted) continue;
      const f = fitLargest(opts.maxSize, opts.minSize, (s) => fitsAt(s, c));
      if ((f.fits && !fit.fits) || (f.fits === fit.fits && f.sizeMm > fit.sizeMm * 1.02)) {
        fit = f;
        columns = c;
      }
    }
  }

  const size = fit.sizeMm;
  const { rows, widthMm, heightMm } = measure(size, columns);
  const centreXMm = new Array<number>(n).fill(0);
  const baselineYMm = new Array<number>(n).fill(0);
  // Use the page: columns of equal pitch across the whole width when every cell fits one (so the items
  // of every row line up, a short last row centred on the same columns), else each row's spare width
  // spread between its cells; spare height opens the row gaps up to a row's height each and centres
  // what is left. A pitch of (width + gap) / columns leaves a cell width of pitch - gap, exactly what
  // a full row of equal cells needs to fit, so equal cells always get the grid.
  const pitchMm = (box.width + CELL_GAP_MM) / Math.max(1, columns);
  const equalColumns = items.every((_, i) => cellW(i, size) <= pitchMm - CELL_GAP_MM + EPS_MM);
  const rowHeights = rows.map((row) => aboveMm + Math.max(0, ...row.map((i) => size * items[i].heightPerSize)) + belowOf(row));
  const spareHMm = Math.max(0, box.height - heightMm);
  const gapGrowMm = rows.length > 1 ? Math.min(spareHMm / rows.length, Math.min(...rowHeights) * 0.5) : 0;
  let topMm = box.y + (spareHMm - gapGrowMm * (rows.length - 1)) / 2;
  rows.forEach((row, r) => {
    let h = 0;
    for (const i of row) h = Math.max(h, size * items[i].heightPerSize);
    const baseline = topMm + aboveMm + h;
    if (equalColumns) {
      const shiftMm = ((columns - row.length) / 2) * pitchMm;
      row.forEach((i, k) => {
        centreXMm[i] = box.x + shiftMm + k * pitchMm + (pitchMm - CELL_GAP_MM) / 2;
        baselineYMm[i] = baseline;
      });
    } else {
      const natural = row.reduce((a, i) => a + cellW(i, size), 0) + (row.length - 1) * CELL_GAP_MM;
      const spare = Math.max(0, box.width - natural) / row.length;
      let x = box.x + spare / 2;
      for (const i of row) {
        const w = cellW(i, size);
        centreXMm[i] = x + w / 2;
        baselineYMm[i] = baseline;
        x += w + CELL_GAP_MM + spare;
      }
    }
    topMm = baseline + belowOf(row) + ROW_GAP_MM + (r < rows.length - 1 ? gapGrowMm : 0);
  });
  return { size, fits: fit.fits, rows, centreXMm, baselineYMm, bottomMm: topMm - ROW_GAP_MM, labelLines: labelText, widthMm, heightMm };
}
