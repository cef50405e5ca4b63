// `tallyglyph sheet`: the supplied drawing beside its correction. Checked from outside: rsvg-convert
// renders the sheet and the corrected panel's marks carry ink in proportion to the data (Tufte's
// 0.95–1.05, 1983, p. 57); pngcheck reads the PNG's resolution (PNG spec pHYs: 300 ppi = 11811 px/m).
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildSheet, correctSvg, sanitizedCopy } from '../../../shared-core/audit';
import { importSvg } from '../../../shared-core/audit/importSvg';
import { gate, lieFactors } from '../../../shared-core/integrity';
import { main } from '../../../main/cli/index';
import { BARRELS_AREA } from '../../fixtures/audit/scenes';
import { hasPngcheck, hasRsvg, pngcheckPhys, rsvgMarkCoverages } from '../../helpers/independent';

const fixtures = fileURLToPath(new URL('../../fixtures/audit/', import.meta.url));
let dir = '';
beforeAll(() => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyglyph-sheet-'));
});
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

async function cli(args: string[]) {
  let out = '', err = '';
  const code = await main(args, { stdout: (s) => void (out += s), stderr: (s) => void (err += s), cwd: dir });
  return { code, out, err };
}

describe('sanitizedCopy', () => {
  it('drops scripts, handlers, foreign objects, style sheets and outside references; prefixes ids and their references', () => {
    const root = importSvg(
      '<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" viewBox="0 0 10 10" fill="red" onload="x()">' +
        '<style>rect{fill:blue}</style><script>alert(1)</script><foreignObject><p>hi</p></foreignObject>' +
        '<defs><linearGradient id="g"><stop offset="0"/></linearGradient><rect id="r" width="2" height="2"/></defs>' +
        '<use xlink:href="#r" onclick="y()"/><use href="file:///etc/hosts#x"/><rect width="1" height="1" style="fill:url(#g)"/></svg>',
    ).root;
    const copy = sanitizedCopy(root, 'p-');
    expect(copy.markup).not.toMatch(/script|onclick|onload|foreignObject|<style|file:/);
    expect(copy.markup).toContain('<use href="#p-r"/>');
    expect(copy.markup).toContain('id="p-g"');
    expect(copy.markup).toContain('fill:url(#p-g)');
    expect(copy.rootAttributes).toBe(' fill="red"');
    // One note per kind left out: event handlers, <style>, <script>, <foreignObject>, outside references.
    expect(copy.warnings.length).toBe(5);
  });
});

describe('tallyglyph sheet', () => {
  it.skipIf(!hasRsvg)('writes an SVG sheet whose corrected panel renders (rsvg-convert) with ink in proportion, the supplied one at ×43.8', async () => {
    const out = path.join(dir, 'sheet.svg');
    const r = await cli(['sheet', path.join(fixtures, 'barrels-area.svg'), '--values', '1,5.54', '-o', out, '--title', 'Price of a barrel']);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/supplied \(area lie factor 9\.43\) beside corrected \(1\.00\)/);
    const sheet = fs.readFileSync(out, 'utf8');
    const ids = ['barrel-1973', 'barrel-1979'];
    const all = ids.flatMap((id) => [`supplied-${id}`, `corrected-${id}`]);
    // Measure the marks alone: hide the page background, the captions and the drawing's own labels (outlined, each with an id).
    const labels = [...sheet.matchAll(/id="((?:supplied|corrected)-outlined-text-\d+)"/g)].map((m) => m[1]);
    expect(labels.length).toBe(4);
    const ink = rsvgMarkCoverages(sheet, [...all, 'sheet-background', 'sheet-captions', ...labels], 1400);
    const at = (id: string) => ink.find((c) => c.id === id)?.px as number;
    const corrected = gate(lieFactors(ids.map((id, i) => ({ label: id, data: BARRELS_AREA.values[i], graphic: at(`corrected-${id}`) }))));
    expect(corrected.pass).toBe(true);
    expect(Math.abs(at('supplied-barrel-1979') / at('supplied-barrel-1973') / 43.8 - 1)).toBeLessThan(0.01);
    // Captions and the drawing's own labels are outlines, not text: the sheet needs no font to show them.
    expect(sheet).not.toMatch(/<text/);
  });

  it.skipIf(!hasPngcheck)('writes a PNG sheet that records 300 ppi (11811 px/m) in its pHYs chunk', async () => {
    const out = path.join(dir, 'sheet.png');
    const r = await cli(['sheet', path.join(fixtures, 'barrels-area.svg'), '--values', '1,5.54', '-o', out]);
    expect(r.code).toBe(0);
    expect(pngcheckPhys(fs.readFileSync(out))).toEqual({ ppmX: 11811, ppmY: 11811, unit: 1 });
  });

  it('a hostile supplied file reaches the sheet without its script, handlers or outside references', () => {
    const svg = BARRELS_AREA.svg().replace('<g id="barrel-1973"', '<script>steal()</script><g onload="steal()" id="barrel-1973"');
    const fixed = correctSvg(svg, { values: BARRELS_AREA.values });
    const sheet = buildSheet({ supplied: svg, corrected: fixed.svg, before: fixed.before, after: fixed.after, reading: fixed.reading });
    expect(sheet.svg).not.toMatch(/steal|<script|onload/);
    expect(sheet.warnings.map((w) => w.message).join(' ')).toMatch(/leaves out 1 <script> elements/);
  });

  it('refuses an output name that is neither .svg nor .png', async () => {
    const r = await cli(['sheet', path.join(fixtures, 'barrels-area.svg'), '--values', '1,5.54', '-o', path.join(dir, 'sheet.pdf')]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/name the output file \.svg or \.png/);
  });
});
