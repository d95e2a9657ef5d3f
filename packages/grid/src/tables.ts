/**
 * The assembled tables of a complete grid: one CSV file per table and
 * table.json, all through core's table model (`toCsv`, `toJsonTable`), so the
 * CSV header `relError [1]` and the JSON key `relError` are one name.
 */
import { existsSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { toCsv, toJsonTable, type Column } from '@penumbra/core';
import { MASSIVE_VECTOR_KERR_APPROXIMATION } from '@penumbra/emission';
import { canonicalGridJson, gridHash, type GridSpec } from './grid.js';
import type { TaskResult } from './compute.js';
import { writeFileAtomic } from './files.js';
import { gridTable, gridTables, TABLE_FILES, type Row, type RowStatus, type TableName } from './schema.js';

/** The JSON file of the assembled tables. */
export const TABLE_JSON = 'table.json';
/** Columns are `{ name, unit, description }`, rows keyed by column name, statuses core's. */
const TABLE_FORMAT = 'penumbra-grid-table/2';

/** A row that holds no numbers, as listed in the summary. */
export interface FailureNote {
  table: TableName;
  /** species grids only */
  species?: string;
  spin: number;
  /** grids with massive fields or species only: Mμ */
  fieldMass?: number;
  a: number;
  omega: number;
  l?: number;
  m?: number;
  status: Exclude<RowStatus, 'success'>;
  message: string;
}

/** Row counts and failures of the assembled tables. */
export interface TableSummary {
  points: number;
  rows: Partial<Record<TableName, number>>;
  failed: Partial<Record<TableName, number>>;
  failures: FailureNote[];
}

/** The files of the assembled tables, with their summary. */
export interface AssembledTables {
  files: { name: string; text: string }[];
  summary: TableSummary;
}

/** table.json as written. */
export interface TableFile {
  format: string;
  gridHash: string;
  units: string;
  grid: unknown;
  /** approximations behind some of the numbers (massive vector spectra on a spinning hole); absent when none */
  approximations?: string[];
  summary: TableSummary;
  tables: Partial<Record<TableName, { file: string; columns: Column[]; rows: Row[] }>>;
}

/** The CSV text of one table. */
export function tableCsv(grid: GridSpec, table: TableName, rows: readonly Row[]): string {
  return toCsv(gridTable(grid, table, rows));
}

/** The table files of a complete grid, from its task results in task order. Pure: equal inputs give equal bytes. */
export function assembleTables(grid: GridSpec, results: readonly TaskResult[]): AssembledTables {
  const summary: TableSummary = { points: results.length, rows: {}, failed: {}, failures: [] };
  const files: { name: string; text: string }[] = [];
  const jsonTables: string[] = [];
  for (const name of gridTables(grid)) {
    const rows: Row[] = [];
    for (const result of results) for (const row of result.rows[name] ?? []) rows.push(row);
    const failed = rows.filter((r) => r.status !== 'success');
    summary.rows[name] = rows.length;
    summary.failed[name] = failed.length;
    for (const r of failed) {
      const note = { table: name } as FailureNote;
      if ('species' in r) note.species = r.species as string;
      note.spin = r.spin as number;
      if ('fieldMass' in r) note.fieldMass = r.fieldMass as number;
      Object.assign(note, {
        a: r.a as number,
        omega: r.omega as number,
        status: r.status as FailureNote['status'],
        message: String(r.message),
      });
      if (name === 'modes') Object.assign(note, { l: r.l as number, m: r.m as number });
      summary.failures.push(note);
    }
    const table = gridTable(grid, name, rows);
    files.push({ name: TABLE_FILES[name], text: toCsv(table) });
    const json = toJsonTable(table);
    const rowLines = json.rows.map((r) => '      ' + JSON.stringify(r)).join(',\n');
    jsonTables.push(
      `    ${JSON.stringify(name)}: {\n      "file": ${JSON.stringify(TABLE_FILES[name])},\n      "columns": ${JSON.stringify(json.columns)},\n      "rows": [\n${rowLines}\n      ]\n    }`,
    );
  }
  const head = {
    format: TABLE_FORMAT,
    gridHash: gridHash(grid),
    units: 'geometric: G = c = ħ = 1, hole mass M = 1 (a in M, ω in 1/M, σ in M²)',
    grid: JSON.parse(canonicalGridJson(grid)),
    ...approximationsOf(grid),
    summary,
  };
  const headText = JSON.stringify(head, null, 2);
  const json = headText.slice(0, -2) + `,\n  "tables": {\n${jsonTables.join(',\n')}\n  }\n}\n`;
  files.push({ name: TABLE_JSON, text: json });
  return { files, summary };
}

/**
 * The approximations behind a table's numbers, named in table.json (absent when
 * none): a massive vector's spectra on a spinning hole are emission's
 * approximation, not an exact solve (its modes and cross-sections are refused there).
 */
function approximationsOf(grid: GridSpec): { approximations?: string[] } {
  const vector = grid.fields.some((f) => f.spin === 1 && f.mass > 0);
  const spinning = grid.holeA.some((a) => a !== 0);
  return vector && spinning && grid.quantities.includes('spectra')
    ? { approximations: [`spectra: ${MASSIVE_VECTOR_KERR_APPROXIMATION}`] }
    : {};
}

/** Writes the assembled files into `dir`; returns their paths. */
export function writeTables(dir: string, assembled: AssembledTables): string[] {
  for (const file of assembled.files) writeFileAtomic(join(dir, file.name), file.text);
  return assembled.files.map((f) => join(dir, f.name));
}

/** Reads table.json from a file path or a run directory. */
export function readTableFile(path: string): TableFile {
  const file = existsSync(path) && statSync(path).isDirectory() ? join(path, TABLE_JSON) : path;
  const parsed = JSON.parse(readFileSync(file, 'utf8')) as TableFile;
  if (parsed?.format !== TABLE_FORMAT) throw new Error(`${file} is not a penumbra grid table (format ${TABLE_FORMAT})`);
  return parsed;
}
