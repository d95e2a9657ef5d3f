/**
 * The shape every penumbra command has. A command lives in
 * src/commands/<name>.ts as `export const command: Command` and is listed,
 * with its summary and a loader, in the registry src/commands/index.ts, so
 * that only the command called is loaded; main.ts does dispatch, `--help` and
 * error reporting.
 */

/** Where a command writes. Each call writes the text as given (include the trailing newline). */
export interface CliIO {
  /** Write results (the command's output proper). */
  stdout(text: string): void;
  /** Write errors, progress and notices, kept apart from results so stdout stays machine-readable. */
  stderr(text: string): void;
}

/** One command of the penumbra executable. */
export interface Command {
  /** the word after `penumbra` */
  name: string;
  /** one line for the command list of `penumbra --help` (the registry entry holds the same line) */
  summary: string;
  /** full help text printed by `penumbra <name> --help`: a "Usage:" line, then options */
  usage: string;
  /** `argv` is everything after the command name; `--help` never reaches it. Returns the exit code. */
  run(argv: string[], io: CliIO): Promise<number> | number;
}

/** A registry entry: what `penumbra --help` lists, and how to load the command only when it is called. */
export interface CommandEntry {
  /** the word after `penumbra` (the same as the loaded command's name) */
  name: string;
  /** one line for the command list of `penumbra --help` */
  summary: string;
  /** Import the command's module; called only when the command is run or its help is asked for. */
  load(): Promise<{ command: Command }>;
}

/** A malformed command line: printed as one line, exit code 2. */
export class UsageError extends Error {
  override readonly name = 'UsageError';
}
