// The limits of a supplied SVG, each refused with a sentence naming it, and the command counter
// behind the path command limit (implicit repeats per SVG 1.1 §8.3.2 count as commands).
import { describe, expect, it } from 'vitest';
import { auditSvg, countPathCommands, importSvg } from '../../../shared-core/audit';
import { TallyError } from '../../../shared-core/errors';

const page = (body: string) => `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 100 100">${body}</svg>`;
const TWO = '<rect x="10" y="50" width="10" height="20"/><rect x="40" y="30" width="10" height="40"/>';

function codeOf(f: () => unknown): string {
  try {
    f();
  } catch (e) {
    if (e instanceof TallyError) return `${e.code}: ${e.message}`;
    throw e;
  }
  return 'no error';
}

describe('countPathCommands', () => {
  it('counts explicit commands and implicit repeats', () => {
    expect(countPathCommands('M0 0 L1 1 L2 2 Z')).toBe(4);
    // "M x y x y" is a moveto then an implicit lineto; "l" with 6 numbers is three linetos.
    expect(countPathCommands('M0 0 5 5 l1 1 2 2 3 3')).toBe(5);
    expect(countPathCommands('M0,0C1,1,2,2,3,3,4,4,5,5,6,6')).toBe(3);
    expect(countPathCommands('M1e2-3.5.5.5H4V-2z')).toBe(5);
  });
});

describe('importSvg limits', () => {
  it('names each limit it refuses at', () => {
    expect(codeOf(() => importSvg(page(TWO), { maxChars: 50 }))).toMatch(/^svg-limit: .*file size limit/);
    expect(codeOf(() => importSvg(page(TWO + '<g/>'.repeat(20)), { maxElements: 10 }))).toMatch(/^svg-limit: .*element count limit/);
    expect(codeOf(() => importSvg(page('<path d="M0 0' + ' L1 1'.repeat(200) + '"/>'), { maxPathCommands: 100 }))).toMatch(/^svg-limit: .*path command limit/);
    expect(codeOf(() => importSvg(page(TWO + '<g>'.repeat(30) + '</g>'.repeat(30)), { maxDepth: 20 }))).toMatch(/^svg-limit: .*depth limit/);
    expect(codeOf(() => importSvg(page('<rect id="r" width="1" height="1"/>' + '<use href="#r"/>'.repeat(50)), { maxShapes: 20 }))).toMatch(/^svg-limit: .*shape count limit/);
  });

  it('stops measuring past the time limit (clock injected: 5 s pass per reading)', () => {
    let t = 0;
    const now = () => (t += 5000);
    expect(codeOf(() => auditSvg(page(TWO), { values: [1, 2], now, limits: { timeLimitMs: 8000 } }))).toMatch(/^time-limit: .*time limit/);
  });

  it('a root that is not <svg>, and an attribute that is not a number, are refused plainly', () => {
    expect(codeOf(() => importSvg('<html/>'))).toMatch(/root element is <html>, not <svg>/);
    expect(codeOf(() => importSvg(page('<rect width="abc" height="1"/>')))).toMatch(/width="abc" is not a number/);
  });
});
