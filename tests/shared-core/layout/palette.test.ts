// The category palette and colour handling, against the WCAG 2.1 contrast formula and CSS compositing.
import { describe, expect, it } from 'vitest';
import { categoryColor, mixWithWhite, opaqueColor, PALETTE } from '../../../shared-core/layout';
import type { Warning } from '../../../shared-core/errors';

/** WCAG 2.1 relative luminance of an sRGB colour (definition "relative luminance", 0.03928 threshold as published). */
function luminance(hex: string): number {
  const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255).map((c) => (c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4));
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

/** WCAG 2.1 contrast ratio (L1 + 0.05) / (L2 + 0.05). */
function contrast(a: string, b: string): number {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x);
  return (hi + 0.05) / (lo + 0.05);
}

describe('PALETTE', () => {
  it('has nine distinct opaque colours', () => {
    expect(new Set(PALETTE).size).toBe(9);
    for (const c of PALETTE) expect(c).toMatch(/^#[0-9a-f]{6}$/);
  });

  it('holds exactly the nine category colours of Paul Tol\'s muted scheme', () => {
    // Paul Tol, tol_colors.py (2019, BSD-3-Clause), tol_cset('muted'), in his order: rose, indigo, sand, green,
    // cyan, wine, teal, olive, purple; its tenth colour, pale grey #DDDDDD, marks missing data and is left out.
    const tolMuted = ['#CC6677', '#332288', '#DDCC77', '#117733', '#88CCEE', '#882255', '#44AA99', '#999933', '#AA4499'];
    expect([...PALETTE].sort()).toEqual(tolMuted.map((c) => c.toLowerCase()).sort());
  });

  it('keeps the first six colours at least 3:1 against white paper (WCAG 2.1, 1.4.11 non-text contrast)', () => {
    // The scheme's cyan and sand are light (about 1.7:1); they come last so charts of up to six categories meet 3:1.
    for (const c of PALETTE.slice(0, 6)) expect(contrast(c, '#ffffff')).toBeGreaterThanOrEqual(3);
  });

  it('uses a row colour first, then the document list, then the palette, cycling', () => {
    expect(categoryColor(0, '#123456', ['#abcdef'])).toBe('#123456');
    expect(categoryColor(3, undefined, ['#000001', '#000002'])).toBe('#000002');
    expect(categoryColor(10, undefined, undefined)).toBe(PALETTE[1]);
  });
});

describe('opaqueColor', () => {
  it('expands #rgb and keeps opaque colours', () => {
    expect(opaqueColor('#1A2')).toBe('#11aa22');
    expect(opaqueColor('#1f77b4ff')).toBe('#1f77b4');
  });

  it('flattens transparency onto white as source-over compositing does (c·a + 1·(1 − a)) and warns', () => {
    // Compositing and Blending Level 1, source-over with an opaque white backdrop: co = cs·αs + cb·(1 − αs).
    const warnings: Warning[] = [];
    const out = opaqueColor('#00000080', warnings, '"A"');
    const a = 0x80 / 255;
    const expected = Math.round(255 * (1 - a));
    expect(out).toBe('#' + expected.toString(16).padStart(2, '0').repeat(3));
    expect(warnings.map((w) => w.code)).toEqual(['color-transparent']);
  });

  it('mixes towards white for the unfilled remainder', () => {
    expect(mixWithWhite('#000000', 0.75)).toBe('#bfbfbf'); // 0.75 × 255 = 191.25
    expect(mixWithWhite('#ff0000', 0)).toBe('#ff0000');
  });
});
