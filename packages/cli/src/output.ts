/**
 * Machine and text output of the commands, chosen once per command line:
 * `--json`, `--csv` or text (the default). Every CSV goes through core's
 * table model, so CSV headers (`relError [1]`) and JSON keys (`relError`)
 * are the same camelCase names everywhere.
 */
import { toCsv, type Table } from '@penumbra/core';
import { UsageError, type CliIO } from './command.js';

/** The three ways a command writes its result. */
export type OutputFormat = 'text' | 'json' | 'csv';

/** Option config of a command that writes text or JSON: spread it into parseOptions. */
export const JSON_OPTION = { json: { type: 'boolean' } } as const;

/** Option config of a command that writes text, JSON or CSV: spread it into parseOptions. */
export const OUTPUT_OPTIONS = { json: { type: 'boolean' }, csv: { type: 'boolean' } } as const;

/** The output format of parsed options; `--json` with `--csv` is a UsageError. */
export function outputFormat(values: { json?: boolean; csv?: boolean }): OutputFormat {
  if (values.json && values.csv) throw new UsageError('choose one of --json and --csv');
  return values.json ? 'json' : values.csv ? 'csv' : 'text';
}

/** How a command's result looks in each format; only the chosen one is built. */
export interface Output {
  /** Build the text output (the default format). */
  text(): string;
  /** Build the value written as the `--json` document. */
  json(): unknown;
  /** required when the command accepts --csv */
  csv?(): Table;
}

/** Writes the result in the chosen format. */
export function writeOutput(io: CliIO, format: OutputFormat, output: Output): void {
  if (format === 'json') writeJson(io, output.json());
  else if (format === 'csv') {
    if (!output.csv) throw new Error('this command has no CSV output');
    writeCsv(io, output.csv());
  } else io.stdout(output.text());
}

/** Write one JSON document (two-space indent) and a newline. */
export function writeJson(io: CliIO, value: unknown): void {
  io.stdout(JSON.stringify(value, null, 2) + '\n');
}

/** Write a table as CSV with `name [unit]` headers (core's toCsv). */
export function writeCsv(io: CliIO, table: Table): void {
  io.stdout(toCsv(table));
}
