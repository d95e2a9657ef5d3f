import { existsSync, mkdtempSync, readdirSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { buildExplorer, EXPLORER_FILES, serveExplorer } from '@penumbra/explorer';
import { UsageError, type Command } from '../command.js';
import { parseNumber, parseOptions } from '../options.js';

const DEFAULT_PORT = 8765;

/** `penumbra explore`. */
export const command: Command = {
  name: 'explore',
  summary: 'an explorer page in the browser: Γ(ω), σ(ω), emission spectra and evaporation, computed in the page',
  usage: `Usage: penumbra explore [--port N] [--host H]
       penumbra explore --out DIR

Builds the explorer page from the installed penumbra packages and serves it
on this machine with Node's own HTTP server, printing its address; stop it
with Ctrl-C. Every computation runs in the browser, in a Web Worker, with
the same library functions as the command line; the page's state is in its
address, so a view can be shared. With --out, writes the page as a static
folder (index.html, style.css, main.js, worker.js) that any web server can
host, and exits.

Options:
  --port N     port to listen on (default ${DEFAULT_PORT}; 0 picks a free one)
  --host H     address to listen on (default 127.0.0.1, this machine only)
  --out DIR    write the static folder to DIR (new, empty, or an earlier
               explorer build) instead of serving
  -h, --help   this text

Examples:
  penumbra explore
  penumbra explore --out site/
`,
  async run(argv, io) {
    const { values } = parseOptions(argv, { port: { type: 'string' }, host: { type: 'string' }, out: { type: 'string' } });
    if (values.out !== undefined) {
      if (values.port !== undefined || values.host !== undefined)
        throw new UsageError('--out builds a folder and serves nothing: drop --port/--host');
      const out = resolve(values.out);
      checkOutDir(out);
      await buildExplorer(out);
      io.stdout(`explorer written to ${out} (${EXPLORER_FILES.join(', ')})\n`);
      return 0;
    }
    const port =
      values.port === undefined ? DEFAULT_PORT : parseNumber('--port', values.port, { min: 0, max: 65535, integer: true });
    const host = values.host ?? '127.0.0.1';
    const dir = mkdtempSync(join(tmpdir(), 'penumbra-explore-'));
    try {
      await buildExplorer(dir);
      const server = await serveExplorer(dir, { host, port }).catch((error: NodeJS.ErrnoException) => {
        if (error.code === 'EADDRINUSE')
          throw new UsageError(`--port ${port} is in use on ${host}; choose another (0 picks a free one)`);
        if (error.code === 'EADDRNOTAVAIL' || error.code === 'ENOTFOUND')
          throw new UsageError(`--host ${host} is not an address of this machine`);
        throw error;
      });
      io.stdout(`penumbra explorer at ${server.url} (Ctrl-C to stop)\n`);
      await new Promise<void>((done) => {
        process.once('SIGINT', done);
        process.once('SIGTERM', done);
      });
      await server.close();
      return 0;
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  },
};

/** A new or empty folder, or one that holds an earlier build, and nothing else. */
function checkOutDir(out: string): void {
  if (!existsSync(out)) return;
  if (!statSync(out).isDirectory()) throw new UsageError(`--out ${out} is a file, not a folder`);
  const extra = readdirSync(out).filter((name) => !(EXPLORER_FILES as readonly string[]).includes(name));
  if (extra.length > 0)
    throw new UsageError(`--out ${out} holds other files (${extra.slice(0, 3).join(', ')}); give a new or empty folder`);
}
