import { afterEach, expect, test, vi } from 'vitest';
import { readFileSync } from 'node:fs';

afterEach(() => vi.restoreAllMocks());

test('the README example is examples/radial.ts verbatim and its two routes agree on ln|Z_in| to 1e-8', async () => {
  const readme = readFileSync(new URL('../README.md', import.meta.url), 'utf8');
  expect(/```ts\n([\s\S]*?)```/.exec(readme)?.[1]).toBe(readFileSync(new URL('../examples/radial.ts', import.meta.url), 'utf8'));
  const lines: string[] = [];
  vi.spyOn(console, 'log').mockImplementation((line: string) => void lines.push(line));
  await import('../examples/radial.js');
  const two = Number(/ln\|Z_in\| = (-?[\d.]+)/.exec(lines[0])?.[1]);
  const one = Number(/ln\|Z_in\| = (-?[\d.]+)/.exec(lines[1])?.[1]);
  expect(Math.abs(two - one)).toBeLessThan(1e-8);
});
