// The honesty check: what the written file measures per category against the smallest value, the
// worst pair, the spread, the verdict, print findings, and when refused, why and what to change.
import { useContext, type ReactElement } from 'react';
import type { HonestyView } from '../render/renderTypes';
import { toUiWords } from '../honesty/findingWords';
import { formatDrawn, formatFactor, formatGraphic, formatValue, inkPixels, meterPosition, readingSentence, rowFormula } from '../honesty/formatHonesty';
import { Icon } from './Icon';
import { pickableRow, RowPickContext } from '../preview/rowPick';

/** What a row's cell says when its pair has no usable lie factor; "not drawn" is kept for rows without ink. */
const PAIR_PROBLEM_WORDS: Readonly<Record<string, string>> = {
  'reference-not-drawn': 'no reference drawn',
  'not-drawn': 'not drawn',
  'wrong-direction': 'drawn the wrong way',
  'no-difference': 'no difference drawn',
};

const DRAWN_HEADINGS = { glyphs: 'Glyphs', mm: 'Height (mm)', mm2: 'Ink (mm²)', share: 'Filled' } as const;

/** A remedy the designer can apply with one click; the app checked that it is possible. */
export interface OneClickFix {
  /** The words on the button, in the app's vocabulary ("Cut by ink", "Use 25 per glyph"). */
  label: string;
  /** What the click changes and why it passes. */
  title: string;
  apply: () => void;
}

export type HonestyState =
  | { kind: 'checked'; honesty: HonestyView; current: boolean }
  /** previous: the last check, shown faded below, so the figures do not vanish while a cell is fixed. */
  | { kind: 'waiting'; title: string; problems: string[]; previous: HonestyView | null }
  | { kind: 'failed'; title: string; message: string }
  | { kind: 'pending' };

interface HonestyPanelProps {
  state: HonestyState;
  ppi: number;
  /** One-click remedies for a refusal, in the order offered. */
  fixes?: OneClickFix[];
}

function Meter({ value, limits }: { value: number | null; limits: { low: number; high: number } }): ReactElement | null {
  if (value === null) return null;
  const lo = meterPosition(limits.low, limits);
  const hi = meterPosition(limits.high, limits);
  const at = meterPosition(value, limits);
  const inside = value >= limits.low && value <= limits.high;
  return (
    <span className="meter" aria-hidden="true">
      <span className="meter-band" style={{ left: `calc(4px + (100% - 8px) * ${lo.toFixed(4)})`, width: `calc((100% - 8px) * ${(hi - lo).toFixed(4)})` }} />
      <span className="meter-one" />
      <span className={inside ? 'meter-dot ok' : 'meter-dot bad'} style={{ left: `calc((100% - 8px) * ${at.toFixed(4)})` }} />
    </span>
  );
}

/** Test ids only on the check of the document on screen, never on a faded earlier one. */
function testId(id: string, current: boolean): string | undefined {
  return current ? id : undefined;
}

function Verdict({ honesty, current, fixes }: { honesty: HonestyView; current: boolean; fixes: OneClickFix[] }): ReactElement {
  const { limits } = honesty;
  const allowed = `${limits.low.toFixed(2)}–${limits.high.toFixed(2)}`;
  if (honesty.pass) {
    return (
      <div className={current ? 'verdict pass' : 'verdict pass stale'} data-testid="verdict" data-verdict="pass" data-current={current}>
        <div className="verdict-head">
          <Icon name="check" size={18} />
          <span>Honest — ready to export</span>
        </div>
        <p className="verdict-line">
          {honesty.worst ? (
            <>
              Worst lie factor <strong data-testid={testId('worst-factor', current)}>{formatFactor(honesty.worst.lieFactor, limits)}</strong> ({honesty.worst.label} against {honesty.worst.reference}), allowed {allowed}.
            </>
          ) : (
            <>Nothing to compare: {honesty.notes[0] ?? 'a single category.'}</>
          )}
        </p>
      </div>
    );
  }
  const blocking = honesty.findings.filter((f) => f.severity === 'blocking');
  const first = blocking[0];
  const reason = toUiWords(first?.message ?? honesty.reason ?? honesty.problems[0] ?? 'It did not pass the check.');
  // The fix of each finding is its own; general suggestions only add what the findings do not say.
  const ownFixes = new Set(blocking.map((f) => f.fix));
  // "Or use a smaller unit" reads oddly once the sentence it followed is shown as the fix above.
  const suggestions = honesty.suggestions.filter((sg) => !ownFixes.has(sg)).map((sg) => toUiWords(sg).replace(/^Or (\w)/, (_, c: string) => c.toUpperCase()));
  return (
    <div className={current ? 'verdict refused' : 'verdict refused stale'} data-testid="verdict" data-verdict="refused" data-current={current} role="alert">
      <div className="verdict-head">
        <Icon name="stop" size={18} />
        <span>Refused — this chart misstates the data</span>
      </div>
      <p className="verdict-reason" data-testid={testId('refusal-reason', current)}>{reason}</p>
      {first?.fix && (
        <p className="verdict-fix" data-testid={testId('refusal-fix', current)}>
          <span className="fixes-title">What to change</span> {toUiWords(first.fix)}
        </p>
      )}
      {current && fixes.length > 0 && (
        <div className="fix-buttons" data-testid="fix-buttons">
          {fixes.map((f) => (
            <button key={f.label} type="button" className="button fix-button" title={f.title} onClick={f.apply}>
              {f.label}
            </button>
          ))}
        </div>
      )}
      {blocking.length > 1 && (
        <details className="more-problems" open={blocking.length <= 3}>
          <summary>{blocking.length - 1} more {blocking.length === 2 ? 'problem' : 'problems'}</summary>
          <ul data-testid={testId('more-findings', current)}>
            {blocking.slice(1).map((f, i) => (
              <li key={i}>
                {toUiWords(f.message)}
                {f.fix && f.fix !== first?.fix && <span className="finding-fix"> {toUiWords(f.fix)}</span>}
              </li>
            ))}
          </ul>
        </details>
      )}
      {blocking.length === 0 && honesty.problems.length > 1 && (
        <details className="more-problems">
          <summary>{honesty.problems.length - 1} more {honesty.problems.length === 2 ? 'problem' : 'problems'}</summary>
          <ul>
            {honesty.problems.slice(1).map((p, i) => (
              <li key={i}>{toUiWords(p)}</li>
            ))}
          </ul>
        </details>
      )}
      {suggestions.length > 0 && (
        <div className="fixes">
          <span className="fixes-title">{first?.fix ? 'Also worth trying' : 'How to fix it'}</span>
          <ul data-testid={testId('suggestions', current)}>
            {suggestions.map((sg, i) => (
              <li key={i}>{sg}</li>
            ))}
          </ul>
        </div>
      )}
    </div>
  );
}

export function HonestyPanel({ state, ppi, fixes = [] }: HonestyPanelProps): ReactElement {
  return (
    <aside className="panel honesty" aria-label="Honesty check" id="honesty-check" tabIndex={-1}>
      <header className="panel-head">
        <h2>Honesty check</h2>
        <span className="panel-sub">measured on the written file</span>
      </header>
      <div className="panel-body" data-testid="honesty-panel">
        {state.kind === 'pending' && <p className="muted">Measuring the chart…</p>}
        {state.kind === 'waiting' && (
          <div className="verdict waiting" data-testid="verdict" data-verdict="waiting" data-current="true">
            <div className="verdict-head">
              <Icon name="stop" size={18} />
              <span>{state.title}</span>
            </div>
            <ul className="plain-list">
              {state.problems.slice(0, 6).map((p, i) => (
                <li key={i}>{p}</li>
              ))}
            </ul>
          </div>
        )}
        {state.kind === 'waiting' && state.previous && (
          <div className="previous-check" aria-label="Last check before the table changed">
            <p className="section-note">The last check, before this change:</p>
            <CheckedDetails honesty={state.previous} current={false} ppi={ppi} fixes={[]} />
          </div>
        )}
        {state.kind === 'failed' && (
          <div className="verdict refused" data-testid="verdict" data-verdict="failed" data-current="true" role="alert">
            <div className="verdict-head">
              <Icon name="stop" size={18} />
              <span>{state.title}</span>
            </div>
            <p className="verdict-reason">{state.message}</p>
          </div>
        )}
        {state.kind === 'checked' && <CheckedDetails honesty={state.honesty} current={state.current} ppi={ppi} fixes={fixes} />}
      </div>
    </aside>
  );
}

function CheckedDetails({ honesty, current, ppi, fixes }: { honesty: HonestyView; current: boolean; ppi: number; fixes: OneClickFix[] }): ReactElement {
  const pick = useContext(RowPickContext);
  const { limits } = honesty;
  const unitWord = honesty.rows[0]?.graphicUnit ?? 'glyphs';
  const referenceRow = honesty.rows.find((r) => r.isReference);
  const worstRow = honesty.worst ? honesty.rows.find((r) => r.label === honesty.worst?.label) : undefined;
  const worstFormula = worstRow ? rowFormula(worstRow, referenceRow) : null;
  const smallestPx = honesty.smallestGlyph ? inkPixels(honesty.smallestGlyph.inkMm2, ppi) : null;
  return (
    <>
      <Verdict honesty={honesty} current={current} fixes={fixes} />

      <section className="check-section">
        <h3>Each category against the smallest</h3>
        <p className="section-note">
          Read by {readingSentence(honesty.reading)}. {honesty.reference ? <>Reference: <strong>{honesty.reference.label}</strong> ({formatValue(honesty.reference.value)}).</> : null}
        </p>
        <table className="factor-table" data-testid={testId('factor-table', current)}>
          <thead>
            <tr>
              <th scope="col">Category</th>
              <th scope="col" className="num col-value">Value</th>
              <th scope="col" className="num col-drawn">{DRAWN_HEADINGS[unitWord]}</th>
              <th scope="col" className="num col-factor">Lie factor</th>
              <th scope="col" className="col-meter"><span className="sr-only">Position in the allowed band</span></th>
            </tr>
          </thead>
          <tbody>
            {honesty.rows.map((r) => {
              const outside = r.lieFactor !== null && (r.lieFactor < limits.low || r.lieFactor > limits.high);
              return (
                <tr key={r.label} className={[r.isWorst ? 'worst' : '', outside || r.problem ? 'outside' : ''].join(' ').trim() || undefined} data-label={r.label} {...pickableRow(pick, r.label, current)}>
                  <th scope="row" title={r.label}>{r.label}</th>
                  <td className="num">{formatValue(r.value)}</td>
                  <td className="num" title={formatGraphic(r.graphic, r.graphicUnit)}>{formatDrawn(r.graphic, r.graphicUnit)}</td>
                  <td className="num factor" data-testid={testId('row-factor', current)} title={rowTitle(r, referenceRow)}>
                    {r.isReference ? <span className="ref-tag">{r.drawn ? 'reference' : 'reference, not drawn'}</span> : !r.drawn ? <span className="bad-text">not drawn</span> : r.problem ? <span className="bad-text">{PAIR_PROBLEM_WORDS[r.problem] ?? 'no lie factor'}</span> : formatFactor(r.lieFactor, limits)}
                    {r.basis === 'ratio' && <span className="basis-tag" title="The values differ by less than 2%, so the ratio form is used">ratio</span>}
                  </td>
                  <td className="meter-cell">{!r.isReference && <Meter value={r.lieFactor} limits={limits} />}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
        <dl className="figures">
          <div>
            <dt>Worst pair</dt>
            <dd data-testid={testId('worst-pair', current)}>{honesty.worst ? `${honesty.worst.label} vs ${honesty.worst.reference}: ${formatFactor(honesty.worst.lieFactor, limits)}` : '—'}</dd>
            {worstFormula && (
              <dd className="figure-note" data-testid={testId('worst-formula', current)}>
                = {worstFormula}
              </dd>
            )}
          </div>
          <div>
            <dt>Spread</dt>
            <dd data-testid={testId('spread', current)}>{honesty.spread === null ? '—' : formatFactor(honesty.spread, { low: 1 / limits.high, high: Math.min(limits.high, 1 / limits.low) })}</dd>
            <dd className="figure-note">Largest ÷ smallest drawn-to-value ratio; 1 = one scale for all.</dd>
          </div>
          <div>
            <dt>Allowed</dt>
            <dd>
              {limits.low.toFixed(2)} to {limits.high.toFixed(2)} <span className="muted">(Tufte)</span>
            </dd>
          </div>
        </dl>
        <p className="section-note small">
          Lie factor = change shown ÷ change in the data, each change counted from the reference: (drawn ratio − 1) ÷ (value ratio − 1). 1 is faithful; {unitWord === 'glyphs' ? 'glyph counts' : 'measurements'} come from the exported file itself.
        </p>
      </section>

      <section className="check-section">
        <h3>Print preflight</h3>
        {honesty.preflight.length === 0 ? (
          <p className="ok-text" data-testid={testId('preflight-clear', current)}>No findings: strokes, text sizes, safe area and bleed look fine.</p>
        ) : (
          <ul className="findings" data-testid={testId('preflight', current)}>
            {honesty.preflight.map((f, i) => (
              <li key={i}>
                <span className="finding-code">{f.code.replace(/-/g, ' ')}</span>
                {f.message}
              </li>
            ))}
          </ul>
        )}
        {smallestPx !== null && honesty.smallestGlyph && (
          <p className="section-note small">
            Smallest glyph ({honesty.smallestGlyph.label}): {formatGraphic(honesty.smallestGlyph.inkMm2, 'mm2')} of ink, about {Math.round(smallestPx).toLocaleString('en-US')} px at {ppi} ppi.
          </p>
        )}
        <p className="section-note small muted">Preflight follows printers’ common practice; it never blocks an export.</p>
      </section>

      {(honesty.warnings.length > 0 || honesty.notes.length > 0) && (
        <section className="check-section">
          <h3>Notes</h3>
          <ul className="findings">
            {honesty.notes.map((n, i) => (
              <li key={`n${i}`}>{n}</li>
            ))}
            {honesty.warnings.map((w, i) => (
              <li key={`w${i}`}>{w.message}</li>
            ))}
          </ul>
        </section>
      )}
    </>
  );
}

/** The factor cell's tooltip: the lie factor written out from the row's own figures. */
function rowTitle(row: HonestyView['rows'][number], reference: HonestyView['rows'][number] | undefined): string | undefined {
  const formula = rowFormula(row, reference);
  return formula ? `${formula}${row.basis === 'ratio' ? ' (ratio form: the values differ by less than 2%)' : ''}` : undefined;
}
