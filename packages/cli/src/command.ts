/**
 * The shape every penumbra command has. A command lives in
 * src/commands/<name>.ts as `export const command: Command` and is listed in
 * src/commands/index.ts; main.ts does dispatch, `--help` and error reporting.
 */

/** Where a command writes. Each call writes the text as given (include the trailing newline). */
export interface CliIO {
  stdout(text: string): void;
  stderr(text: string): void;
}

export interface Command {
  /** the word after `penumbra` */
  name: string;
  /** one line for the command list of `penumbra --help` */
  summary: string;
  /** full help text printed by `penumbra <name> --help`: a "Usage:" line, then options */
  usage: string;
  /** `argv` is everything after the command name; `--help` never reaches it. Returns the exit code. */
  run(argv: string[], io: CliIO): Promise<number> | number;
}

/** A malformed command line: printed as one line, exit code 2. */
export class UsageError extends Error {
  override readonly name = 'UsageError';
}
