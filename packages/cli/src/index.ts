export { type CliIO, type Command, type CommandEntry, UsageError } from './command.js';
export { commands } from './commands/index.js';
export { main, processIO, version, EXIT_OK, EXIT_FAILURE, EXIT_USAGE, EXIT_NOT_CONVERGED } from './main.js';
