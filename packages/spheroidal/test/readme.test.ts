import { readFileSync } from 'node:fs';
import { afterEach, expect, test, vi } from 'vitest';

afterEach(() => vi.restoreAllMocks());

test('the README example is examples/spheroidal.ts verbatim, runs, and shows A_{−2} = A_{+2} + 4 (physics notes) to 12 decimals', async () => {
  const readme = readFileSync(new URL('../README.md', import.meta.url), 'utf8');
  expect(/```ts\n([\s\S]*?)```/.exec(readme)?.[1]).toBe(
    readFileSync(new URL('../examples/spheroidal.ts', import.meta.url), 'utf8'),
  );
  const lines: string[] = [];
  vi.spyOn(console, 'log').mockImplementation((line: string) => void lines.push(line));
  await import('../examples/spheroidal.js');
  expect(lines).toHaveLength(5);
  const A = /^A = (-?[\d.]+)/.exec(lines[0])?.[1];
  const plus = /= (-?[\d.]+)$/.exec(lines[1])?.[1];
  expect(A).toBeDefined();
  expect(A).toBe(plus);
  expect(lines[3]).toMatch(/c = 0, 2, …, 8\) = 10\.000000, /);
  expect(lines[4]).toMatch(/^complex c: A = -?[\d.]+ [−+] [\d.]+i \(Leaver agreement /);
});
