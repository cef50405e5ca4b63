// Page background: an optional colour (or "none") in the document, painted opaque to the bleed edge, and read by
// verification as the paper colour. Checked with an independent renderer (Debian's rsvg-convert).
import { describe, expect, it } from 'vitest';
import { chartToDocument, parseChart } from '../../../shared-core/document';
import { renderChart } from '../../../shared-core/pipeline/renderChart';
import { chartDoc } from '../../helpers/chartDoc';
import { caught } from '../../helpers/errors';
import { hasRsvg, rsvgRender } from '../../helpers/independent';

describe('page background', () => {
  const withBackground = (background: string, extra: Record<string, unknown> = {}) => chartDoc({ layout: { background, bleedMm: 3, ...extra } });

  it('is absent by default, so older documents keep a transparent page', () => {
    const result = renderChart(chartDoc());
    expect(result.svg).not.toContain('tg-background');
    expect(parseChart(chartDoc()).layout.background).toBeUndefined();
    expect(parseChart(chartDoc({ layout: { background: 'none' } })).layout.background).toBeUndefined();
  });

  it('paints the colour to the bleed edge, so preflight no longer says the bleed is unused, and survives a save', () => {
    const result = renderChart(withBackground('#fdf6e3'));
    expect(result.report.pass).toBe(true);
    expect(result.svg).toMatch(/<rect class="tg-background" x="-3" y="-3" width="156" height="106" fill="#fdf6e3"\/>/);
    expect(result.report.preflight.map((f) => f.code)).not.toContain('bleed-unused');
    expect(chartToDocument(result.spec).layout?.background).toBe('#fdf6e3');
  });

  it.skipIf(!hasRsvg)('makes every pixel of the page opaque in an independent renderer (rsvg-convert), corners included', () => {
    const { svg } = renderChart(withBackground('#fdf6e3'));
    const { widthPx, heightPx, rgba } = rsvgRender(svg, { widthPx: 312 });
    for (const [x, y] of [[0, 0], [widthPx - 1, 0], [0, heightPx - 1], [widthPx - 1, heightPx - 1]]) {
      const i = (y * widthPx + x) * 4;
      expect([...rgba.slice(i, i + 4)]).toEqual([0xfd, 0xf6, 0xe3, 255]);
    }
  });

  it('refuses a category painted in the background colour (verification reads the background as the paper)', () => {
    const e = caught(() => renderChart(chartDoc({ layout: { background: '#336699' }, data: [{ label: 'Alder Street', value: 30, color: '#336699' }, { label: 'Birch Road', value: 55 }] })));
    expect(e.code).toBe('gate-refused');
    expect(e.message).toMatch(/colour of the page/);
  });

  it('refuses a background that is not a colour, naming the field', () => {
    const e = caught(() => parseChart(chartDoc({ layout: { background: 'beige' } })));
    expect(e.message).toMatch(/^layout\.background: expected .*CSS hex colour/);
  });

  it('warns when the background leaves body text under 4.5:1 (WCAG 2.1 contrast minimum)', () => {
    const result = renderChart(withBackground('#333333'));
    expect(result.warnings.map((w) => w.code)).toContain('background-contrast');
  });
});
