/**
 * One table model for every output: named columns with units, rows of values.
 * The CLI, `grid` and the validation report write CSV and JSON through it, so
 * every table has the same header convention: `name [unit]` in CSV, and
 * `{ name, unit, description }` column records in JSON.
 */
import { InputError, requireObject } from './errors.js';

/** A named column with its unit. */
export interface Column {
  /** machine name, camelCase, the same in CSV and JSON (e.g. `relError`) */
  readonly name: string;
  /** unit in words or symbols (`1/M`, `M^2`, `GeV`, `1` for dimensionless), or '' for labels */
  readonly unit: string;
  readonly description?: string;
}

/** One value of a table row; null is an empty cell. */
export type Cell = number | string | boolean | null;

/** Named columns with units, and rows with one cell per column. */
export interface Table {
  readonly columns: readonly Column[];
  readonly rows: readonly (readonly Cell[])[];
}

// The checks below guard callers outside TypeScript: each names the argument's path.
function checkColumn(column: unknown, parameter: string): Column {
  const c = requireObject(parameter, column, 'a column {name, unit, description?}');
  if (typeof c.name !== 'string') throw new InputError(`${parameter}.name`, 'a string', c.name);
  if (typeof c.unit !== 'string') throw new InputError(`${parameter}.unit`, 'a string', c.unit);
  if (c.description !== undefined && typeof c.description !== 'string')
    throw new InputError(`${parameter}.description`, 'a string', c.description);
  return column as Column;
}

function checkColumns(columns: unknown, parameter: string): readonly Column[] {
  if (!Array.isArray(columns)) throw new InputError(parameter, 'an array of columns', columns);
  for (const [i, c] of columns.entries()) checkColumn(c, `${parameter}[${i}]`);
  return columns;
}

const CELL = 'a number, string, boolean or null';

function checkRow(row: unknown, parameter: string): readonly Cell[] {
  if (!Array.isArray(row)) throw new InputError(parameter, 'an array of cells', row);
  row.forEach((v, i) => {
    if (v !== null && !['number', 'string', 'boolean'].includes(typeof v)) throw new InputError(`${parameter}[${i}]`, CELL, v);
  });
  return row;
}

function checkTable(table: unknown, parameter: string): Table {
  const t = requireObject(parameter, table, 'a table {columns, rows}');
  checkColumns(t.columns, `${parameter}.columns`);
  if (!Array.isArray(t.rows)) throw new InputError(`${parameter}.rows`, 'an array of rows', t.rows);
  for (const [i, r] of t.rows.entries()) checkRow(r, `${parameter}.rows[${i}]`);
  return table as Table;
}

/** CSV header cell: `name [unit]`, or the bare name for unitless labels. */
export function headerCell(column: Column): string {
  checkColumn(column, 'column');
  return column.unit ? `${column.name} [${column.unit}]` : column.name;
}

/** A number in CSV/JSON text: shortest round-trip form; non-finite values spelt out. */
export function formatCell(value: Cell): string {
  if (value === null) return '';
  if (typeof value === 'number')
    return Number.isNaN(value) ? 'NaN' : value === Infinity ? 'Infinity' : value === -Infinity ? '-Infinity' : String(value);
  return String(value);
}

/** Quote a CSV field where RFC 4180 needs it (comma, quote, CR or LF). */
export function csvField(text: string): string {
  if (typeof text !== 'string') throw new InputError('text', 'a string', text);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** The header line of a table's CSV (no trailing newline). */
export function csvHeader(columns: readonly Column[]): string {
  checkColumns(columns, 'columns');
  return columns.map((c) => csvField(headerCell(c))).join(',');
}

/** One CSV line (no trailing newline). */
export function csvRow(row: readonly Cell[]): string {
  checkRow(row, 'row');
  return row.map((v) => csvField(formatCell(v))).join(',');
}

/** A whole table as CSV text, header first, one trailing newline. */
export function toCsv(table: Table): string {
  checkTable(table, 'table');
  return [csvHeader(table.columns), ...table.rows.map(csvRow)].join('\n') + '\n';
}

/**
 * A whole table as a JSON-ready object: column records and row objects keyed
 * by column name. A non-finite number becomes null, as JSON.stringify writes it.
 */
export function toJsonTable(table: Table): { columns: Column[]; rows: Record<string, Cell>[] } {
  checkTable(table, 'table');
  const cell = (v: Cell | undefined): Cell => (v === undefined || (typeof v === 'number' && !Number.isFinite(v)) ? null : v);
  return {
    columns: table.columns.map((c) => ({ ...c })),
    rows: table.rows.map((row) => Object.fromEntries(table.columns.map((c, i) => [c.name, cell(row[i])]))),
  };
}
