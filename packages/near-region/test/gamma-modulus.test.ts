import { expect, test } from 'vitest';
import { readFileSync } from 'node:fs';
import { logAbsGammaSquared } from '../src/gammaModulus.js';

const fixture = JSON.parse(readFileSync(new URL('./fixtures/gamma-modulus.json', import.meta.url), 'utf8')) as {
  rows: { h: number; y: number; logAbsGammaSquared: number }[];
};

test('ln |Γ(h + iy)|² matches mpmath loggamma (60 digits; fixtures/make-gamma-modulus-fixture.py) to 1e-13 absolute + 1e-14 relative for h = 1/2 … 11, |y| ≤ 300', () => {
  expect(fixture.rows.length).toBe(49);
  for (const { h, y, logAbsGammaSquared: expected } of fixture.rows) {
    const value = logAbsGammaSquared(h, y);
    expect(Math.abs(value - expected), `h = ${h}, y = ${y}`).toBeLessThan(1e-13 + 1e-14 * Math.abs(expected));
  }
});
