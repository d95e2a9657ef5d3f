/**
 * Hostile command lines for every penumbra command, at fixed seeds: random
 * argv drawn from a grammar of the real options with hostile values. The
 * property: the exit code is 0, 2 or 3, and a failing run writes exactly one
 * line to stderr with no stack trace and no "internal error". Work is
 * bounded: cheap commands get plausible values with --tol 1e-2 and short
 * grids; the expensive ones (demo, emission, evolve, table, merge) only get
 * values that fail validation, so they never start a long computation.
 */
import { afterAll, describe, expect, test } from 'vitest';
import fc from 'fast-check';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { run } from './helpers.js';

const SEED = 20261203;
/** bench/fuzz.bench.mjs sets PENUMBRA_FUZZ_SCALE to multiply every run count (same seed). */
const SCALE = Math.max(1, Number(process.env.PENUMBRA_FUZZ_SCALE ?? 1) || 1);
const work = mkdtempSync(join(tmpdir(), 'penumbra-fuzz-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

/** Values no option accepts (or that are out of every range). */
const HOSTILE = [
  '',
  ' ',
  '0x1',
  '0b1',
  '0o7',
  'Infinity',
  '-Infinity',
  'NaN',
  'nan',
  '1e999',
  '-1e999',
  '1e308',
  '-1e308',
  '1e-400',
  '1_0',
  '1,',
  ',',
  '::',
  '1:2',
  '1:2:0',
  '1:2:1e9',
  '1/0',
  '--',
  '-',
  '--json',
  'abc',
  '\u0000',
  '💥',
  '1e',
  '.',
  '+',
  '-5',
  '99999',
  '0:0:2',
  '-1:-2:3',
];
const hostileValue = fc.oneof(fc.constantFrom(...HOSTILE), fc.string({ maxLength: 6 }));

/** Plausible values per option of the cheap commands (bounded work). */
const PLAUSIBLE: Record<string, string[]> = {
  a: ['0', '0.5', '-0.9', '0.99', '1', '1.2'],
  spin: ['0', '1/2', '0.5', '1', '2', '3', '-1'],
  l: ['0', '1', '2', '1/2', '3/2', '-1', '101'],
  m: ['0', '1', '-1', '1/2', '-1/2', '2'],
  omega: ['0.1', '0.3', '1e-5', '0.01:0.5:3', '0.1:0.2:2', '31', '0'],
  tol: ['1e-2', '1e-3', '1e-13', '0.5'],
  'field-mass': ['0', '0.05', '0.3', '-0.1', '30', '135'],
  'field-mass-unit': ['MeV', 'GeV', 'eV', 'TeV'],
  mass: ['1', '2', '1e15', '1e155', '1e-160'],
  unit: ['g', 'kg', 'msun', 'lb'],
  c: ['0', '0.5', '-2', '1e3'],
  theta: ['0', '1.5', '0:3.14:4', '-1'],
};
const FLAGS: Record<string, string[]> = {
  kerr: ['--json'],
  greybody: ['--json', '--csv', '--log'],
  'cross-section': ['--json', '--csv', '--log'],
  spheroidal: ['--json'],
  emission: ['--json', '--csv'],
  evolve: ['--json', '--csv'],
  table: ['--quiet'],
  demo: ['--json', '--csv'],
  merge: [],
  plot: [],
  explore: [],
};
const OPTIONS: Record<string, string[]> = {
  kerr: ['a', 'mass', 'unit'],
  greybody: ['spin', 'l', 'm', 'a', 'omega', 'tol', 'field-mass', 'field-mass-unit', 'mass', 'unit'],
  'cross-section': ['spin', 'a', 'omega', 'tol', 'field-mass', 'field-mass-unit', 'mass', 'unit'],
  spheroidal: ['spin', 'l', 'm', 'c', 'a', 'omega', 'theta'],
  emission: ['a', 'spin', 'mass', 'unit', 'omega', 'tol', 'content', 'energy', 'confinement-scale'],
  evolve: ['a', 'mass', 'unit', 'content', 'confinement-scale', 'final', 'spectrum', 'below', 'table-points', 'points'],
  table: ['out', 'workers', 'shard', 'spins', 'a', 'omega', 'spacing', 'l', 'tol', 'quantities', 'chunk-size'],
  demo: [],
  merge: ['out'],
  plot: ['out', 'quantity', 'spin', 'a'],
  explore: ['port', 'host', 'out'],
};
// explore always carries a poison value too: a valid command line would serve until interrupted.
const EXPENSIVE = new Set(['demo', 'emission', 'evolve', 'table', 'merge', 'explore']);

/** One command line for `command`: options in random order, hostile or plausible values, stray tokens. */
function argvFor(command: string): fc.Arbitrary<string[]> {
  const expensive = EXPENSIVE.has(command);
  const value = (option: string) =>
    expensive || !PLAUSIBLE[option]
      ? hostileValue
      : fc.oneof({ weight: 3, arbitrary: fc.constantFrom(...PLAUSIBLE[option]) }, { weight: 1, arbitrary: hostileValue });
  const option = fc.constantFrom(...OPTIONS[command], 'bogus').chain((name) => value(name).map((v) => [`--${name}`, v]));
  const flag = FLAGS[command].length ? fc.constantFrom(...FLAGS[command]).map((f) => [f]) : fc.constant([] as string[]);
  const stray = fc.constantFrom(['stray'], ['--'], ['-x'], ['--tol'], [join(work, 'missing')]);
  const parts = fc.array(
    fc.oneof({ weight: 6, arbitrary: option }, { weight: 2, arbitrary: flag }, { weight: 1, arbitrary: stray }),
    { maxLength: 7 },
  );
  // the expensive commands always carry one value that fails validation
  const poison = expensive
    ? fc.constantFrom(['--bogus', 'x'], [command === 'demo' ? 'stray' : '--a', 'NaN'])
    : fc.constant([] as string[]);
  return fc.tuple(parts, poison).map(([ps, p]) => [command, ...ps.flat(), ...p]);
}

/** A complete command line of a cheap command: every option given, mostly plausible values. */
function completeArgv(command: string): fc.Arbitrary<string[]> {
  const options = OPTIONS[command].map((name) =>
    fc
      .oneof({ weight: 5, arbitrary: fc.constantFrom(...PLAUSIBLE[name]) }, { weight: 1, arbitrary: hostileValue })
      .map((v) => [`--${name}`, v]),
  );
  const flags = fc.subarray(FLAGS[command]);
  return fc
    .tuple(fc.tuple(...options), flags)
    .map(([os, fs]) => [
      command,
      ...os.flat(),
      ...fs,
      ...(command === 'kerr' || command === 'spheroidal' ? [] : ['--tol', '1e-2']),
    ]);
}

/** Exit codes seen, so the last test can show that the fuzz reaches the solvers. */
const tally = new Map<number, number>();

async function check(argv: string[]): Promise<void> {
  const result = await run(...argv);
  tally.set(result.code, (tally.get(result.code) ?? 0) + 1);
  const context = `penumbra ${argv.map((a) => JSON.stringify(a)).join(' ')} → ${result.code}: ${result.stderr}`;
  expect([0, 2, 3], context).toContain(result.code);
  if (result.code !== 0) {
    expect(result.stderr, context).toMatch(/^penumbra: [^\n]*\n$/);
    expect(result.stderr, context).not.toMatch(/internal error|\n\s+at |TypeError|RangeError/);
  }
}

const COMMANDS = Object.keys(OPTIONS);
const RUNS: Record<string, number> = { greybody: 80, 'cross-section': 40, spheroidal: 80, kerr: 120, plot: 60 };

describe('hostile command lines (fast-check, fixed seed)', () => {
  test.each(COMMANDS)(
    'penumbra %s: random options and hostile values exit 0, 2 or 3 with one stderr line and no stack trace (seeded)',
    async (command) => {
      await fc.assert(fc.asyncProperty(argvFor(command), check), { seed: SEED, numRuns: (RUNS[command] ?? 40) * SCALE });
    },
  );

  test.each(['kerr', 'greybody', 'spheroidal', 'cross-section'])(
    'penumbra %s with every option given (mostly plausible values, --tol 1e-2) exits 0, 2 or 3 with one stderr line (seeded)',
    async (command) => {
      await fc.assert(fc.asyncProperty(completeArgv(command), check), {
        seed: SEED,
        numRuns: (command === 'cross-section' ? 25 : 80) * SCALE,
      });
    },
  );

  test('top level: hostile command names and tokens exit 0 or 2 with one stderr line (seeded, 60 runs)', async () => {
    const token = fc.oneof(
      fc.constantFrom(...HOSTILE, '--help', '-h', 'help', '--version', '-v', ...COMMANDS),
      fc.string({ maxLength: 5 }),
    );
    await fc.assert(
      fc.asyncProperty(fc.array(token, { minLength: 1, maxLength: 3 }), async (argv) => {
        // a bare command name would run it with no options (demo computes): keep a poison token
        await check(COMMANDS.includes(argv[0]) ? [...argv, '--bogus'] : argv);
      }),
      { seed: SEED, numRuns: 60 * SCALE },
    );
  });

  test('the fuzz reaches the solvers: some command lines succeed (exit 0) and many are refused (exit 2)', () => {
    console.log(`cli fuzz exit codes: ${JSON.stringify(Object.fromEntries(tally))}`);
    // exit 0 printed a result, 2 is a refused input (UsageError or InputError), 3 a ConvergenceError
    const classes = { finite: tally.get(0) ?? 0, InputError: tally.get(2) ?? 0, ConvergenceError: tally.get(3) ?? 0 };
    const other = [...tally.values()].reduce((a, b) => a + b, 0) - classes.finite - classes.InputError - classes.ConvergenceError;
    console.log(`cli fuzz outcomes: ${JSON.stringify({ ...classes, other })}`);
    expect(tally.get(0) ?? 0).toBeGreaterThan(20);
    expect(tally.get(2) ?? 0).toBeGreaterThan(200);
  });
});
