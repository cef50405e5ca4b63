// The integrity panel: what the chart rules found beyond the lie factor (money not adjusted for prices,
// totals of groups of different size, unstated unit or source...), grouped by severity, each with its fix,
// the source it rests on, and a button where the app can apply the fix; the adjustments applied, with their
// footnote; and the findings set aside with the reason the designer gave.
import { useEffect, useRef, useState, type ReactElement } from 'react';
import { CHART_RULES } from '../../../shared-core/integrity/rules/index';
import { adjustmentFootnote } from '../../../shared-core/standardise';
import type { Action } from '../editor/actions';
import type { EditorDocument } from '../editor/editorDocument';
import { adjustDocument } from '../editor/integrityActions';
import { ruleWords } from './ruleWords';
import type { RuleFindingView } from '../render/renderTypes';
import { canDismiss, groupFindings, priceFixFor, SEVERITY_HEADINGS, setAsideEntries, type DialogKind } from './integrityModel';
import { PerCapitaDialog, PriceIndexDialog, TextDialog } from './IntegrityDialogs';
import './integrity.css';

interface IntegrityPanelProps {
  doc: EditorDocument;
  /** The rules' findings of the last check (dismissed ones marked), or null before the first. */
  findings: RuleFindingView[] | null;
  /** False while the findings belong to an earlier version of the document. */
  current: boolean;
  dispatch: (action: Action) => void;
  onNotice: (text: string, tone?: 'info' | 'error') => void;
}

type OpenDialog =
  | { kind: DialogKind; suggestion?: Record<string, unknown> }
  | { kind: 'dismiss'; finding: RuleFindingView };

function ruleNameOf(code: string): string {
  return CHART_RULES.find((r) => code === r.code || code.startsWith(`${r.code}-`))?.name ?? code;
}

export function IntegrityPanel({ doc, findings, current, dispatch, onNotice }: IntegrityPanelProps): ReactElement {
  const [dialog, setDialog] = useState<OpenDialog | null>(null);
  const panel = useRef<HTMLElement>(null);
  const fallback = () => panel.current;
  // A fix removes its own finding (and its button) once the chart is checked again; focus that was on it
  // would fall to the page, so it is kept in the panel. Removing a focused element fires no blur.
  const focusInside = useRef(false);
  useEffect(() => {
    if (focusInside.current && dialog === null && (document.activeElement === document.body || document.activeElement === null)) panel.current?.focus();
  }, [findings, doc, dialog]);
  const close = () => setDialog(null);
  const all = findings ?? [];
  const { groups, openCount } = groupFindings(all);
  const dismissed = doc.carried?.dismissed ?? [];
  const setAside = setAsideEntries(dismissed, all);
  const std = doc.carried?.standardise;
  const footnote = adjustmentFootnote(std);
  const steps = std?.adjustments?.steps ?? [];
  const hasStep = (kind: string) => steps.some((s) => s.kind === kind);

  /** Edits that cannot fail apply at once; an adjustment that cannot be repeated says why instead. */
  const applyEdit = (action: Action) => {
    if (action.type === 'remove-adjustments' || action.type === 'reapply-adjustments') {
      const out = adjustDocument(doc, action);
      if (!out.ok) {
        onNotice(out.message, 'error');
        return;
      }
    }
    dispatch(action);
  };

  const fixButton = (f: RuleFindingView): ReactElement | null => {
    const plan = priceFixFor(f);
    if (!plan) return null;
    const label = ruleWords(f.action?.label ?? (plan.kind === 'dialog' && plan.dialog === 'price-index' ? 'Adjust for prices…' : 'Fix'));
    const dialogLabel = plan.kind === 'dialog' && !label.endsWith('…') ? `${label}…` : label;
    return (
      <button
        type="button"
        className="button fix-button"
        disabled={!current}
        title={ruleWords(f.fix)}
        data-testid="integrity-fix"
        onClick={() => (plan.kind === 'edit' ? applyEdit(plan.action) : setDialog({ kind: plan.dialog, ...(plan.suggestion ? { suggestion: plan.suggestion } : {}) }))}
      >
        {dialogLabel}
      </button>
    );
  };

  return (
    <section
      className="panel integrity"
      aria-labelledby="integrity-title"
      id="integrity-panel"
      tabIndex={-1}
      ref={panel}
      data-testid="integrity-panel"
      onFocus={() => (focusInside.current = true)}
      onBlur={(e) => {
        if (!panel.current?.contains(e.relatedTarget as Node | null) && !(e.relatedTarget as HTMLElement | null)?.closest?.('.integrity-dialog')) focusInside.current = false;
      }}
    >
      <header className="panel-head">
        <h2 id="integrity-title">Integrity</h2>
        <span className="panel-sub">units, scale, context, labels</span>
        <span className="integrity-count" data-testid="integrity-count">{findings === null ? '' : openCount === 0 ? 'clear' : `${openCount} open`}</span>
      </header>
      <div className={current ? 'panel-body' : 'panel-body integrity-stale'} aria-busy={!current}>
        {findings === null && <p className="muted">The rules run with each check of the chart.</p>}
        {findings !== null && openCount === 0 && (
          <p className="ok-text" data-testid="integrity-clear">
            No findings: units, scale, time steps and labelling look sound.
          </p>
        )}
        {groups.map((g) => (
          <div key={g.severity} className={`integrity-group ${g.severity}`} data-testid={`integrity-group-${g.severity}`}>
            <h3>
              {SEVERITY_HEADINGS[g.severity]} <span className="integrity-group-count">{g.findings.length}</span>
            </h3>
            <ul className="integrity-findings">
              {g.findings.map((f) => (
                <li key={`${f.code}/${f.category ?? ''}`} className={`integrity-finding ${f.severity}`} data-testid="integrity-finding" data-code={f.code}>
                  <p className="integrity-finding-name">
                    {f.ruleName}
                    {f.category !== undefined && <span className="integrity-category"> · {f.category}</span>}
                  </p>
                  <p className="integrity-message">{ruleWords(f.message)}</p>
                  <p className="integrity-fix-text">
                    <span className="integrity-label">Fix</span> {ruleWords(f.fix)}
                  </p>
                  {f.basis && (
                    <p className="integrity-basis">
                      <span className="integrity-label">Basis</span> {f.basis}
                    </p>
                  )}
                  <div className="integrity-buttons">
                    {fixButton(f)}
                    {canDismiss(f) && (
                      <button type="button" className="button subtle" disabled={!current} onClick={() => setDialog({ kind: 'dismiss', finding: f })} data-testid="integrity-dismiss">
                        Set aside…
                      </button>
                    )}
                  </div>
                </li>
              ))}
            </ul>
          </div>
        ))}

        <div className="integrity-adjust" data-testid="integrity-adjustments">
          <h3>Adjust values</h3>
          {footnote ? (
            <p className="integrity-footnote" data-testid="integrity-footnote">
              On the chart: “{footnote}”
            </p>
          ) : (
            <p className="muted small">Show values per head or in the money of one period; the chart then says so in a footnote.</p>
          )}
          <div className="integrity-buttons">
            <button type="button" className="button" onClick={() => setDialog({ kind: 'per-capita' })} disabled={hasStep('per-capita')} title={hasStep('per-capita') ? 'Already shown per head: remove the adjustments to change it.' : 'Divide each value by its group’s size'} data-testid="adjust-per-capita">
              Per head…
            </button>
            <button type="button" className="button" onClick={() => setDialog({ kind: 'price-index' })} disabled={hasStep('price-index')} title={hasStep('price-index') ? 'Already adjusted for prices: remove the adjustments to change it.' : 'Convert amounts to the money of one period with a price index'} data-testid="adjust-prices">
              Money of one period…
            </button>
            {steps.length > 0 && (
              <button type="button" className="button subtle" onClick={() => applyEdit({ type: 'remove-adjustments' })} title="Bring back the values as given and drop the footnote" data-testid="adjust-remove">
                Remove adjustments
              </button>
            )}
          </div>
        </div>

        {setAside.length > 0 && (
          <details className="integrity-set-aside" data-testid="integrity-set-aside">
            <summary>Set aside ({setAside.length})</summary>
            <ul>
              {setAside.map(({ dismissal, finding }) => (
                <li key={`${dismissal.code}/${dismissal.category ?? ''}`} data-testid="set-aside-entry" data-code={dismissal.code}>
                  <p className="integrity-finding-name">
                    {finding?.ruleName ?? ruleNameOf(dismissal.code)}
                    {dismissal.category !== undefined && <span className="integrity-category"> · {dismissal.category}</span>}
                    {finding === null && <span className="muted"> (not found now)</span>}
                  </p>
                  {finding && <p className="integrity-message muted">{ruleWords(finding.message)}</p>}
                  <p className="integrity-reason" data-testid="set-aside-reason">
                    <span className="integrity-label">Reason</span> {dismissal.reason}
                  </p>
                  <button type="button" className="button subtle" onClick={() => dispatch({ type: 'bring-back-finding', code: dismissal.code, ...(dismissal.category !== undefined ? { category: dismissal.category } : {}) })} data-testid="bring-back">
                    Bring back
                  </button>
                </li>
              ))}
            </ul>
          </details>
        )}
      </div>

      {dialog?.kind === 'per-capita' && <PerCapitaDialog doc={doc} suggestion={dialog.suggestion} onApply={(a) => (dispatch(a), close())} onClose={close} fallback={fallback} />}
      {dialog?.kind === 'price-index' && <PriceIndexDialog doc={doc} suggestion={dialog.suggestion} onApply={(a) => (dispatch(a), close())} onClose={close} fallback={fallback} />}
      {dialog?.kind === 'source' && (
        <TextDialog
          title="Add the source"
          lead="Where the numbers come from, as it should read under the chart."
          label="Source line"
          initial={doc.source}
          placeholder="Survey of bike counts, city transport office, 2024"
          applyLabel="Add"
          emptyMessage="Type the source, or cancel."
          testId="source-dialog"
          onApply={(text) => (dispatch({ type: 'set-source', source: text }), close())}
          onClose={close}
          fallback={fallback}
        />
      )}
      {dialog?.kind === 'unit-name' && (
        <TextDialog
          title="Name the unit"
          lead="What is counted, so the key reads “one glyph = 50 rides”."
          label="Unit name"
          initial={doc.encoding.unitName ?? ''}
          placeholder="rides"
          applyLabel="Name it"
          emptyMessage="Type what is counted, or cancel."
          testId="unit-name-dialog"
          onApply={(text) => (dispatch({ type: 'set-unit-name', unitName: text }), close())}
          onClose={close}
          fallback={fallback}
        />
      )}
      {dialog?.kind === 'dismiss' && (
        <TextDialog
          title={`Set aside: ${dialog.finding.ruleName}`}
          lead="The finding moves to the “Set aside” list with your reason, which is saved in the chart document. Bring it back at any time."
          label="Reason (required)"
          initial=""
          placeholder="The brief compares two survey years."
          multiline
          applyLabel="Set aside"
          emptyMessage="Give a reason: it is kept with the chart so others can see why this was set aside."
          testId="dismiss-dialog"
          onApply={(reason) => {
            const f = dialog.finding;
            dispatch({ type: 'dismiss-finding', code: f.code, ...(f.category !== undefined ? { category: f.category } : {}), reason });
            close();
          }}
          onClose={close}
          fallback={fallback}
        />
      )}
    </section>
  );
}
