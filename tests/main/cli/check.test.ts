import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { command } from '../../../main/cli/commands/check';
import { command as render } from '../../../main/cli/commands/render';
import { capture, runTallyglyph } from '../../helpers/cli';
import { docFolder, roundedToWholeGlyphs } from './cliSetup';

const tmp = docFolder('tallyglyph-check-');
const writeDoc = tmp.writeDoc;

// Invented: ferry fare income in two survey years, in nominal euros, no source; the two-year advice dismissed.
const FARES = {
  format: 'tallyglyph.chart/1',
  title: 'Ferry fare income',
  data: [
    { label: '2019', value: 400 },
    { label: '2024', value: 520 },
  ],
  encoding: { mode: 'repeat', glyph: 'coin', unit: 40, unitName: 'euros' },
  page: { width: 180, height: 120, unit: 'mm' },
  dismissed: [{ code: 'context-thin', reason: 'The brief compares two survey years.' }],
};

// 12 and 27 at 10 per whole glyph are drawn as 1 and 3 glyphs: lie factor 1.6 (Tufte 1983, p. 57).
const ROUNDED = roundedToWholeGlyphs({ source: 'Invented test data', encoding: { unitName: 'bikes' } });

describe('tallyglyph check', () => {
  it('prints each open finding with its fix, lists the dismissed one with its reason, and exits 0 when nothing blocks', async () => {
    const io = capture(tmp.dir);
    expect(await command.run([writeDoc('fares.json', FARES)], io)).toBe(0);
    expect(io.out).toContain('fares.json: 0 blocking findings, 2 warnings, 0 advice; worst lie factor 1.0000 (allowed 0.95-1.05).');
    expect(io.out.split('\n')[1]).toMatch(/^Ink: data marks \d+%, reading aids \d+%, decoration 0% \(\d+ mm² in all\)\.$/);
    expect(io.out).toContain('WARNING money-nominal (Money over time not adjusted for prices)');
    expect(io.out).toContain('WARNING source-unstated (Source not stated)');
    expect(io.out).toContain('  Fix: Name the source of the data');
    expect(io.out).toContain('Dismissed context-thin: The brief compares two survey years.');
    expect(io.err).toBe('');
  });

  it('--strict exits 1 on open warnings', async () => {
    expect(await command.run([writeDoc('fares.json', FARES), '--strict'], capture(tmp.dir))).toBe(1);
  });

  it('--json gives the findings, the dismissed ones and the lie factor', async () => {
    const io = capture(tmp.dir);
    expect(await command.run([writeDoc('fares.json', FARES), '--json'], io)).toBe(0);
    const out = JSON.parse(io.out);
    expect(out.ok).toBe(true);
    // 400 and 520 at 40 a coin are 10 and 13 whole coins: lie factor (13/10 - 1) / (520/400 - 1) = 1 (Tufte 1983, p. 57),
    // measured from summed floating-point ink areas, so 1 to within rounding of the last bits.
    expect(out.lieFactor.pass).toBe(true);
    expect(out.lieFactor.worst).toBeCloseTo(1, 12);
    expect(out.ink.dataShare).toBeCloseTo(out.ink.dataMm2 / (out.ink.dataMm2 + out.ink.readingAidMm2 + out.ink.decorationMm2), 12);
    expect(out.ink.dataShare).toBeGreaterThan(0.5);
    expect(out.findings.map((f: { code: string }) => f.code)).toEqual(['money-nominal', 'source-unstated']);
    expect(out.dismissed[0]).toMatchObject({ reason: 'The brief compares two survey years.', finding: { code: 'context-thin', severity: 'advice' } });
  });

  it('a lie-factor failure blocks (exit 1), and the rounding rule names the unit that fixes it', async () => {
    const io = capture(tmp.dir);
    expect(await command.run([writeDoc('rounded.json', ROUNDED), '--json'], io)).toBe(1);
    const out = JSON.parse(io.out);
    expect(out.ok).toBe(false);
    expect(out.lieFactor.pass).toBe(false);
    expect(out.lieFactor.worst).toBeCloseTo(1.6, 9);
    expect(out.findings[0].severity).toBe('blocking');
    // At 2.5 per glyph: 12 -> 4.8 -> 5 (+4.2%), 27 -> 10.8 -> 11 (+1.9%), both within 5% (arithmetic by hand).
    expect(out.findings.find((f: { code: string }) => f.code === 'rounding-error').action).toEqual({ kind: 'set-unit', label: 'Use 2.5 per glyph', payload: { unit: 2.5 } });
  });

  it('bad input exits 2 with one plain line: no file, invalid document, bad option', async () => {
    let io = capture(tmp.dir);
    expect(await command.run(['missing.json'], io)).toBe(2);
    expect(io.err).toBe('tallyglyph check: Could not read "missing.json": there is no such file.\n');
    io = capture(tmp.dir);
    expect(await command.run([writeDoc('bad.json', { ...FARES, dismissed: [{ code: 'context-thin' }] })], io)).toBe(2);
    expect(io.err).toMatch(/^tallyglyph check: bad\.json: dismissed\[0\]\.reason: .+\n$/);
    io = capture(tmp.dir);
    expect(await command.run([writeDoc('fares.json', FARES), '--fast'], io)).toBe(2);
    expect(io.err).toContain("Unknown option '--fast'");
  });

  it('a zero population is reported as a finding, not dropped', async () => {
    const doc = {
      ...FARES,
      source: 'Invented test data',
      data: [
        { label: 'Kestrel Bay', value: 120 },
        { label: 'Ashby Cross', value: 2_400 },
      ],
      encoding: { mode: 'repeat', glyph: 'bike', unit: 100, unitName: 'bike thefts' },
      standardise: { columns: { population: { values: { 'Kestrel Bay': 0, 'Ashby Cross': 480_000 } } } },
      dismissed: undefined,
    };
    const io = capture(tmp.dir);
    expect(await command.run([writeDoc('towns.json', doc), '--json'], io)).toBe(0);
    const out = JSON.parse(io.out);
    expect(out.findings.map((f: { code: string }) => f.code)).toEqual(['size-unadjusted-base-incomplete']);
    expect(out.findings[0].category).toBe('Kestrel Bay');
  });

  it('runs as a real command from the dispatcher', () => {
    const file = path.join(tmp.dir, writeDoc('fares.json', FARES));
    const res = runTallyglyph(['check', file]);
    expect(res.status).toBe(0);
    expect(res.stdout).toContain('WARNING money-nominal');
  });
});

describe('tallyglyph render prints the rule findings', () => {
  it('writes the chart and lists open findings on stderr, one line each', async () => {
    const io = capture(tmp.dir);
    expect(await render.run([writeDoc('fares.json', FARES), '-o', 'fares.svg'], io)).toBe(0);
    expect(fs.existsSync(path.join(tmp.dir, 'fares.svg'))).toBe(true);
    const lines = io.err.split('\n').filter(Boolean);
    expect(lines).toHaveLength(2);
    expect(lines[0]).toMatch(/^tallyglyph render: warning money-nominal: The values are money \(euros\) from 2019 to 2024 .* Fix: Supply a price index/);
    expect(lines[1]).toMatch(/^tallyglyph render: warning source-unstated: /);
  });

  it('includes findings and dismissed ones in --json', async () => {
    const io = capture(tmp.dir);
    expect(await render.run([writeDoc('fares.json', FARES), '-o', 'fares.svg', '--json'], io)).toBe(0);
    const out = JSON.parse(io.out);
    expect(out.findings.map((f: { code: string }) => f.code)).toEqual(['money-nominal', 'source-unstated']);
    expect(out.dismissed).toHaveLength(1);
  });
});
