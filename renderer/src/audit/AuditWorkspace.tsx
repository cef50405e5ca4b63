// The audit workspace: a supplied drawing (opened or dropped) with its marks outlined and numbered,
// the values confirmed by the designer, the lie factor under every reading with its arithmetic, and
// the two honest answers (rescale the marks in place, or redraw as a verified unit chart), ending in
// the side-by-side sheet for the client.
import { useCallback, useEffect, useMemo, useState, type DragEvent, type ReactElement } from 'react';
import type { AuditReport } from '../../../shared-core/audit/auditReport';
import { buildRedrawSheet, imageAsSvg } from '../../../shared-core/audit/buildRedrawSheet';
import { buildSheet } from '../../../shared-core/audit/buildSheet';
import { correctSvg, type CorrectionResult } from '../../../shared-core/audit/correctSvg';
import { formatFactor, formatMeasure } from '../../../shared-core/audit/formatNumbers';
import { sanitizedCopy } from '../../../shared-core/audit/sanitizedCopy';
import { READING_NAMES, type ReadingName } from '../../../shared-core/audit/types';
import { isTallyError } from '../../../shared-core/errors';
import { safeFileName, type HostApi } from '../../../shared-core/host';
import { Icon } from '../components/Icon';
import { bytesToBase64 } from '../host/browserHost';
import { auditDetection, detectRaster, detectSvg, type Detection } from './detectMarks';
import { readingArithmetic } from './readingArithmetic';
import { base64ToBytes, readSupplied, type SuppliedGraphic } from './readSupplied';
import { redrawAsUnitChart } from './redrawChart';
import './audit.css';

const CAUTION_KEY = 'tallyglyph.audit-caution-seen/1';
const READING_LABELS: Record<ReadingName, string> = { length: 'Length', area: 'Area', volume: 'Volume', count: 'Count' };

type Answer =
  | { kind: 'corrected'; svg: string; correction: CorrectionResult }
  | { kind: 'redrawn'; svg: string; lieFactor: number | null; mode: 'repeat' | 'stack' };

interface Loaded {
  graphic: SuppliedGraphic;
  detection: Detection;
  /** What the <img> shows: a sanitised copy of an SVG, or the image's own bytes. */
  displayUrl: string;
  /** The supplied drawing as SVG text for the sheet (an image wrapped in an SVG). */
  sheetSource: string;
}

function messageOf(e: unknown): string {
  return isTallyError(e) ? e.message : e instanceof Error ? e.message : String(e);
}

function readCaution(): boolean {
  try {
    return localStorage.getItem(CAUTION_KEY) === 'yes';
  } catch {
    return false;
  }
}

/** The supplied SVG re-serialised without anything active, framed like the detection so outlines line up. */
function displaySvg(detection: Detection): string {
  const imp = detection.imported;
  if (!imp) throw new Error('An SVG detection always carries its import.');
  const copy = sanitizedCopy(imp.root, 'shown-');
  const f = detection.frame;
  return `<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" width="${f.width}" height="${f.height}" viewBox="${f.x} ${f.y} ${f.width} ${f.height}"><g${copy.rootAttributes}>${copy.markup}</g></svg>`;
}

function stemOf(name: string): string {
  return name.replace(/\.[A-Za-z0-9]{1,5}$/, '') || 'supplied';
}

export function AuditWorkspace({ host, onNotice, hidden = false }: { host: HostApi; onNotice: (text: string, tone?: 'info' | 'error') => void; hidden?: boolean }): ReactElement {
  const [loaded, setLoaded] = useState<Loaded | null>(null);
  const [valueText, setValueText] = useState<string[]>([]);
  const [chosen, setChosen] = useState<ReadingName | null>(null);
  const [answer, setAnswer] = useState<Answer | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [cautionSeen, setCautionSeen] = useState(readCaution);
  const [dragging, setDragging] = useState(false);
  const [redrawMode, setRedrawMode] = useState<'repeat' | 'stack'>('repeat');
  const [ppi, setPpi] = useState(300);
  const [busy, setBusy] = useState(false);

  useEffect(() => () => {
    if (loaded) URL.revokeObjectURL(loaded.displayUrl);
  }, [loaded]);

  const load = useCallback(
    async (name: string, bytes: Uint8Array) => {
      setBusy(true);
      try {
        const graphic = await readSupplied(name, bytes);
        const detection = graphic.kind === 'svg' ? detectSvg(graphic.text) : detectRaster(graphic.image);
        const displayUrl =
          graphic.kind === 'svg'
            ? URL.createObjectURL(new Blob([displaySvg(detection)], { type: 'image/svg+xml' }))
            : URL.createObjectURL(new Blob([graphic.bytes as BlobPart], { type: graphic.mime }));
        const sheetSource = graphic.kind === 'svg' ? graphic.text : imageAsSvg(bytesToBase64(graphic.bytes), graphic.mime, graphic.image.widthPx, graphic.image.heightPx);
        setLoaded({ graphic, detection, displayUrl, sheetSource });
        setValueText(detection.prefill.map((p) => (p.value === null ? '' : String(p.value))));
        setChosen(null);
        setAnswer(null);
        setProblem(null);
        const fromLabels = detection.prefill.filter((p) => p.from !== null).length;
        onNotice(`Found ${detection.marks.length} mark${detection.marks.length === 1 ? '' : 's'} in ${name}${fromLabels ? `; ${fromLabels} value${fromLabels === 1 ? '' : 's'} read from the drawing` : ''}.`);
      } catch (e) {
        onNotice(`Could not audit ${name}: ${messageOf(e)}`, 'error');
      } finally {
        setBusy(false);
      }
    },
    [onNotice],
  );

  const open = useCallback(async () => {
    const result = await host.openSupplied({ purpose: 'audit' });
    if (!result.ok) return onNotice(result.error.message, 'error');
    if (result.value) await load(result.value.name, base64ToBytes(result.value.base64));
  }, [host, load, onNotice]);

  const onDrop = useCallback(
    async (e: DragEvent) => {
      e.preventDefault();
      setDragging(false);
      const file = e.dataTransfer.files[0];
      if (!file) return;
      await load(file.name, new Uint8Array(await file.arrayBuffer()));
    },
    [load],
  );

  const values = useMemo(() => valueText.map((t) => (t.trim() === '' ? NaN : Number(t.replace(',', '.')))), [valueText]);
  const valueProblems = values.map((v) => (Number.isFinite(v) ? (v < 0 ? 'Negative values cannot be drawn as sizes.' : null) : 'Type the value this mark stands for.'));
  const allValues = valueProblems.every((p) => p === null);

  const audit: { report: AuditReport | null; error: string | null } = useMemo(() => {
    if (!loaded || !allValues) return { report: null, error: null };
    try {
      return { report: auditDetection(loaded.detection, values), error: null };
    } catch (e) {
      return { report: null, error: messageOf(e) };
    }
  }, [loaded, values, allValues]);
  const report = audit.report;
  const reading: ReadingName | null = report ? (chosen && report.readings[chosen].available ? chosen : report.suggested) : null;

  // Any change to the values or the reading makes an earlier answer out of date.
  useEffect(() => setAnswer(null), [valueText, chosen]);

  const names = loaded?.detection.names ?? [];

  const correct = () => {
    if (!loaded || loaded.graphic.kind !== 'svg' || !report || !reading || reading === 'count') return;
    try {
      const named = Object.fromEntries(loaded.detection.marks.map((m, i) => [m.id, values[i]]));
      const correction = correctSvg(loaded.graphic.text, { values: named, reading });
      setAnswer({ kind: 'corrected', svg: correction.svg, correction });
      setProblem(null);
      onNotice(`Corrected for the ${reading} reading: lie factor ${formatFactor(correction.after.readings[reading].lieFactor.worst)}.`);
    } catch (e) {
      setProblem(`Could not correct in place: ${messageOf(e)}`);
    }
  };

  const redraw = () => {
    if (!loaded || !report) return;
    try {
      const title = loaded.detection.imported ? titleOf(loaded.detection) : undefined;
      const { result } = redrawAsUnitChart({ names, values, mode: redrawMode, glyph: 'square', title });
      setAnswer({ kind: 'redrawn', svg: result.svg, lieFactor: result.report.lieFactor.worst, mode: redrawMode });
      setProblem(null);
      onNotice(`Redrawn as a ${redrawMode} chart and verified from the written file: lie factor ${formatFactor(result.report.lieFactor.worst)}.`);
    } catch (e) {
      setProblem(`Could not redraw: ${messageOf(e)}`);
    }
  };

  const sheet = useMemo((): { svg: string; notes: string[] } | null => {
    if (!loaded || !report || !reading || !answer) return null;
    try {
      const built =
        answer.kind === 'corrected'
          ? buildSheet({ supplied: loaded.sheetSource, corrected: answer.correction.svg, before: answer.correction.before, after: answer.correction.after, reading: answer.correction.reading })
          : buildRedrawSheet({ supplied: loaded.sheetSource, redrawn: answer.svg, before: report, reading, redrawnLieFactor: answer.lieFactor });
      return { svg: built.svg, notes: built.warnings.map((w) => w.message) };
    } catch (e) {
      return { svg: `error:${messageOf(e)}`, notes: [] };
    }
  }, [loaded, report, reading, answer]);
  const sheetSvg = sheet?.svg ?? null;

  const exportSheet = async (format: 'svg' | 'png') => {
    if (!loaded || !sheetSvg) return;
    if (sheetSvg.startsWith('error:')) return onNotice(`The sheet could not be made: ${sheetSvg.slice(6)}`, 'error');
    setBusy(true);
    try {
      const result = await host.exportSheet({ svg: sheetSvg, suggestedName: safeFileName(`${stemOf(loaded.graphic.name)} audit sheet`, format), format, ppi });
      if (!result.ok) onNotice(result.error.message, 'error');
      else if (result.value) onNotice(`Exported ${result.value.name} (${Math.max(1, Math.round(result.value.bytes / 1024))} KB).`);
    } finally {
      setBusy(false);
    }
  };

  const answerUrl = useMemo(() => (answer ? URL.createObjectURL(new Blob([answer.svg], { type: 'image/svg+xml' })) : null), [answer]);
  useEffect(() => () => {
    if (answerUrl) URL.revokeObjectURL(answerUrl);
  }, [answerUrl]);

  const dismissCaution = () => {
    setCautionSeen(true);
    try {
      localStorage.setItem(CAUTION_KEY, 'yes');
    } catch {
      // Without storage the caution simply shows again next time.
    }
  };

  return (
    <main className="workspace audit-workspace" aria-label="Audit a supplied graphic" hidden={hidden}>
      <aside className="panel editor audit-side">
        <div className="section-body">
          <div className="audit-open">
            <button type="button" className="button primary" onClick={() => void open()} disabled={busy} data-testid="audit-open">
              <Icon name="open" /> Open a supplied graphic…
            </button>
            <p className="field-hint">SVG, PNG or JPEG, or drop the file on the drawing area.</p>
          </div>
          {!cautionSeen && (
            <div className="audit-caution" role="note" data-testid="audit-caution">
              <p>The audit measures the drawing; what the client's data mean is your call as the designer.</p>
              <button type="button" className="link-button" onClick={dismissCaution}>
                Understood
              </button>
            </div>
          )}
          {loaded && (
            <>
              <h2 className="audit-heading">Marks and values</h2>
              <p className="field-hint">
                {loaded.detection.marks.length} mark{loaded.detection.marks.length === 1 ? '' : 's'} found, measured in {loaded.detection.unit}s. Type or confirm what each one stands for.
              </p>
              <table className="data-table audit-values" data-testid="audit-values">
                <thead>
                  <tr>
                    <th scope="col">#</th>
                    <th scope="col">Mark</th>
                    <th scope="col">Value</th>
                  </tr>
                </thead>
                <tbody>
                  {loaded.detection.marks.map((m, i) => {
                    const p = loaded.detection.prefill[i];
                    const typed = p.value === null || p.value !== values[i];
                    return (
                      <tr key={m.id} data-mark={i + 1}>
                        <td className="audit-number">{i + 1}</td>
                        <th scope="row" title={m.id}>
                          {names[i]}
                        </th>
                        <td>
                          <input
                            className={valueProblems[i] ? 'cell-input invalid' : 'cell-input'}
                            inputMode="decimal"
                            value={valueText[i] ?? ''}
                            aria-label={`Value of mark ${i + 1}`}
                            aria-invalid={valueProblems[i] !== null}
                            onChange={(e) => setValueText((old) => old.map((t, j) => (j === i ? e.target.value : t)))}
                          />
                          <span className="audit-from">{typed ? 'typed' : p.from === 'file' ? 'from the file' : `from label “${p.labelText}”`}</span>
                        </td>
                      </tr>
                    );
                  })}
                </tbody>
              </table>
              {[...loaded.detection.warnings, ...(report?.warnings.filter((w) => !loaded.detection.warnings.includes(w)) ?? [])].slice(0, 6).map((w, i) => (
                <p key={i} className="field-hint audit-warning">
                  {w.message}
                </p>
              ))}
              {loaded.detection.setAside.slice(0, 4).map((s, i) => (
                <p key={`s${i}`} className="field-hint">
                  Set aside: {s.description}
                </p>
              ))}
            </>
          )}
        </div>
      </aside>

      <section
        className={dragging ? 'stage audit-stage dragging' : 'stage audit-stage'}
        aria-label="Supplied drawing"
        onDragOver={(e) => {
          e.preventDefault();
          setDragging(true);
        }}
        onDragLeave={() => setDragging(false)}
        onDrop={(e) => void onDrop(e)}
        data-testid="audit-drop"
      >
        <div className="stage-bar">
          <span className="stage-title">{loaded ? loaded.graphic.name : 'Supplied drawing'}</span>
          <span className="spacer" />
          {busy && (
            <span className="busy-label on" role="status">
              <span className="spinner" aria-hidden="true" /> Measuring…
            </span>
          )}
        </div>
        <div className="audit-canvas">
          {!loaded && (
            <div className="audit-empty">
              <p className="audit-empty-title">Check a client's mock-up</p>
              <p>Drop an SVG, PNG or JPEG here, or use Open. Every mark is found, measured and numbered; you confirm the values.</p>
            </div>
          )}
          {loaded && (
            <div className={answer ? 'audit-pair' : 'audit-single'}>
              <figure className="audit-figure">
                <figcaption>As supplied{report && reading ? ` · lie factor ${formatFactor(report.readings[reading].lieFactor.worst)}` : ''}</figcaption>
                <div className="audit-frame" style={{ aspectRatio: `${loaded.detection.frame.width} / ${loaded.detection.frame.height}` }}>
                  <img src={loaded.displayUrl} alt={`The supplied drawing ${loaded.graphic.name}`} data-testid="audit-image" />
                  <MarkOutlines detection={loaded.detection} />
                </div>
              </figure>
              {answer && answerUrl && (
                <figure className="audit-figure">
                  <figcaption data-testid="audit-answer-caption">
                    {answer.kind === 'corrected'
                      ? `Corrected for the ${answer.correction.reading} reading · lie factor ${formatFactor(answer.correction.after.readings[answer.correction.reading].lieFactor.worst)}`
                      : `Redrawn as a ${answer.mode} chart · lie factor ${formatFactor(answer.lieFactor)} (verified)`}
                  </figcaption>
                  <div className="audit-frame answer">
                    <img src={answerUrl} alt={answer.kind === 'corrected' ? 'The corrected drawing' : 'The redrawn unit chart'} data-testid="audit-answer" data-kind={answer.kind} />
                  </div>
                </figure>
              )}
            </div>
          )}
        </div>
      </section>

      <aside className="panel audit-readings" aria-label="Readings and lie factors">
        <div className="panel-head">
          <h2>Lie factor by reading</h2>
        </div>
        <div className="panel-body">
          {!loaded && <p className="empty-note">Open a drawing to see how each way of reading it compares with the data.</p>}
          {loaded && !allValues && <p className="empty-note">Type a value for every mark to see the lie factors.</p>}
          {audit.error && <p className="field-problem">{audit.error}</p>}
          {loaded && report && reading && (
            <>
              <p className="audit-verdict" data-testid="audit-verdict" data-pass={String(report.readings[reading].pass)}>
                {report.readings[reading].pass ? 'Faithful' : report.readings[reading].pass === false ? 'Distorted' : 'Not judged'} under the {reading} reading: lie factor {formatFactor(report.readings[reading].lieFactor.worst)} (0.95–1.05 is faithful).
              </p>
              <div role="radiogroup" aria-label="Reading" className="audit-reading-list" data-testid="audit-readings">
                {READING_NAMES.map((name) => {
                  const r = report.readings[name];
                  const arithmetic = readingArithmetic(r, report, names);
                  return (
                    <label key={name} className={name === reading ? 'audit-reading chosen' : 'audit-reading'} data-reading={name}>
                      <span className="audit-reading-head">
                        <input type="radio" name="audit-reading" checked={name === reading} disabled={!r.available} onChange={() => setChosen(name)} />
                        <span className="audit-reading-name">{READING_LABELS[name]}</span>
                        {name === report.suggested && <span className="tag">suggested</span>}
                        <span className="spacer" />
                        <span className={r.pass ? 'audit-factor ok' : r.pass === false ? 'audit-factor bad' : 'audit-factor'} data-testid={`factor-${name}`}>
                          {r.available ? formatFactor(r.lieFactor.worst) : 'n/a'}
                        </span>
                      </span>
                      <span className="audit-arithmetic" data-testid={`arithmetic-${name}`}>
                        {arithmetic}
                      </span>
                    </label>
                  );
                })}
              </div>
              {report.reasons.length > 0 && (
                <p className="field-hint">
                  Why {report.suggested} is suggested: {report.reasons.join(' ')}
                </p>
              )}
              <h2 className="audit-heading">Make it honest</h2>
              <div className="audit-actions">
                <button
                  type="button"
                  className="button"
                  onClick={correct}
                  disabled={loaded.graphic.kind !== 'svg' || reading === 'count'}
                  title={loaded.graphic.kind !== 'svg' ? 'An image cannot be rescaled in place; redraw it instead.' : reading === 'count' ? 'Choose the length, area or volume reading to rescale the marks.' : `Rescale each mark so the ${reading} reading is honest`}
                  data-testid="audit-correct"
                >
                  Correct in place
                </button>
                <div className="audit-redraw">
                  <select value={redrawMode} onChange={(e) => setRedrawMode(e.target.value as 'repeat' | 'stack')} aria-label="Redraw as">
                    <option value="repeat">rows of glyphs</option>
                    <option value="stack">stacked columns</option>
                  </select>
                  <button type="button" className="button" onClick={redraw} data-testid="audit-redraw">
                    Redraw as unit chart
                  </button>
                </div>
              </div>
              {problem && <p className="field-problem">{problem}</p>}
              <h2 className="audit-heading">Sheet for the client</h2>
              <p className="field-hint">The supplied drawing beside the honest one, with each lie factor and the data.</p>
              <div className="audit-actions">
                <button type="button" className="button" disabled={!sheetSvg || busy} onClick={() => void exportSheet('svg')} data-testid="audit-sheet-svg" title={answer ? 'Export the side-by-side sheet as SVG' : 'Correct or redraw first'}>
                  <Icon name="export" /> Sheet SVG
                </button>
                <select className="ppi-select" value={ppi} onChange={(e) => setPpi(Number(e.target.value))} aria-label="Sheet PNG resolution">
                  {[150, 300, 600].map((p) => (
                    <option key={p} value={p}>
                      {p} ppi
                    </option>
                  ))}
                </select>
                <button type="button" className="button" disabled={!sheetSvg || busy} onClick={() => void exportSheet('png')} data-testid="audit-sheet-png" title={answer ? 'Export the side-by-side sheet as PNG' : 'Correct or redraw first'}>
                  <Icon name="export" /> Sheet PNG
                </button>
              </div>
              {sheet?.notes.map((note, i) => (
                <p key={i} className="field-hint audit-warning" data-testid="sheet-note">
                  {note}
                </p>
              ))}
              <details className="audit-data">
                <summary>Measured marks</summary>
                <table className="data-table">
                  <thead>
                    <tr>
                      <th>#</th>
                      <th>Value</th>
                      <th>{reading === 'count' ? 'Glyphs' : `${READING_LABELS[reading]}`}</th>
                    </tr>
                  </thead>
                  <tbody>
                    {report.marks.map((m, i) => (
                      <tr key={m.id}>
                        <td>{i + 1}</td>
                        <td>{formatMeasure(m.value)}</td>
                        <td>{formatMeasure(report.readings[reading].measured[i])}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </details>
            </>
          )}
        </div>
      </aside>
    </main>
  );
}

function titleOf(detection: Detection): string | undefined {
  const root = detection.imported?.root;
  const title = root?.children.find((c) => c.name === 'title')?.text?.trim();
  return title ? title.slice(0, 120) : undefined;
}

/** Each mark's box outlined and numbered over the drawing, in the drawing's own coordinates. */
function MarkOutlines({ detection }: { detection: Detection }): ReactElement {
  const f = detection.frame;
  // Badge size from the frame, so numbers read the same on a 100-unit and a 4000-pixel drawing.
  const r = Math.max(f.width, f.height) * 0.022;
  return (
    <svg className="audit-outlines" viewBox={`${f.x} ${f.y} ${f.width} ${f.height}`} preserveAspectRatio="xMidYMid meet" aria-hidden="true" data-testid="audit-outlines">
      {detection.marks.map((m, i) => {
        const cx = Math.max(f.x + r, Math.min(f.x + f.width - r, m.box.x + r * 0.2));
        const cy = Math.max(f.y + r, Math.min(f.y + f.height - r, m.box.y - r * 1.1));
        return (
          <g key={m.id} className="audit-mark" data-mark={i + 1}>
            <rect x={m.box.x} y={m.box.y} width={m.box.width} height={m.box.height} vectorEffect="non-scaling-stroke" />
            <circle cx={cx} cy={cy} r={r} />
            <text x={cx} y={cy} fontSize={r * 1.25} textAnchor="middle" dominantBaseline="central">
              {i + 1}
            </text>
          </g>
        );
      })}
    </svg>
  );
}
