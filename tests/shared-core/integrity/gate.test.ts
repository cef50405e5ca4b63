import { describe, expect, it } from 'vitest';
import { DISTORTION_LIMITS, gate, lieFactors } from '../../../shared-core/integrity/index';
import { TallyError } from '../../../shared-core/errors';

const twoCategories = (graphicB: number, dataB = 200) =>
  lieFactors([
    { label: 'Station A', data: 100, graphic: 100 },
    { label: 'Station B', data: dataB, graphic: graphicB },
  ]);

describe('gate thresholds', () => {
  it('uses Tufte\'s limits: above 1.05 or below 0.95 is substantial distortion (1983, p. 57)', () => {
    expect(DISTORTION_LIMITS).toEqual({ low: 0.95, high: 1.05 });
  });

  it('passes a lie factor of exactly 1.05 and exactly 0.95', () => {
    // Data effect +100%; drawn +105% and +95%.
    expect(twoCategories(205).pairs[0].lieFactor).toBeCloseTo(1.05, 12);
    expect(gate(twoCategories(205)).pass).toBe(true);
    expect(twoCategories(195).pairs[0].lieFactor).toBeCloseTo(0.95, 12);
    expect(gate(twoCategories(195)).pass).toBe(true);
  });

  it('refuses just outside, printing enough digits that the factor does not read as allowed', () => {
    const over = gate(twoCategories(205.01));
    expect(over.pass).toBe(false);
    expect(over.reason).toContain('lie factor 1.0501');
    const under = gate(twoCategories(194.99));
    expect(under.pass).toBe(false);
    expect(under.reason).toContain('lie factor 0.9499');
    expect(under.reason).toMatch(/drawn only 1\.95x as large as Station A although its value is 2\.00x/);
  });

  it('honours custom limits and refuses nonsense limits', () => {
    expect(gate(twoCategories(220), { low: 0.8, high: 1.25 }).pass).toBe(true);
    expect(() => gate(twoCategories(200), { low: 1.1, high: 1.2 })).toThrow(TallyError);
    expect(() => gate(twoCategories(200), { low: 0, high: 1.05 })).toThrow(/0 < low/);
    expect(() => gate(twoCategories(200), { low: 0.95, high: Number.NaN })).toThrow(/0 < low/);
  });
});

describe('gate messages', () => {
  it('names the worst pair with both numbers in plain words', () => {
    const report = lieFactors([
      { label: 'Station A', data: 1, graphic: 1 },
      { label: 'Station B', data: 2, graphic: 4 },
    ]);
    const result = gate(report);
    expect(result.pass).toBe(false);
    // Effects: drawn +300% against data +100%, so 3.00.
    expect(result.reason).toBe(
      'Station B is drawn 4.00x as large as Station A but its value is only 2.00x (lie factor 3.00, allowed 0.95–1.05): ' +
        '(4.00 − 1) / (2.00 − 1) = 3.00, the growth drawn over the growth in the data.',
    );
    expect(result.worst?.label).toBe('Station B');
  });

  it('refuses Tufte\'s barrels with lie factor 9.43 (+4,280% against +454%, p. 62)', () => {
    const result = gate(lieFactors([{ label: '1973', data: 1, graphic: 1 }, { label: '1979', data: 5.54, graphic: 43.8 }]));
    expect(result.reason).toMatch(/1979 is drawn 43\.80x as large as 1973 but its value is only 5\.54x \(lie factor 9\.43,/);
  });

  it('words the reading that was measured', () => {
    const report = lieFactors([{ label: 'A', data: 2, graphic: 2 }, { label: 'B', data: 4, graphic: 5 }]);
    expect(gate(report, { reading: 'count' }).reason).toMatch(/^B is drawn with 2\.50x as many glyphs as A but its value is only 2\.00x/);
    expect(gate(report, { reading: 'length' }).reason).toMatch(/^B is drawn 2\.50x as long as A/);
    expect(gate(report, { reading: 'area' }).reason).toMatch(/^B is drawn with 2\.50x the ink area of A/);
  });

  it('equal values drawn differently are refused on the ratio basis', () => {
    const result = gate(lieFactors([{ label: 'A', data: 5, graphic: 5 }, { label: 'B', data: 5, graphic: 6 }]));
    expect(result.pass).toBe(false);
    expect(result.reason).toBe('B has the same value as A but is drawn 1.20x as large as A (lie factor 1.20 on the ratio basis, allowed 0.95–1.05).');
  });

  it('refuses ink on a zero and a value that is not drawn at all', () => {
    const zero = gate(lieFactors([{ label: 'A', data: 1, graphic: 1 }, { label: 'Empty', data: 0, graphic: 0.2 }]));
    expect(zero.pass).toBe(false);
    expect(zero.reason).toMatch(/^Empty has a value of 0 but is drawn with ink/);
    expect(zero.suggestions.join(' ')).toMatch(/Draw nothing for a zero value/);

    const missing = gate(lieFactors([{ label: 'A', data: 1, graphic: 1 }, { label: 'B', data: 3, graphic: 0 }]));
    expect(missing.reason).toMatch(/^B \(value 3\) is not drawn at all/);

    const lonely = gate(lieFactors([{ label: 'Only', data: 3, graphic: 0 }]));
    expect(lonely.pass).toBe(false);
    expect(lonely.reason).toMatch(/^Only \(value 3\) is not drawn at all/);

    const unreferenced = gate(lieFactors([{ label: 'A', data: 1, graphic: 0 }, { label: 'B', data: 2, graphic: 2 }, { label: 'C', data: 3, graphic: 3 }]));
    expect(unreferenced.problems).toEqual(['A (value 1) is not drawn at all, so nothing in the chart can be compared with it.']);
  });

  it('refuses a chart whose categories pass against the reference but not against each other', () => {
    // B and C have equal data; B is drawn 2.05 / 1.95 = 1.051x as large as C per unit of value.
    const report = lieFactors([
      { label: 'A', data: 1, graphic: 1 },
      { label: 'B', data: 2, graphic: 2.05 },
      { label: 'C', data: 2, graphic: 1.95 },
    ]);
    expect(report.pairs.every((p) => (p.lieFactor as number) >= 0.95 - 1e-12 && (p.lieFactor as number) <= 1.05 + 1e-12)).toBe(true);
    const result = gate(report);
    expect(result.pass).toBe(false);
    expect(result.reason).toMatch(/B is drawn 1\.051x as large as C/);
  });

  it('passes a single category and an all-zero chart, with a note that nothing could be compared', () => {
    const single = gate(lieFactors([{ label: 'Only', data: 3, graphic: 9 }]));
    expect(single.pass).toBe(true);
    expect(single.notes[0]).toMatch(/not defined/);
    expect(single.reason).toBeUndefined();
    const zeros = gate(lieFactors([{ label: 'A', data: 0, graphic: 0 }, { label: 'B', data: 0, graphic: 0 }]));
    expect(zeros.pass).toBe(true);
    expect(zeros.notes[0]).toMatch(/Every value is zero/);
  });
});

describe('gate suggestions', () => {
  const skewed = lieFactors([{ label: 'A', data: 1, graphic: 1 }, { label: 'B', data: 2, graphic: 4 }]);

  it('whole-glyph rounding: suggests partial glyphs cut by ink or a smaller unit', () => {
    const s = gate(skewed, { mode: 'repeat', rounding: 'whole', reading: 'count' }).suggestions.join('\n');
    expect(s).toMatch(/partial glyphs cut by ink/);
    expect(s).toMatch(/smaller unit/);
  });

  it('scaled glyphs: suggests area scaling or repeat/stack', () => {
    const s = gate(skewed, { mode: 'scale', reading: 'area' }).suggestions.join('\n');
    expect(s).toMatch(/by ink area/);
    expect(s).toMatch(/repeat.*stack/);
  });

  it('scaled glyphs read by height: suggests repeat or stack', () => {
    const s = gate(skewed, { mode: 'scale', reading: 'length' }).suggestions.join('\n');
    expect(s).toMatch(/read by height/);
    expect(s).toMatch(/"repeat" or "stack"/);
  });

  it('fill: suggests filling by share of ink, and gives no suggestions on a pass', () => {
    expect(gate(skewed, { mode: 'fill', reading: 'fill' }).suggestions.join('\n')).toMatch(/share of ink/);
    expect(gate(twoCategories(200), { mode: 'fill' }).suggestions).toEqual([]);
  });
});
