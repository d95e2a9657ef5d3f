import { ConvergenceError } from '@penumbra/core';
import { failureDiagnostics } from './diagnostics.js';
import { leaverRecurrence, leaverScalars, realArithmetic } from './leaverRecurrence.js';

/**
 * Leaver's continued fraction (J. Math. Phys. 27, 1238 (1986)) for real c,
 * from the recurrence of leaverRecurrence.ts. A is an eigenvalue exactly when
 * {a_n} is the minimal solution, i.e. when the `inversion`-th form of the
 * continued fraction vanishes.
 */

/** F(A) and dF/dA of one inversion of the continued fraction, and the depth summed. */
export interface ContinuedFractionValue {
  value: number;
  derivative: number;
  depth: number;
}

const MAX_DEPTH = 20000;

/**
 * F(A) = β_N + (lower finite fraction) + (upper infinite fraction), with N the
 * inversion; returns F and dF/dA. The upper fraction is summed forward with
 * the Wallis recurrences (and their A-derivatives) until the convergents agree
 * to rounding.
 */
export function leaverFunction(
  s: number,
  m: number,
  c: number,
  A: number,
  inversion: number,
  sigma: 1 | -1 = 1,
): ContinuedFractionValue {
  const r = leaverRecurrence(s, m, sigma);
  const { beta0, slope, gammaScale } = leaverScalars(r, realArithmetic, c, A);
  const alpha = r.alpha;
  const beta = (n: number) => r.betaQuadratic(n) + r.betaLinear(n) * slope + beta0;
  const gamma = (n: number) => gammaScale * r.gammaWeight(n);

  // Lower part, bottom-up: t_0 = β_0, t_j = β_j − α_{j−1}γ_j / t_{j−1}; dβ/dA = −1.
  let lower = 0;
  let dLower = 0;
  if (inversion > 0) {
    let t = beta(0);
    let dt = -1;
    for (let j = 1; j < inversion; j++) {
      const p = alpha(j - 1) * gamma(j);
      const tNew = beta(j) - p / t;
      dt = -1 + (p * dt) / (t * t);
      t = tNew;
    }
    const p = alpha(inversion - 1) * gamma(inversion);
    lower = -p / t;
    dLower = (p * dt) / (t * t);
  }

  // Upper part a1/(b1 + a2/(b2 + …)), a_k = −α_{N+k−1}γ_{N+k}, b_k = β_{N+k}.
  let pPrev = 1,
    p = 0,
    qPrev = 0,
    q = 1; // convergent P_0/Q_0 = 0/1
  let dpPrev = 0,
    dp = 0,
    dqPrev = 0,
    dq = 0;
  let value = 0;
  let derivative = 0;
  let depth = 0;
  let converged = false;
  for (let k = 1; k <= MAX_DEPTH; k++) {
    const n = inversion + k;
    const ak = -alpha(n - 1) * gamma(n);
    const bk = beta(n);
    const pNew = bk * p + ak * pPrev;
    const qNew = bk * q + ak * qPrev;
    const dpNew = bk * dp - p + ak * dpPrev;
    const dqNew = bk * dq - q + ak * dqPrev;
    pPrev = p;
    p = pNew;
    qPrev = q;
    q = qNew;
    dpPrev = dp;
    dp = dpNew;
    dqPrev = dq;
    dq = dqNew;
    // Rescale to keep the recurrences in range.
    const scale = Math.abs(q) > 1e-300 ? 1 / q : 1;
    p *= scale;
    pPrev *= scale;
    q *= scale;
    qPrev *= scale;
    dp *= scale;
    dpPrev *= scale;
    dq *= scale;
    dqPrev *= scale;
    const v = p / q;
    const dv = (dp * q - p * dq) / (q * q);
    depth = k;
    if (
      k > 2 &&
      Math.abs(v - value) <= 1e-17 * Math.abs(v) + 1e-300 &&
      Math.abs(dv - derivative) <= 1e-13 * Math.abs(dv) + 1e-300
    ) {
      value = v;
      derivative = dv;
      converged = true;
      break;
    }
    value = v;
    derivative = dv;
  }
  if (!converged) {
    throw new ConvergenceError(
      'Leaver continued fraction did not converge',
      failureDiagnostics('leaver-continued-fraction', `no convergence within ${MAX_DEPTH} terms`, depth, 1, {
        s,
        m,
        c,
        A,
        inversion,
        depth,
      }),
    );
  }
  // Re-sum the tail backwards from beyond the forward convergence depth: the
  // backward recurrence is the numerically stable one (it follows the minimal
  // solution), the forward pass only told us how deep to start.
  const start = inversion + Math.ceil(1.5 * depth) + 10;
  let t = beta(start);
  let dt = -1;
  for (let n = start - 1; n > inversion; n--) {
    const ak = -alpha(n) * gamma(n + 1);
    const tNew = beta(n) + ak / t;
    dt = -1 - (ak * dt) / (t * t);
    t = tNew;
  }
  const a1 = -alpha(inversion) * gamma(inversion + 1);
  value = a1 / t;
  derivative = (-a1 * dt) / (t * t);
  return { value: beta(inversion) + lower + value, derivative: -1 + dLower + derivative, depth };
}

/** A root of the continued fraction with the Newton steps taken, the last step size and the depth. */
export interface LeaverRoot {
  A: number;
  iterations: number;
  lastStep: number;
  depth: number;
}

/**
 * Newton iteration on the continued fraction from a starting value (normally
 * the spectral eigenvalue). Converges when the Newton step falls below
 * `tolerance`·scale; throws ConvergenceError otherwise.
 */
export function leaverRoot(
  s: number,
  m: number,
  c: number,
  start: number,
  inversion: number,
  scale: number,
  maxIterations = 12,
  sigma: 1 | -1 = 1,
): LeaverRoot {
  let A = start;
  let lastStep = Infinity;
  let depth = 0;
  const tolerance = 4e-16 * Math.max(scale, 1);
  let iterations = 0;
  for (let it = 1; it <= maxIterations; it++) {
    iterations = it;
    const f = leaverFunction(s, m, c, A, inversion, sigma);
    depth = f.depth;
    const step = f.value / f.derivative;
    if (!Number.isFinite(step)) break;
    A -= step;
    const size = Math.abs(step);
    if (size <= tolerance) return { A, iterations: it, lastStep: size, depth };
    // At the rounding floor the steps stop shrinking: accept once they are tiny.
    if (size <= 1e-13 * Math.max(scale, 1) && size >= 0.5 * lastStep) return { A, iterations: it, lastStep: size, depth };
    lastStep = size;
  }
  throw new ConvergenceError(
    'Newton iteration on Leaver continued fraction did not converge',
    failureDiagnostics('leaver-newton', `no convergence in ${iterations} Newton steps`, iterations, iterations, {
      s,
      m,
      c,
      start,
      inversion,
      A,
      lastStep,
      depth,
    }),
  );
}
