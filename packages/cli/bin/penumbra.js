#!/usr/bin/env node
// Shim for the penumbra executable: the code lives in ../dist, built by `npm ci` (root "prepare":
// tsc -b), or in ../bundle, the same code in a few files (scripts/bundle-cli.mjs), which starts
// about 0.1 s sooner. The bundle is used only while every file it was made from is unchanged.
import { readFileSync, statSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

/** Commands whose packages (grid, plot, explorer) stay outside the bundle. */
const UNBUNDLED = new Set(['table', 'merge', 'plot', 'explore']);

function bundleIsCurrent() {
  try {
    // plain path strings: a URL per input doubled the check's ~7 ms
    const base = fileURLToPath(new URL('../bundle/', import.meta.url));
    const inputs = JSON.parse(readFileSync(`${base}inputs.json`, 'utf8'));
    return inputs.every(({ path, size, mtimeMs }) => {
      const stat = statSync(base + path);
      return stat.size === size && stat.mtimeMs === mtimeMs;
    });
  } catch {
    return false;
  }
}

let main;
try {
  const useBundle = !UNBUNDLED.has(process.argv[2]) && bundleIsCurrent();
  ({ main } = await import(useBundle ? '../bundle/main.js' : '../dist/main.js'));
} catch (error) {
  if (error?.code !== 'ERR_MODULE_NOT_FOUND') throw error;
  process.stderr.write('penumbra: not built yet; run `npm run build` (or `npm ci`) at the repository root\n');
  process.exit(1);
}
process.exitCode = await main(process.argv.slice(2));
