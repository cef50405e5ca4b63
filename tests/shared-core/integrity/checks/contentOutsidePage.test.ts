// content-outside-page: whatever lies past the trim edge is cut off when the sheet is trimmed.
import { describe, expect, it } from 'vitest';
import { contentOutsidePage } from '../../../../shared-core/integrity/checks/contentOutsidePage';
import { contentOutsideSafeArea } from '../../../../shared-core/integrity/checks/contentOutsideSafeArea';
import { repeatChart } from '../chartSvgFixtures';
import { expectFindings, runCheck } from './checkHarness';

/** A 200 x 150 mm page with artwork from x = 180 to x = 180 + widthMm. */
const chart = (widthMm: number) => repeatChart([{ label: 'A', value: 20 }]).replace('</svg>', `<path d="M180 20H${180 + widthMm}V30H180Z" fill="#222222"/></svg>`);

describe('check content-outside-page', () => {
  it('warns about artwork reaching 5 mm past the right trim edge, and does not repeat it as a safe-area finding', () => {
    const findings = runCheck(contentOutsidePage, chart(25));
    expectFindings(contentOutsidePage, findings);
    expect(contentOutsidePage.category).toBe('preflight');
    expect(findings[0].message).toMatch(/content 20–205 x 20–138 mm on a 200 x 150 mm page/);
    expect(runCheck(contentOutsideSafeArea, chart(25))).toEqual([]);
  });

  it('says nothing of artwork inside the page', () => {
    expect(runCheck(contentOutsidePage, chart(10))).toEqual([]);
  });
});
