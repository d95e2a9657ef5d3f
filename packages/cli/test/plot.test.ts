import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
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
    expect(result.stderr).toMatch(/gamma: 4 series, 20 points; log ω axis, symlog y axis/);
    const svg = readFileSync(out, 'utf8');
    expect(svg.startsWith('<svg')).toBe(true);
    expect(svg).toContain('ω [1/M]');
    expect(svg).toContain('Γ (absorbed fraction of the incident flux, dimensionless)');
    expect(svg).toContain('l = 1, m = 1');
    expect(svg).toContain('s = 0, a = 0.9 M');
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
      [['--quantity', 'crossSection'], /the table has no crossSection; it can draw gamma/],
      [['--spin', '2'], /field spin 2 is not in the table \(it has 0\)/],
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
});
