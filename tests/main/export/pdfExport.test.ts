import fs from 'node:fs';
import path from 'node:path';
import svgpath from 'svgpath';
import { describe, expect, it } from 'vitest';
import { command } from '../../../main/cli/commands/render';
import { pdfFromRender } from '../../../main/export/pdfExport';
import { collectPaint, PT_PER_MM, writePdfPages } from '../../../main/export/pdfFromSvg';
import { grayInkPx, readNetpbm, renderPdfPages } from '../../../main/export/pdfRasterize';
import { verifyPdf } from '../../../main/export/verifyPdf';
import { DEMO_CHARTS } from '../../../shared-core/demo/demoCharts';
import { renderChart } from '../../../shared-core/pipeline/index';
import { chartDoc } from '../../helpers/chartDoc';
import { capture } from '../../helpers/cli';
import { hasPoppler, pdffontsNames, pdfinfoBoxes } from '../../helpers/poppler';
import { folderPerTest } from '../../helpers/tempDirs';

const tmp = folderPerTest('tallyglyph-pdf-');
const FIXED_DATE = new Date('2026-01-15T12:00:00Z');

function page(svgBody: string, widthMm: number, heightMm: number): string {
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${widthMm}mm" height="${heightMm}mm" viewBox="0 0 ${widthMm} ${heightMm}">${svgBody}</svg>`;
}

async function inkMm2(svg: string, ppi = 300): Promise<number> {
  const painted = collectPaint(svg);
  const pdf = await writePdfPages([{ ops: painted.ops, widthMm: painted.widthMm, heightMm: painted.heightMm, originX: 0, originY: 0, unitsPerMm: 1, bleedMm: 0 }]);
  const [drawn] = await renderPdfPages(pdf, { ppi, gray: true });
  return grayInkPx(drawn) * (25.4 / ppi) ** 2;
}

describe('readNetpbm', () => {
  it('reads a binary PGM with a comment in its header (Netpbm pgm(5))', () => {
    const header = new TextEncoder().encode('P5\n# made by hand\n3 2\n255\n');
    const bytes = new Uint8Array([...header, 0, 128, 255, 255, 255, 0]);
    const img = readNetpbm(bytes);
    expect(img).toMatchObject({ widthPx: 3, heightPx: 2, channels: 1 });
    // (255 + 127 + 0 + 0 + 0 + 255) / 255 of ink
    expect(grayInkPx(img)).toBeCloseTo(637 / 255, 10);
  });
});

describe('collectPaint', () => {
  it('refuses text that is not outlined, transforms, opacity and unknown elements rather than dropping them', () => {
    expect(() => collectPaint(page('<text x="1" y="5">Hi</text>', 20, 10))).toThrow(/text that is not converted to outlines/);
    expect(() => collectPaint(page('<g transform="scale(2)"><path d="M0 0H1V1Z"/></g>', 20, 10))).toThrow(/transform/);
    expect(() => collectPaint(page('<path d="M0 0H1V1Z" fill-opacity="0.5"/>', 20, 10))).toThrow(/fill-opacity/);
    expect(() => collectPaint(page('<circle cx="5" cy="5" r="2"/>', 20, 10))).toThrow(/<circle>/);
  });

  it('resolves <use> with x and y and the fill it carries (SVG 1.1, the use element)', () => {
    const p = collectPaint(page('<defs><path id="g" d="M0 0H2V2H0Z"/></defs><g class="tg-mark" id="mark-1"><use xlink:href="#g" xmlns:xlink="http://www.w3.org/1999/xlink" x="3" y="4" fill="#ff0000" data-part="full"/></g>', 20, 10));
    expect(p.ops).toEqual([expect.objectContaining({ d: 'M0 0H2V2H0Z', dx: 3, dy: 4, fill: '#ff0000', markId: 'mark-1', part: 'full' })]);
  });
});

describe.skipIf(!hasPoppler)('PDF geometry through poppler', () => {
  it('a 20 x 10 mm rectangle is 200 mm² of ink in poppler\'s pixels (closed form; 1 mm = 72/25.4 pt)', async () => {
    const ink = await inkMm2(page('<rect x="5" y="5" width="20" height="10" fill="#000000"/>', 40, 30));
    expect(Math.abs(ink / 200 - 1)).toBeLessThan(0.002);
  });

  it('a circle of radius 6 mm drawn with two arcs is 36π mm² of ink (closed form)', async () => {
    const ink = await inkMm2(page('<path d="M4 10A6 6 0 1 0 16 10A6 6 0 1 0 4 10Z" fill="#000000"/>', 20, 20));
    expect(Math.abs(ink / (36 * Math.PI) - 1)).toBeLessThan(0.003);
  });

  it('an even-odd ring keeps its hole: 10² − 6² = 64 mm² (closed form)', async () => {
    const ink = await inkMm2(page('<path fill-rule="evenodd" d="M2 2H12V12H2ZM4 4H10V10H4Z" fill="#000000"/>', 14, 14));
    expect(Math.abs(ink / 64 - 1)).toBeLessThan(0.003);
  });
});

describe.skipIf(!hasPoppler)('chart PDF', () => {
  it('has the page size in mm with bleed, the trim box inset by the bleed, no fonts and an sRGB output intent', async () => {
    const rendered = renderChart(chartDoc({ layout: { bleedMm: 3 } }));
    const built = await pdfFromRender(rendered, { creationDate: FIXED_DATE });
    const info = pdfinfoBoxes(built.bytes);
    // 150 x 100 mm trim plus 3 mm bleed each side = 156 x 106 mm; 1 mm = 72/25.4 pt (CSS Values 4 absolute units).
    expect(info.pages).toBe(1);
    expect(info.mediaBox[2]).toBeCloseTo(156 * PT_PER_MM, 1);
    expect(info.mediaBox[3]).toBeCloseTo(106 * PT_PER_MM, 1);
    expect(info.bleedBox).toEqual(info.mediaBox);
    expect(info.trimBox[0]).toBeCloseTo(3 * PT_PER_MM, 1);
    expect(info.trimBox[2]).toBeCloseTo(153 * PT_PER_MM, 1);
    expect(info.trimBox[3]).toBeCloseTo(103 * PT_PER_MM, 1);
    expect(info.title).toBe('Test chart');
    // Text is outlines: pdffonts lists no font at all.
    expect(pdffontsNames(built.bytes)).toEqual([]);
    const text = Buffer.from(built.bytes).toString('latin1');
    expect(text).toMatch(/\/OutputConditionIdentifier \(sRGB IEC61966-2\.1\)/);
    expect(built.pdfCheck.pass).toBe(true);
  });

  it.each(['repeat-bike-share', 'stack-cafe-cups', 'scale-trees-planted', 'fill-planting-target'])(
    'keeps every mark\'s ink and the lie factor within the gate in poppler\'s pixels: %s',
    async (name) => {
      const demo = DEMO_CHARTS.find((d) => d.name === name);
      const built = await pdfFromRender(renderChart(demo?.document));
      for (const m of built.pdfCheck.marks) if (m.inkRatio !== null) expect(Math.abs(m.inkRatio - 1)).toBeLessThan(0.02);
      // Tufte's lie factor, allowed 0.95–1.05 (The Visual Display of Quantitative Information, p. 57).
      const worst = built.pdfCheck.lieFactor.worst as number;
      expect(worst).toBeGreaterThan(0.95);
      expect(worst).toBeLessThan(1.05);
      expect(built.pdfCheck.page?.differentShare).toBeLessThan(0.005);
    },
    60_000,
  );

  it('refuses a PDF in which one mark was drawn 15% larger in area than the checked SVG', async () => {
    const rendered = renderChart(DEMO_CHARTS.find((d) => d.name === 'scale-trees-planted')?.document);
    const painted = collectPaint(rendered.svg);
    const target = rendered.report.marks[0].id;
    const k = Math.sqrt(1.15);
    const ops = painted.ops.map((op) => (op.markId === target ? { ...op, d: svgpath(op.d).scale(k).toString(), dx: op.dx * k, dy: op.dy * k } : op));
    const tampered = await writePdfPages([{ ops, widthMm: painted.widthMm, heightMm: painted.heightMm, originX: painted.viewBox.x, originY: painted.viewBox.y, unitsPerMm: 1, bleedMm: 0 }]);
    const check = await verifyPdf(tampered, rendered.svg, rendered.report);
    expect(check.pass).toBe(false);
    expect(check.reason).toMatch(/does not look like the checked chart/);
  }, 60_000);

  it('refuses when poppler\'s ink disagrees with the data (one value changed by 20%)', async () => {
    const rendered = renderChart(DEMO_CHARTS.find((d) => d.name === 'scale-trees-planted')?.document);
    const built = await pdfFromRender(rendered);
    const wrong = { ...rendered.report, marks: rendered.report.marks.map((m, i) => (i === 0 ? { ...m, value: m.value * 1.2 } : m)) };
    const check = await verifyPdf(built.bytes, rendered.svg, wrong);
    expect(check.pass).toBe(false);
    expect(check.problems[0]).toMatch(/In the PDF as poppler draws it/);
  }, 60_000);
});

describe.skipIf(!hasPoppler)('tallyglyph render -o chart.pdf', () => {
  it('writes a checked PDF and says its page size and the lie factor from poppler\'s pixels', async () => {
    fs.writeFileSync(path.join(tmp.dir, 'bikes.json'), JSON.stringify(DEMO_CHARTS[0].document));
    const io = capture(tmp.dir);
    const code = await command.run(['bikes.json', '-o', 'bikes.pdf'], io);
    expect(code).toBe(0);
    expect(io.out).toMatch(/^Wrote bikes\.pdf: 4 marks read by count, .* PDF page 180 x 120 mm, lie factor from poppler's pixels at 300 ppi \d\.\d{4}\.\n$/);
    expect(io.err).toMatch(/CMYK conversion is out of scope/);
    const info = pdfinfoBoxes(new Uint8Array(fs.readFileSync(path.join(tmp.dir, 'bikes.pdf'))));
    expect(info.mediaBox[2]).toBeCloseTo(180 * PT_PER_MM, 1);
    expect(info.mediaBox[3]).toBeCloseTo(120 * PT_PER_MM, 1);
  }, 60_000);

  it('refuses a misleading chart and leaves the old PDF untouched', async () => {
    const rounded = chartDoc({ data: [{ label: 'A', value: 12 }, { label: 'B', value: 27 }], encoding: { mode: 'repeat', glyph: 'bike', unit: 10, rounding: 'whole' } });
    fs.writeFileSync(path.join(tmp.dir, 'rounded.json'), JSON.stringify(rounded));
    fs.writeFileSync(path.join(tmp.dir, 'chart.pdf'), 'previous chart');
    const io = capture(tmp.dir);
    expect(await command.run(['rounded.json', '-o', 'chart.pdf'], io)).toBe(1);
    expect(io.err).toMatch(/lie factor/i);
    expect(fs.readFileSync(path.join(tmp.dir, 'chart.pdf'), 'utf8')).toBe('previous chart');
  }, 60_000);
});
