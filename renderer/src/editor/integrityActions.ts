// The editor actions of the integrity panel: adjustments (per capita, prices, share, index), their removal
// and replay, and findings set aside with a reason. Each is one undo step; the document's standardise and
// dismissed blocks (EditorDocument.carried) are what they change, so Save and Open keep them.
import { isTallyError } from '../../../shared-core/errors';
import {
  applyAdjustment,
  removeAdjustments,
  type AdjustableChart,
  type AdjustmentStep,
  type DataColumn,
  type DismissedFinding,
  type PriceIndexTable,
  type Standardisation,
} from '../../../shared-core/standardise';
import { formatNumber, readNumber, type EditorDocument } from './editorDocument';

export type IntegrityAction =
  /**
   * One more adjustment step. columns: extra columns to add or replace first (a population typed in the
   * dialog); priceIndex: the index table to keep (null removes it). The chart's amount per glyph goes back to
   * automatic, because the values change scale.
   */
  | { type: 'apply-adjustment'; step: AdjustmentStep; columns?: Record<string, DataColumn>; priceIndex?: PriceIndexTable | null }
  /** The values and unit name as they were before any adjustment; the steps are forgotten. */
  | { type: 'remove-adjustments' }
  /** The recorded steps run again from the recorded original values (after a value was edited by hand). */
  | { type: 'reapply-adjustments' }
  /** A warning or advice set aside; the reason is required and kept in the document. */
  | { type: 'dismiss-finding'; code: string; category?: string; reason: string }
  /** A finding set aside earlier is shown again. */
  | { type: 'bring-back-finding'; code: string; category?: string };

export type IntegrityActionType = IntegrityAction['type'];

export const INTEGRITY_ACTION_NAMES: Readonly<Record<IntegrityActionType, string>> = Object.freeze({
  'apply-adjustment': 'adjustment',
  'remove-adjustments': 'removal of adjustments',
  'reapply-adjustments': 'new run of adjustments',
  'dismiss-finding': 'setting a finding aside',
  'bring-back-finding': 'bringing a finding back',
});

const INTEGRITY_TYPES: ReadonlySet<string> = new Set(Object.keys(INTEGRITY_ACTION_NAMES));

export function isIntegrityAction(action: { type: string }): action is IntegrityAction {
  return INTEGRITY_TYPES.has(action.type);
}

export type AdjustOutcome = { ok: true; document: EditorDocument } | { ok: false; message: string };

/** The table as numbers by trimmed label, or the first cell that stops it (an adjustment needs every value). */
function chartOf(doc: EditorDocument): { ok: true; chart: AdjustableChart } | { ok: false; message: string } {
  const data: AdjustableChart['data'] = [];
  for (const [i, row] of doc.rows.entries()) {
    const read = readNumber(row.valueText);
    if (!read.ok) return { ok: false, message: `Fix the table first: row ${i + 1} (${row.label.trim() || 'no label'}): ${read.message}` };
    data.push({ label: row.label.trim(), value: read.value });
  }
  const unitName = doc.encoding.unitName?.trim();
  return { ok: true, chart: { data, encoding: unitName ? { unitName } : {}, ...(doc.carried?.standardise ? { standardise: doc.carried.standardise } : {}) } };
}

/** The editor document with the adjusted chart's values, unit name and standardise block. */
function withChart(doc: EditorDocument, chart: AdjustableChart, resetUnit: boolean): EditorDocument {
  const byLabel = new Map(chart.data.map((r) => [r.label, r.value]));
  const rows = doc.rows.map((r) => {
    const v = byLabel.get(r.label.trim());
    return v === undefined ? r : { ...r, valueText: formatNumber(v) };
  });
  const { unitName: _oldName, unit: _oldUnit, ...restEncoding } = doc.encoding;
  const encoding: EditorDocument['encoding'] = { ...restEncoding };
  if (!resetUnit && doc.encoding.unit !== undefined) encoding.unit = doc.encoding.unit;
  if (chart.encoding.unitName !== undefined) encoding.unitName = chart.encoding.unitName;
  const carried = { ...doc.carried };
  if (chart.standardise && Object.keys(chart.standardise).length > 0) carried.standardise = chart.standardise;
  else delete carried.standardise;
  const next: EditorDocument = { ...doc, rows, encoding };
  if (Object.keys(carried).length > 0) next.carried = carried;
  else delete next.carried;
  return next;
}

function failed(e: unknown): AdjustOutcome {
  if (isTallyError(e)) return { ok: false, message: e.message };
  throw e;
}

/**
 * The document after an adjustment action, or the sentence saying why it cannot be done (a missing
 * population, a period the index lacks...). Pure: the dialogs call it to show the problem, the reducer to act.
 */
export function adjustDocument(doc: EditorDocument, action: Extract<IntegrityAction, { type: 'apply-adjustment' | 'remove-adjustments' | 'reapply-adjustments' }>): AdjustOutcome {
  const read = chartOf(doc);
  if (!read.ok) return read;
  const chart = read.chart;
  try {
    switch (action.type) {
      case 'apply-adjustment': {
        const std: Standardisation = { ...chart.standardise };
        if (action.columns) std.columns = { ...std.columns, ...action.columns };
        if (action.priceIndex === null) delete std.priceIndex;
        else if (action.priceIndex) std.priceIndex = action.priceIndex;
        return { ok: true, document: withChart(doc, applyAdjustment({ ...chart, standardise: std }, action.step), true) };
      }
      case 'remove-adjustments': {
        if (!chart.standardise?.adjustments) return { ok: false, message: 'No adjustment is applied to this chart.' };
        return { ok: true, document: withChart(doc, removeAdjustments(chart), true) };
      }
      case 'reapply-adjustments': {
        const steps = chart.standardise?.adjustments?.steps ?? [];
        if (steps.length === 0) return { ok: false, message: 'No adjustment is applied to this chart.' };
        const replayed = steps.reduce((c, step) => applyAdjustment(c, step), removeAdjustments(chart));
        return { ok: true, document: withChart(doc, replayed, false) };
      }
    }
  } catch (e) {
    return failed(e);
  }
}

function sameDismissal(d: DismissedFinding, code: string, category: string | undefined): boolean {
  return d.code === code && d.category === category;
}

/** The document after an integrity action; the same object when nothing changes (or the change is refused). */
export function performIntegrity(doc: EditorDocument, action: IntegrityAction): EditorDocument {
  switch (action.type) {
    case 'apply-adjustment':
    case 'remove-adjustments':
    case 'reapply-adjustments': {
      const out = adjustDocument(doc, action);
      return out.ok ? out.document : doc;
    }
    case 'dismiss-finding': {
      const reason = action.reason.trim();
      if (reason === '' || action.code.trim() === '') return doc;
      const kept = (doc.carried?.dismissed ?? []).filter((d) => !sameDismissal(d, action.code, action.category));
      const entry: DismissedFinding = { code: action.code, ...(action.category !== undefined ? { category: action.category } : {}), reason };
      return { ...doc, carried: { ...doc.carried, dismissed: [...kept, entry] } };
    }
    case 'bring-back-finding': {
      const list = doc.carried?.dismissed ?? [];
      const kept = list.filter((d) => !sameDismissal(d, action.code, action.category));
      if (kept.length === list.length) return doc;
      const carried = { ...doc.carried };
      if (kept.length > 0) carried.dismissed = kept;
      else delete carried.dismissed;
      const next: EditorDocument = { ...doc };
      if (Object.keys(carried).length > 0) next.carried = carried;
      else delete next.carried;
      return next;
    }
  }
}
