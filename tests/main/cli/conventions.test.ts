// Command-line conventions every tool shares: --version, help for each command including help itself,
// and exit statuses a script can rely on.
import fs from 'node:fs';
import { describe, expect, it } from 'vitest';
import { main } from '../../../main/cli/index';

async function cli(args: string[]) {
  let out = '';
  let err = '';
  const code = await main(args, { stdout: (s) => void (out += s), stderr: (s) => void (err += s), cwd: process.cwd() });
  return { code, out, err };
}

describe('tallyglyph conventions', () => {
  it('--version prints the version npm knows from package.json', async () => {
    const pkg = JSON.parse(fs.readFileSync(new URL('../../../package.json', import.meta.url), 'utf8')) as { version: string };
    const r = await cli(['--version']);
    expect(r.code).toBe(0);
    expect(r.out).toBe(`tallyglyph ${pkg.version}\n`);
    expect(pkg.version).toMatch(/^\d+\.\d+\.\d+/);
  });

  it('help help explains help itself, and the command list mentions --version', async () => {
    const r = await cli(['help', 'help']);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/^Usage: tallyglyph help \[<command>\]/);
    expect(r.err).toBe('');
    const list = await cli(['help']);
    expect(list.out).toMatch(/tallyglyph --version/);
  });

  it('an unknown command exits 2 with a sentence', async () => {
    const r = await cli(['help', 'nosuch']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/unknown command "nosuch"/);
  });
});
