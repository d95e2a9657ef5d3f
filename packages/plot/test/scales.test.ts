import { describe, expect, test } from 'vitest';
import fc from 'fast-check';
import { autoScale } from '@penumbra/plot';
import { smallestMagnitude, symlogTicks } from '../src/internal.js';

describe('autoScale', () => {
  test('is linear below a span of 100 (by default) or with fewer than two nonzero values, log for positive data spanning more, symlog for data of both signs', () => {
    expect(autoScale([1, 50])).toBe('linear');
    expect(autoScale([1, 100])).toBe('log');
    expect(autoScale([-1, 100])).toBe('symlog');
    expect(autoScale([0, 0, 5])).toBe('linear');
    expect(autoScale([])).toBe('linear');
    expect(autoScale([0.02, 0.4], 20)).toBe('log');
    expect(autoScale([0.02, 0.3], 20)).toBe('linear');
  });

  test('takes large data sets (no argument-list overflow on 300 000 values)', () => {
    const values = Array.from({ length: 300_000 }, (_, i) => 1 + i);
    expect(autoScale(values)).toBe('log');
    expect(smallestMagnitude(values)).toBe(1);
  });
});

describe('symlogTicks', () => {
  test('gives zero and signed powers of ten reaching past the data on each side', () => {
    expect(symlogTicks([-0.002, 0.3, 0.9])).toEqual([-0.01, -0.001, 0, 0.001, 0.01, 0.1, 1]);
    expect(symlogTicks([])).toEqual([0]);
  });

  test('gives at most 15 ticks, in increasing order and always with zero, for any data (property, 100 runs)', () => {
    const value = fc.double({ min: -1e30, max: 1e30, noNaN: true });
    fc.assert(
      fc.property(fc.array(value, { minLength: 1, maxLength: 50 }), (values) => {
        const ticks = symlogTicks(values);
        expect(ticks).toContain(0);
        expect(ticks.length).toBeLessThanOrEqual(15);
        expect([...ticks].sort((p, q) => p - q)).toEqual(ticks);
      }),
    );
  });
});
