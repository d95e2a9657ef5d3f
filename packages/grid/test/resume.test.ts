import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { computeTask, gridChunks, runGrid, validateGrid, type TaskMessage, type TaskResult } from '@penumbra/grid';
import { chunkPath } from '@penumbra/grid/internal';
import { ensureBuilt, tableFiles } from './support.js';

const work = mkdtempSync(join(tmpdir(), 'penumbra-resume-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));
let buildProblem: string | undefined;
beforeAll(() => {
  buildProblem = ensureBuilt();
}, 180_000);

// 2 holes × 9 frequencies = 18 scalar points of one mode each, 3 points per chunk: 6 chunks, milliseconds per task.
const grid = validateGrid({
  fieldSpins: [0],
  holeA: [0, 0.5],
  frequencies: { from: 0.1, to: 0.9, count: 9, spacing: 'linear' },
  l: { max: 0 },
  tolerance: 1e-6,
  quantities: ['gamma'],
  chunkSize: 3,
});
const chunks = gridChunks(grid);

/** Deterministic pseudo-random numbers in [0, 1) (mulberry32), so the shuffled finishing order is the same on every run. */
function seeded(seed: number): () => number {
  let t = seed >>> 0;
  return () => {
    t = (t + 0x6d2b79f5) >>> 0;
    let x = Math.imul(t ^ (t >>> 15), 1 | t);
    x = (x + Math.imul(x ^ (x >>> 7), 61 | x)) ^ x;
    return ((x ^ (x >>> 14)) >>> 0) / 4294967296;
  };
}

/** A compute function that finishes each task after a seeded random delay (0–8 ms), so tasks finish out of order; it records the finishing order. */
function shuffledCompute(seed: number) {
  const random = seeded(seed);
  const finished: number[] = [];
  const compute = (m: TaskMessage) =>
    new Promise<TaskResult>((ok) => {
      setTimeout(
        () => {
          finished.push(m.index);
          ok(computeTask(m));
        },
        Math.floor(random() * 8),
      );
    });
  return { compute, finished };
}

describe('resuming a run killed part-way while tasks finish out of order', () => {
  test('single uninterrupted runs give the same bytes with tasks in shuffled order and in this thread (exact equality)', async (context) => {
    if (buildProblem) context.skip(buildProblem);
    await runGrid({ grid, out: join(work, 'plain'), workers: 0 });
    const { compute, finished } = shuffledCompute(7);
    await runGrid({ grid, out: join(work, 'shuffled'), workers: 8, compute });
    expect(finished).not.toEqual([...finished].sort((x, y) => x - y));
    expect(tableFiles(join(work, 'shuffled'))).toEqual(tableFiles(join(work, 'plain')));
  });

  for (const [killAfter, seed] of [
    [4, 1],
    [9, 2],
    [14, 3],
    [17, 4],
  ] as const) {
    test(`killed after ${killAfter} of 18 tasks (seed ${seed}): exactly the chunks whose tasks had all finished are on disk, the resume computes only the other tasks, and the tables equal an uninterrupted run byte for byte`, async (context) => {
      if (buildProblem) context.skip(buildProblem);
      const out = join(work, `killed-${killAfter}`);
      const { compute, finished } = shuffledCompute(seed);
      const controller = new AbortController();
      let done: Set<number> = new Set();
      const killed = runGrid({
        grid,
        out,
        workers: 8,
        compute,
        signal: controller.signal,
        onProgress: (p) => {
          if (p.doneTasks === killAfter) {
            done = new Set(finished);
            controller.abort(new Error('killed'));
          }
        },
      });
      await expect(killed).rejects.toThrow('killed');
      expect(done.size).toBe(killAfter);

      const complete = chunks.filter((c) =>
        Array.from({ length: c.end - c.first }, (_, i) => c.first + i).every((i) => done.has(i)),
      );
      for (const c of chunks) expect(existsSync(chunkPath(out, c.index)), `chunk ${c.index}`).toBe(complete.includes(c));
      expect(existsSync(join(out, 'modes.csv'))).toBe(false);

      const recomputed: number[] = [];
      const resumed = await runGrid({
        grid,
        out,
        workers: 0,
        compute: async (m) => {
          recomputed.push(m.index);
          return computeTask(m);
        },
      });
      const keptTasks = complete.reduce((n, c) => n + c.end - c.first, 0);
      expect(resumed.chunksSkipped).toBe(complete.length);
      expect(resumed.tasksComputed).toBe(18 - keptTasks);
      expect(recomputed.every((i) => !complete.some((c) => i >= c.first && i < c.end))).toBe(true);
      expect(resumed.complete).toBe(true);
      expect(tableFiles(out)).toEqual(tableFiles(join(work, 'plain')));
    });
  }
});
