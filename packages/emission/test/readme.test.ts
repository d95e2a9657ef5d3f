import { afterEach, expect, test, vi } from 'vitest';
import { readFileSync } from 'node:fs';

afterEach(() => vi.restoreAllMocks());

test('the README example is examples/emission.ts verbatim and runs: photon power ≈ 3.36e-5/M² (Page 1976, value from memory) to 2e-3', async () => {
  const readme = readFileSync(new URL('../README.md', import.meta.url), 'utf8');
  const block = /```ts\n([\s\S]*?)```/.exec(readme)?.[1];
  expect(block).toBe(readFileSync(new URL('../examples/emission.ts', import.meta.url), 'utf8'));
  const lines: string[] = [];
  vi.spyOn(console, 'log').mockImplementation((line: string) => void lines.push(line));
  await import('../examples/emission.js');
  expect(lines).toHaveLength(3);
  const power = Number(/dE\/dt = ([\d.e+-]+)/.exec(lines[0])?.[1]);
  expect(Math.abs(power / 3.36e-5 - 1)).toBeLessThan(2e-3);
  expect(lines[1]).toContain('dJ/dt > 0: true');
});
