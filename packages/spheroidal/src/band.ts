import { bandTerms, combineTerms } from './bandTerms.js';
import { lowestL } from './quantum.js';

/**
 * The spectral matrix K(c) = diag((l−s)(l+s+1)) − c² X² + 2cs X in the
 * basis u_l, l = lFirst, lFirst + stride, … (X = matrix of cosθ). Its
 * eigenvalues are the A_{slm}(c). Stored by diagonals: K is symmetric and
 * pentadiagonal (tridiagonal when stride = 2).
 *
 * For s = 0 the problem has parity x → −x, K only couples l to l ± 2, and we
 * keep just the parity block of the wanted l: in that block the eigenvalues are
 * well separated, whereas across blocks they pair up exponentially closely at
 * large |c|.
 */
export interface Band {
  s: number;
  m: number;
  c: number;
  lFirst: number;
  stride: 1 | 2;
  size: number;
  d0: Float64Array;
  d1: Float64Array;
  d2: Float64Array;
  /** ∂K/∂c, for Hellmann–Feynman derivatives dA/dc. */
  e0: Float64Array;
  e1: Float64Array;
  e2: Float64Array;
  /** max row sum of |K|: the scale for tolerances. */
  norm: number;
}

/** Where the wanted l sits in the basis: first l kept, stride (2 keeps one parity block for s = 0) and its index. */
export function basisLayout(s: number, l: number, m: number): { lFirst: number; stride: 1 | 2; index: number } {
  const lmin = lowestL(s, m);
  if (s === 0) {
    const parity = (l - lmin) % 2;
    return { lFirst: lmin + parity, stride: 2, index: (l - lmin - parity) / 2 };
  }
  return { lFirst: lmin, stride: 1, index: l - lmin };
}

/**
 * The real band K(c) and ∂K/∂c for real c, assembled from the shared terms
 * (bandTerms.ts); into `reuse` when it holds the six diagonals (the store of
 * a band no longer read: eigenvalue.ts passes the last band of the same mode).
 */
export function buildBand(
  s: number,
  m: number,
  c: number,
  lFirst: number,
  stride: 1 | 2,
  size: number,
  reuse?: ArrayBufferLike,
): Band {
  const terms = bandTerms(s, m, lFirst, stride, size);
  const [x2Diagonal, x2First, x2Second] = terms.squared;
  const [xDiagonal, xFirst] = terms.linear;
  // One backing store for the six diagonals: a typed-array allocation with its own
  // store costs about 1 µs, six of them were a quarter of a warm eigenvalue solve.
  // (a store of its own is allocated outside the JS heap: reusing one was measured at ~15 % of a warm solve, with its garbage collection)
  const buffer = reuse !== undefined && reuse.byteLength >= 48 * size ? reuse : new ArrayBuffer(48 * size);
  const d0 = new Float64Array(buffer, 0, size);
  const d1 = new Float64Array(buffer, 8 * size, size);
  const d2 = new Float64Array(buffer, 16 * size, size);
  const e0 = new Float64Array(buffer, 24 * size, size);
  const e1 = new Float64Array(buffer, 32 * size, size);
  const e2 = new Float64Array(buffer, 40 * size, size);
  // K = A₀ + pX² + qX with p = −c², q = 2cs; ∂K/∂c has p = −2c, q = 2s.
  const p = -(c * c);
  const q = 2 * c * s;
  const dp = -2 * c;
  const dq = 2 * s;
  combineTerms(d0, size, terms.spherical, p, x2Diagonal, q, xDiagonal);
  combineTerms(e0, size, null, dp, x2Diagonal, dq, xDiagonal);
  combineTerms(d1, size, null, p, x2First, q, xFirst);
  combineTerms(e1, size, null, dp, x2First, dq, xFirst);
  if (x2Second) {
    combineTerms(d2, size, null, p, x2Second, 0, null);
    combineTerms(e2, size, null, dp, x2Second, 0, null);
  } else {
    d2.fill(0);
    e2.fill(0);
  }
  let norm = 0;
  for (let i = 0; i < size; i++) {
    const row =
      Math.abs(d0[i]) + Math.abs(d1[i]) + Math.abs(d2[i]) + (i > 0 ? Math.abs(d1[i - 1]) : 0) + (i > 1 ? Math.abs(d2[i - 2]) : 0);
    if (row > norm) norm = row;
  }
  return { s, m, c, lFirst, stride, size, d0, d1, d2, e0, e1, e2, norm: Math.max(norm, 1) };
}

/** y = K x for a banded symmetric matrix given by its diagonals. */
export function bandMultiply(
  d0: Float64Array,
  d1: Float64Array,
  d2: Float64Array,
  n: number,
  x: Float64Array,
  y: Float64Array,
): void {
  for (let i = 0; i < n; i++) {
    let v = d0[i] * x[i];
    if (i + 1 < n) v += d1[i] * x[i + 1];
    if (i + 2 < n) v += d2[i] * x[i + 2];
    if (i >= 1) v += d1[i - 1] * x[i - 1];
    if (i >= 2) v += d2[i - 2] * x[i - 2];
    y[i] = v;
  }
}

/** xᵀ K x. */
export function bandQuadratic(d0: Float64Array, d1: Float64Array, d2: Float64Array, n: number, x: Float64Array): number {
  let q = 0;
  for (let i = 0; i < n; i++) {
    let v = d0[i] * x[i];
    if (i + 1 < n) v += 2 * d1[i] * x[i + 1];
    if (i + 2 < n) v += 2 * d2[i] * x[i + 2];
    q += x[i] * v;
  }
  return q;
}

/** Workspace for the LDLᵀ factorisation of K − σI (no pivoting). */
export class BandFactor {
  readonly D: Float64Array;
  readonly L1: Float64Array;
  readonly L2: Float64Array;
  constructor(readonly capacity: number) {
    this.D = new Float64Array(capacity);
    this.L1 = new Float64Array(capacity);
    this.L2 = new Float64Array(capacity);
  }

  /**
   * Factor K − σI = L D Lᵀ and return the number of negative pivots, which by
   * Sylvester's law of inertia is the number of eigenvalues below σ. Tiny
   * pivots are nudged to ±pivmin, as in LAPACK's Sturm counts.
   */
  factor(band: Band, n: number, sigma: number): number {
    const { d0, d1, d2 } = band;
    const { D, L1, L2 } = this;
    const pivmin = 1e-300 + 1e-30 * band.norm;
    let negatives = 0;
    for (let i = 0; i < n; i++) {
      let d = d0[i] - sigma;
      if (i >= 1) d -= L1[i - 1] * L1[i - 1] * D[i - 1];
      if (i >= 2) d -= L2[i - 2] * L2[i - 2] * D[i - 2];
      if (Math.abs(d) < pivmin) d = d < 0 ? -pivmin : pivmin;
      D[i] = d;
      if (d < 0) negatives++;
      let off = i + 1 < n ? d1[i] : 0;
      if (i >= 1 && i + 1 < n) off -= L2[i - 1] * L1[i - 1] * D[i - 1];
      L1[i] = off / d;
      L2[i] = i + 2 < n ? d2[i] / d : 0;
    }
    return negatives;
  }

  /**
   * The count of `factor` (the same operations in the same order, so the same
   * count bit for bit) without storing the factors: the last two pivots and
   * multipliers stay in locals. For the Sylvester bisections, which only read
   * the count.
   */
  count(band: Band, n: number, sigma: number): number {
    const { d0, d1, d2 } = band;
    const pivmin = 1e-300 + 1e-30 * band.norm;
    let negatives = 0;
    // pivots D[i−1], D[i−2] and multipliers L1[i−1], L2[i−1], L2[i−2]
    let D1 = 0;
    let D2 = 0;
    let L1prev = 0;
    let L2prev = 0;
    let L2prev2 = 0;
    for (let i = 0; i < n; i++) {
      let d = d0[i] - sigma;
      if (i >= 1) d -= L1prev * L1prev * D1;
      if (i >= 2) d -= L2prev2 * L2prev2 * D2;
      if (Math.abs(d) < pivmin) d = d < 0 ? -pivmin : pivmin;
      if (d < 0) negatives++;
      let off = i + 1 < n ? d1[i] : 0;
      if (i >= 1 && i + 1 < n) off -= L2prev * L1prev * D1;
      D2 = D1;
      D1 = d;
      L2prev2 = L2prev;
      L1prev = off / d;
      L2prev = i + 2 < n ? d2[i] / d : 0;
    }
    return negatives;
  }

  /**
   * The counts of `count` at three shifts at once, into out[0..2] (each the same operations in the same order as
   * `count`, so the same integer): each count is bound by the latency of its own recurrence (a division and two
   * products a row), and three independent ones share a pass. Measured in settleEigenvalue (warm solves, a new c
   * each, 20,000 random problems settled to the same doubles with the same counts): s = 1, l = 100, m = 50,
   * c = 0.99 13.6 → 12.2 µs a solve; s = 1, l = 3, m = 1, c = 0.5 6.0 → 5.8 µs.
   */
  count3(band: Band, n: number, sa: number, sb: number, sc: number, out: Int32Array): void {
    const { d0, d1, d2 } = band;
    const pivmin = 1e-300 + 1e-30 * band.norm;
    let na = 0,
      nb = 0,
      nc = 0;
    let aD1 = 0,
      aD2 = 0,
      aL1 = 0,
      aL2 = 0,
      aL22 = 0;
    let bD1 = 0,
      bD2 = 0,
      bL1 = 0,
      bL2 = 0,
      bL22 = 0;
    let cD1 = 0,
      cD2 = 0,
      cL1 = 0,
      cL2 = 0,
      cL22 = 0;
    for (let i = 0; i < n; i++) {
      let da = d0[i] - sa,
        db = d0[i] - sb,
        dc = d0[i] - sc;
      if (i >= 1) {
        da -= aL1 * aL1 * aD1;
        db -= bL1 * bL1 * bD1;
        dc -= cL1 * cL1 * cD1;
      }
      if (i >= 2) {
        da -= aL22 * aL22 * aD2;
        db -= bL22 * bL22 * bD2;
        dc -= cL22 * cL22 * cD2;
      }
      if (Math.abs(da) < pivmin) da = da < 0 ? -pivmin : pivmin;
      if (Math.abs(db) < pivmin) db = db < 0 ? -pivmin : pivmin;
      if (Math.abs(dc) < pivmin) dc = dc < 0 ? -pivmin : pivmin;
      if (da < 0) na++;
      if (db < 0) nb++;
      if (dc < 0) nc++;
      const off = i + 1 < n ? d1[i] : 0;
      let oa = off,
        ob = off,
        oc = off;
      if (i >= 1 && i + 1 < n) {
        oa -= aL2 * aL1 * aD1;
        ob -= bL2 * bL1 * bD1;
        oc -= cL2 * cL1 * cD1;
      }
      const e2 = i + 2 < n ? d2[i] : 0;
      aD2 = aD1;
      aD1 = da;
      aL22 = aL2;
      aL1 = oa / da;
      aL2 = i + 2 < n ? e2 / da : 0;
      bD2 = bD1;
      bD1 = db;
      bL22 = bL2;
      bL1 = ob / db;
      bL2 = i + 2 < n ? e2 / db : 0;
      cD2 = cD1;
      cD1 = dc;
      cL22 = cL2;
      cL1 = oc / dc;
      cL2 = i + 2 < n ? e2 / dc : 0;
    }
    out[0] = na;
    out[1] = nb;
    out[2] = nc;
  }

  /** Solve (K − σI) y = x in place using the last factorisation. */
  solve(n: number, x: Float64Array): void {
    const { D, L1, L2 } = this;
    for (let i = 1; i < n; i++) {
      x[i] -= L1[i - 1] * x[i - 1];
      if (i >= 2) x[i] -= L2[i - 2] * x[i - 2];
    }
    for (let i = 0; i < n; i++) x[i] /= D[i];
    for (let i = n - 2; i >= 0; i--) {
      x[i] -= L1[i] * x[i + 1];
      if (i + 2 < n) x[i] -= L2[i] * x[i + 2];
    }
  }
}
