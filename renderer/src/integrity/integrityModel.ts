// What the integrity panel shows and what its buttons do, as pure data: findings grouped by severity, the
// findings set aside with their reasons, which button a fix becomes (a direct edit or a dialog), and the
// dialogs' forms turned into one editor action or a sentence saying what is missing. No DOM here.
import type { DataColumn, DismissedFinding, PerCapitaStep, PriceIndexStep, PriceIndexTable, Standardisation } from '../../../shared-core/standardise';
import type { Action } from '../editor/actions';
import { formatNumber, readNumber, type EditorDocument } from '../editor/editorDocument';
import type { RuleFindingView } from '../render/renderTypes';

export type SeverityGroup = 'blocking' | 'warning' | 'advice';

export const SEVERITY_HEADINGS: Readonly<Record<SeverityGroup, string>> = Object.freeze({
  blocking: 'Blocks export',
  warning: 'Warnings',
  advice: 'Advice',
});

export interface GroupedFindings {
  groups: { severity: SeverityGroup; findings: RuleFindingView[] }[];
  openCount: number;
}

/** Open findings by severity, blocking first; empty groups left out. */
export function groupFindings(findings: readonly RuleFindingView[]): GroupedFindings {
  const open = findings.filter((f) => f.dismissedReason === undefined);
  const groups = (['blocking', 'warning', 'advice'] as const).map((severity) => ({ severity, findings: open.filter((f) => f.severity === severity) })).filter((g) => g.findings.length > 0);
  return { groups, openCount: open.length };
}

/** One entry of the "Set aside" list: the document's dismissal, with the finding it hides when the rule still fires. */
export interface SetAsideEntry {
  dismissal: DismissedFinding;
  finding: RuleFindingView | null;
}

/** Every dismissal kept in the document, in its order; a dismissal whose finding no longer fires is listed too. */
export function setAsideEntries(dismissed: readonly DismissedFinding[], findings: readonly RuleFindingView[]): SetAsideEntry[] {
  return dismissed.map((d) => ({
    dismissal: d,
    finding: findings.find((f) => f.dismissedReason !== undefined && (f.code === d.code || f.code.startsWith(`${d.code}-`)) && (d.category === undefined || d.category === f.category)) ?? null,
  }));
}

/** Blocking findings stop the export and cannot be set aside; warnings and advice can. */
export function canDismiss(finding: Pick<RuleFindingView, 'severity'>): boolean {
  return finding.severity !== 'blocking';
}

export type DialogKind = 'per-capita' | 'price-index' | 'source' | 'unit-name';

/** What a fix button does: an edit at once, or a dialog that asks for what the edit needs. */
export type FixPlan = { kind: 'edit'; action: Action } | { kind: 'dialog'; dialog: DialogKind; suggestion?: Record<string, unknown> } | null;

function stepOf(payload: Record<string, unknown> | undefined): Record<string, unknown> | undefined {
  const step = payload?.step;
  return typeof step === 'object' && step !== null ? (step as Record<string, unknown>) : undefined;
}

/** The button a finding's fix becomes in the app, or null for a kind the app cannot apply. */
export function planFix(action: { kind: string; payload?: Record<string, unknown> } | undefined): FixPlan {
  if (!action) return null;
  const p = action.payload ?? {};
  switch (action.kind) {
    case 'apply-per-capita':
      return { kind: 'dialog', dialog: 'per-capita', ...(stepOf(p) ? { suggestion: stepOf(p) } : {}) };
    case 'apply-price-index':
      return { kind: 'dialog', dialog: 'price-index', ...(stepOf(p) ? { suggestion: stepOf(p) } : {}) };
    case 'set-source':
      return { kind: 'dialog', dialog: 'source' };
    case 'set-unit-name':
      return { kind: 'dialog', dialog: 'unit-name' };
    case 'show-legend':
      return { kind: 'edit', action: { type: 'set-show', what: 'legend', on: true } };
    case 'remove-adjustments':
      return { kind: 'edit', action: { type: 'remove-adjustments' } };
    case 'reapply-adjustments':
      return { kind: 'edit', action: { type: 'reapply-adjustments' } };
    case 'set-unit':
      return typeof p.unit === 'number' && Number.isFinite(p.unit) && p.unit > 0 ? { kind: 'edit', action: { type: 'set-unit', unit: p.unit } } : null;
    case 'set-rounding':
      return p.rounding === 'ink-cut' || p.rounding === 'whole' ? { kind: 'edit', action: { type: 'set-rounding', rounding: p.rounding } } : null;
    case 'set-mode':
      return p.mode === 'repeat' || p.mode === 'stack' || p.mode === 'scale' || p.mode === 'fill' ? { kind: 'edit', action: { type: 'set-mode', mode: p.mode } } : null;
    default:
      return null;
  }
}

/** The money rule also fires without an index in the document; the dialog lets the designer type one. */
export function priceFixFor(finding: RuleFindingView): FixPlan {
  if (finding.action) return planFix(finding.action);
  return finding.code === 'money-nominal' ? { kind: 'dialog', dialog: 'price-index' } : null;
}

// ---------------------------------------------------------------------------------------------
// Per capita

/** Rate bases offered first; any other positive number can be typed. */
export const PER_CHOICES: readonly number[] = [1, 1_000, 100_000];

/** Column names that already hold group sizes, for the dialog's first guess (as the size rule reads them). */
const SIZE_WORDS = /population|residents|inhabitants|people|persons|households|pupils|students|members|employees|staff|visitors|size/i;

export interface PerCapitaForm {
  columnName: string;
  baseName: string;
  /** What was typed per row, by row id. */
  baseTexts: Record<string, string>;
  per: number | 'custom';
  customPerText: string;
}

/** The dialog's first state: a size column of the document (or the rule's suggestion), its figures per row, per 100,000. */
export function initialPerCapitaForm(doc: EditorDocument, suggestion?: Record<string, unknown>): PerCapitaForm {
  const columns = doc.carried?.standardise?.columns ?? {};
  const suggested = typeof suggestion?.column === 'string' ? suggestion.column : undefined;
  const columnName = suggested ?? Object.keys(columns).find((c) => SIZE_WORDS.test(c) || SIZE_WORDS.test(columns[c].unitName ?? '')) ?? 'population';
  const column = columns[columnName];
  const baseTexts: Record<string, string> = {};
  for (const row of doc.rows) {
    const cell = column?.values[row.label.trim()];
    baseTexts[row.id] = typeof cell === 'number' ? formatNumber(cell) : typeof cell === 'string' ? cell : '';
  }
  const per = typeof suggestion?.per === 'number' && suggestion.per > 0 ? suggestion.per : 100_000;
  return {
    columnName,
    baseName: column?.unitName ?? 'residents',
    baseTexts,
    per: PER_CHOICES.includes(per) ? per : 'custom',
    customPerText: PER_CHOICES.includes(per) ? '' : formatNumber(per),
  };
}

export type FormResult<T> = { ok: true; value: T } | { ok: false; problems: string[] };

/** Names of the document's extra columns, for the dialog's choice of base column. */
export function columnNames(doc: EditorDocument): string[] {
  return Object.keys(doc.carried?.standardise?.columns ?? {});
}

/** The form with another base column: an existing column's figures and unit fill the rows; a new name keeps what was typed. */
export function withBaseColumn(doc: EditorDocument, form: PerCapitaForm, columnName: string): PerCapitaForm {
  const column = doc.carried?.standardise?.columns?.[columnName.trim()];
  if (!column) return { ...form, columnName };
  const baseTexts: Record<string, string> = {};
  for (const row of doc.rows) {
    const cell = column.values[row.label.trim()];
    baseTexts[row.id] = typeof cell === 'number' ? formatNumber(cell) : typeof cell === 'string' ? cell : '';
  }
  return { ...form, columnName, baseTexts, baseName: column.unitName ?? form.baseName };
}

/** The apply-adjustment action a per-capita form asks for, or every problem with it (each row named). */
export function perCapitaAction(doc: EditorDocument, form: PerCapitaForm): FormResult<Extract<Action, { type: 'apply-adjustment' }>> {
  const problems: string[] = [];
  const columnName = form.columnName.trim();
  const baseName = form.baseName.trim();
  if (columnName === '') problems.push('Name the column of base figures (for example "population").');
  if (baseName === '') problems.push('Say what the base counts (for example "residents").');
  let per: number | null = typeof form.per === 'number' ? form.per : null;
  if (form.per === 'custom') {
    const read = readNumber(form.customPerText);
    if (!read.ok || !(read.value > 0)) problems.push('The rate base must be a number above 0, such as 10,000.');
    else per = read.value;
  }
  const values: Record<string, number> = {};
  for (const [i, row] of doc.rows.entries()) {
    const label = row.label.trim() || `row ${i + 1}`;
    const read = readNumber(form.baseTexts[row.id] ?? '');
    if (!read.ok) problems.push(`${label}: ${read.message === 'Enter a value.' ? `enter its ${baseName || 'base'} figure.` : read.message}`);
    else if (!(read.value > 0)) problems.push(`${label}: a rate needs a ${baseName || 'base'} figure above 0.`);
    else values[row.label.trim()] = read.value;
  }
  if (problems.length > 0 || per === null) return { ok: false, problems };
  const column: DataColumn = { unitName: baseName, values };
  const step: PerCapitaStep = { kind: 'per-capita', column: columnName, per, baseName };
  return { ok: true, value: { type: 'apply-adjustment', step, columns: { [columnName]: column } } };
}

// ---------------------------------------------------------------------------------------------
// Price adjustment

export interface PriceForm {
  /** Each row's period as typed, by row id (the row's label unless changed). */
  periodTexts: Record<string, string>;
  /** 'period': one index value per distinct period (a supplied table); 'row': one per row (an index column). */
  indexBy: 'period' | 'row';
  /** Index values as typed: by period text when indexBy is 'period', by row id when 'row'. */
  indexTexts: Record<string, string>;
  basePeriod: string;
  indexName: string;
}

/** Column names the rules read as each row's period. */
const PERIOD_COLUMN = 'period';
/** The column an index typed per row is kept in. */
export const INDEX_COLUMN = 'price index';

/** The distinct periods of the form, in row order. */
export function formPeriods(doc: EditorDocument, form: Pick<PriceForm, 'periodTexts'>): string[] {
  const out: string[] = [];
  for (const row of doc.rows) {
    const p = (form.periodTexts[row.id] ?? row.label).trim();
    if (p !== '' && !out.includes(p)) out.push(p);
  }
  return out;
}

/** The dialog's first state: periods from a period column or the labels, the document's index table, the latest period as base. */
export function initialPriceForm(doc: EditorDocument, suggestion?: Record<string, unknown>): PriceForm {
  const std: Standardisation | undefined = doc.carried?.standardise;
  const periodColumn = std?.columns?.[PERIOD_COLUMN] ?? std?.columns?.year ?? std?.columns?.date;
  const periodTexts: Record<string, string> = {};
  for (const row of doc.rows) {
    const cell = periodColumn?.values[row.label.trim()];
    periodTexts[row.id] = cell !== undefined ? String(cell) : row.label.trim();
  }
  const table = std?.priceIndex?.values ?? {};
  const indexColumn = std?.columns?.[INDEX_COLUMN];
  const indexBy: PriceForm['indexBy'] = indexColumn && Object.keys(table).length === 0 ? 'row' : 'period';
  const indexTexts: Record<string, string> = {};
  if (indexBy === 'row') {
    for (const row of doc.rows) {
      const cell = indexColumn?.values[row.label.trim()];
      indexTexts[row.id] = cell !== undefined ? String(cell) : '';
    }
  } else {
    for (const p of formPeriods(doc, { periodTexts })) indexTexts[p] = table[p] !== undefined ? formatNumber(table[p]) : '';
  }
  const periods = formPeriods(doc, { periodTexts });
  const suggested = typeof suggestion?.basePeriod === 'string' && periods.includes(suggestion.basePeriod) ? suggestion.basePeriod : undefined;
  return { periodTexts, indexBy, indexTexts, basePeriod: suggested ?? periods[periods.length - 1] ?? '', indexName: std?.priceIndex?.name ?? '' };
}

/** The apply-adjustment action a price form asks for, or every problem with it. */
export function priceAction(doc: EditorDocument, form: PriceForm): FormResult<Extract<Action, { type: 'apply-adjustment' }>> {
  const problems: string[] = [];
  const periods = formPeriods(doc, form);
  const base = form.basePeriod.trim();
  if (base === '' || !periods.includes(base)) problems.push('Choose the base period: the period whose money every amount is shown in.');
  const columns: Record<string, DataColumn> = {};
  // A period column only when some period differs from its row's label; labels are the periods otherwise.
  const periodValues: Record<string, string> = {};
  let periodsDiffer = false;
  for (const [i, row] of doc.rows.entries()) {
    const p = (form.periodTexts[row.id] ?? '').trim();
    if (p === '') problems.push(`${row.label.trim() || `row ${i + 1}`}: enter its period.`);
    periodValues[row.label.trim()] = p;
    if (p !== row.label.trim()) periodsDiffer = true;
  }
  if (periodsDiffer) columns[PERIOD_COLUMN] = { values: periodValues };
  const indexValue = (text: string | undefined, what: string): number | null => {
    const read = readNumber(text ?? '');
    if (!read.ok) problems.push(`${what}: ${read.message === 'Enter a value.' ? 'enter its index value.' : read.message}`);
    else if (!(read.value > 0)) problems.push(`${what}: an index value must be above 0.`);
    else return read.value;
    return null;
  };
  let priceIndex: PriceIndexTable | null | undefined;
  const step: PriceIndexStep = { kind: 'price-index', basePeriod: base };
  if (periodsDiffer) step.periodColumn = PERIOD_COLUMN;
  const name = form.indexName.trim();
  if (form.indexBy === 'period') {
    const values: Record<string, number> = {};
    for (const p of periods) {
      const v = indexValue(form.indexTexts[p], p);
      if (v !== null) values[p] = v;
    }
    priceIndex = { ...(name ? { name } : {}), values };
  } else {
    const values: Record<string, number> = {};
    for (const [i, row] of doc.rows.entries()) {
      const v = indexValue(form.indexTexts[row.id], row.label.trim() || `row ${i + 1}`);
      if (v !== null) values[row.label.trim()] = v;
    }
    columns[INDEX_COLUMN] = { ...(name ? { unitName: name } : {}), values };
    step.indexColumn = INDEX_COLUMN;
  }
  if (problems.length > 0) return { ok: false, problems };
  return { ok: true, value: { type: 'apply-adjustment', step, ...(Object.keys(columns).length > 0 ? { columns } : {}), ...(priceIndex !== undefined ? { priceIndex } : {}) } };
}
