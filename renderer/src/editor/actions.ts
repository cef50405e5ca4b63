// Every change the editor can make, as a named action, and the pure perform(document, action)
// that returns the next document. Nothing else changes a document.

import {
  GROUP_EVERY_CHOICES,
  LABEL_ALIGNS,
  LABEL_POSITIONS,
  PAGE_UNIT_MM,
  SORT_ORDERS,
  SOURCE_SIZE_PT_RANGE,
  TEXT_FONTS,
  TITLE_SIZE_PT_RANGE,
  type Arrangement,
  type Direction,
  type EncodingMode,
  type FillTo,
  type GroupEvery,
  type LabelAlign,
  type LabelPosition,
  type MarginsMm,
  type OwnGlyph,
  type PageUnit,
  type Rounding,
  type SortOrder,
  type TextFont,
} from '../../../shared-core/document';
import type { EditorDocument, EditorRow } from './editorDocument';
import { INTEGRITY_ACTION_NAMES, isIntegrityAction, performIntegrity, type IntegrityAction } from './integrityActions';
import { parseTable } from './parseTable';

export type Action =
  | { type: 'set-title'; title: string }
  | { type: 'set-source'; source: string }
  | { type: 'edit-label'; rowId: string; text: string }
  | { type: 'edit-value'; rowId: string; text: string }
  | { type: 'set-row-glyph'; rowId: string; glyph: string | null }
  | { type: 'add-row'; afterRowId?: string }
  | { type: 'remove-row'; rowId: string }
  | { type: 'move-row'; rowId: string; by: -1 | 1 }
  /** Pasted table text; from a row onward (overwriting, adding rows as needed) or replacing the table. */
  | { type: 'paste-table'; text: string; atRowId?: string }
  | { type: 'set-mode'; mode: EncodingMode }
  /** typing: from the Amount field as it is typed, merged into one undo step until the field is left. */
  | { type: 'set-unit'; unit: number | null; typing?: boolean }
  | { type: 'set-unit-name'; unitName: string }
  | { type: 'set-glyph'; glyph: string }
  | { type: 'set-rounding'; rounding: Rounding }
  | { type: 'set-arrangement'; arrangement: Arrangement }
  | { type: 'set-fill-to'; fillTo: FillTo }
  /** null: the default palette. */
  | { type: 'set-colors'; colors: string[] | null; typing?: boolean }
  | { type: 'set-page-size'; width: number; height: number }
  | { type: 'set-page-unit'; unit: PageUnit }
  | { type: 'set-margins'; margins: MarginsMm }
  | { type: 'set-bleed'; bleedMm: number }
  /** null: no background (a transparent page). */
  | { type: 'set-background'; background: string | null; typing?: boolean }
  | { type: 'set-show'; what: 'labels' | 'valueLabels' | 'legend'; on: boolean }
  /** A glyph of one's own kept in the document under `name` ("own:…"), and used as the chart's glyph. */
  | { type: 'add-own-glyph'; name: string; glyph: OwnGlyph }
  /** Removes an own glyph; rows and the chart fall back to the bundled square where they used it. */
  | { type: 'remove-own-glyph'; name: string }
  // Layout and style controls. typing: sent while a field is typed in or a colour dragged in its
  // picker, merged into one undo step until the control is left.
  /** null: automatic (the palette colour of the row's place). */
  | { type: 'set-row-color'; rowId: string; color: string | null; typing?: boolean }
  /** null: automatic (the largest size that fits). */
  | { type: 'set-glyph-size'; glyphSizeMm: number | null; typing?: boolean }
  | { type: 'set-gap'; gapRatio: number; typing?: boolean }
  | { type: 'set-columns'; columns: number | 'auto'; typing?: boolean }
  | { type: 'set-direction'; direction: Direction }
  /** 0: even spacing. */
  | { type: 'set-group-every'; groupEvery: GroupEvery }
  | { type: 'set-label-position'; labelPosition: LabelPosition }
  | { type: 'set-label-align'; labelAlign: LabelAlign }
  /** Kept as typed ("" clears it); the document check refuses what is too long. */
  | { type: 'set-value-unit'; valueUnit: string }
  | { type: 'set-sort'; sort: SortOrder }
  /** null: the default size. */
  | { type: 'set-title-size'; sizePt: number | null; typing?: boolean }
  | { type: 'set-source-size'; sizePt: number | null; typing?: boolean }
  | { type: 'set-font'; font: TextFont }
  /** Kept as typed ("" is the default wording), so a wording without {amount} stays in its field with the check's sentence. */
  | { type: 'set-key-wording'; keyWording: string }
  /** Adjustments and findings set aside, from the integrity panel (integrityActions.ts). */
  | IntegrityAction;

export type ActionType = Action['type'];

/** Words for the undo and redo buttons' tooltips: "Undo change of value". */
export const ACTION_NAMES: Readonly<Record<ActionType, string>> = Object.freeze({
  'set-title': 'title change',
  'set-source': 'source change',
  'edit-label': 'label edit',
  'edit-value': 'value edit',
  'set-row-glyph': 'row glyph change',
  'add-row': 'new row',
  'remove-row': 'row removal',
  'move-row': 'row move',
  'paste-table': 'paste',
  'set-mode': 'mode change',
  'set-unit': 'unit change',
  'set-unit-name': 'unit name change',
  'set-glyph': 'glyph change',
  'set-rounding': 'rounding change',
  'set-arrangement': 'arrangement change',
  'set-fill-to': 'fill change',
  'set-colors': 'colour change',
  'set-page-size': 'page size change',
  'set-page-unit': 'page unit change',
  'set-margins': 'margin change',
  'set-bleed': 'bleed change',
  'set-background': 'background change',
  'set-show': 'label setting',
  'add-own-glyph': 'glyph import',
  'remove-own-glyph': 'glyph removal',
  'set-row-color': 'row colour change',
  'set-glyph-size': 'glyph size change',
  'set-gap': 'gap change',
  'set-columns': 'glyphs per row change',
  'set-direction': 'reading direction change',
  'set-group-every': 'grouping change',
  'set-label-position': 'label position change',
  'set-label-align': 'label alignment change',
  'set-value-unit': 'value unit change',
  'set-sort': 'sort order change',
  'set-title-size': 'title size change',
  'set-source-size': 'source size change',
  'set-font': 'font change',
  'set-key-wording': 'key wording change',
  ...INTEGRITY_ACTION_NAMES,
});

type LayoutField = 'groupEvery' | 'labelPosition' | 'labelAlign' | 'valueUnit' | 'sort' | 'titleSizePt' | 'sourceSizePt' | 'font' | 'keyWording';

/** The document with one optional layout field set, or removed when `value` is undefined; the same document when nothing changes. */
function withLayoutField<F extends LayoutField>(doc: EditorDocument, field: F, value: EditorDocument['layout'][F] | undefined): EditorDocument {
  if (doc.layout[field] === value) return doc;
  const layout: EditorDocument['layout'] = { ...doc.layout };
  if (value === undefined) delete layout[field];
  else layout[field] = value;
  return { ...doc, layout };
}

function inRange(value: number | null, range: { min: number; max: number }): boolean {
  return value === null || (Number.isFinite(value) && value >= range.min && value <= range.max);
}

/** The layout's own bound on the gap (chartSchema: at most 10 glyph sizes). */
const MAX_GAP_RATIO = 10;

/** An opaque #rrggbb colour in lower case, or null for anything else. */
function opaqueHex(color: string): string | null {
  return /^#[0-9a-f]{6}$/i.test(color) ? color.toLowerCase() : null;
}

const MAX_ROWS = 10_000;

function newRow(doc: EditorDocument, fields: Partial<Omit<EditorRow, 'id'>> = {}): { row: EditorRow; next: number } {
  const row: EditorRow = { id: `r${doc.nextRowNumber}`, label: '', valueText: '', ...fields };
  return { row, next: doc.nextRowNumber + 1 };
}

function unusedLabel(rows: readonly EditorRow[]): string {
  const used = new Set(rows.map((r) => r.label.trim()));
  for (let n = rows.length + 1; ; n++) if (!used.has(`Category ${n}`)) return `Category ${n}`;
}

function mapRow(doc: EditorDocument, rowId: string, change: (row: EditorRow) => EditorRow): EditorDocument {
  let changed = false;
  const rows = doc.rows.map((r) => {
    if (r.id !== rowId) return r;
    const next = change(r);
    if (next !== r) changed = true;
    return next;
  });
  return changed ? { ...doc, rows } : doc;
}

/** Rounds a converted length so that 210 mm shows as 8.268 in, not 8.267716535433072. */
function roundLength(value: number, unit: PageUnit): number {
  const decimals = unit === 'in' ? 3 : unit === 'mm' ? 2 : 1;
  return Number(value.toFixed(decimals));
}

function sameColors(a: readonly string[] | undefined, b: readonly string[] | undefined): boolean {
  if (a === undefined || b === undefined) return a === b;
  return a.length === b.length && a.every((c, i) => c === b[i]);
}

/**
 * The document after an action. Returns the same object when nothing changes, so the history can
 * tell a real change from a no-op. Values arrive already checked by the controls that send them;
 * table text is kept exactly as typed (toChartDocument reports its problems).
 */
export function perform(doc: EditorDocument, action: Action): EditorDocument {
  if (isIntegrityAction(action)) return performIntegrity(doc, action);
  switch (action.type) {
    case 'set-title':
      return action.title === doc.title ? doc : { ...doc, title: action.title };
    case 'set-source':
      return action.source === doc.source ? doc : { ...doc, source: action.source };
    case 'edit-label':
      return mapRow(doc, action.rowId, (r) => (r.label === action.text ? r : { ...r, label: action.text }));
    case 'edit-value':
      return mapRow(doc, action.rowId, (r) => (r.valueText === action.text ? r : { ...r, valueText: action.text }));
    case 'set-row-glyph':
      return mapRow(doc, action.rowId, (r) => {
        if ((r.glyph ?? null) === action.glyph) return r;
        const { glyph: _old, ...rest } = r;
        return action.glyph === null ? rest : { ...rest, glyph: action.glyph };
      });
    case 'add-row': {
      if (doc.rows.length >= MAX_ROWS) return doc;
      const { row, next } = newRow(doc, { label: unusedLabel(doc.rows), valueText: '' });
      const at = action.afterRowId ? doc.rows.findIndex((r) => r.id === action.afterRowId) + 1 : doc.rows.length;
      const rows = [...doc.rows];
      rows.splice(at <= 0 ? doc.rows.length : at, 0, row);
      return { ...doc, rows, nextRowNumber: next };
    }
    case 'remove-row': {
      const rows = doc.rows.filter((r) => r.id !== action.rowId);
      return rows.length === doc.rows.length ? doc : { ...doc, rows };
    }
    case 'move-row': {
      const i = doc.rows.findIndex((r) => r.id === action.rowId);
      const j = i + action.by;
      if (i < 0 || j < 0 || j >= doc.rows.length) return doc;
      const rows = [...doc.rows];
      [rows[i], rows[j]] = [rows[j], rows[i]];
      return { ...doc, rows };
    }
    case 'paste-table': {
      const pasted = parseTable(action.text).rows;
      if (pasted.length === 0) return doc;
      let nextRowNumber = doc.nextRowNumber;
      const fresh = (): string => `r${nextRowNumber++}`;
      const start = action.atRowId ? doc.rows.findIndex((r) => r.id === action.atRowId) : -1;
      if (start < 0) {
        const rows = pasted.slice(0, MAX_ROWS).map((p): EditorRow => ({ id: fresh(), ...p }));
        return { ...doc, rows, nextRowNumber };
      }
      const rows = [...doc.rows];
      pasted.forEach((p, k) => {
        const at = start + k;
        if (at < rows.length) {
          const { glyph: _old, ...kept } = rows[at];
          rows[at] = p.glyph !== undefined ? { ...kept, label: p.label, valueText: p.valueText, glyph: p.glyph } : { ...rows[at], label: p.label, valueText: p.valueText };
        } else if (rows.length < MAX_ROWS) rows.push({ id: fresh(), ...p });
      });
      return { ...doc, rows, nextRowNumber };
    }
    case 'set-mode':
      return action.mode === doc.encoding.mode ? doc : { ...doc, encoding: { ...doc.encoding, mode: action.mode } };
    case 'set-unit': {
      if ((doc.encoding.unit ?? null) === action.unit) return doc;
      if (action.unit !== null && !(Number.isFinite(action.unit) && action.unit > 0)) return doc;
      const { unit: _old, ...rest } = doc.encoding;
      return { ...doc, encoding: action.unit === null ? rest : { ...rest, unit: action.unit } };
    }
    case 'set-unit-name': {
      if ((doc.encoding.unitName ?? '') === action.unitName) return doc;
      const { unitName: _old, ...rest } = doc.encoding;
      return { ...doc, encoding: action.unitName === '' ? rest : { ...rest, unitName: action.unitName } };
    }
    case 'add-own-glyph':
      return { ...doc, glyphs: { ...(doc.glyphs ?? {}), [action.name]: { ...action.glyph } }, encoding: { ...doc.encoding, glyph: action.name } };
    case 'remove-own-glyph': {
      if (!doc.glyphs || !(action.name in doc.glyphs)) return doc;
      const { [action.name]: _gone, ...kept } = doc.glyphs;
      const fallback = (g: unknown) => g === action.name;
      const rows = doc.rows.map((r) => {
        if (!fallback(r.glyph)) return r;
        const { glyph: _old, ...rest } = r;
        return rest;
      });
      const next: EditorDocument = { ...doc, rows, encoding: fallback(doc.encoding.glyph) ? { ...doc.encoding, glyph: 'square' } : doc.encoding };
      if (Object.keys(kept).length > 0) next.glyphs = kept;
      else delete next.glyphs;
      return next;
    }
    case 'set-glyph':
      return action.glyph === doc.encoding.glyph ? doc : { ...doc, encoding: { ...doc.encoding, glyph: action.glyph } };
    case 'set-rounding':
      return action.rounding === doc.encoding.rounding ? doc : { ...doc, encoding: { ...doc.encoding, rounding: action.rounding } };
    case 'set-arrangement':
      return action.arrangement === doc.encoding.arrangement ? doc : { ...doc, encoding: { ...doc.encoding, arrangement: action.arrangement } };
    case 'set-fill-to':
      return action.fillTo === doc.encoding.fillTo ? doc : { ...doc, encoding: { ...doc.encoding, fillTo: action.fillTo } };
    case 'set-colors': {
      const colors = action.colors && action.colors.length > 0 ? [...action.colors] : undefined;
      if (sameColors(colors, doc.layout.colors)) return doc;
      const { colors: _old, ...rest } = doc.layout;
      return { ...doc, layout: colors ? { ...rest, colors } : rest };
    }
    case 'set-page-size': {
      const { width, height } = action;
      if (!(width > 0 && height > 0 && Number.isFinite(width) && Number.isFinite(height))) return doc;
      if (width === doc.page.width && height === doc.page.height) return doc;
      return { ...doc, page: { ...doc.page, width, height } };
    }
    case 'set-page-unit': {
      if (action.unit === doc.page.unit) return doc;
      const factor = PAGE_UNIT_MM[doc.page.unit] / PAGE_UNIT_MM[action.unit];
      return {
        ...doc,
        page: { unit: action.unit, width: roundLength(doc.page.width * factor, action.unit), height: roundLength(doc.page.height * factor, action.unit) },
      };
    }
    case 'set-margins': {
      const m = action.margins;
      const values = [m.top, m.right, m.bottom, m.left];
      if (!values.every((v) => Number.isFinite(v) && v >= 0)) return doc;
      const old = doc.layout.margins;
      if (m.top === old.top && m.right === old.right && m.bottom === old.bottom && m.left === old.left) return doc;
      return { ...doc, layout: { ...doc.layout, margins: { top: m.top, right: m.right, bottom: m.bottom, left: m.left } } };
    }
    case 'set-bleed':
      if (!(Number.isFinite(action.bleedMm) && action.bleedMm >= 0) || action.bleedMm === doc.layout.bleedMm) return doc;
      return { ...doc, layout: { ...doc.layout, bleedMm: action.bleedMm } };
    case 'set-background': {
      const next = action.background !== null && /^#[0-9a-f]{6}$/i.test(action.background) ? action.background.toLowerCase() : undefined;
      if (next === doc.layout.background) return doc;
      const { background: _old, ...rest } = doc.layout;
      return { ...doc, layout: next ? { ...rest, background: next } : rest };
    }
    case 'set-show':
      return doc.layout[action.what] === action.on ? doc : { ...doc, layout: { ...doc.layout, [action.what]: action.on } };
    case 'set-row-color': {
      const color = action.color === null ? null : opaqueHex(action.color);
      if (action.color !== null && color === null) return doc;
      return mapRow(doc, action.rowId, (r) => {
        if ((r.color ?? null) === color) return r;
        const { color: _old, ...rest } = r;
        return color === null ? rest : { ...rest, color };
      });
    }
    case 'set-glyph-size': {
      const size = action.glyphSizeMm;
      if (size !== null && !(Number.isFinite(size) && size > 0)) return doc;
      if ((doc.layout.glyphSizeMm ?? null) === size) return doc;
      const { glyphSizeMm: _old, ...rest } = doc.layout;
      return { ...doc, layout: size === null ? rest : { ...rest, glyphSizeMm: size } };
    }
    case 'set-gap':
      if (!(Number.isFinite(action.gapRatio) && action.gapRatio >= 0 && action.gapRatio <= MAX_GAP_RATIO) || action.gapRatio === doc.layout.gapRatio) return doc;
      return { ...doc, layout: { ...doc.layout, gapRatio: action.gapRatio } };
    case 'set-columns': {
      const c = action.columns;
      if (c !== 'auto' && !(Number.isInteger(c) && c >= 1)) return doc;
      return c === doc.layout.columns ? doc : { ...doc, layout: { ...doc.layout, columns: c } };
    }
    case 'set-direction':
      return action.direction === doc.layout.direction ? doc : { ...doc, layout: { ...doc.layout, direction: action.direction } };
    // Choices at their default are removed rather than written, so a document saves back as it was.
    case 'set-group-every':
      if (!GROUP_EVERY_CHOICES.includes(action.groupEvery)) return doc;
      return withLayoutField(doc, 'groupEvery', action.groupEvery === 0 ? undefined : action.groupEvery);
    case 'set-label-position':
      if (!LABEL_POSITIONS.includes(action.labelPosition)) return doc;
      return withLayoutField(doc, 'labelPosition', action.labelPosition === 'beside' ? undefined : action.labelPosition);
    case 'set-label-align':
      return LABEL_ALIGNS.includes(action.labelAlign) ? withLayoutField(doc, 'labelAlign', action.labelAlign) : doc;
    case 'set-value-unit':
      return withLayoutField(doc, 'valueUnit', action.valueUnit === '' ? undefined : action.valueUnit);
    case 'set-sort':
      if (!SORT_ORDERS.includes(action.sort)) return doc;
      return withLayoutField(doc, 'sort', action.sort === 'given' ? undefined : action.sort);
    case 'set-title-size':
      return inRange(action.sizePt, TITLE_SIZE_PT_RANGE) ? withLayoutField(doc, 'titleSizePt', action.sizePt ?? undefined) : doc;
    case 'set-source-size':
      return inRange(action.sizePt, SOURCE_SIZE_PT_RANGE) ? withLayoutField(doc, 'sourceSizePt', action.sizePt ?? undefined) : doc;
    case 'set-font':
      if (!TEXT_FONTS.includes(action.font)) return doc;
      return withLayoutField(doc, 'font', action.font === 'sans' ? undefined : action.font);
    case 'set-key-wording':
      return withLayoutField(doc, 'keyWording', action.keyWording === '' ? undefined : action.keyWording);
  }
}

/**
 * Actions that continue the previous one (typing in the same cell) share one undo step; the key
 * says what "the same" means. null: always a step of its own.
 */
export function coalesceKey(action: Action): string | null {
  switch (action.type) {
    case 'edit-label':
    case 'edit-value':
      return `${action.type}:${action.rowId}`;
    case 'set-title':
    case 'set-source':
    case 'set-unit-name':
      return action.type;
    case 'set-unit':
      return action.typing ? 'set-unit:typing' : null;
    case 'set-row-color':
      return action.typing ? `${action.type}:${action.rowId}:typing` : null;
    case 'set-colors':
    case 'set-background':
    case 'set-glyph-size':
    case 'set-gap':
    case 'set-columns':
    case 'set-title-size':
    case 'set-source-size':
      return action.typing ? `${action.type}:typing` : null;
    case 'set-value-unit':
    case 'set-key-wording':
      return action.type;
    default:
      return null;
  }
}
