import { afterEach, expect, test, vi } from 'vitest';
import { readFileSync } from 'node:fs';

afterEach(() => vi.restoreAllMocks());

test('the README example is examples/near-region.ts verbatim and runs: ratio within 1 % of one at Mω = 1e-3 (the O(Mω) correction of limit.test.ts), Cardy entropy = A/4 to 12 digits (Castro, Maloney & Strominger 2010)', async () => {
  const readme = readFileSync(new URL('../README.md', import.meta.url), 'utf8');
  const block = /```ts\n([\s\S]*?)```/.exec(readme)?.[1];
  expect(block).toBe(readFileSync(new URL('../examples/near-region.ts', import.meta.url), 'utf8'));
  const lines: string[] = [];
  vi.spyOn(console, 'log').mockImplementation((line: string) => void lines.push(line));
  await import('../examples/near-region.js');
  expect(lines).toHaveLength(3);
  expect(lines[0]).toContain('(h_L, h_R) = (1, 2)');
  const ratio = Number(/ratio = ([\d.]+)/.exec(lines[1])?.[1]);
  expect(Math.abs(ratio - 1)).toBeLessThan(0.01);
  expect(lines[2]).toContain('Cardy entropy / (A/4) = 1.000000000000');
  // the printed block in the README is what the example prints
  for (const line of lines) expect(readme).toContain(line);
});
