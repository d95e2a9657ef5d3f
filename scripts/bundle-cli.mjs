// Bundles the penumbra executable (packages/cli/dist after `tsc -b`) with esbuild into
// packages/cli/bundle/: a file per lazily loaded command plus shared chunks, instead of ~150 ES
// modules that Node 20 resolves, reads and links one by one (about 0.1 s of every start,
// bench/emission-one-process.bench.mjs). The commands built on grid, plot and explorer (table,
// merge, plot, explore) keep loading dist/: those packages find files next to their own modules.
// bundle/inputs.json lists every bundled file with its size and mtime, paths relative to
// bundle/; bin/penumbra.js uses the bundle only while all of them are unchanged, so a build
// without this step (plain `tsc -b`) never runs stale code.
import { rmSync, statSync, writeFileSync } from 'node:fs';
import { dirname, join, relative, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..');
const cli = join(root, 'packages', 'cli');
const outdir = join(cli, 'bundle');
/** Packages left to dist/ (the shim sends their commands there) or not bundleable. */
const EXTERNAL = ['@penumbra/grid', '@penumbra/plot', '@penumbra/explorer', 'esbuild', '@resvg/resvg-js', 'playwright-core'];

rmSync(outdir, { recursive: true, force: true });
let build;
try {
  ({ build } = await import('esbuild'));
} catch (error) {
  if (error?.code !== 'ERR_MODULE_NOT_FOUND') throw error;
  // Without the dev dependencies the executable simply runs dist/.
  console.log('bundle-cli: esbuild not installed; the executable runs packages/cli/dist/');
  process.exit(0);
}
const result = await build({
  entryPoints: [join(cli, 'dist', 'main.js')],
  bundle: true,
  splitting: true,
  format: 'esm',
  platform: 'node',
  target: 'node20',
  outdir,
  external: EXTERNAL,
  metafile: true,
  logLevel: 'warning',
  absWorkingDir: root,
});
const inputs = Object.keys(result.metafile.inputs).map((input) => {
  const path = resolve(root, input);
  const { size, mtimeMs } = statSync(path);
  return { path: relative(outdir, path), size, mtimeMs };
});
writeFileSync(join(outdir, 'inputs.json'), `${JSON.stringify(inputs)}\n`);
console.log(`bundle-cli: ${inputs.length} modules into ${relative(root, outdir)}/`);
