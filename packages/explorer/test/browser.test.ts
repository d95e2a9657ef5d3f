/**
 * The explorer in a real browser: Debian's Chromium (installed by .ci/run),
 * driven by playwright-core. The page's printed numbers must equal the
 * library's to the last printed digit, and bad input must show an error, not
 * a number.
 */
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { emissionSpectrum, toPhysicalSpectrum } from '@penumbra/emission';
import { greybody } from '@penumbra/flux';
import { buildExplorer, printNumber, serveExplorer, type ExplorerServer } from '../src/index.js';

const CHROMIUM = process.env.PENUMBRA_CHROMIUM ?? '/usr/bin/chromium';
// CI (.ci/run) installs Chromium and sets PENUMBRA_REQUIRE_BROWSER=1, so there a missing browser fails;
// on a fresh machine without it the suite still runs, and the summary line counts these tests as skipped.
const haveBrowser = existsSync(CHROMIUM);
if (!haveBrowser && process.env.PENUMBRA_REQUIRE_BROWSER === '1') {
  throw new Error(`PENUMBRA_REQUIRE_BROWSER=1 but no Chromium at ${CHROMIUM} (apt-get install chromium)`);
}
let dir: string;
let server: ExplorerServer;
let browser: Browser;

beforeAll(async () => {
  if (!haveBrowser) return;
  dir = mkdtempSync(join(tmpdir(), 'penumbra-explorer-'));
  await buildExplorer(dir);
  server = await serveExplorer(dir);
  browser = await chromium.launch({
    executablePath: CHROMIUM,
    // No background networking: this machine's network is closed, and the page needs none.
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}, 120_000);

afterAll(async () => {
  await browser?.close();
  await server?.close();
  if (dir) rmSync(dir, { recursive: true, force: true });
});

async function open(query: string): Promise<Page> {
  const page = await browser.newPage();
  await page.goto(`${server.url}?${query}`);
  return page;
}

async function finished(page: Page): Promise<string> {
  await page.waitForFunction(
    () => {
      const s = document.getElementById('status');
      return s && (s.className === 'error' || s.textContent?.startsWith('done'));
    },
    undefined,
    { timeout: 90_000 },
  );
  return (await page.textContent('#status')) ?? '';
}

const column = (page: Page, index: number) =>
  page.$$eval(`#table tbody tr td:nth-child(${index + 1})`, (cells) => cells.map((c) => c.textContent ?? ''));

describe.skipIf(!haveBrowser)('the explorer page in headless Chromium (Debian chromium, playwright-core)', () => {
  test('Γ of s = 1, l = m = 1 at a = 0.9 shown on the page equals flux greybody to the last printed digit', async () => {
    const page = await open('view=greybody&a=0.9&spin=1&l=1&m=1&from=0.1&to=0.5&count=3');
    expect(await finished(page)).toMatch(/^done: 3 rows/);
    const omegas = await column(page, 2);
    const gammas = await column(page, 3);
    expect(gammas).toHaveLength(3);
    omegas.forEach((w, i) => {
      const g = greybody({ hole: { a: 0.9 }, mode: { field: { spin: 1 }, l: 1, m: 1 }, omega: Number(w) }, { tol: 1e-8 });
      expect(gammas[i]).toBe(printNumber(g.gamma));
    });
    expect(await page.$eval('#figure svg', (svg) => svg.outerHTML.length)).toBeGreaterThan(1000);
    // The URL holds the state: reloading it recomputes the same view.
    expect(page.url()).toContain('view=greybody');
    await page.close();
  });

  test('the photon spectrum of a 1e15 g hole in GeV⁻¹ s⁻¹ equals emissionSpectrum × 2 dof to the last printed digit', async () => {
    const page = await open('view=spectrum&a=0.5&mass=1e15&unit=g&species=photon&from=0.1&to=1&count=3&spacing=log&tol=1e-4');
    expect(await finished(page)).toMatch(/^done/);
    const rates = await column(page, 2);
    const spectrum = emissionSpectrum({ hole: { a: 0.5 }, field: { spin: 1 }, grid: [0.1, Math.sqrt(0.1), 1] }, { tol: 1e-4 });
    const expected = spectrum.points.map((p) => printNumber(2 * toPhysicalSpectrum(p, 1e15, 'g').perGeVPerSecond));
    expect(rates).toEqual(expected);
    await page.close();
  });

  test.each([
    ['a ≥ 1', 'view=greybody&a=1', 'hole.a'],
    ['ω ≤ 0', 'view=greybody&from=-0.1', 'from'],
    ['l < |s|', 'view=greybody&spin=2&l=1&m=1', 'mode.l'],
  ])('%s (query %s) shows an error naming %s and no numbers', async (_what, query, parameter) => {
    const page = await open(query);
    const status = await finished(page);
    expect(status).toContain(`invalid ${parameter}`);
    expect(await page.$$('#table td')).toHaveLength(0);
    await page.close();
  });

  test('a long computation shows progress and stops when cancelled', async () => {
    const page = await open('view=greybody&a=0.99&spin=2&l=2,3,4&m=all&from=0.05&to=3&count=60');
    await page.waitForFunction(() => document.getElementById('status')?.textContent?.includes('/'), undefined, {
      timeout: 60_000,
    });
    await page.click('#cancel');
    expect(await page.textContent('#status')).toBe('cancelled');
    expect(await page.$$('#table td')).toHaveLength(0);
    await page.close();
  });

  test('the table downloads as CSV with units in the header', async () => {
    const page = await open('view=greybody&a=0.5&spin=0&l=1&m=1&from=0.2&to=0.4&count=2');
    await finished(page);
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('#download-csv')]);
    const path = await download.path();
    const { readFileSync } = await import('node:fs');
    const text = readFileSync(path, 'utf8');
    expect(text.split('\n')[0]).toBe('l [1],m [1],omega [1/M],gamma [1],relError [1]');
    expect(text.trim().split('\n')).toHaveLength(3);
    await page.close();
  });
});
