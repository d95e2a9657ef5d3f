/**
 * Chebyshev–Lobatto collocation on [−1, 1] for the Riccati steps
 * (riccatiStep.ts): nodes t_j = cos(πj/N), j = 0…N (t_0 = 1), the
 * differentiation matrix and the Clenshaw–Curtis weights (Trefethen,
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
  const rule = { n, t, D, w };
  rules.set(n, rule);
  return rule;
}

/**
 * |a_N| + |a_{N−1}| of the Chebyshev expansion Σ a_k T_k(t) interpolating
 * the complex samples (re, im) at the nodes of `rule`: the size of what the
 * interpolant has not resolved.
 */
export function chebyshevTail(rule: ChebyshevRule, re: Float64Array, im: Float64Array): number {
  // cos(πjN/N) = (−1)^j and cos(πj(N−1)/N) = (−1)^j t_j
  const N = rule.n - 1;
  let nr = 0,
    ni = 0,
    mr = 0,
    mi = 0;
  for (let j = 0; j <= N; j++) {
    const f = (j === 0 || j === N ? 0.5 : 1) * (j % 2 === 0 ? 1 : -1);
    nr += f * re[j];
    ni += f * im[j];
    mr += f * rule.t[j] * re[j];
    mi += f * rule.t[j] * im[j];
  }
  return (Math.sqrt(nr * nr + ni * ni) + 2 * Math.sqrt(mr * mr + mi * mi)) / N;
}
