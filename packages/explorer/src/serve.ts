/**
 * Serves a built explorer folder on localhost with Node's own HTTP server:
 * GET and HEAD of the folder's files only, nothing outside it.
 */
import { readFile } from 'node:fs/promises';
import { createServer } from 'node:http';
import { extname, join, normalize, sep } from 'node:path';

const TYPES: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.json': 'application/json',
};

/** A running explorer server. */
export interface ExplorerServer {
  /** the page's address, e.g. http://127.0.0.1:8765/ */
  url: string;
  /** stop listening; resolves when the server is closed */
  close(): Promise<void>;
}

/** Serve `root` on host:port (port 0 picks a free one). */
export function serveExplorer(root: string, options: { host?: string; port?: number } = {}): Promise<ExplorerServer> {
  const { host = '127.0.0.1', port = 0 } = options;
  const base = normalize(root + sep);
  const server = createServer(async (request, response) => {
    if (request.method !== 'GET' && request.method !== 'HEAD') {
      response.writeHead(405, { allow: 'GET, HEAD' }).end();
      return;
    }
    const path = decodeURIComponent(new URL(request.url ?? '/', 'http://localhost').pathname);
    const file = normalize(join(base, path === '/' ? 'index.html' : path));
    if (!file.startsWith(base)) {
      response.writeHead(403).end();
      return;
    }
    try {
      const body = await readFile(file);
      response.writeHead(200, {
        'content-type': TYPES[extname(file)] ?? 'application/octet-stream',
        'cache-control': 'no-store',
      });
      response.end(request.method === 'HEAD' ? undefined : body);
    } catch {
      response.writeHead(404, { 'content-type': 'text/plain' }).end('not found\n');
    }
  });
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => {
      const address = server.address();
      const actual = typeof address === 'object' && address ? address.port : port;
      const shownHost = host.includes(':') ? `[${host}]` : host;
      resolve({
        url: `http://${shownHost}:${actual}/`,
        close: () => new Promise<void>((done) => server.close(() => done())),
      });
    });
  });
}
