// bleed-unused: a bleed is there so the background runs past the trim (3 mm in Europe; printer guidance, common
// practice, no source); asked for and left empty, it only risks a white edge.
import { describe, expect, it } from 'vitest';
import { bleedUnused } from '../../../../shared-core/integrity/checks/bleedUnused';
import { chartSvg, rect, ringPath } from '../chartSvgFixtures';
import { expectFindings, runCheck } from './checkHarness';

const chart = (under?: string) =>
  chartSvg({
    reading: 'count',
    mode: 'repeat',
    unit: 1,
    bleedMm: 3,
    marks: [{ id: 'mark-1', label: 'A', value: 1, pieces: [{ ring: rect(20, 20, 8, 8), part: 'full' }] }],
    under,
  });

describe('check bleed-unused', () => {
  it('warns about a 3 mm bleed that nothing reaches into', () => {
    const findings = runCheck(bleedUnused, chart());
    expectFindings(bleedUnused, findings);
    expect(bleedUnused.category).toBe('preflight');
    expect(findings[0].message).toMatch(/^A 3 mm bleed was asked for but nothing reaches into it/);
  });

  it('says nothing when a background fills the bleed', () => {
    expect(runCheck(bleedUnused, chart(`<g class="tg-background"><path d="${ringPath(rect(-3, -3, 206, 156))}" fill="#fdf6e3"/></g>`))).toEqual([]);
  });
});
