import { afterEach, expect, test, vi } from 'vitest';
import { readFileSync } from 'node:fs';
import { greybody } from '@penumbra/flux';
import { printNumber } from '../src/index.js';

afterEach(() => vi.restoreAllMocks());

test('the README example is examples/explorer.ts verbatim and runs: its Γ equal flux greybody to the printed digits', async () => {
  const readme = readFileSync(new URL('../README.md', import.meta.url), 'utf8');
  const block = /```ts\n([\s\S]*?)```/.exec(readme)?.[1];
  expect(block).toBe(readFileSync(new URL('../examples/explorer.ts', import.meta.url), 'utf8'));
  const lines: string[] = [];
  vi.spyOn(console, 'log').mockImplementation((line: string) => void lines.push(line));
  await import('../examples/explorer.js');
  expect(lines[0]).toBe(
    `l = 2, m = 2, Mω = 0.3: Γ = ${printNumber(greybody({ hole: { a: 0.99 }, mode: { field: { spin: 2 }, l: 2, m: 2 }, omega: 0.3 }).gamma)}`,
  );
  expect(lines.at(-1)).toMatch(/^built into /);
});
