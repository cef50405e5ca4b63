// `tallyglyph glyph` prints what the library measures, from a real subprocess as a user runs it.
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { getGlyph, measureGlyph } from '../../../shared-core/glyph';

const repo = fileURLToPath(new URL('../../../', import.meta.url));
const bin = join(repo, 'bin', 'tallyglyph.js');
const run = (...args: string[]) => spawnSync(process.execPath, [bin, ...args], { cwd: repo, encoding: 'utf8' });

describe('tallyglyph glyph', () => {
  it('prints the same ink area as measureGlyph for a bundled glyph (--json)', () => {
    const out = JSON.parse(execFileSync(process.execPath, [bin, 'glyph', 'bike', '--json'], { cwd: repo, encoding: 'utf8' }));
    const lib = measureGlyph(getGlyph('bike').svg);
    expect(out.inkArea).toBe(lib.areaUnits2);
    expect(out.bbox).toEqual(lib.bbox);
    expect(out.boxFraction).toBe(lib.boxFraction);
    expect(out.warnings).toEqual([]);
  });
  it('measures a file and reports the rounded figures in text', () => {
    const dir = mkdtempSync(join(tmpdir(), 'tg-glyph-'));
    const file = join(dir, 'disc.svg');
    writeFileSync(file, '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 100 100"><circle cx="50" cy="50" r="50"/></svg>');
    const r = run('glyph', file);
    expect(r.status).toBe(0);
    // πr² for r = 50 is 7853.98 (closed form); flattening keeps it within 1e-4.
    const area = Number(/ink area\s+([\d.]+)/.exec(r.stdout)?.[1]);
    expect(Math.abs(area - Math.PI * 2500) / (Math.PI * 2500)).toBeLessThan(1e-4);
    expect(r.stdout).toMatch(/box filled 78\.5\d%/); // π/4 = 78.54% of the box
  });
  it('fails clearly on a missing file, an unknown glyph and bad markup', () => {
    const missing = run('glyph', 'no/such/file.svg');
    expect(missing.status).toBe(2);
    expect(missing.stderr).toMatch(/no such file/);
    const unknown = run('glyph', 'bicyclee');
    expect(unknown.status).toBe(2);
    expect(unknown.stderr).toMatch(/no bundled glyph.*bike/i);
    const dir = mkdtempSync(join(tmpdir(), 'tg-glyph-'));
    writeFileSync(join(dir, 'bad.svg'), '<svg><path d="M0 0 L"/></svg>');
    const bad = run('glyph', join(dir, 'bad.svg'));
    expect(bad.status).toBe(2);
    expect(bad.stderr).toMatch(/path data cannot be read/);
    expect(bad.stderr).not.toMatch(/at .*\.ts:\d+/); // no stack trace
  });
  it('warns when the ink reaches outside the viewBox (a drop drawn from y 5 to 103 in a 0-100 box)', () => {
    const dir = mkdtempSync(join(tmpdir(), 'tg-glyph-'));
    const file = join(dir, 'drop.svg');
    // A polygon with its lowest point at y = 103: 3 units below the viewBox's bottom edge at 100 (SVG 1.1, 7.7 viewBox).
    writeFileSync(file, '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 100 100"><path d="M50 5 L80 60 L50 103 L20 60 Z"/></svg>');
    const r = run('glyph', file);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/warning\s+The ink reaches outside the glyph's viewBox \(0 0 100 100\): 3 units below the bottom/);
    const json = JSON.parse(run('glyph', file, '--json').stdout);
    expect(json.warnings.map((w: { code: string }) => w.code)).toEqual(['ink-outside-viewbox']);
  });
  it('gives no such warning for bundled glyphs whose ink strays under a thousandth of the box (stroke joins)', () => {
    for (const name of ['bike', 'fish', 'motorbike', 'wheelchair', 'drop', 'person']) {
      const ink = measureGlyph(getGlyph(name).svg);
      expect(ink.warnings.map((w) => w.code)).not.toContain('ink-outside-viewbox');
    }
  });
});
