// Rules about how the chart is drawn, read from the laid-out scene: one scale, ink-matched glyphs, disclosed
// apparent-size scaling, solid-looking glyphs, rounding to whole glyphs, and the data-ink share. Each rule is
// shown quiet on real layouts of invented data and triggered by the same scene edited as a careless tool would.
import { describe, expect, it } from 'vitest';
import { regionArea } from '../../../../shared-core/geometry/index';
import {
  APPARENT_MAGNITUDE_AREA_EXPONENT,
  decorationHeavy,
  glyphsUnnormalised,
  measureDataInk,
  perceptualUndisclosed,
  roundingError,
  scaleInconsistent,
  unitWithinLimit,
  volumeCue,
} from '../../../../shared-core/integrity/rules/index';
import { writeSvg } from '../../../../shared-core/svg/index';
import { resvgAlphaSum } from '../../../helpers/independent';
import { copyScene, laid, moved, run, scaled } from './ruleFixtures';

const mixed = () =>
  laid({
    data: [
      { label: 'Bikes', value: 30, glyph: 'bike' },
      { label: 'Buses', value: 55, glyph: 'bus' },
      { label: 'Trams', value: 40, glyph: 'tram' },
    ],
  });
const stack = () => laid({ encoding: { mode: 'stack', glyph: 'coffee', unit: 5, unitName: 'cups' } });
const scale = () => laid({ encoding: { mode: 'scale', glyph: 'tree', unitName: 'trees' } });
const fill = () => laid({ data: [{ label: 'North', value: 0.4 }, { label: 'South', value: 0.7 }], encoding: { mode: 'fill', glyph: 'drop', fillTo: 'share' } });

describe('scale-inconsistent: one scale for every category', () => {
  it('is quiet on real layouts in every mode, with mixed glyphs and as one shared icon array', () => {
    for (const chart of [laid(), mixed(), stack(), scale(), fill(), laid({ encoding: { mode: 'repeat', glyph: 'person', unit: 1, unitName: 'people', arrangement: 'shared-grid' } })]) {
      expect(run(scaleInconsistent, chart)).toEqual([]);
    }
  });

  it('triggers when one category is drawn at another unit (marks or legend)', () => {
    const chart = laid();
    const scene = copyScene(chart.scene);
    scene.marks[1].intended *= 1.25;
    expect(run(scaleInconsistent, { spec: chart.spec, scene }).map((f) => f.code)).toEqual(['scale-inconsistent-unit']);
    const legend = copyScene(chart.scene);
    legend.legendKeys[0].unitValue = 10;
    expect(run(scaleInconsistent, { spec: chart.spec, scene: legend })[0].message).toContain('one glyph stands for 10, but the chart is drawn at 5 per glyph');
  });

  it('triggers when one category\'s glyphs are larger, or one glyph among them is', () => {
    const chart = laid();
    const scene = copyScene(chart.scene);
    for (const g of scene.marks[2].glyphs) if (g.part === 'full') g.region = scaled(g.region, 1.1);
    const [f] = run(scaleInconsistent, { spec: chart.spec, scene });
    expect(f.code).toBe('scale-inconsistent-size');
    expect(f.category).toBe('Cedar Lane');
    const one = copyScene(chart.scene);
    one.marks[0].glyphs[0].region = scaled(one.marks[0].glyphs[0].region, 1.2);
    expect(run(scaleInconsistent, { spec: chart.spec, scene: one }).some((x) => x.message.includes('within "Alder Street"'))).toBe(true);
  });

  it('triggers when one category\'s glyphs are spaced wider', () => {
    const chart = laid();
    const scene = copyScene(chart.scene);
    scene.marks[1].glyphs.forEach((g, i) => (g.region = moved(g.region, i * 0.8, 0)));
    const found = run(scaleInconsistent, { spec: chart.spec, scene });
    expect(found.map((f) => f.code)).toEqual(['scale-inconsistent-gap']);
    expect(found[0].category).toBe('Birch Road');
  });

  it('triggers when one stack starts above the shared baseline', () => {
    const chart = stack();
    const scene = copyScene(chart.scene);
    for (const g of scene.marks[2].glyphs) g.region = moved(g.region, 0, -3);
    const found = run(scaleInconsistent, { spec: chart.spec, scene });
    expect(found.map((f) => f.code)).toEqual(['scale-inconsistent-baseline']);
    expect(found[0].message).toContain('"Cedar Lane" starts 3 mm away');
  });
});

describe('glyphs-unnormalised: mixed glyphs not matched by ink', () => {
  it('is quiet when the layout sizes each glyph by its ink (repeat and scale)', () => {
    expect(run(glyphsUnnormalised, mixed())).toEqual([]);
    expect(run(glyphsUnnormalised, laid({ data: [{ label: 'Bikes', value: 30, glyph: 'bike' }, { label: 'Buses', value: 55, glyph: 'bus' }], encoding: { mode: 'scale', glyph: 'bike', unitName: 'trips' } }))).toEqual([]);
  });

  it('triggers when one glyph kind is matched by its box instead (here: 30% more ink per glyph)', () => {
    const chart = mixed();
    const scene = copyScene(chart.scene);
    for (const g of scene.marks[1].glyphs) g.region = scaled(g.region, Math.sqrt(1.3));
    const [f] = run(glyphsUnnormalised, { spec: chart.spec, scene });
    expect(f.code).toBe('glyphs-unnormalised');
    expect(f.message).toContain('"bus"');
    expect(f.message).toContain('(1.3 times as much)');
  });
});

describe('perceptual-undisclosed: apparent-magnitude scaling without a note', () => {
  // Flannery (1971), via REFERENCES.md (secondary sources): radius grows as value^0.5716, so area as value^1.1432.
  function flannery(note?: string) {
    const chart = scale();
    const scene = copyScene(chart.scene);
    const vmax = Math.max(...scene.marks.map((m) => m.value));
    for (const m of scene.marks) {
      const s = Math.sqrt((m.value / vmax) ** (APPARENT_MAGNITUDE_AREA_EXPONENT - 1));
      m.glyphs = m.glyphs.map((g) => ({ ...g, region: scaled(g.region, s) }));
    }
    if (note) scene.texts.push({ ...scene.texts[0], role: 'note', text: note });
    return { spec: chart.spec, scene };
  }

  it('is quiet on area-true scaling', () => {
    expect(run(perceptualUndisclosed, scale())).toEqual([]);
  });

  it('triggers on areas that grow as value^1.1432 with no note, and is quiet once the chart says so', () => {
    const [f] = run(perceptualUndisclosed, flannery());
    expect(f.code).toBe('perceptual-undisclosed');
    expect(f.message).toContain('value^1.143');
    expect(run(perceptualUndisclosed, flannery('Sizes use apparent-magnitude scaling.'))).toEqual([]);
  });
});

describe('volume-cue: solid-looking glyphs scaled by area', () => {
  // An invented drawing of a box: a front face plus a slanted top and side (two parallelograms).
  const BOX = '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 30 30"><rect x="0" y="8" width="22" height="22" fill="#3d6fb6"/><polygon points="0,8 8,0 30,0 22,8" fill="#7fa6dc"/><polygon points="22,8 30,0 30,22 22,30" fill="#24477a"/></svg>';

  it('triggers on a box drawn in perspective in scale mode', () => {
    const [f] = run(volumeCue, laid({ encoding: { mode: 'scale', glyph: { svg: BOX }, unitName: 'crates' } }));
    expect(f.code).toBe('volume-cue');
    expect(f.message).toContain('parallelogram faces');
    expect(f.action).toEqual({ kind: 'set-mode', label: 'Use repeat mode', payload: { mode: 'repeat' } });
  });

  it('is quiet for a flat glyph in scale mode and for the box in repeat mode', () => {
    expect(run(volumeCue, scale())).toEqual([]);
    expect(run(volumeCue, laid({ encoding: { mode: 'repeat', glyph: { svg: BOX }, unit: 5, unitName: 'crates' } }))).toEqual([]);
  });
});

describe('rounding-error: whole glyphs moving a category by more than 5%', () => {
  const whole = (unit: number, rounding = 'whole') => laid({ encoding: { mode: 'repeat', glyph: 'bike', unit, unitName: 'bikes', rounding } });

  it('triggers at 20 per glyph (30 drawn as 2 glyphs: +33.33%) and names 5 as the unit that fixes it', () => {
    // 30/20 = 1.5 -> 2 (+33.33%); 55/20 = 2.75 -> 3 (+9.09%); 40/20 = 2 (exact). At 10: 55/10 = 5.5 -> 6 (+9.09%);
    // at 5 every value is a whole number of glyphs (arithmetic by hand).
    const [f] = run(roundingError, whole(20));
    expect(f.code).toBe('rounding-error');
    expect(f.category).toBe('Alder Street');
    expect(f.message).toContain('adds 33.33% of "Alder Street" (1.5 glyphs drawn as 2), and more than 5% of 1 other category');
    expect(f.action).toEqual({ kind: 'set-unit', label: 'Use 5 per glyph', payload: { unit: 5 } });
  });

  it('is quiet with ink-cut remainders or a unit that divides the values', () => {
    expect(run(roundingError, whole(20, 'ink-cut'))).toEqual([]);
    expect(run(roundingError, whole(5))).toEqual([]);
  });

  it('unitWithinLimit stops at the glyph budget and returns null rather than an unusable unit', () => {
    expect(unitWithinLimit([30, 55, 40], 20)).toBe(5);
    expect(unitWithinLimit([1_000_001, 1_000_003], 1_000)).toBeNull();
  });
});

describe('data ink: measured from the geometry', () => {
  it('agrees with an independent renderer: data marks and all ink of a written chart (resvg alpha sum, within 1%)', () => {
    const chart = mixed();
    const ink = measureDataInk(chart.scene);
    const svg = writeSvg(chart.scene, { outlineText: true });
    const widthPx = 3600;
    const mmPerPx = chart.scene.page.widthMm / widthPx;
    // resvg, called directly, counts every painted pixel's coverage: marks, text outlines and legend keys.
    const allInk = resvgAlphaSum(svg, widthPx) * mmPerPx * mmPerPx;
    expect(Math.abs(ink.dataMm2 + ink.readingAidMm2 - allInk) / allInk).toBeLessThan(0.01);
    // The marks' ink equals whole-glyph ink times the glyphs drawn: 125 / 5 = 25 glyphs (ink-cut, summary's unit glyph ink).
    expect(ink.dataMm2 / ((125 / 5) * (chart.scene.summary.unitGlyphInkMm2 ?? 0))).toBeCloseTo(1, 3);
    expect(ink.decorationMm2).toBe(0);
    expect(ink.dataShare).toBeCloseTo(ink.dataMm2 / allInk, 1);
  });

  it('counts a tinted page as decoration; decoration-heavy then advises, with the three shares', () => {
    const chart = laid();
    const scene = copyScene(chart.scene);
    scene.background = '#f4e9d8';
    const ink = measureDataInk(scene);
    expect(ink.decorationMm2).toBe(180 * 120);
    const [f] = run(decorationHeavy, { spec: chart.spec, scene });
    expect(f).toMatchObject({ code: 'decoration-heavy', severity: 'advice' });
    expect(f.message).toMatch(/data marks [\d.]+% of the ink .*reading aids [\d.]+%, decoration [\d.]+%/);
  });

  it('is quiet on a plain chart and on a white page', () => {
    const chart = laid();
    expect(run(decorationHeavy, chart)).toEqual([]);
    const white = copyScene(chart.scene);
    white.background = '#FFFFFF';
    expect(run(decorationHeavy, { spec: chart.spec, scene: white })).toEqual([]);
    expect(regionArea(chart.scene.marks[0].glyphs[0].region)).toBeGreaterThan(0);
  });
});
