/**
 * Chebyshev–Lobatto collocation on [−1, 1] for the Riccati steps
 * (riccatiStep.ts): nodes t_j = cos(πj/N), j = 0…N (t_0 = 1), the
 * differentiation matrix (and its product with samples, folded by symmetry)
 * and the Clenshaw–Curtis weights (Trefethen,
 * Spectral Methods in MATLAB, SIAM 2000, programs cheb and clencurt), and the
 * two highest Chebyshev coefficients of a sampled function (the resolution
 * check). Built once per node count.
 */

/** Nodes, differentiation matrix (row-major) and quadrature weights of one node count. */
export interface ChebyshevRule {
  /** number of nodes N + 1 */
  n: number;
  /** nodes t_j = cos(πj/N), from 1 down to −1 */
  t: Float64Array;
  /** differentiation matrix D (n × n, row-major): (Df)(t_i) = Σ_j D_ij f(t_j) */
  D: Float64Array;
  /** Clenshaw–Curtis weights: ∫_{−1}^{1} f ≈ Σ w_j f(t_j) */
  w: Float64Array;
  /**
   * D folded by its symmetry D_{N−i,N−j} = −D_ij (n even, h = n/2, h × h
   * row-major, i, j < h): E_ij = (D_ij + D_{i,N−j})/2 acts on the even part
   * c_j + c_{N−j}, F_ij = (D_ij − D_{i,N−j})/2 on the odd part c_j − c_{N−j};
   * with P = E·even, Q = F·odd, (Dc)_i = P_i + Q_i and (Dc)_{N−i} = Q_i − P_i,
   * half the multiplications of D c. Empty for odd n.
   */
  E: Float64Array;
  /** the odd half of the fold (see E) */
  F: Float64Array;
  /** chebyshevTail's weights f_j = (½ at the ends, else 1)·(−1)^j */
  alt: Float64Array;
  /** f_j t_j (the same doubles as the product formed in the loop) */
  altT: Float64Array;
}

const rules = new Map<number, ChebyshevRule>();

/** The rule with n nodes (n ≥ 3), cached. */
export function chebyshevRule(n: number): ChebyshevRule {
  const hit = rules.get(n);
  if (hit) return hit;
  const N = n - 1;
  const t = new Float64Array(n);
  for (let j = 0; j < n; j++) t[j] = Math.cos((Math.PI * j) / N);
  const c = (j: number) => (j === 0 || j === N ? 2 : 1) * (j % 2 === 0 ? 1 : -1);
  const D = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    let diag = 0;
    for (let j = 0; j < n; j++) {
      if (i === j) continue;
      const d = c(i) / c(j) / (t[i] - t[j]);
      D[i * n + j] = d;
      diag -= d; // negative-sum trick: rows of D annihilate constants exactly
    }
    D[i * n + i] = diag;
  }
  const w = new Float64Array(n);
  // Clenshaw–Curtis weights (clencurt), N ≥ 2.
  const theta = (j: number) => (Math.PI * j) / N;
  const v = new Float64Array(n).fill(1);
  if (N % 2 === 0) {
    w[0] = w[N] = 1 / (N * N - 1);
    for (let k = 1; k < N / 2; k++) for (let j = 1; j < N; j++) v[j] -= (2 * Math.cos(2 * k * theta(j))) / (4 * k * k - 1);
    for (let j = 1; j < N; j++) v[j] -= Math.cos(N * theta(j)) / (N * N - 1);
  } else {
    w[0] = w[N] = 1 / (N * N);
    for (let k = 1; k <= (N - 1) / 2; k++) for (let j = 1; j < N; j++) v[j] -= (2 * Math.cos(2 * k * theta(j))) / (4 * k * k - 1);
  }
  for (let j = 1; j < N; j++) w[j] = (2 * v[j]) / N;
  const h = n % 2 === 0 ? n / 2 : 0;
  const E = new Float64Array(h * h),
    F = new Float64Array(h * h);
  for (let i = 0; i < h; i++)
    for (let j = 0; j < h; j++) {
      E[i * h + j] = 0.5 * (D[i * n + j] + D[i * n + N - j]);
      F[i * h + j] = 0.5 * (D[i * n + j] - D[i * n + N - j]);
    }
  const alt = new Float64Array(n),
    altT = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    alt[j] = (j === 0 || j === N ? 0.5 : 1) * (j % 2 === 0 ? 1 : -1);
    altT[j] = alt[j] * t[j];
  }
  const rule = { n, t, D, w, E, F, alt, altT };
  rules.set(n, rule);
  return rule;
}

/**
 * |a_N| + |a_{N−1}| of the Chebyshev expansion Σ a_k T_k(t) interpolating
 * the complex samples (re, im) at the nodes of `rule`: the size of what the
 * interpolant has not resolved.
 */
export function chebyshevTail(rule: ChebyshevRule, re: Float64Array, im: Float64Array): number {
  // cos(πjN/N) = (−1)^j and cos(πj(N−1)/N) = (−1)^j t_j, with the weights of the end nodes (rule.alt, rule.altT)
  const N = rule.n - 1;
  const { alt, altT } = rule;
  let nr = 0,
    ni = 0,
    mr = 0,
    mi = 0;
  for (let j = 0; j <= N; j++) {
    const a = re[j],
      b = im[j],
      f = alt[j],
      g = altT[j];
    nr += f * a;
    ni += f * b;
    mr += g * a;
    mi += g * b;
  }
  return tailOf(nr, ni, mr, mi, N);
}

/** chebyshevTail from its sums Σ f_j z_j (nr, ni) and Σ f_j t_j z_j (mr, mi), f = rule.alt, for a caller that forms them in its own loop over j = 0 … N. */
export function tailOf(nr: number, ni: number, mr: number, mi: number, N: number): number {
  return (Math.sqrt(nr * nr + ni * ni) + 2 * Math.sqrt(mr * mr + mi * mi)) / N;
}

const evenRe = new Float64Array(64),
  evenIm = new Float64Array(64),
  oddRe = new Float64Array(64),
  oddIm = new Float64Array(64);

/**
 * (D c) at the nodes, c = (cRe, cIm)[o … o + n − 1], into (outRe, outIm):
 * for even n by the fold of D (chebyshev.ts), half the multiplications, in
 * two partial sums per part (a single running sum waits on each addition);
 * directly for odd n. Allocates nothing. This product was most of a Riccati
 * step's cost (bench/riccati-cost.bench.mjs: with the fold a step costs
 * 1.27–1.45 times less, ~410 and ~310 integrator evaluations on its rungs).
 */
export function chebyshevDerivative(
  rule: ChebyshevRule,
  cRe: Float64Array,
  cIm: Float64Array,
  o: number,
  outRe: Float64Array,
  outIm: Float64Array,
): void {
  const n = rule.n,
    N = n - 1;
  const h = rule.E.length > 0 && n <= 2 * evenRe.length ? n / 2 : 0;
  if (h === 0) {
    const D = rule.D;
    for (let i = 0; i < n; i++) {
      let sr = 0,
        si = 0;
      for (let j = 0; j < n; j++) {
        const d = D[i * n + j];
        sr += d * cRe[o + j];
        si += d * cIm[o + j];
      }
      outRe[i] = sr;
      outIm[i] = si;
    }
    return;
  }
  for (let j = 0; j < h; j++) {
    const a = o + j,
      b = o + N - j;
    evenRe[j] = cRe[a] + cRe[b];
    evenIm[j] = cIm[a] + cIm[b];
    oddRe[j] = cRe[a] - cRe[b];
    oddIm[j] = cIm[a] - cIm[b];
  }
  const { E, F } = rule;
  // two rows at a time (each value of the even and odd parts loaded once for both), each row's sums as before:
  // the same doubles, ~1.3 times faster (16 nodes, measured in isolation on this machine: 185–193 → 139–159 ns)
  let i = 0;
  for (; i + 1 < h; i += 2) {
    const r = i * h,
      s = r + h;
    let a0 = 0,
      a1 = 0,
      b0 = 0,
      b1 = 0,
      c0 = 0,
      c1 = 0,
      d0 = 0,
      d1 = 0;
    let j = 0;
    for (; j + 1 < h; j += 2) {
      const xr0 = evenRe[j],
        xi0 = evenIm[j],
        xr1 = evenRe[j + 1],
        xi1 = evenIm[j + 1];
      const e0 = E[r + j],
        e1 = E[r + j + 1],
        g0 = E[s + j],
        g1 = E[s + j + 1];
      a0 += e0 * xr0;
      b0 += e0 * xi0;
      a1 += e1 * xr1;
      b1 += e1 * xi1;
      c0 += g0 * xr0;
      d0 += g0 * xi0;
      c1 += g1 * xr1;
      d1 += g1 * xi1;
    }
    if (j < h) {
      const e0 = E[r + j],
        g0 = E[s + j];
      a0 += e0 * evenRe[j];
      b0 += e0 * evenIm[j];
      c0 += g0 * evenRe[j];
      d0 += g0 * evenIm[j];
    }
    const pr = a0 + a1,
      pi = b0 + b1,
      pr2 = c0 + c1,
      pi2 = d0 + d1;
    a0 = a1 = b0 = b1 = c0 = c1 = d0 = d1 = 0;
    for (j = 0; j + 1 < h; j += 2) {
      const xr0 = oddRe[j],
        xi0 = oddIm[j],
        xr1 = oddRe[j + 1],
        xi1 = oddIm[j + 1];
      const f0 = F[r + j],
        f1 = F[r + j + 1],
        g0 = F[s + j],
        g1 = F[s + j + 1];
      a0 += f0 * xr0;
      b0 += f0 * xi0;
      a1 += f1 * xr1;
      b1 += f1 * xi1;
      c0 += g0 * xr0;
      d0 += g0 * xi0;
      c1 += g1 * xr1;
      d1 += g1 * xi1;
    }
    if (j < h) {
      const f0 = F[r + j],
        g0 = F[s + j];
      a0 += f0 * oddRe[j];
      b0 += f0 * oddIm[j];
      c0 += g0 * oddRe[j];
      d0 += g0 * oddIm[j];
    }
    const qr = a0 + a1,
      qi = b0 + b1,
      qr2 = c0 + c1,
      qi2 = d0 + d1;
    outRe[i] = pr + qr;
    outIm[i] = pi + qi;
    outRe[N - i] = qr - pr;
    outIm[N - i] = qi - pi;
    outRe[i + 1] = pr2 + qr2;
    outIm[i + 1] = pi2 + qi2;
    outRe[N - 1 - i] = qr2 - pr2;
    outIm[N - 1 - i] = qi2 - pi2;
  }
  if (i < h) {
    // the last row (and its mirror image) of an odd h
    let pr0 = 0,
      pr1 = 0,
      pi0 = 0,
      pi1 = 0,
      qr0 = 0,
      qr1 = 0,
      qi0 = 0,
      qi1 = 0;
    const row = i * h;
    let j = 0;
    for (; j + 1 < h; j += 2) {
      const e0 = E[row + j],
        e1 = E[row + j + 1],
        f0 = F[row + j],
        f1 = F[row + j + 1];
      pr0 += e0 * evenRe[j];
      pi0 += e0 * evenIm[j];
      pr1 += e1 * evenRe[j + 1];
      pi1 += e1 * evenIm[j + 1];
      qr0 += f0 * oddRe[j];
      qi0 += f0 * oddIm[j];
      qr1 += f1 * oddRe[j + 1];
      qi1 += f1 * oddIm[j + 1];
    }
    if (j < h) {
      const e0 = E[row + j],
        f0 = F[row + j];
      pr0 += e0 * evenRe[j];
      pi0 += e0 * evenIm[j];
      qr0 += f0 * oddRe[j];
      qi0 += f0 * oddIm[j];
    }
    const pr = pr0 + pr1,
      pi = pi0 + pi1,
      qr = qr0 + qr1,
      qi = qi0 + qi1;
    outRe[i] = pr + qr;
    outIm[i] = pi + qi;
    outRe[N - i] = qr - pr;
    outIm[N - i] = qi - pi;
  }
}
