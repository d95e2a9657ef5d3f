/**
 * The output directory of a grid run:
 *
 *   grid.json              the validated grid (its identity)
 *   chunks/chunk-NNNNNN.json  finished chunks, each written atomically
 *   modes.csv, cross-section.csv, spectra.csv, table.json
 *                          the assembled tables, written once every chunk exists
 *   run.json / run-shard-K-of-N.json   timing and worker counts (never compared)
 *
 * Every file is written to a temporary name and renamed into place, so a
 * killed run leaves either the old file or the complete new one.
 */
import { accessSync, closeSync, constants, existsSync, fsyncSync, mkdirSync, openSync, readdirSync, readFileSync, renameSync, statSync, unlinkSync, writeSync } from 'node:fs';
import { hostname } from 'node:os';
import { basename, dirname, join, resolve } from 'node:path';
import { canonicalGridJson, GridError, gridHash, validateGrid, type GridSpec } from './grid.js';
import type { TaskResult } from './compute.js';
import { gridTables, headerCell, TABLE_FILES, tableColumns, type Cell, type Row, type TableName } from './schema.js';
import type { GridChunk } from './tasks.js';

export const GRID_FILE = 'grid.json';
export const CHUNK_DIR = 'chunks';
export const TABLE_JSON = 'table.json';
const GRID_FORMAT = 'penumbra-grid/1';
const CHUNK_FORMAT = 'penumbra-grid-chunk/1';
const TABLE_FORMAT = 'penumbra-grid-table/1';

const tmpTag = `.tmp-${hostname().replace(/[^A-Za-z0-9_-]/g, '_')}-`;

/** Write-then-rename, with the data flushed to disk before the rename. */
export function writeFileAtomic(path: string, text: string): void {
  const tmp = join(dirname(path), `.${basename(path)}${tmpTag}${process.pid}`);
  const fd = openSync(tmp, 'w');
  try {
    writeSync(fd, text);
    fsyncSync(fd);
  } finally {
    closeSync(fd);
  }
  renameSync(tmp, path);
}

/** Removes temporary files of killed runs on this host (a live process's files are left alone). */
function removeStaleTemporaries(dir: string): void {
  if (!existsSync(dir)) return;
  for (const name of readdirSync(dir)) {
    const at = name.lastIndexOf(tmpTag);
    if (!name.startsWith('.') || at < 0) continue;
    const pid = Number(name.slice(at + tmpTag.length));
    if (!Number.isInteger(pid) || pid === process.pid || isAlive(pid)) continue;
    try {
      unlinkSync(join(dir, name));
    } catch {
      // another process got there first
    }
  }
}

function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}

export function gridFileText(grid: GridSpec): string {
  return JSON.stringify({ format: GRID_FORMAT, gridHash: gridHash(grid), grid: JSON.parse(canonicalGridJson(grid)) }, null, 2) + '\n';
}

/** Reads DIR/grid.json; a problem text if it is not a valid grid file. */
export function readGridFile(dir: string): GridSpec | string {
  const path = join(dir, GRID_FILE);
  let parsed: unknown;
  try {
    parsed = JSON.parse(readFileSync(path, 'utf8'));
  } catch (error) {
    return `${path} is not readable JSON (${(error as Error).message})`;
  }
  const record = parsed as { format?: unknown; grid?: unknown };
  if (record?.format !== GRID_FORMAT) return `${path} is not a penumbra grid file`;
  try {
    return validateGrid(record.grid);
  } catch (error) {
    return `${path} holds an invalid grid (${error instanceof GridError ? error.problems.join('; ') : String(error)})`;
  }
}

/**
 * Problems that stop `dir` from receiving the output of `grid`, found without
 * writing anything: not a directory, a different grid already there, a
 * non-empty foreign directory, no write permission.
 */
export function outputDirProblems(dir: string, grid: GridSpec | undefined, option = '--out'): string[] {
  const problems: string[] = [];
  const path = resolve(dir);
  if (existsSync(path)) {
    if (!statSync(path).isDirectory()) return [`${option} ${dir} exists and is not a directory`];
    if (existsSync(join(path, GRID_FILE))) {
      const held = readGridFile(path);
      if (typeof held === 'string') problems.push(`${option} ${dir}: ${held}`);
      else if (grid && canonicalGridJson(held) !== canonicalGridJson(grid)) {
        problems.push(`${option} ${dir} already holds a different grid (grid ${gridHash(held)}, this one ${gridHash(grid)}); choose another directory or remove it`);
      }
    } else if (readdirSync(path).length > 0) {
      problems.push(`${option} ${dir} exists, is not empty and holds no ${GRID_FILE}; choose an empty or new directory`);
    }
    if (!writable(path)) problems.push(`${option} ${dir} is not writable`);
    return problems;
  }
  let ancestor = dirname(path);
  while (!existsSync(ancestor)) ancestor = dirname(ancestor);
  if (!statSync(ancestor).isDirectory()) problems.push(`${option} ${dir} cannot be created: ${ancestor} is not a directory`);
  else if (!writable(ancestor)) problems.push(`${option} ${dir} cannot be created: ${ancestor} is not writable`);
  return problems;
}

function writable(path: string): boolean {
  try {
    accessSync(path, constants.W_OK | constants.X_OK);
    return true;
  } catch {
    return false;
  }
}

/** Creates the directory layout and grid.json (kept if already there). */
export function initOutputDir(dir: string, grid: GridSpec): void {
  mkdirSync(join(dir, CHUNK_DIR), { recursive: true });
  removeStaleTemporaries(dir);
  removeStaleTemporaries(join(dir, CHUNK_DIR));
  if (!existsSync(join(dir, GRID_FILE))) writeFileAtomic(join(dir, GRID_FILE), gridFileText(grid));
}

export const chunkFileName = (index: number) => `chunk-${String(index).padStart(6, '0')}.json`;

export interface ChunkFile {
  format: string;
  gridHash: string;
  chunk: number;
  tasks: [number, number];
  results: TaskResult[];
}

export function chunkText(grid: GridSpec, chunk: GridChunk, results: TaskResult[]): string {
  const file: ChunkFile = { format: CHUNK_FORMAT, gridHash: gridHash(grid), chunk: chunk.index, tasks: [chunk.first, chunk.end], results };
  return JSON.stringify(file) + '\n';
}

export function writeChunk(dir: string, grid: GridSpec, chunk: GridChunk, results: TaskResult[]): void {
  writeFileAtomic(join(dir, CHUNK_DIR, chunkFileName(chunk.index)), chunkText(grid, chunk, results));
}

/** A finished chunk, or undefined if the file is missing or does not belong to this grid and chunk. */
export function readChunk(dir: string, grid: GridSpec, chunk: GridChunk): ChunkFile | undefined {
  const path = join(dir, CHUNK_DIR, chunkFileName(chunk.index));
  if (!existsSync(path)) return undefined;
  try {
    const file = JSON.parse(readFileSync(path, 'utf8')) as ChunkFile;
    const ok = file.format === CHUNK_FORMAT && file.gridHash === gridHash(grid) && file.chunk === chunk.index
      && file.tasks?.[0] === chunk.first && file.tasks?.[1] === chunk.end && Array.isArray(file.results)
      && file.results.length === chunk.end - chunk.first && file.results.every((r, i) => r.index === chunk.first + i);
    return ok ? file : undefined;
  } catch {
    return undefined;
  }
}

function csvCell(value: Cell): string {
  if (value === null) return '';
  const text = typeof value === 'number' ? String(value) : value;
  return /[",\r\n]/.test(text) || text !== text.trim() ? `"${text.replace(/"/g, '""')}"` : text;
}

export function csvText(grid: GridSpec, table: TableName, rows: readonly Row[]): string {
  const columns = tableColumns(grid, table);
  const lines = [columns.map((c) => csvCell(headerCell(c))).join(',')];
  for (const row of rows) lines.push(columns.map((c) => csvCell(row[c.key] ?? null)).join(','));
  return lines.join('\n') + '\n';
}

export interface FailureNote {
  table: TableName;
  s: number;
  a: number;
  omega: number;
  l?: number;
  m?: number;
  failure: string;
}

export interface TableSummary {
  points: number;
  rows: Partial<Record<TableName, number>>;
  failed: Partial<Record<TableName, number>>;
  failures: FailureNote[];
}

export interface AssembledTables {
  files: { name: string; text: string }[];
  summary: TableSummary;
}

/** The table files of a complete grid, from its task results in task order. Pure: equal inputs give equal bytes. */
export function assembleTables(grid: GridSpec, results: readonly TaskResult[]): AssembledTables {
  const tables = gridTables(grid);
  const summary: TableSummary = { points: results.length, rows: {}, failed: {}, failures: [] };
  const files: { name: string; text: string }[] = [];
  const jsonTables: string[] = [];
  for (const table of tables) {
    const rows: Row[] = [];
    for (const result of results) for (const row of result.rows[table] ?? []) rows.push(row);
    const failed = rows.filter((r) => r.status !== 'ok');
    summary.rows[table] = rows.length;
    summary.failed[table] = failed.length;
    for (const r of failed) {
      const note: FailureNote = { table, s: r.s as number, a: r.a as number, omega: r.omega as number, failure: String(r.failure) };
      if (table === 'modes') Object.assign(note, { l: r.l as number, m: r.m as number });
      summary.failures.push(note);
    }
    files.push({ name: TABLE_FILES[table], text: csvText(grid, table, rows) });
    const columns = JSON.stringify(tableColumns(grid, table));
    const rowLines = rows.map((r) => '      ' + JSON.stringify(r)).join(',\n');
    jsonTables.push(`    ${JSON.stringify(table)}: {\n      "file": ${JSON.stringify(TABLE_FILES[table])},\n      "columns": ${columns},\n      "rows": [\n${rowLines}\n      ]\n    }`);
  }
  const head = {
    format: TABLE_FORMAT,
    gridHash: gridHash(grid),
    units: 'geometric: G = c = ħ = 1, hole mass M = 1 (a in M, ω in 1/M, σ in M²)',
    grid: JSON.parse(canonicalGridJson(grid)),
    summary,
  };
  const headText = JSON.stringify(head, null, 2);
  const json = headText.slice(0, -2) + `,\n  "tables": {\n${jsonTables.join(',\n')}\n  }\n}\n`;
  files.push({ name: TABLE_JSON, text: json });
  return { files, summary };
}

export function writeTables(dir: string, assembled: AssembledTables): string[] {
  for (const file of assembled.files) writeFileAtomic(join(dir, file.name), file.text);
  return assembled.files.map((f) => join(dir, f.name));
}

export interface GridTable {
  format: string;
  gridHash: string;
  units: string;
  grid: unknown;
  summary: TableSummary;
  tables: Partial<Record<TableName, { file: string; columns: { key: string; unit: string; description: string }[]; rows: Row[] }>>;
}

/** Reads table.json from a file path or a run directory. */
export function readTable(path: string): GridTable {
  const file = existsSync(path) && statSync(path).isDirectory() ? join(path, TABLE_JSON) : path;
  const parsed = JSON.parse(readFileSync(file, 'utf8')) as GridTable;
  if (parsed?.format !== TABLE_FORMAT) throw new Error(`${file} is not a penumbra grid table`);
  return parsed;
}
