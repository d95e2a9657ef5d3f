import { spawn } from 'node:child_process';
import { mkdirSync, mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, test } from 'vitest';
import { run } from './helpers.js';

const work = mkdtempSync(join(tmpdir(), 'penumbra-explore-cli-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

describe('penumbra explore', () => {
  test('--out DIR writes the static page (index.html, style.css, main.js, worker.js) and exits 0', async () => {
    const out = join(work, 'site');
    const r = await run('explore', '--out', out);
    expect(r.code).toBe(0);
    expect(r.stdout).toContain(out);
    expect(readdirSync(out).sort()).toEqual(['index.html', 'main.js', 'style.css', 'worker.js']);
    // A second build into the same folder is allowed: it holds only an earlier build.
    expect((await run('explore', '--out', out)).code).toBe(0);
  });

  test('a folder holding other files, a bad port and --out with --port are refused with exit 2 and one line', async () => {
    const busy = join(work, 'busy');
    mkdirSync(busy);
    writeFileSync(join(busy, 'thesis.tex'), '');
    for (const argv of [
      ['--out', busy],
      ['--port', '70000'],
      ['--port', 'http'],
      ['--out', join(work, 'x'), '--port', '1'],
      ['--colour', 'red'],
    ]) {
      const r = await run('explore', ...argv);
      expect(r.code, argv.join(' ')).toBe(2);
      expect(r.stderr.trim().split('\n')).toHaveLength(1);
      expect(r.stdout).toBe('');
    }
  });

  test('the executable serves the page on a free port, prints its address, answers GET / and stops on SIGINT with exit 0', async () => {
    const bin = fileURLToPath(new URL('../bin/penumbra.js', import.meta.url));
    const child = spawn(process.execPath, [bin, 'explore', '--port', '0'], { stdio: ['ignore', 'pipe', 'pipe'] });
    const url = await new Promise<string>((resolve, reject) => {
      let text = '';
      child.stdout.on('data', (chunk: Buffer) => {
        text += chunk.toString();
        const match = /http:\/\/\S+\//.exec(text);
        if (match) resolve(match[0]);
      });
      child.once('exit', (code) => reject(new Error(`exited ${code} before serving`)));
    });
    const page = await fetch(url);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain('penumbra explorer');
    expect((await fetch(`${url}worker.js`)).headers.get('content-type')).toContain('javascript');
    expect((await fetch(`${url}..%2f..%2fetc%2fpasswd`)).status).toBeGreaterThanOrEqual(400);
    const exited = new Promise<number | null>((resolve) => child.once('exit', resolve));
    child.kill('SIGINT');
    expect(await exited).toBe(0);
  });
});
