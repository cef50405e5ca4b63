// content-outside-safe-area: trimming can be off by a millimetre or two, so content keeps a safe margin from the
// trim (3 mm unless the file or the caller says; printers' common practice, no source).
import { describe, expect, it } from 'vitest';
import { contentOutsideSafeArea } from '../../../../shared-core/integrity/checks/contentOutsideSafeArea';
import { repeatChart } from '../chartSvgFixtures';
import { expectFindings, runCheck } from './checkHarness';

/** Artwork ending `gapMm` inside the right trim edge of a 200 mm page. */
const chart = (gapMm: number) => repeatChart([{ label: 'A', value: 20 }]).replace('</svg>', `<path d="M180 20H${200 - gapMm}V30H180Z" fill="#222222"/></svg>`);

describe('check content-outside-safe-area', () => {
  it('warns about content 1 mm from the trim', () => {
    const findings = runCheck(contentOutsideSafeArea, chart(1));
    expectFindings(contentOutsideSafeArea, findings);
    expect(contentOutsideSafeArea.category).toBe('preflight');
    expect(findings[0].message).toMatch(/closer than 3 mm to the trim edge/);
  });

  it('says nothing at 3 mm from the trim, nor at 1 mm when the safe margin asked for is 1 mm', () => {
    expect(runCheck(contentOutsideSafeArea, chart(3))).toEqual([]);
    expect(runCheck(contentOutsideSafeArea, chart(1), { safeMarginMm: 1 })).toEqual([]);
  });
});
