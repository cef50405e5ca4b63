// The one benchmark: speed figures for the main job, printed as a table and written as JSON and Markdown
// under bench/results/. Asserts nothing (speed goals live here, not in tests). `--smoke` runs every case at
// tiny sizes (the test suite does, so this file cannot rot); `--out DIR` writes elsewhere.
import { spawnSync } from 'node:child_process';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { Resvg } from '@resvg/resvg-js';
import { auditSvg } from '../shared-core/audit/index';
import { parseChart } from '../shared-core/document/index';
import { listGlyphs, measureGlyph } from '../shared-core/glyph/index';
import { verifySvg } from '../shared-core/integrity/index';
import { layoutChart, withGlyphBudget } from '../shared-core/layout/index';
import { embedMeasured } from '../shared-core/pipeline/renderChart';
import { writeSvg } from '../shared-core/svg/index';

export interface BenchFigure {
  /** Median of the timed runs, after one warm-up run. */
  medianMs: number;
  minMs: number;
  maxMs: number;
  runs: number;
}

export interface BenchRow {
  case: string;
  /** What was measured, in words (with the figure's unit). */
  figure: string;
  value: number | string | null;
  unit: string;
  min?: number;
  max?: number;
  note?: string;
}

export interface BenchResult {
  /** 'partial' when only some cases ran (--only). */
  mode: 'full' | 'smoke' | 'partial';
  date: string;
  node: string;
  cores: number;
  cpu: string;
  rows: BenchRow[];
}

export interface BenchOptions {
  smoke?: boolean;
  /** Timed runs per figure (after one warm-up); default 5, 3 for the largest chart, 2 in smoke mode. */
  runs?: number;
  outDir?: string | null;
  log?: (line: string) => void;
  /**
   * Run only these cases: render, ink, png, app, audit (default all); `verify` times verification alone on the
   * repeat charts (1k / 10k / 100k glyphs, written once, untimed), for work on the verifier.
   */
  only?: readonly string[];
}

const SCRIPT = fileURLToPath(import.meta.url);
const ROOT = path.resolve(path.dirname(SCRIPT), '..');

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 ? s[mid] : (s[mid - 1] + s[mid]) / 2;
}

async function timed(runs: number, fn: () => unknown | Promise<unknown>, warmUp = true): Promise<BenchFigure> {
  if (warmUp) await fn(); // warm-up: compiled code and filled caches of the libraries, as in a running app
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    await fn();
    times.push(performance.now() - t0);
  }
  return { medianMs: median(times), minMs: Math.min(...times), maxMs: Math.max(...times), runs };
}

/** A repeat chart document of about `glyphs` glyphs: five invented categories, one glyph per unit. */
export function repeatChartDoc(glyphs: number, page: { width: number; height: number } = { width: 420, height: 297 }): Record<string, unknown> {
  const weights = [0.6, 0.8, 1, 1.2, 1.4];
  const total = weights.reduce((a, b) => a + b, 0);
  const data = weights.map((w, i) => ({ label: `Depot ${String.fromCharCode(65 + i)}`, value: Math.max(1, Math.round((glyphs * w) / total)) }));
  return {
    format: 'tallyglyph.chart/1',
    title: 'Parcels sorted per hour',
    source: 'Invented benchmark data',
    data,
    encoding: { mode: 'repeat', glyph: 'person', unit: 1 },
    page: { ...page, unit: 'mm' },
    useReferences: true,
  };
}

const STAGES = ['parse', 'layout', 'write', 'verify', 'embed'] as const;
type Stage = (typeof STAGES)[number];

/** parse → layout → write → verify → embed, each stage timed on its own. */
function renderStages(doc: unknown): Record<Stage, number> & { chars: number; pass: boolean; reason: string } {
  const t0 = performance.now();
  const spec = parseChart(doc);
  const t1 = performance.now();
  const scene = withGlyphBudget(1e6, () => layoutChart(spec));
  const t2 = performance.now();
  const svg = writeSvg(scene, { useReferences: spec.useReferences, outlineText: spec.outlineText });
  const t3 = performance.now();
  const report = verifySvg(svg, { rounding: spec.encoding.rounding });
  const t4 = performance.now();
  embedMeasured(svg, { lieFactorWorst: report.lieFactor.worst, spread: report.spread, pass: report.pass }, report.summary);
  const t5 = performance.now();
  return { parse: t1 - t0, layout: t2 - t1, write: t3 - t2, verify: t4 - t3, embed: t5 - t4, chars: svg.length, pass: report.pass, reason: report.reason ?? '' };
}

/** A Vega 6 spec with `count` symbol marks in a grid, the nearest thing a charting grammar has to a unit chart. */
function vegaSpec(count: number): Record<string, unknown> {
  const cols = Math.ceil(Math.sqrt(count));
  return {
    $schema: 'https://vega.github.io/schema/vega/v6.json',
    width: 1200,
    height: 850,
    data: [{ name: 'units', values: Array.from({ length: count }, (_, i) => ({ col: i % cols, row: Math.floor(i / cols), cat: i % 5 })) }],
    scales: [
      { name: 'x', type: 'linear', domain: [0, cols], range: 'width' },
      { name: 'y', type: 'linear', domain: [0, cols], range: 'height' },
      { name: 'c', type: 'ordinal', domain: [0, 1, 2, 3, 4], range: 'category' },
    ],
    marks: [
      {
        type: 'symbol',
        from: { data: 'units' },
        encode: { enter: { x: { scale: 'x', field: 'col' }, y: { scale: 'y', field: 'row' }, shape: { value: 'circle' }, size: { value: 20 }, fill: { scale: 'c', field: 'cat' } } },
      },
    ],
  };
}

async function vegaToSvg(count: number): Promise<number> {
  const vega = await import('vega');
  const view = new vega.View(vega.parse(vegaSpec(count) as never), { renderer: 'none' });
  const svg = await view.toSVG();
  view.finalize();
  return svg.length;
}

/** Ink of a glyph by resvg at `sizePx` across its longer viewBox side: the sum of alpha, in glyph units squared. */
function rasterInk(svg: string, sizePx: number, viewBox: { width: number; height: number }): number {
  const longer = Math.max(viewBox.width, viewBox.height);
  const fitTo = viewBox.width >= viewBox.height ? ({ mode: 'width', value: sizePx } as const) : ({ mode: 'height', value: sizePx } as const);
  const image = new Resvg(svg, { fitTo }).render();
  const pixels = image.pixels;
  let alpha = 0;
  for (let i = 3; i < pixels.length; i += 4) alpha += pixels[i];
  const unitsPerPx = longer / sizePx;
  return (alpha / 255) * unitsPerPx * unitsPerPx;
}

/** PNG export in a child process, so its peak memory (max resident set size) is its own. */
function pngChild(glyphs: number, ppi: number, page: { width: number; height: number }): { wallMs: number; cpuMs: number; peakMb: number; pass: boolean; error?: string } {
  const args = ['--import', 'tsx', SCRIPT, '--png-child', String(glyphs), String(ppi), String(page.width), String(page.height)];
  const run = spawnSync(process.execPath, args, { cwd: ROOT, encoding: 'utf8', maxBuffer: 16 * 1024 * 1024 });
  const line = (run.stdout ?? '').trim().split('\n').pop() ?? '';
  try {
    return JSON.parse(line) as { wallMs: number; cpuMs: number; peakMb: number; pass: boolean };
  } catch {
    return { wallMs: NaN, cpuMs: NaN, peakMb: NaN, pass: false, error: (run.stderr || run.stdout || 'no output').trim().split('\n').slice(-3).join(' ') };
  }
}

async function pngChildMain(argv: string[]): Promise<void> {
  const [glyphs, ppi, width, height] = argv.map(Number);
  const { exportFromRender } = await import('../main/export/exportChart');
  const { renderChart } = await import('../shared-core/pipeline/index');
  const t0 = performance.now();
  // The whole `render -o chart.png` path: layout, SVG, vector verification, the pixel re-check, the PNG.
  const rendered = withGlyphBudget(1e6, () => renderChart(repeatChartDoc(glyphs, { width, height })));
  const built = exportFromRender(rendered, 'png', { ppi });
  const wallMs = performance.now() - t0;
  const usage = process.resourceUsage();
  // CPU time too: on a shared machine the wall time is mostly waiting for a core.
  const cpuMs = (usage.userCPUTime + usage.systemCPUTime) / 1000;
  console.log(JSON.stringify({ wallMs, cpuMs, peakMb: peakResidentMb(usage.maxRSS), pass: built.bytes.length > 0 }));
}

/**
 * Peak resident memory of this process in MB. On Linux the max RSS that getrusage reports survives exec, so a
 * child forked from a large parent inherits the parent's peak; VmHWM in /proc/self/status belongs to this
 * program's own memory. Elsewhere, max RSS.
 */
function peakResidentMb(maxRssKb: number): number {
  try {
    const hwm = /VmHWM:\s+(\d+) kB/.exec(readFileSync('/proc/self/status', 'utf8'));
    if (hwm) return Number(hwm[1]) / 1024;
  } catch {
    // not Linux
  }
  return maxRssKb / 1024;
}

/** A supplied SVG of `count` marks (bars of invented values), as a client's mock-up would arrive. */
function auditFixture(count: number): { svg: string; values: number[] } {
  const cols = Math.ceil(Math.sqrt(count));
  const values: number[] = [];
  const parts: string[] = [];
  for (let i = 0; i < count; i++) {
    const value = 1 + (i % 17);
    values.push(value);
    const x = (i % cols) * 10;
    const y = Math.floor(i / cols) * 10;
    parts.push(`<rect id="m${i}" x="${x}" y="${y + 9 - value * 0.5}" width="6" height="${value * 0.5}" fill="#3a6ea5"/>`);
  }
  const size = cols * 10;
  return { svg: `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${size} ${size}" width="${size}" height="${size}">${parts.join('')}</svg>`, values };
}

function fmt(n: number | string | null | undefined, digits = 3): string {
  if (n === null || n === undefined) return '—';
  if (typeof n === 'string') return n;
  if (!Number.isFinite(n)) return String(n);
  return Math.abs(n) >= 100 ? n.toFixed(0) : String(Number(n.toPrecision(digits)));
}

export function formatTable(rows: BenchRow[]): string {
  const head = ['case', 'figure', 'value', 'unit', 'min', 'max', 'note'];
  const body = rows.map((r) => [r.case, r.figure, fmt(r.value), r.unit, fmt(r.min), fmt(r.max), r.note ?? '']);
  return [`| ${head.join(' | ')} |`, `| ${head.map(() => '---').join(' | ')} |`, ...body.map((cells) => `| ${cells.join(' | ')} |`)].join('\n');
}

export async function runBench(opts: BenchOptions = {}): Promise<BenchResult> {
  const smoke = opts.smoke ?? false;
  const log = opts.log ?? ((line: string) => console.log(line));
  const runs = opts.runs ?? (smoke ? 2 : 5);
  const rows: BenchRow[] = [];
  const want = (name: string) => !opts.only || opts.only.includes(name);
  const add = (row: BenchRow) => {
    rows.push(row);
    log(`${row.case.padEnd(34)} ${row.figure.padEnd(44)} ${fmt(row.value).padStart(10)} ${row.unit}${row.note ? `  (${row.note})` : ''}`);
  };

  // 1 and 2: full render of repeat charts, per stage, beside Vega 6 rendering as many symbol marks.
  const sizes = !want('render') ? [] : smoke ? [50, 200] : [1_000, 10_000, 100_000];
  const totals = new Map<number, number>();
  for (const n of sizes) {
    // 100,000 legible glyphs do not fit on A3 (the layout refuses with layout-no-room): a 1200 x 900 mm poster.
    const page = n >= 100_000 ? { width: 1200, height: 900 } : { width: 420, height: 297 };
    const doc = repeatChartDoc(n, page);
    // The largest chart: one timed run, warmed up by the smaller charts before it (said in the row's note).
    const largest = n >= 100_000;
    const stageRuns = largest ? 1 : n >= 10_000 ? Math.min(runs, 3) : runs;
    const perStage: Record<Stage, number[]> = { parse: [], layout: [], write: [], verify: [], embed: [] };
    let chars = 0;
    let pass = true;
    let reason = '';
    const whole = await timed(stageRuns, () => {
      const st = renderStages(doc);
      for (const k of STAGES) perStage[k].push(st[k]);
      chars = st.chars;
      pass &&= st.pass;
      reason ||= st.reason;
    }, !largest);
    // The warm-up run also pushed its stages: drop it.
    if (!largest) for (const k of STAGES) perStage[k] = perStage[k].slice(1);
    const theirs = await timed(stageRuns, () => vegaToSvg(n), !largest);
    totals.set(n, whole.medianMs);
    add({ case: `repeat ${n} glyphs`, figure: 'ours: parse+layout+SVG+verify+embed', value: whole.medianMs, unit: 'ms', min: whole.minMs, max: whole.maxMs, note: `${page.width}x${page.height} mm, ${(chars / 1e6).toFixed(2)} MB SVG, ${pass ? 'verified' : `refused: ${reason.slice(0, 100)}`}${largest ? ', 1 run without warm-up' : ''}` });
    for (const k of STAGES) {
      add({ case: `repeat ${n} glyphs`, figure: `  stage ${k}`, value: median(perStage[k]), unit: 'ms', min: Math.min(...perStage[k]), max: Math.max(...perStage[k]) });
    }
    add({ case: `repeat ${n} glyphs`, figure: 'Vega 6 toSVG, same number of symbols', value: theirs.medianMs, unit: 'ms', min: theirs.minMs, max: theirs.maxMs });
    add({ case: `repeat ${n} glyphs`, figure: 'ratio ours / Vega', value: whole.medianMs / theirs.medianMs, unit: 'x', note: 'goal at most 0.1' });
  }
  const big = sizes[sizes.length - 1];
  const mid = sizes[sizes.length - 2];
  if (sizes.length) add({ case: 'growth', figure: `time ${big} / time ${mid} glyphs`, value: (totals.get(big) as number) / (totals.get(mid) as number), unit: 'x', note: `${big / mid}x the glyphs; goal at most ${(big / mid) * 1.1}` });

  // Verification alone (--only verify): each repeat chart laid out and written once, then verifySvg timed.
  const verifySizes = want('verify') && !want('render') ? (smoke ? [50, 200] : [1_000, 10_000, 100_000]) : [];
  const verifyTotals = new Map<number, number>();
  for (const n of verifySizes) {
    const page = n >= 100_000 ? { width: 1200, height: 900 } : { width: 420, height: 297 };
    const spec = parseChart(repeatChartDoc(n, page));
    const scene = withGlyphBudget(1e6, () => layoutChart(spec));
    const svg = writeSvg(scene, { useReferences: spec.useReferences, outlineText: spec.outlineText });
    let pass = true;
    let reason = '';
    const verifyRuns = n >= 100_000 ? Math.min(runs, 3) : runs;
    const fig = await timed(verifyRuns, () => {
      const report = verifySvg(svg, { rounding: spec.encoding.rounding });
      pass &&= report.pass;
      reason ||= report.reason ?? '';
    });
    verifyTotals.set(n, fig.medianMs);
    add({ case: `repeat ${n} glyphs`, figure: '  stage verify', value: fig.medianMs, unit: 'ms', min: fig.minMs, max: fig.maxMs, note: `${(svg.length / 1e6).toFixed(2)} MB SVG, ${pass ? 'verified' : `refused: ${reason.slice(0, 100)}`}` });
  }
  if (verifySizes.length > 1) {
    const [vMid, vBig] = verifySizes.slice(-2);
    add({ case: 'growth', figure: `verify time ${vBig} / time ${vMid} glyphs`, value: (verifyTotals.get(vBig) as number) / (verifyTotals.get(vMid) as number), unit: 'x', note: `${vBig / vMid}x the glyphs; goal at most ${(vBig / vMid) * 1.1}` });
  }

  // 3: exact ink area of bundled glyphs against a 2048 x 2048 raster count.
  const glyphs = !want('ink') ? [] : smoke ? listGlyphs().slice(0, 4) : listGlyphs();
  let exactMs = 0;
  let rasterMs = 0;
  let worst = { name: '', rel: 0 };
  for (const g of glyphs) {
    const ours = await timed(smoke ? 1 : 2, () => measureGlyph(g.svg));
    const ink = measureGlyph(g.svg);
    const vb = ink.viewBox ?? { x: 0, y: 0, width: 1, height: 1 };
    let raster = 0;
    const theirs = await timed(1, () => (raster = rasterInk(g.svg, 2048, vb)));
    exactMs += ours.medianMs;
    rasterMs += theirs.medianMs;
    const rel = Math.abs(raster / ink.areaUnits2 - 1);
    if (rel > worst.rel) worst = { name: g.name, rel };
  }
  if (glyphs.length) add({ case: `ink area, ${glyphs.length} glyphs`, figure: 'exact (polygons), per glyph', value: exactMs / glyphs.length, unit: 'ms' });
  if (glyphs.length) add({ case: `ink area, ${glyphs.length} glyphs`, figure: 'resvg 2048 px alpha count, per glyph', value: rasterMs / glyphs.length, unit: 'ms' });
  if (glyphs.length) add({ case: `ink area, ${glyphs.length} glyphs`, figure: 'speed ratio raster / exact', value: rasterMs / exactMs, unit: 'x' });
  if (glyphs.length) add({ case: `ink area, ${glyphs.length} glyphs`, figure: 'largest disagreement', value: worst.rel, unit: 'relative', note: worst.name });

  // 4: PNG export, A3 at 300 ppi with 2,000 glyphs (smoke: A6 at 72 ppi, 40 glyphs), in its own process.
  const png = smoke ? { glyphs: 40, ppi: 72, page: { width: 148, height: 105 } } : { glyphs: 2_000, ppi: 300, page: { width: 420, height: 297 } };
  const pngRuns: { wallMs: number; cpuMs: number; peakMb: number }[] = [];
  let pngError: string | undefined;
  for (let i = 0; i < (!want('png') ? 0 : smoke ? 1 : 2); i++) {
    const r = pngChild(png.glyphs, png.ppi, png.page);
    if (r.error) pngError = r.error;
    else pngRuns.push(r);
  }
  const pngCase = `PNG ${png.page.width}x${png.page.height} mm ${png.ppi} ppi, ${png.glyphs} glyphs`;
  if (!want('png')) {
    // skipped
  } else if (pngRuns.length) {
    const walls = pngRuns.map((r) => r.wallMs);
    const peaks = pngRuns.map((r) => r.peakMb);
    add({ case: pngCase, figure: 'wall time (render + verify + pixel check + PNG)', value: median(walls), unit: 'ms', min: Math.min(...walls), max: Math.max(...walls), note: 'goal under 2000' });
    const cpus = pngRuns.map((r) => r.cpuMs);
    add({ case: pngCase, figure: 'CPU time of the whole process (user + system)', value: median(cpus), unit: 'ms', min: Math.min(...cpus), max: Math.max(...cpus), note: 'includes starting Node' });
    add({ case: pngCase, figure: 'peak memory (resident high-water mark of the process)', value: median(peaks), unit: 'MB', min: Math.min(...peaks), max: Math.max(...peaks), note: 'goal under 500' });
  } else add({ case: pngCase, figure: 'wall time', value: null, unit: 'ms', note: `failed: ${pngError ?? 'unknown'}` });

  // 5: the app in Debian Chromium: a value edit to the verified preview (see benchApp.ts).
  if (want('app')) {
    const appGlyphs = smoke ? 50 : 1_000;
    const appCase = `app edit → preview, ${appGlyphs} glyphs`;
    try {
      const { measureAppEdits } = await import('./benchApp');
      const times = await measureAppEdits(repeatChartDoc(appGlyphs) as { data: { value: number }[] }, smoke ? 3 : 20);
      const sorted = [...times.editMs].sort((a, b) => a - b);
      const p95 = sorted[Math.min(sorted.length - 1, Math.ceil(0.95 * sorted.length) - 1)];
      const verifiedNote = times.allVerified ? 'every preview a passed file' : 'A PREVIEW WITHOUT A PASS VERDICT';
      add({ case: appCase, figure: 'keystroke to verified preview, median', value: median(sorted), unit: 'ms', min: sorted[0], max: sorted[sorted.length - 1], note: `${sorted.length} edits, includes the 160 ms typing debounce; ${verifiedNote}` });
      add({ case: appCase, figure: 'keystroke to verified preview, 95th percentile', value: p95, unit: 'ms', note: 'goal: median within one 16 ms frame of checking' });
    } catch (e) {
      add({ case: appCase, figure: 'keystroke to verified preview, median', value: null, unit: 'ms', note: `failed: ${e instanceof Error ? e.message.slice(0, 160) : String(e)}` });
    }
  }

  // 6: audit of a supplied SVG with 5,000 marks.
  const auditCount = !want('audit') ? 0 : smoke ? 50 : 5_000;
  const fixture = auditFixture(auditCount);
  const markIds = fixture.values.map((_, i) => `m${i}`);
  if (auditCount) try {
    const audit = await timed(smoke ? 1 : 2, () => auditSvg(fixture.svg, { values: fixture.values, markIds }));
    add({ case: `audit ${auditCount} marks`, figure: 'auditSvg of a supplied SVG', value: audit.medianMs, unit: 'ms', min: audit.minMs, max: audit.maxMs });
  } catch (e) {
    add({ case: `audit ${auditCount} marks`, figure: 'auditSvg of a supplied SVG', value: null, unit: 'ms', note: `refused: ${e instanceof Error ? e.message.slice(0, 120) : String(e)}` });
  }

  const result: BenchResult = {
    mode: smoke ? 'smoke' : opts.only ? 'partial' : 'full',
    date: new Date().toISOString(),
    node: process.version,
    cores: os.cpus().length,
    cpu: os.cpus()[0]?.model ?? 'unknown',
    rows,
  };
  const outDir = opts.outDir === undefined ? path.join(ROOT, 'bench', 'results') : opts.outDir;
  if (outDir) writeResults(result, outDir);
  return result;
}

export function writeResults(result: BenchResult, outDir: string): { json: string; markdown: string } {
  mkdirSync(outDir, { recursive: true });
  const stamp = result.date.slice(0, 19).replace(/[:T]/g, '-');
  const md = [
    `# Benchmark ${result.mode === 'full' ? '' : `(${result.mode} run)`}`.trim(),
    '',
    `${result.date} · Node ${result.node} · ${result.cores} cores (${result.cpu}) · medians after one warm-up, with min and max.`,
    '',
    formatTable(result.rows),
    '',
  ].join('\n');
  const json = path.join(outDir, `bench-${result.mode}-${stamp}.json`);
  const markdown = path.join(outDir, `bench-${result.mode}-${stamp}.md`);
  writeFileSync(json, JSON.stringify(result, null, 2) + '\n');
  writeFileSync(markdown, md);
  writeFileSync(path.join(outDir, `latest-${result.mode}.json`), JSON.stringify(result, null, 2) + '\n');
  writeFileSync(path.join(outDir, `latest-${result.mode}.md`), md);
  return { json, markdown };
}

const invoked = process.argv[1] ? pathToFileURL(path.resolve(process.argv[1])).href === import.meta.url : false;
if (invoked) {
  const argv = process.argv.slice(2);
  if (argv[0] === '--png-child') await pngChildMain(argv.slice(1));
  else {
    const outAt = argv.indexOf('--out');
    const runsAt = argv.indexOf('--runs');
    const onlyAt = argv.indexOf('--only');
    const result = await runBench({
      smoke: argv.includes('--smoke'),
      ...(runsAt >= 0 ? { runs: Number(argv[runsAt + 1]) } : {}),
      ...(outAt >= 0 ? { outDir: argv[outAt + 1] } : {}),
      ...(onlyAt >= 0 ? { only: argv[onlyAt + 1].split(',') } : {}),
      log: (line) => console.log(line),
    });
    console.log('\n' + formatTable(result.rows));
  }
}
