import { describe, expect, test } from 'vitest';
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { gridValues } from '@penumbra/core';
import {
  canonicalGridJson,
  gridChunks,
  gridHash,
  gridTasks,
  parseShard,
  shardChunks,
  taskCost,
  validateGrid,
} from '@penumbra/grid';
import { problemsOf } from './support.js';

const base = {
  fieldSpins: [0, 1],
  holeA: [0, 0.9],
  frequencies: { spacing: 'log', from: 0.01, to: 1, count: 5 },
  l: { max: 2 },
  tolerance: 1e-6,
  quantities: ['gamma'],
};

describe('grid descriptions', () => {
  test('a valid grid gets its defaults (chunk size 16) and log frequencies with exact endpoints and a constant ratio to 1e-15', () => {
    const grid = validateGrid(base);
    expect(grid.chunkSize).toBe(16);
    const w = gridValues(grid.frequencies);
    expect(w[0]).toBe(0.01);
    expect(w[4]).toBe(1);
    for (let i = 1; i < 5; i++) expect(Math.abs(w[i] / w[i - 1] / Math.sqrt(Math.sqrt(100)) - 1)).toBeLessThan(1e-15);
  });

  test('every problem of a bad grid is reported at once, one phrase each', () => {
    const problems = problemsOf({
      fieldSpins: [0, 3, 0],
      holeA: [1, 'x'],
      frequencies: { spacing: 'cubic', from: -1, to: 40, count: 0.5 },
      l: { min: 3, max: 1 },
      tolerance: 1,
      quantities: ['gamma', 'flux'],
      color: 'red',
    });
    // key, two spins, two holes, spacing, from, to, count, a quantity, l, tolerance
    expect(problems).toHaveLength(12);
    expect(problems.join('\n')).toMatch(/unknown key 'color'/);
    expect(problems.join('\n')).toMatch(/fieldSpins\[1\].*got 3/);
    expect(problems.join('\n')).toMatch(/fieldSpins\[2\]: 0 appears twice/);
    expect(problems.join('\n')).toMatch(/l: min \(3\) exceeds max \(1\)/);
  });

  test('contradictory grids are refused: both frequency forms, an l range holding no mode of a spin, an l range with sums only, a non-increasing list', () => {
    expect(problemsOf({ ...base, frequencies: { values: [0.1], spacing: 'log', from: 0.1, to: 1, count: 3 } })[0]).toMatch(
      /either "values" or/,
    );
    expect(problemsOf({ ...base, fieldSpins: [2], l: { max: 1 } })[0]).toMatch(/holds no mode of field spin 2/);
    expect(problemsOf({ ...base, quantities: ['crossSection'] })[0]).toMatch(
      /explicit l range applies to gamma and reflection only/,
    );
    expect(problemsOf({ ...base, frequencies: { values: [0.1, 0.3, 0.2] } })[0]).toMatch(/increase strictly/);
    expect(problemsOf({ ...base, frequencies: { spacing: 'linear', from: 0.5, to: 0.5, count: 3 } })[0]).toMatch(
      /'to' \(0.5\) must exceed/,
    );
  });

  test('the canonical text and hash ignore key order and defaults written out', () => {
    const a = validateGrid(base);
    const b = validateGrid({
      quantities: ['gamma'],
      tolerance: 1e-6,
      chunkSize: 16,
      l: { min: 0, max: 2 },
      frequencies: base.frequencies,
      holeA: [0, -0 + 0.9],
      fieldSpins: [0, 1],
    });
    expect(canonicalGridJson(a)).toBe(canonicalGridJson(b));
    expect(gridHash(a)).toBe(gridHash(b));
    expect(gridHash(validateGrid({ ...base, tolerance: 1e-7 }))).not.toBe(gridHash(a));
  });

  test('the hash is the first 16 hex digits of the SHA-256 of the canonical JSON: equal to node:crypto (an independent implementation) on this grid and on random grids, and pinned for the base grid', () => {
    const nodeHash = (text: string) => createHash('sha256').update(text).digest('hex').slice(0, 16);
    const grid = validateGrid(base);
    expect(canonicalGridJson(grid)).toBe(
      '{"fieldSpins":[0,1],"holeA":[0,0.9],"frequencies":{"spacing":"log","from":0.01,"to":1,"count":5},"l":{"min":0,"max":2},"tolerance":0.000001,"quantities":["gamma"],"chunkSize":16}',
    );
    expect(gridHash(grid)).toBe(nodeHash(canonicalGridJson(grid)));
    expect(gridHash(grid)).toBe('0b3dc01ed91535e2');
    fc.assert(
      fc.property(
        fc.subarray([0, 0.5, 1, 2], { minLength: 1 }),
        fc.uniqueArray(fc.double({ min: -0.9999, max: 0.9999, noNaN: true }), { minLength: 1, maxLength: 4 }),
        fc.integer({ min: 1, max: 99 }),
        (fieldSpins, holeA, chunkSize) => {
          const g = validateGrid({
            ...base,
            fieldSpins,
            holeA: holeA.map((x) => (x === 0 ? 0 : x)),
            chunkSize,
            l: 'auto',
            quantities: ['crossSection'],
          });
          expect(gridHash(g)).toBe(nodeHash(canonicalGridJson(g)));
        },
      ),
      { numRuns: 50 },
    );
  });

  test('the grid spec modules import no Node built-in (they run in a browser): only core, flux, emission, kerr, @noble/hashes and each other', () => {
    const importsOf = (file: string) =>
      [...readFileSync(new URL(`../src/${file}`, import.meta.url), 'utf8').matchAll(/^import .* from '([^']+)';$/gm)].map(
        (m) => m[1],
      );
    expect(importsOf('grid.ts')).toEqual([
      '@noble/hashes/sha2.js',
      '@noble/hashes/utils.js',
      '@penumbra/core',
      '@penumbra/flux',
      './fields.js',
    ]);
    expect(importsOf('fields.ts')).toEqual(['@penumbra/core', '@penumbra/flux', '@penumbra/emission', '@penumbra/kerr']);
  });

  test("the old key 'holeSpins' is read as holeA (same grid, same hash); both keys together are refused", () => {
    const { holeA, ...rest } = base;
    expect(canonicalGridJson(validateGrid({ ...rest, holeSpins: holeA }))).toBe(canonicalGridJson(validateGrid(base)));
    expect(problemsOf({ ...base, holeSpins: holeA })).toEqual(["give holeA only ('holeSpins' is its old name)"]);
    expect(problemsOf({ ...rest, holeSpins: [2] })[0]).toMatch(/^holeSpins\[0\]: expected a\/M/);
  });

  test("field spins follow core's rule: '1/2', 0.5 and '0.5' are one spin, '3/2' and -1 are refused", () => {
    expect(validateGrid({ ...base, fieldSpins: ['1/2', 1, '2'] }).fieldSpins).toEqual([0.5, 1, 2]);
    expect(problemsOf({ ...base, fieldSpins: [0.5, '0.5'] })).toEqual(["fieldSpins[1]: '0.5' appears twice"]);
    expect(problemsOf({ ...base, fieldSpins: ['3/2', -1] })).toHaveLength(2);
  });
});

describe('shards', () => {
  test("'K/N' parses for 1 ≤ K ≤ N; '5/4', '0/0', '0/3', '1/0', 'a/b' and '2' are refused with the rule", () => {
    expect(parseShard('3/8')).toEqual({ k: 3, n: 8 });
    for (const bad of ['5/4', '0/0', '0/3', '1/0', 'a/b', '2', '1/2/3']) expect(parseShard(bad)).toMatch(/1 ≤ K ≤ N/);
  });

  test('shards partition the chunks exactly, deterministically, and each load is within one chunk of the mean (property, fast-check)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 2, max: 60 }),
        fc.integer({ min: 1, max: 9 }),
        fc.integer({ min: 1, max: 7 }),
        (count, n, chunkSize) => {
          const grid = validateGrid({ ...base, frequencies: { spacing: 'linear', from: 0.01, to: 3, count }, chunkSize });
          const chunks = gridChunks(grid);
          const parts = Array.from({ length: n }, (_, i) => shardChunks(chunks, { k: i + 1, n }));
          const all = parts.flat().sort((x, y) => x - y);
          expect(all).toEqual(chunks.map((c) => c.index));
          expect(shardChunks(chunks, { k: 1, n })).toEqual(parts[0]);
          const loads = parts.map((p) => p.reduce((sum, i) => sum + chunks[i].cost, 0));
          const mean = loads.reduce((x, y) => x + y, 0) / n;
          const largest = Math.max(...chunks.map((c) => c.cost));
          // Longest-processing-time-first keeps every shard within one chunk of the mean (Graham 1969 bound, common practice).
          for (const load of loads) expect(Math.abs(load - mean)).toBeLessThanOrEqual(largest + 1e-9);
        },
      ),
      { numRuns: 60 },
    );
  });

  test('tasks run s, then a, then ω, and cost grows with ω for automatic l-sums', () => {
    const grid = validateGrid({ ...base, l: 'auto', quantities: ['crossSection'] });
    const tasks = gridTasks(grid);
    expect(tasks).toHaveLength(20);
    expect(tasks[6]).toMatchObject({ index: 6, s: 0, a: 0.9 });
    expect(tasks[10]).toMatchObject({ index: 10, s: 1, a: 0 });
    expect(taskCost(grid, tasks[9])).toBeGreaterThan(taskCost(grid, tasks[5]));
  });
});
