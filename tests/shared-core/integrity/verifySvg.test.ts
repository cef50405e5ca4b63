import { describe, expect, it } from 'vitest';
import { DISTORTION_LIMITS, verifySvg } from '../../../shared-core/integrity/index';
import { textOutline } from '../../../shared-core/text/index';
import {
  chartSvg,
  fillChart,
  polygon,
  rect,
  repeatChart,
  ringArea,
  ringPath,
  scaleChart,
  stackChart,
  triangleRepeatChart,
  type HandMark,
} from './chartSvgFixtures';
import { caught } from '../../helpers/errors';

/** Tufte's lie factor, computed here from its definition (1983, p. 57): effect shown / effect in data, effect = (b − a) / a. */
const tufte = (graphicA: number, graphicB: number, dataA: number, dataB: number) => (graphicB - graphicA) / graphicA / ((dataB - dataA) / dataA);

const STATIONS = [
  { label: 'Station A', value: 120 },
  { label: 'Station B', value: 275 },
  { label: 'Station C', value: 60 },
];

describe('verifySvg: Tufte\'s 0.95–1.05 band drives the verdict (The Visual Display of Quantitative Information, 1983, p. 57)', () => {
  const values = [
    { label: 'North', value: 10 },
    { label: 'South', value: 20 },
    { label: 'East', value: 40 },
  ];

  it('passes glyphs scaled by area (ink ∝ value) with lie factors of 1', () => {
    const report = verifySvg(scaleChart(values, 'area'));
    expect(report.pass).toBe(true);
    expect(report.reading).toBe('area');
    expect(report.lieFactor.worst).toBeCloseTo(1, 6);
    // The area of each regular 256-gon, from its closed form (n/2) r² sin(2π/n), is 2 mm² per unit of value by construction.
    for (const m of report.marks) expect(m.graphic / (2 * m.value)).toBeCloseTo(1, 6);
  });

  it('refuses the classic distortion: glyph height scaled by the value, so the area grows with its square', () => {
    const report = verifySvg(scaleChart(values, 'height'));
    expect(report.pass).toBe(false);
    // Areas go as v², so by Tufte's formula the lie factor is ((v/v0)² − 1) / (v/v0 − 1) = v/v0 + 1: 5 for East.
    expect(report.lieFactor.worst).toBeCloseTo(tufte(1, 16, 10, 40), 4);
    expect(report.lieFactor.worst).toBeCloseTo(5, 4);
    expect(report.lieFactor.worstPair).toEqual({ label: 'East', reference: 'North' });
    expect(report.reason).toMatch(/East is drawn with 16\.00x the ink area of North but its value is only 4\.00x \(lie factor 5\.00/);
    expect(report.suggestions.join(' ')).toMatch(/by ink area/);
  });

  /** Two squares, values 1 and 2, the second drawn with `areaB` mm² against 100 mm². */
  const twoSquares = (areaB: number) =>
    chartSvg({
      reading: 'area',
      mode: 'scale',
      unit: 0.01,
      summary: { unit: 0.01 },
      marks: [
        { id: 'mark-1', label: 'One', value: 1, pieces: [{ ring: rect(20, 20, 10, 10), part: 'full' }] },
        { id: 'mark-2', label: 'Two', value: 2, pieces: [{ ring: rect(50, 20, Math.sqrt(areaB), Math.sqrt(areaB)), part: 'full' }] },
      ],
    });

  it('passes a lie factor of exactly 1.05 and refuses 1.06 (the band\'s ends belong to it)', () => {
    // +105% drawn for +100% in the data: lie factor 1.05 (Tufte's limit); +106%: 1.06.
    expect(DISTORTION_LIMITS).toEqual({ low: 0.95, high: 1.05 });
    const atLimit = verifySvg(twoSquares(205));
    expect(atLimit.lieFactor.worst).toBeCloseTo(1.05, 6);
    const over = verifySvg(twoSquares(206));
    expect(over.lieFactor.worst).toBeCloseTo(1.06, 6);
    expect(over.pass).toBe(false);
    const under = verifySvg(twoSquares(194));
    expect(under.lieFactor.worst).toBeCloseTo(0.94, 6);
    expect(under.pass).toBe(false);
    // The absolute check (value per mm²) is off by 2.5% at 205 mm², inside the same tolerance, so the verdict is the gate's.
    expect(atLimit.pass).toBe(true);
  });
});

describe('verifySvg: count reading (repeat)', () => {
  it('counts glyphs as ink ÷ one full glyph\'s ink, partial remainders included', () => {
    const report = verifySvg(repeatChart(STATIONS, { unit: 10 }));
    expect(report.pass).toBe(true);
    expect(report.mode).toBe('repeat');
    // 120 / 10 = 12, 275 / 10 = 27.5, 60 / 10 = 6 glyphs; squares of 8 mm have 64 mm² of ink.
    expect(report.marks.map((m) => m.glyphs)).toEqual([expect.closeTo(12, 9), expect.closeTo(27.5, 9), expect.closeTo(6, 9)]);
    expect(report.marks[0].unitInkMm2).toBeCloseTo(64, 9);
    expect(report.marks[1].pieces).toEqual({ full: 27, partial: 1, filled: 0, rest: 0, other: 0 });
    expect(report.lieFactor.worst).toBeCloseTo(1, 9);
  });

  it('measures <use> references exactly as inline paths (ids of the whole document resolve)', () => {
    const inline = verifySvg(repeatChart(STATIONS));
    const refs = verifySvg(repeatChart(STATIONS, { useRefs: true }));
    expect(refs.marks.map((m) => m.inkMm2)).toEqual(inline.marks.map((m) => expect.closeTo(m.inkMm2, 9)));
    expect(refs.pass).toBe(true);
  });

  it('passes a remainder cut by ink and refuses one cut by width', () => {
    const data = [
      { label: 'A', value: 1 },
      { label: 'B', value: 2.5 },
    ];
    expect(verifySvg(triangleRepeatChart(data, 'ink')).pass).toBe(true);
    const byWidth = verifySvg(triangleRepeatChart(data, 'width'));
    // Half the width of a right-pointing triangle holds 2·0.5 − 0.5² = 0.75 of its ink, so B shows 2.75 glyphs.
    expect(byWidth.marks[1].glyphs).toBeCloseTo(2.75, 9);
    expect(byWidth.lieFactor.worst).toBeCloseTo(tufte(1, 2.75, 1, 2.5), 9);
    expect(byWidth.pass).toBe(false);
    expect(byWidth.reason).toMatch(/B is drawn with 2\.75x as many glyphs as A but its value is only 2\.50x \(lie factor 1\.17/);
  });

  it('refuses one glyph drawn at two sizes even when each row\'s count is right', () => {
    const report = verifySvg(repeatChart(STATIONS, { scaleOf: (row) => (row === 1 ? 1.2 : 1) }));
    expect(report.pass).toBe(false);
    expect(report.reason).toMatch(/"Station B" carry 1\.44x the ink of those of "Station A" although they are the same glyph/);
  });

  it('refuses a chart whose key states a different unit from the one drawn (lie factor 1 throughout)', () => {
    const svg = repeatChart(STATIONS, { unit: 10 }).replace('data-unit-value="10"', 'data-unit-value="20"');
    const report = verifySvg(svg);
    expect(report.lieFactor.worst).toBeCloseTo(1, 9);
    expect(report.pass).toBe(false);
    expect(report.reason).toMatch(/drawn as 12 glyphs, which the key reads as 240 things at 20 per glyph, but its value is 120/);
  });

  it('refuses a mark whose data no longer matches the file\'s summary', () => {
    const svg = repeatChart(STATIONS).replace('data-value="275"', 'data-value="280"');
    const report = verifySvg(svg);
    expect(report.pass).toBe(false);
    expect(report.problems.join(' ')).toMatch(/summary records "Station B" = 275, but mark "mark-2" carries "Station B" = 280/);
  });
});

describe('verifySvg: length reading (stack)', () => {
  it('measures length as (whole glyphs + partial ink) × the pitch between slots', () => {
    const report = verifySvg(stackChart(STATIONS, { unit: 10, sizeMm: 6 }));
    expect(report.pass).toBe(true);
    // Pitch: 6 mm glyph + 25% gap = 7.5 mm, measured from slot positions.
    for (const m of report.marks) {
      expect(m.pitchMm).toBeCloseTo(7.5, 9);
      expect(m.graphic).toBeCloseTo((m.value / 10) * 7.5, 9);
    }
  });

  it('refuses a stack drawn with a wider pitch than the others', () => {
    const report = verifySvg(stackChart(STATIONS, { gapOf: (col) => (col === 1 ? 0.5 : 0.25) }));
    expect(report.pass).toBe(false);
    // B: 27.5 glyphs at 9 mm against C's 6 glyphs at 7.5 mm.
    expect(report.lieFactor.worst).toBeCloseTo(tufte(6 * 7.5, 27.5 * 9, 60, 275), 9);
  });

  it('refuses a stack lifted off the shared baseline, and one that skips a slot', () => {
    const lifted = verifySvg(stackChart(STATIONS, { liftOf: (col) => (col === 2 ? 3 : 0) }));
    expect(lifted.pass).toBe(false);
    expect(lifted.reason).toMatch(/"Station C" starts 3 mm away from that of "Station A"; every stack must start on the same baseline/);

    const skipped = stackChart(STATIONS).replace(/<path d="[^"]*" fill="#1f77b4" data-part="full" data-slot="1"\/>/, '');
    const report = verifySvg(skipped);
    expect(report.pass).toBe(false);
    expect(report.problems.join(' ')).toMatch(/skips or repeats slots/);
  });
});

describe('verifySvg: fill reading', () => {
  const shares = [
    { label: 'Q1', value: 30 },
    { label: 'Q2', value: 55 },
    { label: 'Q3', value: 100 },
  ];

  it('reads filled ink ÷ (filled + rest) and passes an ink-true fill', () => {
    const report = verifySvg(fillChart(shares, 'ink'));
    expect(report.pass).toBe(true);
    // Coordinates are written with 6 decimals, so shares agree to about 1e-7.
    for (const m of report.marks) expect(m.fillShare).toBeCloseTo(m.value / 100, 6);
  });

  it('refuses a glyph filled to a share of its height', () => {
    const report = verifySvg(fillChart(shares, 'height'));
    expect(report.pass).toBe(false);
    // Filled to height t, an upward triangle holds 1 − (1 − t)² of its ink (similar triangles).
    const ink = (t: number) => 1 - (1 - t) ** 2;
    expect(report.marks[0].fillShare).toBeCloseTo(ink(0.3), 9);
    expect(report.lieFactor.worst).toBeCloseTo(tufte(ink(0.3), ink(1), 30, 100), 9);
    expect(report.suggestions.join(' ')).toMatch(/share of ink/);
  });
});

describe('verifySvg: edge cases', () => {
  const squares = (values: number[], drawZeroAs = 0) =>
    chartSvg({
      reading: 'area',
      mode: 'scale',
      unit: 1,
      summary: { unit: 1 },
      marks: values.map<HandMark>((v, i) => {
        const area = v > 0 ? v : drawZeroAs;
        return { id: `mark-${i + 1}`, label: `C${i + 1}`, value: v, pieces: area > 0 ? [{ ring: rect(10 + i * 25, 20, Math.sqrt(area), Math.sqrt(area)), part: 'full' }] : [] };
      }),
    });

  it('passes a zero drawn as nothing and refuses a zero drawn with ink', () => {
    expect(verifySvg(squares([0, 100, 200])).pass).toBe(true);
    const inked = verifySvg(squares([0, 100, 200], 4));
    expect(inked.pass).toBe(false);
    expect(inked.reason).toMatch(/C1 has a value of 0 but is drawn with ink/);
  });

  it('compares equal values by ratio and passes them when drawn equal', () => {
    const report = verifySvg(squares([150, 150, 150]));
    expect(report.pass).toBe(true);
    expect(report.lieFactor.pairs.every((p) => p.basis === 'ratio')).toBe(true);
  });

  it('passes a single category with a note that there is nothing to compare', () => {
    const report = verifySvg(squares([42]));
    expect(report.pass).toBe(true);
    expect(report.lieFactor.worst).toBeNull();
    expect(report.notes.join(' ')).toMatch(/no second value/);
  });

  it('refuses a negative data-value with the reason', () => {
    const svg = squares([100, 200]).replace('data-value="100"', 'data-value="-100"');
    const e = caught(() => verifySvg(svg));
    expect(e.code).toBe('data-invalid');
    expect(e.message).toMatch(/negative value -100; no count, area or length of ink can show a negative amount/);
  });
});

describe('verifySvg: files that are not Tallyglyph charts', () => {
  it('says to use audit for an SVG without marks', () => {
    const e = caught(() => verifySvg('<svg xmlns="http://www.w3.org/2000/svg" width="10mm" height="10mm" viewBox="0 0 10 10"><circle cx="5" cy="5" r="4"/></svg>'));
    expect(e.code).toBe('document-invalid');
    expect(e.message).toMatch(/not a Tallyglyph chart/);
    expect(e.message).toMatch(/use audit/);
  });

  it('refuses malformed XML and entity declarations with a sentence', () => {
    expect(caught(() => verifySvg('<svg><g class="tg-mark"></svg>')).code).toBe('svg-malformed');
    const bomb = '<?xml version="1.0"?><!DOCTYPE svg [<!ENTITY a "aaaa">]><svg xmlns="http://www.w3.org/2000/svg">&a;</svg>';
    expect(caught(() => verifySvg(bomb)).message).toMatch(/does not expand DTD entities/);
  });

  it('refuses marks that are read in two different ways', () => {
    const svg = repeatChart(STATIONS).replace('data-reading="count"', 'data-reading="area"');
    expect(caught(() => verifySvg(svg)).message).toMatch(/one chart is read one way/);
  });
});

describe('verifySvg: preflight from the file', () => {
  const base = (extra: string, opts: { bleedMm?: number; under?: string; widthMm?: number } = {}) =>
    chartSvg({
      reading: 'area',
      mode: 'scale',
      unit: 1,
      summary: { unit: 1 },
      bleedMm: opts.bleedMm,
      widthMm: opts.widthMm,
      under: opts.under,
      marks: [
        { id: 'mark-1', label: 'A', value: 100, pieces: [{ ring: rect(20, 20, 10, 10), part: 'full' }] },
        { id: 'mark-2', label: 'B', value: 200, pieces: [{ ring: rect(50, 20, Math.SQRT2 * 10, Math.SQRT2 * 10), part: 'full' }] },
      ],
      extra,
    });
  // CSS Values and Units: 1pt = 1/72 in = 25.4/72 mm.
  const ptToMm = (pt: number) => (pt * 25.4) / 72;

  it('flags a baseline rule thinner than 0.25 pt and not one of 0.5 pt', () => {
    const rule = (pt: number) => `<g class="tg-rule" data-role="baseline"><line x1="10" y1="60" x2="100" y2="60" stroke="#333333" stroke-width="${ptToMm(pt)}"/></g>`;
    const thin = verifySvg(base(rule(0.1))).preflight;
    expect(thin.map((f) => f.code)).toContain('stroke-thin');
    expect(thin.find((f) => f.code === 'stroke-thin')?.message).toMatch(/as thin as 0\.1 pt/);
    expect(verifySvg(base(rule(0.5))).preflight.map((f) => f.code)).not.toContain('stroke-thin');
  });

  it('reads text size from data-size-pt, and from the outline\'s cap height when it is absent', () => {
    const declared = verifySvg(base('<g class="tg-text" data-role="label" data-size-pt="5"><path d="M20 40h10v2h-10z"/></g>')).preflight;
    expect(declared.find((f) => f.code === 'text-small')?.message).toMatch(/as small as 5 pt/);
    const outlined = (pt: number) => {
      const o = textOutline('Harbour Gate 420', { sizeMm: ptToMm(pt), xMm: 20, yMm: 50 });
      return base(`<g class="tg-text" data-role="label"><path d="${o.pathData}" fill="#222222"/></g>`);
    };
    const small = verifySvg(outlined(5)).preflight.find((f) => f.code === 'text-small');
    expect(small).toBeDefined();
    const shown = Number(/as small as ([\d.]+) pt/.exec(small?.message ?? '')?.[1]);
    // Ascenders (b, G) reach a little above the cap height: the estimate errs large by a few percent.
    expect(shown).toBeGreaterThan(4.9);
    expect(shown).toBeLessThan(5.5);
    expect(verifySvg(outlined(9)).preflight.map((f) => f.code)).not.toContain('text-small');
  });

  it('flags content beyond the page, and content inside the page but in the 3 mm safe margin', () => {
    const beyond = verifySvg(base('', { widthMm: 60 })).preflight.map((f) => f.code);
    expect(beyond).toContain('content-outside-page');
    const nearEdge = verifySvg(base('<g class="tg-text" data-role="source" data-size-pt="8"><path d="M1 140h20v2h-20z"/></g>')).preflight.map((f) => f.code);
    expect(nearEdge).toContain('content-outside-safe-area');
    expect(verifySvg(base('')).preflight).toEqual([]);
  });

  it('flags a bleed that nothing reaches into, and not one a background fills', () => {
    const bare = verifySvg(base('', { bleedMm: 3 }));
    expect(bare.page).toEqual({ widthMm: 200, heightMm: 150, bleedMm: 3 });
    const finding = bare.preflight.find((f) => f.code === 'bleed-unused');
    expect(finding?.basis).toBe('common practice');
    const background = '<rect class="tg-background" x="-3" y="-3" width="206" height="156" fill="#fffbe8"/>';
    expect(verifySvg(base('', { bleedMm: 3, under: background })).preflight.map((f) => f.code)).not.toContain('bleed-unused');
    // An unmarked rectangle that covers the page counts as background too, and is not content.
    const plain = '<rect x="-3" y="-3" width="206" height="156" fill="#fffbe8"/>';
    expect(verifySvg(base('', { bleedMm: 3, under: plain })).preflight).toEqual([]);
  });
});

describe('verifySvg: the report', () => {
  it('has the printed shape and survives JSON unchanged', () => {
    const report = verifySvg(repeatChart(STATIONS));
    for (const key of ['pass', 'lieFactor', 'spread', 'marks', 'suggestions', 'preflight']) expect(report).toHaveProperty(key);
    expect(Object.keys(report.lieFactor)).toEqual(['worst', 'worstPair', 'pairs']);
    expect(JSON.parse(JSON.stringify(report))).toEqual(report);
    const failing = verifySvg(scaleChart([{ label: 'a', value: 1 }, { label: 'b', value: 3 }], 'height'));
    expect(typeof failing.reason).toBe('string');
    expect(JSON.parse(JSON.stringify(failing))).toEqual(failing);
  });

  it('measures a circle-like glyph to its closed-form area (no bounding boxes)', () => {
    const svg = chartSvg({
      reading: 'area',
      mode: 'scale',
      unit: 1,
      marks: [{ id: 'mark-1', label: 'disc', value: 1, pieces: [{ ring: polygon(50, 50, 10), part: 'full' }] }],
    });
    const [m] = verifySvg(svg).marks;
    // Written with 6 decimals: agreement to about 1e-6 mm².
    expect(m.inkMm2).toBeCloseTo(ringArea(polygon(50, 50, 10)), 5);
    expect(m.inkMm2 / (m.boxMm!.width * m.boxMm!.height)).toBeCloseTo(Math.PI / 4, 3);
    expect(ringPath(polygon(0, 0, 1, 4))).toMatch(/^M1 0L/);
  });
});

describe('verifySvg: a scale chart\'s key', () => {
  const withKey = (keySideMm: number) =>
    chartSvg({
      reading: 'area',
      mode: 'scale',
      unit: 1,
      summary: { unit: 1 },
      marks: [
        { id: 'mark-1', label: 'A', value: 100, pieces: [{ ring: rect(20, 20, 10, 10), part: 'full' }] },
        { id: 'mark-2', label: 'B', value: 400, pieces: [{ ring: rect(50, 20, 20, 20), part: 'full' }] },
      ],
      // The marks carry 1 mm² per unit of value, so a key for 25 must carry 25 mm² (a 5 mm square).
      legend: { ring: rect(100, 100, keySideMm, keySideMm), glyph: 'square', unitValue: 25 },
    });

  it('passes a key glyph at the marks\' ink per value and refuses one drawn 1.44x too large', () => {
    expect(verifySvg(withKey(5)).pass).toBe(true);
    const report = verifySvg(withKey(6));
    expect(report.pass).toBe(false);
    // (6 / 5)² = 1.44.
    expect(report.reason).toMatch(/key glyph for 25 carries 36 mm² of ink, 1\.44x what the marks carry/);
  });
});
