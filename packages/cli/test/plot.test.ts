import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { chmodSync, cpSync, existsSync, mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { ensureBuilt, writeGridFile } from '../../grid/test/support.js';
import { run } from './helpers.js';

// Γ(ω) of s = 0, l ≤ 1 at a = 0.9 over two decades, plus σ(ω): 5 points.
const GRID = {
  fieldSpins: [0],
  holeA: [0.9],
  frequencies: { spacing: 'log', from: 0.02, to: 2, count: 5 },
  l: { max: 1 },
  tolerance: 1e-6,
  quantities: ['gamma'],
};

/** The text content of every <text> element. */
const texts = (svg: string) => [...svg.matchAll(/<text[^>]*>([^<]*)<\/text>/g)].map((m) => m[1]);
/** The tick labels of the y axes (Vega marks each axis group with its title in aria-label). */
const yTickLabels = (svg: string) =>
  [...svg.matchAll(/aria-label="Y-axis[^"]*"[\s\S]*?role-axis-label[^>]*>([\s\S]*?)<\/g>/g)].flatMap((m) => texts(m[1]));

let work = '';
let buildProblem: string | undefined;

beforeAll(async () => {
  buildProblem = ensureBuilt();
  work = mkdtempSync(join(tmpdir(), 'penumbra-plot-'));
  if (buildProblem) return;
  const table = await run('table', writeGridFile(work, GRID), '--out', join(work, 'table'), '--workers', '2', '--quiet');
  if (table.code !== 0) throw new Error(table.stderr);
}, 180_000);
afterAll(() => rmSync(work, { recursive: true, force: true }));

describe('penumbra plot', () => {
  test('draws Γ(ω) by mode as SVG with labelled axes, units and logarithmic axes for data spanning decades', async (context) => {
    if (buildProblem) context.skip(buildProblem);
    const out = join(work, 'gamma.svg');
    const result = await run('plot', join(work, 'table'), '--out', out);
    expect(result.code, result.stderr).toBe(0);
    expect(result.stderr).toMatch(/gamma: 4 series, 20 points; log x axis, symlog y axis/);
    const svg = readFileSync(out, 'utf8');
    expect(svg.startsWith('<svg')).toBe(true);
    const labels = texts(svg);
    for (const label of ['ω [1/M]', 'Γₛₗₘ', 'm = 1', 'm = −1', 'l = 0', 'l = 1', 'Ωₕ', 'superradiant'])
      expect(labels).toContain(label);
    expect(labels.some((t) => t.startsWith('s = 0, a = 0.9 M'))).toBe(true);
    // the superradiant band is drawn, and the symmetric-log axis has a tick in every decade from 10⁻⁶ of the peak to the ends
    expect(svg).toContain('fill="#fbe3b8"');
    const ticks = yTickLabels(svg);
    expect(ticks).toContain('0');
    const negative = ticks.filter((t) => t.startsWith('−'));
    expect(negative.length).toBeGreaterThanOrEqual(3);
  });

  test("reads the table's own modes.csv as well as its table.json: the same series and points", async (context) => {
    if (buildProblem) context.skip(buildProblem);
    const fromCsv = await run('plot', join(work, 'table', 'modes.csv'), '--out', join(work, 'csv.svg'));
    const fromJson = await run('plot', join(work, 'table', 'table.json'), '--out', join(work, 'json.svg'));
    expect(fromCsv.code, fromCsv.stderr).toBe(0);
    expect(fromCsv.stderr.replace(/wrote .*/, '')).toBe(fromJson.stderr.replace(/wrote .*/, ''));
  });

  test('--l and --m select modes: one series, a linear y axis for Γ > 0 data, and the rest left out of the legend', async (context) => {
    if (buildProblem) context.skip(buildProblem);
    const out = join(work, 'l1m1.svg');
    const result = await run('plot', join(work, 'table'), '--l', '1', '--m', '0:1', '--y-scale', 'log', '--out', out);
    expect(result.code, result.stderr).toBe(0);
    expect(result.stderr).toMatch(/gamma: 2 series/);
    const labels = texts(readFileSync(out, 'utf8'));
    expect(labels).toContain('m = 0');
    expect(labels).not.toContain('m = −1');
  });

  test('reads table.json directly and draws the same figure bytes twice (deterministic output)', async (context) => {
    if (buildProblem) context.skip(buildProblem);
    const a = await run(
      'plot',
      join(work, 'table', 'table.json'),
      '--quantity',
      'gamma',
      '--spin',
      '0',
      '--a',
      '0.9',
      '--out',
      join(work, 'a.svg'),
    );
    const b = await run('plot', join(work, 'table'), '--out', join(work, 'b.svg'));
    expect(a.code, a.stderr).toBe(0);
    expect(b.code, b.stderr).toBe(0);
    expect(readFileSync(join(work, 'a.svg'), 'utf8')).toBe(readFileSync(join(work, 'b.svg'), 'utf8'));
  });

  test('a quantity the table lacks, a spin not in it or a missing table: exit 2, one message, no file', async (context) => {
    if (buildProblem) context.skip(buildProblem);
    const cases: [string[], RegExp][] = [
      [['--quantity', 'crossSection'], /the data has no crossSection; it can draw gamma, amplification/],
      [['--spin', '2'], /field spin 2 is not in the data \(it has 0\)/],
      [['--quantity', 'flux'], /--quantity expects one of/],
    ];
    for (const [args, message] of cases) {
      const out = join(work, 'bad.svg');
      const result = await run('plot', join(work, 'table'), ...args, '--out', out);
      expect(result.code).toBe(2);
      expect(result.stderr).toMatch(/^penumbra: [^\n]+\n$/);
      expect(result.stderr).toMatch(message);
      expect(existsSync(out)).toBe(false);
    }
    const missing = await run('plot', join(work, 'nowhere'), '--out', join(work, 'bad.svg'));
    expect(missing.code).toBe(2);
    expect(missing.stderr).toMatch(/does not exist/);
  });

  test('a read-only (0444) target is refused with exit 2 and left unchanged, even for root', async (context) => {
    if (buildProblem) context.skip(buildProblem);
    const out = join(work, 'readonly.svg');
    writeFileSync(out, 'keep');
    chmodSync(out, 0o444);
    const result = await run('plot', join(work, 'table'), '--out', out);
    expect(result.code).toBe(2);
    expect(result.stderr).toMatch(/^penumbra: --out [^\n]*readonly\.svg is read-only; refusing to replace it[^\n]*\n$/);
    expect(readFileSync(out, 'utf8')).toBe('keep');
    expect(statSync(out).mode & 0o777).toBe(0o444);
  });

  test('a write that fails (no such directory under /proc) is one line naming --out and the error code, exit 2, not an internal error', async (context) => {
    if (buildProblem) context.skip(buildProblem);
    if (!existsSync('/proc/self')) context.skip('no /proc');
    const result = await run('plot', join(work, 'table'), '--out', '/proc/penumbra-test.svg');
    expect(result.code).toBe(2);
    expect(result.stderr).toMatch(
      /^penumbra: invalid --out = "\/proc\/penumbra-test\.svg": allowed a file penumbra can write \(E[A-Z]+\)\n$/,
    );
  });

  test('rows of the wrong shape are refused with one line naming the file and the first bad entry, exit 2, no file written', async (context) => {
    if (buildProblem) context.skip(buildProblem);
    const mutations: [(row: Record<string, unknown>) => void, RegExp][] = [
      [(r) => (r.gamma = 'abc'), /rows\[0\]\.gamma = "abc" is not a finite number/],
      [(r) => delete r.omega, /rows\[0\]\.omega = undefined is not a finite number/],
      [(r) => (r.status = 5), /rows\[0\]\.status is not a string/],
    ];
    for (const [mutate, message] of mutations) {
      const dir = join(work, 'bad-table');
      rmSync(dir, { recursive: true, force: true });
      cpSync(join(work, 'table'), dir, { recursive: true });
      const file = JSON.parse(readFileSync(join(dir, 'table.json'), 'utf8'));
      for (const row of file.tables.modes.rows) mutate(row);
      writeFileSync(join(dir, 'table.json'), JSON.stringify(file));
      const out = join(work, 'bad-shape.svg');
      const result = await run('plot', dir, '--out', out);
      expect(result.code).toBe(2);
      expect(result.stderr).toMatch(/^penumbra: cannot read [^\n]*bad-table: not a well-formed penumbra table [^\n]*\n$/);
      expect(result.stderr).toMatch(message);
      expect(existsSync(out)).toBe(false);
    }
    writeFileSync(
      join(work, 'null-rows.json'),
      JSON.stringify({ format: 'penumbra-grid-table/2', tables: { modes: { columns: [], rows: [null] } } }),
    );
    const nullRows = await run('plot', join(work, 'null-rows.json'), '--out', join(work, 'bad-shape.svg'));
    expect(nullRows.code).toBe(2);
    expect(nullRows.stderr).toMatch(/^penumbra: cannot read [^\n]*null-rows\.json: not a well-formed penumbra table[^\n]*\n$/);
    expect(nullRows.stderr).not.toMatch(/Cannot read properties|Cannot destructure/);
  });
});
