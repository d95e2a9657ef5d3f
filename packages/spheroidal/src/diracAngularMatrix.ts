/**
 * The Chandrasekhar angular pair of the massive Dirac field as a symmetric
 * matrix eigenproblem (derivation: docs/massive-dirac.md).
 *
 * With ℒ = D − aω sinθ, ℒ† = D̃ + aω sinθ, D = ∂θ + m/sinθ + ½cotθ,
 * D̃ = ∂θ − m/sinθ + ½cotθ, the pair
 *   ℒ S₊ = −(λ − aμ cosθ) S₋,   ℒ† S₋ = (λ + aμ cosθ) S₊
 * is λ (S₊, S₋) = H (S₊, S₋) with H = [[−aμ cosθ, ℒ†], [−ℒ, aμ cosθ]].
 * Basis: u_j, the orthonormal s = +1/2 spin-weighted harmonics (j ≥ |m|), and
 * v_j = D u_j/(j + ½), orthonormal because D̃D u_j = −(j + ½)² u_j. With
 * X = ⟨u|cosθ|u⟩ (coupling.ts) and L_j = (j + ½)²:
 *   ⟨v_i|cosθ|v_j⟩ = ½[(L_i + L_j − 1) X_ij + 2m δ_ij] / ((i + ½)(j + ½)),
 *   ⟨u_i|sinθ|v_j⟩ = ½[(L_i − L_j − 1) X_ij + 2m δ_ij] / (j + ½).
 */
import { cosDiagonal, cosOffDiagonal } from './coupling.js';

const S = 0.5;

function cosElement(ji: number, jj: number, m: number): number {
  if (ji === jj) return cosDiagonal(ji, m, S);
  if (ji === jj + 1) return cosOffDiagonal(jj, m, S);
  if (jj === ji + 1) return cosOffDiagonal(ji, m, S);
  return 0;
}

/** ⟨v_i|cosθ|v_j⟩ for the basis v_j = D u_j/(j + ½). */
export function cosElementLowered(ji: number, jj: number, m: number): number {
  const Li = (ji + 0.5) ** 2;
  const Lj = (jj + 0.5) ** 2;
  return (0.5 * ((Li + Lj - 1) * cosElement(ji, jj, m) + (ji === jj ? 2 * m : 0))) / ((ji + 0.5) * (jj + 0.5));
}

/** ⟨u_i|sinθ|v_j⟩. */
export function sinElementMixed(ji: number, jj: number, m: number): number {
  const Li = (ji + 0.5) ** 2;
  const Lj = (jj + 0.5) ** 2;
  return (0.5 * ((Li - Lj - 1) * cosElement(ji, jj, m) + (ji === jj ? 2 * m : 0))) / (jj + 0.5);
}

/** The matrix H as a symmetric band of half-width 3: H[i][i + k] = data[4i + k], k = 0…3. */
export interface DiracBand {
  size: number;
  /** the upper band, row by row (one array: a typed array per row was a visible share of a cold λ in allocation) */
  data: Float64Array;
  /** max row sum of |H| (bounds every eigenvalue) */
  norm: number;
}

/**
 * The truncated H in band storage, in the interleaved basis (u_{j0}, v_{j0},
 * u_{j0+1}, …), j0 = |m|, with `count` values of j (size 2·count).
 */
export function diracAngularBand(m: number, aOmega: number, aMu: number, count: number): DiracBand {
  const size = 2 * count;
  const data = new Float64Array(4 * size);
  const j0 = Math.abs(m);
  const set = (i: number, k: number, v: number) => {
    if (k >= i && k - i <= 3) data[4 * i + k - i] = v;
  };
  for (let p = 0; p < count; p++) {
    for (let q = Math.max(0, p - 1); q <= Math.min(count - 1, p + 1); q++) {
      const ji = j0 + p;
      const jj = j0 + q;
      set(2 * p, 2 * q, -aMu * cosElement(ji, jj, m));
      set(2 * p + 1, 2 * q + 1, aMu * cosElementLowered(ji, jj, m));
      const mixed = (p === q ? -(jj + 0.5) : 0) + aOmega * sinElementMixed(ji, jj, m);
      set(2 * p, 2 * q + 1, mixed);
      set(2 * q + 1, 2 * p, mixed);
    }
  }
  let norm = 0;
  for (let i = 0; i < size; i++) {
    let sum = 0;
    for (let k = 0; k < 4; k++) sum += Math.abs(data[4 * i + k]) + (k > 0 && i - k >= 0 ? Math.abs(data[4 * (i - k) + k]) : 0);
    norm = Math.max(norm, sum);
  }
  return { size, data, norm };
}

/**
 * Number of eigenvalues below σ (Sylvester's law of inertia on the LDLᵀ of
 * H − σI). With half-width 3, row i of L has L[i][i−3…i−1] only, so the
 * factorisation runs on a window of three rows in locals (the operations of
 * the textbook band loop, in its order; rows before the first read as L = 0,
 * d = 1, which subtract exact zeros): bisection calls it ~30 times per λ.
 */
export function countBelow(band: DiracBand, sigma: number): number {
  const n = band.size;
  const h = band.data;
  const tiny = Number.EPSILON * band.norm * 1e-3 + Number.MIN_VALUE;
  let negatives = 0;
  // d[i−1], d[i−2], d[i−3]; L[i−1][i−3], L[i−1][i−2]; L[i−2][i−3]
  let d1 = 1,
    d2 = 1,
    d3 = 1;
  let prevB = 0,
    prevC = 0,
    prevPrevC = 0;
  // ln|det(H − σ)| = Σ ln|d_i|, from a product rescaled as it grows or shrinks
  let product = 1;
  let logScale = 0;
  for (let i = 0; i < n; i++) {
    const o = 4 * i;
    const a = i >= 3 ? h[o - 12 + 3] / d3 : 0;
    const b = i >= 2 ? (h[o - 8 + 2] - a * prevPrevC * d3) / d2 : 0;
    const c = i >= 1 ? (h[o - 4 + 1] - a * prevB * d3 - b * prevC * d2) / d1 : 0;
    let di = h[o] - sigma;
    di -= a * a * d3;
    di -= b * b * d2;
    di -= c * c * d1;
    if (di === 0) di = -tiny;
    if (di < 0) negatives++;
    product *= Math.abs(di);
    if (product > 1e150 || product < 1e-150) {
      logScale += Math.log(product);
      product = 1;
    }
    d3 = d2;
    d2 = d1;
    d1 = di;
    prevPrevC = prevC;
    prevB = b;
    prevC = c;
  }
  lastLogDeterminant = logScale + Math.log(product);
  return negatives;
}

/** ln|det(H − σ)| of the last countBelow call. */
let lastLogDeterminant = 0;

/**
 * The index-th eigenvalue (ascending, from 0) of the band, to adjacent
 * floats: bisection by Sylvester counts until the bracket holds it alone,
 * then regula falsi with the Illinois modification on det(H − σ) (one sign
 * change in the bracket; each step a count too, so the bracket stays
 * certain), then bisection of what is left. From `guess` = [lo, hi] when two
 * counts confirm that it holds the eigenvalue, else from ±(norm + 1).
 */
export function bandEigenvalue(band: DiracBand, index: number, guess?: [number, number]): { value: number; counts: number } {
  let lo = -band.norm - 1;
  let hi = band.norm + 1;
  let counts = 0;
  // counts below lo and hi, and ln|det| there (NaN: not known)
  let nLo = 0;
  let nHi = band.size;
  let logLo = Number.NaN;
  let logHi = Number.NaN;
  if (guess && guess[0] > lo && guess[1] < hi) {
    counts += 2;
    const a = countBelow(band, guess[0]);
    const la = lastLogDeterminant;
    const b = countBelow(band, guess[1]);
    if (a <= index && b > index) {
      [lo, hi, nLo, nHi, logLo, logHi] = [guess[0], guess[1], a, b, la, lastLogDeterminant];
    }
  }
  let side = 0; // which end the last regula falsi step kept (−1 lo, +1 hi), for the Illinois halving
  let slow = 0;
  for (let it = 0; it < 300; it++) {
    const mid = 0.5 * (lo + hi);
    if (mid <= lo || mid >= hi) break;
    let x = mid;
    const alone = nLo === index && nHi === index + 1 && Number.isFinite(logLo) && Number.isFinite(logHi);
    if (alone && slow < 2) {
      // det changes sign once in [lo, hi]: its zero by linear interpolation, t = |f_lo|/(|f_lo| + |f_hi|)
      const t = 1 / (1 + Math.exp(logHi - logLo));
      let y = lo + (hi - lo) * t;
      // Landing next to an end (the root is there): step a few times that distance past it, to cut the bracket from the far side.
      const edge = Math.min(y - lo, hi - y);
      if (edge < 1e-3 * (hi - lo)) {
        const push = 4 * Math.max(edge, 4 * Number.EPSILON * Math.abs(y));
        y = y - lo < hi - y ? y + push : y - push;
      }
      if (y > lo && y < hi) x = y;
    }
    const width = hi - lo;
    counts++;
    const c = countBelow(band, x);
    if (c > index) {
      hi = x;
      nHi = c;
      logHi = lastLogDeterminant;
      if (side === 1) logLo -= Math.LN2; // kept lo twice: halve f_lo (Illinois)
      side = 1;
    } else {
      lo = x;
      nLo = c;
      logLo = lastLogDeterminant;
      if (side === -1) logHi -= Math.LN2;
      side = -1;
    }
    // a step that did not halve the bracket counts against regula falsi; after two, one bisection step
    slow = hi - lo > 0.5 * width ? slow + 1 : 0;
    if (slow > 2) slow = 0;
  }
  return { value: 0.5 * (lo + hi), counts };
}
