// stroke-thin: printers' guidance puts the thinnest line that prints reliably at about 0.25 pt (common practice,
// no source). CSS Values and Units: 1 pt = 1/72 in = 25.4/72 mm, so 0.05 mm = 0.142 pt and 0.1 mm = 0.283 pt.
import { describe, expect, it } from 'vitest';
import { strokeThin } from '../../../../shared-core/integrity/checks/strokeThin';
import { repeatChart } from '../chartSvgFixtures';
import { expectFindings, runCheck } from './checkHarness';

const chart = (widthMm: number) =>
  repeatChart([{ label: 'A', value: 20 }]).replace('</svg>', `<path d="M20 145H60" stroke="#000000" stroke-width="${widthMm}" fill="none"/></svg>`);

describe('check stroke-thin', () => {
  it('warns about a 0.05 mm (0.142 pt) line, naming its owner', () => {
    const findings = runCheck(strokeThin, chart(0.05));
    expectFindings(strokeThin, findings);
    expect(strokeThin.category).toBe('preflight');
    expect(findings[0].severity).toBe('warning');
    expect(findings[0].owner).toBe('artwork');
    expect(findings[0].message).toMatch(/^artwork: 1 line as thin as 0\.142 pt/);
  });

  it('says nothing of a 0.1 mm (0.283 pt) line', () => {
    expect(runCheck(strokeThin, chart(0.1))).toEqual([]);
  });
});
