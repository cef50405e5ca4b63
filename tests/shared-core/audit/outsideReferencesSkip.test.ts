// Tags whose attributes cannot reach outside skip the span matching; a reference among thousands of such
// tags, in any attribute the scan reads, must still be found and removed with every other byte kept.
import { describe, expect, it } from 'vitest';
import { findOutsideReferences, stripOutsideReferences } from '../../../shared-core/audit/outsideReferences';

const CLEAN = '<use xlink:href="#glyph-person" x="1.5" y="2" fill="#3a6ea5"/><path d="M0 0L1 0L1 1Z" fill="#123456"/>';

function page(bad: string): string {
  const many = CLEAN.repeat(2000);
  return `<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" xmlns:r="http://www.w3.org/1999/02/22-rdf-syntax-ns#">${many}${bad}${many}</svg>`;
}

describe('outside references among many clean tags', () => {
  // One of each attribute test in the scan: event handler, link, xml:base, editor address (under a bound
  // prefix), CSS url() in a presentation attribute, CSS escape in a style attribute.
  const cases: Array<[string, string, string]> = [
    ['<rect width="1" height="1" onclick="x()"/>', 'event-handler', '<rect width="1" height="1"/>'],
    ['<use xlink:href="http://example.com/a.svg#b"/>', 'link', '<use/>'],
    ['<g xml:base="http://example.com/"/>', 'link', '<g/>'],
    ['<g r:resource="http://example.com/licence"/>', 'metadata-address', '<g/>'],
    ['<rect width="1" height="1" fill="url(http://example.com/p.svg#g)"/>', 'css-url', '<rect width="1" height="1"/>'],
    ['<rect style="fill:red;background:\\75rl(http://example.com/i.png)"/>', 'css-url', '<rect/>'],
  ];
  for (const [bad, kind, cleaned] of cases) {
    it(`finds ${kind} in ${bad}`, () => {
      const svg = page(bad);
      expect(findOutsideReferences(svg).map((r) => r.kind)).toEqual([kind]);
      expect(stripOutsideReferences(svg).svg).toBe(page(cleaned));
    });
  }

  it('finds nothing in the clean tags themselves', () => {
    expect(findOutsideReferences(page(''))).toEqual([]);
  });
});
