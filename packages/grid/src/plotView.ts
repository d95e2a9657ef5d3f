/**
 * Transitional: the table as the figure code (plot.ts, moving to its own
 * package) still reads it, in the names of table format 1 — columns with a
 * `key`, the field spin as `s`, a converged row's status `ok`. Drop this file
 * once the figure code reads `readTableFile` (`name`, `spin`, `success`).
 */
import type { TableSummary } from './tables.js';
import { readTableFile, type TableFile } from './tables.js';
import type { Row, TableName } from './schema.js';

/** A grid table in the names the figure code reads (see `readTable`). */
export interface GridTable {
  format: string;
  gridHash: string;
  units: string;
  grid: unknown;
  summary: TableSummary;
  tables: Partial<
    Record<TableName, { file: string; columns: { key: string; unit: string; description: string }[]; rows: Row[] }>
  >;
}

/** The figure code's view of a table file. */
export function plotView(file: TableFile): GridTable {
  const tables: GridTable['tables'] = {};
  for (const [name, table] of Object.entries(file.tables) as [TableName, NonNullable<TableFile['tables'][TableName]>][]) {
    tables[name] = {
      file: table.file,
      columns: table.columns.map((c) => ({
        key: c.name === 'spin' ? 's' : c.name,
        unit: c.unit,
        description: c.description ?? '',
      })),
      rows: table.rows.map(({ spin, status, ...rest }) => ({ s: spin, ...rest, status: status === 'success' ? 'ok' : status })),
    };
  }
  return { ...file, tables };
}

/**
 * Reads table.json (a file path or a run directory) for `plotTable`.
 * Transitional: other readers use `readTableFile`, which gives the file as written.
 */
export function readTable(path: string): GridTable {
  return plotView(readTableFile(path));
}
