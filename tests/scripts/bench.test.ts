// The benchmark in smoke mode: every case runs at tiny sizes and yields real figures, so `npm run bench`
// cannot rot between full runs. Speed is not asserted here (speed goals live in the benchmark itself).
import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { runBench } from '../../scripts/bench';
import { tempRoot } from '../helpers/tempDirs';
import { haveChromium } from '../renderer/browser/helpers/appServer';

const out = tempRoot('tallyglyph-bench-');

describe('npm run bench --smoke', () => {
  it('measures every case with finite figures and writes JSON and Markdown with the machine described', { timeout: 300_000 }, async () => {
    const result = await runBench({ smoke: true, outDir: out, log: () => {} });
    const byFigure = (c: RegExp, f: RegExp) => result.rows.find((r) => c.test(r.case) && f.test(r.figure));
    // Every row is a finite positive number; the app rows too where Chromium is installed.
    for (const row of result.rows) {
      if (/^app /.test(row.case) && !haveChromium) continue;
      expect(typeof row.value, `${row.case}: ${row.figure}`).toBe('number');
      expect(Number.isFinite(row.value as number), `${row.case}: ${row.figure}`).toBe(true);
      expect(row.value as number).toBeGreaterThanOrEqual(0);
      if (row.min !== undefined && row.max !== undefined) {
        expect(row.min).toBeLessThanOrEqual(row.value as number);
        expect(row.max).toBeGreaterThanOrEqual(row.value as number);
      }
    }
    const ours = byFigure(/repeat 200/, /^ours/);
    const vega = byFigure(/repeat 200/, /^Vega/);
    const ratio = byFigure(/repeat 200/, /^ratio/);
    expect(ours?.note).toMatch(/verified/);
    expect(vega?.value as number).toBeGreaterThan(0);
    expect(ratio?.value as number).toBeCloseTo((ours?.value as number) / (vega?.value as number), 9);
    // Exact ink against resvg's alpha count at 2048 px: the method's documented agreement is 0.032% at worst
    // on the bundled glyphs (DEVELOPERS.md, measured against resvg); 1e-3 leaves room, a broken count fails it.
    expect(byFigure(/ink area/, /largest disagreement/)?.value as number).toBeLessThan(1e-3);
    expect(byFigure(/^PNG/, /peak memory/)?.value as number).toBeGreaterThan(10);
    expect(byFigure(/^audit/, /auditSvg/)?.value).not.toBeNull();
    if (haveChromium) {
      // The app's preview only ever shows a file that passed (the honesty panel's verdict for that very file).
      expect(byFigure(/^app /, /median/)?.note).toMatch(/every preview a passed file/);
      expect(byFigure(/^app /, /95th/)?.value as number).toBeGreaterThanOrEqual(byFigure(/^app /, /median/)?.value as number);
    }
    expect(result.cores).toBeGreaterThan(0);
    expect(result.node).toMatch(/^v\d+/);
    const files = fs.readdirSync(out);
    expect(files).toContain('latest-smoke.json');
    expect(files).toContain('latest-smoke.md');
    const back = JSON.parse(fs.readFileSync(path.join(out, 'latest-smoke.json'), 'utf8'));
    expect(back.rows.length).toBe(result.rows.length);
    expect(fs.readFileSync(path.join(out, 'latest-smoke.md'), 'utf8')).toMatch(/\| repeat 200 glyphs \| ours/);
  });

  it('times verification alone with --only verify: a stage row per chart size and the growth between them', { timeout: 300_000 }, async () => {
    const result = await runBench({ smoke: true, only: ['verify'], outDir: out, log: () => {} });
    expect(result.mode).toBe('smoke');
    const stages = result.rows.filter((r) => /stage verify/.test(r.figure));
    expect(stages.map((r) => r.case)).toEqual(['repeat 50 glyphs', 'repeat 200 glyphs']);
    for (const row of stages) {
      expect(Number.isFinite(row.value as number) && (row.value as number) > 0).toBe(true);
      expect(row.note).toMatch(/verified/);
    }
    const growth = result.rows.find((r) => r.case === 'growth');
    expect(growth?.value as number).toBeCloseTo((stages[1].value as number) / (stages[0].value as number), 9);
    // Nothing else ran: no full render, no Vega, no other case.
    expect(result.rows.every((r) => r.case === 'growth' || /stage verify/.test(r.figure))).toBe(true);
  });
});
