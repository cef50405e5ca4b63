// Running the command line in tests: in-process with a capturing CliIO, or as a real Node process.
import { spawnSync, type SpawnSyncReturns } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import type { CliIO } from '../../main/cli/types';

/** A CliIO working in `cwd` that keeps what the command prints. */
export function capture(cwd: string): CliIO & { out: string; err: string } {
  const io = { out: '', err: '', cwd, stdout: (s: string) => void (io.out += s), stderr: (s: string) => void (io.err += s) };
  return io;
}

/** The command as a user runs it. */
export const TALLYGLYPH_BIN = fileURLToPath(new URL('../../bin/tallyglyph.js', import.meta.url));

/** Runs `node bin/tallyglyph.js ...args` in a child process. */
export function runTallyglyph(args: readonly string[], timeoutMs = 60_000): SpawnSyncReturns<string> {
  return spawnSync(process.execPath, [TALLYGLYPH_BIN, ...args], { encoding: 'utf8', timeout: timeoutMs });
}
