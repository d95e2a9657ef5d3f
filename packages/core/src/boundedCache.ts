/**
 * The memory bound of the package caches (angular band terms, last solved
 * points, Γ per frequency): a map that would grow past its limit with a new
 * key is emptied first. Results never depend on a cache, so dropping it all
 * is safe and keeps the bookkeeping to one comparison per insertion.
 */

/** Set `key` to `value`, first emptying `map` when the key is new and the map already holds `limit` entries. */
export function setBounded<K, V>(map: Map<K, V>, key: K, value: V, limit: number): void {
  if (map.size >= limit && !map.has(key)) map.clear();
  map.set(key, value);
}
