// The sheet's frame: marks named by their label or value (never an element id), drawings filling their
// frames, and nothing of a corrected drawing cut off by its panel.
import { describe, expect, it } from 'vitest';
import { buildSheet, correctSvg } from '../../../shared-core/audit';
import { PANEL_MM, dataLine } from '../../../shared-core/audit/sheetFrame';

function sheetOf(svg: string, values: number[]) {
  const fixed = correctSvg(svg, { values });
  return { fixed, sheet: buildSheet({ supplied: svg, corrected: fixed.svg, before: fixed.before, after: fixed.after, reading: fixed.reading }) };
}

function viewBoxOf(sheet: string, id: string): number[] {
  const m = new RegExp(`<svg id="${id}"[^>]* viewBox="([^"]+)"`).exec(sheet);
  return (m?.[1] ?? '').split(' ').map(Number);
}

// Invented: two parcels, the second labelled in the file, the first only by its element id.
const PARCELS = (label: string) =>
  '<svg xmlns="http://www.w3.org/2000/svg" width="200" height="100" viewBox="0 0 200 100">' +
  '<rect id="rect-4471" x="20" y="60" width="20" height="20"/>' +
  `<rect id="rect-4472" ${label} x="120" y="40" width="40" height="40"/></svg>`;

describe('the sheet frame', () => {
  it('names marks by their label where the file has one, else by value alone, never by element id', () => {
    const { fixed } = sheetOf(PARCELS('data-label="Harbour depot"'), [2, 8]);
    expect(dataLine(fixed.before)).toBe('Data: 2, Harbour depot 8');
    expect(dataLine(fixed.before)).not.toMatch(/rect-447/);
  });

  it('shortens a long data-label at a grapheme boundary (no lone surrogate from a split emoji; Unicode UAX #29)', () => {
    const { fixed } = sheetOf(PARCELS(`data-label="${'a'.repeat(79)}\u{1F4E6} depot"`), [2, 8]);
    const label = fixed.before.marks[1].label;
    expect(label).toBe('a'.repeat(79) + '…');
    expect(/[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/.test(label)).toBe(false);
  });

  it('fits each drawing to fill its frame (its longer side spans the panel) with the frame drawn tight around it', () => {
    const { sheet } = sheetOf(PARCELS(''), [2, 8]);
    for (const box of [sheet.panels.supplied, sheet.panels.corrected]) {
      // 200 x 100 units: the width spans the 120 mm panel, the height half of it.
      expect(box.width).toBeCloseTo(PANEL_MM, 9);
      expect(box.height).toBeCloseTo(PANEL_MM / 2, 9);
      expect(sheet.svg).toContain(`<rect x="${box.x}" y="${box.y}" width="${box.width}" height="${box.height}" fill="none"`);
    }
    // The page is no taller than the drawings and their captions need: no empty square above the captions.
    expect(sheet.heightMm).toBeLessThan(2 * 12 + PANEL_MM / 2 + 40);
  });

  it('widens both panels alike when the correction grows a mark past the page, so no mark is cut off', () => {
    // The larger value keeps its 40-unit square; half its value needs half its area, a square of 28.3 units,
    // so the 10-unit square at the right edge grows about its bottom centre (x 90) past the page edge at 100.
    const svg = '<svg xmlns="http://www.w3.org/2000/svg" width="100" height="100" viewBox="0 0 100 100"><rect id="a" x="10" y="50" width="40" height="40"/><rect id="b" x="85" y="80" width="10" height="10"/></svg>';
    const { fixed, sheet } = sheetOf(svg, [8, 4]);
    const grown = fixed.after.marks[1];
    expect(grown.xUnits + grown.widthUnits).toBeGreaterThan(100);
    const [x, , w] = viewBoxOf(sheet.svg, 'corrected-panel');
    expect(x + w).toBeGreaterThanOrEqual(grown.xUnits + grown.widthUnits - 1e-9);
    // One scale for both panels, so the change of size shows truly side by side.
    expect(viewBoxOf(sheet.svg, 'supplied-panel')).toEqual(viewBoxOf(sheet.svg, 'corrected-panel'));
  });
});
