import { afterEach, expect, test, vi } from 'vitest';
import { readFileSync } from 'node:fs';

afterEach(() => vi.restoreAllMocks());

test('the README example is examples/background.ts verbatim, and running it prints the a = 0.9 background (r+ = 1 + √0.19, hand evaluation)', async () => {
  const readme = readFileSync(new URL('../README.md', import.meta.url), 'utf8');
  const block = /```ts\n([\s\S]*?)```/.exec(readme)?.[1];
  const example = readFileSync(new URL('../examples/background.ts', import.meta.url), 'utf8');
  expect(block).toBe(example);

  const lines: string[] = [];
  vi.spyOn(console, 'log').mockImplementation((line: string) => void lines.push(line));
  await import('../examples/background.js');
  expect(lines).toHaveLength(4);
  expect(lines[0]).toContain(`r+ = ${(1 + Math.sqrt(0.19)).toFixed(6)}`);
  expect(lines[1]).toMatch(/r\(r\*\) = 10(\.0*\d?)? after \d+ Newton steps/);
  // 1e15 g Schwarzschild: 10.6 MeV (well-known figure); a = 0.9 lowers T_H by κ(0.9)/κ(0) = 4√0.19/(2(1 + √0.19)).
  const megaElectronVolts = Number(/T_H = ([\d.]+) MeV/.exec(lines[3])?.[1]);
  const expected = (10.6 * 4 * Math.sqrt(0.19)) / (2 * (1 + Math.sqrt(0.19)));
  expect(Math.abs(megaElectronVolts / expected - 1)).toBeLessThan(5e-3);
});
