// A designer's own SVG glyph: cleaned, measured by ink, its geometry warnings stated, carried in the
// chart document by name and resolved by the layout like a bundled glyph.
import { describe, expect, it } from 'vitest';
import { parseChart } from '../../../shared-core/document';
import { importOwnGlyph, ownGlyphName } from '../../../shared-core/glyph/importOwnGlyph';
import { verifySvg } from '../../../shared-core/integrity';
import { renderChart } from '../../../shared-core/pipeline';
import { caught } from '../../helpers/errors';

const codes = (w: { code: string }[]) => w.map((x) => x.code);

describe('importOwnGlyph', () => {
  it('measures a plain square and a circle by ink (closed form: side², and π/4 of the box)', () => {
    const square = importOwnGlyph('<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 20 20"><rect x="5" y="5" width="10" height="10"/></svg>');
    expect(square.inkAreaUnits2).toBeCloseTo(100, 6);
    expect(square.boxFraction).toBeCloseTo(1, 6);
    expect(square.viewBox).toEqual({ x: 0, y: 0, width: 20, height: 20 });
    expect(square.warnings).toEqual([]);
    // Area of a disc πr² over its bounding square (2r)²: π/4 (flattening error well under 1e-4 here).
    const disc = importOwnGlyph('<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"><circle cx="5" cy="5" r="5"/></svg>');
    expect(Math.abs(disc.boxFraction - Math.PI / 4)).toBeLessThan(1e-4);
  });

  it('removes scripts, handlers and outside references, and says so', () => {
    const g = importOwnGlyph(
      '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10" onload="alert(1)"><script>alert(2)</script><rect width="10" height="10" onclick="x()"/><image href="https://example.com/x.png" width="1" height="1"/></svg>',
    );
    expect(g.svg).not.toMatch(/script|onload|onclick|example\.com/);
    expect(g.warnings.map((w) => w.message).join(' ')).toMatch(/leaves out 1 <script> elements/);
    expect(g.inkAreaUnits2).toBeCloseTo(100, 6);
  });

  it('warns of strokes turned into ink, open filled paths, and ink outside the box (which is widened)', () => {
    const g = importOwnGlyph(
      '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"><path d="M0 0 L10 0 L10 10" fill="#000"/><path d="M2 12 L8 12" stroke="#000" stroke-width="2" fill="none"/></svg>',
    );
    expect(codes(g.warnings)).toEqual(expect.arrayContaining(['strokes-converted', 'open-path', 'ink-outside-box']));
    // The stroke (width 2, butt caps) reaches y = 13: the box grows to hold it.
    expect(g.viewBox.y + g.viewBox.height).toBeCloseTo(13, 6);
    // Closed-form ink: the open triangle closes to half of 10 × 10 (50) plus the 6 × 2 stroke (12).
    expect(g.inkAreaUnits2).toBeCloseTo(62, 4);
  });

  it('refuses a file that paints nothing, and one that is not SVG', () => {
    expect(caught(() => importOwnGlyph('<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"><rect width="10" height="10" fill="none"/></svg>')).code).toBe('glyph-empty');
    expect(caught(() => importOwnGlyph('<html><body/></html>')).code).toBe('svg-malformed');
  });

  it('names glyphs from their file names, never twice the same', () => {
    expect(ownGlyphName('Studio Cup.svg')).toBe('own:studio-cup');
    expect(ownGlyphName('Studio Cup.svg', ['own:studio-cup'])).toBe('own:studio-cup-2');
    expect(ownGlyphName('★.svg')).toBe('own:glyph');
  });
});

describe('own glyphs in the chart document', () => {
  const cup = importOwnGlyph('<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 20 20"><path d="M3 4h12v8a6 6 0 0 1-12 0z"/><path d="M15 6h2a3 3 0 0 1 0 6h-2" fill="none" stroke="#000" stroke-width="1.5"/></svg>');
  const doc = {
    format: 'tallyglyph.chart/1',
    title: 'Cups poured per stall (invented)',
    data: [
      { label: 'North stall', value: 7.5 },
      { label: 'South stall', value: 12 },
    ],
    encoding: { mode: 'repeat', unit: 1, glyph: 'own:cup' },
    page: { width: 180, height: 120, unit: 'mm' },
    glyphs: { 'own:cup': { svg: cup.svg, from: 'cup.svg' } },
  };

  it('round-trips through parseChart, and documents without the field still parse', () => {
    expect(parseChart(doc).glyphs).toEqual({ 'own:cup': { svg: cup.svg, from: 'cup.svg' } });
    const { glyphs: _g, ...older } = doc;
    expect(parseChart({ ...older, encoding: { ...doc.encoding, glyph: 'bike' } }).glyphs).toBeUndefined();
  });

  it('refuses bad own-glyph names and a reference to a glyph the document does not hold', () => {
    expect(caught(() => parseChart({ ...doc, glyphs: { cup: { svg: cup.svg } } })).message).toMatch(/own:studio-cup/);
    expect(caught(() => renderChart({ ...doc, encoding: { ...doc.encoding, glyph: 'own:saucer' } })).message).toMatch(/encoding\.glyph/);
  });

  it('lays out, writes and verifies a chart of the own glyph from the written file alone', () => {
    const result = renderChart(doc);
    const report = verifySvg(result.svg);
    expect(report.pass).toBe(true);
    // 12 / 7.5 = 1.6: ink-true partial glyphs keep the drawn ink in the data's ratio (Tufte, lie factor 1).
    expect(report.lieFactor.worst).toBeGreaterThan(0.999);
    expect(report.lieFactor.worst).toBeLessThan(1.001);
  });
});
