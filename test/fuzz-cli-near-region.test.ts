/**
 * Hostile command lines for `penumbra near-region`, at a fixed seed, in the
 * manner of packages/cli/test/fuzz.test.ts: the exit code is 0, 2 or 3, and a
 * failing run writes exactly one line to stderr with no stack trace. Work is
 * bounded: --tol 1e-2 and short grids.
 */
import { describe, expect, test } from 'vitest';
import fc from 'fast-check';
import { run } from '../packages/cli/test/helpers.js';

const SEED = 20261203;
const HOSTILE = [
  '',
  ' ',
  '0x1',
  'Infinity',
  'NaN',
  '1e999',
  '-1e999',
  '1e-400',
  '1:2',
  '1:2:0',
  '::',
  '--',
  '-',
  'abc',
  '💥',
  '-5',
  '99999',
];
const hostileValue = fc.oneof(fc.constantFrom(...HOSTILE), fc.string({ maxLength: 6 }));
const PLAUSIBLE: Record<string, string[]> = {
  a: ['0', '0.5', '-0.9', '0.99', '0.99995', '1', '1e-9', '1e-300'],
  spin: ['0', '1/2', '0.5', '1', '2', '3'],
  l: ['0', '1', '2', '1/2', '3/2', '-1', '101'],
  m: ['0', '1', '-1', '1/2', '-1/2', '2'],
  omega: ['0.1', '1e-3', '1e-5', '1e-6', '0.01:0.1:2', '31', '0'],
  tol: ['1e-2', '1e-3', '1e-13', '0.5'],
};
const OPTIONS = Object.keys(PLAUSIBLE);
const FLAGS = ['--json', '--csv', '--log'];

const value = (name: string) =>
  fc.oneof({ weight: 4, arbitrary: fc.constantFrom(...PLAUSIBLE[name]) }, { weight: 1, arbitrary: hostileValue });

/** Random options in random order, hostile or plausible values, stray tokens. */
const randomArgv = fc
  .array(
    fc.oneof(
      {
        weight: 6,
        arbitrary: fc
          .constantFrom(...OPTIONS, 'bogus')
          .chain((n) => (n === 'bogus' ? hostileValue : value(n)).map((v) => [`--${n}`, v])),
      },
      { weight: 2, arbitrary: fc.constantFrom(...FLAGS).map((f) => [f]) },
      { weight: 1, arbitrary: fc.constantFrom(['stray'], ['--'], ['-x'], ['--tol']) },
    ),
    { maxLength: 8 },
  )
  .map((parts) => ['near-region', ...parts.flat()]);

/** Every option given: a valid mode and hole most of the time, a hostile value now and then; cheap tolerance. */
const VALID_MODES = [
  ['0', '0', '0'],
  ['0', '1', '1'],
  ['1/2', '1/2', '-1/2'],
  ['1', '1', '1'],
  ['2', '2', '2'],
  ['2', '3', '-1'],
];
const completeArgv = fc
  .tuple(
    fc.constantFrom(...VALID_MODES),
    value('spin'),
    fc.boolean(),
    fc.oneof({ weight: 4, arbitrary: fc.constantFrom('0.5', '0.9', '0.99') }, { weight: 1, arbitrary: value('a') }),
    fc.oneof({ weight: 4, arbitrary: fc.constantFrom('1e-3', '0.05', '1e-3:0.01:2') }, { weight: 1, arbitrary: value('omega') }),
    fc.subarray(FLAGS),
  )
  .map(([[spin, l, m], otherSpin, keep, a, omega, flags]) => [
    'near-region',
    ...['--spin', keep ? spin : otherSpin, '--l', l, '--m', m, '--a', a, '--omega', omega],
    ...flags,
    '--tol',
    '1e-2',
  ]);

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

describe('hostile command lines for penumbra near-region (fast-check, fixed seed)', () => {
  test('random options and hostile values exit 0, 2 or 3 with one stderr line and no stack trace (seeded, 80 runs)', async () => {
    await fc.assert(fc.asyncProperty(randomArgv, check), { seed: SEED, numRuns: 80 });
  });

  test('every option given (mostly plausible values, --tol 1e-2) exits 0, 2 or 3 with one stderr line (seeded, 80 runs)', async () => {
    await fc.assert(fc.asyncProperty(completeArgv, check), { seed: SEED, numRuns: 80 });
  });

  test('the fuzz reaches the comparison: some command lines succeed (exit 0) and many are refused (exit 2)', () => {
    console.log(`near-region cli fuzz exit codes: ${JSON.stringify(Object.fromEntries(tally))}`);
    expect(tally.get(0) ?? 0).toBeGreaterThan(5);
    expect(tally.get(2) ?? 0).toBeGreaterThan(50);
  });
});
