// Bad glyph input: every case ends in a clear error or warning, quickly, never a hang or a crash.
import { describe, expect, it } from 'vitest';
import { TallyError } from '../../../shared-core/errors';
import { measureGlyph } from '../../../shared-core/glyph';

const svg = (body: string) => `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 100 100">${body}</svg>`;

function expectProblem(markup: string, code: string, text: RegExp) {
  const t0 = Date.now();
  let err: unknown;
  try {
    measureGlyph(markup);
  } catch (e) {
    err = e;
  }
  expect(err, 'should have thrown').toBeInstanceOf(TallyError);
  expect((err as TallyError).code).toBe(code);
  expect((err as TallyError).message).toMatch(text);
  return Date.now() - t0;
}

describe('measureGlyph on bad input', () => {
  it('malformed path data is a clear error', () => {
    expectProblem(svg('<path d="M 0 0 L 10 x"/>'), 'path-malformed', /path data cannot be read/);
    expectProblem(svg('<path d="L 10 10"/>'), 'path-malformed', /start with/);
    expectProblem(svg('<path d="M0 0 A 5 5 0 2 1 10 10"/>'), 'path-malformed', /arc flag/);
  });
  it('NaN and Infinity coordinates are refused, not drawn', () => {
    expectProblem(svg('<circle cx="10" cy="10" r="NaN"/>'), 'number-invalid', /not a finite number/);
    expectProblem(svg('<rect width="Infinity" height="10"/>'), 'number-invalid', /not a finite number/);
    expectProblem(svg('<rect width="1e999" height="10"/>'), 'number-invalid', /not a finite number/);
    expectProblem(svg('<path d="M0 0 L1e999 0 L0 10Z"/>'), 'number-invalid', /not a finite number/);
    expectProblem(svg('<polygon points="0,0 10,NaN 0,10"/>'), 'number-invalid', /not a finite number/);
    expectProblem(svg('<rect width="10" height="10" transform="scale(NaN)"/>'), 'number-invalid', /not finite/);
  });
  it('an empty glyph measures zero and warns that it cannot stand for a quantity', () => {
    for (const body of ['', '<g/>', '<rect width="0" height="10"/>', '<path d="M0 0"/>', '<rect width="10" height="10" fill="none"/>']) {
      const g = measureGlyph(svg(body));
      expect(g.areaUnits2).toBe(0);
      expect(g.warnings.map((w) => w.code)).toContain('empty-glyph');
    }
  });
  it('a glyph of millions of commands is refused by the command limit, quickly', () => {
    const d = 'M0 0' + 'L1 1L2 0'.repeat(1_000_000);
    const ms = expectProblem(svg(`<path d="${d}"/>`), 'geometry-limit', /limit/);
    // A bound against hanging, not a speed goal: reading 16 MB of path data takes 2-5 s on a busy 2-core
    // machine, while measuring the 2 million segments instead of refusing them would take minutes.
    expect(ms).toBeLessThan(20_000);
  });
  it('self-intersecting junk is refused by the crossing guard before the union can stall', () => {
    let seed = 7;
    const rnd = () => ((seed = (seed * 16807) % 2147483647) / 2147483647) * 100;
    let d = `M${rnd()} ${rnd()}`;
    for (let i = 0; i < 20_000; i++) d += `L${rnd().toFixed(2)} ${rnd().toFixed(2)}`;
    const ms = expectProblem(svg(`<path d="${d}"/>`), 'geometry-limit', /crosses itself/);
    expect(ms).toBeLessThan(5000);
  });
  it('small self-intersecting shapes are measured by the nonzero rule (a pentagram has a filled centre)', () => {
    // Pentagram on a unit circle: nonzero fills the centre pentagon; evenodd leaves it empty (SVG 1.1 §11.3).
    const pts = [0, 2, 4, 1, 3].map((k) => [50 + 40 * Math.sin((2 * Math.PI * k) / 5), 50 - 40 * Math.cos((2 * Math.PI * k) / 5)]);
    const points = pts.map((p) => p.join(',')).join(' ');
    const nonzero = measureGlyph(svg(`<polygon points="${points}"/>`)).areaUnits2;
    const evenodd = measureGlyph(svg(`<polygon points="${points}" fill-rule="evenodd"/>`)).areaUnits2;
    // Pentagon inside a pentagram of circumradius R has circumradius R·(3 − √5)/2 ... its area is the difference.
    const r = 40 * (3 - Math.sqrt(5)) / 2;
    const innerPentagon = (5 / 2) * r * r * Math.sin((2 * Math.PI) / 5);
    expect(nonzero - evenodd).toBeCloseTo(innerPentagon, 3);
  });
  it('not SVG, not XML, entities and unsupported content give clear messages', () => {
    expectProblem('<html/>', 'svg-malformed', /root element/);
    expectProblem('<svg><path d="M0 0"', 'svg-malformed', /not well-formed/);
    expectProblem('<!DOCTYPE svg [<!ENTITY x "boom">]><svg>&x;</svg>', 'svg-malformed', /entities/);
    const g = measureGlyph(svg('<rect width="10" height="10"/><text x="0" y="50">7</text><image href="x.png" width="5" height="5"/>'));
    expect(g.areaUnits2).toBeCloseTo(100, 6);
    expect(g.warnings.map((w) => w.code)).toEqual(expect.arrayContaining(['unsupported-text', 'unsupported-image']));
  });
  it('gradients, clip paths and partial opacity warn that the number may differ from what shows', () => {
    const g = measureGlyph(svg('<rect width="10" height="10" fill="url(#g)" clip-path="url(#c)" opacity="0.5"/>'));
    expect(g.warnings.map((w) => w.code)).toEqual(expect.arrayContaining(['paint-server', 'unsupported-clip-path', 'partial-opacity']));
  });
  it('a use cycle is refused', () => {
    expectProblem(svg('<g id="a"><use href="#a"/></g>'), 'svg-limit', /cycle/);
  });
});
