// Legend sentences read as English: a unit of one takes the singular (regular English plurals, from memory).
import { describe, expect, it } from 'vitest';
import { singularOf, unitLegendText } from '../../../shared-core/layout/legend';

describe('unitLegendText', () => {
  it('uses the singular for a unit of exactly one and keeps the name otherwise', () => {
    expect(unitLegendText(1, 'commuters')).toBe('one glyph = 1 commuter');
    expect(unitLegendText(50, 'rides')).toBe('one glyph = 50 rides');
    expect(unitLegendText(1, '')).toBe('one glyph = 1');
  });
  it('undoes regular plural endings only', () => {
    expect(singularOf('bikes')).toBe('bike');
    expect(singularOf('berries')).toBe('berry');
    expect(singularOf('buses')).toBe('bus');
    expect(singularOf('boxes')).toBe('box');
    expect(singularOf('trips by bus')).toBe('trips by bus');
    expect(singularOf('people')).toBe('people');
    expect(singularOf('gas')).toBe('gas');
    expect(singularOf('tonnes CO2')).toBe('tonnes CO2');
    expect(singularOf('electric cars')).toBe('electric car');
  });
});
