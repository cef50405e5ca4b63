// `tallyglyph check --list` prints the registries (FILE_CHECKS and CHART_RULES): every code with its severity and name.
import { describe, expect, it } from 'vitest';
import { command } from '../../../main/cli/commands/check';
import { listChecks } from '../../../shared-core/integrity/index';
import { capture } from '../../helpers/cli';
import { folderPerTest } from '../../helpers/tempDirs';

const tmp = folderPerTest('tallyglyph-check-list-');

describe('tallyglyph check --list', () => {
  it('prints one line per check and rule, code, severity and name, and exits 0', async () => {
    const io = capture(tmp.dir);
    expect(await command.run(['--list'], io)).toBe(0);
    const lines = io.out.split('\n');
    for (const c of listChecks()) {
      const line = lines.find((l) => l.trim().split(/\s+/)[0] === c.code);
      expect(line, c.code).toBeDefined();
      expect(line?.trim().split(/\s+/)[1]).toBe(c.severity);
      expect(line?.endsWith(c.name)).toBe(true);
    }
    expect(io.out).toMatch(/^Checks of the written file \(23;/);
    expect(io.out).toContain('lie-factor                 blocking  lie-factor   Lie factor outside 0.95–1.05');
    expect(io.out).toContain('context-thin               advice    rule         Only two periods');
    expect(io.err).toBe('');
  });

  it('--json gives the same listing for scripts', async () => {
    const io = capture(tmp.dir);
    expect(await command.run(['--list', '--json'], io)).toBe(0);
    expect(JSON.parse(io.out)).toEqual({ checks: listChecks() });
  });

  it('refuses a chart document beside --list (exit 2)', async () => {
    const io = capture(tmp.dir);
    expect(await command.run(['--list', 'chart.json'], io)).toBe(2);
    expect(io.err).toMatch(/--list takes no chart document/);
  });
});
