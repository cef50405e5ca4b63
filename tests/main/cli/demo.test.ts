import fs from 'node:fs';
import path from 'node:path';
import { PNG } from 'pngjs';
import { describe, expect, it } from 'vitest';
import { command } from '../../../main/cli/commands/demo';
import { DEMO_CHARTS } from '../../../shared-core/demo/demoCharts';
import { verifySvg } from '../../../shared-core/integrity/index';
import { readChartSvg } from '../../../shared-core/svg/index';
import { capture, runTallyglyph } from '../../helpers/cli';
import { hasPngcheck, pngcheckPhys } from '../../helpers/independent';
import { tempRoot } from '../../helpers/tempDirs';

const root = tempRoot('tallyglyph-demo-');

describe('tallyglyph demo', () => {
  it('writes every mode as SVG and PNG, each verified, with progress lines', async () => {
    const io = capture(root);
    expect(await command.run(['-o', 'out/demo'], io)).toBe(0);
    const dir = path.join(root, 'out/demo');
    const names = DEMO_CHARTS.map((c) => c.name);
    expect(fs.readdirSync(dir).sort()).toEqual(names.flatMap((n) => [`${n}.png`, `${n}.svg`]).sort());
    const lines = io.out.trim().split('\n');
    expect(lines).toHaveLength(2 * names.length + 1);
    // The measured figure to four decimals: 1 within 1e-4 for the bike demo (partial bikes cut by ink, 1 µm coordinates), either side of 1.
    const svgLine = /^\[1\/6\] repeat-bike-share\.svg .*verified from the file: worst lie factor (\d\.\d{4})$/.exec(lines[0]);
    expect(svgLine).not.toBeNull();
    expect(Math.abs(Number(svgLine?.[1]) - 1)).toBeLessThanOrEqual(1e-4);
    expect(lines[1]).toMatch(/^\[1\/6\] repeat-bike-share\.png +2126 x 141[78] px at 300 ppi; lie factor from pixels \d\.\d{4}$/);
    const modes = new Set<string>();
    for (const name of names) {
      const svg = fs.readFileSync(path.join(dir, `${name}.svg`), 'utf8');
      const report = verifySvg(svg);
      expect(report.pass).toBe(true);
      modes.add(readChartSvg(svg).summary?.mode ?? '');
      const png = fs.readFileSync(path.join(dir, `${name}.png`));
      // 180 mm at 300 ppi (1 in = 25.4 mm) is 2126 px; pHYs 300 ppi = 11811 px/m (PNG spec).
      expect(PNG.sync.read(png).width).toBe(2126);
      if (hasPngcheck) expect(pngcheckPhys(png)).toEqual({ ppmX: 11811, ppmY: 11811, unit: 1 });
    }
    expect([...modes].sort()).toEqual(['fill', 'repeat', 'scale', 'stack']);
    // The demo says where its figures come from.
    expect(DEMO_CHARTS.every((c) => /invented demo data/.test(c.document.source ?? ''))).toBe(true);
  });

  it('exits 2 without a folder', async () => {
    const io = capture(root);
    expect(await command.run([], io)).toBe(2);
    expect(io.err).toMatch(/Give -o <folder>/);
  });

  it('runs as a real process: node bin/tallyglyph.js demo', () => {
    const dir = path.join(root, 'subprocess');
    // 150 ppi keeps the run short; the 300 ppi files are checked above.
    const run = runTallyglyph(['demo', '-o', dir, '--ppi', '150'], 120_000);
    expect(run.status).toBe(0);
    expect(run.stdout).toMatch(/Wrote 12 verified files/);
    expect(fs.readdirSync(dir)).toHaveLength(12);
  });
});
