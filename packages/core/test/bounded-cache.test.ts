import { describe, expect, it } from 'vitest';
import { setBounded } from '../src/internal.js';

// The caches' contract (project-internal: results never depend on a cache, so only the bound is checked).
describe('setBounded', () => {
  it('never lets a map grow past its limit: a new key into a full map empties it first', () => {
    const map = new Map<number, number>();
    for (let k = 0; k < 10; k++) setBounded(map, k, k * k, 4);
    expect(map.size).toBeLessThanOrEqual(4);
    expect(map.get(9)).toBe(81);
  });

  it('replaces the value of a key already held without emptying the full map', () => {
    const map = new Map([
      [1, 'a'],
      [2, 'b'],
    ]);
    setBounded(map, 2, 'c', 2);
    expect([...map.entries()]).toEqual([
      [1, 'a'],
      [2, 'c'],
    ]);
  });
});
