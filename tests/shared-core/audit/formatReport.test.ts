// The text report a designer forwards to a client: plain words for what a reader compares and the
// verdict, with the numbers behind it (lie factors by Tufte's definition, 1983, p. 57).
import { describe, expect, it } from 'vitest';
import { auditSvg, formatAuditReport } from '../../../shared-core/audit';
import { BARRELS_AREA, STRETCHED_3X } from '../../fixtures/audit/scenes';

describe('formatAuditReport', () => {
  it('barrels scaled in both directions: explains the area reading, the 3-D look, and gives 9.43 = 42.8 / 4.54', () => {
    const text = formatAuditReport(auditSvg(BARRELS_AREA.svg(true)), 'barrels.svg');
    expect(text).toContain('Tallyglyph audit of barrels.svg');
    expect(text).toMatch(/the width grows ×6\.62 and the height ×6\.62/);
    expect(text).toMatch(/readers judge how much space it covers, so it is read by its area/);
    expect(text).toMatch(/look solid \(an elliptical top on a body of the same width, as on a barrel/);
    // sqrt(43.8) = 6.618; (43.8 - 1) / (5.54 - 1) = 9.427.
    expect(text).toMatch(/stands for 5\.54 times the value of barrel-1973 and is drawn with 43\.8 times the area/);
    // The figure in the effect form it comes from (Tufte 1983, p. 57): (43.8 - 1) / (5.54 - 1) = 9.43.
    expect(text).toMatch(/shows the difference 9\.43 times as big as the data does \(lie factor \(43\.8 − 1\) ÷ \(5\.54 − 1\) = 9\.43, the growth drawn over the growth in the data; Tufte counts anything outside 0\.95–1\.05/);
    expect(text).toMatch(/area \(suggested\)\s+9\.43/);
    // Values read from the labels, said plainly.
    expect(text).toMatch(/"1\.00" → barrel-1973 \(value 1\)/);
    expect(text).toMatch(/"5\.54" → barrel-1979 \(value 5\.54\)/);
    expect(text).toMatch(/Scale each picture so that its area, not its height, is in proportion to its value/);
  });

  it('a glyph stretched in height only: explains the length reading and calls it faithful (1.00)', () => {
    const text = formatAuditReport(auditSvg(STRETCHED_3X.svg(), { values: STRETCHED_3X.values }), 'stretched.svg');
    expect(text).toMatch(/the height grows ×3\.00 while the width stays the same/);
    expect(text).toMatch(/the marks are read by their height/);
    expect(text).toMatch(/Read by length, the marks are in proportion to the data: tall stands for 3\.00 times the value of short and is drawn 3\.00 times as long, a lie factor of \(3\.00? − 1\) ÷ \(3\.00? − 1\) = 1\.00/);
    expect(text).toMatch(/length \(height\) \(suggested\)\s+1\.00\s+tall vs short\s+1\.00\s+faithful/);
    expect(text).toMatch(/Read by length, nothing needs to change/);
  });

  it('never prints a failing lie factor as a passing one', () => {
    const svg = STRETCHED_3X.svg().replace('scale(1 3)', 'scale(1 3.1021)');
    const r = auditSvg(svg, { values: STRETCHED_3X.values });
    // (3.1021 - 1) / 2 = 1.05105: out of bounds, and two decimals would show 1.05.
    expect(r.readings.length.pass).toBe(false);
    expect(formatAuditReport(r)).toMatch(/length \(height\) \(suggested\)\s+1\.051/);
  });
});
