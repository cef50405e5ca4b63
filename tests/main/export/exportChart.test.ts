import fs from 'node:fs';
import path from 'node:path';
import { PNG } from 'pngjs';
import { describe, expect, it } from 'vitest';
import { buildExport, exportChart, formatFromPath } from '../../../main/export/index';
import { DEMO_CHARTS } from '../../../shared-core/demo/demoCharts';
import { verifySvg } from '../../../shared-core/integrity/index';
import { readChartSvg } from '../../../shared-core/svg/index';
import { chartDoc } from '../../helpers/chartDoc';
import { rejected } from '../../helpers/errors';
import { hasPngcheck, hasXmllint, pngcheckPhys, xmllintValidateSvg11 } from '../../helpers/independent';
import { folderPerTest } from '../../helpers/tempDirs';

const tmp = folderPerTest('tallyglyph-export-');

const bikes = DEMO_CHARTS[0].document;

describe('exportChart: SVG', () => {
  it('writes a file that re-verifies from disk and validates as SVG 1.1', async () => {
    const out = path.join(tmp.dir, 'bikes.svg');
    const result = await exportChart(bikes, out);
    const text = fs.readFileSync(out, 'utf8');
    expect(text).toBe(result.svg);
    expect(verifySvg(text).pass).toBe(true);
    expect(readChartSvg(text).summary?.measured?.pass).toBe(true);
    if (hasXmllint) {
      // Validated against the W3C SVG 1.1 DTD named by the file's DOCTYPE together with the internal subset
      // that declares the data-* attributes (xmllint --valid, resolved offline through w3c-sgml-lib's catalog).
      const run = xmllintValidateSvg11(text);
      expect(run.output).toBe('');
      expect(run.valid).toBe(true);
      // The check can fail: an undeclared attribute is reported.
      const bad = text.replace('<g class="tg-marks"', '<g class="tg-marks" data-undeclared="1"');
      expect(xmllintValidateSvg11(bad).output).toMatch(/No declaration for attribute data-undeclared/);
    }
  });

  it('takes the format from the extension and refuses others', () => {
    expect(formatFromPath('a/b.SVG')).toBe('svg');
    expect(formatFromPath('b.png')).toBe('png');
    expect(() => formatFromPath('b.pdf')).toThrow(/name the output file \.svg or \.png/);
  });
});

describe('exportChart: PNG', () => {
  it('records 300 ppi as 11811 pixels per metre (PNG spec, pHYs) at physical size × ppi / 25.4 pixels', async () => {
    const out = path.join(tmp.dir, 'bikes.png');
    const result = await exportChart(bikes, out);
    const png = fs.readFileSync(out);
    // pngjs (an independent decoder) reads the size: 180 x 120 mm at 300 ppi, 1 in = 25.4 mm.
    const decoded = PNG.sync.read(png);
    expect(decoded.width).toBe(Math.round((180 * 300) / 25.4));
    expect(Math.abs(decoded.height - (120 * 300) / 25.4)).toBeLessThanOrEqual(1);
    // 300 / 0.0254 = 11811.02, stored rounded (PNG spec §11.3.5.3, unit 1 = metre).
    if (hasPngcheck) expect(pngcheckPhys(png)).toEqual({ ppmX: 11811, ppmY: 11811, unit: 1 });
    expect(result.raster?.pass).toBe(true);
    expect(Math.abs((result.raster?.lieFactor.worst ?? 1) - 1)).toBeLessThan(0.01);
  });

  it('honours another resolution: 150 ppi is 5906 pixels per metre', async () => {
    const out = path.join(tmp.dir, 'bikes-150.png');
    await exportChart(bikes, out, { ppi: 150 });
    const png = fs.readFileSync(out);
    expect(PNG.sync.read(png).width).toBe(Math.round((180 * 150) / 25.4));
    if (hasPngcheck) expect(pngcheckPhys(png)).toEqual({ ppmX: 5906, ppmY: 5906, unit: 1 });
  });

  it('refuses a raster whose glyphs are too few pixels to keep their area, and writes nothing', async () => {
    const out = path.join(tmp.dir, 'tiny.png');
    const e = await rejected(() => exportChart(bikes, out, { ppi: 12 }));
    expect(e.code).toBe('gate-refused');
    expect(e.message).toMatch(/^The PNG was refused: /);
    expect(e.message).toMatch(/ppi or more/);
    expect(fs.existsSync(out)).toBe(false);
    expect(fs.readdirSync(tmp.dir)).toEqual([]);
  });
});

describe('exportChart: a refusal never touches the disk', () => {
  it('leaves an existing file byte for byte as it was when the gate refuses', async () => {
    const out = path.join(tmp.dir, 'chart.svg');
    fs.writeFileSync(out, 'the good old chart');
    const e = await rejected(() => exportChart(chartDoc({ data: [{ label: 'A', value: 12 }, { label: 'B', value: 27 }], encoding: { mode: 'repeat', glyph: 'bike', unit: 10, rounding: 'whole' } }), out));
    expect(e.code).toBe('gate-refused');
    expect(fs.readFileSync(out, 'utf8')).toBe('the good old chart');
    // No temporary file left behind beside it.
    expect(fs.readdirSync(tmp.dir)).toEqual(['chart.svg']);
  });

  const bad: [string, unknown, string][] = [
    ['a negative value', chartDoc({ data: [{ label: 'A', value: -1 }, { label: 'B', value: 2 }] }), 'document-invalid'],
    ['NaN', chartDoc({ data: [{ label: 'A', value: Number.NaN }, { label: 'B', value: 2 }] }), 'document-invalid'],
    ['Infinity', chartDoc({ data: [{ label: 'A', value: Infinity }, { label: 'B', value: 2 }] }), 'document-invalid'],
    ['empty data', chartDoc({ data: [] }), 'document-invalid'],
    ['10^9 units at one per glyph', chartDoc({ data: [{ label: 'A', value: 1e9 }], encoding: { mode: 'repeat', glyph: 'bike', unit: 1 } }), 'data-invalid'],
    ['an unknown glyph', chartDoc({ encoding: { mode: 'repeat', glyph: 'unicorn-rocket', unit: 10 } }), 'glyph-unknown'],
    ['invalid inline SVG', chartDoc({ encoding: { mode: 'repeat', glyph: { svg: '<svg><path d="M0 0' }, unit: 10 } }), 'svg-malformed'],
    ['an unknown format version', chartDoc({ format: 'tallyglyph.chart/2' }), 'document-version'],
    ['text that is not JSON', '{"format": "tallyglyph.chart/1", ', 'document-invalid'],
  ];
  it.each(bad)('refuses %s with a clear error and writes no file', async (_what, input, code) => {
    for (const name of ['out.svg', 'out.png']) {
      const out = path.join(tmp.dir, name);
      const e = await rejected(() => exportChart(input, out));
      expect(e.code).toBe(code);
      expect(e.message.length).toBeGreaterThan(20);
      expect(fs.existsSync(out)).toBe(false);
    }
    expect(fs.readdirSync(tmp.dir)).toEqual([]);
  });

  it('builds in memory without writing anything', () => {
    const built = buildExport(bikes, { format: 'svg' });
    expect(new TextDecoder().decode(built.bytes)).toBe(built.svg);
    expect(fs.readdirSync(tmp.dir)).toEqual([]);
  });
});
