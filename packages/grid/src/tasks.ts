/**
 * The work of a grid: one task per (field, a, ω) point in a fixed order (the
 * fields as listed, then a, then ω), chunks of consecutive tasks, and a deterministic
 * cost-balanced split of the chunks into shards.
 */
import { gridValues, type FieldSpin } from '@penumbra/core';
import type { GridSpec } from './grid.js';
import { fieldLs, modeStates, type GridSpecies, type ModeState } from './fields.js';

/** One grid point. */
export interface GridTask {
  index: number;
  /** field spin of the point (0, 1/2, 1, 2) */
  s: number;
  /** field mass Mμ (units of 1/M; 0 massless) */
  mass: number;
  /** the species the field stands for (species grids) */
  species?: GridSpecies;
  /** the hole's a/M */
  a: number;
  omega: number;
}

/** Consecutive tasks written to one chunk file. */
export interface GridChunk {
  index: number;
  /** task indices [first, end) */
  first: number;
  end: number;
  cost: number;
}

/** Every point of a grid, field first (as listed), then a, then ω. */
export function gridTasks(grid: GridSpec): GridTask[] {
  const omegas = gridValues(grid.frequencies);
  const tasks: GridTask[] = [];
  for (const field of grid.fields) {
    for (const a of grid.holeA) {
      for (const omega of omegas) {
        const task: GridTask = { index: tasks.length, s: field.spin, mass: field.mass, a, omega };
        if (field.species) task.species = field.species;
        tasks.push(task);
      }
    }
  }
  return tasks;
}

/**
 * Modes of one explicit-range point: every l in range, every m from −l to l,
 * and every spin state of a massive Dirac (both signs of κ) or vector field
 * (its polarisations; from l = 0, the monopole).
 */
export function explicitModes(
  s: number,
  range: { min: number; max: number },
  mass = 0,
): ({ l: number; m: number } & ModeState)[] {
  const field = { spin: s as FieldSpin, mass };
  const out: ({ l: number; m: number } & ModeState)[] = [];
  for (const l of fieldLs(field, range))
    for (let m = -l; m <= l; m++) for (const state of modeStates(field, l)) out.push({ l, m, ...state });
  return out;
}

/**
 * Number of greybody solves an automatically truncated l-sum needs, roughly:
 * shells up to about ω·5M (the capture cut of the flux cross-section) plus
 * two past it, every m of a shell unless a = 0 (one solve per shell there).
 */
export function estimatedSumModes(s: number, a: number, omega: number): number {
  const top = Math.max(s + 2, Math.ceil(omega * 5) + 2);
  let modes = 0;
  for (let l = s; l <= top; l++) modes += a === 0 ? 1 : 2 * l + 1;
  return modes;
}

/** Estimated cost of a task in units of one greybody solve; only its proportions matter. */
export function taskCost(grid: GridSpec, task: GridTask): number {
  const q = grid.quantities;
  const perMode = q.includes('gamma') || q.includes('reflection');
  // The reflection coefficient needs a second (−s) integration.
  const reflectionFactor = q.includes('reflection') ? 1.6 : 1;
  let cost = 0;
  // A massive Dirac sum solves both signs of κ, a massive vector three polarisations.
  const states = task.mass > 0 && task.s === 0.5 ? 2 : task.mass > 0 && task.s === 1 ? 3 : 1;
  const sumModes = estimatedSumModes(task.s, task.a, task.omega) * states;
  if (perMode) {
    cost +=
      grid.l === 'auto'
        ? sumModes * (q.includes('reflection') ? 2.6 : 1)
        : explicitModes(task.s, grid.l, task.mass).length * reflectionFactor;
  }
  if (q.includes('crossSection') && !(perMode && grid.l === 'auto')) cost += sumModes;
  if (q.includes('spectra')) cost += sumModes;
  // Spin-weighted fields take more steps (two-sided route); common practice, no source.
  return cost * (task.s === 0 ? 1 : 1.5);
}

/** The chunks of a grid with their estimated costs. */
export function gridChunks(grid: GridSpec, tasks: readonly GridTask[] = gridTasks(grid)): GridChunk[] {
  const chunks: GridChunk[] = [];
  for (let first = 0; first < tasks.length; first += grid.chunkSize) {
    const end = Math.min(first + grid.chunkSize, tasks.length);
    let cost = 0;
    for (let i = first; i < end; i++) cost += taskCost(grid, tasks[i]);
    chunks.push({ index: chunks.length, first, end, cost });
  }
  return chunks;
}

/** Shard k of n. */
export interface ShardSpec {
  /** 1-based shard number */
  k: number;
  n: number;
}

/** 'K/N' with 1 ≤ K ≤ N; returns a problem text instead of throwing, so callers can report all problems together. */
export function parseShard(text: string): ShardSpec | string {
  const match = /^\s*(\d+)\s*\/\s*(\d+)\s*$/.exec(text);
  const rule = `--shard expects K/N with integers 1 ≤ K ≤ N (e.g. 3/8), got '${text}'`;
  if (!match) return rule;
  const k = Number(match[1]),
    n = Number(match[2]);
  if (!(n >= 1 && k >= 1 && k <= n) || n > 100_000) return rule;
  return { k, n };
}

/**
 * Chunk indices of shard k of n: longest-processing-time-first, i.e. chunks by
 * decreasing estimated cost (ties by index), each to the least-loaded shard
 * (ties to the lowest shard). The same grid and n always give the same split.
 */
export function shardChunks(chunks: readonly GridChunk[], shard: ShardSpec): number[] {
  if (shard.n === 1) return chunks.map((c) => c.index);
  const order = [...chunks].sort((x, y) => y.cost - x.cost || x.index - y.index);
  const load = new Array<number>(shard.n).fill(0);
  const mine: number[] = [];
  for (const chunk of order) {
    let best = 0;
    for (let j = 1; j < shard.n; j++) if (load[j] < load[best]) best = j;
    load[best] += chunk.cost;
    if (best === shard.k - 1) mine.push(chunk.index);
  }
  return mine.sort((x, y) => x - y);
}
