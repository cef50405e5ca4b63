// The small dialogs the integrity panel opens when a fix needs input: values per head (a base figure per
// row), money of one period (a price index), the source line, the unit's name, and the reason for setting
// a finding aside. Each ends in one editor action, so each is one undo step.
import { useId, useMemo, useState, type ReactElement, type ReactNode } from 'react';
import type { Action } from '../editor/actions';
import type { EditorDocument } from '../editor/editorDocument';
import { adjustDocument } from '../editor/integrityActions';
import { formatValue } from '../honesty/formatHonesty';
import { columnNames, formPeriods, initialPerCapitaForm, withBaseColumn, initialPriceForm, perCapitaAction, PER_CHOICES, priceAction, type PerCapitaForm, type PriceForm } from './integrityModel';
import { useDialogFocus } from './useDialogFocus';

interface FrameProps {
  title: string;
  testId: string;
  onClose: () => void;
  /** Where focus goes on close when the opening button is gone. */
  fallback: () => HTMLElement | null;
  children: ReactNode;
  wide?: boolean;
}

function DialogFrame({ title, testId, onClose, fallback, children, wide }: FrameProps): ReactElement {
  const titleId = useId();
  const { ref, onKeyDown } = useDialogFocus(onClose, fallback);
  return (
    <div className="dialog-backdrop" onMouseDown={(e) => e.target === e.currentTarget && onClose()}>
      <div className={wide ? 'dialog integrity-dialog wide' : 'dialog integrity-dialog'} role="dialog" aria-modal="true" aria-labelledby={titleId} ref={ref} onKeyDown={onKeyDown} data-testid={testId}>
        <h2 id={titleId}>{title}</h2>
        {children}
      </div>
    </div>
  );
}

function Problems({ problems }: { problems: string[] }): ReactElement | null {
  if (problems.length === 0) return null;
  return (
    <div className="dialog-note bad" role="alert" data-testid="dialog-problems">
      <ul className="plain-list">
        {problems.slice(0, 8).map((p, i) => (
          <li key={i}>{p}</li>
        ))}
        {problems.length > 8 && <li>and {problems.length - 8} more</li>}
      </ul>
    </div>
  );
}

interface AdjustDialogProps {
  doc: EditorDocument;
  suggestion?: Record<string, unknown>;
  onApply: (action: Action) => void;
  onClose: () => void;
  fallback: () => HTMLElement | null;
}

/** The values the action would give, by row id, for the dialog's preview column; null while the form is incomplete. */
function previewOf(doc: EditorDocument, action: Extract<Action, { type: 'apply-adjustment' }> | null): { values: Map<string, string>; unitName: string } | null {
  if (!action) return null;
  const out = adjustDocument(doc, action);
  if (!out.ok) return null;
  return { values: new Map(out.document.rows.map((r) => [r.id, r.valueText])), unitName: out.document.encoding.unitName ?? '' };
}

function applyOrSay(doc: EditorDocument, action: Extract<Action, { type: 'apply-adjustment' }>, onApply: (a: Action) => void, setProblems: (p: string[]) => void): void {
  const out = adjustDocument(doc, action);
  if (!out.ok) {
    setProblems([out.message]);
    return;
  }
  onApply(action);
}

export function PerCapitaDialog({ doc, suggestion, onApply, onClose, fallback }: AdjustDialogProps): ReactElement {
  const [form, setForm] = useState<PerCapitaForm>(() => initialPerCapitaForm(doc, suggestion));
  const [problems, setProblems] = useState<string[]>([]);
  const result = useMemo(() => perCapitaAction(doc, form), [doc, form]);
  const preview = useMemo(() => previewOf(doc, result.ok ? result.value : null), [doc, result]);
  const unitName = doc.encoding.unitName?.trim() || 'values';
  const columnListId = useId();
  const set = (patch: Partial<PerCapitaForm>) => {
    setForm((f) => ({ ...f, ...patch }));
    setProblems([]);
  };
  return (
    <DialogFrame title="Show values per head" testId="per-capita-dialog" onClose={onClose} fallback={fallback} wide>
      <p className="dialog-lead">Each value is divided by its group’s size and multiplied by the rate base, so groups of different size compare fairly. The chart says so in a footnote; the values as given are kept and can be brought back.</p>
      <div className="integrity-form-grid">
        <label>
          <span>Column</span>
          <input
            value={form.columnName}
            list={columnListId}
            onChange={(e) => {
              setForm((f) => withBaseColumn(doc, f, e.target.value));
              setProblems([]);
            }}
            data-testid="per-capita-column"
          />
          <datalist id={columnListId}>
            {columnNames(doc).map((c) => (
              <option key={c} value={c} />
            ))}
          </datalist>
        </label>
        <label>
          <span>The base counts</span>
          <input value={form.baseName} onChange={(e) => set({ baseName: e.target.value })} placeholder="residents" data-testid="per-capita-base-name" />
        </label>
        <label>
          <span>Per</span>
          <select value={form.per === 'custom' ? 'custom' : String(form.per)} onChange={(e) => set({ per: e.target.value === 'custom' ? 'custom' : Number(e.target.value) })} data-testid="per-capita-per">
            {PER_CHOICES.map((p) => (
              <option key={p} value={p}>
                {p === 1 ? '1 (per head)' : p.toLocaleString('en-US')}
              </option>
            ))}
            <option value="custom">Other…</option>
          </select>
        </label>
        {form.per === 'custom' && (
          <label>
            <span>Rate base</span>
            <input value={form.customPerText} inputMode="decimal" onChange={(e) => set({ customPerText: e.target.value })} placeholder="10,000" data-testid="per-capita-custom" />
          </label>
        )}
      </div>
      <div className="integrity-table-wrap">
        <table className="integrity-table">
          <thead>
            <tr>
              <th scope="col">Category</th>
              <th scope="col" className="num">{unitName}</th>
              <th scope="col">{form.baseName.trim() || 'Base'} (one figure per row)</th>
              <th scope="col" className="num">Result</th>
            </tr>
          </thead>
          <tbody>
            {doc.rows.map((row, i) => (
              <tr key={row.id}>
                <th scope="row">{row.label}</th>
                <td className="num">{row.valueText}</td>
                <td>
                  <input
                    value={form.baseTexts[row.id] ?? ''}
                    inputMode="decimal"
                    aria-label={`${form.baseName.trim() || 'Base'} of ${row.label.trim() || `row ${i + 1}`}`}
                    data-autofocus={i === 0 ? true : undefined}
                    onChange={(e) => set({ baseTexts: { ...form.baseTexts, [row.id]: e.target.value } })}
                    data-testid="per-capita-base"
                  />
                </td>
                <td className="num muted">{preview ? formatValue(Number(preview.values.get(row.id))) : '—'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {preview && <p className="dialog-lead small">New unit: <strong>{preview.unitName}</strong>. One glyph’s amount is chosen again automatically.</p>}
      <Problems problems={problems} />
      <div className="dialog-actions">
        <button type="button" className="button" onClick={onClose}>
          Cancel
        </button>
        <button type="button" className="button primary" data-testid="per-capita-apply" onClick={() => (result.ok ? applyOrSay(doc, result.value, onApply, setProblems) : setProblems(result.problems))}>
          Apply
        </button>
      </div>
    </DialogFrame>
  );
}

export function PriceIndexDialog({ doc, suggestion, onApply, onClose, fallback }: AdjustDialogProps): ReactElement {
  const [form, setForm] = useState<PriceForm>(() => initialPriceForm(doc, suggestion));
  const [problems, setProblems] = useState<string[]>([]);
  const periods = useMemo(() => formPeriods(doc, form), [doc, form]);
  const result = useMemo(() => priceAction(doc, form), [doc, form]);
  const preview = useMemo(() => previewOf(doc, result.ok ? result.value : null), [doc, result]);
  const set = (patch: Partial<PriceForm>) => {
    setForm((f) => ({ ...f, ...patch }));
    setProblems([]);
  };
  const setIndexBy = (indexBy: PriceForm['indexBy']) => {
    // Carry what was typed across: a row's value becomes its period's, a period's value each of its rows'.
    const texts: Record<string, string> = {};
    if (indexBy === 'row') for (const row of doc.rows) texts[row.id] = form.indexTexts[(form.periodTexts[row.id] ?? row.label).trim()] ?? '';
    else for (const row of doc.rows) {
      const p = (form.periodTexts[row.id] ?? row.label).trim();
      if (texts[p] === undefined || texts[p] === '') texts[p] = form.indexTexts[row.id] ?? '';
    }
    set({ indexBy, indexTexts: texts });
  };
  const indexKeys = form.indexBy === 'period' ? periods.map((p) => ({ key: p, label: p })) : doc.rows.map((r, i) => ({ key: r.id, label: r.label.trim() || `row ${i + 1}` }));
  return (
    <DialogFrame title="Show money of one period" testId="price-dialog" onClose={onClose} fallback={fallback} wide>
      <p className="dialog-lead">Each amount becomes amount × index of the base period ÷ index of its own period, so rising prices alone no longer make later amounts look larger. The chart says so in a footnote; the amounts as given are kept.</p>
      <div className="integrity-table-wrap">
        <table className="integrity-table">
          <thead>
            <tr>
              <th scope="col">Category</th>
              <th scope="col" className="num">Amount</th>
              <th scope="col">Period</th>
              <th scope="col" className="num">Result</th>
            </tr>
          </thead>
          <tbody>
            {doc.rows.map((row, i) => (
              <tr key={row.id}>
                <th scope="row">{row.label}</th>
                <td className="num">{row.valueText}</td>
                <td>
                  <input value={form.periodTexts[row.id] ?? ''} aria-label={`Period of ${row.label.trim() || `row ${i + 1}`}`} onChange={(e) => set({ periodTexts: { ...form.periodTexts, [row.id]: e.target.value } })} data-testid="price-period" />
                </td>
                <td className="num muted">{preview ? formatValue(Number(preview.values.get(row.id))) : '—'}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <fieldset className="integrity-fieldset">
        <legend>Price index</legend>
        <div className="integrity-radio-row" role="radiogroup" aria-label="Index values given">
          <label>
            <input type="radio" name="index-by" checked={form.indexBy === 'period'} onChange={() => setIndexBy('period')} /> One value per period
          </label>
          <label>
            <input type="radio" name="index-by" checked={form.indexBy === 'row'} onChange={() => setIndexBy('row')} /> One value per row
          </label>
        </div>
        <div className="integrity-index-grid">
          {indexKeys.map(({ key, label }, i) => (
            <label key={key}>
              <span>{label}</span>
              <input
                value={form.indexTexts[key] ?? ''}
                inputMode="decimal"
                aria-label={`Index value of ${label}`}
                data-autofocus={i === 0 ? true : undefined}
                onChange={(e) => set({ indexTexts: { ...form.indexTexts, [key]: e.target.value } })}
                data-testid="price-index-value"
              />
            </label>
          ))}
        </div>
        <div className="integrity-form-grid">
          <label>
            <span>Base period</span>
            <select value={periods.includes(form.basePeriod) ? form.basePeriod : ''} onChange={(e) => set({ basePeriod: e.target.value })} data-testid="price-base">
              {!periods.includes(form.basePeriod) && <option value="">Choose…</option>}
              {periods.map((p) => (
                <option key={p} value={p}>
                  {p}
                </option>
              ))}
            </select>
          </label>
          <label className="span-2">
            <span>Index name (for the footnote)</span>
            <input value={form.indexName} onChange={(e) => set({ indexName: e.target.value })} placeholder="the consumer price index (2015 = 100)" data-testid="price-index-name" />
          </label>
        </div>
      </fieldset>
      {preview && <p className="dialog-lead small">New unit: <strong>{preview.unitName}</strong>. One glyph’s amount is chosen again automatically.</p>}
      <Problems problems={problems} />
      <div className="dialog-actions">
        <button type="button" className="button" onClick={onClose}>
          Cancel
        </button>
        <button type="button" className="button primary" data-testid="price-apply" onClick={() => (result.ok ? applyOrSay(doc, result.value, onApply, setProblems) : setProblems(result.problems))}>
          Apply
        </button>
      </div>
    </DialogFrame>
  );
}

interface TextDialogProps {
  title: string;
  lead: string;
  label: string;
  initial: string;
  placeholder?: string;
  multiline?: boolean;
  applyLabel: string;
  /** The sentence shown when the field is left empty. */
  emptyMessage: string;
  testId: string;
  onApply: (text: string) => void;
  onClose: () => void;
  fallback: () => HTMLElement | null;
}

/** One required line (or paragraph) of text: the source, the unit's name, a reason for setting a finding aside. */
export function TextDialog({ title, lead, label, initial, placeholder, multiline, applyLabel, emptyMessage, testId, onApply, onClose, fallback }: TextDialogProps): ReactElement {
  const [text, setText] = useState(initial);
  const [problem, setProblem] = useState<string | null>(null);
  const fieldId = useId();
  const submit = () => {
    if (text.trim() === '') {
      setProblem(emptyMessage);
      return;
    }
    onApply(text.trim());
  };
  return (
    <DialogFrame title={title} testId={testId} onClose={onClose} fallback={fallback}>
      <p className="dialog-lead">{lead}</p>
      <div className="field">
        <label htmlFor={fieldId}>{label}</label>
        {multiline ? (
          <textarea id={fieldId} value={text} rows={3} placeholder={placeholder} aria-invalid={problem !== null} data-autofocus onChange={(e) => (setText(e.target.value), setProblem(null))} data-testid={`${testId}-text`} />
        ) : (
          <input
            id={fieldId}
            value={text}
            placeholder={placeholder}
            aria-invalid={problem !== null}
            data-autofocus
            onChange={(e) => (setText(e.target.value), setProblem(null))}
            onKeyDown={(e) => {
              if (e.key === 'Enter') submit();
            }}
            data-testid={`${testId}-text`}
          />
        )}
      </div>
      {problem && <Problems problems={[problem]} />}
      <div className="dialog-actions">
        <button type="button" className="button" onClick={onClose}>
          Cancel
        </button>
        <button type="button" className="button primary" onClick={submit} data-testid={`${testId}-apply`}>
          {applyLabel}
        </button>
      </div>
    </DialogFrame>
  );
}

