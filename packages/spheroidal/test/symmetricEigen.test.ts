/**
 * The dense symmetric eigen-solver of the spheroidal cold start (tred2/tql2)
 * against the general-purpose library ml-matrix 6.15 (EigenvalueDecomposition,
 * assumeSymmetric), whose operation order it follows: the same doubles, on
 * random dense matrices and on spheroidal bands (fast-check).
 */
import { buildBand, symmetricEigen } from '@penumbra/spheroidal/internal';
import fc from 'fast-check';
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { describe, expect, it } from 'vitest';

function compare(a: Float64Array, n: number): void {
  const K = new Matrix(n, n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) K.set(i, j, a[i * n + j]);
  const reference = new EigenvalueDecomposition(K, { assumeSymmetric: true });
  const ours = symmetricEigen(a, n);
  const V = reference.eigenvectorMatrix;
  for (let k = 0; k < n; k++) {
    expect(Object.is(ours.values[k], reference.realEigenvalues[k])).toBe(true);
    for (let i = 0; i < n; i++) expect(Object.is(ours.vectors[k * n + i], V.get(i, k))).toBe(true);
  }
}

describe('symmetricEigen', () => {
  it('gives bit-identical eigenvalues and eigenvectors to ml-matrix on random symmetric matrices (n = 1 … 12)', () => {
    fc.assert(
      fc.property(
        fc
          .integer({ min: 1, max: 12 })
          .chain((n) =>
            fc.tuple(
              fc.constant(n),
              fc.array(fc.double({ min: -10, max: 10, noNaN: true }), { minLength: n * n, maxLength: n * n }),
            ),
          ),
        ([n, raw]) => {
          const a = new Float64Array(n * n);
          for (let i = 0; i < n; i++) for (let j = 0; j <= i; j++) a[i * n + j] = a[j * n + i] = raw[i * n + j];
          compare(a, n);
        },
      ),
      { numRuns: 200 },
    );
  });

  it('gives bit-identical results to ml-matrix on spheroidal bands (s, m, c as in the cold start)', () => {
    for (const [s, m, c, lFirst, stride] of [
      [-2, 2, 3.5, 2, 1],
      [0, 0, -12, 0, 2],
      [-0.5, 1.5, 25, 1.5, 1],
      [1, -1, 40, 1, 1],
    ] as const) {
      for (const size of [6, 17, 40]) {
        const band = buildBand(s, m, c, lFirst, stride, size);
        const a = new Float64Array(size * size);
        for (let i = 0; i < size; i++) {
          a[i * size + i] = band.d0[i];
          if (i + 1 < size) a[i * size + i + 1] = a[(i + 1) * size + i] = band.d1[i];
          if (i + 2 < size) a[i * size + i + 2] = a[(i + 2) * size + i] = band.d2[i];
        }
        compare(a, size);
      }
    }
  });
});
