// Tufte's worked examples (The Visual Display of Quantitative Information, 1983, ch. 2, figures as
// listed in shared/REFERENCES.md), rebuilt as SVGs from their stated measurements: the audit must
// reproduce the published lie factors from the drawings alone.
import { describe, expect, it } from 'vitest';
import { auditSvg, correctSvg } from '../../../shared-core/audit';
import { BANKNOTES, BARRELS_AREA, BARRELS_VOLUME, DERRICKS } from '../../fixtures/audit/scenes';
import { hasRsvg, rsvgMarkCoverages } from '../../helpers/independent';

describe('auditSvg: Tufte, ch. 2', () => {
  it('barrels (p. 62): data +454%, drawn area +4,280% → lie factor 9.4', () => {
    const r = auditSvg(BARRELS_AREA.svg(), { values: BARRELS_AREA.values });
    // Tufte p. 62 prints 9.4 = 4280 / 454 (one decimal).
    expect(r.readings.area.lieFactor.worst?.toFixed(1)).toBe('9.4');
    // The drawn effect itself, measured from ink: 4,280% within 0.1%.
    const pair = r.readings.area.lieFactor.pairs[0];
    expect(Math.abs((pair.graphicRatio as number) - 1 - 42.8) / 42.8).toBeLessThan(1e-3);
    expect(r.suggested).toBe('area');
    expect(r.verdict.pass).toBe(false);
  });

  it('derricks (p. 62): $1.80 → $14.54 (+708%), drawn +6,700% → lie factor 9.5', () => {
    const r = auditSvg(DERRICKS.svg(), { values: DERRICKS.values });
    expect(r.readings.area.lieFactor.pairs[0].dataRatio - 1).toBeCloseTo(7.08, 2);
    expect(r.readings.area.lieFactor.worst?.toFixed(1)).toBe('9.5');
    expect(r.suggested).toBe('area');
  });

  it('barrels read by volume (p. 71): +27,000% against +454% → lie factor 59.4 (the book truncates 59.47)', () => {
    const r = auditSvg(BARRELS_VOLUME.svg(), { values: BARRELS_VOLUME.values });
    const lf = r.readings.volume.lieFactor.worst as number;
    expect(Math.floor(lf * 10) / 10).toBe(59.4);
    expect(lf).toBeCloseTo(27000 / 454, 1);
    // A barrel has an elliptical top: the audit flags the volume reading.
    expect(r.volumeReadable).toBe(true);
    expect(r.marks.every((m) => m.solidCues.includes('elliptic-cap'))).toBe(true);
  });

  it('the two barrel figures cannot come from one drawing of similar barrels: +4,280% area implies about +28,900% volume', () => {
    // Book figures are read off drawings; under uniform scaling volume = area^(3/2). A check on our volume reading.
    const r = auditSvg(BARRELS_AREA.svg(), { values: BARRELS_AREA.values });
    const volumeEffect = (r.readings.volume.lieFactor.pairs[0].graphicRatio as number) - 1;
    expect(volumeEffect / (43.8 ** 1.5 - 1)).toBeCloseTo(1, 3);
  });

  it('shrinking banknote (p. 70): the corrected smaller note is 0.44 / 0.44² = 2.27 times the area drawn', () => {
    const before = auditSvg(BANKNOTES.svg(), { values: BANKNOTES.values });
    const fixed = correctSvg(BANKNOTES.svg(), { values: BANKNOTES.values });
    const after = auditSvg(fixed.svg, { values: BANKNOTES.values });
    const small = before.marks.findIndex((m) => m.id === 'note-1978');
    const grown = after.marks[small].inkAreaUnits2 / before.marks[small].inkAreaUnits2;
    expect(Math.abs(grown - 0.44 / 0.44 ** 2) / 2.27).toBeLessThan(0.005);
    // The larger note (the larger value) keeps its size.
    expect(fixed.keptMark).toBe('note-1958');
    expect(after.marks[1 - small].inkAreaUnits2).toBeCloseTo(before.marks[1 - small].inkAreaUnits2, 6);
  });
});

describe.skipIf(!hasRsvg)('auditSvg ink against an independent renderer (rsvg-convert)', () => {
  it('barrel and derrick ink areas agree with rsvg-convert alpha sums within 0.5%', () => {
    for (const scene of [BARRELS_AREA.svg(), DERRICKS.svg()]) {
      const r = auditSvg(scene, { values: [1, 2] });
      const ids = r.marks.map((m) => m.id);
      // 1 user unit = 1 mm on these pages, so rsvg's mm² equal our units².
      const cov = rsvgMarkCoverages(scene, ids, 1600);
      for (const m of r.marks) {
        const c = cov.find((x) => x.id === m.id)?.mm2 as number;
        expect(Math.abs(c - m.inkAreaUnits2) / m.inkAreaUnits2).toBeLessThan(0.005);
      }
    }
  });
});
