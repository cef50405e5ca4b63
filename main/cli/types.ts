// The contract every command-line command implements; the dispatcher loads commands lazily.

export interface CliIO {
  stdout(s: string): void;
  stderr(s: string): void;
  /** Folder relative paths are resolved against. */
  cwd: string;
}

export interface CliCommand {
  name: string;
  /** One line for the command list. */
  summary: string;
  /** Usage text shown by `tallyglyph help <command>` and on usage errors. */
  usage: string;
  /** Returns the process exit code: 0 success, 1 refused or failed check, 2 usage or input error, 3 unexpected failure. */
  run(argv: string[], io: CliIO): Promise<number>;
}

export const EXIT = { ok: 0, refused: 1, usage: 2, failure: 3 } as const;
