import { expect, test } from 'vitest';
import { readFileSync } from 'node:fs';
import { run } from './helpers.js';

const readme = readFileSync(new URL('../README.md', import.meta.url), 'utf8');
const block = /```sh\n([\s\S]*?)```/.exec(readme)?.[1] ?? '';
const lines = block.split('\n').filter((line) => line.startsWith('penumbra '));

test('the README has examples', () => {
  expect(lines.length).toBeGreaterThan(5);
});

for (const line of lines) {
  test(`README example runs with exit code 0: ${line}`, async () => {
    const result = await run(...line.split(/\s+/).slice(1));
    expect(result.code, result.stderr).toBe(0);
    expect(result.stdout.length).toBeGreaterThan(0);
  });
}
