import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { command } from '../../../main/cli/commands/render';
import { DEMO_CHARTS } from '../../../shared-core/demo/demoCharts';
import { verifySvg } from '../../../shared-core/integrity/index';
import { capture, runTallyglyph } from '../../helpers/cli';
import { hasPngcheck, pngcheckPhys } from '../../helpers/independent';
import { docFolder, roundedToWholeGlyphs } from './cliSetup';

const tmp = docFolder('tallyglyph-render-');
const writeDoc = tmp.writeDoc;

const BIKES = DEMO_CHARTS[0].document;
const ROUNDED = roundedToWholeGlyphs();

describe('tallyglyph render', () => {
  it('writes a verified SVG and says what it measured', async () => {
    const io = capture(tmp.dir);
    const code = await command.run([writeDoc('bikes.json', BIKES), '-o', 'bikes.svg'], io);
    expect(code).toBe(0);
    const printed = /^Wrote bikes\.svg: 4 marks read by count, worst lie factor (\d\.\d{4}) \(allowed 0\.95-1\.05\)\.\n$/.exec(io.out);
    expect(printed).not.toBeNull();
    const report = verifySvg(fs.readFileSync(path.join(tmp.dir, 'bikes.svg'), 'utf8'));
    expect(report.pass).toBe(true);
    // The figure printed is the one measured from the written file, to four decimals. 8.4, 5.5, 12.2 and 2.7 bikes
    // with partial bikes cut by ink and coordinates written to 1 µm: the lie factor (Tufte 1983, p. 57) is 1 within 1e-4.
    const worst = report.lieFactor.worst ?? Number.NaN;
    expect(printed?.[1]).toBe(worst.toFixed(4));
    expect(Math.abs(worst - 1)).toBeLessThan(1e-4);
  });

  it('writes a PNG at the asked resolution with pHYs set (PNG spec: 150 ppi = 5906 px/m)', async () => {
    const io = capture(tmp.dir);
    const code = await command.run([writeDoc('bikes.json', BIKES), '-o', 'bikes.png', '--ppi', '150'], io);
    expect(code).toBe(0);
    expect(io.out).toMatch(/PNG 1063 x \d+ px at 150 ppi/);
    if (hasPngcheck) expect(pngcheckPhys(fs.readFileSync(path.join(tmp.dir, 'bikes.png')))).toEqual({ ppmX: 5906, ppmY: 5906, unit: 1 });
  });

  it('prints the full report with --json', async () => {
    const io = capture(tmp.dir);
    expect(await command.run([writeDoc('bikes.json', BIKES), '-o', 'bikes.svg', '--json'], io)).toBe(0);
    const out = JSON.parse(io.out);
    expect(out.ok).toBe(true);
    expect(out.report.pass).toBe(true);
    expect(out.report.marks).toHaveLength(4);
  });

  it('refuses a misleading chart with one line on stderr, exit 1, and leaves the old file untouched', async () => {
    fs.writeFileSync(path.join(tmp.dir, 'chart.svg'), 'previous chart');
    const io = capture(tmp.dir);
    const code = await command.run([writeDoc('rounded.json', ROUNDED), '-o', 'chart.svg'], io);
    expect(code).toBe(1);
    expect(io.err.split('\n').filter(Boolean)).toHaveLength(1);
    expect(io.err).toMatch(/B is drawn with 3\.00x as many glyphs as A but its value is only 2\.25x \(lie factor 1\.60/);
    expect(fs.readFileSync(path.join(tmp.dir, 'chart.svg'), 'utf8')).toBe('previous chart');
    expect(fs.readdirSync(tmp.dir).sort()).toEqual(['chart.svg', 'rounded.json']);
  });

  it('gives the refusal\'s details with --json', async () => {
    const io = capture(tmp.dir);
    expect(await command.run([writeDoc('rounded.json', ROUNDED), '-o', 'chart.png', '--json'], io)).toBe(1);
    const out = JSON.parse(io.out);
    expect(out.ok).toBe(false);
    expect(out.error.code).toBe('gate-refused');
    expect(out.report.pass).toBe(false);
    expect(out.report.lieFactor.worst).toBeCloseTo((3 - 1) / (27 / 12 - 1), 9);
    expect(fs.existsSync(path.join(tmp.dir, 'chart.png'))).toBe(false);
  });

  it('exits 2 for usage and input errors, writing nothing', async () => {
    const cases: [string[], RegExp][] = [
      [[writeDoc('bikes.json', BIKES)], /Give -o out\.svg or -o out\.png/],
      [[], /which chart document/],
      [['bikes.json', '-o', 'out.tiff'], /name the output file \.svg, \.png or \.pdf/],
      [['bikes.json', '-o', 'out.png', '--ppi', 'lots'], /--ppi must be a positive number/],
      [['bikes.json', '-o', 'out.png', '--ppi', '0'], /--ppi must be a positive number/],
      [['missing.json', '-o', 'out.svg'], /Could not read "missing\.json": there is no such file/],
      [[writeDoc('bad.json', '{"format": "tallyglyph.chart/7", "data": []}'), '-o', 'out.svg'], /Unknown document format "tallyglyph\.chart\/7"/],
      [['bikes.json', '-o', 'out.svg', '--colour'], /Unknown option '--colour'/],
    ];
    for (const [argv, message] of cases) {
      const io = capture(tmp.dir);
      expect(await command.run(argv, io)).toBe(2);
      expect(io.err).toMatch(message);
    }
    expect(fs.readdirSync(tmp.dir).sort()).toEqual(['bad.json', 'bikes.json']);
  });

  it('runs as a real process: node bin/tallyglyph.js render', () => {
    const input = path.join(tmp.dir, writeDoc('bikes.json', BIKES));
    const output = path.join(tmp.dir, 'out.svg');
    const run = runTallyglyph(['render', input, '-o', output]);
    expect(run.stderr).toBe('');
    expect(run.status).toBe(0);
    expect(run.stdout).toMatch(/^Wrote /);
    expect(verifySvg(fs.readFileSync(output, 'utf8')).pass).toBe(true);
  });
});
