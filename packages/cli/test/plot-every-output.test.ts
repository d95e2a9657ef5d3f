import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Resvg } from '@resvg/resvg-js';
import { renderSvg } from '@penumbra/plot';
import { plotFigure, type PlotRow } from '@penumbra/cli/internal';
import { run } from './helpers.js';

/** Every command that writes JSON or CSV, with small, fast arguments. */
const COMMANDS: { name: string; args: string[]; formats: ('json' | 'csv')[]; draws?: RegExp }[] = [
  {
    name: 'greybody grid',
    args: ['greybody', '--spin', '1', '--l', '1', '--m', '1', '--a', '0.9', '--omega', '0.1:0.5:3', '--tol', '1e-4'],
    formats: ['json', 'csv'],
    draws: /gamma: 1 series, 3 points/,
  },
  {
    name: 'greybody point',
    args: ['greybody', '--spin', '0', '--l', '0', '--m', '0', '--a', '0', '--omega', '0.3', '--tol', '1e-4'],
    formats: ['json', 'csv'],
    draws: /gamma: 1 series, 1 points/,
  },
  {
    name: 'cross-section',
    args: ['cross-section', '--spin', '0', '--a', '0', '--omega', '0.2:0.4:2', '--tol', '1e-3'],
    formats: ['json', 'csv'],
    draws: /crossSection: 1 series, 2 points/,
  },
  {
    name: 'emission spectrum',
    args: ['emission', '--spin', '0', '--a', '0', '--omega', '0.1:0.3:3', '--mass', '1e15', '--unit', 'g', '--tol', '1e-3'],
    formats: ['json', 'csv'],
    draws: /spectra: 1 series, 3 points; log x axis, log y axis/,
  },
  { name: 'emission totals', args: ['emission', '--spin', '0', '--a', '0', '--tol', '1e-3'], formats: ['json', 'csv'] },
  {
    name: 'evolve',
    args: ['evolve', '--a', '0.5', '--mass', '1e15', '--unit', 'g', '--points', '6'],
    formats: ['json', 'csv'],
    draws: /track: 3 series/,
  },
  {
    name: 'spheroidal',
    args: ['spheroidal', '--spin', '-2', '--l', '2', '--m', '2', '--c', '1.5', '--theta', '0.1:3:5'],
    formats: ['json'],
    draws: /harmonic: 1 series, 5 points/,
  },
  { name: 'kerr', args: ['kerr', '--a', '0.9'], formats: ['json'] },
];

let work = '';
beforeAll(() => {
  work = mkdtempSync(join(tmpdir(), 'penumbra-plot-every-'));
});
afterAll(() => rmSync(work, { recursive: true, force: true }));

/** PNG width and height from the IHDR chunk. */
function pngSize(png: Uint8Array): [number, number] {
  const view = new DataView(png.buffer, png.byteOffset, png.byteLength);
  return [view.getUint32(16), view.getUint32(20)];
}

describe('penumbra plot reads what every command writes', () => {
  for (const c of COMMANDS) {
    for (const format of c.formats) {
      const what = c.draws
        ? 'draws it as an SVG that renders to a PNG of at least 500 × 300 px'
        : 'refuses it in one line naming what the file holds (single values, no series)';
      test(`${c.name} --${format}: ${what}`, async () => {
        const output = await run(...c.args, `--${format}`);
        expect(output.code, output.stderr).toBe(0);
        const file = join(work, `${c.name.replace(/ /g, '-')}.${format}`);
        writeFileSync(file, output.stdout);
        const out = `${file}.svg`;
        const plotted = await run('plot', file, '--out', out);
        if (!c.draws) {
          expect(plotted.code).toBe(2);
          expect(plotted.stderr).toMatch(/^penumbra: cannot read [^\n]*: (holds single values|its columns)[^\n]*\n$/);
          return;
        }
        expect(plotted.code, plotted.stderr).toBe(0);
        expect(plotted.stderr).toMatch(c.draws);
        const png = new Resvg(readFileSync(out, 'utf8'), { font: { loadSystemFonts: false } }).render().asPng();
        expect([...png.subarray(1, 4)].map((b) => String.fromCharCode(b)).join('')).toBe('PNG');
        const [width, height] = pngSize(png);
        expect(width).toBeGreaterThanOrEqual(500);
        expect(height).toBeGreaterThanOrEqual(300);
      }, 60_000);
    }
  }
});

describe('the figures of many modes', () => {
  test('24 modes (s = 1, l = 1 … 4, every m, a = 0.7) get 24 distinct (colour, dash) pairs, a colour legend by m and a dash legend by l', async () => {
    const rows: PlotRow[] = [];
    for (let l = 1; l <= 4; l++)
      for (let m = -l; m <= l; m++)
        for (const omega of [0.2, 0.6, 1])
          rows.push({ spin: 1, a: 0.7, l, m, omega, gamma: (0.1 * omega) / l + 0.001 * m, status: 'success' });
    const result = plotFigure([{ kind: 'modes', rows }], {});
    expect(result.series).toHaveLength(24);
    const svg = await renderSvg(result.figure);
    const lines = [
      ...svg.matchAll(/aria-roledescription="line mark" d="[^"]*" stroke="([^"]+)"[^>]*stroke-dasharray="([^"]+)"/g),
    ];
    expect(lines).toHaveLength(24);
    expect(new Set(lines.map((m) => `${m[1]} ${m[2]}`)).size).toBe(24);
    const labels = [...svg.matchAll(/<text[^>]*>([^<]*)<\/text>/g)].map((m) => m[1]);
    for (const entry of ['m', 'l', 'm = −4', 'm = 4', 'l = 1', 'l = 4']) expect(labels).toContain(entry);
  });

  test('at a = 0 the m of an l share one curve: one series per l, not one per (l, m)', () => {
    const rows: PlotRow[] = [];
    for (let l = 1; l <= 3; l++)
      for (let m = -l; m <= l; m++) for (const omega of [0.2, 0.6]) rows.push({ spin: 1, a: 0, l, m, omega, gamma: omega / l });
    const result = plotFigure([{ kind: 'modes', rows }], {});
    expect(result.series).toEqual(['l = 1 (every m)', 'l = 2 (every m)', 'l = 3 (every m)']);
  });
});
