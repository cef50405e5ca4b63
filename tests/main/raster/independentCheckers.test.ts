// The helpers other suites lean on must themselves tell good from bad, or their checks cannot fail.
import { describe, expect, it } from 'vitest';
import { Resvg } from '@resvg/resvg-js';
import { hasPngcheck, hasRsvg, hasXmllint, pngcheckPhys, pngcheckRun, rsvgAlphaSum, rsvgRender, xmllintValidateSvg11 } from '../../helpers/independent';
import { SVG_NS as NS } from '../../helpers/svgPage';

describe.skipIf(!hasXmllint)('xmllintValidateSvg11 (W3C SVG 1.1 Second Edition DTD)', () => {
  it('accepts a minimal valid SVG 1.1 file', () => {
    const svg = `<?xml version="1.0" encoding="UTF-8"?>\n<svg ${NS} xmlns:xlink="http://www.w3.org/1999/xlink" version="1.1" width="10mm" height="10mm" viewBox="0 0 10 10"><defs><rect id="r" width="5" height="5"/></defs><use xlink:href="#r"/></svg>`;
    const result = xmllintValidateSvg11(svg);
    expect(result.output).toBe('');
    expect(result.valid).toBe(true);
  });

  it('rejects an unknown element', () => {
    const result = xmllintValidateSvg11(`<svg ${NS} version="1.1" width="10mm" height="10mm"><blob/></svg>`);
    expect(result.valid).toBe(false);
    expect(result.output).toMatch(/No declaration for element blob/);
  });

  it('rejects attributes SVG 1.1 does not have (plain href on <use>, paint-order)', () => {
    // SVG 1.1 links use xlink:href; paint-order arrived with SVG 2.
    expect(xmllintValidateSvg11(`<svg ${NS} version="1.1" width="10" height="10"><rect id="r" width="1" height="1"/><use href="#r"/></svg>`).valid).toBe(false);
    expect(xmllintValidateSvg11(`<svg ${NS} version="1.1" width="10" height="10"><rect paint-order="stroke" width="1" height="1"/></svg>`).valid).toBe(false);
  });

  it('with a DOCTYPE, counts the internal subset (an ATTLIST there declares data-*) and refuses any DTD but SVG 1.1', () => {
    // SVG 1.1 allows extending its DTD in the internal subset (docs/chart-svg.md); xmllint --valid reads it.
    const doctype = (subset: string, id = '-//W3C//DTD SVG 1.1//EN') => `<!DOCTYPE svg PUBLIC "${id}" "http://www.w3.org/Graphics/SVG/1.1/DTD/svg11.dtd"${subset}>`;
    const body = `<svg ${NS} version="1.1" width="10" height="10"><g data-label="a"><rect width="1" height="1"/></g></svg>`;
    const declared = xmllintValidateSvg11(`${doctype(' [<!ATTLIST g data-label CDATA #IMPLIED>]')}\n${body}`);
    expect(declared.output).toBe('');
    expect(declared.valid).toBe(true);
    const undeclared = xmllintValidateSvg11(`${doctype('')}\n${body}`);
    expect(undeclared.valid).toBe(false);
    expect(undeclared.output).toMatch(/No declaration for attribute data-label/);
    expect(xmllintValidateSvg11(`${doctype(' [<!ATTLIST g data-label CDATA #IMPLIED>]', '-//W3C//DTD SVG 1.0//EN')}\n${body}`).valid).toBe(false);
  });
});

describe.skipIf(!hasRsvg)('rsvg-convert helpers', () => {
  it('renders at the asked width with the aspect ratio kept and sums alpha', () => {
    const svg = `<svg ${NS} width="40" height="20"><rect x="10" y="5" width="20" height="10"/></svg>`;
    const raster = rsvgRender(svg, { widthPx: 80 });
    expect([raster.widthPx, raster.heightPx]).toEqual([80, 40]);
    // Scaled by 2: a 20 x 10 rect covers 40 x 20 = 800 px; it sits on whole pixels, so no edge blur.
    expect(rsvgAlphaSum(svg, 80)).toBeCloseTo(800, 6);
  });
});

describe.skipIf(!hasPngcheck)('pngcheck helpers', () => {
  it('reports no pHYs in a plain resvg PNG, and flags a damaged file', () => {
    const png = new Resvg(`<svg ${NS} width="4" height="4"/>`).render().asPng();
    expect(pngcheckPhys(png)).toBeNull();
    expect(pngcheckRun(png).ok).toBe(true);
    const broken = Buffer.from(png);
    broken[broken.length - 1] ^= 0xff;
    expect(pngcheckRun(broken).ok).toBe(false);
    expect(() => pngcheckPhys(broken)).toThrow(/pngcheck rejected/);
  });
});
