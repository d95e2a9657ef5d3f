import { beforeAll, describe, expect, test } from 'vitest';
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('../../../', import.meta.url));
const bin = fileURLToPath(new URL('../bin/penumbra.js', import.meta.url));
const built = fileURLToPath(new URL('../dist/main.js', import.meta.url));

let buildFailure = '';

beforeAll(() => {
  // `npm ci` builds through the root "prepare" script; build here only when dist is missing.
  if (existsSync(built)) return;
  const build = spawnSync('npx', ['tsc', '-b', 'packages/cli'], { cwd: root, encoding: 'utf8' });
  if (build.status !== 0 || !existsSync(built)) buildFailure = `tsc -b packages/cli failed: ${build.stdout}${build.stderr}`;
}, 120_000);

describe('the built penumbra executable', () => {
  test('bin/penumbra.js kerr --a 1.2 exits with code 2 and one line on stderr, no stack trace', (context) => {
    if (buildFailure) context.skip(`cannot build the CLI (${buildFailure.slice(0, 200)})`);
    const result = spawnSync(process.execPath, [bin, 'kerr', '--a', '1.2'], { cwd: root, encoding: 'utf8' });
    expect(result.status).toBe(2);
    expect(result.stdout).toBe('');
    expect(result.stderr).toMatch(/^penumbra: invalid a = 1\.2: [^\n]+\n$/);
  });

  test('bin/penumbra.js kerr --a 0.9 --json exits 0 with the JSON object on stdout', (context) => {
    if (buildFailure) context.skip(`cannot build the CLI (${buildFailure.slice(0, 200)})`);
    const result = spawnSync(process.execPath, [bin, 'kerr', '--a', '0.9', '--json'], { cwd: root, encoding: 'utf8' });
    expect(result.status).toBe(0);
    expect(JSON.parse(result.stdout).rPlus).toBe(1 + Math.sqrt(0.19));
  });

  test('npm links the bin as node_modules/.bin/penumbra at the repository root', (context) => {
    const link = fileURLToPath(new URL('node_modules/.bin/penumbra', `file://${root}`));
    if (!existsSync(fileURLToPath(new URL('node_modules/', `file://${root}`)))) context.skip('no node_modules at the root');
    expect(existsSync(link)).toBe(true);
  });
});
