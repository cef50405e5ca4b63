// The rules' file-format words turned into the names the window shows (the Key checkbox, the mode buttons).
import { describe, expect, it } from 'vitest';
import { ruleWords } from '../../../renderer/src/integrity/ruleWords';
import { unitUnstated, volumeCue } from '../../../shared-core/integrity/rules/index';

describe('ruleWords', () => {
  it('names the key and the modes as the window does', () => {
    expect(ruleWords('Turn the legend on, so the chart says "one glyph = N ...".')).toBe('Turn the key on (Show: Key), so the chart says "one glyph = N ...".');
    expect(ruleWords('Show the legend')).toBe('Show the key');
    expect(ruleWords('The chart does not say what one glyph stands for (the legend is off).')).toBe('The chart does not say what one glyph stands for (the key is off).');
    expect(ruleWords('Use repeat mode')).toBe('Use the Repeat mode');
    expect(ruleWords('or switch to repeat mode so the number of glyphs carries the value.')).toBe('or switch to the Repeat mode so the number of glyphs carries the value.');
  });

  it('leaves the rules\' own names alone where they carry no file words', () => {
    expect(ruleWords(unitUnstated.name)).toBe(unitUnstated.name);
    expect(ruleWords(volumeCue.name)).toBe(volumeCue.name);
  });
});
