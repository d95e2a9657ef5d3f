import { afterEach, beforeAll, expect, test, vi } from 'vitest';
import { readFileSync } from 'node:fs';
import { ensureBuilt } from './support.js';

let buildProblem: string | undefined;
beforeAll(() => {
  buildProblem = ensureBuilt();
}, 180_000);
afterEach(() => vi.restoreAllMocks());

test('the README example is examples/small-grid.ts verbatim; σ(Mω = 0.001) is within 1 % of 16πM² (Das, Gibbons & Mathur, PRL 78, 417 (1997)) and σ(Mω = 1.5) within 5 % of 27πM² (Misner, Thorne & Wheeler 1973)', async (context) => {
  if (buildProblem) context.skip(buildProblem);
  const readme = readFileSync(new URL('../README.md', import.meta.url), 'utf8');
  const block = /```ts\n([\s\S]*?)```/.exec(readme)?.[1];
  expect(block).toBe(readFileSync(new URL('../examples/small-grid.ts', import.meta.url), 'utf8'));

  const lines: string[] = [];
  vi.spyOn(console, 'log').mockImplementation((line: string) => void lines.push(line));
  await import('../examples/small-grid.js');
  expect(lines[0]).toBe('complete: true; rows: 3; failed: 0');
  const rows = lines[1].split('\n');
  expect(rows[0]).toBe('spin [1],a [M],omega [1/M],status,sigma [M^2],relError [1],droppedBound [M^2],lMax [1],modes,message');
  const sigma = rows.slice(1).map((r) => Number(r.split(',')[4]));
  expect(Math.abs(sigma[0] / (16 * Math.PI) - 1)).toBeLessThan(0.01);
  expect(Math.abs(sigma[2] / (27 * Math.PI) - 1)).toBeLessThan(0.05);
});
