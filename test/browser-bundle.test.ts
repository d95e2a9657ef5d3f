/**
 * The library packages run in a browser: each src/index.ts bundles with
 * esbuild for platform 'browser' without any Node built-in import, and the
 * flux bundle, loaded as a plain ES module, computes the same greybody factor
 * as the sources do in process.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { builtinModules } from 'node:module';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import * as esbuild from 'esbuild';
import { afterAll, describe, expect, test } from 'vitest';
import * as fluxInProcess from '@penumbra/flux';

const root = fileURLToPath(new URL('..', import.meta.url));
const scratch = mkdtempSync(join(tmpdir(), 'penumbra-browser-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

/** The one greybody call of this file (if the flux API changes shape, update it here only). */
function oneGreybodyFactor(flux: typeof fluxInProcess): number {
  return flux.greybody({ hole: { a: 0.5 }, mode: { field: { spin: 1 }, l: 1, m: 1 }, omega: 0.3 }).gamma;
}

interface BuiltinImport {
  path: string;
  importer: string;
}

const builtins = new Set(builtinModules.map((name) => name.replace(/^node:/, '')));
const isBuiltin = (path: string) => path.startsWith('node:') || builtins.has(path.split('/')[0]);

/** Bundles packages/<name>/src/index.ts for the browser; @penumbra/* resolve to their sources, built-ins are recorded and left external. */
async function bundle(name: string): Promise<{ code: string; builtinImports: BuiltinImport[] }> {
  const builtinImports: BuiltinImport[] = [];
  const plugin: esbuild.Plugin = {
    name: 'penumbra-sources-and-builtins',
    setup(build) {
      build.onResolve({ filter: /^@penumbra\/[a-z-]+(\/internal)?$/ }, (args) => {
        const [, pkg, subpath] = /^@penumbra\/([a-z-]+)(?:\/(internal))?$/.exec(args.path)!;
        return { path: join(root, 'packages', pkg, 'src', `${subpath ?? 'index'}.ts`) };
      });
      build.onResolve({ filter: /.*/ }, (args) => {
        if (!isBuiltin(args.path)) return undefined;
        builtinImports.push({ path: args.path, importer: args.importer.replace(root, '') });
        return { path: args.path, external: true };
      });
    },
  };
  const result = await esbuild.build({
    entryPoints: [join(root, 'packages', name, 'src', 'index.ts')],
    bundle: true,
    platform: 'browser',
    format: 'esm',
    target: 'es2022',
    write: false,
    logLevel: 'silent',
    plugins: [plugin],
  });
  return { code: result.outputFiles[0].text, builtinImports };
}

async function expectNoBuiltins(name: string): Promise<string> {
  const { code, builtinImports } = await bundle(name);
  expect(builtinImports, `Node built-ins imported by the ${name} bundle`).toEqual([]);
  return code;
}

describe('browser bundles (esbuild, platform browser, format esm) import no Node built-in', () => {
  for (const name of ['core', 'kerr', 'spheroidal', 'regge-wheeler', 'near-region']) {
    test(`packages/${name}: no node: or bare built-in import in the bundle`, async () => {
      await expectNoBuiltins(name);
    });
  }

  test('packages/radial: no node: or bare built-in import in the bundle', async () => {
    await expectNoBuiltins('radial');
  });

  test('packages/emission: no node: or bare built-in import in the bundle', async () => {
    await expectNoBuiltins('emission');
  });

  test('packages/flux: no built-in import, and the bundle imported as an ES module gives Γ(s=1, l=m=1, a=0.5, Mω=0.3) equal to the in-process value to 1e-12 relative', async () => {
    const code = await expectNoBuiltins('flux');
    const file = join(scratch, 'flux.bundle.mjs');
    writeFileSync(file, code);
    const fluxBundle = (await import(/* @vite-ignore */ pathToFileURL(file).href)) as typeof fluxInProcess;
    const expected = oneGreybodyFactor(fluxInProcess);
    expect(Math.abs(oneGreybodyFactor(fluxBundle) / expected - 1)).toBeLessThan(1e-12);
  });
});
