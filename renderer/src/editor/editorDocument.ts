// The document as the editor holds it: the chart document with each table value kept as the text
// the designer typed, so a half-typed or wrong value is shown with its problem instead of being lost.
// toChartDocument turns it back into a chart document, or says which cells stop it.

import {
  CHART_FORMAT,
  parseChart,
  chartToDocument,
  type Arrangement,
  type ChartDocument,
  type EncodingMode,
  type FillTo,
  type GlyphRef,
  type LayoutOptions,
  type OwnGlyph,
  type PageUnit,
  type Rounding,
} from '../../../shared-core/document';
import { closeGlyphNames, getGlyph } from '../../../shared-core/glyph';
import { chartExtrasOf } from '../../../shared-core/standardise';

export interface EditorRow {
  /** Stable within a document, for React keys and actions; never written to the file. */
  id: string;
  label: string;
  /** Exactly what was typed or pasted. */
  valueText: string;
  /** Absent: the chart's glyph. */
  glyph?: GlyphRef;
  color?: string;
}

export interface EditorEncoding {
  mode: EncodingMode;
  /** Absent: chosen automatically by the layout. */
  unit?: number;
  unitName?: string;
  glyph: GlyphRef;
  rounding: Rounding;
  /** Kept when another mode is chosen, so switching back restores it. */
  arrangement: Arrangement;
  fillTo: FillTo;
}

/** The editor keeps layout options exactly as the document model defines them. */
export type EditorLayout = LayoutOptions;

export interface EditorDocument {
  title: string;
  source: string;
  rows: EditorRow[];
  encoding: EditorEncoding;
  layout: EditorLayout;
  page: { width: number; height: number; unit: PageUnit };
  outlineText: boolean;
  useReferences: boolean;
  /** Next row id number; ids are never reused within a document's history. */
  nextRowNumber: number;
  /** Glyphs of one's own kept in the document, by "own:…" name. */
  glyphs?: Record<string, OwnGlyph>;
  /**
   * Parts of the document the editor shows but does not edit (standardisation steps, dismissed findings
   * with their reasons, the all-zero permission): carried through unchanged so saving from the app loses nothing.
   */
  carried?: Pick<ChartDocument, 'standardise' | 'dismissed' | 'allowAllZero'>;
}

export type RowField = 'label' | 'value' | 'glyph';

export interface RowProblem {
  rowId: string;
  field: RowField;
  message: string;
}

export interface ConversionResult {
  /** The chart document, or null when a cell or setting stops it. */
  document: ChartDocument | null;
  rowProblems: RowProblem[];
  /** Problems that are not about one cell, as plain sentences. */
  otherProblems: string[];
  /** The chart glyph's problem (also in otherProblems), e.g. a name this build does not bundle. */
  chartGlyphProblem: string | null;
}

// ---------------------------------------------------------------------------------------------
// Numbers typed by people

export type NumberReading = { ok: true; value: number } | { ok: false; message: string };

/**
 * Reads a value as typed: "7.5", " 1,234 " (thousands commas), "1e3", "+4". A lone comma like "7,5"
 * is refused rather than guessed, because it means 7.5 in some places and 75 in others.
 */
export function readNumber(text: string): NumberReading {
  const t = text.trim().replace(/[\u00a0\u202f]/g, '');
  if (t === '') return { ok: false, message: 'Enter a value.' };
  let plain = t;
  if (/^[+-]?\d{1,3}(,\d{3})+(\.\d+)?$/.test(t)) plain = t.replace(/,/g, '');
  else if (/^[+-]?\d+,\d+$/.test(t)) {
    return { ok: false, message: `"${t}" is ambiguous: write decimals with a point (${t.replace(',', '.')}).` };
  }
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(plain)) {
    const shown = t.length > 24 ? `${t.slice(0, 24)}…` : t;
    return { ok: false, message: `"${shown}" is not a number.` };
  }
  const value = Number(plain);
  if (!Number.isFinite(value)) return { ok: false, message: `"${t}" is too large to draw.` };
  return { ok: true, value };
}

/** A number as the table shows it after loading: no float noise, no exponent for ordinary sizes. */
export function formatNumber(value: number): string {
  if (!Number.isFinite(value)) return String(value);
  const clean = Number(value.toPrecision(12));
  return clean === 0 || Math.abs(clean) >= 1e-6 && Math.abs(clean) < 1e15 ? String(clean) : clean.toExponential();
}

const NEGATIVE_MESSAGE = 'Negative values cannot be drawn: no count, length or area of ink shows less than nothing. Chart gains and losses as separate positive amounts.';

// ---------------------------------------------------------------------------------------------
// From and to chart documents

/** The editor's form of a chart document (validated first; throws TallyError as parseChart does). */
export function fromChartDocument(input: unknown): EditorDocument {
  const spec = parseChart(input);
  const doc = chartToDocument(spec);
  const enc = spec.encoding;
  const rows: EditorRow[] = spec.data.map((row, i) => {
    const out: EditorRow = { id: `r${i + 1}`, label: row.label, valueText: formatNumber(row.value) };
    if (row.glyph !== undefined) out.glyph = row.glyph;
    if (row.color !== undefined) out.color = row.color;
    return out;
  });
  const layout: EditorLayout = { ...spec.layout, margins: { ...spec.layout.margins } };
  if (spec.layout.colors) layout.colors = [...spec.layout.colors];
  const encoding: EditorEncoding = {
    mode: enc.mode,
    glyph: enc.glyph,
    rounding: enc.rounding,
    arrangement: enc.mode === 'repeat' ? enc.arrangement : 'per-category',
    fillTo: enc.mode === 'fill' ? enc.fillTo : 'max',
  };
  if (enc.unit !== undefined) encoding.unit = enc.unit;
  if (enc.unitName !== undefined) encoding.unitName = enc.unitName;
  const out: EditorDocument = {
    title: spec.title ?? '',
    source: spec.source ?? '',
    rows,
    encoding,
    layout,
    page: { ...doc.page },
    outlineText: spec.outlineText,
    useReferences: spec.useReferences,
    nextRowNumber: rows.length + 1,
  };
  const carried: NonNullable<EditorDocument['carried']> = { ...chartExtrasOf(spec) };
  if (spec.allowAllZero === true) carried.allowAllZero = true;
  if (Object.keys(carried).length > 0) out.carried = carried;
  if (doc.glyphs) out.glyphs = doc.glyphs;
  return out;
}

/** How many near names an unknown glyph's message offers. */
const NEAR_GLYPH_NAMES = 3;

/** Bundled glyph names close to an unknown one (spelling and tags), or [] when the name is known. */
export function nearGlyphNames(glyph: GlyphRef | undefined): string[] {
  if (typeof glyph !== 'string') return [];
  try {
    getGlyph(glyph);
    return [];
  } catch {
    return closeGlyphNames(glyph, NEAR_GLYPH_NAMES);
  }
}

function glyphProblem(glyph: GlyphRef, own?: Record<string, OwnGlyph>): string | null {
  if (typeof glyph !== 'string') return null;
  if (own && glyph in own) return null;
  try {
    getGlyph(glyph);
    return null;
  } catch {
    const shown = glyph.length > 40 ? `${glyph.slice(0, 40)}…` : glyph;
    const near = closeGlyphNames(glyph, NEAR_GLYPH_NAMES).map((n) => `"${n}"`);
    const hint = near.length ? ` Near names: ${near.slice(0, -1).join(', ')}${near.length > 1 ? ' or ' : ''}${near[near.length - 1]}.` : '';
    return `The glyph "${shown}" is unknown: it is not one of the bundled glyphs.${hint} Choose one with the Glyph button.`;
  }
}

/** The chart document to lay out and save, or the problems that stop it, each tied to its cell. */
export function toChartDocument(ed: EditorDocument): ConversionResult {
  const rowProblems: RowProblem[] = [];
  const otherProblems: string[] = [];
  const data: ChartDocument['data'] = [];
  const seen = new Map<string, number>();
  ed.rows.forEach((row, index) => {
    const label = row.label.trim();
    if (label === '') rowProblems.push({ rowId: row.id, field: 'label', message: 'Give this row a label.' });
    else if (seen.has(label)) rowProblems.push({ rowId: row.id, field: 'label', message: `Row ${(seen.get(label) ?? 0) + 1} already uses this label; each category needs its own.` });
    else seen.set(label, index);

    const read = readNumber(row.valueText);
    if (!read.ok) rowProblems.push({ rowId: row.id, field: 'value', message: read.message });
    else if (read.value < 0) rowProblems.push({ rowId: row.id, field: 'value', message: NEGATIVE_MESSAGE });
    else if (ed.encoding.mode === 'fill' && ed.encoding.fillTo === 'share' && read.value > 1) {
      rowProblems.push({ rowId: row.id, field: 'value', message: `${formatNumber(read.value)} is more than 1, but "fill by share" reads each value as a share from 0 to 1.` });
    }

    if (row.glyph !== undefined) {
      const problem = glyphProblem(row.glyph, ed.glyphs);
      if (problem) rowProblems.push({ rowId: row.id, field: 'glyph', message: problem });
    }
    const out: ChartDocument['data'][number] = { label, value: read.ok ? read.value : 0 };
    if (row.glyph !== undefined) out.glyph = row.glyph;
    if (row.color !== undefined) out.color = row.color;
    data.push(out);
  });
  if (ed.rows.length === 0) otherProblems.push('The table is empty: a chart needs at least one row.');
  const chartGlyph = glyphProblem(ed.encoding.glyph, ed.glyphs);
  if (chartGlyph) otherProblems.push(chartGlyph);
  if (rowProblems.length > 0 || otherProblems.length > 0) return { document: null, rowProblems, otherProblems, chartGlyphProblem: chartGlyph };

  const { mode, glyph, rounding, unit, unitName, arrangement, fillTo } = ed.encoding;
  const encoding: ChartDocument['encoding'] = { mode, glyph, rounding };
  if (unit !== undefined) encoding.unit = unit;
  if (unitName !== undefined && unitName.trim() !== '') encoding.unitName = unitName.trim();
  if (mode === 'repeat') encoding.arrangement = arrangement;
  if (mode === 'fill') encoding.fillTo = fillTo;

  const layout: NonNullable<ChartDocument['layout']> = {
    columns: ed.layout.columns,
    gapRatio: ed.layout.gapRatio,
    direction: ed.layout.direction,
    labels: ed.layout.labels,
    valueLabels: ed.layout.valueLabels,
    legend: ed.layout.legend,
    margins: { ...ed.layout.margins },
    bleedMm: ed.layout.bleedMm,
  };
  if (ed.layout.glyphSizeMm !== undefined) layout.glyphSizeMm = ed.layout.glyphSizeMm;
  if (ed.layout.colors !== undefined && ed.layout.colors.length > 0) layout.colors = [...ed.layout.colors];
  if (ed.layout.background !== undefined) layout.background = ed.layout.background;
  // Style options are written only when set, so a document opened and saved without touching them is unchanged.
  const { groupEvery, labelPosition, labelAlign, valueUnit, sort, titleSizePt, sourceSizePt, font, keyWording } = ed.layout;
  if (groupEvery !== undefined) layout.groupEvery = groupEvery;
  if (labelPosition !== undefined) layout.labelPosition = labelPosition;
  if (labelAlign !== undefined) layout.labelAlign = labelAlign;
  if (valueUnit !== undefined && valueUnit !== '') layout.valueUnit = valueUnit;
  if (sort !== undefined) layout.sort = sort;
  if (titleSizePt !== undefined) layout.titleSizePt = titleSizePt;
  if (sourceSizePt !== undefined) layout.sourceSizePt = sourceSizePt;
  if (font !== undefined) layout.font = font;
  if (keyWording !== undefined && keyWording !== '') layout.keyWording = keyWording;

  const document: ChartDocument = {
    format: CHART_FORMAT,
    data,
    encoding,
    layout,
    page: { ...ed.page },
    outlineText: ed.outlineText,
    useReferences: ed.useReferences,
  };
  if (ed.title.trim() !== '') document.title = ed.title;
  if (ed.source.trim() !== '') document.source = ed.source;
  if (ed.glyphs && Object.keys(ed.glyphs).length > 0) document.glyphs = ed.glyphs;
  if (ed.carried) Object.assign(document, ed.carried);
  return { document, rowProblems, otherProblems, chartGlyphProblem: null };
}

/** The row a document problem path such as `data[2].value` points at, with its field. */
export function rowForProblemPath(ed: EditorDocument, problemPath: string): { rowId: string; field: RowField } | null {
  const m = /^data\[(\d+)\](?:\.(label|value|glyph))?/.exec(problemPath);
  if (!m) return null;
  const row = ed.rows[Number(m[1])];
  if (!row) return null;
  return { rowId: row.id, field: (m[2] as RowField | undefined) ?? 'value' };
}

/** A file name stem for saving and exporting, from the title. */
export function documentStem(ed: EditorDocument): string {
  return ed.title.trim() || 'chart';
}
