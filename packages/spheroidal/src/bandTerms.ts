import { setBounded } from '@penumbra/core/internal';
import { cosDiagonal, cosOffDiagonal } from './coupling.js';
import { sphericalA0 } from './quantum.js';

/**
 * The c-independent pieces of the spectral matrix
 *   K(c) = diag(A₀) + p·X² + q·X,  p = −c², q = 2cs   (and ∂K/∂c: p = −2c, q = 2s)
 * in the basis u_l, l = lFirst, lFirst + stride, …, stored by the diagonals
 * the band keeps (X is the matrix of cosθ, coupling.ts). Real and complex c
 * assemble their bands from these same numbers with `combineTerms`, so the
 * matrix elements are written once.
 *
 * For stride 2 (s = 0, one parity block) the band is tridiagonal: X has no
 * element inside a parity block off the diagonal, and X² couples l to l ± 2.
 */
export interface BandTerms {
  /** rows available (at least the size asked for) */
  readonly length: number;
  /** A₀ = (l − s)(l + s + 1) on the diagonal */
  readonly spherical: Float64Array;
  /** X² on the diagonal and on the first and (stride 1) second band off-diagonals */
  readonly squared: readonly [Float64Array, Float64Array, Float64Array | null];
  /** X on the diagonal and (stride 1) on the first band off-diagonal */
  readonly linear: readonly [Float64Array, Float64Array | null];
}

/** Terms are cached per (s, m, lFirst, stride): building them dominated warm solves. */
const termsCache = new Map<number, BandTerms>();
const TERMS_CACHE_LIMIT = 1024;

/** The terms for (s, m, lFirst, stride) with at least `size` rows (cached, grown by doubling). */
export function bandTerms(s: number, m: number, lFirst: number, stride: 1 | 2, size: number): BandTerms {
  // one number per (s, m, lFirst, stride): |2s| ≤ 4, |2m| ≤ 2·MAX_L, 0 ≤ 2·lFirst ≤ 2·MAX_L (a string key was measured at a few % of a warm solve)
  const key = ((2 * lFirst * 2048 + (2 * m + 1024)) * 16 + (2 * s + 8)) * 4 + stride;
  const cached = termsCache.get(key);
  if (cached && cached.length >= size) return cached;
  const n = Math.max(size, 2 * (cached?.length ?? 0), 32);
  // Couplings a(l), b(l) over every l the rows touch (stride 1 indexing).
  const full = stride * (n - 1) + 3;
  const a = new Float64Array(full + 1);
  const b = new Float64Array(full + 1);
  for (let j = 0; j <= full; j++) {
    a[j] = cosOffDiagonal(lFirst + j, m, s);
    b[j] = cosDiagonal(lFirst + j, m, s);
  }
  const aBelow = cosOffDiagonal(lFirst - 1, m, s); // a(l−1) for l = lFirst (zero when lFirst = lmin)
  const spherical = new Float64Array(n);
  const x2Diagonal = new Float64Array(n);
  const x2First = new Float64Array(n);
  const x2Second = stride === 1 ? new Float64Array(n) : null;
  const xDiagonal = new Float64Array(n);
  const xFirst = stride === 1 ? new Float64Array(n) : null;
  for (let i = 0; i < n; i++) {
    const j = stride * i;
    const aPrev = j === 0 ? aBelow : a[j - 1];
    spherical[i] = sphericalA0(s, lFirst + j);
    x2Diagonal[i] = aPrev * aPrev + b[j] * b[j] + a[j] * a[j];
    xDiagonal[i] = b[j];
    const x2Skip = a[j] * a[j + 1]; // ⟨l|X²|l+2⟩
    if (x2Second && xFirst) {
      x2First[i] = a[j] * (b[j] + b[j + 1]); // ⟨l|X²|l+1⟩
      x2Second[i] = x2Skip;
      xFirst[i] = a[j];
    } else {
      x2First[i] = x2Skip;
    }
  }
  const terms: BandTerms = { length: n, spherical, squared: [x2Diagonal, x2First, x2Second], linear: [xDiagonal, xFirst] };
  setBounded(termsCache, key, terms, TERMS_CACHE_LIMIT);
  return terms;
}

/**
 * out[i] = base[i] + p·squared[i] + q·linear[i] for i < size, leaving out the
 * parts given as null: one diagonal (or one real/imaginary part of one) of
 * A₀ + pX² + qX. The evaluation order is fixed, so a real band and the real
 * part of a complex band at Im c = 0 agree bit for bit.
 */
export function combineTerms(
  out: Float64Array,
  size: number,
  base: Float64Array | null,
  p: number,
  squared: Float64Array,
  q: number,
  linear: Float64Array | null,
): void {
  if (base && linear) for (let i = 0; i < size; i++) out[i] = base[i] + p * squared[i] + q * linear[i];
  else if (linear) for (let i = 0; i < size; i++) out[i] = p * squared[i] + q * linear[i];
  else if (base) for (let i = 0; i < size; i++) out[i] = base[i] + p * squared[i];
  else for (let i = 0; i < size; i++) out[i] = p * squared[i];
}
