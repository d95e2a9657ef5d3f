import fc from 'fast-check';
import { describe, expect, test } from 'vitest';

describe('property tests are reproducible', () => {
  test('fast-check runs on the suite-wide fixed seed unless PENUMBRA_FC_SEED overrides it', () => {
    const expected = Number.isInteger(Number(process.env.PENUMBRA_FC_SEED)) ? Number(process.env.PENUMBRA_FC_SEED) : 20261203;
    expect(fc.readConfigureGlobal().seed).toBe(expected);
  });

  test('two runs of the same unseeded property draw the same first case', () => {
    const first = (): number => fc.sample(fc.integer(), { numRuns: 1 })[0] as number;
    expect(first()).toBe(first());
  });
});
