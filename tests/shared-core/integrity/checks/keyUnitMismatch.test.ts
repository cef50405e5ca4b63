// key-unit-mismatch: the key says what one glyph stands for; a chart drawn at another unit throughout keeps a
// lie factor of 1 between its rows yet misstates every amount. Held to Tufte's 0.95-1.05 band (1983, p. 57).
import { describe, expect, it } from 'vitest';
import { keyUnitMismatch } from '../../../../shared-core/integrity/checks/keyUnitMismatch';
import { lieFactor } from '../../../../shared-core/integrity/checks/lieFactor';
import { repeatChart } from '../chartSvgFixtures';
import { expectFindings, runCheck } from './checkHarness';

const honest = repeatChart([
  { label: 'A', value: 30 },
  { label: 'B', value: 50 },
]);

describe('check key-unit-mismatch', () => {
  it('refuses a key that says 20 per glyph over glyphs drawn at 10 (3 glyphs read as 60 for a value of 30)', () => {
    const tampered = honest.replace('data-unit-value="10"', 'data-unit-value="20"');
    expect(tampered).not.toBe(honest);
    expect(runCheck(lieFactor, tampered)).toEqual([]);
    const findings = runCheck(keyUnitMismatch, tampered);
    expectFindings(keyUnitMismatch, findings);
    expect(keyUnitMismatch.category).toBe('consistency');
    expect(findings[0].category).toBe('A');
    expect(findings[0].message).toMatch(/"A" is drawn as 3 glyphs, which the key reads as 60 things at 20 per glyph, but its value is 30/);
  });

  it('passes the key as written', () => {
    expect(runCheck(keyUnitMismatch, honest)).toEqual([]);
  });
});
