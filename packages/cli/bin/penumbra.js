#!/usr/bin/env node
// Shim for the penumbra executable: the code lives in ../dist, built by `npm ci` (root "prepare": tsc -b).
let main;
try {
  ({ main } = await import('../dist/main.js'));
} catch (error) {
  if (error?.code !== 'ERR_MODULE_NOT_FOUND') throw error;
  process.stderr.write('penumbra: not built yet; run `npm run build` (or `npm ci`) at the repository root\n');
  process.exit(1);
}
process.exitCode = await main(process.argv.slice(2));
