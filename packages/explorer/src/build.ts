/**
 * Writes the explorer as a static folder: index.html, style.css and two
 * bundles (the page and its worker) made by esbuild from the workspace
 * packages. The folder can be served by any static web server.
 */
import { copyFileSync, existsSync, mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';

/** The files a built explorer folder holds. */
export const EXPLORER_FILES = ['index.html', 'style.css', 'main.js', 'worker.js'] as const;

/** Build the explorer into `outDir` (created if missing); resolves to the folder's path. */
export async function buildExplorer(outDir: string): Promise<string> {
  mkdirSync(outDir, { recursive: true });
  // Compiled page modules beside this file, or (run from the sources, as the tests do) the TypeScript ones.
  const page = (name: string) => {
    const js = fileURLToPath(new URL(`./page/${name}.js`, import.meta.url));
    return existsSync(js) ? js : js.replace(/\.js$/, '.ts');
  };
  await build({
    entryPoints: { main: page('main'), worker: page('worker') },
    outdir: outDir,
    bundle: true,
    format: 'esm',
    platform: 'browser',
    target: 'es2022',
    minify: true,
    legalComments: 'none',
    logLevel: 'silent',
  });
  for (const name of ['index.html', 'style.css']) {
    copyFileSync(fileURLToPath(new URL(`../static/${name}`, import.meta.url)), join(outDir, name));
  }
  return outDir;
}
