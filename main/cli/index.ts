// Entry of `tallyglyph <command>`: finds the command, runs it, turns errors into one plain line.
import fs from 'node:fs';
import { pathToFileURL } from 'node:url';
import { isTallyError } from '../../shared-core/errors';
import { EXIT, type CliCommand, type CliIO } from './types';

/** Known commands, in the order the help lists them. Each lives in ./commands/<name>.ts. */
export const COMMAND_NAMES = ['render', 'verify', 'check', 'demo', 'glyph', 'audit', 'correct', 'sheet'] as const;

export async function loadCommand(name: string): Promise<CliCommand | null> {
  if (!(COMMAND_NAMES as readonly string[]).includes(name)) return null;
  try {
    const mod = (await import(`./commands/${name}.ts`)) as { command: CliCommand };
    return mod.command;
  } catch (e) {
    if (e && typeof e === 'object' && 'code' in e && (e as { code: string }).code === 'ERR_MODULE_NOT_FOUND' && String((e as unknown as Error).message).includes(`commands/${name}`)) return null;
    throw e;
  }
}

const HELP_USAGE = `Usage: tallyglyph help [<command>]

Without a command, lists every command with one line on what it does. With one, prints that
command's options; \`tallyglyph <command> --help\` does the same.
\`tallyglyph --version\` prints the version.

Exit status: 0 help was printed, 2 the command is unknown.
`;

/** The version in package.json, the one npm installs and publishes. */
export function cliVersion(): string {
  const pkg = JSON.parse(fs.readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version?: unknown };
  return typeof pkg.version === 'string' ? pkg.version : 'unknown';
}

async function helpText(): Promise<string> {
  const lines = ['Tallyglyph: honest pictogram and unit charts, checked before they leave the building.', '', 'Usage: tallyglyph <command> [options]', '', 'Commands:'];
  for (const name of COMMAND_NAMES) {
    const cmd = await loadCommand(name);
    if (cmd) lines.push(`  ${name.padEnd(9)} ${cmd.summary}`);
  }
  lines.push('', 'Run `tallyglyph help <command>` for a command\'s options, `tallyglyph --version` for the version.');
  return lines.join('\n') + '\n';
}

export async function main(argv: string[], io: CliIO): Promise<number> {
  const [name, ...rest] = argv;
  if (name === '--version' || name === '-V') {
    io.stdout(`tallyglyph ${cliVersion()}\n`);
    return EXIT.ok;
  }
  if (!name || name === '--help' || name === '-h' || name === 'help') {
    if (name === 'help' && rest[0] === 'help') {
      io.stdout(HELP_USAGE);
      return EXIT.ok;
    }
    if (name === 'help' && rest[0]) {
      const cmd = await loadCommand(rest[0]);
      if (!cmd) {
        io.stderr(`tallyglyph: unknown command "${rest[0]}".\n`);
        return EXIT.usage;
      }
      io.stdout(cmd.usage.endsWith('\n') ? cmd.usage : cmd.usage + '\n');
      return EXIT.ok;
    }
    io.stdout(await helpText());
    return name ? EXIT.ok : EXIT.usage;
  }
  const cmd = await loadCommand(name);
  if (!cmd) {
    io.stderr(`tallyglyph: unknown command "${name}". Try one of: ${COMMAND_NAMES.join(', ')}.\n`);
    return EXIT.usage;
  }
  if (rest.includes('--help') || rest.includes('-h')) {
    io.stdout(cmd.usage.endsWith('\n') ? cmd.usage : cmd.usage + '\n');
    return EXIT.ok;
  }
  try {
    return await cmd.run(rest, io);
  } catch (e) {
    if (isTallyError(e)) {
      io.stderr(`tallyglyph ${name}: ${e.message}\n`);
      return e.code === 'gate-refused' ? EXIT.refused : EXIT.usage;
    }
    if (e && typeof e === 'object' && 'code' in e && String((e as { code: unknown }).code).startsWith('ERR_PARSE_ARGS')) {
      io.stderr(`tallyglyph ${name}: ${(e as unknown as Error).message}\n${cmd.usage}\n`);
      return EXIT.usage;
    }
    io.stderr(`tallyglyph ${name}: unexpected failure: ${e instanceof Error ? e.message : String(e)}\n`);
    return EXIT.failure;
  }
}

const isEntry = process.argv[1] && (import.meta.url === pathToFileURL(process.argv[1]).href || process.argv[1].endsWith('tallyglyph.js') || process.argv[1].endsWith('tallyglyph'));
if (isEntry) {
  const io: CliIO = { stdout: (s) => process.stdout.write(s), stderr: (s) => process.stderr.write(s), cwd: process.cwd() };
  main(process.argv.slice(2), io).then(
    (code) => {
      process.exitCode = code;
    },
    (e: unknown) => {
      // Only a command module that fails to load gets here; still one line, no stack trace.
      process.stderr.write(`tallyglyph: unexpected failure: ${e instanceof Error ? e.message : String(e)}\n`);
      process.exitCode = EXIT.failure;
    },
  );
}
