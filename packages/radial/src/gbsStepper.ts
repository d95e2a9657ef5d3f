/**
 * An allocation-free Gragg–Bulirsch–Stoer extrapolation loop for a
 * 4-component real state: the algorithm of Hairer & Wanner's ODEX (as the
 * npm `odex` package runs it here: step-number sequence 2, 4, 6, …, at most 9
 * columns, no dense output, pure relative tolerance), with its step-size and
 * order control kept operation for operation, so that it takes the same steps
 * and returns the same doubles as the 'odex' integrator. What changes is the
 * calling convention: the state lives in preallocated Float64Arrays and,
 * for the radial equation, the right-hand side is evaluated inline from its
 * packed coefficients (rhs.ts, `equationKernel`) on scalar locals, where the
 * generic package copies arrays on every evaluation and every step (measured:
 * that copying and its garbage were about 60 % of a greybody solve;
 * docs/method.md, section 7).
 */
import type { DiracKernel } from './dirac/equation.js';
import type { AdvanceResult, Stepper } from './integrators.js';
import type { EquationKernel, Rhs } from './rhs.js';
import { type FailureContext, stepperFailure } from './stepperFailure.js';

/** Columns of the extrapolation tableau (ODEX's default KM). */
const KM = 9;
/** Dimension of the state. */
const N = 4;
/** ODEX's rounding unit (its WORK(1) default). */
const U_ROUND = 2.3e-16;
/** ODEX's step-size controls (WORK(3)…WORK(9) defaults). */
const REDUCTION = 0.5,
  FAC1 = 0.02,
  FAC2 = 4.0,
  FAC3 = 0.8,
  FAC4 = 0.9,
  SAFE1 = 0.65,
  SAFE2 = 0.94;

/** Step numbers n_j = 2j (1-based; index KM + 1 is read by the convergence monitor). */
const NJ = new Float64Array(KM + 2);
for (let i = 1; i <= KM + 1; i++) NJ[i] = 2 * i;
/** Work per column, for the order selection: A[j] = 1 + n_1 + … + n_j. */
const WORK = new Float64Array(KM + 2).fill(Number.NaN);
WORK[1] = 1 + NJ[1];
for (let i = 2; i <= KM; i++) WORK[i] = WORK[i - 1] + NJ[i];
/** Aitken–Neville denominators (n_j/n_{l−1})² − 1, at [j·(KM+1) + l], computed as ODEX computes them. */
const NEVILLE = new Float64Array((KM + 2) * (KM + 1));
for (let j = 2; j <= KM; j++) for (let l = j; l > 1; l--) NEVILLE[j * (KM + 1) + l] = (NJ[j] / NJ[l - 1]) ** 2 - 1;
/** Per column: the exponent 1/(2j − 1) and the smallest step factor 0.02^exponent. */
const EXPONENT = new Float64Array(KM + 1);
const FAC_MIN = new Float64Array(KM + 1);
for (let j = 1; j <= KM; j++) {
  EXPONENT[j] = 1 / (2 * j - 1);
  FAC_MIN[j] = FAC1 ** EXPONENT[j];
}

/** The states of ODEX's core loop. */
const START = 0,
  BASIC = 1,
  CONVERGENCE = 2,
  HOPE = 3,
  ACCEPT = 4,
  REJECT = 5;

/**
 * The loop's arrays. Every `advance` sets each of them before reading it and
 * runs to completion without calling another stepper, so all steppers share
 * one set (measured: allocating them per leg was a visible share of the
 * garbage collection).
 */
const WORKSPACE = {
  y: new Float64Array(N),
  dz: new Float64Array(N),
  dy: new Float64Array(N),
  yh1: new Float64Array(N),
  yh2: new Float64Array(N),
  scal: new Float64Array(N),
  /** tableau rows t[j] at [j·N + i], j = 1…KM */
  t: new Float64Array((KM + 1) * N),
  hh: new Float64Array(KM + 2),
  w: new Float64Array(KM + 2),
  /** per column: the err and |h| its hh and w come from, and whether they are still to be computed from them */
  colErr: new Float64Array(KM + 2),
  colAbsH: new Float64Array(KM + 2),
  colPending: new Uint8Array(KM + 2),
};

/** The loop's state: the shared arrays, and scalars reset by every `advance`. */
class GbsLoop implements Stepper {
  readonly y = WORKSPACE.y;
  readonly dz = WORKSPACE.dz;
  readonly dy = WORKSPACE.dy;
  readonly yh1 = WORKSPACE.yh1;
  readonly yh2 = WORKSPACE.yh2;
  readonly scal = WORKSPACE.scal;
  readonly t = WORKSPACE.t;
  readonly hh = WORKSPACE.hh;
  readonly w = WORKSPACE.w;
  readonly colErr = WORKSPACE.colErr;
  readonly colAbsH = WORKSPACE.colAbsH;
  readonly colPending = WORKSPACE.colPending;
  readonly kStart: number;
  x = 0;
  h = 0;
  hMax = 0;
  posneg = 1;
  err = 0;
  errOld = 1e10;
  k = 2;
  kc = 0;
  reject = false;
  atov = false;
  /** sum of the accepted steps' error estimates err (relative to tol) in this advance */
  errSum = 0;
  /** the midpoint step of the line being swept (midex) */
  hj = 0.5;

  constructor(
    readonly tol: number,
    readonly maxSteps: number,
    readonly rhs: Rhs,
    readonly kernel: EquationKernel | undefined,
    readonly failure: FailureContext,
    readonly dirac: DiracKernel | undefined = undefined,
  ) {
    // ODEX's first order guess from the tolerance.
    this.kStart = Math.max(2, Math.min(KM - 1, Math.floor(-(Math.log(tol + 1e-40) / Math.LN10) * 0.6 + 1.5)));
  }

  /** f(x, y) into out. */
  evaluate(out: Float64Array, yy: Float64Array, x: number): void {
    const dk = this.dirac;
    if (dk !== undefined) {
      // diracRhs (dirac/equation.ts), the same operations in the same order
      dk.counter.evaluations++;
      const delta = (x - dk.rPlus) * (x - dk.rMinus);
      const sq = Math.sqrt(delta);
      const kd = ((x * x + dk.a2) * dk.omega - dk.am) / delta;
      const g = dk.lambda / sq;
      const h = (dk.mu * x) / sq;
      const y0 = yy[0],
        y1 = yy[1],
        y2 = yy[2],
        y3 = yy[3];
      out[0] = kd * y1 + g * y2 + h * y3;
      out[1] = -kd * y0 + g * y3 - h * y2;
      out[2] = g * y0 - h * y1 - kd * y3;
      out[3] = g * y1 + h * y0 + kd * y2;
      return;
    }
    const kn = this.kernel;
    if (kn === undefined) {
      this.rhs(out, yy, x);
      return;
    }
    kn.counter.evaluations++;
    const k = kn.k;
    const X = x - kn.c;
    const d = k[0] + X * (k[1] + X * k[2]);
    const iA = 1 / (d * d);
    const Br = k[3] + X * (k[4] + X * (k[5] + X * (k[6] + X * k[7])));
    const Cr = k[13] + X * (k[14] + X * (k[15] + X * (k[16] + X * k[17])));
    const Ci = k[18] + X * (k[19] + X * (k[20] + X * (k[21] + X * k[22])));
    out[0] = yy[2];
    out[1] = yy[3];
    if (kn.complexB) {
      const Bi = k[8] + X * (k[9] + X * (k[10] + X * (k[11] + X * k[12])));
      out[2] = -(Br * yy[2] - Bi * yy[3] + Cr * yy[0] - Ci * yy[1]) * iA;
      out[3] = -(Br * yy[3] + Bi * yy[2] + Cr * yy[1] + Ci * yy[0]) * iA;
    } else {
      out[2] = -(Br * yy[2] + Cr * yy[0] - Ci * yy[1]) * iA;
      out[3] = -(Br * yy[3] + Cr * yy[1] + Ci * yy[0]) * iA;
    }
  }

  /** ODEX's stability check after the first midpoint step of lines 1 and 2: true when the step must be halved. */
  unstable(): boolean {
    const { dz, dy, scal } = this;
    let del1 = 0;
    for (let i = 0; i < N; i++) del1 += (dz[i] / scal[i]) ** 2;
    let del2 = 0;
    for (let i = 0; i < N; i++) del2 += ((dy[i] - dz[i]) / scal[i]) ** 2;
    return del2 / Math.max(U_ROUND, del1) > 4;
  }

  /**
   * The midpoint sweep of line j (step hj = this.hj) with the right-hand side inline (the radial equation); false when
   * the stability check rejects. The first pass (which carries ODEX's stability check on lines 1 and 2) and the final
   * smoothing evaluation are peeled off the loop, and a real B (every equation but the 'phase' variable's) has its own
   * loop: the same operations in the same order as the one loop they replace, so the same doubles.
   */
  sweepKernel(j: number, m: number): boolean {
    const kn = this.kernel as EquationKernel;
    return kn.complexB ? this.sweepComplex(j, m, kn) : this.sweepReal(j, m, kn);
  }

  /** `sweepKernel` for a real B. */
  sweepReal(j: number, m: number, kn: EquationKernel): boolean {
    const hj = this.hj;
    const { k, c } = kn;
    const { y, dz, dy } = this;
    const k0 = k[0],
      k1 = k[1],
      k2 = k[2],
      k3 = k[3],
      k4 = k[4],
      k5 = k[5],
      k6 = k[6],
      k7 = k[7];
    const k13 = k[13],
      k14 = k[14],
      k15 = k[15],
      k16 = k[16],
      k17 = k[17];
    const k18 = k[18],
      k19 = k[19],
      k20 = k[20],
      k21 = k[21],
      k22 = k[22];
    const x = this.x;
    const h2 = 2 * hj;
    // yh1 = (a0…a3), yh2 = (b0…b3)
    let a0 = y[0],
      a1 = y[1],
      a2 = y[2],
      a3 = y[3];
    let b0 = y[0] + hj * dz[0],
      b1 = y[1] + hj * dz[1],
      b2 = y[2] + hj * dz[2],
      b3 = y[3] + hj * dz[3];
    let d2 = 0,
      d3 = 0;
    for (let mm = 1; mm <= m; mm++) {
      const X = x + hj * mm - c;
      const d = k0 + X * (k1 + X * k2);
      const iA = 1 / (d * d);
      const Br = k3 + X * (k4 + X * (k5 + X * (k6 + X * k7)));
      const Cr = k13 + X * (k14 + X * (k15 + X * (k16 + X * k17)));
      const Ci = k18 + X * (k19 + X * (k20 + X * (k21 + X * k22)));
      d2 = -(Br * b2 + Cr * b0 - Ci * b1) * iA;
      d3 = -(Br * b3 + Cr * b1 + Ci * b0) * iA;
      const s0 = a0,
        s1 = a1,
        s2 = a2,
        s3 = a3;
      a0 = b0;
      a1 = b1;
      a2 = b2;
      a3 = b3;
      b0 = s0 + h2 * b2;
      b1 = s1 + h2 * b3;
      b2 = s2 + h2 * d2;
      b3 = s3 + h2 * d3;
      if (mm === 1 && j <= 2) {
        dy[0] = a2;
        dy[1] = a3;
        dy[2] = d2;
        dy[3] = d3;
        if (this.unstable()) {
          kn.counter.evaluations += 1;
          return false;
        }
      }
    }
    // the final smoothing evaluation at x + h
    const X = x + this.h - c;
    const d = k0 + X * (k1 + X * k2);
    const iA = 1 / (d * d);
    const Br = k3 + X * (k4 + X * (k5 + X * (k6 + X * k7)));
    const Cr = k13 + X * (k14 + X * (k15 + X * (k16 + X * k17)));
    const Ci = k18 + X * (k19 + X * (k20 + X * (k21 + X * k22)));
    const d0 = b2,
      d1 = b3;
    d2 = -(Br * b2 + Cr * b0 - Ci * b1) * iA;
    d3 = -(Br * b3 + Cr * b1 + Ci * b0) * iA;
    kn.counter.evaluations += m + 1;
    const t = this.t;
    const tj = j * N;
    t[tj] = (a0 + b0 + hj * d0) / 2;
    t[tj + 1] = (a1 + b1 + hj * d1) / 2;
    t[tj + 2] = (a2 + b2 + hj * d2) / 2;
    t[tj + 3] = (a3 + b3 + hj * d3) / 2;
    return true;
  }

  /** `sweepKernel` for a complex B (the 'phase' variable). */
  sweepComplex(j: number, m: number, kn: EquationKernel): boolean {
    const hj = this.hj;
    const { k, c } = kn;
    const { y, dz, dy } = this;
    const k0 = k[0],
      k1 = k[1],
      k2 = k[2],
      k3 = k[3],
      k4 = k[4],
      k5 = k[5],
      k6 = k[6],
      k7 = k[7];
    const k8 = k[8],
      k9 = k[9],
      k10 = k[10],
      k11 = k[11],
      k12 = k[12];
    const k13 = k[13],
      k14 = k[14],
      k15 = k[15],
      k16 = k[16],
      k17 = k[17];
    const k18 = k[18],
      k19 = k[19],
      k20 = k[20],
      k21 = k[21],
      k22 = k[22];
    const x = this.x;
    let a0 = y[0],
      a1 = y[1],
      a2 = y[2],
      a3 = y[3];
    let b0 = y[0] + hj * dz[0],
      b1 = y[1] + hj * dz[1],
      b2 = y[2] + hj * dz[2],
      b3 = y[3] + hj * dz[3];
    let d0 = 0,
      d1 = 0,
      d2 = 0,
      d3 = 0;
    for (let mm = 1; mm <= m + 1; mm++) {
      // the last pass is the final smoothing evaluation at x + h
      const X = (mm <= m ? x + hj * mm : x + this.h) - c;
      const d = k0 + X * (k1 + X * k2);
      const iA = 1 / (d * d);
      const Br = k3 + X * (k4 + X * (k5 + X * (k6 + X * k7)));
      const Bi = k8 + X * (k9 + X * (k10 + X * (k11 + X * k12)));
      const Cr = k13 + X * (k14 + X * (k15 + X * (k16 + X * k17)));
      const Ci = k18 + X * (k19 + X * (k20 + X * (k21 + X * k22)));
      d0 = b2;
      d1 = b3;
      d2 = -(Br * b2 - Bi * b3 + Cr * b0 - Ci * b1) * iA;
      d3 = -(Br * b3 + Bi * b2 + Cr * b1 + Ci * b0) * iA;
      if (mm > m) break;
      const s0 = a0,
        s1 = a1,
        s2 = a2,
        s3 = a3;
      a0 = b0;
      a1 = b1;
      a2 = b2;
      a3 = b3;
      b0 = s0 + 2 * hj * d0;
      b1 = s1 + 2 * hj * d1;
      b2 = s2 + 2 * hj * d2;
      b3 = s3 + 2 * hj * d3;
      if (mm <= 1 && j <= 2) {
        dy[0] = d0;
        dy[1] = d1;
        dy[2] = d2;
        dy[3] = d3;
        if (this.unstable()) {
          kn.counter.evaluations += mm;
          return false;
        }
      }
    }
    kn.counter.evaluations += m + 1;
    const t = this.t;
    const tj = j * N;
    t[tj] = (a0 + b0 + hj * d0) / 2;
    t[tj + 1] = (a1 + b1 + hj * d1) / 2;
    t[tj + 2] = (a2 + b2 + hj * d2) / 2;
    t[tj + 3] = (a3 + b3 + hj * d3) / 2;
    return true;
  }

  /** The midpoint sweep of line j (step hj = this.hj) with the massive Dirac pair inline; false when the stability check rejects. */
  sweepDirac(j: number, m: number): boolean {
    const hj = this.hj;
    const dk = this.dirac as DiracKernel;
    const { rPlus, rMinus, a2: aSquared, am, omega, mu, lambda } = dk;
    const { y, dz, dy } = this;
    const x = this.x;
    let a0 = y[0],
      a1 = y[1],
      a2 = y[2],
      a3 = y[3];
    let b0 = y[0] + hj * dz[0],
      b1 = y[1] + hj * dz[1],
      b2 = y[2] + hj * dz[2],
      b3 = y[3] + hj * dz[3];
    let d0 = 0,
      d1 = 0,
      d2 = 0,
      d3 = 0;
    for (let mm = 1; mm <= m + 1; mm++) {
      // the last pass is the final smoothing evaluation at x + h
      const r = mm <= m ? x + hj * mm : x + this.h;
      const delta = (r - rPlus) * (r - rMinus);
      const sq = Math.sqrt(delta);
      const kd = ((r * r + aSquared) * omega - am) / delta;
      const g = lambda / sq;
      const h = (mu * r) / sq;
      d0 = kd * b1 + g * b2 + h * b3;
      d1 = -kd * b0 + g * b3 - h * b2;
      d2 = g * b0 - h * b1 - kd * b3;
      d3 = g * b1 + h * b0 + kd * b2;
      if (mm > m) break;
      const s0 = a0,
        s1 = a1,
        s2 = a2,
        s3 = a3;
      a0 = b0;
      a1 = b1;
      a2 = b2;
      a3 = b3;
      b0 = s0 + 2 * hj * d0;
      b1 = s1 + 2 * hj * d1;
      b2 = s2 + 2 * hj * d2;
      b3 = s3 + 2 * hj * d3;
      if (mm <= 1 && j <= 2) {
        dy[0] = d0;
        dy[1] = d1;
        dy[2] = d2;
        dy[3] = d3;
        if (this.unstable()) {
          dk.counter.evaluations += mm;
          return false;
        }
      }
    }
    dk.counter.evaluations += m + 1;
    const t = this.t;
    const tj = j * N;
    t[tj] = (a0 + b0 + hj * d0) / 2;
    t[tj + 1] = (a1 + b1 + hj * d1) / 2;
    t[tj + 2] = (a2 + b2 + hj * d2) / 2;
    t[tj + 3] = (a3 + b3 + hj * d3) / 2;
    return true;
  }

  /** The midpoint sweep of line j (step hj = this.hj) through the generic right-hand side; false when the stability check rejects. */
  sweepGeneric(j: number, m: number): boolean {
    const { y, dz, dy, yh1, yh2, rhs, x, hj } = this;
    for (let i = 0; i < N; i++) {
      yh1[i] = y[i];
      yh2[i] = y[i] + hj * dz[i];
    }
    for (let mm = 1; mm <= m; mm++) {
      rhs(dy, yh2, x + hj * mm);
      for (let i = 0; i < N; i++) {
        const ys = yh1[i];
        yh1[i] = yh2[i];
        yh2[i] = ys + 2 * hj * dy[i];
      }
      if (mm <= 1 && j <= 2 && this.unstable()) return false;
    }
    // final smoothing step
    rhs(dy, yh2, x + this.h);
    const t = this.t;
    const tj = j * N;
    for (let i = 0; i < N; i++) t[tj + i] = (yh1[i] + yh2[i] + hj * dy[i]) / 2;
    return true;
  }

  /** Line j of the tableau by the explicit midpoint rule, extrapolated; sets err and the optimal step hh[j] (ODEX's MIDEX). */
  midex(j: number): void {
    const nj = NJ[j];
    // hj passes through a field: as an argument of the (not inlined) sweep it was boxed, a heap number per line
    this.hj = this.h / nj;
    const swept =
      this.dirac !== undefined
        ? this.sweepDirac(j, nj - 1)
        : this.kernel === undefined
          ? this.sweepGeneric(j, nj - 1)
          : this.sweepKernel(j, nj - 1);
    if (!swept) {
      this.atov = true;
      this.h *= REDUCTION;
      this.reject = true;
      return;
    }
    if (j === 1) return;
    // polynomial extrapolation
    const { t, y, scal, tol } = this;
    const row = j * (KM + 1);
    // the four components written out (N = 4), each in the order of the loop they replace
    for (let l = j; l > 1; l--) {
      const fac = NEVILLE[row + l];
      const a = l * N;
      const b = a - N;
      const ta0 = t[a],
        ta1 = t[a + 1],
        ta2 = t[a + 2],
        ta3 = t[a + 3];
      t[b] = ta0 + (ta0 - t[b]) / fac;
      t[b + 1] = ta1 + (ta1 - t[b + 1]) / fac;
      t[b + 2] = ta2 + (ta2 - t[b + 2]) / fac;
      t[b + 3] = ta3 + (ta3 - t[b + 3]) / fac;
    }
    const s0 = 0 + tol * Math.max(Math.abs(y[0]), Math.abs(t[N]));
    const s1 = 0 + tol * Math.max(Math.abs(y[1]), Math.abs(t[N + 1]));
    const s2 = 0 + tol * Math.max(Math.abs(y[2]), Math.abs(t[N + 2]));
    const s3 = 0 + tol * Math.max(Math.abs(y[3]), Math.abs(t[N + 3]));
    scal[0] = s0;
    scal[1] = s1;
    scal[2] = s2;
    scal[3] = s3;
    const e0 = (t[N] - t[2 * N]) / s0,
      e1 = (t[N + 1] - t[2 * N + 1]) / s1,
      e2 = (t[N + 2] - t[2 * N + 2]) / s2,
      e3 = (t[N + 3] - t[2 * N + 3]) / s3;
    let err = 0;
    err += e0 * e0;
    err += e1 * e1;
    err += e2 * e2;
    err += e3 * e3;
    err = Math.sqrt(err / N);
    this.err = err;
    if (err * U_ROUND >= 1 || (j > 2 && err >= this.errOld)) {
      this.atov = true;
      this.h *= REDUCTION;
      this.reject = true;
      return;
    }
    this.errOld = Math.max(4 * err, 1);
    // the optimal step for this column, hh[j] and w[j], from these when read (colH, colW): most columns' are never
    // read, and the power in them was measured at a tenth of the loop
    this.colErr[j] = err;
    this.colAbsH[j] = Math.abs(this.h);
    this.colPending[j] = 1;
  }

  /** hh[j] and w[j] of a column whose midex left them pending, as midex computed them. */
  settleColumn(j: number): void {
    this.colPending[j] = 0;
    const exp0 = EXPONENT[j];
    const facMin = FAC_MIN[j];
    let fac = Math.min(FAC2 / facMin, Math.max(facMin, (this.colErr[j] / SAFE1) ** exp0 / SAFE2));
    fac = 1 / fac;
    this.hh[j] = Math.min(this.colAbsH[j] * fac, this.hMax);
    this.w[j] = WORK[j] / this.hh[j];
  }

  /** hh[j], the optimal step of column j. */
  colH(j: number): number {
    if (this.colPending[j] === 1) this.settleColumn(j);
    return this.hh[j];
  }

  /** w[j], the work per unit step of column j. */
  colW(j: number): number {
    if (this.colPending[j] === 1) this.settleColumn(j);
    return this.w[j];
  }

  /** Order and step after an accepted step (ODEX's label 60, after the output call). */
  nextOrder(): void {
    const { kc, k, posneg } = this;
    let kopt: number;
    if (kc === 2) {
      kopt = Math.min(3, KM - 1);
      if (this.reject) kopt = 2;
    } else if (kc <= k) {
      kopt = kc;
      if (this.colW(kc - 1) < this.colW(kc) * FAC3) kopt = kc - 1;
      if (this.colW(kc) < this.colW(kc - 1) * FAC4) kopt = Math.min(kc + 1, KM - 1);
    } else {
      kopt = kc - 1;
      if (kc > 3 && this.colW(kc - 2) < this.colW(kc - 1) * FAC3) kopt = kc - 2;
      if (this.colW(kc) < this.colW(kopt) * FAC4) kopt = Math.min(kc, KM - 1);
    }
    if (this.reject) {
      // after a rejected step
      this.k = Math.min(kopt, kc);
      this.h = posneg * Math.min(Math.abs(this.h), Math.abs(this.colH(this.k)));
      this.reject = false;
      return;
    }
    let h: number;
    if (kopt <= kc) h = this.colH(kopt);
    else if (kc < k && this.colW(kc) < this.colW(kc - 1) * FAC4) h = (this.colH(kc) * WORK[kopt + 1]) / WORK[kc];
    else h = (this.colH(kc) * WORK[kopt]) / WORK[kc];
    this.k = kopt;
    this.h = posneg * Math.abs(h);
  }

  advance(state: Float64Array, x0: number, xEnd: number, h0: number, overflow: number): AdvanceResult {
    const { y, t, dz, hh, w } = this;
    for (let i = 0; i < N; i++) {
      y[i] = state[i];
      this.scal[i] = this.tol + Math.abs(y[i]);
    }
    hh.fill(Number.NaN);
    w.fill(Number.NaN);
    w[1] = 0;
    this.colPending.fill(0);
    const hMax = Math.abs(xEnd - x0);
    const posneg = xEnd - x0 >= 0 ? 1 : -1;
    this.hMax = hMax;
    this.posneg = posneg;
    this.x = x0;
    this.k = this.kStart;
    this.h = posneg * Math.min(Math.max(Math.abs(h0), 1e-4), hMax, Math.abs(xEnd - x0) / 2);
    this.err = 0;
    this.errOld = 1e10;
    this.reject = false;
    this.atov = false;
    this.kc = 0;
    this.errSum = 0;
    let hLast = h0;
    let nStep = 0;
    // The state at the start is reported first, as ODEX's first output call does.
    if (Math.abs(y[0]) + Math.abs(y[1]) > overflow) return { r: x0, steps: 0, h: hLast, errorSum: 0 };
    const hoptde = posneg * hMax;
    let last = false;
    let stopped = false;
    let phase = START;
    loop: for (;;) {
      switch (phase) {
        case START: {
          this.atov = false;
          const x = this.x;
          // Is xEnd reached in the next step?
          if (0.1 * Math.abs(xEnd - x) <= Math.abs(x) * U_ROUND) break loop;
          this.h = posneg * Math.min(Math.abs(this.h), Math.abs(xEnd - x), hMax, Math.abs(hoptde));
          if ((x + 1.01 * this.h - xEnd) * posneg > 0) {
            this.h = xEnd - x;
            last = true;
          }
          this.evaluate(dz, y, x);
          if (nStep === 0 || last) {
            // the first and last step
            ++nStep;
            phase = HOPE;
            for (let j = 1; j <= this.k; j++) {
              this.kc = j;
              this.midex(j);
              if (this.atov) {
                phase = START;
                break;
              }
              if (j > 1 && this.err <= 1) {
                phase = ACCEPT;
                break;
              }
            }
            continue;
          }
          phase = BASIC;
          continue;
        }
        case BASIC: {
          ++nStep;
          if (nStep >= this.maxSteps) {
            const what = `exceeded its step limit of ${this.maxSteps} steps`;
            throw stepperFailure(this.failure, 'gbs', what, nStep, this.x, this.maxSteps);
          }
          const kc = this.k - 1;
          this.kc = kc;
          phase = -1;
          for (let j = 1; j <= kc; j++) {
            this.midex(j);
            if (this.atov) {
              phase = START;
              break;
            }
          }
          if (phase === START) continue;
          // convergence monitor
          const k = this.k;
          if (k === 2 || this.reject) phase = CONVERGENCE;
          else if (this.err <= 1) phase = ACCEPT;
          else if (this.err > ((NJ[k + 1] * NJ[k]) / 4) ** 2) phase = REJECT;
          else phase = CONVERGENCE;
          continue;
        }
        case CONVERGENCE: {
          this.midex(this.k);
          if (this.atov) {
            phase = START;
            continue;
          }
          this.kc = this.k;
          phase = this.err <= 1 ? ACCEPT : HOPE;
          continue;
        }
        case HOPE: {
          // hope for convergence in line k + 1
          if (this.err > (NJ[this.k + 1] / 2) ** 2) {
            phase = REJECT;
            continue;
          }
          this.kc = this.k + 1;
          this.midex(this.kc);
          if (this.atov) phase = START;
          else phase = this.err > 1 ? REJECT : ACCEPT;
          continue;
        }
        case ACCEPT: {
          // the accepted column's estimate: ‖T_kk − T_k,k−1‖ / (tol |y|), the error of the lower-order value
          this.errSum += this.err;
          const xOld = this.x;
          this.x += this.h;
          for (let i = 0; i < N; i++) y[i] = t[N + i];
          if (this.x > xOld) hLast = this.x - xOld;
          if (Math.abs(y[0]) + Math.abs(y[1]) > overflow) {
            stopped = true;
            break loop;
          }
          this.nextOrder();
          phase = START;
          continue;
        }
        default: {
          // REJECT
          let k = Math.min(this.k, this.kc, KM - 1);
          if (k > 2 && this.colW(k - 1) < this.colW(k) * FAC3) k -= 1;
          this.k = k;
          this.h = posneg * this.colH(k);
          this.reject = true;
          phase = BASIC;
        }
      }
    }
    for (let i = 0; i < N; i++) state[i] = y[i];
    return { r: stopped ? this.x : xEnd, steps: nStep, h: hLast, errorSum: this.errSum };
  }
}

/**
 * The extrapolation stepper for `rhs` at local relative tolerance `tol`; with
 * `kernel` (the same equation's packed coefficients) the right-hand side is
 * evaluated inline instead of through `rhs`. Each `advance` call is one
 * integration from r to rEnd with fresh step and order control, as one
 * `odex` solve is; past `maxSteps` it throws a ConvergenceError quoting `failure`.
 */
export function gbsStepper(
  rhs: Rhs,
  tol: number,
  maxSteps: number,
  failure: FailureContext,
  kernel?: EquationKernel,
  dirac?: DiracKernel,
): Stepper {
  return new GbsLoop(tol, maxSteps, rhs, kernel, failure, dirac);
}
