import { describe, expect, test } from 'vitest';
import { closest, isInaccurate, warnInaccurate } from '@penumbra/cli/internal';
import { run } from './helpers.js';

const oneLine = /^penumbra: [^\n]+\n$/;

describe('one meaning of --mass, visible accuracy warnings, honest milestones, helpful option errors', () => {
  test.each([
    ['kerr', '--a', '0.5', '--mass', '2'],
    ['emission', '--a', '0', '--spin', '0', '--mass', '1e15'],
    ['evolve', '--a', '0.5', '--mass', '1e15'],
  ])('%s … --mass without --unit is refused in every command: exit 2, one line naming --unit', async (...argv) => {
    const r = await run(...argv);
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(oneLine);
    expect(r.stderr).toMatch(/--mass needs --unit \(g, kg, msun/);
  });

  test.each([
    ['kerr', '--a', '0.5', '--unit', 'g'],
    ['emission', '--a', '0', '--spin', '0', '--unit', 'kg'],
    ['evolve', '--a', '0.5', '--unit', 'msun'],
  ])('%s … --unit without --mass is refused in every command: exit 2, one line', async (...argv) => {
    const r = await run(...argv);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(oneLine);
    expect(r.stderr).toMatch(/--unit needs --mass/);
  });

  test('kerr --unit geometric scales the geometric quantities with M, --unit g keeps them in units of M: Schwarzschild r+ = 2M (any GR text) to 1e-12', async () => {
    const phys = JSON.parse((await run('kerr', '--a', '0', '--mass', '1e15', '--unit', 'g', '--json')).stdout);
    const geo = JSON.parse((await run('kerr', '--a', '0', '--mass', '3', '--unit', 'geometric', '--json')).stdout);
    expect(Math.abs(geo.rPlus / 6 - 1)).toBeLessThan(1e-12);
    expect(Math.abs(phys.rPlus / 2 - 1)).toBeLessThan(1e-12);
  });

  test('evolve --a 0.5 reports no crossing of its own starting value; --below 0.6,0.5,0.4 marks 0.6 and 0.5 as reached at the start (time 0)', async () => {
    const text = (await run('evolve', '--a', '0.5', '--points', '3')).stdout;
    expect(text).not.toMatch(/a\* < 0\.5/);
    expect(text).toMatch(/a\* < 0\.1 after/);
    const j = JSON.parse((await run('evolve', '--a', '0.5', '--below', '0.6,0.5,0.4', '--points', '3', '--json')).stdout);
    expect(j.crossings.map((c: { atStart: boolean }) => c.atStart)).toEqual([true, true, false]);
    expect(j.crossings[0].timeSeconds).toBe(0);
    expect(j.crossings[1].timeSeconds).toBe(0);
    expect(j.crossings[2].timeSeconds).toBeGreaterThan(0);
    expect(j.crossings[2].timeSeconds).toBeLessThan(j.lifetimeSeconds);
  });

  test('evolve JSON carries the lifetime relError (the diagnostics errorEstimate) and inaccurate: false for the shipped table (errorEstimate < 1e-3)', async () => {
    const j = JSON.parse((await run('evolve', '--a', '0.5', '--points', '3', '--json')).stdout);
    expect(j.relError).toBe(j.diagnostics.errorEstimate);
    expect(j.relError).toBeLessThan(1e-3);
    expect(j.inaccurate).toBe(false);
  });

  test('a value above the 1e-3 limit is flagged and warned in one stderr line; values within it are silent (common practice, no source)', () => {
    expect(isInaccurate(0.36)).toBe(true);
    expect(isInaccurate(1e-3)).toBe(false);
    expect(isInaccurate(Number.NaN)).toBe(true);
    let stderr = '';
    const io = {
      stdout: () => {},
      stderr: (t: string) => {
        stderr += t;
      },
    };
    warnInaccurate(io, [{ what: 'lifetime', relError: 1e-5 }]);
    expect(stderr).toBe('');
    warnInaccurate(io, [
      { what: 'lifetime', relError: 0.36 },
      ...[1, 2, 3, 4].map((i) => ({ what: `σ at Mω = ${i}`, relError: 0.01 })),
    ]);
    expect(stderr).toMatch(oneLine);
    expect(stderr).toMatch(/warning: estimated relative error above 0\.001: lifetime \(3\.6e-1\), .* and 2 more/);
  });

  test('a mistyped option gets "did you mean": --omgea → --omega, --contnet → --content; exit 2, one line', async () => {
    const r = await run('greybody', '--spin', '0', '--l', '0', '--m', '0', '--a', '0', '--omgea', '0.3');
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(oneLine);
    expect(r.stderr).toMatch(/unknown option '--omgea'; did you mean --omega\?/);
    expect((await run('evolve', '--a', '0.5', '--contnet', 'photon')).stderr).toMatch(/did you mean --content\?/);
    expect((await run('kerr', '--a', '0.5', '--zzz', '1')).stderr).not.toMatch(/did you mean/);
    expect(closest('omgea', ['omega', 'tol'])).toBe('omega');
    expect(closest('x', ['omega', 'tol'])).toBeUndefined();
  });

  test('evolve --content names the species the command line can take, never {name, spin, dof}; exit 2, one line', async () => {
    const r = await run('evolve', '--a', '0.5', '--content', 'photn');
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(oneLine);
    expect(r.stderr).toMatch(
      /--content expects a comma-separated list of photon, graviton, .*got 'photn'; did you mean photon\?/,
    );
    expect(r.stderr).not.toMatch(/spin, dof/);
  });

  test('cross-section --omega takes a list W1,W2 as table does: two rows at exactly those frequencies', async () => {
    const r = await run('cross-section', '--spin', '0', '--a', '0', '--omega', '0.0001,0.001', '--tol', '1e-4', '--json');
    expect(r.code).toBe(0);
    expect(JSON.parse(r.stdout).map((x: { omega: number }) => x.omega)).toEqual([0.0001, 0.001]);
    const mixed = await run('cross-section', '--spin', '0', '--a', '0', '--omega', '0.1,0.2:0.3:2');
    expect(mixed.code).toBe(2);
    expect(mixed.stderr).toMatch(oneLine);
  });

  test.each(['greybody', 'cross-section', 'emission', 'spheroidal', 'table', 'kerr', 'evolve'])(
    '%s --help states its limits (a Limits: block)',
    async (name) => {
      const help = (await run(name, '--help')).stdout;
      expect(help).toMatch(/\nLimits:\n/);
      if (['greybody', 'spheroidal', 'table'].includes(name)) expect(help).toMatch(/l from \|s\| to \d+/);
      if (['greybody', 'cross-section', 'emission', 'table'].includes(name)) expect(help).toMatch(/Mω from .* to 30/);
    },
  );
});
