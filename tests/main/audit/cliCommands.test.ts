// `tallyglyph audit` and `tallyglyph correct` on real fixture files (tests/fixtures/audit), through the
// command-line dispatcher; figures follow from the fixtures' stated scale factors (see scenes.ts).
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { PNG } from 'pngjs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../../main/cli/index';
import { verifySvg } from '../../../shared-core/integrity/verifySvg';
import { marksOnlySvg } from '../../../main/export/index';
import { hasRsvg, rsvgMarkCoverages } from '../../helpers/independent';

const fixtures = fileURLToPath(new URL('../../fixtures/audit/', import.meta.url));
let dir = '';
beforeAll(() => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyglyph-cli-audit-'));
});
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

async function cli(args: string[], cwd = fixtures) {
  let out = '', err = '';
  const code = await main(args, { stdout: (s) => void (out += s), stderr: (s) => void (err += s), cwd });
  return { code, out, err };
}

describe('tallyglyph audit', () => {
  it('prints the JSON shape scripts rely on', async () => {
    const r = await cli(['audit', 'barrels-area.svg', '--values', '1,5.54', '--json']);
    // Distorted (Tufte's 9.4, far outside 0.95-1.05): a failed check, exit 1 like verify.
    expect(r.code).toBe(1);
    const j = JSON.parse(r.out);
    expect(j.marks.map((m: { id: string }) => m.id)).toEqual(['barrel-1973', 'barrel-1979']);
    for (const k of ['length', 'area', 'volume']) expect(typeof j.readings[k].lieFactor.worst).toBe('number');
    // (43.8 - 1) / (5.54 - 1): Tufte's 9.4 (p. 62).
    expect(j.readings.area.lieFactor.worst).toBeCloseTo(42.8 / 4.54, 2);
    expect(j.suggested).toBe('area');
    expect(j.volumeReadable).toBe(true);
  });

  it('values by mark id and the text report', async () => {
    const r = await cli(['audit', 'stretched-height.svg', '--values', 'tall=30,short=10']);
    // Stretched x3 in height for a value x3, read by height: faithful, exit 0.
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/Tallyglyph audit of stretched-height\.svg/);
    expect(r.out).toMatch(/read by their height/);
  });

  it('a 3-D box drawing is flagged in the report', async () => {
    const r = await cli(['audit', 'box-3d.svg', '--values', '1,2', '--json']);
    const j = JSON.parse(r.out);
    expect(j.volumeReadable).toBe(true);
    expect(j.marks[0].solidCues).toContain('parallelogram-faces');
  });

  it('usage errors exit 2 with a sentence', async () => {
    const r = await cli(['audit', 'barrels-area.svg', '--values', '1,2,3']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/3 value\(s\) were given but the graphic has 2 mark/);
    expect((await cli(['audit'])).code).toBe(2);
    expect((await cli(['audit', 'barrels-area.svg', '--values', '1,abc'])).err).toMatch(/"abc" is not a number/);
  });
});

describe('tallyglyph audit exit status and advice', () => {
  it('exits 1 on a distorted verdict and 0 on a faithful one, as help audit documents', async () => {
    // Tufte p. 62: the barrels drawn by area against data up 454% give a lie factor of 9.4.
    const distorted = await cli(['audit', 'barrels-area.svg', '--values', '1,5.54']);
    expect(distorted.code).toBe(1);
    expect(distorted.out).toMatch(/Verdict/);
    // The figure is shown in the effect form it comes from (Tufte p. 57): the drawing grows 43.8x
    // (+4,280%), the data 5.54x (+454%), (43.8 - 1) / (5.54 - 1) = 9.43 (the book's 9.4, p. 62).
    expect(distorted.out).toContain('lie factor (43.8 − 1) ÷ (5.54 − 1) = 9.43');
    expect(distorted.out).toMatch(/ {4}area: \(43\.8 − 1\) ÷ \(5\.54 − 1\) = 9\.43\n/);
    expect((await cli(['audit', 'stretched-height.svg', '--values', '10,30'])).code).toBe(0);
    const help = await cli(['help', 'audit']);
    expect(help.out).toMatch(/Exit status: 0 .*faithful/);
    expect(help.out).toMatch(/1 the graphic distorts the data/);
  });

  it('a PNG audited with the wrong number of values points to the options that pick marks in an image', async () => {
    // Three dark squares on white: three marks, but only two values.
    const png = new PNG({ width: 120, height: 60 });
    png.data.fill(255);
    for (const [x0, side] of [[10, 10], [45, 20], [80, 30]] as const) {
      for (let y = 15; y < 15 + side; y++) {
        for (let x = x0; x < x0 + side; x++) {
          const i = (y * png.width + x) * 4;
          png.data[i] = png.data[i + 1] = png.data[i + 2] = 20;
        }
      }
    }
    const file = path.join(dir, 'three-squares.png');
    fs.writeFileSync(file, PNG.sync.write(png));
    const r = await cli(['audit', file, '--values', '1,2'], dir);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/2 value\(s\) were given but the image has 3 mark/);
    expect(r.err).toMatch(/--seed x,y/);
    // --marks picks SVG elements by id: no use for an image.
    expect(r.err).not.toMatch(/--marks/);
  });
});

describe('tallyglyph correct', () => {
  it('writes a corrected file that re-audits within 0.95–1.05, and leaves the supplied file alone', async () => {
    const before = fs.readFileSync(path.join(fixtures, 'barrels-area.svg'), 'utf8');
    const out = path.join(dir, 'fixed.svg');
    const r = await cli(['correct', path.join(fixtures, 'barrels-area.svg'), '--values', '1,5.54', '-o', out], dir);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/Worst area lie factor: 9\.43 before, 1\.00 after/);
    expect(fs.readFileSync(path.join(fixtures, 'barrels-area.svg'), 'utf8')).toBe(before);
    const again = await cli(['audit', out, '--values', '1,5.54', '--json'], dir);
    expect(again.code).toBe(0);
    const j = JSON.parse(again.out);
    expect(j.readings.area.pass).toBe(true);
    expect(Math.abs(j.readings.area.lieFactor.worst - 1)).toBeLessThan(0.001);
  });

  it('refuses to overwrite the supplied file, a count reading, or an image', async () => {
    const copy = path.join(dir, 'copy.svg');
    fs.copyFileSync(path.join(fixtures, 'barrels-area.svg'), copy);
    const r = await cli(['correct', copy, '--values', '1,5.54', '-o', copy], dir);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/would overwrite the supplied file/);
    expect((await cli(['correct', copy, '--values', '1,5.54', '-o', 'x.svg', '--reading', 'count'], dir)).err).toMatch(/--reading must be area, length or volume/);
    expect((await cli(['correct', copy, '--values', '1,5.54'], dir)).code).toBe(2);
  });
});

describe('tallyglyph correct --rebuild', () => {
  it('redraws the audited data as a verified repeat chart whose glyph ink, rendered by rsvg-convert, follows the values', async () => {
    const out = path.join(dir, 'rebuilt.svg');
    const r = await cli(['correct', 'barrels-area.svg', '--values', '18,54', '--rebuild', 'repeat', '--glyph', 'coin', '--unit', '2', '--unit-name', 'barrels', '-o', out]);
    expect(r.code, r.err).toBe(0);
    expect(r.out).toMatch(/verified from the written file: worst lie factor 1\.0000/);
    const svg = fs.readFileSync(out, 'utf8');
    const report = verifySvg(svg);
    expect(report.pass).toBe(true);
    expect(report.marks.map((m) => m.value)).toEqual([18, 54]);
    // Independent renderer: 54 / 18 = 3 times the ink (repeat charts read by count, each glyph the same ink).
    if (hasRsvg) {
      const ids = [...svg.matchAll(/<g id="(mark-\d+)"/g)].map((m) => m[1]);
      // Labels and legend are hidden first so only data ink is counted.
      const [a, b] = rsvgMarkCoverages(marksOnlySvg(svg), ids, 1800);
      expect(b.px / a.px).toBeGreaterThan(3 * 0.99);
      expect(b.px / a.px).toBeLessThan(3 * 1.01);
    }
  });
  it('refuses an unknown mode and writes nothing', async () => {
    const out = path.join(dir, 'never.svg');
    const r = await cli(['correct', 'barrels-area.svg', '--values', '18,54', '--rebuild', 'pie', '-o', out]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/repeat or stack/);
    expect(fs.existsSync(out)).toBe(false);
  });
});

describe('tallyglyph correct --rebuild with long labels', () => {
  it('shortens a label past the 120-character chart limit at a grapheme boundary, with an ellipsis, and says so', async () => {
    // Invented: an element id of 150 characters (a layout program's generated name) whose 119th
    // character begins a flag (two regional indicators, one grapheme: Unicode UAX #29), so a cut by
    // code points alone would split it.
    const longId = 'crate-' + 'a'.repeat(112) + '\u{1F1F3}\u{1F1F4}' + 'b'.repeat(30);
    const svg =
      '<svg xmlns="http://www.w3.org/2000/svg" width="100" height="100" viewBox="0 0 100 100">' +
      `<rect id="${longId}" x="10" y="60" width="20" height="30"/><rect id="short" x="50" y="30" width="20" height="60"/></svg>`;
    fs.writeFileSync(path.join(dir, 'long-labels.svg'), svg);
    const r = await cli(['correct', 'long-labels.svg', '--marks', `${longId},short`, '--values', '3,6', '--rebuild', 'repeat', '--unit', '1', '-o', 'long.svg', '--json'], dir);
    expect(r.code, r.err).toBe(0);
    const j = JSON.parse(r.out);
    const label: string = j.document.data[0].label;
    // 120 code points at most (the chart schema counts code points), the flag dropped whole, an ellipsis at the end.
    expect([...label].length).toBeLessThanOrEqual(120);
    expect(label).toBe('crate-' + 'a'.repeat(112) + '…');
    expect(j.document.data[1].label).toBe('short');
    expect(j.warnings.map((w: { message: string }) => w.message).join(' ')).toMatch(/1 label was longer than a chart label may be \(120 characters\) and shortened/);
    expect(verifySvg(fs.readFileSync(path.join(dir, 'long.svg'), 'utf8')).pass).toBe(true);
    const text = await cli(['correct', 'long-labels.svg', '--marks', `${longId},short`, '--values', '3,6', '--rebuild', 'repeat', '--unit', '1', '-o', 'long2.svg'], dir);
    expect(text.out).toMatch(/^Note: 1 label was longer than a chart label may be/m);
  });
});
