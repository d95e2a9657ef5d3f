/**
 * The output directory of a grid run:
 *
 *   grid.json              the validated grid (its identity)
 *   chunks/chunk-NNNNNN.json  finished chunks, each written atomically and closed by a checksum
 *   modes.csv, cross-section.csv, spectra.csv, table.json
 *                          the assembled tables (tables.ts), written once every chunk exists
 *   run.json / run-shard-K-of-N.json   timing and worker counts (never compared)
 */
import { accessSync, constants, existsSync, mkdirSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { sha256 } from '@noble/hashes/sha2.js';
import { bytesToHex, utf8ToBytes } from '@noble/hashes/utils.js';
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
/**
 * Chunk rows are keyed by column name (`spin`, `status`, `message`, …) and the
 * file ends in a sha256 of everything before it; older chunks are recomputed.
 */
const CHUNK_FORMAT = 'penumbra-grid-chunk/3';
/** The checksum closes the file: `…,"sha256":"<64 hex digits>"}` and a newline. */
const CHECKSUM_TAIL = /,"sha256":"([0-9a-f]{64})"\}\n$/;

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
  /** sha256 (hex) of the file text before the `"sha256"` key */
  sha256: string;
}

/** The text of a chunk file: its JSON on one line, closed by the sha256 of the text before the checksum key. */
export function chunkText(grid: GridSpec, chunk: GridChunk, results: TaskResult[]): string {
  const body = JSON.stringify({
    format: CHUNK_FORMAT,
    gridHash: gridHash(grid),
    chunk: chunk.index,
    tasks: [chunk.first, chunk.end],
    results,
  }).slice(0, -1);
  return `${body},"sha256":"${chunkChecksum(body)}"}\n`;
}

function chunkChecksum(body: string): string {
  return bytesToHex(sha256(utf8ToBytes(body)));
}

/** Writes a finished chunk atomically. */
export function writeChunk(dir: string, grid: GridSpec, chunk: GridChunk, results: TaskResult[]): void {
  writeFileAtomic(chunkPath(dir, chunk.index), chunkText(grid, chunk, results));
}

/** The path of chunk `index` in run directory `dir`. */
export const chunkPath = (dir: string, index: number) => join(dir, CHUNK_DIR, chunkFileName(index));

/**
 * What a chunk file holds: `missing` (no file), `old` (a readable chunk of an
 * older format, recomputed on resume), `corrupt` (fails its checksum, is cut
 * short, or belongs to another grid or chunk: `problem` says which), or `ok`
 * with the parsed file and its exact text.
 */
export type ChunkRead =
  | { status: 'missing'; path: string }
  | { status: 'old'; path: string; format: string }
  | { status: 'corrupt'; path: string; problem: string }
  | { status: 'ok'; path: string; file: ChunkFile; text: string };

/** Reads and verifies chunk `chunk` of `grid` in `dir` (see ChunkRead). */
export function inspectChunk(dir: string, grid: GridSpec, chunk: GridChunk): ChunkRead {
  const path = chunkPath(dir, chunk.index);
  if (!existsSync(path)) return { status: 'missing', path };
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (error) {
    return { status: 'corrupt', path, problem: `unreadable (${(error as Error).message})` };
  }
  const corrupt = (problem: string): ChunkRead => ({ status: 'corrupt', path, problem });
  const tail = CHECKSUM_TAIL.exec(text);
  if (!tail) {
    // A whole chunk of an older format (no checksum) is recomputed, not an error.
    const format = oldChunkFormat(text);
    if (format) return { status: 'old', path, format };
    return corrupt(text.endsWith('\n') ? 'no checksum at its end' : 'cut short (no trailing newline)');
  }
  const body = text.slice(0, tail.index);
  if (chunkChecksum(body) !== tail[1]) return corrupt('its sha256 checksum does not match its content');
  let file: ChunkFile;
  try {
    file = JSON.parse(`${body}}`) as ChunkFile;
  } catch {
    return corrupt('not valid JSON');
  }
  if (file.format !== CHUNK_FORMAT) return corrupt(`unknown format ${JSON.stringify(file.format)}`);
  if (file.gridHash !== gridHash(grid)) return corrupt(`belongs to grid ${file.gridHash}, not ${gridHash(grid)}`);
  const shaped =
    file.chunk === chunk.index &&
    file.tasks?.[0] === chunk.first &&
    file.tasks?.[1] === chunk.end &&
    Array.isArray(file.results) &&
    file.results.length === chunk.end - chunk.first &&
    file.results.every((r, i) => r?.index === chunk.first + i);
  if (!shaped) return corrupt(`does not hold tasks ${chunk.first}…${chunk.end - 1} of chunk ${chunk.index}`);
  return { status: 'ok', path, file, text };
}

function oldChunkFormat(text: string): string | undefined {
  try {
    const format = (JSON.parse(text) as { format?: unknown })?.format;
    return typeof format === 'string' && format.startsWith('penumbra-grid-chunk/') && format !== CHUNK_FORMAT
      ? format
      : undefined;
  } catch {
    return undefined;
  }
}

/** A verified chunk, or undefined if the file is missing, of an older format or corrupt. */
export function readChunk(dir: string, grid: GridSpec, chunk: GridChunk): ChunkFile | undefined {
  const read = inspectChunk(dir, grid, chunk);
  return read.status === 'ok' ? read.file : undefined;
}

// Transitional: plot.ts reads the table type from here until it moves to its own package.
export type { GridTable } from './plotView.js';
