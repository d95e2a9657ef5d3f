/**
 * What a new user gets from the tarballs: `npm pack --workspaces`, then
 * `npm install` of all of them into an empty project outside the repository,
 * then the flux README example run from the installed packages. Needs the
 * built dist/ (made by `npm ci` through the root "prepare" script; built here
 * if missing) and the npm registry for the third-party dependencies.
 */
import { spawnSync, type SpawnSyncReturns } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import ts from 'typescript';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';

const root = fileURLToPath(new URL('..', import.meta.url));
const packageNames = readdirSync(join(root, 'packages')).filter((d) => existsSync(join(root, 'packages', d, 'package.json')));
const scratch = mkdtempSync(join(tmpdir(), 'penumbra-install-'));
const packs = join(scratch, 'packs');
const app = join(scratch, 'app');
const npmFlags = ['--no-audit', '--no-fund', '--prefer-offline'];

// `npm test` exports its own workspace settings; the nested npm runs must not inherit them.
const env = Object.fromEntries(
  Object.entries(process.env).filter(([key]) => !/^npm_config_(workspaces?|include_workspace_root|global)$/i.test(key)),
);

function run(command: string, args: string[], cwd: string, input?: string): SpawnSyncReturns<string> {
  return spawnSync(command, args, { cwd, env, input, encoding: 'utf8', timeout: 120_000 });
}

function emptyProject(dir: string): void {
  mkdirSync(dir, { recursive: true });
  writeFileSync(
    join(dir, 'package.json'),
    `${JSON.stringify({ name: 'penumbra-install-check', private: true, type: 'module' })}\n`,
  );
}

/** The flux README example, transpiled from TypeScript to an ES module. */
function fluxReadmeExample(): string {
  const readme = readFileSync(join(root, 'packages', 'flux', 'README.md'), 'utf8');
  const block = /```ts\n([\s\S]*?)```/.exec(readme)?.[1];
  if (!block) throw new Error('packages/flux/README.md has no ts block');
  const options = { module: ts.ModuleKind.ESNext, target: ts.ScriptTarget.ES2022 };
  return ts.transpileModule(block, { compilerOptions: options }).outputText;
}

let tarballs: string[] = [];
let setupFailure = '';

beforeAll(() => {
  if (packageNames.some((name) => !existsSync(join(root, 'packages', name, 'dist', 'index.js')))) {
    const build = run('npx', ['tsc', '-b'], root);
    if (build.status !== 0) throw new Error(`tsc -b failed:\n${build.stdout}${build.stderr}`);
  }
  mkdirSync(packs);
  const pack = run('npm', ['pack', '--workspaces', '--pack-destination', packs], root);
  if (pack.status !== 0) throw new Error(`npm pack failed:\n${pack.stderr}`);
  tarballs = readdirSync(packs)
    .filter((f) => f.endsWith('.tgz'))
    .map((f) => join(packs, f));
  emptyProject(app);
  const install = run('npm', ['install', ...npmFlags, ...tarballs], app);
  if (install.status !== 0) setupFailure = `npm install of the tarballs failed:\n${install.stderr}`;
}, 180_000);

afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('installing the packed tarballs into an empty project', () => {
  test('npm pack --workspaces makes one tarball per package, each with LICENSE, README.md and dist/index.js', () => {
    expect(tarballs).toHaveLength(packageNames.length);
    for (const tarball of tarballs) {
      const listing = run('tar', ['tzf', tarball], scratch).stdout.split('\n');
      for (const file of ['package/LICENSE', 'package/README.md', 'package/package.json', 'package/dist/index.js']) {
        expect(listing, `${tarball} lacks ${file}`).toContain(file);
      }
    }
  });

  test('npm install of all tarballs together succeeds and links every @penumbra package', () => {
    expect(setupFailure).toBe('');
    for (const name of packageNames) {
      expect(existsSync(join(app, 'node_modules', '@penumbra', name, 'package.json')), name).toBe(true);
    }
  });

  test('the flux README example runs from the installed packages: four lines, superradiant graviton, σ(Mω=2) within 5 % of 27πM² (Misner, Thorne & Wheeler 1973), and the same output as the workspace build', () => {
    expect(setupFailure).toBe('');
    const code = fluxReadmeExample();
    // Code read from stdin resolves its imports from the working directory.
    const installed = run(process.execPath, ['--input-type=module'], app, code);
    expect(installed.stderr).toBe('');
    expect(installed.status).toBe(0);
    const lines = installed.stdout.trimEnd().split('\n');
    expect(lines).toHaveLength(4);
    expect(lines[1]).toContain('superradiant: true');
    const ratio = Number(/σ\(Mω = 2\) = ([\d.]+)/.exec(lines[3])?.[1]);
    expect(Math.abs(ratio - 1)).toBeLessThan(0.05);
    const workspace = run(process.execPath, ['--input-type=module'], root, code);
    expect(workspace.status).toBe(0);
    expect(installed.stdout).toBe(workspace.stdout);
  });

  test('the installed penumbra executable prints its version (node_modules/.bin/penumbra --version)', () => {
    expect(setupFailure).toBe('');
    const version = JSON.parse(readFileSync(join(root, 'packages', 'cli', 'package.json'), 'utf8')).version as string;
    const result = run(join(app, 'node_modules', '.bin', 'penumbra'), ['--version'], app);
    expect(result.status).toBe(0);
    expect(result.stdout.trim()).toBe(`penumbra ${version}`);
  });

  // Until the packages are published, a lone tarball cannot find its @penumbra
  // dependencies; once they are on the registry this case installs, and this
  // test should change to expect success.
  test('npm install of the flux tarball alone fails with E404 for one of its @penumbra dependencies (not yet on the registry)', () => {
    const alone = join(scratch, 'flux-alone');
    emptyProject(alone);
    const flux = tarballs.find((t) => /penumbra-flux-[\d.]+\.tgz$/.test(t));
    expect(flux).toBeDefined();
    const result = run('npm', ['install', ...npmFlags, flux!], alone);
    expect(result.status).not.toBe(0);
    expect(result.stderr).toMatch(/E404/);
    expect(result.stderr).toMatch(/@penumbra(\/|%2f)(core|kerr|spheroidal|radial)/);
  });
});
