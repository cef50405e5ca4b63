// Every reason verification or the gate refuses a chart has its own stable code and its own fix, and the
// sentences show the arithmetic a reader can redo. The lie factor is Tufte's (The Visual Display of
// Quantitative Information, 1983, p. 57): (graphic ratio - 1) / (data ratio - 1) against the reference.
import { describe, expect, it } from 'vitest';
import { effectForm, gate } from '../../../shared-core/integrity/gate';
import { lieFactors } from '../../../shared-core/integrity/lieFactor';
import { verifySvg } from '../../../shared-core/integrity/verifySvg';
import { renderChart } from '../../../shared-core/pipeline';
import { TallyError } from '../../../shared-core/errors';
import type { VerifyReport } from '../../../shared-core/integrity/verifySvg';
import { chartSvg, rect, repeatChart } from './chartSvgFixtures';

const HAND_EDIT = /edited by hand/;
const chart = (data: object[], encoding: object = { mode: 'repeat', glyph: 'bike', unit: 1 }) => ({
  format: 'tallyglyph.chart/1',
  title: 'Findings',
  data,
  encoding,
  page: { width: 180, height: 120, unit: 'mm' },
});

function refusedReport(doc: unknown): VerifyReport {
  try {
    renderChart(doc);
  } catch (e) {
    expect(e).toBeInstanceOf(TallyError);
    return (e as TallyError).details as VerifyReport;
  }
  throw new Error('expected a refusal');
}

describe('findings: one code and one fix per problem', () => {
  it('a category in the page colour is "ink-page-coloured", fixed by a colour, not by re-exporting', () => {
    const report = refusedReport(chart([{ label: 'Soap', value: 3, color: '#ffffff' }, { label: 'Rinse', value: 5 }]));
    const f = report.findings.find((x) => x.code === 'ink-page-coloured');
    expect(f?.category).toBe('Soap');
    expect(f?.severity).toBe('blocking');
    expect(f?.fix).toMatch(/colour that stands out from the page/);
    expect(report.findings.every((x) => !HAND_EDIT.test(x.fix))).toBe(true);
    expect(report.suggestions.join(' ')).not.toMatch(HAND_EDIT);
  });

  it('text drawn across a mark is "painted-over", named as text, fixed by making room', () => {
    const honest = renderChart(chart([{ label: 'Soap', value: 3 }, { label: 'Rinse', value: 5 }])).svg;
    // A source line laid across the marks, as an overflowing layout would draw it.
    const over = honest.replace('</svg>', '<g class="tg-text" data-role="source"><path d="M0 0H400V400H0Z" fill="#222222"/></g></svg>');
    const report = verifySvg(over);
    const f = report.findings.find((x) => x.code === 'painted-over');
    expect(f?.message).toMatch(/\(text \(a title, label or source line\)\)/);
    expect(f?.fix).toMatch(/larger page, a larger unit \(fewer glyphs\) or fewer rows/);
    expect(f?.fix).not.toMatch(HAND_EDIT);
  });

  it('a summary that disagrees with the marks is "summary-mismatch", and only that says the file was edited by hand', () => {
    const honest = repeatChart([{ label: 'A', value: 30 }, { label: 'B', value: 50 }]);
    const svg = honest.replace('data-value="50"', 'data-value="55"');
    expect(svg).not.toBe(honest);
    const report = verifySvg(svg);
    expect(report.pass).toBe(false);
    const codes = report.findings.map((x) => x.code);
    expect(codes).toContain('summary-mismatch');
    for (const f of report.findings) expect(HAND_EDIT.test(f.fix)).toBe(f.code === 'summary-mismatch');
  });

  it('gives each refused pair the code of its own problem, with the row concerned', () => {
    // Reference not drawn (a value of 1 drawn with no ink) against drawn rows.
    const lf = lieFactors([
      { label: 'Mop', data: 1, graphic: 0 },
      { label: 'Dust', data: 2, graphic: 2 },
      { label: 'Sweep', data: 4, graphic: 4 },
    ]);
    const verdict = gate(lf, { mode: 'repeat', reading: 'count' });
    expect(verdict.pass).toBe(false);
    expect(verdict.findings.map((f) => [f.code, f.category])).toEqual([['reference-not-drawn', 'Mop']]);
    expect(verdict.findings[0].fix).toMatch(/smaller than one unit still needs ink/);
    // Advice about one glyph at one size has nothing to do with a missing row.
    expect(verdict.suggestions.join(' ')).not.toMatch(/one glyph at one size/);
  });

  it('a distortion from rounding to whole glyphs is told to cut by ink or use a smaller unit, not to fix sizes or pitch', () => {
    // 3 whole glyphs for 2.04 units against 1 for 1 (Tufte's effect form: (3 - 1) / (2.04 - 1) = 1.92).
    const lf = lieFactors([
      { label: 'Station', data: 1, graphic: 1 },
      { label: 'Lane', data: 2.04, graphic: 3 },
    ]);
    for (const mode of ['repeat', 'stack'] as const) {
      const whole = gate(lf, { mode, reading: 'count', rounding: 'whole' }).suggestions.join(' ');
      expect(whole).toMatch(/partial glyphs cut by ink/);
      expect(whole).toMatch(/smaller unit/);
      expect(whole).not.toMatch(/one glyph at one size|one pitch/);
      // With remainders already cut by ink, rounding cannot explain it: sizes and pitch are the suspects.
      const inkCut = gate(lf, { mode, reading: 'count', rounding: 'ink-cut' }).suggestions.join(' ');
      expect(inkCut).toMatch(/one glyph at one size/);
    }
  });

  it('a distorted pair is "lie-factor", a zero drawn with ink is "zero-drawn"', () => {
    const verdict = gate(
      lieFactors([
        { label: 'A', data: 1, graphic: 1 },
        { label: 'B', data: 3.75, graphic: 3 },
        { label: 'Z', data: 0, graphic: 0.5 },
      ]),
      { mode: 'repeat', reading: 'count' },
    );
    const codes = verdict.findings.map((f) => f.code);
    expect(codes).toEqual(['lie-factor', 'zero-drawn']);
    expect(verdict.findings[0].category).toBe('B');
    expect(verdict.findings[1].category).toBe('Z');
    expect(verdict.findings[1].fix).toMatch(/Draw nothing for a zero value/);
    expect(verdict.findings.every((f) => f.basis?.includes('1983'))).toBe(true);
  });

  it('marks each row drawn or not, so "not drawn" goes on the undrawn row only', () => {
    const report = verifySvg(
      chartSvg({
        reading: 'count',
        mode: 'repeat',
        unit: 1,
        marks: [
          { id: 'mark-1', label: 'A', value: 1, pieces: [] },
          { id: 'mark-2', label: 'B', value: 2, pieces: [{ ring: rect(20, 20, 8, 8), part: 'full' }, { ring: rect(30, 20, 8, 8), part: 'full' }] },
        ],
      }),
    );
    expect(report.marks.map((m) => [m.label, m.drawn])).toEqual([
      ['A', false],
      ['B', true],
    ]);
    expect(report.findings.find((f) => f.code === 'reference-not-drawn')?.category).toBe('A');
  });
});

describe('sentences show the effect form the lie factor comes from (Tufte 1983, p. 57)', () => {
  it('3.00x drawn for 3.75x in the data: (3.00 − 1) / (3.75 − 1) = 0.73, not 3.00 / 3.75 = 0.80', () => {
    const verdict = gate(lieFactors([{ label: 'A', data: 1, graphic: 1 }, { label: 'B', data: 3.75, graphic: 3 }]), { reading: 'count' });
    expect(verdict.reason).toMatch(/drawn with only 3\.00x as many glyphs as A although its value is 3\.75x \(lie factor 0\.73, allowed 0\.95–1\.05\): \(3\.00 − 1\) \/ \(3\.75 − 1\) = 0\.73/);
  });

  it('writes more decimals when two would not give the printed factor', () => {
    // 1.0306 / 1.0290: at two decimals both read 1.03, and (1.03 - 1) / (1.03 - 1) = 1, not the factor 1.0552.
    const text = effectForm(1.0306, 1.029, 0.0306 / 0.029, 0.95, 1.05);
    const m = /^\((\S+) − 1\) \/ \((\S+) − 1\) = (\S+)$/.exec(text);
    expect(m).not.toBeNull();
    const [, g, d, shown] = m as RegExpExecArray;
    expect(((Number(g) - 1) / (Number(d) - 1)).toFixed(shown.split('.')[1].length)).toBe(shown);
  });
});

describe('smallest ink drawn (preflight names it)', () => {
  it('is the smallest partial glyph when one is smaller than a whole glyph, in its own row', () => {
    // A 8 x 8 mm square glyph; "B" ends on a quarter glyph (2 x 8 mm = 16 mm²), the smallest ink on the page.
    const report = verifySvg(repeatChart([{ label: 'A', value: 30 }, { label: 'B', value: 52.5 }]));
    expect(report.pass).toBe(true);
    expect(report.smallestInk?.label).toBe('B');
    expect(report.smallestInk?.part).toBe('partial');
    expect(report.smallestInk?.inkMm2).toBeCloseTo(2 * 8, 6);
    // Whole glyphs tie: the smallest whole glyph is the first row's, not an arbitrary one.
    expect(report.smallestGlyph?.label).toBe('A');
  });
});

describe('ink of a mark: pieces are unioned only where their boxes meet', () => {
  it('counts overlapping pieces once and apart pieces in full (closed-form rectangle areas)', () => {
    const report = verifySvg(
      chartSvg({
        reading: 'area',
        mode: 'scale',
        unit: 1,
        marks: [
          {
            id: 'mark-1',
            label: 'A',
            value: 1,
            // Two 8 x 8 squares overlapping by 4 x 8 (union 12 x 8 = 96 mm²), a third far away (64 mm²).
            pieces: [
              { ring: rect(20, 20, 8, 8), part: 'full' },
              { ring: rect(24, 20, 8, 8), part: 'full' },
              { ring: rect(120, 90, 8, 8), part: 'full' },
            ],
          },
        ],
      }),
    );
    expect(report.marks[0].inkMm2).toBeCloseTo(96 + 64, 9);
    // Outline: 2 x (12 + 8) + 4 x 8 = 72 mm.
    expect(report.marks[0].perimeterMm).toBeCloseTo(72, 9);
    expect(report.marks[0].boxMm).toEqual({ x: 20, y: 20, width: 108, height: 78 });
  });
});
