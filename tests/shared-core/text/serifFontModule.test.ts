// The committed Noto Serif modules are exactly the package's WOFF files unpacked (W3C WOFF 1.0), and parse as fonts.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { serifModulePath, serifModuleSource, serifWeights, serifWoffPath } from '../../../scripts/build-serif-font-module';
import { loadFontFace } from '../../../shared-core/text/loadFont';

describe('bundled serif font', () => {
  it.each(serifWeights)('weight %i: the committed module is current', (weight) => {
    const expected = serifModuleSource(weight, new Uint8Array(readFileSync(serifWoffPath(weight))));
    expect(readFileSync(serifModulePath(weight), 'utf8')).toBe(expected);
  });

  it.each(serifWeights)('weight %i: loads as Noto Serif with its own metrics', (weight) => {
    const serif = loadFontFace(weight, 'serif');
    const sans = loadFontFace(weight, 'sans');
    expect((serif.font.names as unknown as { windows: { fontFamily: { en: string } } }).windows.fontFamily.en).toMatch(/Noto Serif/);
    expect((sans.font.names as unknown as { windows: { fontFamily: { en: string } } }).windows.fontFamily.en).toMatch(/Noto Sans/);
    expect(serif.unitsPerEm).toBe(1000);
  });
});
