// The static audit fixtures are exactly what their builders make (regenerate with writeFixtures.ts).
import fs from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { STATIC_FIXTURES } from '../../fixtures/audit/scenes';

describe('audit fixtures', () => {
  it.each(Object.keys(STATIC_FIXTURES))('%s matches its builder', (name) => {
    expect(fs.readFileSync(fileURLToPath(new URL(`../../fixtures/audit/${name}`, import.meta.url)), 'utf8')).toBe(STATIC_FIXTURES[name]);
  });
});
