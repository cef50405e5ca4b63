// The editor window: data and drawing controls on the left, the written chart in the middle, the
// honesty check on the right. Every change is a named action; files go through the host.
import { useCallback, useEffect, useMemo, useReducer, useRef, useState, type ReactElement } from 'react';
import { PAGE_UNIT_MM } from '../../shared-core/document';
import { isTallyError } from '../../shared-core/errors';
import { safeFileName, type HostApi, type HostCapabilities, type MenuCommand, type RecentChart } from '../../shared-core/host';
import { ACTION_NAMES, type Action } from './editor/actions';
import { documentStem, fromChartDocument, rowForProblemPath, toChartDocument, type EditorDocument, type RowProblem } from './editor/editorDocument';
import { canRedo, canUndo, createHistory, historyReducer } from './editor/history';
import { demoCharts, defaultPalette } from './demoCharts';
import { shortReason, toUiWords } from './honesty/findingWords';
import { formatFactor, formatValue } from './honesty/formatHonesty';
import { keyOfDocument, useChartRender } from './render/useChartRender';
import { isMacPlatform, shortcutCommand, shortcutLabel } from './shortcuts';
import { DataTable } from './components/DataTable';
import { DrawingPanel } from './components/DrawingPanel';
import { HonestyPanel, type HonestyState, type OneClickFix } from './components/HonestyPanel';
import { BrandMark, Icon } from './components/Icon';
import { PagePanel } from './components/PagePanel';
import { SizeOrderPanel } from './components/SizeOrderPanel';
import { TypeLabelsPanel } from './components/TypeLabelsPanel';
import { Preview } from './components/Preview';
import { PdfExportDialog } from './components/PdfExportDialog';
import { RecoveryBanner } from './components/RecoveryBanner';
import { blankDocument, isBlank } from './documents/blankChart';
import { copySvgToClipboard } from './documents/copySvg';
import { useRecovery } from './documents/useRecovery';
import { RowPickContext, type RowPick } from './preview/rowPick';
import { AuditWorkspace } from './audit/AuditWorkspace';
import { OwnGlyphsPanel } from './glyphs/OwnGlyphsPanel';
import { setOwnGlyphs } from './glyphs/ownGlyphImages';
import { IntegrityPanel } from './integrity/IntegrityPanel';

interface FileInfo {
  documentId: string | null;
  name: string;
  demoId: string | null;
}

interface Notice {
  id: number;
  text: string;
  tone: 'info' | 'error';
}

const PPI_CHOICES = [150, 300, 600];

function plural(n: number, word: string): string {
  return `${n} ${word}${n === 1 ? '' : 's'}`;
}

export function App({ host }: { host: HostApi }): ReactElement {
  const demos = useMemo(() => demoCharts(), []);
  const palette = useMemo(() => defaultPalette(), []);
  const isMac = useMemo(() => isMacPlatform(), []);
  const [history, send] = useReducer(historyReducer, demos[0].document, (d: unknown) => createHistory(fromChartDocument(d)));
  const doc = history.present;
  // Glyph thumbnails anywhere in the window show the document's own glyphs.
  setOwnGlyphs(doc.glyphs);
  const [file, setFile] = useState<FileInfo>({ documentId: null, name: demos[0].name, demoId: demos[0].id });
  const [savedDoc, setSavedDoc] = useState<EditorDocument>(doc);
  const [caps, setCaps] = useState<HostCapabilities | null>(null);
  const [ppi, setPpi] = useState(300);
  const [notice, setNotice] = useState<Notice | null>(null);
  const [recent, setRecent] = useState<RecentChart[] | null>(null);
  const [working, setWorking] = useState<string | null>(null);
  /** After an open or a demo load, until this chart is first checked: the last check and preview are another chart's. */
  const [checksBelongToOtherChart, setChecksBelongToOtherChart] = useState(false);
  const [pdfDialog, setPdfDialog] = useState(false);
  const [pickedLabel, setPickedLabel] = useState<string | null>(null);
  const rowPick: RowPick = useMemo(() => ({ pickedLabel, onPick: (label: string) => setPickedLabel((l) => (l === label ? null : label)) }), [pickedLabel]);
  const [workspace, setWorkspace] = useState<'chart' | 'audit'>('chart');
  const noticeId = useRef(0);
  const recentWrap = useRef<HTMLDivElement>(null);

  // The recent list closes on a click elsewhere or Escape, like any menu.
  useEffect(() => {
    if (recent === null) return;
    const onDown = (e: MouseEvent) => {
      if (!recentWrap.current?.contains(e.target as Node)) setRecent(null);
    };
    const onKey = (e: KeyboardEvent) => {
      if (e.key === 'Escape') setRecent(null);
    };
    document.addEventListener('mousedown', onDown);
    document.addEventListener('keydown', onKey);
    return () => {
      document.removeEventListener('mousedown', onDown);
      document.removeEventListener('keydown', onKey);
    };
  }, [recent]);

  const dispatch = useCallback((action: Action) => send({ type: 'perform', action }), []);
  const seal = useCallback(() => send({ type: 'seal' }), []);
  const say = useCallback((text: string, tone: 'info' | 'error' = 'info') => {
    noticeId.current += 1;
    setNotice({ id: noticeId.current, text, tone });
  }, []);

  useEffect(() => {
    let live = true;
    void host.getCapabilities().then((r) => {
      if (live && r.ok) setCaps(r.value);
    });
    return () => {
      live = false;
    };
  }, [host]);

  // ---- the chart document and its check

  const conversion = useMemo(() => toChartDocument(doc), [doc]);
  const render = useChartRender(conversion.document);
  const currentKey = useMemo(() => keyOfDocument(conversion.document), [conversion.document]);
  const current = render.outcome !== null && currentKey !== null && render.outcomeKey === currentKey;
  useEffect(() => {
    if (current && checksBelongToOtherChart) setChecksBelongToOtherChart(false);
  }, [current, checksBelongToOtherChart]);
  const outcome = checksBelongToOtherChart && !current ? null : render.outcome;

  // Problems from the document check (after the table's own), tied to cells where they name one.
  const rowProblems: RowProblem[] = useMemo(() => {
    if (conversion.rowProblems.length > 0) return conversion.rowProblems;
    if (current && outcome?.kind === 'invalid') {
      return outcome.problems.flatMap((p) => {
        const at = rowForProblemPath(doc, p.path);
        return at ? [{ ...at, message: p.message }] : [];
      });
    }
    return [];
  }, [conversion.rowProblems, current, outcome, doc]);

  const tableProblems = [
    ...conversion.rowProblems.map((p) => {
      const index = doc.rows.findIndex((r) => r.id === p.rowId);
      return `Row ${index + 1}, ${p.field}: ${p.message}`;
    }),
    ...conversion.otherProblems,
  ];

  // An opened document may name a glyph this build does not bundle: say so, not "fix the table".
  const onlyGlyphProblems = tableProblems.length > 0 && conversion.rowProblems.every((p) => p.field === 'glyph') && conversion.otherProblems.length === (conversion.chartGlyphProblem ? 1 : 0);

  const exportSvgText = current && outcome?.kind === 'checked' && outcome.honesty.pass ? outcome.svg : null;

  const exportBlock: string | null = (() => {
    if (tableProblems.length > 0) return `Fix the table first. ${tableProblems[0]}`;
    if (!current || render.busy) return 'Checking the latest change…';
    if (!outcome) return 'Checking the chart…';
    if (outcome.kind === 'invalid') return `The chart document has a problem: ${outcome.message}`;
    if (outcome.kind === 'failed') return outcome.message;
    if (!outcome.honesty.pass) {
      const first = outcome.honesty.findings.find((f) => f.severity === 'blocking');
      return `Export is blocked: ${toUiWords(first?.message ?? outcome.honesty.reason ?? 'the chart did not pass the honesty check.')}`;
    }
    if (!outcome.svg) return 'The chart could not be written.';
    return null;
  })();

  // The same block in a few words, shown beside the badge; the whole sentence is in the honesty panel.
  const exportBlockShort: string | null = (() => {
    if (!exportBlock) return null;
    if (tableProblems.length > 0) return 'fix the table';
    if (outcome?.kind === 'invalid') return 'document problem';
    if (outcome?.kind === 'failed') return 'not drawn';
    if (outcome?.kind === 'checked' && !outcome.honesty.pass) {
      const worst = outcome.honesty.worst;
      // formatFactor, as the panel shows it: never rounded to a figure on the wrong side of a limit.
      const factor = worst && worst.lieFactor !== null ? formatFactor(worst.lieFactor, outcome.honesty.limits) : null;
      // The pill names what actually blocks: the first blocking finding, not always the lie factor.
      const first = outcome.honesty.findings.find((f) => f.severity === 'blocking');
      if (first) return shortReason(first, factor);
      return factor ? `lie factor ${factor}` : 'failed the honesty check';
    }
    return null;
  })();

  const honestyState: HonestyState = (() => {
    const previous = outcome?.kind === 'checked' ? outcome.honesty : null;
    if (tableProblems.length > 0) return { kind: 'waiting', title: onlyGlyphProblems ? 'Unknown glyph' : 'Waiting for the table', problems: tableProblems, previous: isBlank(doc) ? null : previous };
    if (!outcome) return { kind: 'pending' };
    if (outcome.kind === 'invalid') return current ? { kind: 'waiting', title: 'The chart document has a problem', problems: outcome.problems.length ? outcome.problems.map((p) => `${p.path}: ${p.message}`) : [outcome.message], previous: null } : { kind: 'pending' };
    if (outcome.kind === 'failed') return { kind: 'failed', title: 'The chart could not be drawn', message: outcome.message };
    return { kind: 'checked', honesty: outcome.honesty, current };
  })();

  // One-click remedies: the verifier's own actions where the app knows how to apply them, then the
  // remedies the render worker tried and found to pass.
  const oneClickFixes: OneClickFix[] = (() => {
    if (!current || outcome?.kind !== 'checked' || outcome.honesty.pass) return [];
    const out: OneClickFix[] = [];
    const unitName = doc.encoding.unitName?.trim();
    const add = (fix: OneClickFix) => {
      if (!out.some((f) => f.label === fix.label)) out.push(fix);
    };
    for (const f of outcome.honesty.findings) {
      if (f.severity !== 'blocking' || !f.action) continue;
      const action = editorActionFor(f.action);
      if (action) add({ label: toUiWords(f.action.label), title: toUiWords(f.fix), apply: () => dispatch(action) });
    }
    if (outcome.offers?.inkCut) {
      add({ label: 'Cut by ink', title: 'Show remainders as partial glyphs cut by ink, so a remainder of 0.4 shows 40% of a glyph’s ink. Checked: the chart then passes.', apply: () => dispatch({ type: 'set-rounding', rounding: 'ink-cut' }) });
    }
    const unit = outcome.offers?.unit;
    if (unit !== undefined) {
      add({ label: `Use ${formatValue(unit)}${unitName ? ` ${unitName}` : ''} per glyph`, title: `One glyph stands for ${formatValue(unit)} instead; rounding then changes each amount less. Checked: the chart then passes.`, apply: () => dispatch({ type: 'set-unit', unit }) });
    }
    return out;
  })();

  const previewSvg = outcome?.kind === 'checked' ? outcome.svg : null;
  const overlay: Parameters<typeof Preview>[0]['overlay'] = (() => {
    if (tableProblems.length > 0 && !outcome) {
      return { tone: 'stale', title: 'Nothing drawn yet', text: onlyGlyphProblems ? 'Choose a bundled glyph (Glyph button) to draw this chart.' : 'Fix the highlighted cells to draw this chart.' };
    }
    if (tableProblems.length > 0) {
      return { tone: 'stale', title: 'Showing the last valid chart', text: onlyGlyphProblems ? 'Choose a bundled glyph (Glyph button) to update it.' : 'Fix the highlighted cells to update it.' };
    }
    if (outcome?.kind === 'failed') return { tone: 'error', title: 'The chart could not be drawn', text: outcome.message };
    if (outcome?.kind === 'invalid' && current) return { tone: 'error', title: 'The chart document has a problem', text: outcome.message };
    if (outcome?.kind === 'checked' && !outcome.honesty.pass) return { tone: 'refused', title: 'Refused: not exportable', text: 'This is the file as written; the honesty check explains what is wrong.' };
    return null;
  })();

  // ---- commands

  const exportAs = useCallback(
    async (kind: 'svg' | 'png' | 'pdf') => {
      if (exportBlock || !exportSvgText) {
        say(exportBlock ?? 'Nothing to export yet.', 'error');
        return;
      }
      if (kind === 'png' && caps && !caps.rasterizesPng) {
        say('This host cannot make PNG files.', 'error');
        return;
      }
      const suggestedName = safeFileName(documentStem(doc), kind);
      setWorking(kind === 'png' ? `Making the PNG at ${ppi} ppi…` : kind === 'pdf' ? 'Making the PDF and checking it with an independent renderer…' : 'Exporting the SVG…');
      try {
        const result =
          kind === 'svg' ? await host.exportSvg({ svg: exportSvgText, suggestedName }) : kind === 'pdf' ? await host.exportPdf({ svg: exportSvgText, suggestedName }) : await host.exportPng({ svg: exportSvgText, suggestedName, ppi });
        if (!result.ok) say(result.error.message, 'error');
        else if (result.value) say(`Exported ${result.value.name} (${(result.value.bytes / 1024).toFixed(result.value.bytes < 10_240 ? 1 : 0)} KB).`);
      } finally {
        setWorking(null);
      }
    },
    [exportBlock, exportSvgText, caps, doc, ppi, host, say],
  );

  const save = useCallback(
    async (saveAs: boolean) => {
      if (!conversion.document) {
        say(`Not saved: fix the table first. ${tableProblems[0] ?? ''}`.trim(), 'error');
        return;
      }
      const text = JSON.stringify(conversion.document, null, 2) + '\n';
      const result = await host.saveChart({ text, suggestedName: safeFileName(file.documentId ? file.name : documentStem(doc), 'json'), documentId: file.documentId, saveAs });
      if (!result.ok) say(result.error.message, 'error');
      else if (result.value) {
        setFile({ documentId: result.value.documentId, name: result.value.name, demoId: null });
        setSavedDoc(doc);
        say(`Saved ${result.value.name}.`);
      }
    },
    [conversion.document, tableProblems, host, file, doc, say],
  );

  const dirty = doc !== savedDoc;
  const dirtyRef = useRef(dirty);
  dirtyRef.current = dirty;
  /** True when nothing unsaved would be lost, or the designer agreed to lose it. */
  const mayReplace = useCallback((what: string) => !dirtyRef.current || window.confirm(`The chart has unsaved changes. ${what} anyway and lose them?`), []);

  const loadText = useCallback(
    (name: string, text: string, documentId: string | null) => {
      let next: EditorDocument;
      try {
        next = fromChartDocument(JSON.parse(text));
      } catch (e) {
        const why = isTallyError(e) ? e.message : e instanceof SyntaxError ? `it is not valid JSON (${e.message})` : String(e);
        say(`Could not open ${name}: ${why}`, 'error');
        return;
      }
      // A fresh history: undo must not bring back the previous chart under this file's id,
      // or Save would write that chart over this file.
      send({ type: 'reset', document: next });
      setChecksBelongToOtherChart(true);
      setFile({ documentId, name, demoId: null });
      setSavedDoc(next);
      say(`Opened ${name}.`);
    },
    [say],
  );

  const open = useCallback(
    async (documentId?: string) => {
      if (!mayReplace('Open another chart')) return;
      const result = await host.openChart(documentId ? { documentId } : {});
      if (!result.ok) say(result.error.message, 'error');
      else if (result.value) loadText(result.value.name, result.value.text, result.value.documentId);
    },
    [host, loadText, say, mayReplace],
  );

  const recovery = useRecovery(host, { name: file.name, documentId: file.documentId, editor: doc }, dirty);
  const restoreRecovered = useCallback(() => {
    const work = recovery.restore();
    if (!work) return;
    // The restored work stays unsaved (the saved document is still the one that was open), so the dirty marker shows.
    send({ type: 'reset', document: work.editor });
    setFile({ documentId: work.documentId, name: work.name, demoId: null });
    say(`Restored unsaved work on ${work.name}.`);
  }, [recovery, say]);

  const newChart = useCallback(() => {
    if (!mayReplace('Start a new chart')) return;
    const next = blankDocument(doc);
    send({ type: 'reset', document: next });
    setFile({ documentId: null, name: 'Untitled chart', demoId: null });
    setSavedDoc(next);
    setPickedLabel(null);
  }, [doc, mayReplace]);

  const copySvg = useCallback(async () => {
    if (exportBlock || !exportSvgText) {
      say(exportBlock ?? 'Nothing to copy yet.', 'error');
      return;
    }
    try {
      const how = await copySvgToClipboard(exportSvgText);
      say(how === 'svg' ? 'Copied the checked chart as SVG: paste it into your vector editor.' : 'Copied the checked chart\'s SVG code: paste it into your vector editor.');
    } catch (e) {
      say(`Could not copy: ${e instanceof Error ? e.message : String(e)}`, 'error');
    }
  }, [exportBlock, exportSvgText, say]);

  const loadDemo = useCallback(
    (id: string) => {
      const demo = demos.find((d) => d.id === id);
      if (!demo || !mayReplace('Load the demo')) return;
      const next = fromChartDocument(demo.document);
      send({ type: 'reset', document: next });
      setChecksBelongToOtherChart(true);
      setFile({ documentId: null, name: demo.name, demoId: demo.id });
      setSavedDoc(next);
    },
    [demos, mayReplace],
  );

  const commands: Record<MenuCommand, () => void> = {
    open: () => void open(),
    save: () => void save(false),
    'save-as': () => void save(true),
    'export-svg': () => void exportAs('svg'),
    'export-png': () => void exportAs('png'),
    undo: () => send({ type: 'undo' }),
    redo: () => send({ type: 'redo' }),
    new: () => newChart(),
    'export-pdf': () => setPdfDialog(true),
    'copy-svg': () => void copySvg(),
  };
  const commandsRef = useRef(commands);
  commandsRef.current = commands;

  useEffect(() => host.onMenuCommand((c) => commandsRef.current[c]()), [host]);

  // Documents the operating system asks to open (desktop app): the first opens as Open would; the host has put
  // every one on the Recent list, so the others stay one click away.
  const openRef = useRef(open);
  openRef.current = open;
  useEffect(() => host.onOpenRequest?.((requests) => {
    if (requests.length > 0) void openRef.current(requests[0].documentId);
  }), [host]);

  useEffect(() => {
    if (!caps || caps.menuShortcuts) return;
    const onKey = (e: KeyboardEvent) => {
      const command = shortcutCommand(e, isMac);
      if (!command) return;
      e.preventDefault();
      e.stopPropagation();
      commandsRef.current[command]();
    };
    window.addEventListener('keydown', onKey, true);
    return () => window.removeEventListener('keydown', onKey, true);
  }, [caps, isMac]);

  // Closing or reloading the window with unsaved changes asks first (Electron: main.ts shows the question).
  useEffect(() => {
    if (!dirty) return;
    const onBeforeUnload = (e: BeforeUnloadEvent) => {
      e.preventDefault();
      // Older engines show the prompt only when returnValue is set.
      e.returnValue = '';
    };
    window.addEventListener('beforeunload', onBeforeUnload);
    return () => window.removeEventListener('beforeunload', onBeforeUnload);
  }, [dirty]);

  // A chart not yet saved to a file is known by its title, so a rename shows at once; a saved one by its file name.
  const displayName = file.documentId === null && doc.title.trim() !== '' ? doc.title.trim() : file.name;

  useEffect(() => {
    document.title = `${dirty ? '• ' : ''}${displayName} — Tallyglyph`;
  }, [dirty, displayName]);

  useEffect(() => {
    if (!notice) return;
    const t = setTimeout(() => setNotice((n) => (n && n.id === notice.id ? null : n)), notice.tone === 'error' ? 9000 : 4500);
    return () => clearTimeout(t);
  }, [notice]);

  const undoTitle = canUndo(history) ? `Undo ${ACTION_NAMES[history.past[history.past.length - 1].action]} (${shortcutLabel('undo', isMac)})` : 'Nothing to undo';
  const redoTitle = canRedo(history) ? `Redo ${ACTION_NAMES[history.future[0].action]} (${shortcutLabel('redo', isMac)})` : 'Nothing to redo';
  const pageMm = { w: doc.page.width * PAGE_UNIT_MM[doc.page.unit], h: doc.page.height * PAGE_UNIT_MM[doc.page.unit] };
  const pageLabel = `${trimNumber(doc.page.width)} × ${trimNumber(doc.page.height)} ${doc.page.unit}${doc.page.unit !== 'mm' ? ` (${trimNumber(pageMm.w, 1)} × ${trimNumber(pageMm.h, 1)} mm)` : ''}${doc.layout.bleedMm > 0 ? ` + ${trimNumber(doc.layout.bleedMm)} mm bleed` : ''}`;
  const chosenUnit = outcome?.kind === 'checked' && outcome.unit ? outcome.unit.value : null;
  const pngOffered = caps?.rasterizesPng ?? false;

  return (
    <div className="app" data-workspace={workspace}>
      <header className="topbar">
        <div className="brand">
          <BrandMark />
          <span className="brand-name">Tallyglyph</span>
        </div>
        <div className="workspace-switch" role="tablist" aria-label="Workspace">
          <button type="button" role="tab" aria-selected={workspace === 'chart'} onClick={() => setWorkspace('chart')} data-testid="workspace-chart">Chart</button>
          <button type="button" role="tab" aria-selected={workspace === 'audit'} onClick={() => setWorkspace('audit')} data-testid="workspace-audit">Audit</button>
        </div>
        <div className="doc-name" title={displayName} data-testid="doc-name">
          <span className="doc-name-text">{displayName}</span>
          {dirty && <span className="dirty-dot" title="Unsaved changes" aria-label="Unsaved changes" />}
        </div>
        <div className="toolbar-group demo-group">
          <label className="demo-picker">
            <span>Demo</span>
            <select value={file.demoId ?? ''} onChange={(e) => loadDemo(e.target.value)} aria-label="Demo chart" data-testid="demo-picker">
              {file.demoId === null && <option value="">Choose a demo…</option>}
              {demos.map((d) => {
                // The demo being edited shows its current title, renamed or not.
                const renamed = d.id === file.demoId && displayName !== d.name ? displayName : null;
                return (
                  <option key={d.id} value={d.id} title={renamed ?? d.name}>
                    {renamed ? `${modeName(d.document)} · ${renamed}` : demoLabel(d.id, d.document)}
                  </option>
                );
              })}
            </select>
          </label>
        </div>
        <div className="toolbar-group">
          <button type="button" className="tool" onClick={newChart} title="Start a new, empty chart" data-testid="new-chart">
            <Icon name="plus" /> New
          </button>
          <button type="button" className="tool" onClick={() => void open()} title={`Open a chart document (${shortcutLabel('open', isMac)})`}>
            <Icon name="open" /> Open
          </button>
          <div className="recent-wrap" ref={recentWrap}>
            <button
              type="button"
              className="tool"
              aria-haspopup="menu"
              aria-expanded={recent !== null}
              onClick={async () => {
                if (recent !== null) return setRecent(null);
                const r = await host.listRecent();
                setRecent(r.ok ? r.value : []);
              }}
              title="Recently opened or saved charts"
            >
              <Icon name="recent" /> Recent
            </button>
            {recent !== null && (
              <div className="popover recent-list" role="menu">
                {recent.length === 0 && <p className="empty-note">No recent charts yet.</p>}
                {recent.map((r) => (
                  <button key={r.documentId} type="button" role="menuitem" className="recent-item" onClick={() => {
                    setRecent(null);
                    void open(r.documentId);
                  }}>
                    <span className="recent-name">{r.name}</span>
                    <span className="recent-where">{r.location}</span>
                  </button>
                ))}
              </div>
            )}
          </div>
          <button type="button" className="tool" onClick={() => void save(false)} title={`Save the chart document (${shortcutLabel('save', isMac)})`} data-testid="save">
            <Icon name="save" /> Save
          </button>
          <button type="button" className="tool" onClick={() => void save(true)} title={`Save under a new name (${shortcutLabel('save-as', isMac)})`} data-testid="save-as">
            Save As…
          </button>
        </div>
        <div className="toolbar-group">
          <button type="button" className="tool icon-only" onClick={() => send({ type: 'undo' })} disabled={!canUndo(history)} title={undoTitle} aria-label="Undo" data-testid="undo">
            <Icon name="undo" />
          </button>
          <button type="button" className="tool icon-only" onClick={() => send({ type: 'redo' })} disabled={!canRedo(history)} title={redoTitle} aria-label="Redo" data-testid="redo">
            <Icon name="redo" />
          </button>
        </div>
        <span className="spacer" />
        <div className="export-group">
          {exportBlock && !render.busy && current && (
            <button
              type="button"
              className="export-blocked"
              title={exportBlock}
              data-testid="export-blocked"
              onClick={() => {
                const panel = document.getElementById('honesty-check');
                panel?.scrollIntoView({ block: 'start' });
                panel?.focus();
              }}
            >
              <span className="export-blocked-label">{exportBlockShort ? 'Blocked:' : 'Export blocked'}</span>
              {exportBlockShort && <span className="export-blocked-reason" data-testid="export-blocked-reason">{exportBlockShort}</span>}
            </button>
          )}
          {pngOffered && (
            <>
              <select className="ppi-select" value={ppi} onChange={(e) => setPpi(Number(e.target.value))} aria-label="PNG resolution" title="PNG resolution in pixels per inch (300 is usual for print)">
                {PPI_CHOICES.map((p) => (
                  <option key={p} value={p}>
                    {p} ppi
                  </option>
                ))}
              </select>
              <button type="button" className="button" disabled={exportBlock !== null || working !== null} title={exportBlock ?? `Export a PNG at ${ppi} ppi (${shortcutLabel('export-png', isMac)})`} onClick={() => void exportAs('png')} data-testid="export-png">
                PNG
              </button>
            </>
          )}
          <button type="button" className="button" disabled={exportBlock !== null} title={exportBlock ?? `Copy the checked chart as SVG for a vector editor (${shortcutLabel('copy-svg', isMac)})`} onClick={() => void copySvg()} data-testid="copy-svg">
            Copy SVG
          </button>
          <button type="button" className="button" disabled={working !== null} title={`Export a PDF for print (${shortcutLabel('export-pdf', isMac)})`} onClick={() => setPdfDialog(true)} data-testid="export-pdf">
            PDF…
          </button>
          <button type="button" className="button primary" disabled={exportBlock !== null || working !== null} title={exportBlock ?? `Export the SVG (${shortcutLabel('export-svg', isMac)})`} onClick={() => void exportAs('svg')} data-testid="export-svg">
            <Icon name="export" /> Export SVG
          </button>
        </div>
      </header>

      {pdfDialog && (
        <PdfExportDialog
          pageLabel={pageLabel}
          bleedMm={doc.layout.bleedMm}
          available={caps?.exportsPdf === true}
          blocked={exportBlock}
          working={working !== null}
          onClose={() => setPdfDialog(false)}
          onExport={() => {
            setPdfDialog(false);
            void exportAs('pdf');
          }}
        />
      )}

      <main className="workspace" hidden={workspace !== 'chart'}>
        <aside className="panel editor" aria-label="Chart settings">
          <details className="section" open>
            <summary>
              <span>Data</span>
              <span className="summary-meta">{plural(doc.rows.length, 'row')}</span>
            </summary>
            <div className="section-body">
              <div className="field">
                <label htmlFor="chart-title">Title</label>
                <input id="chart-title" value={doc.title} placeholder="What the chart shows" onChange={(e) => dispatch({ type: 'set-title', title: e.target.value })} onBlur={seal} />
              </div>
              <div className="field">
                <label htmlFor="chart-source">Source line</label>
                <input id="chart-source" value={doc.source} placeholder="Where the numbers come from" onChange={(e) => dispatch({ type: 'set-source', source: e.target.value })} onBlur={seal} />
              </div>
              <DataTable doc={doc} problems={rowProblems} dispatch={dispatch} seal={seal} onNotice={say} colorNote={colorNote(outcome)} />
            </div>
          </details>
          <details className="section" open>
            <summary>
              <span>Drawing</span>
              <span className="summary-meta">{modeName({ encoding: doc.encoding })}</span>
            </summary>
            <div className="section-body">
              <DrawingPanel doc={doc} dispatch={dispatch} seal={seal} chosenUnit={chosenUnit} defaultColors={palette} />
            </div>
          </details>
          <details className="section" open>
            <summary>
              <span>Size &amp; order</span>
            </summary>
            <div className="section-body">
              <SizeOrderPanel doc={doc} dispatch={dispatch} seal={seal} />
            </div>
          </details>
          <details className="section" open>
            <summary>
              <span>Type &amp; labels</span>
            </summary>
            <div className="section-body">
              <TypeLabelsPanel doc={doc} dispatch={dispatch} seal={seal} problems={current && outcome?.kind === 'invalid' ? outcome.problems : []} />
            </div>
          </details>
          <details className="section" open>
            <summary>
              <span>Your glyphs</span>
              <span className="summary-meta">{plural(Object.keys(doc.glyphs ?? {}).length, 'glyph')}</span>
            </summary>
            <div className="section-body">
              <OwnGlyphsPanel doc={doc} dispatch={dispatch} host={host} onNotice={say} />
            </div>
          </details>
          <details className="section" open>
            <summary>
              <span>Page</span>
              <span className="summary-meta">{trimNumber(doc.page.width)} × {trimNumber(doc.page.height)} {doc.page.unit}</span>
            </summary>
            <div className="section-body">
              <PagePanel doc={doc} dispatch={dispatch} seal={seal} />
            </div>
          </details>
        </aside>

        <Preview
          svg={previewSvg}
          busy={render.busy || working !== null}
          overlay={isBlank(doc) ? null : overlay}
          pageLabel={pageLabel}
          elapsedMs={current ? render.elapsedMs : null}
          emptyState={isBlank(doc) ? <BlankChartNote /> : undefined}
          notice={recovery.offer ? <RecoveryBanner offer={recovery.offer} onRestore={restoreRecovered} onDiscard={recovery.discard} /> : null}
          highlightLabel={pickedLabel}
          onClearHighlight={() => setPickedLabel(null)}
        />

        <div className="side-column">
          <RowPickContext.Provider value={rowPick}>
            <HonestyPanel state={honestyState} ppi={ppi} fixes={oneClickFixes} />
          </RowPickContext.Provider>
          <IntegrityPanel doc={doc} findings={outcome?.kind === 'checked' ? outcome.rules ?? null : null} current={current && !render.busy} dispatch={dispatch} onNotice={say} />
        </div>
      </main>
      <AuditWorkspace host={host} onNotice={say} hidden={workspace !== 'audit'} />

      <footer className="statusbar">
        {/* One line however long the sentence: the whole of it on hover (title), on focus (shown above the bar)
            and, for a refusal, in the honesty panel the button leads to. */}
        <span
          className={notice ? `notice ${notice.tone}` : 'notice'}
          role="status"
          aria-live="polite"
          data-testid="notice"
          title={working ?? notice?.text ?? undefined}
          tabIndex={working ?? notice?.text ? 0 : undefined}
        >
          {working ?? notice?.text ?? ''}
        </span>
        {!working && notice?.tone === 'error' && notice.text === exportBlock && (
          <button type="button" className="link-button status-why" data-testid="notice-why" onClick={() => {
            const panel = document.getElementById('honesty-check');
            panel?.scrollIntoView({ block: 'start' });
            panel?.focus();
          }}>
            Why?
          </button>
        )}
        <span className="status-meta">
          {caps ? (caps.kind === 'browser' ? 'Browser: files download, PNG drawn by the browser' : 'Desktop') : ''}
        </span>
      </footer>
    </div>
  );
}

/** The layout's sentence about category colours (a refusal or a warning), for the data table's colour column. */
function colorNote(outcome: ReturnType<typeof useChartRender>['outcome']): { message: string; refused: boolean } | null {
  if (outcome?.kind === 'failed') return /colour/i.test(outcome.message) ? { message: outcome.message, refused: true } : null;
  const warning = outcome?.kind === 'checked' ? outcome.honesty.warnings.find((w) => w.code === 'color-repeated') : undefined;
  return warning ? { message: warning.message, refused: false } : null;
}

function BlankChartNote(): ReactElement {
  return (
    <>
      <h2>A new chart</h2>
      <p>Type a category and its value in the first row of the Data table, then add rows. The chart and its honesty check appear as you type.</p>
      <p>Paste a table from a spreadsheet into a cell to fill many rows at once.</p>
    </>
  );
}

function trimNumber(value: number, decimals = 2): string {
  return String(Number(value.toFixed(decimals)));
}

/** "Repeat · bike share" from the demo's file name "repeat-bike-share". */
function demoLabel(id: string, doc: unknown): string {
  const mode = modeName(doc);
  const words = id.replace(/-/g, ' ').replace(new RegExp(`^${mode}\\s+`, 'i'), '');
  return `${mode} · ${words}`;
}

function modeName(doc: unknown): string {
  const mode = (doc as { encoding?: { mode?: string } }).encoding?.mode ?? '';
  return mode ? mode[0].toUpperCase() + mode.slice(1) : 'Chart';
}

/** The editor action for a verifier's fix, when the app knows the kind and the payload is sound. */
function editorActionFor(fix: { kind: string; payload?: Record<string, unknown> }): Action | null {
  const p = fix.payload ?? {};
  switch (fix.kind) {
    case 'set-unit':
      return typeof p.unit === 'number' && p.unit > 0 && Number.isFinite(p.unit) ? { type: 'set-unit', unit: p.unit } : null;
    case 'set-rounding':
      return p.rounding === 'ink-cut' || p.rounding === 'whole' ? { type: 'set-rounding', rounding: p.rounding } : null;
    case 'set-mode':
      return p.mode === 'repeat' || p.mode === 'stack' || p.mode === 'scale' || p.mode === 'fill' ? { type: 'set-mode', mode: p.mode } : null;
    default:
      return null;
  }
}
