/**
 * The output directory of a grid run:
 *
 *   grid.json              the validated grid (its identity)
 *   chunks/chunk-NNNNNN.json  finished chunks, each written atomically
 *   modes.csv, cross-section.csv, spectra.csv, table.json
 *                          the assembled tables (tables.ts), written once every chunk exists
 *   run.json / run-shard-K-of-N.json   timing and worker counts (never compared)
 */
import { accessSync, constants, existsSync, mkdirSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { canonicalGridJson, GridError, gridHash, validateGrid, type GridSpec } from './grid.js';
import type { TaskResult } from './compute.js';
import { removeStaleTemporaries, writeFileAtomic } from './files.js';
import type { GridChunk } from './tasks.js';

/** The grid file of a run directory. */
export const GRID_FILE = 'grid.json';
/** The directory of the chunk files. */
export const CHUNK_DIR = 'chunks';
/** Written since the grid key `holeSpins` became `holeA`; format 1 files are still read. */
const GRID_FORMAT = 'penumbra-grid/2';
const READ_GRID_FORMATS = ['penumbra-grid/1', GRID_FORMAT];
/** Chunk rows are keyed by column name (`spin`, `status`, `message`, …); older chunks are recomputed. */
const CHUNK_FORMAT = 'penumbra-grid-chunk/2';

/** The text of grid.json. */
export function gridFileText(grid: GridSpec): string {
  return (
    JSON.stringify({ format: GRID_FORMAT, gridHash: gridHash(grid), grid: JSON.parse(canonicalGridJson(grid)) }, null, 2) + '\n'
  );
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
  if (!READ_GRID_FORMATS.includes(record?.format as string)) return `${path} is not a penumbra grid file`;
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
        problems.push(
          `${option} ${dir} already holds a different grid (grid ${gridHash(held)}, this one ${gridHash(grid)}); choose another directory or remove it`,
        );
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

/**
 * Creates the directory layout and grid.json. A grid.json of the same grid
 * in an older format is rewritten (outputDirProblems has checked it is the same grid).
 */
export function initOutputDir(dir: string, grid: GridSpec): void {
  mkdirSync(join(dir, CHUNK_DIR), { recursive: true });
  removeStaleTemporaries(dir);
  removeStaleTemporaries(join(dir, CHUNK_DIR));
  const path = join(dir, GRID_FILE);
  const text = gridFileText(grid);
  if (!existsSync(path) || readFileSync(path, 'utf8') !== text) writeFileAtomic(path, text);
}

/** The file name of chunk `index`. */
export const chunkFileName = (index: number) => `chunk-${String(index).padStart(6, '0')}.json`;

/** A chunk file: the task results of consecutive grid points. */
export interface ChunkFile {
  format: string;
  gridHash: string;
  chunk: number;
  tasks: [number, number];
  results: TaskResult[];
}

/** The text of a chunk file. */
export function chunkText(grid: GridSpec, chunk: GridChunk, results: TaskResult[]): string {
  const file: ChunkFile = {
    format: CHUNK_FORMAT,
    gridHash: gridHash(grid),
    chunk: chunk.index,
    tasks: [chunk.first, chunk.end],
    results,
  };
  return JSON.stringify(file) + '\n';
}

/** Writes a finished chunk atomically. */
export function writeChunk(dir: string, grid: GridSpec, chunk: GridChunk, results: TaskResult[]): void {
  writeFileAtomic(join(dir, CHUNK_DIR, chunkFileName(chunk.index)), chunkText(grid, chunk, results));
}

/** A finished chunk, or undefined if the file is missing or does not belong to this grid, chunk and format. */
export function readChunk(dir: string, grid: GridSpec, chunk: GridChunk): ChunkFile | undefined {
  const path = join(dir, CHUNK_DIR, chunkFileName(chunk.index));
  if (!existsSync(path)) return undefined;
  try {
    const file = JSON.parse(readFileSync(path, 'utf8')) as ChunkFile;
    const ok =
      file.format === CHUNK_FORMAT &&
      file.gridHash === gridHash(grid) &&
      file.chunk === chunk.index &&
      file.tasks?.[0] === chunk.first &&
      file.tasks?.[1] === chunk.end &&
      Array.isArray(file.results) &&
      file.results.length === chunk.end - chunk.first &&
      file.results.every((r, i) => r.index === chunk.first + i);
    return ok ? file : undefined;
  } catch {
    return undefined;
  }
}

// Transitional: plot.ts reads the table type from here until it moves to its own package.
export type { GridTable } from './plotView.js';
