/** Entry point of the penumbra executable: dispatch, help, version and one-line errors. */
import { readFileSync } from 'node:fs';
import { ConvergenceError, InputError } from '@penumbra/kerr';
import { UsageError, type CliIO, type Command } from './command.js';
import { commands } from './commands/index.js';

export const EXIT_OK = 0;
export const EXIT_FAILURE = 1;
export const EXIT_USAGE = 2;
export const EXIT_NOT_CONVERGED = 3;

export const processIO: CliIO = {
  stdout: (text) => void process.stdout.write(text),
  stderr: (text) => void process.stderr.write(text),
};

export function version(): string {
  // src/ and dist/ both sit one level below package.json
  const pkg = JSON.parse(readFileSync(new URL('../package.json', import.meta.url), 'utf8')) as { version: string };
  return pkg.version;
}

export function topLevelHelp(): string {
  const width = Math.max(...commands.map((c) => c.name.length));
  return (
    'Usage: penumbra <command> [options]\n\n' +
    'Greybody factors of Kerr black holes from the Teukolsky equations.\n\n' +
    'Commands:\n' +
    commands.map((c) => `  ${c.name.padEnd(width)}  ${c.summary}`).join('\n') +
    '\n\nOptions:\n  -h, --help     this text; `penumbra <command> --help` for a command\n  -v, --version  print the version\n'
  );
}

const isHelp = (arg: string) => arg === '--help' || arg === '-h';

/** Runs one command line (without `node` and the script path) and returns the exit code. */
export async function main(argv: string[], io: CliIO = processIO): Promise<number> {
  const [first, ...rest] = argv;
  if (first === undefined) {
    io.stderr(topLevelHelp());
    return EXIT_USAGE;
  }
  if (first === '--version' || first === '-v') {
    io.stdout(`penumbra ${version()}\n`);
    return EXIT_OK;
  }
  if (isHelp(first) || first === 'help') {
    const topic = first === 'help' ? rest[0] : undefined;
    const command = topic === undefined ? undefined : findCommand(topic);
    if (topic !== undefined && !command) return report(io, new UsageError(unknownCommand(topic)));
    io.stdout(command ? commandHelp(command) : topLevelHelp());
    return EXIT_OK;
  }
  const command = findCommand(first);
  if (!command) return report(io, new UsageError(unknownCommand(first)));
  const beforeTerminator = rest.indexOf('--') === -1 ? rest : rest.slice(0, rest.indexOf('--'));
  if (beforeTerminator.some(isHelp)) {
    io.stdout(commandHelp(command));
    return EXIT_OK;
  }
  try {
    return await command.run(rest, io);
  } catch (error) {
    return report(io, error, command);
  }
}

function findCommand(name: string): Command | undefined {
  return commands.find((c) => c.name === name);
}

function unknownCommand(name: string): string {
  return `unknown command '${name}' (commands: ${commands.map((c) => c.name).join(', ')}; see 'penumbra --help')`;
}

function commandHelp(command: Command): string {
  return `penumbra ${command.name}: ${command.summary}\n\n${command.usage.endsWith('\n') ? command.usage : command.usage + '\n'}`;
}

/** Error classes are matched by name too, in case two copies of @penumbra/kerr are loaded. */
function isErrorNamed(error: unknown, name: string): error is Error {
  return error instanceof Error && error.name === name;
}

function report(io: CliIO, error: unknown, command?: Command): number {
  const message = oneLine(error instanceof Error ? error.message : String(error));
  if (process.env.PENUMBRA_DEBUG && error instanceof Error && error.stack) io.stderr(error.stack + '\n');
  if (error instanceof UsageError || isErrorNamed(error, 'UsageError')) {
    const hint = command ? ` (see 'penumbra ${command.name} --help')` : '';
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
