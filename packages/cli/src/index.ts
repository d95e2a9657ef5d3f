export * from './command.js';
export * from './options.js';
export { commands } from './commands/index.js';
export { main, processIO, version, EXIT_OK, EXIT_FAILURE, EXIT_USAGE, EXIT_NOT_CONVERGED } from './main.js';
