/**
 * The integrator right-hand side, generated from the polynomial coefficients
 * of one `RadialEquation`: y = (Re R, Im R, Re R', Im R') and
 * R'' = −(B R' + C R)/A. The coefficients are unpacked once, so each call is
 * a few Horner steps in plain float64 and allocates nothing.
 */
import type { RadialEquation } from './equation.js';

/** Fill dy with the derivative at r; must not allocate. */
export type Rhs = (dy: Float64Array | number[], y: Float64Array | number[], r: number) => void;

/** Counts right-hand-side evaluations across the legs of one solve. */
export interface EvaluationCounter {
  /** evaluations so far */
  evaluations: number;
}

/** Highest power the evaluation handles (the radial equation has degree 4). */
const MAX_DEGREE = 4;

/** Offsets of the coefficient blocks in the one typed array the right-hand side reads. */
const D = 0,
  BR = 3,
  BI = BR + MAX_DEGREE + 1,
  CR = BI + MAX_DEGREE + 1,
  CI = CR + MAX_DEGREE + 1,
  SIZE = CI + MAX_DEGREE + 1;

/** Whether A = Δ·Δ coefficient for coefficient, the products summed as `mul` of complexPoly.ts sums them (without building Δ²). */
function isSquareOfDelta(eq: RadialEquation): boolean {
  const { re: dr, im: di } = eq.delta;
  const n = 2 * dr.length - 1;
  if (eq.A.re.length !== n) return false;
  for (let k = 0; k < n; k++) {
    let re = 0,
      im = 0;
    for (let i = Math.max(0, k - dr.length + 1); i <= Math.min(k, dr.length - 1); i++) {
      re += dr[i] * dr[k - i] - di[i] * di[k - i];
      im += dr[i] * di[k - i] + di[i] * dr[k - i];
    }
    if (eq.A.re[k] !== re || eq.A.im[k] !== 0 || im !== 0) return false;
  }
  return true;
}

/** Δ, B and C packed into one typed array at the offsets above (one array: measured faster than several, or than closure constants). */
function packCoefficients(eq: RadialEquation, k: Float64Array): void {
  for (const p of [eq.B, eq.C]) {
    if (p.re.length > MAX_DEGREE + 1) throw new Error(`radial equation coefficient of degree ${p.re.length - 1} > ${MAX_DEGREE}`);
  }
  if (eq.delta.re.length > 3) throw new Error('radial equation: Δ must be quadratic');
  k.fill(0);
  k.set(eq.delta.re, D);
  k.set(eq.B.re, BR);
  k.set(eq.B.im, BI);
  k.set(eq.C.re, CR);
  k.set(eq.C.im, CI);
}

/**
 * The coefficients of one equation as the integrator loop reads them: Δ, B
 * and C packed at fixed offsets (k), the expansion point minus the argument's
 * origin (c), and whether B is complex (the 'phase' variable). The extrapolation
 * loop (gbsStepper.ts) evaluates the right-hand side from these inline.
 */
export interface EquationKernel {
  /** Δ at [0, 3), Re B at [3, 8), Im B at [8, 13), Re C at [13, 18), Im C at [18, 23) */
  k: Float64Array;
  /** the argument minus this is the distance from the expansion point */
  c: number;
  /** B has an imaginary part */
  complexB: boolean;
  /** counts the evaluations */
  counter: EvaluationCounter;
}

/**
 * Packed coefficients of the equations seen last (a leg is integrated in
 * several pieces, each asking for the kernel of the same equation; the
 * equations are never modified after they are built), found by identity:
 * a short list, measured cheaper than a WeakMap, whose insertions were a
 * visible share of a greybody factor. Each slot owns its array (a fresh
 * one per equation was measured among a solve's allocations), so a kernel,
 * and a right-hand side made from it, reads valid coefficients until eight
 * other equations have been packed: a leg uses its kernel only while it runs.
 */
const recent: { eq: RadialEquation | null; k: Float64Array; complexB: boolean }[] = Array.from({ length: 8 }, () => ({
  eq: null,
  k: new Float64Array(SIZE),
  complexB: false,
}));
let nextSlot = 0;

/** The kernel of `eq` for an argument measured from `origin` (default 0: the argument is r itself). */
export function equationKernel(eq: RadialEquation, counter: EvaluationCounter, origin = 0): EquationKernel {
  let packed = recent.find((e) => e.eq === eq);
  if (packed === undefined) {
    if (!isSquareOfDelta(eq)) throw new Error('radial equation: the coefficient of R″ must be Δ²');
    packed = recent[nextSlot];
    nextSlot = (nextSlot + 1) % recent.length;
    packed.eq = null;
    packCoefficients(eq, packed.k);
    packed.complexB = !eq.B.im.every((x) => x === 0);
    packed.eq = eq;
  }
  // An argument measured from the expansion point needs no subtraction (and loses no digits to one).
  return { k: packed.k, c: eq.center - origin, complexB: packed.complexB, counter };
}

/**
 * The right-hand side of `eq`, counting its calls in `counter`; its argument
 * is the radius minus `origin` (default 0: the argument is r itself). The
 * coefficient of R'' is Δ² for every equation built here, so Δ (degree 2) is
 * evaluated and squared; B and C are evaluated by Horner's rule, and a real B
 * (the unsubstituted equation) skips its imaginary part. (Measured: the
 * coefficients held in many closure variables, or a complex B throughout,
 * cost 10–25 % of a whole solve.) The extrapolation loop evaluates the same
 * expressions inline from `equationKernel`. Like a kernel, it is valid until
 * eight other equations have been packed (see `recent`).
 */
export function equationRhs(eq: RadialEquation, counter: EvaluationCounter, origin = 0): Rhs {
  return kernelRhs(equationKernel(eq, counter, origin));
}

/** The right-hand side `equationRhs` makes, from a kernel already built (the same doubles). */
export function kernelRhs({ k, c, complexB, counter }: EquationKernel): Rhs {
  if (!complexB) {
    return (dy, y, r) => {
      counter.evaluations++;
      const x = r - c;
      const d = k[0] + x * (k[1] + x * k[2]);
      const iA = 1 / (d * d);
      const Br = k[3] + x * (k[4] + x * (k[5] + x * (k[6] + x * k[7])));
      const Cr = k[13] + x * (k[14] + x * (k[15] + x * (k[16] + x * k[17])));
      const Ci = k[18] + x * (k[19] + x * (k[20] + x * (k[21] + x * k[22])));
      dy[0] = y[2];
      dy[1] = y[3];
      dy[2] = -(Br * y[2] + Cr * y[0] - Ci * y[1]) * iA;
      dy[3] = -(Br * y[3] + Cr * y[1] + Ci * y[0]) * iA;
    };
  }
  return (dy, y, r) => {
    counter.evaluations++;
    const x = r - c;
    const d = k[0] + x * (k[1] + x * k[2]);
    const iA = 1 / (d * d);
    const Br = k[3] + x * (k[4] + x * (k[5] + x * (k[6] + x * k[7])));
    const Bi = k[8] + x * (k[9] + x * (k[10] + x * (k[11] + x * k[12])));
    const Cr = k[13] + x * (k[14] + x * (k[15] + x * (k[16] + x * k[17])));
    const Ci = k[18] + x * (k[19] + x * (k[20] + x * (k[21] + x * k[22])));
    dy[0] = y[2];
    dy[1] = y[3];
    dy[2] = -(Br * y[2] - Bi * y[3] + Cr * y[0] - Ci * y[1]) * iA;
    dy[3] = -(Br * y[3] + Bi * y[2] + Cr * y[1] + Ci * y[0]) * iA;
  };
}
