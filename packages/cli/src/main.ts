/**
 * Entry point of the penumbra executable: dispatch, help, version and
 * one-line errors. It loads a command module only when that command runs (or
 * prints its own help), so `--version` and `--help` load no solver.
 */
import { readFileSync } from 'node:fs';
import { ConvergenceError, InputError } from '@penumbra/core';
import { UsageError, type CliIO, type Command, type CommandEntry } from './command.js';
import { commands } from './commands/index.js';
import { closest } from './options.js';

/** Exit code of a successful run. */
export const EXIT_OK = 0;
/** Exit code of an internal error (a bug). */
export const EXIT_FAILURE = 1;
/** Exit code of a malformed command line or an input outside the physics range. */
export const EXIT_USAGE = 2;
/** Exit code of a computation that did not reach its tolerance. */
export const EXIT_NOT_CONVERGED = 3;

/** The process's stdout and stderr. */
export const processIO: CliIO = {
  stdout: (text) => void process.stdout.write(text),
  stderr: (text) => void process.stderr.write(text),
};

/** The version of the cli package. */
export function version(): string {
  // src/ and dist/ both sit one level below package.json
  const pkg = JSON.parse(readFileSync(new URL('../package.json', import.meta.url), 'utf8')) as { version: string };
  return pkg.version;
}

function topLevelHelp(registry: readonly CommandEntry[]): string {
  const width = Math.max(...registry.map((c) => c.name.length));
  return (
    'Usage: penumbra <command> [options]\n\n' +
    'Greybody factors of Kerr black holes from the Teukolsky equations.\n\n' +
    'Commands:\n' +
    registry.map((c) => `  ${c.name.padEnd(width)}  ${c.summary}`).join('\n') +
    '\n\nOptions:\n  -h, --help     this text; `penumbra <command> --help` for a command\n  -v, --version  print the version\n'
  );
}

const isHelp = (arg: string) => arg === '--help' || arg === '-h';

/**
 * Runs one command line (without `node` and the script path) and returns the
 * exit code. `registry` is the list of commands (tests pass their own).
 */
export async function main(argv: string[], io: CliIO = processIO, registry: readonly CommandEntry[] = commands): Promise<number> {
  const [first, ...rest] = argv;
  if (first === undefined) {
    io.stderr(topLevelHelp(registry));
    return EXIT_USAGE;
  }
  if (first === '--version' || first === '-v') {
    io.stdout(`penumbra ${version()}\n`);
    return EXIT_OK;
  }
  if (isHelp(first) || first === 'help') {
    const topic = first === 'help' ? rest[0] : undefined;
    if (topic === undefined) {
      io.stdout(topLevelHelp(registry));
      return EXIT_OK;
    }
    const entry = registry.find((c) => c.name === topic);
    if (!entry) return report(io, new UsageError(unknownCommand(registry, topic)));
    io.stdout(commandHelp((await entry.load()).command));
    return EXIT_OK;
  }
  const entry = registry.find((c) => c.name === first);
  if (!entry) return report(io, new UsageError(unknownCommand(registry, first)));
  const beforeTerminator = rest.indexOf('--') === -1 ? rest : rest.slice(0, rest.indexOf('--'));
  try {
    const { command } = await entry.load();
    if (beforeTerminator.some(isHelp)) {
      io.stdout(commandHelp(command));
      return EXIT_OK;
    }
    return await command.run(rest, io);
  } catch (error) {
    return report(io, error, entry.name);
  }
}

function unknownCommand(registry: readonly CommandEntry[], name: string): string {
  const names = registry.map((c) => c.name);
  const near = closest(name, names);
  const hint = near === undefined ? '' : `; did you mean '${near}'?`;
  return `unknown command '${name}'${hint} (commands: ${names.join(', ')}; see 'penumbra --help')`;
}

function commandHelp(command: Command): string {
  return `penumbra ${command.name}: ${command.summary}\n\n${command.usage.endsWith('\n') ? command.usage : command.usage + '\n'}`;
}

/** Error classes are matched by name too, in case two copies of @penumbra/core are loaded. */
function isErrorNamed(error: unknown, name: string): error is Error {
  return error instanceof Error && error.name === name;
}

function report(io: CliIO, error: unknown, commandName?: string): number {
  const message = oneLine(error instanceof Error ? error.message : String(error));
  if (process.env.PENUMBRA_DEBUG && error instanceof Error && error.stack) io.stderr(error.stack + '\n');
  if (error instanceof UsageError || isErrorNamed(error, 'UsageError')) {
    const hint = commandName ? ` (see 'penumbra ${commandName} --help')` : '';
    io.stderr(`penumbra: ${message}${hint}\n`);
    return EXIT_USAGE;
  }
  if (error instanceof InputError || isErrorNamed(error, 'InputError')) {
    io.stderr(`penumbra: ${message}\n`);
    return EXIT_USAGE;
  }
  if (error instanceof ConvergenceError || isErrorNamed(error, 'ConvergenceError')) {
    io.stderr(`penumbra: not converged: ${message}\n`);
    return EXIT_NOT_CONVERGED;
  }
  io.stderr(`penumbra: internal error: ${message} (set PENUMBRA_DEBUG=1 for the stack trace)\n`);
  return EXIT_FAILURE;
}

function oneLine(text: string): string {
  return text.replace(/\s*\n\s*/g, ' ').trim();
}
