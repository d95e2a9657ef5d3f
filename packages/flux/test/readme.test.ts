import { afterEach, expect, test, vi } from 'vitest';
import { readFileSync } from 'node:fs';

afterEach(() => vi.restoreAllMocks());

test('the README example is examples/greybody.ts verbatim and runs: σ(Mω=2) within 5 % of 27πM² (Misner, Thorne & Wheeler 1973)', async () => {
  const readme = readFileSync(new URL('../README.md', import.meta.url), 'utf8');
  const block = /```ts\n([\s\S]*?)```/.exec(readme)?.[1];
  expect(block).toBe(readFileSync(new URL('../examples/greybody.ts', import.meta.url), 'utf8'));
  const lines: string[] = [];
  vi.spyOn(console, 'log').mockImplementation((line: string) => void lines.push(line));
  await import('../examples/greybody.js');
  expect(lines).toHaveLength(4);
  expect(lines[1]).toContain('superradiant: true');
  const ratio = Number(/σ\(Mω = 2\) = ([\d.]+)/.exec(lines[3])?.[1]);
  expect(Math.abs(ratio - 1)).toBeLessThan(0.05);
});
