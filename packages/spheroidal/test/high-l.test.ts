/**
 * Eigenvalues at the top of the l range (core's MAX_L = 230; the documented
 * sums reach l ≈ 200 at c = aω up to 30): s = 0 against the oblate spheroidal
 * characteristic values of scipy.special.obl_cv (scipy 1.17.1), A_{0lm}(c) =
 * obl_cv(|m|, l, c) (the convention of fixtures/make_oblate_fixture.py), and
 * the exact symmetry A_{−s} = A_{s} + 2s (Teukolsky 1973; physics notes).
 */
import { describe, expect, it } from 'vitest';
import { spheroidalEigenvalue } from '@penumbra/spheroidal';

// scipy.special.obl_cv(m, l, c), scipy 1.17.1, printed with repr()
const OBL_CV: [number, number, number, number][] = [
  [200, 100, 30, 39861.82787366002],
  [200, 200, 30, 40197.75432936197],
  [150, 3, 30, 22201.28892014421],
];

describe('spheroidal eigenvalues at l = 150 … 200, c = 30', () => {
  for (const [l, m, c, cv] of OBL_CV) {
    it(`s = 0, l = ${l}, m = ${m}, c = ${c}: A equals scipy's obl_cv to 1e-13 relative`, () => {
      expect(Math.abs(spheroidalEigenvalue({ s: 0, l, m, c }).A / cv - 1)).toBeLessThanOrEqual(1e-13);
    });
  }
  it('s = ±2, l = 200, m = 0 and ±200, c = 30: A_{−2} = A_{+2} + 4 to 1e-13 relative (exact symmetry)', () => {
    for (const m of [0, 200, -200]) {
      const plus = spheroidalEigenvalue({ s: 2, l: 200, m, c: 30 }).A;
      const minus = spheroidalEigenvalue({ s: -2, l: 200, m, c: 30 }).A;
      expect(Math.abs((minus - plus - 4) / plus)).toBeLessThanOrEqual(1e-13);
    }
  });
});
