// fill-parts-same-colour: a fill is read as the filled part against the rest; one colour for both hides it
// (common practice, no source).
import { describe, expect, it } from 'vitest';
import { fillPartsSameColour } from '../../../../shared-core/integrity/checks/fillPartsSameColour';
import { chartSvg, triangleUpAbove, triangleUpBelow } from '../chartSvgFixtures';
import { expectFindings, runCheck } from './checkHarness';

const chart = (restFill: string) =>
  chartSvg({
    reading: 'fill',
    mode: 'fill',
    unit: 10,
    marks: [
      {
        id: 'mark-1',
        label: 'Filled half',
        value: 5,
        pieces: [
          { ring: triangleUpBelow(20, 100, 20, 24, 1 - Math.sqrt(0.5)), part: 'filled', fill: '#1f77b4' },
          { ring: triangleUpAbove(20, 100, 20, 24, 1 - Math.sqrt(0.5)), part: 'rest', fill: restFill },
        ],
      },
    ],
  });

describe('check fill-parts-same-colour', () => {
  it('refuses filled and unfilled parts in one colour', () => {
    const findings = runCheck(fillPartsSameColour, chart('#1f77b4'));
    expectFindings(fillPartsSameColour, findings);
    expect(fillPartsSameColour.category).toBe('visibility');
    expect(findings[0].category).toBe('Filled half');
  });

  it('passes a paler unfilled part', () => {
    expect(runCheck(fillPartsSameColour, chart('#dddddd'))).toEqual([]);
  });
});
