// text-small: printers' guidance: text under about 6 pt is hard to read (some say 8 pt; common practice, no source).
import { describe, expect, it } from 'vitest';
import { textSmall } from '../../../../shared-core/integrity/checks/textSmall';
import { repeatChart } from '../chartSvgFixtures';
import { expectFindings, runCheck } from './checkHarness';

const chart = (sizePt: number) =>
  repeatChart([{ label: 'A', value: 20 }]).replace('</svg>', `<g class="tg-text" data-role="title" data-size-pt="${sizePt}"><path d="M20 5H60V8H20Z" fill="#222222"/></g></svg>`);

describe('check text-small', () => {
  it('warns about a 5 pt title', () => {
    const findings = runCheck(textSmall, chart(5));
    expectFindings(textSmall, findings);
    expect(textSmall.category).toBe('preflight');
    expect(findings[0].owner).toBe('title text');
    expect(findings[0].message).toMatch(/as small as 5 pt; text under about 6 pt/);
  });

  it('says nothing at 6 pt', () => {
    expect(runCheck(textSmall, chart(6))).toEqual([]);
  });

  it('follows the minimum it is given (8 pt, as some printers ask)', () => {
    expect(runCheck(textSmall, chart(7), { preflight: { minTextPt: 8 } })).toHaveLength(1);
  });
});
