import { ConvergenceError } from '@penumbra/core';
import { type Band, BandFactor, bandMultiply, bandQuadratic, buildBand } from './band.js';
import { cosDiagonal, cosOffDiagonal } from './coupling.js';
import { failureDiagnostics, type Tally } from './diagnostics.js';
import { sphericalA0 } from './quantum.js';
import { symmetricEigen } from './symmetricEigen.js';

/** Trailing coefficients of a normalised eigenvector must be below this. */
export const TAIL_TOLERANCE = 1e-16;

/** A spectral eigenpair of one band, with the Hellmann–Feynman slope and the work spent. */
export interface SpectralSolution {
  A: number;
  /** Normalised eigenvector (Σ b² = 1) in the basis of the band. */
  vector: Float64Array;
  band: Band;
  /** dA/dc from Hellmann–Feynman, bᵀ (∂K/∂c) b. */
  dAdc: number;
  /** ‖K b − A b‖ / ‖K‖. */
  residual: number;
  iterations: number;
  method: 'spectral-dense' | 'spectral-rqi';
}

/**
 * Truncation rule: follow the perturbative decay of the coefficients away
 * from the wanted one, b_{i+1}/b_i ≈ (coupling)/(distance of diagonal entries),
 * until the accumulated product is far below the tail tolerance. The resulting
 * size is then verified on the actual eigenvector (see `tailIsConverged`).
 */
export function estimateSize(
  s: number,
  m: number,
  c: number,
  lFirst: number,
  stride: 1 | 2,
  index: number,
  aGuess: number,
): number {
  let logAmp = 0;
  const c2 = c * c;
  for (let i = index; ; i++) {
    const l = lFirst + stride * i;
    const a0 = cosOffDiagonal(l, m, s);
    const a1 = cosOffDiagonal(l + 1, m, s);
    let coupling: number;
    if (stride === 1) {
      coupling = Math.abs(c2 * a0 * (cosDiagonal(l, m, s) + cosDiagonal(l + 1, m, s)) - 2 * c * s * a0) + c2 * a0 * a1;
    } else {
      coupling = c2 * a0 * a1;
    }
    const gap = Math.max(Math.abs(sphericalA0(s, l + stride) - c2 * 0.5 - aGuess), 1);
    const ratio = coupling / gap;
    logAmp += Math.log(Math.max(ratio, 1e-300));
    if (i >= index + 2 && ratio < 0.5 && logAmp < Math.log(1e-22)) return i + 4;
    if (i > index + 4000) return i;
  }
}

function tailIsConverged(vector: Float64Array, size: number, stride: 1 | 2): boolean {
  const tail = stride === 1 ? Math.max(Math.abs(vector[size - 1]), Math.abs(vector[size - 2])) : Math.abs(vector[size - 1]);
  return tail < TAIL_TOLERANCE;
}

/**
 * Working vectors reused across calls (a typed array with its own store costs
 * about 1 µs to allocate, comparable to a whole factorisation of the band):
 * slot 0 holds K·b in finishSolution, slot 1 the seed vector of a warm solve
 * that is not grown to its tail (a seed only: its vector is never kept).
 */
const scratchVectors = [new Float64Array(64), new Float64Array(64)];
function scratch(n: number, slot: 0 | 1): Float64Array {
  if (scratchVectors[slot].length < n) scratchVectors[slot] = new Float64Array(Math.max(n, 2 * scratchVectors[slot].length));
  return scratchVectors[slot];
}

function finishSolution(
  band: Band,
  vector: Float64Array,
  iterations: number,
  method: SpectralSolution['method'],
): SpectralSolution {
  const n = band.size;
  let norm2 = 0;
  for (let i = 0; i < n; i++) norm2 += vector[i] * vector[i];
  const inv = 1 / Math.sqrt(norm2);
  for (let i = 0; i < n; i++) vector[i] *= inv;
  const A = bandQuadratic(band.d0, band.d1, band.d2, n, vector);
  const dAdc = bandQuadratic(band.e0, band.e1, band.e2, n, vector);
  const kv = scratch(n, 0);
  bandMultiply(band.d0, band.d1, band.d2, n, vector, kv);
  let r2 = 0;
  for (let i = 0; i < n; i++) {
    const r = kv[i] - A * vector[i];
    r2 += r * r;
  }
  return { A, vector, band, dAdc, residual: Math.sqrt(r2) / band.norm, iterations, method };
}

/** Dense symmetric eigen-solve (tred2/tql2) of the truncated matrix: the cold start. */
export function solveDense(
  s: number,
  m: number,
  c: number,
  lFirst: number,
  stride: 1 | 2,
  index: number,
  initialSize: number,
  tally: Tally,
): SpectralSolution {
  let size = Math.max(initialSize, index + 3);
  for (let attempt = 0; attempt < 8; attempt++) {
    const band = buildBand(s, m, c, lFirst, stride, size);
    tally.evaluations++;
    const K = new Float64Array(size * size);
    for (let i = 0; i < size; i++) {
      K[i * size + i] = band.d0[i];
      if (i + 1 < size) {
        K[i * size + i + 1] = band.d1[i];
        K[(i + 1) * size + i] = band.d1[i];
      }
      if (i + 2 < size) {
        K[i * size + i + 2] = band.d2[i];
        K[(i + 2) * size + i] = band.d2[i];
      }
    }
    const evd = symmetricEigen(K, size);
    const values = evd.values;
    const order = Array.from(values, (_, i) => i).sort((p, q) => values[p] - values[q]);
    const column = order[index];
    const vector = evd.vectors.slice(column * size, column * size + size);
    if (tailIsConverged(vector, size, stride)) return finishSolution(band, vector, attempt + 1, 'spectral-dense');
    size = Math.ceil(size * 1.5) + 8;
  }
  throw new ConvergenceError(
    'spheroidal spectral expansion did not converge',
    failureDiagnostics('spectral-dense', 'eigenvector tail above 1e-16 after 8 truncations', 8, tally.evaluations, {
      s,
      m,
      c,
      index,
      size,
    }),
  );
}

const factorCache = { factor: new BandFactor(64) };
/** The counts of one `count3` pass. */
const threeCounts = new Int32Array(3);
function workspace(n: number): BandFactor {
  if (factorCache.factor.capacity < n) factorCache.factor = new BandFactor(Math.max(n, 2 * factorCache.factor.capacity));
  return factorCache.factor;
}

/**
 * Warm start: Rayleigh-quotient iteration on the banded matrix from a predicted
 * eigenvalue and eigenvector, O(size) per step. The Sylvester inertia of
 * K − (A ± δ)I then proves that A is the index-th eigenvalue. Returns null when
 * the iteration fails or lands on another eigenvalue, so the caller can fall back
 * to the dense solve.
 */
export function solveWarm(
  s: number,
  m: number,
  c: number,
  lFirst: number,
  stride: 1 | 2,
  index: number,
  size: number,
  aGuess: number,
  vectorGuess: Float64Array | null,
  tally: Tally,
  /** With false, return the eigenpair of this size without the tail check (a seed for `settle`). */
  growToTail = true,
  /** the band of this size, when the caller has built it already */
  prebuilt?: Band,
  /**
   * With false (a seed only, growToTail false), skip the two counts that prove the index: the
   * deterministic finish checks its first bracket by two counts of its own and settles the
   * index-th eigenvalue from any seed (a seed on a neighbour only costs that finish more counts).
   */
  checkIndex = true,
): SpectralSolution | null {
  size = Math.max(size, index + 3);
  for (let attempt = 0; attempt < 4; attempt++) {
    const band = prebuilt !== undefined && prebuilt.size === size ? prebuilt : buildBand(s, m, c, lFirst, stride, size);
    const ws = workspace(size);
    // A seed (growToTail false) lives in scratch; its vector is dropped by the caller (settle).
    const x = growToTail ? new Float64Array(size) : scratch(size, 1).subarray(0, size).fill(0);
    if (vectorGuess) {
      const k = Math.min(size, vectorGuess.length);
      for (let i = 0; i < k; i++) x[i] = vectorGuess[i];
    } else {
      x[index] = 1;
    }
    let sigma = aGuess;
    let converged = false;
    let iterations = 0;
    const tol = 4e-16 * band.norm;
    for (; iterations < 12; iterations++) {
      tally.evaluations++;
      ws.factor(band, size, sigma);
      ws.solve(size, x);
      let norm2 = 0;
      for (let i = 0; i < size; i++) norm2 += x[i] * x[i];
      const inv = 1 / Math.sqrt(norm2);
      for (let i = 0; i < size; i++) x[i] *= inv;
      const next = bandQuadratic(band.d0, band.d1, band.d2, size, x);
      // ‖(K − σI)⁻¹x‖ large ⇔ σ is within tol of an eigenvalue.
      const step = Math.abs(next - sigma);
      sigma = next;
      if (step <= tol || inv * 1 <= tol) {
        converged = true;
        iterations++;
        break;
      }
    }
    if (!converged) return null;
    if (!checkIndex && !growToTail) return finishSolution(band, x, iterations, 'spectral-rqi');
    const delta = Math.max(1e-11 * band.norm, 1e-9);
    tally.evaluations += 2;
    const below = ws.count(band, size, sigma - delta);
    const above = ws.count(band, size, sigma + delta);
    if (below !== index || above !== index + 1) {
      // At large |c| the modes concentrated at the two poles pair up (s = 2, l = 2,
      // m = −2, c = 30: the lowest two agree to all digits) and the count steps by
      // two within δ. A seed (growToTail false) then takes the wanted member of the
      // pair from a 2×2 Rayleigh–Ritz on the pair's invariant subspace.
      if (growToTail || above - below !== 2 || below > index || above <= index) return null;
      tally.evaluations++;
      const ritz = pairRitz(band, ws, size, sigma, x);
      const seed = finishSolution(band, x, iterations, 'spectral-rqi');
      seed.A = index === below ? ritz[0] : ritz[1];
      return seed;
    }
    if (!growToTail || tailIsConverged(x, size, stride)) return finishSolution(band, x, iterations, 'spectral-rqi');
    size = Math.ceil(size * 1.5) + 8;
    vectorGuess = x;
  }
  return null;
}

/**
 * Both eigenvalues of a pair within δ of σ, ascending: two steps of block
 * inverse iteration at σ from x (an eigenvector of the pair) and a fixed second
 * vector span the pair's invariant subspace (the rest of the spectrum is damped
 * by its distance over the pair's), and the eigenvalues of K projected on it
 * are the pair's to a few rounding units of ‖K‖, however close the pair.
 * Factors K − σI in `ws`; x is left unchanged.
 */
function pairRitz(band: Band, ws: BandFactor, n: number, sigma: number, x: Float64Array): [number, number] {
  ws.factor(band, n, sigma);
  const u = new Float64Array(x.subarray(0, n));
  const v = new Float64Array(n);
  for (let i = 0; i < n; i++) v[i] = 1 / Math.sqrt(n) + (i % 3) * 1e-3;
  for (let step = 0; step < 2; step++) {
    ws.solve(n, u);
    ws.solve(n, v);
    orthonormalise(u, v, n);
  }
  const ku = scratch(n, 0);
  bandMultiply(band.d0, band.d1, band.d2, n, u, ku);
  let a = 0;
  let b = 0;
  for (let i = 0; i < n; i++) {
    a += u[i] * ku[i];
    b += v[i] * ku[i];
  }
  const d = bandQuadratic(band.d0, band.d1, band.d2, n, v);
  const mean = 0.5 * (a + d);
  const radius = Math.hypot(0.5 * (a - d), b);
  return [mean - radius, mean + radius];
}

/** Gram–Schmidt, twice (the vectors come out of a nearly singular solve nearly parallel). */
function orthonormalise(u: Float64Array, v: Float64Array, n: number): void {
  let uu = 0;
  for (let i = 0; i < n; i++) uu += u[i] * u[i];
  const inv = 1 / Math.sqrt(uu);
  for (let i = 0; i < n; i++) u[i] *= inv;
  for (let pass = 0; pass < 2; pass++) {
    let uv = 0;
    for (let i = 0; i < n; i++) uv += u[i] * v[i];
    let vv = 0;
    for (let i = 0; i < n; i++) {
      v[i] -= uv * u[i];
      vv += v[i] * v[i];
    }
    const invV = 1 / Math.sqrt(vv);
    for (let i = 0; i < n; i++) v[i] *= invV;
  }
}

/** Width, relative to ‖K‖, to which a cold start bisects before the Rayleigh-quotient iteration. */
const BISECTION_WIDTH = 1e-6;

/**
 * Cold start without a dense solve: bisection on Sylvester counts isolates the
 * index-th eigenvalue of the banded matrix, then `solveWarm` refines it.
 */
export function solveBisection(
  s: number,
  m: number,
  c: number,
  lFirst: number,
  stride: 1 | 2,
  index: number,
  size: number,
  tally: Tally,
  growToTail = true,
): SpectralSolution | null {
  size = Math.max(size, index + 3);
  const band = buildBand(s, m, c, lFirst, stride, size);
  const ws = workspace(size);
  let lo = -band.norm;
  let hi = band.norm;
  // Bisected to 1e-6 ‖K‖ (was 1e-9): Rayleigh-quotient iteration converges cubically from there, and the
  // Sylvester counts in solveWarm reject a neighbouring eigenvalue (the settled value depends on the band alone;
  // measured: the same doubles on 6,000 random problems with |c| ≤ 30, 10 fewer counts a cold solve).
  const width = BISECTION_WIDTH * band.norm;
  for (let it = 0; it < 200 && hi - lo > width; it++) {
    const mid = 0.5 * (lo + hi);
    tally.evaluations++;
    if (ws.count(band, size, mid) <= index) lo = mid;
    else hi = mid;
  }
  const start = new Float64Array(size).fill(1);
  return solveWarm(s, m, c, lFirst, stride, index, size, 0.5 * (lo + hi), start, tally, growToTail, band);
}

/**
 * Deterministic finish: the index-th eigenvalue of the band as the point where
 * the Sylvester count of K − σI steps from `index` to `index + 1`, found by
 * bisection on the fixed dyadic hierarchy of [−B, B] (B = the power of two
 * above ‖K‖) down to adjacent floats. The result depends only on the band, not
 * on how the seed was obtained. The seed only lets us skip the levels whose
 * midpoint is farther than `margin` from it: there the count is decided by
 * which side of the eigenvalue the midpoint lies, so skipping changes nothing;
 * the first bracket actually used is checked by two counts. Returns null if
 * that check fails (seed not within `margin`). The counts are made three in a
 * pass (BandFactor.count3): the check's two with the first level's, then each
 * level's with both midpoints of the next; `counts` and the tally count the
 * levels used, as when they were made one by one.
 */
export function settleEigenvalue(
  band: Band,
  index: number,
  seed: number,
  margin: number,
  tally: Tally,
): { A: number; counts: number } | null {
  const n = band.size;
  const ws = workspace(n);
  const B = 2 ** Math.ceil(Math.log2(band.norm));
  // Stop at adjacent floats, or at 2⁻⁶⁰B for eigenvalues near zero (absolute
  // accuracy of any eigenvalue is ~ε‖K‖, far above that).
  const floor = B * 2 ** -60;
  let lo = -B;
  let hi = B;
  let counts = 0;
  let checked = false;
  // counts made ahead, at the two midpoints of the next level (see `count3`): the same integers as made there
  let aheadLo = Number.NaN,
    aheadHi = Number.NaN;
  const c = threeCounts;
  for (;;) {
    const mid = 0.5 * (lo + hi);
    if (mid <= lo || mid >= hi || hi - lo <= floor) break;
    if (mid < seed - margin) {
      lo = mid;
      continue;
    }
    if (mid > seed + margin) {
      hi = mid;
      continue;
    }
    if (!checked) {
      checked = true;
      // the check's two counts and the first level's in one pass (the checks as before: a failed one ends the search)
      ws.count3(band, n, lo, hi, mid, c);
      if (lo > -B) {
        counts++;
        tally.evaluations++;
        if (c[0] > index) return null;
      }
      if (hi < B) {
        counts++;
        tally.evaluations++;
        if (c[1] <= index) return null;
      }
      counts++;
      tally.evaluations++;
      if (c[2] <= index) lo = mid;
      else hi = mid;
      continue;
    }
    counts++;
    tally.evaluations++;
    let below: number;
    if (mid === aheadLo) below = c[1];
    else if (mid === aheadHi) below = c[2];
    else {
      // this level's count, and those of both midpoints of the next level
      aheadLo = 0.5 * (lo + mid);
      aheadHi = 0.5 * (mid + hi);
      ws.count3(band, n, mid, aheadLo, aheadHi, c);
      below = c[0];
    }
    if (below <= index) lo = mid;
    else hi = mid;
  }
  return { A: 0.5 * (lo + hi), counts };
}

/** Full dyadic bisection without a seed: the same definition, every level counted. */
export function settleEigenvalueCold(band: Band, index: number, tally: Tally): { A: number; counts: number } {
  return settleEigenvalue(band, index, 0, Infinity, tally) as { A: number; counts: number };
}

/**
 * Eigenvector for an eigenvalue known to the last bit: two steps of inverse
 * iteration at σ = A from a fixed start vector, so that it too depends only on
 * the band. Pivots that vanish at σ = A are nudged (see BandFactor.factor).
 */
export function settledSolution(
  band: Band,
  A: number,
  iterations: number,
  method: SpectralSolution['method'],
  tally: Tally,
  /** a store no longer read to hold the eigenvector, when large enough (eigenvalue.ts passes the last vector of the same mode) */
  reuse?: ArrayBufferLike,
): SpectralSolution {
  const n = band.size;
  const ws = workspace(n);
  tally.evaluations++;
  ws.factor(band, n, A);
  const x = reuse !== undefined && reuse.byteLength >= 8 * n ? new Float64Array(reuse, 0, n) : new Float64Array(n);
  for (let i = 0; i < n; i++) x[i] = 1 / Math.sqrt(n) + (i % 3) * 1e-3;
  for (let step = 0; step < 2; step++) {
    ws.solve(n, x);
    let norm2 = 0;
    for (let i = 0; i < n; i++) norm2 += x[i] * x[i];
    const inv = 1 / Math.sqrt(norm2);
    for (let i = 0; i < n; i++) x[i] *= inv;
  }
  const solution = finishSolution(band, x, iterations, method);
  // Keep the bisected value; the Rayleigh quotient of x only enters the residual.
  solution.A = A;
  return solution;
}

/** Whether the eigenvector's trailing coefficients are below TAIL_TOLERANCE (the truncation is converged). */
export function tailConverged(solution: SpectralSolution): boolean {
  return tailIsConverged(solution.vector, solution.band.size, solution.band.stride);
}
