import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { command } from '../../../main/cli/commands/verify';
import { DEMO_CHARTS } from '../../../shared-core/demo/demoCharts';
import { renderChart } from '../../../shared-core/pipeline/index';
import { capture, runTallyglyph } from '../../helpers/cli';
import { tempRoot } from '../../helpers/tempDirs';
import { scaleChart } from '../../shared-core/integrity/chartSvgFixtures';

const dir = tempRoot('tallyglyph-verify-');

const good = path.join(dir, 'trees.svg');
fs.writeFileSync(good, renderChart(DEMO_CHARTS[2].document).svg);
// Glyph height scaled by the value: areas go as the square, lie factor v/v0 + 1 = 5 for 40 against 10 (Tufte 1983, p. 57).
const bad = path.join(dir, 'squared.svg');
fs.writeFileSync(bad, scaleChart([{ label: 'North', value: 10 }, { label: 'East', value: 40 }], 'height'));
const foreign = path.join(dir, 'plain.svg');
fs.writeFileSync(foreign, '<svg xmlns="http://www.w3.org/2000/svg" width="10mm" height="10mm" viewBox="0 0 10 10"><rect width="5" height="5"/></svg>');

describe('tallyglyph verify', () => {
  it('prints every lie factor and PASS, exit 0, for an honest chart', async () => {
    const io = capture(dir);
    expect(await command.run(['trees.svg'], io)).toBe(0);
    expect(io.out).toMatch(/^trees\.svg: 4 marks, read by area \(mode scale\)/);
    expect(io.out).toMatch(/Lie factor against "Eastfield" \(the smallest value\), \(drawn ratio − 1\) ÷ \(value ratio − 1\):/);
    expect(io.out).toMatch(/\n {2}Riverside +1\.0\d{3} = \([\d.]+ − 1\) ÷ \([\d.]+ − 1\)\n/);
    expect(io.out).toMatch(/\nPASS: /);
  });

  it('prints FAIL with the reason and a fix, exit 1, for the squared chart', async () => {
    const io = capture(dir);
    expect(await command.run(['squared.svg'], io)).toBe(1);
    expect(io.out).toMatch(/Worst lie factor 5\.0000 \(East against North\)/);
    // Written out in Tufte's effect form (p. 57): 16x the ink for 4x the value, (16 - 1) / (4 - 1) = 5.
    expect(io.out).toMatch(/\n {2}East +5\.0000 = \(16 − 1\) ÷ \(4 − 1\)\n/);
    expect(io.out).toMatch(/FAIL: East is drawn with 16\.00x the ink area of North but its value is only 4\.00x/);
    expect(io.out).toMatch(/try: Scale each glyph by ink area/);
  });

  it('prints the report itself with --json', async () => {
    const io = capture(dir);
    expect(await command.run(['squared.svg', '--json'], io)).toBe(1);
    const report = JSON.parse(io.out);
    for (const key of ['pass', 'lieFactor', 'spread', 'marks', 'reason', 'suggestions', 'preflight']) expect(report).toHaveProperty(key);
    expect(report.pass).toBe(false);
    expect(report.lieFactor.worst).toBeCloseTo(5, 4);
  });

  it('exits 2 for a file it cannot read or that is not a Tallyglyph chart', async () => {
    const cases: [string[], RegExp][] = [
      [['plain.svg'], /not a Tallyglyph chart.*use audit/],
      [['nowhere.svg'], /could not read "nowhere\.svg": there is no such file/],
      [['.'], /it is a folder/],
      [[], /which file\?/],
      [['a.svg', 'b.svg'], /exactly one SVG file/],
    ];
    for (const [argv, message] of cases) {
      const io = capture(dir);
      expect(await command.run(argv, io)).toBe(2);
      expect(io.err).toMatch(message);
    }
  });

  it('runs as a real process: node bin/tallyglyph.js verify --json', () => {
    const run = runTallyglyph(['verify', good, '--json']);
    expect(run.status).toBe(0);
    expect(JSON.parse(run.stdout).pass).toBe(true);
    const fail = runTallyglyph(['verify', bad]);
    expect(fail.status).toBe(1);
  });
});
