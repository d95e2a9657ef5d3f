/**
 * Running a grid: check everything, then compute the pending chunks of this
 * shard on a piscina worker pool, write each chunk as it completes, and
 * assemble the tables once every chunk of the grid is in the directory.
 */
import { availableParallelism } from 'node:os';
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { computeTask, type TaskMessage, type TaskResult } from './compute.js';
import { GridError, gridHash, type GridSpec } from './grid.js';
import { writeFileAtomic } from './files.js';
import { initOutputDir, outputDirProblems, readChunk, writeChunk } from './store.js';
import { assembleTables, writeTables, type TableSummary } from './tables.js';
import { gridChunks, gridTasks, shardChunks, type GridChunk, type GridTask, type ShardSpec } from './tasks.js';

/** The worker is always the built file: src/ and dist/ both sit one level below the package root. */
export const WORKER_FILE = fileURLToPath(new URL('../dist/worker.js', import.meta.url));

/** Progress of a run, for `onProgress`. */
export interface Progress {
  doneTasks: number;
  totalTasks: number;
  /** estimated-cost fraction done, 0 … 1 */
  fraction: number;
  elapsedSeconds: number;
  /** seconds left, from the cost rate so far; undefined before the first task ends */
  etaSeconds: number | undefined;
}

/** What `runGrid` runs and where it reports. */
export interface RunOptions {
  grid: GridSpec;
  out: string;
  /** worker threads (default: every core); 0 computes in this thread, without a pool */
  workers?: number;
  shard?: ShardSpec;
  /** called after each task completes, with the progress of the run so far */
  onProgress?: (p: Progress) => void;
  /** called once before work starts */
  onStart?: (info: { chunks: number; skipped: number; pending: number; tasks: number }) => void;
}

/** What a run did. */
export interface RunSummary {
  gridHash: string;
  shard: ShardSpec;
  workers: number;
  chunksInShard: number;
  chunksSkipped: number;
  chunksComputed: number;
  tasksComputed: number;
  /** every chunk of the grid is in the directory and the tables were written */
  complete: boolean;
  /** chunks of the whole grid still missing in the directory */
  missingChunks: number;
  files: string[];
  summary: TableSummary | undefined;
  seconds: number;
}

/** Worker threads by default: every core. */
export function defaultWorkers(): number {
  return availableParallelism();
}

/** The message a worker receives for one task. */
export function taskMessage(grid: GridSpec, task: GridTask): TaskMessage {
  return {
    index: task.index,
    s: task.s,
    a: task.a,
    omega: task.omega,
    l: grid.l,
    tolerance: grid.tolerance,
    quantities: grid.quantities,
  };
}

/** Problems with the run options (beyond the grid itself), found without writing. */
export function runProblems(options: Pick<RunOptions, 'grid' | 'out' | 'workers'>): string[] {
  const problems = outputDirProblems(options.out, options.grid);
  const w = options.workers;
  if (w !== undefined && !(Number.isInteger(w) && w >= 0 && w <= 1024))
    problems.push(`workers: expected an integer from 0 to 1024, got ${w}`);
  if (options.workers !== 0 && !existsSync(WORKER_FILE))
    problems.push(`the worker ${WORKER_FILE} is not built; run \`npx tsc -b\` at the repository root`);
  return problems;
}

/**
 * Computes the pending chunks of one shard (default the whole grid) on a
 * worker pool, writes each chunk as it completes, and writes the tables once
 * every chunk of the grid is in `out`. Throws GridError before writing
 * anything if the run cannot start.
 */
export async function runGrid(options: RunOptions): Promise<RunSummary> {
  const { grid, out } = options;
  const shard = options.shard ?? { k: 1, n: 1 };
  const workers = options.workers ?? defaultWorkers();
  const problems = runProblems({ grid, out, workers });
  if (problems.length) throw new GridError(problems, 'cannot run the grid');
  const started = Date.now();

  const tasks = gridTasks(grid);
  const chunks = gridChunks(grid, tasks);
  const mine = shardChunks(chunks, shard).map((i) => chunks[i]);
  initOutputDir(out, grid);
  const pending = mine.filter((c) => readChunk(out, grid, c) === undefined);
  const pendingTasks = pending.reduce((n, c) => n + c.end - c.first, 0);
  options.onStart?.({ chunks: mine.length, skipped: mine.length - pending.length, pending: pending.length, tasks: pendingTasks });

  const totalCost = pending.reduce((sum, c) => sum + c.cost, 0);
  let doneCost = 0;
  let doneTasks = 0;
  const report = (cost: number) => {
    doneCost += cost;
    doneTasks++;
    const elapsedSeconds = (Date.now() - started) / 1000;
    const fraction = totalCost > 0 && doneTasks < pendingTasks ? Math.min(doneCost / totalCost, 1) : 1;
    options.onProgress?.({
      doneTasks,
      totalTasks: pendingTasks,
      fraction,
      elapsedSeconds,
      etaSeconds: fraction > 0 ? (elapsedSeconds * (1 - fraction)) / fraction : undefined,
    });
  };

  const pool =
    workers > 0 && pending.length > 0
      ? new (await loadPiscina())<TaskMessage, TaskResult>({
          filename: WORKER_FILE,
          minThreads: workers,
          maxThreads: workers,
          idleTimeout: 60_000,
        })
      : undefined;
  const compute = (m: TaskMessage): Promise<TaskResult> =>
    pool ? pool.run(m) : new Promise((ok) => setImmediate(() => ok(computeTask(m))));
  const chunkCost = (c: GridChunk) => c.cost / Math.max(1, c.end - c.first);
  try {
    // All tasks are queued at once in chunk order; the FIFO queue finishes chunks roughly in order.
    await Promise.all(
      pending.map(async (chunk) => {
        const jobs: Promise<TaskResult>[] = [];
        for (let i = chunk.first; i < chunk.end; i++) {
          jobs.push(
            compute(taskMessage(grid, tasks[i])).then((r) => {
              report(chunkCost(chunk));
              return r;
            }),
          );
        }
        const results = await Promise.all(jobs);
        writeChunk(out, grid, chunk, results);
      }),
    );
  } finally {
    await pool?.destroy();
  }

  // Shards sharing one directory: whichever finishes last finds every chunk and writes the tables.
  const all: TaskResult[] = [];
  let missing = 0;
  for (const chunk of chunks) {
    const file = readChunk(out, grid, chunk);
    if (file) all.push(...file.results);
    else missing++;
  }
  let files: string[] = [];
  let summary: TableSummary | undefined;
  if (missing === 0) {
    const assembled = assembleTables(grid, all);
    files = writeTables(out, assembled);
    summary = assembled.summary;
  }
  const seconds = (Date.now() - started) / 1000;
  const result: RunSummary = {
    gridHash: gridHash(grid),
    shard,
    workers,
    chunksInShard: mine.length,
    chunksSkipped: mine.length - pending.length,
    chunksComputed: pending.length,
    tasksComputed: pendingTasks,
    complete: missing === 0,
    missingChunks: missing,
    files,
    summary,
    seconds,
  };
  writeFileAtomic(
    join(out, runFileName(shard)),
    JSON.stringify(
      {
        kind: 'run',
        startedAt: new Date(started).toISOString(),
        seconds,
        workers,
        shard: `${shard.k}/${shard.n}`,
        chunksSkipped: result.chunksSkipped,
        chunksComputed: result.chunksComputed,
        tasksComputed: pendingTasks,
        tasksPerSecond: seconds > 0 ? pendingTasks / seconds : null,
        node: process.version,
      },
      null,
      2,
    ) + '\n',
  );
  return result;
}

/** The pool library, loaded only by a run that computes (not by merges, plots or a package import). */
async function loadPiscina() {
  return (await import('piscina')).Piscina;
}

/** Timing metadata lives apart from the tables, one file per shard. */
export function runFileName(shard: ShardSpec): string {
  return shard.n === 1 ? 'run.json' : `run-shard-${shard.k}-of-${shard.n}.json`;
}
