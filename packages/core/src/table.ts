/**
 * One table model for every output: named columns with units, rows of values.
 * The CLI, `grid` and the validation report write CSV and JSON through it, so
 * every table has the same header convention: `name [unit]` in CSV, and
 * `{ name, unit, description }` column records in JSON.
 */
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

/** CSV header cell: `name [unit]`, or the bare name for unitless labels. */
export function headerCell(column: Column): string {
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
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** The header line of a table's CSV (no trailing newline). */
export function csvHeader(columns: readonly Column[]): string {
  return columns.map((c) => csvField(headerCell(c))).join(',');
}

/** One CSV line (no trailing newline). */
export function csvRow(row: readonly Cell[]): string {
  return row.map((v) => csvField(formatCell(v))).join(',');
}

/** A whole table as CSV text, header first, one trailing newline. */
export function toCsv(table: Table): string {
  return [csvHeader(table.columns), ...table.rows.map(csvRow)].join('\n') + '\n';
}

/** A whole table as a JSON-ready object: column records and row objects keyed by column name. */
export function toJsonTable(table: Table): { columns: Column[]; rows: Record<string, Cell>[] } {
  return {
    columns: table.columns.map((c) => ({ ...c })),
    rows: table.rows.map((row) => Object.fromEntries(table.columns.map((c, i) => [c.name, row[i] ?? null]))),
  };
}
