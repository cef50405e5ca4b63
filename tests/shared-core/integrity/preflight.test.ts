import { describe, expect, it } from 'vitest';
import { preflight, type PreflightInput } from '../../../shared-core/integrity/index';
import { TallyError } from '../../../shared-core/errors';

// Thresholds are printers' guidance, not standards (see the print-practice notes):
// minimum line weight about 0.25 pt, minimum text about 6 pt, bleed commonly 3 mm.
// A4 is 210 x 297 mm (ISO 216, from memory).
function a4(overrides: Partial<PreflightInput> = {}): PreflightInput {
  return {
    page: { widthMm: 210, heightMm: 297 },
    bleedMm: 0,
    safeMarginMm: 5,
    strokes: [{ widthPt: 0.5, owner: 'frame' }],
    texts: [{ sizePt: 9, owner: 'labels' }],
    contentBoxMm: { x: 10, y: 10, width: 190, height: 277 },
    backgroundCoversBleed: false,
    ...overrides,
  };
}

describe('preflight', () => {
  it('finds nothing on a clean page', () => {
    expect(preflight(a4())).toEqual([]);
  });

  it('warns about lines thinner than 0.25 pt, one finding per owner, and not at 0.25 pt itself', () => {
    const findings = preflight(
      a4({
        strokes: [
          { widthPt: 0.25, owner: 'frame' },
          { widthPt: 0.2, owner: 'bike outline' },
          { widthPt: 0.1, owner: 'bike outline' },
          { widthPt: 0.24, owner: 'legend rule' },
        ],
      }),
    );
    expect(findings.map((f) => [f.code, f.owner])).toEqual([
      ['stroke-thin', 'bike outline'],
      ['stroke-thin', 'legend rule'],
    ]);
    expect(findings[0].message).toMatch(/2 lines as thin as 0\.1 pt/);
  });

  it('does not count a zero-width stroke as a hairline (SVG 2: a zero stroke-width paints no stroke)', () => {
    expect(preflight(a4({ strokes: [{ widthPt: 0, owner: 'frame' }] }))).toEqual([]);
  });

  it('warns about text under 6 pt, not at 6 pt', () => {
    const findings = preflight(a4({ texts: [{ sizePt: 6, owner: 'title' }, { sizePt: 5.5, owner: 'value labels' }] }));
    expect(findings).toHaveLength(1);
    expect(findings[0]).toMatchObject({ code: 'text-small', owner: 'value labels', severity: 'warning', basis: 'common practice' });
    expect(findings[0].message).toMatch(/5\.5 pt/);
  });

  it('warns about content beyond the page, and does not repeat it as a safe-area finding', () => {
    const findings = preflight(a4({ contentBoxMm: { x: -1, y: 10, width: 100, height: 100 } }));
    expect(findings.map((f) => f.code)).toEqual(['content-outside-page']);
    const right = preflight(a4({ contentBoxMm: { x: 150, y: 10, width: 60.5, height: 100 } }));
    expect(right.map((f) => f.code)).toEqual(['content-outside-page']);
  });

  it('warns about content inside the page but within the safe margin of the trim', () => {
    const findings = preflight(a4({ safeMarginMm: 3, contentBoxMm: { x: 2, y: 10, width: 100, height: 100 } }));
    expect(findings.map((f) => f.code)).toEqual(['content-outside-safe-area']);
    // Exactly on the safe line is inside.
    expect(preflight(a4({ safeMarginMm: 3, contentBoxMm: { x: 3, y: 3, width: 204, height: 291 } }))).toEqual([]);
  });

  it('warns when a 3 mm bleed is asked for but nothing reaches into it', () => {
    const unused = preflight(a4({ bleedMm: 3 }));
    expect(unused.map((f) => f.code)).toEqual(['bleed-unused']);
    expect(unused[0].message).toMatch(/3 mm bleed/);
    expect(preflight(a4({ bleedMm: 3, backgroundCoversBleed: true }))).toEqual([]);
    expect(preflight(a4({ bleedMm: 0, backgroundCoversBleed: false }))).toEqual([]);
  });

  it('labels every finding as a common-practice warning', () => {
    const findings = preflight(
      a4({
        bleedMm: 3.175,
        strokes: [{ widthPt: 0.1, owner: 'a' }],
        texts: [{ sizePt: 4, owner: 'b' }],
        contentBoxMm: { x: 1, y: 1, width: 10, height: 10 },
      }),
    );
    expect(findings).toHaveLength(4);
    for (const f of findings) {
      expect(f.severity).toBe('warning');
      expect(f.basis).toBe('common practice');
      expect(f.message.length).toBeGreaterThan(20);
    }
  });

  it('refuses non-finite or impossible input', () => {
    expect(() => preflight(a4({ page: { widthMm: Number.NaN, heightMm: 297 } }))).toThrow(TallyError);
    expect(() => preflight(a4({ page: { widthMm: 0, heightMm: 297 } }))).toThrow(/positive size/);
    expect(() => preflight(a4({ strokes: [{ widthPt: Infinity, owner: 'x' }] }))).toThrow(/finite/);
    expect(() => preflight(a4({ bleedMm: -3 }))).toThrow(/negative/);
  });
});
