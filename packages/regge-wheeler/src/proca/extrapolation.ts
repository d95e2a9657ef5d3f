/**
 * An allocation-free Gragg–Bulirsch–Stoer extrapolation integrator for the
 * Proca channels (Hairer, Nørsett & Wanner, Solving ODEs I, section II.9:
 * modified midpoint rule, step numbers 2, 4, 6, …, Aitken–Neville
 * extrapolation in h², order and step selection by work per unit step).
 *
 * Why not the radial package's loop (radial/src/gbsStepper.ts): that one is
 * fixed to a 4-component state with ODEX's operation-for-operation control,
 * while the even Proca sector carries 16 components (two horizon solutions of
 * a two-channel system), and this package is the independent Schwarzschild
 * reference, which shares no solver code with the Teukolsky route. What is
 * specific here is the error norm: each solution's u and P parts are scaled by
 * their Euclidean sizes together (|u| + |P|/ω and |P| + ω|u|), since a
 * component, or a whole vector, crossing zero must not shrink the step.
 *
 * The channel equations are written out inside the midpoint loop (no
 * right-hand-side callback, no derivative buffer between substeps): the loop
 * is most of the cost of a solve, and for the two-channel even sector the
 * callback and its buffer were a third of it.
 */
import { ConvergenceError } from '@penumbra/core';

/**
 * The Proca channel equations in r (M = 1) for a state of solutions, each
 * u (N complex) then P = du/dr* (N complex):
 *   du/dr = P/f,  dP/dr = [μ² + L/r² − ω²/f + Q(1/r)/r²] u,  Q(y) = q0 + q1 y.
 */
export interface ProcaChannelEquations {
  /** N = 1 or 2 */
  channels: 1 | 2;
  mu2: number;
  w2: number;
  L: number;
  /** Q's coefficients, row-major N×N each */
  q0: Float64Array;
  q1: Float64Array;
}

/**
 * The channel equations' dy/dr at r into out, for every solution in y (4N
 * components each). The extrapolation loop's midpoint substeps repeat it
 * written out, for speed; its first evaluation of a step and the Cash–Karp
 * route call this.
 */
export function channelDerivative(equations: ProcaChannelEquations, out: Float64Array, y: Float64Array, r: number): void {
  const { q0, q1, L, mu2, w2 } = equations;
  const n = y.length;
  const invF = r / (r - 2);
  const inv2 = 1 / (r * r);
  const diag = mu2 + L * inv2 - w2 * invF;
  if (equations.channels === 1) {
    const c = diag + (q0[0] + q1[0] / r) * inv2;
    for (let o = 0; o < n; o += 4) {
      out[o] = y[o + 2] * invF;
      out[o + 1] = y[o + 3] * invF;
      out[o + 2] = c * y[o];
      out[o + 3] = c * y[o + 1];
    }
    return;
  }
  const yr = 1 / r;
  const a00 = diag + (q0[0] + q1[0] * yr) * inv2;
  const a01 = (q0[1] + q1[1] * yr) * inv2;
  const a10 = (q0[2] + q1[2] * yr) * inv2;
  const a11 = diag + (q0[3] + q1[3] * yr) * inv2;
  for (let o = 0; o < n; o += 8) {
    out[o] = y[o + 4] * invF;
    out[o + 1] = y[o + 5] * invF;
    out[o + 2] = y[o + 6] * invF;
    out[o + 3] = y[o + 7] * invF;
    out[o + 4] = a00 * y[o] + a01 * y[o + 2];
    out[o + 5] = a00 * y[o + 1] + a01 * y[o + 3];
    out[o + 6] = a10 * y[o] + a11 * y[o + 2];
    out[o + 7] = a10 * y[o + 1] + a11 * y[o + 3];
  }
}

/** Largest column of the extrapolation tableau (order 2·KMAX). */
const KMAX = 8;
/** Step numbers n_j = 2j. */
const NJ = Array.from({ length: KMAX + 1 }, (_, j) => 2 * j);
/** Work A_j = 1 + n_1 + … + n_j (right-hand-side evaluations to reach column j). */
const WORK = NJ.map((_, j) => 1 + NJ.slice(1, j + 1).reduce((s, n) => s + n, 0));
const SAFE1 = 0.65;
const SAFE2 = 0.94;
/** Exponent 1/(2j − 1) of the step-size rule of column j, and its smallest factor 0.02^{1/(2j − 1)} (tabled: Math.pow was a tenth of a step's cost). */
const EXPONENT = NJ.map((_, j) => 1 / (2 * j - 1));
const FAC_MIN = EXPONENT.map((expo) => 0.02 ** expo);
/** Aitken–Neville factors 1 / ((n_j / n_{l−1})² − 1) at [j·(KMAX + 1) + l], 2 ≤ l ≤ j (tabled, as FAC_MIN). */
const FOLD = Float64Array.from({ length: (KMAX + 1) * (KMAX + 1) }, (_, x) => {
  const j = Math.floor(x / (KMAX + 1));
  const l = x % (KMAX + 1);
  return l >= 2 && l <= j ? 1 / ((NJ[j] / NJ[l - 1]) ** 2 - 1) : 0;
});
/** Smallest meaningful local tolerance: below it the tableau differences are rounding. */
const TOL_FLOOR = 1e-16;

/** One adaptive extrapolation integrator bound to a state, a right-hand side and an error norm. */
export class ProcaExtrapolation {
  /** current argument */
  r: number;
  /** suggested next step */
  h: number;
  /** right-hand-side evaluations so far */
  evaluations = 0;
  /** accepted steps so far */
  steps = 0;
  private readonly n: number;
  private readonly tol: number;
  private k: number;
  private readonly table: Float64Array;
  private readonly yMid: Float64Array;
  private readonly yPrev: Float64Array;
  private readonly dy0: Float64Array;
  private readonly dy: Float64Array;
  private readonly scale: Float64Array;
  private readonly hNew: Float64Array;
  /** scaled error of each column of the current attempt */
  private readonly errors: Float64Array;

  private readonly equations: ProcaChannelEquations;
  private readonly channels: 1 | 2;
  private readonly mu2: number;
  private readonly w2: number;
  private readonly L: number;
  private readonly q0: Float64Array;
  private readonly q1: Float64Array;
  /** components of one solution: u (first half) then P = du/dr* (second half) */
  private readonly blockSize: number;

  /**
   * @param y the state (solutions of `equations`, 4N components each), advanced in place
   * @param rate the wave number that relates the sizes of u and P (ω)
   * @param method the caller's method, quoted when the integration fails
   */
  constructor(
    private readonly y: Float64Array,
    equations: ProcaChannelEquations,
    r0: number,
    h0: number,
    tol: number,
    private readonly rate: number,
    private readonly method: string,
  ) {
    this.equations = equations;
    this.channels = equations.channels;
    this.mu2 = equations.mu2;
    this.w2 = equations.w2;
    this.L = equations.L;
    this.q0 = equations.q0;
    this.q1 = equations.q1;
    this.blockSize = 4 * equations.channels;
    const n = y.length;
    this.n = n;
    this.r = r0;
    this.h = h0;
    this.tol = Math.max(tol, TOL_FLOOR);
    this.k = Math.max(3, Math.min(KMAX - 1, Math.floor(-Math.log10(this.tol) * 0.6 + 1.5)));
    // one buffer, viewed in parts: a typed array's own storage costs more to make than the views (the
    // constructor was 2–3 % of a near-threshold even-sector solve with eight of them)
    const buffer = new Float64Array((KMAX + 6) * n + 2 * (KMAX + 1));
    let at = 0;
    const part = (size: number): Float64Array => {
      const view = buffer.subarray(at, at + size);
      at += size;
      return view;
    };
    this.table = part((KMAX + 1) * n);
    this.yMid = part(n);
    this.yPrev = part(n);
    this.dy0 = part(n);
    this.dy = part(n);
    this.scale = part(n);
    this.hNew = part(KMAX + 1);
    this.errors = part(KMAX + 1);
  }

  /** dy/dr at r into out. */
  private evaluate(out: Float64Array, y: Float64Array, r: number): void {
    this.evaluations++;
    channelDerivative(this.equations, out, y, r);
  }

  /**
   * Modified midpoint rule over h with `steps` substeps, into row j of the
   * table; the interior substeps evaluate the equations in place,
   * z_{m+1} = z_{m−1} + 2 hs F(r_m, z_m), component by component (one
   * routine per channel count, so that each stays monomorphic).
   */
  private midpoint(h: number, steps: number, j: number): void {
    const { n, y, dy0, dy, yMid, yPrev, table } = this;
    const hs = h / steps;
    for (let i = 0; i < n; i++) {
      yPrev[i] = y[i];
      yMid[i] = y[i] + hs * dy0[i];
    }
    if (this.channels === 2) this.substepsTwo(hs, steps);
    else this.substepsOne(hs, steps);
    this.evaluations += steps - 1;
    this.evaluate(dy, yMid, this.r + h);
    const o = j * n;
    for (let i = 0; i < n; i++) table[o + i] = 0.5 * (yMid[i] + yPrev[i] + hs * dy[i]);
  }

  private substepsOne(hs: number, steps: number): void {
    const { n, yMid, yPrev, q0, q1, L, mu2, w2 } = this;
    const h2 = 2 * hs;
    for (let m = 1; m < steps; m++) {
      const r = this.r + m * hs;
      const invF = r / (r - 2);
      const inv2 = 1 / (r * r);
      const c = mu2 + L * inv2 - w2 * invF + (q0[0] + q1[0] / r) * inv2;
      for (let o = 0; o < n; o += 4) {
        const u0 = yMid[o];
        const u1 = yMid[o + 1];
        const p0 = yMid[o + 2];
        const p1 = yMid[o + 3];
        yMid[o] = yPrev[o] + h2 * (p0 * invF);
        yMid[o + 1] = yPrev[o + 1] + h2 * (p1 * invF);
        yMid[o + 2] = yPrev[o + 2] + h2 * (c * u0);
        yMid[o + 3] = yPrev[o + 3] + h2 * (c * u1);
        yPrev[o] = u0;
        yPrev[o + 1] = u1;
        yPrev[o + 2] = p0;
        yPrev[o + 3] = p1;
      }
    }
  }

  private substepsTwo(hs: number, steps: number): void {
    const { n, yMid, yPrev, q0, q1, L, mu2, w2 } = this;
    const h2 = 2 * hs;
    for (let m = 1; m < steps; m++) {
      const r = this.r + m * hs;
      const invF = r / (r - 2);
      const inv2 = 1 / (r * r);
      const yr = 1 / r;
      const diag = mu2 + L * inv2 - w2 * invF;
      const a00 = diag + (q0[0] + q1[0] * yr) * inv2;
      const a01 = (q0[1] + q1[1] * yr) * inv2;
      const a10 = (q0[2] + q1[2] * yr) * inv2;
      const a11 = diag + (q0[3] + q1[3] * yr) * inv2;
      for (let o = 0; o < n; o += 8) {
        const u0 = yMid[o];
        const u1 = yMid[o + 1];
        const u2 = yMid[o + 2];
        const u3 = yMid[o + 3];
        const p0 = yMid[o + 4];
        const p1 = yMid[o + 5];
        const p2 = yMid[o + 6];
        const p3 = yMid[o + 7];
        yMid[o] = yPrev[o] + h2 * (p0 * invF);
        yMid[o + 1] = yPrev[o + 1] + h2 * (p1 * invF);
        yMid[o + 2] = yPrev[o + 2] + h2 * (p2 * invF);
        yMid[o + 3] = yPrev[o + 3] + h2 * (p3 * invF);
        yMid[o + 4] = yPrev[o + 4] + h2 * (a00 * u0 + a01 * u2);
        yMid[o + 5] = yPrev[o + 5] + h2 * (a00 * u1 + a01 * u3);
        yMid[o + 6] = yPrev[o + 6] + h2 * (a10 * u0 + a11 * u2);
        yMid[o + 7] = yPrev[o + 7] + h2 * (a10 * u1 + a11 * u3);
        yPrev[o] = u0;
        yPrev[o + 1] = u1;
        yPrev[o + 2] = u2;
        yPrev[o + 3] = u3;
        yPrev[o + 4] = p0;
        yPrev[o + 5] = p1;
        yPrev[o + 6] = p2;
        yPrev[o + 7] = p3;
      }
    }
  }

  /** Aitken–Neville: fold row j into rows j − 1 … 1 (row 1 then holds the highest order). */
  private extrapolate(j: number): void {
    const { n, table } = this;
    // component by component down the rows (the same operations as row by row: each row l − 1 is
    // T_l + (T_l − T_{l−1}) · factor with T_l the row just folded), the chain kept in a register
    const f = j * (KMAX + 1);
    for (let i = 0; i < n; i++) {
      let t = table[j * n + i];
      for (let l = j; l > 1; l--) {
        const b = (l - 1) * n + i;
        t = t + (t - table[b]) * FOLD[f + l];
        table[b] = t;
      }
    }
  }

  /** Scaled error of column j: max over components of |T_j1 − T_21| / (tol · block size). */
  private columnError(): number {
    const { n, table, scale } = this;
    let e = 0;
    for (let i = 0; i < n; i++) e = Math.max(e, Math.abs(table[n + i] - table[2 * n + i]) / scale[i]);
    return e;
  }

  /** Error scales: per solution, u scaled by |u| + |P|/ω and P by |P| + ω|u| (the larger of the old and new state). */
  private setScale(): void {
    const { n, y, table, scale, blockSize, tol, rate } = this;
    const half = blockSize / 2;
    for (let b = 0; b < n; b += blockSize) {
      let u0 = 0;
      let p0 = 0;
      let u1 = 0;
      let p1 = 0;
      for (let i = b; i < b + half; i++) {
        u0 += y[i] * y[i];
        u1 += table[n + i] * table[n + i];
        p0 += y[i + half] * y[i + half];
        p1 += table[n + i + half] * table[n + i + half];
      }
      const u = Math.sqrt(Math.max(u0, u1));
      const p = Math.sqrt(Math.max(p0, p1));
      const su = tol * (u + p / rate + 1e-300);
      const sp = tol * (p + rate * u + 1e-300);
      for (let i = b; i < b + half; i++) {
        scale[i] = su;
        scale[i + half] = sp;
      }
    }
  }

  /**
   * One accepted step towards rEnd (never past it). Returns false once r = rEnd.
   * Throws a ConvergenceError with diagnostics when the step size underflows.
   */
  step(rEnd: number): boolean {
    if (this.r >= rEnd) return false;
    const { n, y, table, hNew } = this;
    this.evaluate(this.dy0, y, this.r);
    for (;;) {
      const h = Math.min(this.h, rEnd - this.r);
      const last = h === rEnd - this.r;
      if (!(h > 1e-14 * Math.max(1, Math.abs(this.r)))) {
        throw new ConvergenceError('integration step size underflow', {
          method: this.method,
          steps: this.steps,
          rhsEvaluations: this.evaluations,
          errorEstimate: Infinity,
          message: `extrapolation step size underflow at r = ${this.r}`,
          r: this.r,
        });
      }
      const k = this.k;
      let reached = 1;
      let accepted = false;
      for (let j = 1; j <= k + 1; j++) {
        this.midpoint(h, NJ[j], j);
        if (j === 1) continue;
        this.extrapolate(j);
        this.setScale();
        const e = Math.max(this.columnError(), 1e-300);
        this.errors[j] = e;
        reached = j;
        if (j >= k - 1 && e <= 1) {
          accepted = true;
          break;
        }
        // convergence monitor: stop early when column k + 1 cannot succeed
        if (j === k - 1 && e > ((NJ[k + 1] * NJ[k]) / 4) ** 2) break;
        if (j === k && e > (NJ[k + 1] / 2) ** 2) break;
      }
      // the step sizes of the columns the order choice looks at (it never goes below reached − 2)
      for (let j = Math.max(2, reached - 2); j <= reached; j++) {
        const expo = EXPONENT[j];
        const facMin = FAC_MIN[j];
        hNew[j] = h * Math.min(4 / facMin, Math.max(facMin, SAFE2 * (SAFE1 / this.errors[j]) ** expo));
      }
      const cost = (j: number) => WORK[j] / hNew[j];
      if (accepted) {
        this.steps++;
        for (let i = 0; i < n; i++) y[i] = table[n + i];
        this.r = last ? rEnd : this.r + h;
        // next order as ODEX chooses it (Hairer, Nørsett & Wanner, section II.9): work per unit step
        const kc = reached;
        let kOpt: number;
        if (kc === 2) kOpt = 3;
        else if (kc <= k) {
          kOpt = cost(kc - 1) < 0.9 * cost(kc) ? kc - 1 : kc;
          if (kOpt === kc && cost(kc) < 0.9 * cost(kc - 1)) kOpt = kc + 1;
        } else {
          kOpt = kc > 3 && cost(kc - 2) < 0.9 * cost(kc - 1) ? kc - 2 : kc - 1;
          if (cost(kc) < 0.9 * cost(kOpt)) kOpt = kc;
        }
        kOpt = Math.max(3, Math.min(KMAX - 1, kOpt));
        const hNext = kOpt <= kc ? hNew[kOpt] : (hNew[kc] * WORK[kOpt]) / WORK[kc];
        this.k = kOpt;
        if (!last || hNext > this.h) this.h = hNext;
        return this.r < rEnd;
      }
      // rejected: the order of the last column (one less if that was cheaper), its step
      const kr = reached > 2 && cost(reached - 1) < 0.9 * cost(reached) ? reached - 1 : reached;
      this.k = Math.max(3, Math.min(KMAX - 1, kr));
      this.h = Math.min(hNew[kr], 0.9 * h);
    }
  }
}
