import { afterEach, expect, test, vi } from 'vitest';
import { readFileSync } from 'node:fs';

afterEach(() => vi.restoreAllMocks());

test('the README example is examples/power-laws.ts verbatim, and running it prints a log ω axis (three decades) and an SVG with the axis title and unit and the series names', async () => {
  const readme = readFileSync(new URL('../README.md', import.meta.url), 'utf8');
  const block = /```ts\n([\s\S]*?)```/.exec(readme)?.[1];
  const example = readFileSync(new URL('../examples/power-laws.ts', import.meta.url), 'utf8');
  expect(block).toBe(example);

  const lines: string[] = [];
  vi.spyOn(console, 'log').mockImplementation((...args: unknown[]) => void lines.push(args.join(' ')));
  await import('../examples/power-laws.js');
  expect(lines).toEqual(['x axis: log; 2 series', 'true true true']);
  // the README shows the same output
  expect(readme).toContain('```\nx axis: log; 2 series\ntrue true true\n```');
});
