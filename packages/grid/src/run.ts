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
import { GridError, gridHash, hasFieldMasses, type GridSpec } from './grid.js';
import { writeFileAtomic } from './files.js';
import { initOutputDir, inspectChunk, outputDirProblems, readChunk, writeChunk } from './store.js';
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
  /**
   * seconds left, from the cost rate since the first task ended (worker start-up
   * left out); undefined until enough tasks have ended to measure a rate
   * (twice the workers, and at least 5 % of the tasks)
   */
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
  /** called for each chunk file found corrupt, before it is recomputed */
  onCorruptChunk?: (info: { path: string; problem: string }) => void;
  /** stops the run: no task is started and no chunk written after it fires; runGrid then rejects */
  signal?: AbortSignal;
  /** computes one task instead of the worker pool (tests use it to finish tasks out of order) */
  compute?: (message: TaskMessage) => Promise<TaskResult>;
}

/** What a run did. */
export interface RunSummary {
  gridHash: string;
  shard: ShardSpec;
  workers: number;
  chunksInShard: number;
  chunksSkipped: number;
  chunksComputed: number;
  /** chunk files of this shard that failed verification and were recomputed */
  chunksCorrupt: number;
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
    // Only grids whose rows carry the mass and the species hand them on: older grids keep their bytes.
    ...(hasFieldMasses(grid) ? { fieldMass: task.mass } : {}),
    ...(task.species ? { species: { name: task.species.name, dof: task.species.dof } } : {}),
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
  let corrupt = 0;
  const pending = mine.filter((c) => {
    const read = inspectChunk(out, grid, c);
    if (read.status === 'corrupt') {
      corrupt++;
      options.onCorruptChunk?.({ path: read.path, problem: read.problem });
    }
    return read.status !== 'ok';
  });
  const pendingTasks = pending.reduce((n, c) => n + c.end - c.first, 0);
  options.onStart?.({ chunks: mine.length, skipped: mine.length - pending.length, pending: pending.length, tasks: pendingTasks });

  const totalCost = pending.reduce((sum, c) => sum + c.cost, 0);
  let doneCost = 0;
  let doneTasks = 0;
  // The first task's end marks the start of the rate: before it, worker start-up and module
  // loading dominate, and an ETA from the first few tasks read minutes for a 15 s run.
  let firstEnd: { seconds: number; fraction: number } | undefined;
  const tasksBeforeEta = Math.max(2 * Math.max(1, workers), Math.ceil(0.05 * pendingTasks));
  const report = (cost: number) => {
    doneCost += cost;
    doneTasks++;
    const elapsedSeconds = (Date.now() - started) / 1000;
    const fraction = totalCost > 0 && doneTasks < pendingTasks ? Math.min(doneCost / totalCost, 1) : 1;
    firstEnd ??= { seconds: elapsedSeconds, fraction };
    const measured = fraction - firstEnd.fraction;
    options.onProgress?.({
      doneTasks,
      totalTasks: pendingTasks,
      fraction,
      elapsedSeconds,
      etaSeconds:
        fraction === 1
          ? 0
          : doneTasks >= tasksBeforeEta && measured > 0
            ? ((elapsedSeconds - firstEnd.seconds) * (1 - fraction)) / measured
            : undefined,
    });
  };

  const pool =
    !options.compute && workers > 0 && pending.length > 0
      ? new (await loadPiscina())<TaskMessage, TaskResult>({
          filename: WORKER_FILE,
          minThreads: workers,
          maxThreads: workers,
          idleTimeout: 60_000,
        })
      : undefined;
  const compute =
    options.compute ??
    ((m: TaskMessage): Promise<TaskResult> => (pool ? pool.run(m) : new Promise((ok) => setImmediate(() => ok(computeTask(m))))));
  try {
    await computeChunks(pending, Math.max(1, workers) * IN_FLIGHT_PER_WORKER, {
      start: (i) => compute(taskMessage(grid, tasks[i])),
      chunkDone: (chunk, results) => writeChunk(out, grid, chunk, results),
      taskDone: (chunk) => report(chunk.cost / Math.max(1, chunk.end - chunk.first)),
      signal: options.signal,
    });
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
    chunksCorrupt: corrupt,
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
        chunksCorrupt: corrupt,
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

/**
 * Tasks handed to the pool ahead of the free workers: enough to keep every
 * worker busy, few enough that tasks finish close to task order, so chunks
 * complete (and are written) steadily instead of all near the end.
 */
const IN_FLIGHT_PER_WORKER = 2;

/** How computeChunks starts tasks and reports finished ones. */
interface ChunkCallbacks {
  /** starts task `task` (its grid index) */
  start: (task: number) => Promise<TaskResult>;
  /** called once per chunk, as soon as every task of it has finished, in whatever order they finished */
  chunkDone: (chunk: GridChunk, results: TaskResult[]) => void;
  /** called after each finished task (after `chunkDone` if it completed its chunk) */
  taskDone: (chunk: GridChunk) => void;
  /** stops new work once aborted */
  signal: AbortSignal | undefined;
}

/**
 * Runs the tasks of `chunks` in task order with at most `window` in flight,
 * keeping per chunk the count of tasks still running, so each chunk is handed
 * to `chunkDone` the moment its last task finishes. The first failure or an
 * abort stops new work; tasks still running are awaited but their results dropped.
 */
function computeChunks(chunks: readonly GridChunk[], window: number, on: ChunkCallbacks): Promise<void> {
  const queue: { chunk: GridChunk; slot: number; results: TaskResult[]; left: { n: number } }[] = [];
  for (const chunk of chunks) {
    const results = new Array<TaskResult>(chunk.end - chunk.first);
    const left = { n: chunk.end - chunk.first };
    for (let slot = 0; slot < results.length; slot++) queue.push({ chunk, slot, results, left });
  }
  return new Promise<void>((resolve, reject) => {
    let next = 0;
    let running = 0;
    let failure: unknown;
    const stopped = () => failure !== undefined || on.signal?.aborted === true;
    const settle = () => {
      if (running > 0) return;
      if (failure !== undefined) reject(failure);
      else if (on.signal?.aborted) reject(abortReason(on.signal));
      else if (next >= queue.length) resolve();
    };
    const pump = () => {
      while (!stopped() && running < window && next < queue.length) {
        const item = queue[next++];
        running++;
        let started: Promise<TaskResult>;
        try {
          started = on.start(item.chunk.first + item.slot);
        } catch (error) {
          started = Promise.reject(error);
        }
        started.then(
          (result) => {
            running--;
            if (!stopped()) {
              try {
                item.results[item.slot] = result;
                if (--item.left.n === 0) on.chunkDone(item.chunk, item.results);
                on.taskDone(item.chunk);
              } catch (error) {
                failure ??= error;
              }
            }
            pump();
            settle();
          },
          (error) => {
            running--;
            failure ??= error ?? new Error('a task failed');
            settle();
          },
        );
      }
      settle();
    };
    pump();
  });
}

function abortReason(signal: AbortSignal): unknown {
  return signal.reason ?? new Error('the run was aborted');
}

/** The pool library, loaded only by a run that computes (not by merges, plots or a package import). */
async function loadPiscina() {
  return (await import('piscina')).Piscina;
}

/** Timing metadata lives apart from the tables, one file per shard. */
export function runFileName(shard: ShardSpec): string {
  return shard.n === 1 ? 'run.json' : `run-shard-${shard.k}-of-${shard.n}.json`;
}
