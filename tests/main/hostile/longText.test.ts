// Hostile corpus, long text: each case once ran past 60 s. Now every one ends in a refusal that names the
// limit and why, or in a chart, within a bounded time (the bounds only prove the input cannot hang).
import fs from 'node:fs';
import path from 'node:path';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { main } from '../../../main/cli/index';
import { TEXT_LIMITS } from '../../../shared-core/document/chartSchema';
import { renderChart } from '../../../shared-core/pipeline';
import { breakLines, measureText } from '../../../shared-core/text';
import { loadFontFace } from '../../../shared-core/text/loadFont';
import { MAX_SHAPING_RUN, shapingRuns } from '../../../shared-core/text/layoutLine';
import { capture } from '../../helpers/cli';
import { chartDoc } from '../../helpers/chartDoc';
import { folderPerTest } from '../../helpers/tempDirs';

const work = folderPerTest('tallyglyph-longtext-');
// Only proves the input cannot hang (these ran past 60 s before); refusals take well under a second.
const BOUND_MS = 5000;
/** Measuring 20,000 characters does real work: a bound that a quadratic shaper (7 s for 6,000 letters) cannot meet. */
const MEASURE_BOUND_MS = 15_000;

async function renderCli(doc: unknown): Promise<{ code: number; err: string; ms: number; wrote: boolean }> {
  const file = path.join(work.dir, 'chart.json');
  fs.writeFileSync(file, JSON.stringify(doc));
  const io = capture(work.dir);
  const t0 = Date.now();
  const code = await main(['render', file, '-o', 'out.svg'], io);
  return { code, err: io.err, ms: Date.now() - t0, wrote: fs.existsSync(path.join(work.dir, 'out.svg')) };
}

describe('text longer than a chart can show is refused with the limit and the reason', () => {
  const cases: [string, Record<string, unknown>, RegExp][] = [
    ['a label of 10,000 characters', { data: [{ label: 'x'.repeat(10_000), value: 30 }, { label: 'B', value: 55 }] }, /data\[0\]\.label: is 10,000 characters long; a label may have at most 120 characters, so it can be read/],
    ['a title of 10,000 emoji (counted as characters, not UTF-16 units)', { title: '\u{1F600}'.repeat(10_000) }, /title: is 10,000 characters long; a title may have at most 200 characters/],
    ['a unitName of 10,000 characters', { encoding: { mode: 'repeat', glyph: 'bike', unit: 10, unitName: 'y'.repeat(10_000) } }, /encoding\.unitName: is 10,000 characters long; the name of what is counted may have at most 60/],
    ['a source line of 10,000 characters', { source: 's '.repeat(5_000) }, /source: is 10,000 characters long; a source line may have at most 300/],
  ];
  for (const [what, over, message] of cases) {
    it(what, async () => {
      const r = await renderCli(chartDoc(over));
      expect(r.code).toBe(2);
      expect(r.err).toMatch(message);
      expect(r.err).toMatch(/every character is drawn as an outline and re-measured/);
      expect(r.wrote).toBe(false);
      expect(r.ms).toBeLessThan(BOUND_MS);
    });
  }

  it('the longest title and source line allowed, in the widest letter, still render and verify', () => {
    // The caps must not refuse what they allow: these two are the longest single lines of text a chart holds.
    const W = (n: number) => 'W'.repeat(n);
    const result = renderChart(chartDoc({ title: W(TEXT_LIMITS.title), source: W(TEXT_LIMITS.source) }));
    expect(result.report.pass).toBe(true);
  });

  it('a sheet title of 10,000 characters is refused with the limit', async () => {
    const input = path.join(work.dir, 'bars.svg');
    fs.writeFileSync(input, '<svg xmlns="http://www.w3.org/2000/svg" width="100mm" height="100mm" viewBox="0 0 100 100"><rect id="a" x="10" y="50" width="10" height="20"/><rect id="b" x="40" y="30" width="10" height="40"/></svg>');
    const io = capture(work.dir);
    const t0 = Date.now();
    const code = await main(['sheet', input, '--values', '1,3', '--title', '\u202e<script>!'.repeat(1_000), '-o', 'sheet.svg'], io);
    expect(code).toBe(2);
    expect(io.err).toMatch(/The sheet title is 10,000 characters long; a title may have at most 200 characters/);
    expect(fs.existsSync(path.join(work.dir, 'sheet.svg'))).toBe(false);
    expect(Date.now() - t0).toBeLessThan(BOUND_MS);
  });
});

describe('shaping and line breaking are linear in the text length', () => {
  it('a 20,000-letter word and 20,000 emoji are measured within bounds (no length cap applies here)', () => {
    for (const text of ['x'.repeat(20_000), '\u{1F600}'.repeat(20_000), 'ffi'.repeat(7_000), 'e\u0301'.repeat(10_000)]) {
      const t0 = Date.now();
      const m = measureText(text, { sizeMm: 3 });
      expect(m.widthMm).toBeGreaterThan(0);
      expect(Date.now() - t0).toBeLessThan(MEASURE_BOUND_MS);
    }
  });

  it('shaping in runs gives exactly the glyphs of shaping the whole text (opentype.js is the reference)', () => {
    const face = loadFontFace(400);
    // Letters that form ligatures (ff, fi, fl, ffi, ffl), combining marks, a joiner, emoji, spaces.
    const alphabet = fc.constantFrom('f', 'i', 'l', 'W', 'A', 'V', 'o', ' ', '\u0301', '\u0308', '\u200d', '\u{1F600}', '\u00e9', '1', '-');
    fc.assert(
      fc.property(fc.array(alphabet, { minLength: MAX_SHAPING_RUN, maxLength: 4 * MAX_SHAPING_RUN }), (chars) => {
        const text = chars.join('');
        let whole: number[];
        try {
          whole = face.font.stringToGlyphs(text).map((g) => g.index);
        } catch {
          // opentype.js cannot run some contextual lookups on some mark sequences; layoutLine then sets
          // letter by letter, and there is no whole-text shaping to compare with.
          fc.pre(false);
          return;
        }
        const runs = shapingRuns(text);
        expect(runs.join('')).toBe(text);
        expect(runs.every((r) => r.length <= MAX_SHAPING_RUN)).toBe(true);
        expect(runs.flatMap((r) => face.font.stringToGlyphs(r).map((g) => g.index))).toEqual(whole);
      }),
      { numRuns: 150, seed: 11 },
    );
  });

  it('breakLines matches greedy wrapping measured line by line with measureText', () => {
    const words = fc.constantFrom('To', 'AV', 'office', 'fly', 'Wave', 'a', 'Tallyglyph', 'y.', 'W', '\u00e9t\u00e9');
    fc.assert(
      fc.property(fc.array(words, { minLength: 1, maxLength: 40 }), fc.double({ min: 5, max: 80, noNaN: true }), (list, maxWidthMm) => {
        const text = list.join(' ');
        const width = (s: string) => measureText(s, { sizeMm: 3 }).widthMm;
        // The greedy rule, with every candidate line measured whole.
        const expected: string[] = [];
        let line = '';
        for (const w of list) {
          const next = line ? `${line} ${w}` : w;
          if (line && width(next) > maxWidthMm) {
            expected.push(line);
            line = w;
          } else line = next;
        }
        expected.push(line);
        expect(breakLines(text, maxWidthMm, { sizeMm: 3 })).toEqual(expected);
      }),
      { numRuns: 200, seed: 7 },
    );
  });
});
