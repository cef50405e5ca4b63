// Our own scenes with known geometry: every expected figure follows from the scale factors used to
// draw them and Tufte's definition, lie factor = (g2/g1 - 1) / (d2/d1 - 1) (Tufte 1983, p. 57).
import { describe, expect, it } from 'vitest';
import { auditSvg, findSvgMarks, importSvg, parseLabelNumber, suggestReading } from '../../../shared-core/audit';
import { BOXES_3D, FLAT_SQUARES, PERSON_INK, STRETCHED_3X, UNIFORM_3X, personRows } from '../../fixtures/audit/scenes';

describe('auditSvg: readings of known scenes', () => {
  it('a glyph scaled uniformly ×3 for a value ×3: area lie factor (9-1)/(3-1) = 4.0, length 1.0, suggests area', () => {
    const r = auditSvg(UNIFORM_3X.svg(), { values: UNIFORM_3X.values });
    expect(r.readings.area.lieFactor.worst).toBeCloseTo(4, 3);
    expect(r.readings.length.lieFactor.worst).toBeCloseTo(1, 3);
    // Volume as width² × height grows ×27: (27-1)/(3-1) = 13.
    expect(r.readings.volume.lieFactor.worst).toBeCloseTo(13, 2);
    expect(r.suggested).toBe('area');
    expect(r.volumeReadable).toBe(false);
    expect(r.readings.area.verdict).toBe('distorted');
    expect(r.readings.length.verdict).toBe('faithful');
    // The ink itself, against the closed form of the glyph (a disc and two rectangles).
    expect(Math.abs(r.marks[0].inkAreaUnits2 - PERSON_INK) / PERSON_INK).toBeLessThan(1e-4);
  });

  it('a glyph stretched ×3 in height only: length 1.0, says length (height)', () => {
    const r = auditSvg(STRETCHED_3X.svg(), { values: STRETCHED_3X.values });
    expect(r.suggested).toBe('length');
    expect(r.readings.length.dimension).toBe('height');
    expect(r.readings.length.lieFactor.worst).toBeCloseTo(1, 3);
    // Stretching one side ×3 triples the ink too: area (3-1)/(3-1) = 1.
    expect(r.readings.area.lieFactor.worst).toBeCloseTo(1, 3);
    expect(r.reasons[0]).toMatch(/height grows ×3\.00 while the width stays the same/);
  });

  it('a box drawn with slanted top and side faces is flagged as volume-readable; flat squares are not', () => {
    const box = auditSvg(BOXES_3D.svg(), { values: BOXES_3D.values });
    expect(box.volumeReadable).toBe(true);
    expect(box.marks[0].solidCues).toContain('parallelogram-faces');
    expect(box.reasons.join(' ')).toMatch(/volume/);
    const flat = auditSvg(FLAT_SQUARES.svg(), { values: FLAT_SQUARES.values });
    expect(flat.volumeReadable).toBe(false);
    expect(flat.reasons.join(' ')).not.toMatch(/solid/);
  });

  it('rows of one repeated glyph are read by count: 3 and 5 + a half-ink piece = 5.5', () => {
    const { svg, counts } = personRows();
    const r = auditSvg(svg, { values: [3, 5.5] });
    expect(r.suggested).toBe('count');
    expect(r.marks.map((m) => m.repeats)).toEqual([3, 5]);
    expect(r.marks[0].count).toBeCloseTo(counts[0], 3);
    expect(r.marks[1].count).toBeCloseTo(counts[1], 3);
    expect(r.readings.count.lieFactor.worst).toBeCloseTo(1, 3);
    // Against data 3 → 4 the same drawing overstates: (5.5/3 - 1) / (4/3 - 1) = 2.5.
    const off = auditSvg(svg, { values: [3, 4] });
    expect(off.readings.count.lieFactor.worst).toBeCloseTo(2.5, 3);
  });

  it('equal values drawn alike are faithful on the ratio basis; a zero, a negative or a missing value is refused or reported', () => {
    const same = auditSvg(FLAT_SQUARES.svg(), { values: [2, 2] });
    expect(same.readings.area.lieFactor.pairs[0].basis).toBe('ratio');
    expect(same.readings.area.lieFactor.worst).toBeCloseTo(4, 6);
    expect(() => auditSvg(FLAT_SQUARES.svg(), { values: [1, -2] })).toThrow(/negative value/);
    expect(() => auditSvg(FLAT_SQUARES.svg(), { values: [1] })).toThrow(/1 value\(s\) were given but the graphic has 2 mark/);
    expect(() => auditSvg(FLAT_SQUARES.svg())).toThrow(/No value is known/);
    const zero = auditSvg(FLAT_SQUARES.svg(), { values: [0, 2] });
    expect(zero.readings.area.pass).toBe(false);
    expect(zero.readings.area.problems.join(' ')).toMatch(/value of 0 but is drawn with ink/);
  });
});

describe('findSvgMarks: what counts as one mark', () => {
  const page = (body: string) => `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 200 100">${body}</svg>`;

  it('touching top-level pieces are one mark; a baseline spanning them and a page background are set aside', () => {
    const svg = page(
      '<rect width="200" height="100" fill="#fff"/>' +
        '<g><circle cx="20" cy="20" r="5"/><rect x="15" y="25" width="10" height="30"/>' +
        '<rect x="60" y="35" width="10" height="20"/><rect x="62" y="25" width="6" height="10"/>' +
        '<path d="M0 55 H200 V56 H0 Z"/></g>',
    );
    const found = findSvgMarks(importSvg(svg));
    expect(found.marks.length).toBe(2);
    // Circle (r 5) touching a 10 × 30 bar, and two stacked rectangles: πr² + 300 and 200 + 60.
    expect(found.marks[0].inkAreaUnits2).toBeCloseTo(Math.PI * 25 + 300 - 0, 0);
    expect(found.marks[1].inkAreaUnits2).toBeCloseTo(260, 6);
    expect(found.setAside.map((s) => s.kind).sort()).toEqual(['background', 'connector']);
  });

  it('a single wrapper group is looked through; --marks picks elements by id in the given order', () => {
    const svg = page('<g id="layer"><rect id="p" x="0" width="10" height="10"/><rect id="q" x="50" width="10" height="30"/></g>');
    expect(findSvgMarks(importSvg(svg)).marks.map((m) => m.id)).toEqual(['p', 'q']);
    expect(findSvgMarks(importSvg(svg), { markIds: ['q', 'p'] }).marks.map((m) => m.inkAreaUnits2)).toEqual([300, 100]);
    expect(() => findSvgMarks(importSvg(svg), { markIds: ['nope'] })).toThrow(/no painted element with the id "nope"/);
  });

  it("a Tallyglyph chart's own marks and recorded values are used", () => {
    const svg = page(
      '<g class="tg-marks"><g id="mark-1" class="tg-mark" data-label="Bus" data-value="2"><path d="M0 0H10V10H0Z"/></g>' +
        '<g id="mark-2" class="tg-mark" data-label="Bike" data-value="4"><path d="M20 0H40V10H20Z"/></g></g>' +
        '<g class="tg-text" data-role="title"><path d="M0 90H100V99H0Z"/></g>',
    );
    const r = auditSvg(svg);
    expect(r.marks.map((m) => [m.label, m.value, m.valueFrom])).toEqual([
      ['Bus', 2, 'file'],
      ['Bike', 4, 'file'],
    ]);
    expect(r.readings.area.lieFactor.worst).toBeCloseTo(1, 9);
  });
});

describe('values from labels', () => {
  it('reads amounts as written on charts', () => {
    expect(parseLabelNumber('$14.54')).toBe(14.54);
    expect(parseLabelNumber('1,200')).toBe(1200);
    expect(parseLabelNumber('27.5%')).toBe(27.5);
    expect(parseLabelNumber('2.4 million')).toBe(2_400_000);
    expect(parseLabelNumber('1979: $13.34')).toBe(13.34);
    expect(parseLabelNumber('12kg')).toBe(12);
    expect(parseLabelNumber('none')).toBeNull();
  });

  it('pairs each number label with the nearest mark, says which, and lets the user override one', () => {
    const svg = UNIFORM_3X.svg().replace(
      '</svg>',
      '<text x="15" y="95" font-size="4">10</text><text x="55" y="95" font-size="4">30</text><text x="50" y="5" font-size="4">2024</text></svg>',
    );
    const r = auditSvg(svg);
    expect(r.pairings.map((p) => [p.text, p.mark])).toEqual([
      ['10', 'small'],
      ['30', 'large'],
    ]);
    expect(r.marks.map((m) => m.valueFrom)).toEqual(['label', 'label']);
    const o = auditSvg(svg, { values: 'large=90' });
    expect(o.marks.map((m) => [m.value, m.valueFrom])).toEqual([
      [10, 'label'],
      [90, 'user'],
    ]);
    // 90 / 10 is ×9, the area drawn: now faithful by area.
    expect(o.readings.area.lieFactor.worst).toBeCloseTo(1, 3);
  });
});

describe('suggestReading', () => {
  const mark = (w: number, h: number) => ({ id: `${w}x${h}`, label: '', box: { x: 0, y: 0, width: w, height: h }, inkAreaUnits2: w * h, parts: [], solidCues: [], colours: [] });
  it('both sides growing → area, one side → length, a side changing less than a quarter as much → still length', () => {
    expect(suggestReading([mark(10, 10), mark(20, 18)], null).suggested).toBe('area');
    expect(suggestReading([mark(10, 10), mark(10, 30)], null).suggested).toBe('length');
    expect(suggestReading([mark(10, 10), mark(30, 10)], null).dimension).toBe('width');
    // ln 1.2 / ln 3 = 0.17 < 0.25.
    expect(suggestReading([mark(10, 10), mark(12, 30)], null).suggested).toBe('length');
    // ln 1.5 / ln 3 = 0.37 > 0.25.
    expect(suggestReading([mark(10, 10), mark(15, 30)], null).suggested).toBe('area');
  });
});
