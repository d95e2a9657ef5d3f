/**
 * One Riccati step of the radial equation A R'' + B R' + C R = 0 across an
 * interval [xa, xb] (x = r − r+), at a cost that does not grow with the
 * number of oscillations in it (docs/method.md, section 9).
 *
 * With R = exp(∫y dx) and, in u = ln x, Y = x y, the Riccati equation is
 *
 *   Y_u + Y² + P Y + Q = 0,   P = x B/A − 1, Q = x² C/A.
 *
 * Where the solutions oscillate (or grow and decay) fast against the scale on
 * which P and Q vary, it has two slowly varying solutions Y±, started from
 * the roots (−P ± W)/2 of Y² + PY + Q = 0, W = √(P² − 4Q), and refined by the
 * defect correction Y ← Y − (Y_u + Y² + PY + Q)/(2Y + P): the first two
 * passes analytically (`localRiccati`), the rest with Y_u by Chebyshev
 * collocation in u (the idea of Agocs & Barnett, SIAM J. Numer. Anal. 62
 * (2024): each pass gains a factor of the ratio of the variation scale to the
 * local wavelength, so the number of passes and nodes is set by the
 * tolerance, not by the frequency). Then R = α e^{∫Y+} + β e^{∫Y−} on the
 * interval, with α, β fixed by (R, R') at xa and ∫Y du by Clenshaw–Curtis
 * quadrature: the state is carried to xb exactly up to the residual of the
 * two Riccati solutions.
 *
 * A step that does not converge (a turning point inside, too few
 * oscillations, the interval unresolved) reports failure and the caller
 * integrates that interval with the ODE integrator instead.
 */
import { type ChebyshevRule, chebyshevDerivative, chebyshevRule, chebyshevTail, tailOf } from './chebyshev.js';
import type { RadialEquation } from './equation.js';

/** The coefficients of A R'' + B R' + C R = 0 in powers of x = r − r+ (A = Δ², Δ real). */
export interface RiccatiEquation {
  /** Δ in powers of x (3 coefficients) */
  delta: Float64Array;
  /** Re B, Im B, Re C, Im C in powers of x (5 coefficients each) */
  bRe: Float64Array;
  /** imaginary parts of B */
  bIm: Float64Array;
  /** real parts of C */
  cRe: Float64Array;
  /** imaginary parts of C */
  cIm: Float64Array;
  /** B and C real (bIm, cIm all zero: s = 0 at real ω), where `localRiccatiReal` applies; false or absent means not known to be */
  real?: boolean;
}

/**
 * Node count of a Riccati step. In u = ln x the nearest singularity of P and
 * Q (r = r−) lies π off the real axis, so a rung [x, 4x] (half-length 0.69)
 * sits in a Bernstein ellipse of ρ ≈ 9 and 16 nodes resolve it to ~1e-15;
 * more nodes amplify rounding in the collocation derivative (measured: 20
 * and 24 failed more rungs than 16).
 */
export const RICCATI_NODES = 16;
/** Largest number of defect-correction passes. */
export const MAX_PASSES = 10;
/**
 * Largest number of passes in the far zone of a massive field, where the
 * rate |W| grows only like √r (the 2Mμ²/r tail near threshold): the
 * corrections there contract by 0.1–0.5 per pass and still reach the
 * rounding floor after 8–14 passes (measured on bench/massive.bench.mjs),
 * which costs 16 × 15 coefficient evaluations against ~20 integrator steps
 * (~1,200) for the same rung.
 */
export const MAX_PASSES_LONG_RANGE = 16;
/** A solution is accepted once the last correction moves ∫y and y by less than this share of the tolerance. */
export const ACCEPT = 0.3;
/**
 * Share of the tolerance below which the last correction (or the next one
 * predicted from the contraction) ends the refinement of a solution in the
 * far zone of a massive field (0.01 elsewhere). Such a step is charged
 * RICCATI_STEP_CHARGE (10) tol whatever its own error (hybridLeg.ts), so
 * refining to 0.01 tol bought nothing the estimate shows: measured on the 70
 * modes of bench/massive-cpu.bench.mjs, 0.3 takes one or two passes fewer
 * on the middle rungs of the far zone (e.g. 8 → 6, 11 → 9), Γ moved by at
 * most 1.4e-3 of its error estimate.
 */
const DONE_LONG_RANGE = 0.3;
/**
 * ACCEPT in the far zone of a massive field, where the corrections can stall
 * a little above it (|W| of 20–50): the step is accepted up to this share of
 * the tolerance and charged in proportion (hybridLeg.ts). Measured on
 * bench/massive-threshold.bench.mjs: 2 beats 1 (more rungs left to the
 * integrator) and 3 (the larger charge pushes the single-solve estimate of
 * greybody past the point where it makes a check solve, doubling the work).
 */
export const ACCEPT_LONG_RANGE = 2;
/** The rounding floor of ∫Y over a step, in units of ε·|Y|·(step length in u): collocation and quadrature over 16 nodes (common practice, no source). */
const ROUNDING = 16;
/**
 * The rounding of ∫Y over a step charged to its error estimate, in the units
 * of ROUNDING: each node value of Y carries a few ε of rounding from W = √Z
 * and the polynomial coefficients, and the quadrature adds them with positive
 * weights (common practice, no source; ROUNDING, the threshold of the
 * convergence test, keeps its wider margin).
 */
const ROUNDING_ERROR = 4;
/** A step is refused when the two highest Chebyshev coefficients of Y (what 16 nodes leave unresolved) exceed this share of the tolerance. */
const TAIL = 0.3;

function shifted(p: Float64Array, shift: number, length: number): Float64Array {
  // Coefficients of p(x + shift): re-expand about the new origin (Taylor shift).
  const out = new Float64Array(length);
  const c = Array.from(p);
  for (let k = 0; k < length && k < c.length; k++) {
    // out[k] = Σ_{j≥k} C(j,k) c_j shift^{j−k}
    let sum = 0;
    let binom = 1;
    let pw = 1;
    for (let j = k; j < c.length; j++) {
      sum += binom * c[j] * pw;
      binom = (binom * (j + 1)) / (j + 1 - k);
      pw *= shift;
    }
    out[k] = sum;
  }
  return out;
}

/** The coefficients of an unsubstituted (or substituted) radial equation about r+, for Riccati steps in x = r − r+. */
export function riccatiEquation(eq: RadialEquation, rPlus: number): RiccatiEquation {
  const shift = rPlus - eq.center;
  // About r+ already: the equation's own coefficients (never modified once built), unpadded; Horner's rule over
  // them gives the same doubles as over zero-padded copies (leading zeros add exact zeros for finite x > 0).
  const take = (p: Float64Array, n: number) => {
    if (shift !== 0) return shifted(p, shift, n);
    return p.length > n ? p.subarray(0, n) : p;
  };
  return {
    delta: take(eq.delta.re, 3),
    bRe: take(eq.B.re, 5),
    bIm: take(eq.B.im, 5),
    cRe: take(eq.C.re, 5),
    cIm: take(eq.C.im, 5),
    // set by the one caller that uses it (a massive far zone, hybridLeg.ts): no check on massless legs
    real: false,
  };
}

/** v, v', v'' of the real polynomial Σ c_k x^k at x, into out[o..o+2]. */
function jet(c: Float64Array, x: number, out: Float64Array, o: number): void {
  let v = 0,
    d1 = 0,
    d2 = 0;
  for (let k = c.length - 1; k >= 0; k--) {
    d2 = d2 * x + d1;
    d1 = d1 * x + v;
    v = v * x + c[k];
  }
  out[o] = v;
  out[o + 1] = d1;
  out[o + 2] = 2 * d2;
}

/** Layout of `localRiccati`'s output (Float64Array(LOCAL_SIZE)). */
export const LOCAL = {
  /** P = xp − 1 (re, im) */
  P: 0,
  /** Q = x²q */
  Q: 2,
  /** W = √(P² − 4Q) (principal root, or its negative when flipped) */
  W: 4,
  /** per σ = +1 (offset 6) and −1 (offset 12): Y₁ (re, im), Y₁' and δ₂ */
  PLUS: 6,
  /** as PLUS for σ = −1 */
  MINUS: 12,
  /** the WKB ratio |Y₀'|/|W|² (the larger over σ) */
  RATIO: 18,
} as const;

/** Length of `localRiccati`'s output. */
export const LOCAL_SIZE = 19;

const scratch = new Float64Array(9);

/**
 * The Riccati data of `e` at x, in u = ln x: with Y = x y, the Riccati
 * equation becomes Y_u + Y² + P Y + Q = 0, P = xp − 1, Q = x²q, where
 * p = B/A, q = C/A (the pole of p and q at the horizon disappears, so a rung
 * [x, 2x] is resolved by few nodes). Written into `out` (layout LOCAL): P, Q,
 * W = √(P² − 4Q) and, for each sign σ of W, the second WKB iterate written
 * analytically (docs/method.md, section 9):
 *   Y₀ = (σW − P)/2 (a root of Y² + PY + Q), δ₁ = −Y₀'/(σW),
 *   Y₁ = Y₀ + δ₁ with its exact derivative, δ₂ = −(δ₁' + δ₁²)/(σW + 2δ₁),
 * the derivatives coming from those of the polynomial coefficients, so that
 * no collocation derivative touches the large part of Y. `flip` takes the
 * other root W (to continue a branch). `mirror` (a massive far zone) writes
 * the σ = −1 iterate as the conjugate of the σ = +1 one where P is real and
 * W imaginary: the same doubles (every operation is conjugation-symmetric;
 * checked bit for bit at 185,000 points of 300 random massive modes), at
 * about two thirds of the cost. Allocates nothing.
 */
export function localRiccati(e: RiccatiEquation, x: number, out: Float64Array, flip = false, mirror = false): void {
  at[0] = x;
  localAt(e, out, flip, mirror);
}

/** The point x of `localAt`, passed in an array: a number argument of a call not inlined is boxed (a heap number per node). */
const at = new Float64Array(1);

/**
 * `localRiccati` at x = at[0]: the five jets in one Horner loop (five
 * independent chains, no stores between them; a polynomial shorter than the
 * longest reads zeros above its degree, and Horner's rule over leading zeros
 * leaves v, v', v'' at +0 until its first coefficient, 0·x + 0 = +0 for
 * finite x > 0: the same doubles as over its own length), and 1/g, 1/g²
 * shared by σ = ±1 (the same doubles: g changes sign, g² not).
 */
function localAt(e: RiccatiEquation, out: Float64Array, flip: boolean, mirror: boolean): void {
  const x = at[0];
  const { delta, bRe, bIm, cRe, cIm } = e;
  const nd = delta.length,
    nbr = bRe.length,
    nbi = bIm.length,
    ncr = cRe.length,
    nci = cIm.length;
  const width = Math.max(nd, nbr, nbi, ncr, nci);
  // v, v', v''/2 of Δ (d), Re B (b), Im B (c), Re C (f), Im C (g), as `jet`
  let dv = 0,
    d1 = 0,
    d2 = 0,
    bv = 0,
    b1 = 0,
    b2 = 0,
    cv = 0,
    c1 = 0,
    c2 = 0,
    fv = 0,
    f1 = 0,
    f2 = 0,
    gv = 0,
    g1 = 0,
    g2 = 0;
  for (let k = width - 1; k >= 0; k--) {
    d2 = d2 * x + d1;
    d1 = d1 * x + dv;
    dv = dv * x + (k < nd ? delta[k] : 0);
    b2 = b2 * x + b1;
    b1 = b1 * x + bv;
    bv = bv * x + (k < nbr ? bRe[k] : 0);
    c2 = c2 * x + c1;
    c1 = c1 * x + cv;
    cv = cv * x + (k < nbi ? bIm[k] : 0);
    f2 = f2 * x + f1;
    f1 = f1 * x + fv;
    fv = fv * x + (k < ncr ? cRe[k] : 0);
    g2 = g2 * x + g1;
    g1 = g1 * x + gv;
    gv = gv * x + (k < nci ? cIm[k] : 0);
  }
  const dd2 = 2 * d2;
  const a0 = dv * dv,
    a1 = 2 * dv * d1,
    a2 = 2 * d1 * d1 + 2 * dv * dd2;
  // p, p', p'' and q, q', q'' (x-derivatives) of B/A and C/A
  const pr = bv / a0,
    pi = cv / a0;
  const pr1 = (b1 - pr * a1) / a0,
    pi1 = (c1 - pi * a1) / a0;
  const pr2 = (2 * b2 - 2 * pr1 * a1 - pr * a2) / a0,
    pi2 = (2 * c2 - 2 * pi1 * a1 - pi * a2) / a0;
  const qr = fv / a0,
    qi = gv / a0;
  const qr1 = (f1 - qr * a1) / a0,
    qi1 = (g1 - qi * a1) / a0;
  const qr2 = (2 * f2 - 2 * qr1 * a1 - qr * a2) / a0,
    qi2 = (2 * g2 - 2 * qi1 * a1 - qi * a2) / a0;
  // to u = ln x: P = xp − 1, Q = x²q, d/du = x d/dx
  const x2 = x * x,
    x3 = x2 * x,
    x4 = x3 * x;
  const Pr = x * pr - 1,
    Pi = x * pi;
  const Pr1 = x * pr + x2 * pr1,
    Pi1 = x * pi + x2 * pi1;
  const Pr2 = x * pr + 3 * x2 * pr1 + x3 * pr2,
    Pi2 = x * pi + 3 * x2 * pi1 + x3 * pi2;
  const Qr = x2 * qr,
    Qi = x2 * qi;
  const Qr1 = 2 * x2 * qr + x3 * qr1,
    Qi1 = 2 * x2 * qi + x3 * qi1;
  const Qr2 = 4 * x2 * qr + 5 * x3 * qr1 + x4 * qr2,
    Qi2 = 4 * x2 * qi + 5 * x3 * qi1 + x4 * qi2;
  // Z = P² − 4Q and its derivatives; W = √Z, W' = Z'/(2W), W'' = (Z'' − 2W'²)/(2W)
  const Zr = Pr * Pr - Pi * Pi - 4 * Qr,
    Zi = 2 * Pr * Pi - 4 * Qi;
  const Zr1 = 2 * (Pr * Pr1 - Pi * Pi1) - 4 * Qr1,
    Zi1 = 2 * (Pr * Pi1 + Pi * Pr1) - 4 * Qi1;
  const Zr2 = 2 * (Pr1 * Pr1 - Pi1 * Pi1 + Pr * Pr2 - Pi * Pi2) - 4 * Qr2,
    Zi2 = 2 * (2 * Pr1 * Pi1 + Pr * Pi2 + Pi * Pr2) - 4 * Qi2;
  const mod = Math.sqrt(Zr * Zr + Zi * Zi);
  let Wr = Math.sqrt(0.5 * (mod + Zr)),
    Wi = Math.sqrt(Math.max(0.5 * (mod - Zr), 0)) * (Zi < 0 ? -1 : 1);
  if (flip) {
    Wr = -Wr;
    Wi = -Wi;
  }
  const ww = Wr * Wr + Wi * Wi;
  // 1/(2W)
  const hr = (0.5 * Wr) / ww,
    hi = (-0.5 * Wi) / ww;
  const W1r = Zr1 * hr - Zi1 * hi,
    W1i = Zr1 * hi + Zi1 * hr;
  const tr = Zr2 - 2 * (W1r * W1r - W1i * W1i),
    ti = Zi2 - 4 * W1r * W1i;
  const W2r = tr * hr - ti * hi,
    W2i = tr * hi + ti * hr;
  out[0] = Pr;
  out[1] = Pi;
  out[2] = Qr;
  out[3] = Qi;
  out[4] = Wr;
  out[5] = Wi;
  let ratio = 0;
  // P, P', P'' real and W, W', W'' imaginary (real coefficients, oscillating solutions): every operation below
  // maps σ = +1 to σ = −1 by conjugation, so with `mirror` the second is written as the first's conjugate
  const pair = mirror && Pi === 0 && Pi1 === 0 && Pi2 === 0 && Wr === 0 && W1r === 0 && W2r === 0;
  // 1/W and 1/W² once: for σ = −1, 1/g is the negation (exact) and 1/g² the same
  const iwr = Wr / ww,
    iwi = -Wi / ww;
  const ig2r = iwr * iwr - iwi * iwi,
    ig2i = 2 * iwr * iwi;
  for (let k = 0; k < (pair ? 1 : 2); k++) {
    const sg = k === 0 ? 1 : -1;
    const gr = sg * Wr,
      gi = sg * Wi,
      g1r = sg * W1r,
      g1i = sg * W1i,
      g2r = sg * W2r,
      g2i = sg * W2i;
    const y0r = 0.5 * (gr - Pr),
      y0i = 0.5 * (gi - Pi);
    const y01r = 0.5 * (g1r - Pr1),
      y01i = 0.5 * (g1i - Pi1);
    const y02r = 0.5 * (g2r - Pr2),
      y02i = 0.5 * (g2i - Pi2);
    // 1/g = conj(g)/|g|²
    const igr = sg * iwr,
      igi = sg * iwi;
    // δ₁ = −Y₀'/g
    const d1r = -(y01r * igr - y01i * igi),
      d1i = -(y01r * igi + y01i * igr);
    // δ₁' = (Y₀' g' − Y₀'' g)/g²
    const nr = y01r * g1r - y01i * g1i - (y02r * gr - y02i * gi),
      ni = y01r * g1i + y01i * g1r - (y02r * gi + y02i * gr);
    const d11r = nr * ig2r - ni * ig2i,
      d11i = nr * ig2i + ni * ig2r;
    // δ₂ = −(δ₁' + δ₁²)/(g + 2δ₁)
    const rr = d11r + d1r * d1r - d1i * d1i,
      ri = d11i + 2 * d1r * d1i;
    const er = gr + 2 * d1r,
      ei = gi + 2 * d1i;
    const ee = er * er + ei * ei;
    const o = k === 0 ? 6 : 12;
    out[o] = y0r + d1r;
    out[o + 1] = y0i + d1i;
    out[o + 2] = y01r + d11r;
    out[o + 3] = y01i + d11i;
    out[o + 4] = -(rr * er + ri * ei) / ee;
    out[o + 5] = -(ri * er - rr * ei) / ee;
    ratio = Math.max(ratio, Math.sqrt(y01r * y01r + y01i * y01i) / ww);
  }
  if (pair) {
    for (let i = 6; i < 12; i += 2) {
      out[i + 6] = out[i];
      out[i + 7] = -out[i + 1];
    }
  }
  out[LOCAL.RATIO] = ratio;
}

/**
 * `localRiccati` with `mirror` where B and C are real (`e.real`) and the
 * solutions oscillate (Z = P² − 4Q < 0, so W = ±i√−Z): every term the
 * general code multiplies by a zero imaginary (or real) part is left out,
 * and the σ = −1 iterate is the conjugate of the σ = +1 one. The same
 * doubles up to the sign of zeros and the last bit of W (√−Z for √(|Z|−Z)/2)
 * at about half the cost (the coefficients of a massive field's far zone,
 * 16 per Riccati step). Returns false, `out` untouched, where Z ≥ 0.
 */
export function localRiccatiReal(e: RiccatiEquation, x: number, out: Float64Array, flip = false): boolean {
  at[0] = x;
  return localRealAt(e, out, flip);
}

/** `localRiccatiReal` at x = at[0] (see `at`). */
function localRealAt(e: RiccatiEquation, out: Float64Array, flip: boolean): boolean {
  const x = at[0];
  const j = scratch;
  jet(e.delta, x, j, 0);
  const a0 = j[0] * j[0],
    a1 = 2 * j[0] * j[1],
    a2 = 2 * j[1] * j[1] + 2 * j[0] * j[2];
  jet(e.bRe, x, j, 3);
  const pr = j[3] / a0;
  const pr1 = (j[4] - pr * a1) / a0;
  const pr2 = (j[5] - 2 * pr1 * a1 - pr * a2) / a0;
  jet(e.cRe, x, j, 6);
  const qr = j[6] / a0;
  const qr1 = (j[7] - qr * a1) / a0;
  const qr2 = (j[8] - 2 * qr1 * a1 - qr * a2) / a0;
  const x2 = x * x,
    x3 = x2 * x,
    x4 = x3 * x;
  const Pr = x * pr - 1;
  const Pr1 = x * pr + x2 * pr1;
  const Pr2 = x * pr + 3 * x2 * pr1 + x3 * pr2;
  const Qr = x2 * qr;
  const Qr1 = 2 * x2 * qr + x3 * qr1;
  const Qr2 = 4 * x2 * qr + 5 * x3 * qr1 + x4 * qr2;
  const Zr = Pr * Pr - 4 * Qr;
  if (!(Zr < 0)) return false;
  const Zr1 = 2 * (Pr * Pr1) - 4 * Qr1;
  const Zr2 = 2 * (Pr1 * Pr1 + Pr * Pr2) - 4 * Qr2;
  // W = i Wi, W' = i W1i, W'' = i W2i
  const Wi = flip ? -Math.sqrt(-Zr) : Math.sqrt(-Zr);
  const ww = Wi * Wi;
  const hi = (-0.5 * Wi) / ww;
  const W1i = Zr1 * hi;
  const W2i = (Zr2 + 2 * (W1i * W1i)) * hi;
  out[0] = Pr;
  out[1] = 0;
  out[2] = Qr;
  out[3] = 0;
  out[4] = 0;
  out[5] = Wi;
  // σ = +1: g = i Wi, Y₀ = (g − P)/2 and its derivatives
  const y0r = -0.5 * Pr,
    y0i = 0.5 * Wi;
  const y01r = -0.5 * Pr1,
    y01i = 0.5 * W1i;
  const y02r = -0.5 * Pr2,
    y02i = 0.5 * W2i;
  // 1/g = −i/Wi
  const igi = -Wi / ww;
  // δ₁ = −Y₀'/g
  const d1r = y01i * igi,
    d1i = -(y01r * igi);
  // δ₁' = (Y₀' g' − Y₀'' g)/g², 1/g² = −1/Wi²
  const nr = y02i * Wi - y01i * W1i,
    ni = y01r * W1i - y02r * Wi;
  const ig2r = -(igi * igi);
  const d11r = nr * ig2r,
    d11i = ni * ig2r;
  // δ₂ = −(δ₁' + δ₁²)/(g + 2δ₁)
  const rr = d11r + d1r * d1r - d1i * d1i,
    ri = d11i + 2 * d1r * d1i;
  const er = 2 * d1r,
    ei = Wi + 2 * d1i;
  const ee = er * er + ei * ei;
  const cr = -(rr * er + ri * ei) / ee,
    ci = -(ri * er - rr * ei) / ee;
  out[6] = y0r + d1r;
  out[7] = y0i + d1i;
  out[8] = y01r + d11r;
  out[9] = y01i + d11i;
  out[10] = cr;
  out[11] = ci;
  out[12] = out[6];
  out[13] = -out[7];
  out[14] = out[8];
  out[15] = -out[9];
  out[16] = cr;
  out[17] = -ci;
  out[LOCAL.RATIO] = Math.sqrt(y01r * y01r + y01i * y01i) / ww;
  return true;
}

function horner(c: Float64Array, x: number): number {
  let v = 0;
  for (let k = c.length - 1; k >= 0; k--) v = v * x + c[k];
  return v;
}

/** x |√(p² − 4q)| at x, ≈ |W| where the Riccati step applies: the local rate (radians or e-folds per unit of ln x) of the two solutions; allocates nothing. */
export function phaseRate(e: RiccatiEquation, x: number): number {
  const d = horner(e.delta, x);
  const iA = 1 / (d * d);
  const pr = horner(e.bRe, x) * iA,
    pi = horner(e.bIm, x) * iA;
  const qr = horner(e.cRe, x) * iA,
    qi = horner(e.cIm, x) * iA;
  return x * Math.sqrt(Math.sqrt((pr * pr - pi * pi - 4 * qr) ** 2 + (2 * pr * pi - 4 * qi) ** 2));
}

/** Result of one Riccati step. */
export interface RiccatiStep {
  /** whether both Riccati solutions converged and are resolved on the interval */
  ok: boolean;
  /** defect-correction passes taken (the more of the two solutions) */
  passes: number;
  /** coefficient evaluations made (nodes × 1, for the work count) */
  evaluations: number;
  /** the larger last correction (of ∫Y or, relative, of Y) of the two solutions where one stalled, in units of tol; 0 when both contracted below the target or the step failed */
  correction: number;
  /**
   * the step's own estimate of its truncation error, relative to the state,
   * in units of tol (0 when the step failed): over both solutions (they add,
   * as R = α e^{∫Y+} + β e^{∫Y−} carries both errors), what the last
   * correction leaves (itself, or the next one predicted from the
   * contraction) and the unresolved Chebyshev tail of Y (in ∫Y beyond the
   * rounding floor, and relative in Y)
   */
  error: number;
  /** the rounding of ∫Y over the step (ROUNDING_ERROR ε |Y| × length, both solutions), relative, in units of tol; 0 when the step failed */
  rounding: number;
}

/** Work arrays of one node count, reused across steps. */
interface Work {
  rule: ChebyshevRule;
  pRe: Float64Array;
  pIm: Float64Array;
  qRe: Float64Array;
  qIm: Float64Array;
  /** per σ (offset 0 for +, n for −): y₁, y₁' and the running correction c (y = y₁ + c) */
  aRe: Float64Array;
  aIm: Float64Array;
  apRe: Float64Array;
  apIm: Float64Array;
  cRe: Float64Array;
  cIm: Float64Array;
  yRe: Float64Array;
  yIm: Float64Array;
  dRe: Float64Array;
  dIm: Float64Array;
  /** per solution (+, −): y at xa and xb, ∫y over [xa, xb] */
  ends: Float64Array;
  /** per solution (+, −): the last correction of a stalled solution, in units of tol (0 if it contracted below the target) */
  last: Float64Array;
  /** per solution (+, −): the truncation error estimate of ∫y and y (what the last correction leaves + unresolved tail) */
  error: Float64Array;
  /** per solution (+, −): the rounding of ∫y */
  rounding: Float64Array;
  /** one point's `localRiccati` output */
  local: Float64Array;
}

const works = new Map<number, Work>();

function workFor(n: number): Work {
  let w = works.get(n);
  if (!w) {
    const f = () => new Float64Array(n);
    const f2 = () => new Float64Array(2 * n);
    w = {
      rule: chebyshevRule(n),
      pRe: f(),
      pIm: f(),
      qRe: f(),
      qIm: f(),
      aRe: f2(),
      aIm: f2(),
      apRe: f2(),
      apIm: f2(),
      cRe: f2(),
      cIm: f2(),
      yRe: f(),
      yIm: f(),
      dRe: f(),
      dIm: f(),
      ends: new Float64Array(12),
      last: new Float64Array(2),
      error: new Float64Array(2),
      rounding: new Float64Array(2),
      local: new Float64Array(LOCAL_SIZE),
    };
    works.set(n, w);
  }
  return w;
}

/**
 * Refine one Riccati solution (σ = +1: k = 0, σ = −1: k = 1) on the nodes,
 * y = y₁ + c with y₁' exact and c' by collocation; on success writes y(xa),
 * y(xb) and ∫y into w.ends at offset 6k. `tol` bounds the error of ∫y over
 * the interval and the relative error of y. Returns the passes taken,
 * negative on failure.
 */
function refine(w: Work, k: 0 | 1, half: number, tol: number, maxPasses: number, accept: number, newton = false): number {
  const { rule, pRe, pIm, qRe, qIm, aRe, aIm, apRe, apIm, cRe, cIm, yRe, yIm, dRe, dIm } = w;
  const n = rule.n;
  const o = k * n;
  const inv = 1 / half;
  // max |y| as the root of max |y|² (the same double: a correctly rounded root is monotonic)
  let yScale2 = 0;
  for (let j = 0; j < n; j++) {
    const yr = aRe[o + j] + cRe[o + j],
      yi = aIm[o + j] + cIm[o + j];
    yRe[j] = yr;
    yIm[j] = yi;
    yScale2 = Math.max(yScale2, yr * yr + yi * yi);
  }
  const yScale = Math.sqrt(yScale2);
  const floor = ROUNDING * Number.EPSILON * 2 * half * yScale;
  let previous = Number.POSITIVE_INFINITY;
  let passes = 0;
  let converged = false;
  // the last correction of a stalled solution, in units of tol (0 when it contracted below the target)
  let stalled = 0;
  // what the last correction leaves: its own size, or where convergence was declared on the contraction, the next one predicted
  let remaining = 0;
  const reach = accept > ACCEPT ? accept * tol : 0.01 * tol;
  let newtonPasses = false;
  let firstNewton = 0;
  const { alt, altT } = rule;
  // chebyshevTail of y after the last pass, where that pass was a defect correction (else −1)
  let yTail = -1;
  while (passes < maxPasses) {
    passes++;
    // c' on the nodes (y' = y₁' + c'/half, formed where it is used)
    chebyshevDerivative(rule, cRe, cIm, o, dRe, dIm);
    let largest = 0;
    // chebyshevTail's sums of the new y, formed in the defect pass (the same order, the same doubles)
    let tnr = 0,
      tni = 0,
      tmr = 0,
      tmi = 0;
    if (newtonPasses) {
      yTail = -1;
      for (let i = 0; i < n; i++) {
        dRe[i] = apRe[o + i] + dRe[i] * inv;
        dIm[i] = apIm[o + i] + dIm[i] * inv;
      }
      largest = newtonPass(w, o, inv, passes === firstNewton);
      if (!(largest >= 0)) return -passes;
    } else
      for (let j = 0; j < n; j++) {
        const yr = yRe[j],
          yi = yIm[j];
        const pr = pRe[j],
          pi = pIm[j];
        // residual y' + y² + p y + q
        const rr = apRe[o + j] + dRe[j] * inv + yr * yr - yi * yi + pr * yr - pi * yi + qRe[j];
        const ri = apIm[o + j] + dIm[j] * inv + 2 * yr * yi + pr * yi + pi * yr + qIm[j];
        const gr = 2 * yr + pr,
          gi = 2 * yi + pi;
        const gg = gr * gr + gi * gi;
        const cr = -(rr * gr + ri * gi) / gg,
          ci = -(ri * gr - rr * gi) / gg;
        cRe[o + j] += cr;
        cIm[o + j] += ci;
        // this pass's correction, kept (in place of y' at this node, read above) for the resolution check below
        dRe[j] = cr;
        dIm[j] = ci;
        const nyr = yr + cr,
          nyi = yi + ci;
        yRe[j] = nyr;
        yIm[j] = nyi;
        const f = alt[j],
          g = altT[j];
        tnr += f * nyr;
        tni += f * nyi;
        tmr += g * nyr;
        tmi += g * nyi;
        largest = Math.max(largest, cr * cr + ci * ci);
      }
    if (!newtonPasses) yTail = tailOf(tnr, tni, tmr, tmi, n - 1);
    // the correction's effect on ∫y (interval length 2·half) and on y itself
    largest = Math.sqrt(largest);
    // Measured against the tolerance beyond the rounding floor of ∫Y itself (a phase of |Y|·2·half radians is known to ε of it).
    const size = Math.max(2 * half * largest - floor, largest / yScale);
    // a massive far zone: a first correction this large marks a rung too near the turning point (see FIRST_LIMIT)
    if (newton && passes === 1 && largest > FIRST_LIMIT * yScale) return -passes;
    // Done when this correction, or the next one predicted from the contraction so far, is below the target.
    const next = passes > 1 ? (size * largest) / previous : size;
    const done = newton ? DONE_LONG_RANGE * tol : 0.01 * tol;
    if (size < done || (next < done && largest < 0.1 * previous)) {
      converged = true;
      remaining = Math.min(size, next);
      break;
    }
    // After the first Newton pass the next correction is forecast from δ² (newtonPass): when NEWTON_MARGIN times
    // it is below the target, the chord pass that would only confirm it is not taken.
    if (newtonPasses && passes === firstNewton) {
      const forecast = NEWTON_MARGIN * Math.max(2 * half * newtonAhead - floor, newtonAhead / yScale);
      if (forecast < done) {
        converged = true;
        remaining = forecast;
        break;
      }
    }
    // Not contracting any more: the rounding floor of the collocation derivative (accepted when below tol) or a turning point.
    if (passes > 1 && largest > 0.5 * previous && passes !== firstNewton) {
      if (newton && n <= NEWTON_MAX_NODES && !newtonPasses && size >= accept * tol) {
        newtonPasses = true;
        firstNewton = passes + 1;
        previous = largest;
        continue;
      }
      converged = size < accept * tol;
      stalled = size / tol;
      remaining = size;
      break;
    }
    // Contracting too slowly to arrive within MAX_PASSES: give the stretch to the integrator now.
    // (With a looser acceptance than ACCEPT, the target it must arrive at is that acceptance.)
    if (passes > 2 && !newtonPasses) {
      const toGo = Math.log(reach / size) / Math.log(largest / previous);
      if (passes + toGo > maxPasses) {
        if (!newton || n > NEWTON_MAX_NODES) break;
        newtonPasses = true;
        firstNewton = passes + 1;
      } else if (newton && n <= NEWTON_MAX_NODES && toGo > NEWTON_AFTER) {
        // a massive far zone: Newton passes now cost less than the defect passes still to come
        newtonPasses = true;
        firstNewton = passes + 1;
      }
    }
    // Y already unresolved on the nodes by more than the passes to come can change: refuse now (the final check
    // below would refuse it after them). They change the tail |a_N| + 2|a_{N−1}| (chebyshevTail, a norm) by at
    // most the sum of their own tails: (a) at most 6× the sum of the corrections (a change of δ at every node moves
    // the tail by at most 3δ, taken twice; the sum geometric at the last contraction; from the second pass on:
    // measured on the tail grid and 227 random modes up to l = 91, Mω = 30, a ≤ 0.9999, of 1,118 steps it refused,
    // all failed that check), and (b) on a massless leg, from the first pass on, CORRECTION_TAIL × the tail of this
    // pass's correction (kept in dRe, dIm above; see CORRECTION_TAIL).
    if (!newtonPasses && (passes > 1 || !newton)) {
      const tail = yTail;
      if (unresolved(tail, half, floor, tol, yScale)) {
        let allowance = passes > 1 ? 6 * ((largest * largest) / (previous - largest)) : Number.POSITIVE_INFINITY;
        if (!newton) allowance = Math.min(allowance, CORRECTION_TAIL * chebyshevTail(rule, dRe, dIm));
        if (unresolved(tail - allowance, half, floor, tol, yScale)) return -passes;
      }
    }
    previous = largest;
  }
  if (!converged) return -passes;
  w.last[k] = stalled;
  // Unresolved on the nodes? The interpolant's highest coefficients bound what collocation missed.
  const tail = yTail >= 0 ? yTail : chebyshevTail(rule, yRe, yIm);
  if (2 * half * tail - floor > TAIL * tol || tail > TAIL * tol * yScale) return -passes;
  w.rounding[k] = ROUNDING_ERROR * Number.EPSILON * 2 * half * yScale;
  w.error[k] = remaining + Math.max(2 * half * tail - floor, 0) + tail / yScale;
  let ir = 0,
    ii = 0;
  for (let j = 0; j < n; j++) {
    ir += rule.w[j] * yRe[j];
    ii += rule.w[j] * yIm[j];
  }
  const e = 6 * k;
  const last = n - 1; // t = −1 is xa, t = 1 (j = 0) is xb
  w.ends[e] = yRe[last];
  w.ends[e + 1] = yIm[last];
  w.ends[e + 2] = yRe[0];
  w.ends[e + 3] = yIm[0];
  w.ends[e + 4] = ir * half;
  w.ends[e + 5] = ii * half;
  return passes;
}

/**
 * With `newton`, the defect passes still to come (predicted from the
 * contraction so far) beyond which Newton passes take over. On the first
 * rungs of a massive far zone (|W| of 20–40) the contraction slows from ~0.1
 * to ~0.5 per pass, so the prediction falls short and 11–14 defect passes
 * were taken; with Newton passes once more than four remain, 5–6 (one
 * factorisation at 16 nodes costs about eight defect passes; such a rung
 * took 8.2–8.7 µs against 9.4–12.7 µs, measured on rungs of the worst modes
 * of bench/massive-cpu.bench.mjs; 6 left two of three as they were).
 */
const NEWTON_AFTER = 4;
/**
 * On a massless leg, the multiple of the Chebyshev tail of a pass's
 * correction taken as what the passes to come may still change of Y's tail
 * (refine's early refusal). The corrections are smooth: their tails are far
 * below their sizes, so the bound by their sizes (6× their geometric sum)
 * let unresolved steps run 3–4 passes before refusing them (s = 1, l = 100,
 * m = 50, a = 0.99, Mω = 1: the rungs r = 1.18–1.28 and 2.14–5.14 with Y's
 * tail 200–800 times the limit, unchanged by every pass, and r = 33–65 and
 * 129–257 "slow" at the third pass with the same tails). Measured on the
 * tail grid and 1,000 random modes (s ∈ {0, 1/2, 1, 2}, l ≤ 100, a ≤ 0.9999,
 * 0.05 ≤ Mω ≤ 30) at greybody tol 1e-6, 1e-8, 1e-10 and 1e-11: where a step
 * that succeeded had Y's tail above the limit after some pass, the passes
 * after it moved the tail by at most 4.8 times that pass's correction tail
 * (after the first pass, at most 3.3 times). No step is refused before its
 * first pass: that pass can remove most of the initial iterate's tail (to
 * 2e-5 of it; near the horizon of a = 0.99999 at Mω = 30 from 70 times the
 * limit to below it at tol 1e-8), and a refusal on the initial tail above
 * 1,000 times the limit would have refused 8 steps that succeeded at tol
 * 1e-10 and 100 at 1e-11 (above 10,000 times: 8 at 1e-11). With 10, Γ
 * came out the same to the last bit on all those modes and on 1,500 other
 * random ones (no refused step would have succeeded), and at tol 1e-8 the
 * passes of steps that failed fell from 9,515 to 4,491 (of 52,326 in all;
 * 1,032 of the 2,030 failures now at the first pass), the evaluation count
 * by 3.7 % (2.3, 3.1 and 1.5 % at 1e-6, 1e-10, 1e-11). A failed step now
 * costs mostly its coefficients (16 nodes, ~1.8 of its ~2.7 µs; four
 * passes took ~4.0 µs: the rung r = 2.14–5.14 of the mode above, one core).
 */
const CORRECTION_TAIL = 10;
/**
 * With `newton` (a massive far zone), the largest first correction, relative
 * to |Y|, of a solution worth refining: beyond it the step is refused at
 * once (the integrator, or the halves, take the rung). On 230 massive modes
 * (the 70 of bench/massive-cpu.bench.mjs and 160 more near threshold) no
 * accepted step's first correction exceeded 3.2e-4 of |Y|, while 9 of the 15
 * steps that failed (their tail unresolved after a Newton factorisation, at
 * |W| ≈ 10–16 on the rung's start) had 3.7e-4 to 2.2e-3.
 */
const FIRST_LIMIT = 4e-4;
/**
 * Margin on the forecast of the correction after a first Newton pass
 * (δ²/(2y + p) at every node, which leaves out the collocation derivative's
 * share of the Jacobian): measured on far rungs of the worst modes of
 * bench/massive-cpu.bench.mjs, the confirming pass's correction was 0.8–0.9
 * of the bare forecast wherever it stood above the rounding floor. Skipping
 * that pass took the 70 modes' worst massive/massless CPU ratio from 1.84 to
 * 1.80 (a = 0.752, l = 3, m = 1, Mω = 0.361, v = 0.042: 1.81 → 1.79 with two
 * Newton steps; a = 0.025, l = 4, m = 3: 1.82 → 1.78).
 */
const NEWTON_MARGIN = 10;
/** What the last factoring Newton pass forecasts for the next correction: max |δ|²/|2y + p| over the nodes. */
let newtonAhead = 0;
/** Most nodes a Newton pass takes (the size of its work arrays). */
const NEWTON_MAX_NODES = 64;
const newtonRe = new Float64Array(NEWTON_MAX_NODES * NEWTON_MAX_NODES),
  newtonIm = new Float64Array(NEWTON_MAX_NODES * NEWTON_MAX_NODES),
  newtonPivot = new Int32Array(NEWTON_MAX_NODES),
  rhsRe = new Float64Array(NEWTON_MAX_NODES),
  rhsIm = new Float64Array(NEWTON_MAX_NODES);

/**
 * One Newton (chord) pass of the collocated Riccati equation: with y on the
 * nodes (w.yRe, w.yIm) and its derivative (w.dRe, w.dIm), solve
 * J δ = −(y' + y² + p y + q), J = D/half + diag(2y + p), and add δ to y and
 * to the correction c at offset o. With `factor` J is built at the current y
 * and factored (Gaussian elimination, partial pivoting); later passes of the
 * same solution reuse the factors (y then moves by ~1e-7 of itself, so the
 * chord converges as fast as Newton at the cost of two triangular solves).
 * Where the defect correction (which drops δ') contracts too slowly, near a
 * complex turning point, this converges in one or two passes. Returns
 * max |δ|² (NaN for a singular J).
 */
function newtonPass(w: Work, o: number, inv: number, factor: boolean): number {
  const { rule, pRe, pIm, qRe, qIm, cRe, cIm, yRe, yIm, dRe, dIm } = w;
  const n = rule.n;
  const A = newtonRe,
    B = newtonIm,
    piv = newtonPivot;
  for (let i = 0; i < n; i++) {
    const yr = yRe[i],
      yi = yIm[i];
    rhsRe[i] = -(dRe[i] + yr * yr - yi * yi + pRe[i] * yr - pIm[i] * yi + qRe[i]);
    rhsIm[i] = -(dIm[i] + 2 * yr * yi + pRe[i] * yi + pIm[i] * yr + qIm[i]);
  }
  if (factor) {
    const D = rule.D;
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        A[i * n + j] = D[i * n + j] * inv;
        B[i * n + j] = 0;
      }
      A[i * n + i] += 2 * yRe[i] + pRe[i];
      B[i * n + i] += 2 * yIm[i] + pIm[i];
    }
    for (let col = 0; col < n; col++) {
      let p = col,
        best = -1;
      for (let i = col; i < n; i++) {
        const m = A[i * n + col] ** 2 + B[i * n + col] ** 2;
        if (m > best) {
          best = m;
          p = i;
        }
      }
      if (!(best > 0)) return Number.NaN;
      piv[col] = p;
      // the trailing part only: each multiplier stays where the forward solve below applies it
      if (p !== col)
        for (let j = col; j < n; j++) {
          const a = col * n + j,
            b = p * n + j;
          const ta = A[a],
            tb = B[a];
          A[a] = A[b];
          B[a] = B[b];
          A[b] = ta;
          B[b] = tb;
        }
      // multipliers l = a / pivot, kept below the diagonal
      const prr = A[col * n + col] / best,
        pii = -B[col * n + col] / best;
      for (let i = col + 1; i < n; i++) {
        const ar = A[i * n + col],
          ai = B[i * n + col];
        const fr = ar * prr - ai * pii,
          fi = ar * pii + ai * prr;
        A[i * n + col] = fr;
        B[i * n + col] = fi;
        if (fr === 0 && fi === 0) continue;
        for (let j = col + 1; j < n; j++) {
          const xr = A[col * n + j],
            xi = B[col * n + j];
          A[i * n + j] -= fr * xr - fi * xi;
          B[i * n + j] -= fr * xi + fi * xr;
        }
      }
    }
  }
  // forward: the row swaps and the unit lower factor
  for (let col = 0; col < n; col++) {
    const p = piv[col];
    if (p !== col) {
      const tr = rhsRe[col],
        ti = rhsIm[col];
      rhsRe[col] = rhsRe[p];
      rhsIm[col] = rhsIm[p];
      rhsRe[p] = tr;
      rhsIm[p] = ti;
    }
    const br = rhsRe[col],
      bi = rhsIm[col];
    for (let i = col + 1; i < n; i++) {
      const fr = A[i * n + col],
        fi = B[i * n + col];
      rhsRe[i] -= fr * br - fi * bi;
      rhsIm[i] -= fr * bi + fi * br;
    }
  }
  // back: the upper factor
  let largest = 0,
    ahead = 0;
  for (let i = n - 1; i >= 0; i--) {
    let sr = rhsRe[i],
      si = rhsIm[i];
    for (let j = i + 1; j < n; j++) {
      const ar = A[i * n + j],
        ai = B[i * n + j];
      sr -= ar * rhsRe[j] - ai * rhsIm[j];
      si -= ar * rhsIm[j] + ai * rhsRe[j];
    }
    const dr = A[i * n + i],
      di = B[i * n + i],
      dd = dr * dr + di * di;
    const xr = (sr * dr + si * di) / dd,
      xi = (si * dr - sr * di) / dd;
    rhsRe[i] = xr;
    rhsIm[i] = xi;
    cRe[o + i] += xr;
    cIm[o + i] += xi;
    yRe[i] += xr;
    yIm[i] += xi;
    const d2 = xr * xr + xi * xi;
    largest = Math.max(largest, d2);
    if (factor) {
      // the residual left is δ² exactly (the equation is quadratic in y): its correction is about δ²/(2y + p)
      const gr = 2 * yRe[i] + pRe[i],
        gi = 2 * yIm[i] + pIm[i];
      ahead = Math.max(ahead, d2 / Math.sqrt(gr * gr + gi * gi));
    }
  }
  if (factor) newtonAhead = ahead;
  return Number.isFinite(largest) ? largest : Number.NaN;
}

/**
 * Whether a Chebyshev tail (chebyshevTail of Y on the nodes, less what the
 * passes to come may still change of it) fails `refine`'s resolution check.
 */
function unresolved(tail: number, half: number, floor: number, tol: number, yScale: number): boolean {
  return tail > 0 && (2 * half * tail - floor > TAIL * tol || tail > TAIL * tol * yScale);
}

/**
 * Whether the σ = −1 solution's data on the nodes are exactly the complex
 * conjugates of the σ = +1 solution's, with P and Q real: an equation with
 * real coefficients (s = 0, real ω) where the two solutions oscillate. Then
 * `refine` maps conjugate input to conjugate output operation by operation
 * (the collocation derivative and the quadrature weights are real), so the
 * second refinement is its mirror image, to the last bit.
 */
function conjugatePair(w: Work): boolean {
  const { pIm, qIm, aRe, aIm, apRe, apIm, cRe, cIm } = w;
  const n = w.rule.n;
  for (let j = 0; j < n; j++) {
    if (pIm[j] !== 0 || qIm[j] !== 0) return false;
    const o = n + j;
    if (aRe[o] !== aRe[j] || aIm[o] !== -aIm[j] || apRe[o] !== apRe[j] || apIm[o] !== -apIm[j]) return false;
    if (cRe[o] !== cRe[j] || cIm[o] !== -cIm[j]) return false;
  }
  return true;
}

/** The σ = −1 solution as the mirror image of the refined σ = +1 one (see `conjugatePair`); returns `refine`'s passes for it. */
function mirrorSolution(w: Work, passes: number): number {
  const E = w.ends;
  for (let i = 0; i < 6; i++) E[6 + i] = i % 2 === 0 ? E[i] : -E[i];
  w.last[1] = w.last[0];
  w.error[1] = w.error[0];
  w.rounding[1] = w.rounding[0];
  return passes;
}

/**
 * Share of the tolerance a decaying solution left at its local iterate may
 * cost the step (see `decayingNegligible`).
 */
const DECAYING_SHARE = 0.01;

/**
 * Where the solutions grow and decay (a classically forbidden zone) and the
 * state, carried in the direction of growth, holds the decaying solution
 * only as a negligible share, the σ = −1 solution need not be refined: its
 * local iterate Y₁ + δ₂ (`localRiccati`, already on the nodes) is written to
 * w.ends as it stands, when the error that iterate can bring into the step
 * stays below DECAYING_SHARE tol. That error is bounded with 2 max|δ₂| as
 * the iterate's own error on the nodes (the corrections still to come are a
 * WKB ratio, ≲ 0.012 on a massless rung, smaller than δ₂ each): through the
 * split of the state at xa (β moves by |β| 2|δ₂|/|y₋ − y₊|, and α with it)
 * and through β e^{I₋} itself at xb. In the oscillating zones |β/α| is of
 * order one and the test fails (the step is unchanged bit for bit); after a
 * forbidden rung of growth G, |β/α| ≈ e^{−2G}. Requires the σ = +1 solution
 * refined (w.ends at offset 0). Returns true (w.ends, w.last, w.error,
 * w.rounding at σ = −1 written) where it applies. Measured on the tail grid
 * and 400 random modes (l < 100, Mω < 30, a < 0.9999): at tol 1e-8, Γ the
 * same doubles in 605 of 608 modes and within 1.3e-13 (2e-3 of its estimate)
 * in the rest; at tol 1e-11 within 0.13 of the estimate; it applies on 5–7 of
 * the 11 Riccati steps of s = 0–2, l = 100, m = 50, a = 0.99, Mω = 1, whose
 * σ = −1 refinement was 4–6 passes each.
 */
function decayingNegligible(w: Work, half: number, xa: number, y: Float64Array, tol: number): boolean {
  const { rule, aRe, aIm, cRe, cIm } = w;
  const n = rule.n;
  let ir = 0,
    ii = 0,
    delta = 0;
  for (let j = 0; j < n; j++) {
    const yr = aRe[n + j] + cRe[n + j],
      yi = aIm[n + j] + cIm[n + j];
    ir += rule.w[j] * yr;
    ii += rule.w[j] * yi;
    delta = Math.max(delta, cRe[n + j] * cRe[n + j] + cIm[n + j] * cIm[n + j]);
  }
  // the iterate's error on the nodes (absolute, in Y = x y)
  const err = 2 * Math.sqrt(delta);
  const E = w.ends;
  // y = Y/x at xa of both solutions, and the split R = α + β, R' = α y₊ + β y₋ there
  const ypr = E[0] / xa,
    ypi = E[1] / xa,
    ymr = (aRe[2 * n - 1] + cRe[2 * n - 1]) / xa,
    ymi = (aIm[2 * n - 1] + cIm[2 * n - 1]) / xa;
  const gr = ymr - ypr,
    gi = ymi - ypi;
  const g2 = gr * gr + gi * gi;
  // the state over its size (the split is linear in it; square roots rather than Math.hypot, measured to allocate)
  const sc = 1 / Math.max(Math.abs(y[0]), Math.abs(y[1]), Number.MIN_VALUE);
  const Rr = y[0] * sc,
    Ri = y[1] * sc;
  const nr = y[2] * sc - (ypr * Rr - ypi * Ri),
    ni = y[3] * sc - (ypr * Ri + ypi * Rr);
  const br = (nr * gr + ni * gi) / g2,
    bi = (ni * gr - nr * gi) / g2;
  const beta = Math.sqrt(br * br + bi * bi);
  const alpha = Math.sqrt((Rr - br) ** 2 + (Ri - bi) ** 2);
  const g = Math.sqrt(g2);
  if (!(alpha > 0 && beta < alpha)) return false;
  const ratio = beta / alpha;
  // the split: β (and α) move by |β| err/(x|y₋ − y₊|), carried by e^{I₊} (against |α e^{I₊}|) and by e^{I₋}
  const growth = E[4] - ir * half;
  if (!(growth > 0)) return false;
  const split = (ratio * err) / (xa * g);
  // β e^{I₋} against α e^{I₊}, and the iterate's error in it: in R through ∫Y₋, in R' through ∫Y₋ and Y₋(xb)
  // (R' ≈ α e^{I₊} y₊ there)
  const share = ratio * Math.exp(-growth);
  const mr = aRe[n] + cRe[n],
    mi = aIm[n] + cIm[n];
  const plusB = Math.sqrt(E[2] * E[2] + E[3] * E[3]),
    minusB = Math.sqrt(mr * mr + mi * mi);
  const own = share * (2 * half * err * (1 + minusB / plusB) + err / plusB);
  const bound = split * (1 + Math.exp(-growth)) + own;
  if (!(bound < DECAYING_SHARE * tol)) return false;
  E[6] = aRe[2 * n - 1] + cRe[2 * n - 1];
  E[7] = aIm[2 * n - 1] + cIm[2 * n - 1];
  E[8] = aRe[n] + cRe[n];
  E[9] = aIm[n] + cIm[n];
  E[10] = ir * half;
  E[11] = ii * half;
  w.last[1] = 0;
  w.error[1] = bound;
  w.rounding[1] = 0;
  return true;
}

/**
 * Carry y = (Re R, Im R, Re R', Im R') from xa to xb in place, if both
 * Riccati solutions converge there to `tol` within `maxPasses` passes each
 * (a stalled correction accepted up to `accept` tol).
 * Returns the ln of a scale taken out of y (added to the caller's log-scale)
 * in `scaleOut[0]`. A massive field's far zone sets `mirror` (the σ = −1
 * solution taken as the conjugate of the σ = +1 one where their node data
 * are exact conjugates: `conjugatePair`) and `newton` (a solution whose
 * defect correction contracts too slowly or stalls above `accept` tol is
 * finished by Newton passes, `newtonPass`, rather than refused); both off,
 * the step is the massless one, bit for bit. A massless leg with real B
 * and C (s = 0 at real ω) sets `mirror` alone, with `e.real` unset: the
 * same doubles as without it (Γ and its reflection bit for bit on the tail
 * grid and 2,500 random modes, l ≤ 100, Mω ≤ 30, tol 1e-6 to 1e-11), one
 * refinement instead of two where the solutions oscillate (the 12 s = 0
 * modes of the tail grid at l = 75, 100 and Mω = 1, 10: CPU 0.94 times,
 * 0.89–1.00 per mode, interleaved). Measured on the 70 modes of
 * bench/massive-cpu.bench.mjs: with `newton` 6 % fewer evaluations over
 * all (up to 2.3× fewer on a mode: rungs the integrator crossed in ~20
 * steps), none more; on 150 other random near-threshold modes one more
 * (×1.09: a rung finished by Newton passes then refused as unresolved).
 */
export function riccatiStep(
  e: RiccatiEquation,
  xa: number,
  xb: number,
  y: Float64Array,
  tol: number,
  scaleOut: Float64Array,
  n = RICCATI_NODES,
  maxPasses = MAX_PASSES,
  accept = ACCEPT,
  mirror = false,
  newton = false,
): RiccatiStep {
  const w = workFor(n);
  const { rule, pRe, pIm, qRe, qIm, aRe, aIm, apRe, apIm, cRe, cIm } = w;
  // nodes in u = ln x (riccatiStep works with Y = x y in u; see localRiccati)
  const ua = Math.log(xa),
    ub = Math.log(xb);
  const mid = 0.5 * (ua + ub),
    half = 0.5 * (ub - ua);
  const l = w.local;
  // a massive field's far zone with real coefficients: the cheaper form where it applies (the same doubles, see localRiccatiReal)
  const real = mirror && e.real === true;
  let prevWr = 0,
    prevWi = 0;
  for (let j = 0; j < n; j++) {
    // x_j, passed in `at` (never as a number: a number argument would box it, a heap number per node)
    if (j === 0) at[0] = xb;
    else if (j === n - 1) at[0] = xa;
    else at[0] = Math.exp(mid + half * rule.t[j]);
    if (!(real && localRealAt(e, l, false))) localAt(e, l, false, mirror);
    // one continuous branch of W along the interval
    if (j > 0 && l[4] * prevWr + l[5] * prevWi < 0 && !(real && localRealAt(e, l, true))) localAt(e, l, true, mirror);
    prevWr = l[4];
    prevWi = l[5];
    pRe[j] = l[0];
    pIm[j] = l[1];
    qRe[j] = l[2];
    qIm[j] = l[3];
    aRe[j] = l[6];
    aIm[j] = l[7];
    apRe[j] = l[8];
    apIm[j] = l[9];
    cRe[j] = l[10];
    cIm[j] = l[11];
    const o = n + j;
    aRe[o] = l[12];
    aIm[o] = l[13];
    apRe[o] = l[14];
    apIm[o] = l[15];
    cRe[o] = l[16];
    cIm[o] = l[17];
  }
  const pair = mirror && conjugatePair(w);
  const plus = refine(w, 0, half, tol, maxPasses, accept, newton);
  if (plus < 0) return { ok: false, passes: -plus, evaluations: n, correction: 0, error: 0, rounding: 0 };
  const minus = pair
    ? mirrorSolution(w, plus)
    : !newton && decayingNegligible(w, half, xa, y, tol)
      ? plus
      : refine(w, 1, half, tol, maxPasses, accept, newton);
  if (minus < 0) return { ok: false, passes: Math.max(plus, -minus), evaluations: n, correction: 0, error: 0, rounding: 0 };
  const E = w.ends;
  // y = Y/x at the two ends
  for (let o = 0; o <= 6; o += 6) {
    E[o] /= xa;
    E[o + 1] /= xa;
    E[o + 2] /= xb;
    E[o + 3] /= xb;
  }
  // R = α e^{I+} + β e^{I−}: α + β = R, α y+ + β y− = R' at xa.
  const Rr = y[0],
    Ri = y[1],
    dr = y[2],
    di = y[3];
  const ypr = E[0],
    ypi = E[1],
    ymr = E[6],
    ymi = E[7];
  const nr = dr - (ypr * Rr - ypi * Ri),
    ni = di - (ypr * Ri + ypi * Rr);
  const gr = ymr - ypr,
    gi = ymi - ypi;
  const gg = gr * gr + gi * gi;
  const br = (nr * gr + ni * gi) / gg,
    bi = (ni * gr - nr * gi) / gg;
  const ar = Rr - br,
    ai = Ri - bi;
  // e^{I±}, with the larger growth taken out when it would overflow
  const grow = Math.max(E[4], E[10]);
  const shift = grow > 600 ? grow : 0;
  const ep = Math.exp(E[4] - shift),
    em = Math.exp(E[10] - shift);
  const epr = ep * Math.cos(E[5]),
    epi = ep * Math.sin(E[5]);
  const emr = em * Math.cos(E[11]),
    emi = em * Math.sin(E[11]);
  // A = α e^{I+}, B = β e^{I−}
  const Ar = ar * epr - ai * epi,
    Ai = ar * epi + ai * epr;
  const Br = br * emr - bi * emi,
    Bi = br * emi + bi * emr;
  const dRe = Ar * E[2] - Ai * E[3] + Br * E[8] - Bi * E[9],
    dIm = Ar * E[3] + Ai * E[2] + Br * E[9] + Bi * E[8];
  if (!Number.isFinite(Ar + Ai + Br + Bi + dRe + dIm))
    return { ok: false, passes: Math.max(plus, minus), evaluations: n, correction: 0, error: 0, rounding: 0 };
  y[0] = Ar + Br;
  y[1] = Ai + Bi;
  y[2] = dRe;
  y[3] = dIm;
  scaleOut[0] = shift;
  return {
    ok: true,
    passes: Math.max(plus, minus),
    evaluations: n,
    correction: Math.max(w.last[0], w.last[1]),
    error: (w.error[0] + w.error[1]) / tol,
    rounding: (w.rounding[0] + w.rounding[1]) / tol,
  };
}
