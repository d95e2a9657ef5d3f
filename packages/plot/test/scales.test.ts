import { describe, expect, test } from 'vitest';
import fc from 'fast-check';
import { autoScale, tickLabel } from '@penumbra/plot';
import { roundOut, smallestMagnitude, symlogConstant, symlogTicks } from '../src/internal.js';

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
  test('gives zero, the rounded-out ends and the decades between, with 1, 2, 5 in each decade when there are two or fewer', () => {
    // negative side: only the end −0.002 (it is the linear width); positive side 0.002 … 0.05: 1, 2, 5 per decade up to the end
    expect(symlogTicks([-0.002, 0.05])).toEqual([-0.002, 0, 0.002, 0.005, 0.01, 0.02, 0.05]);
    // three decades: powers of ten only, up to the end 0.9 rounded out to 1
    expect(symlogTicks([-0.002, 0.3, 0.9])).toEqual([-0.002, 0, 0.01, 0.1, 1]);
    expect(symlogTicks([])).toEqual([-1, 0, 1]); // no data: the axis spans −1 … 1
  });

  test('reaches the extreme of the data: the superradiant minimum −0.555 gets the end tick −0.6 and every decade from 10⁻⁶ of the peak', () => {
    const ticks = symlogTicks([-0.555, -1e-9, 0.5, 1]);
    expect(ticks[0]).toBe(-0.6);
    for (const t of [-0.1, -0.01, -1e-3, -1e-4, -1e-5, 0, 1e-5, 1e-3, 0.1, 1]) expect(ticks).toContain(t);
    expect(symlogConstant([-0.555, -1e-9, 1])).toBe(1e-6);
  });

  test('rounds domain ends out to 1, 1.5, 2, 3, 4, 5, 6 or 8 times a power of ten, keeping a round number exceeded by under 1 %', () => {
    expect([0.555, -0.555, 0.93, 1.0000001, 1.02, 2.2e-7].map(roundOut)).toEqual([0.6, -0.6, 1, 1, 1.5, 3e-7]);
  });

  test('labels ticks as a physicist writes them: decimals from 0.001, superscript powers of ten beyond, true minus signs', () => {
    expect([0, 0.6, -0.01, 1e-4, -2e-5, 3e18, 1000].map(tickLabel)).toEqual([
      '0',
      '0.6',
      '−0.01',
      '10⁻⁴',
      '−2×10⁻⁵',
      '3×10¹⁸',
      '1000',
    ]);
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
