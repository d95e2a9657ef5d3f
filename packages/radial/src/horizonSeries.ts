/**
 * Frobenius series of the Teukolsky radial equation at the outer horizon for
 * the solution that is ingoing there:
 *
 *   R = x^ν Σ d_n x^n,  x = r − r+,  ν = −s − i k (2 M r+)/(r+ − r−),
 *
 * normalised so that R → Δ^{−s} e^{−ikr*} with the tortoise constant of
 * @penumbra/kerr. The series converges for x < r+ − r− (the next singular
 * point is r−); we sum it at a fraction of that radius.
 *
 * Where |Im ν| is large (near extremality) the sum is written as
 * R = x^ν (1 + x/b)^β Σ e_n x^n, b = r+ − r−, with β the indicial exponent at r−
 * whose imaginary part is nearest −Im ν: x^ν (1 + x/b)^β carries the fast phase
 * (x/(x + b))^{i Im ν} of the near-horizon throat, and the e_n no longer swell
 * like |ν|^n/n! before decaying (measured at s = −2, m = −2, a = 0.99999, Mω = 3,
 * |ν| ≈ 900: 23 terms and no cancellation at x = 0.75 b, where the plain series
 * overflows; it needed x ≤ 0.0026 b). Leaver's series for Kerr (Proc. R. Soc.
 * Lond. A 402, 285 (1985), from memory) factors the two horizons the same way.
 */
import type { KerrHole } from '@penumbra/kerr';
import { ConvergenceError } from '@penumbra/core';
import { radialEquation, type RadialEquation, type RadialMode } from './equation.js';

/** The horizon series summed at one point. */
export interface HorizonStart {
  /** x0 = r0 − r+ where the series was summed */
  x0: number;
  /** R(r0) as [re, im] */
  R: [number, number];
  /** R'(r0) as [re, im] */
  dR: [number, number];
  /** number of series terms used */
  terms: number;
  /** magnitude of the last term relative to the sum */
  truncation: number;
  /** indicial exponent ν */
  nu: [number, number];
}

const MAX_TERMS = 600;

/**
 * |Im ν| above which the series is factored by (1 + x/b)^β (see the header);
 * below it the plain series is summed as before (common practice, no source:
 * there its coefficients swell less than the default start fraction allows).
 */
const FACTOR_NU = 40;

/** Whether the horizon series of this mode is summed with the throat factor (1 + x/b)^β (see the header). */
export function factorsThroat(hole: KerrHole, mode: RadialMode): boolean {
  return Math.abs((horizonWavenumber(hole, mode) * 2 * hole.mass * hole.rPlus) / (hole.rPlus - hole.rMinus)) > FACTOR_NU;
}

/** Quotient of the real polynomial q (coefficients q[0..n)) by (x + b), into `out` (padded with zeros to its length). */
function quotientByXPlusB(q: Float64Array, n: number, b: number, out: Float64Array): Float64Array {
  const length = out.length;
  out.fill(0);
  let r = 0;
  for (let j = n - 1; j >= 1; j--) {
    r = q[j] - b * r;
    if (j - 1 < length) out[j - 1] = r;
  }
  return out;
}

/**
 * Scratch of the throat factor's coefficients (used within one call of horizonSeriesStart, which re-enters nothing:
 * new arrays per call were measured among a solve's allocations): Δ² and (s+1)ΔΔ' as lists, and their quotients.
 */
const throatA = new Float64Array(5),
  throatB = new Float64Array(4),
  throatAQ = new Float64Array(4),
  throatAQQ = new Float64Array(3),
  throatBQ = new Float64Array(3);

/** k = ω − mΩ_H */
export function horizonWavenumber(hole: KerrHole, mode: RadialMode): number {
  return mode.omega - mode.m * hole.omegaH;
}

/**
 * The coefficients d_n of the last series summed, with what they are the coefficients of (the equation object
 * and the mode's numbers): startAtHorizon's retries sum the same series at smaller x0. Measured per start (a new
 * ω each, −s field, tol 1e-11): s = 1, l = 100, a = 0.7, Mω = 1, where the start moves in six times, 8.7 → 5.0 µs;
 * a = 0.99 (throat factor, two retries) 3.4 → 2.7 µs; a start made at once unchanged (1.9–2.1 µs at l = 2).
 */
const known = {
  eq: undefined as RadialEquation | undefined,
  a: Number.NaN,
  mass: Number.NaN,
  s: Number.NaN,
  m: Number.NaN,
  omega: Number.NaN,
  lambda: Number.NaN,
  mu: Number.NaN,
  count: 0,
  re: new Float64Array(MAX_TERMS),
  im: new Float64Array(MAX_TERMS),
};

/**
 * R and R' of the ingoing horizon solution (normalised to Δ^{−s} e^{−ikr*}) at
 * r = r+ + x0, from its Frobenius series; `eq` is the mode's equation about r+
 * (built here if not given). Throws ConvergenceError where the series does
 * not converge, or with `quiet` returns undefined there (startAtHorizon's
 * retries: building the error's diagnostics cost ~17 µs a retry, more than
 * the failed sum, measured at l = 75, a = 0.99, Mω = 1).
 */
export function horizonSeriesStart(hole: KerrHole, mode: RadialMode, x0: number, eq?: RadialEquation): HorizonStart;
export function horizonSeriesStart(
  hole: KerrHole,
  mode: RadialMode,
  x0: number,
  eq: RadialEquation,
  quiet: true,
): HorizonStart | undefined;
export function horizonSeriesStart(
  hole: KerrHole,
  mode: RadialMode,
  x0: number,
  eq: RadialEquation = radialEquation(hole, mode, hole.rPlus),
  quiet = false,
): HorizonStart | undefined {
  const { rPlus, rMinus, mass: M } = hole;
  const s = mode.s;
  const b = rPlus - rMinus;
  const k = horizonWavenumber(hole, mode);
  const cPlus = (2 * M * rPlus) / b;
  const cMinus = (2 * M * rMinus) / b;
  // ν = −s − i k cPlus
  const nuRe = -s;
  const nuIm = -k * cPlus;

  // Δ² = A2 x² + A3 x³ + A4 x⁴, (s+1)ΔΔ' = B1 x + B2 x² + B3 x³ (both real) and U = Σ C_j x^j,
  // x = r − r+, from the one definition; the recurrence is unrolled over these.
  if (eq.center !== rPlus || eq.s !== s) throw new Error("horizonSeriesStart: the equation must be the mode's, about r+");
  // read in place (coefficients past a polynomial's degree are 0; padded copies were measured among a solve's allocations)
  const at = (q: Float64Array, j: number): number => (j < q.length ? q[j] : 0);
  const A2 = at(eq.A.re, 2),
    A3 = at(eq.A.re, 3),
    A4 = at(eq.A.re, 4);
  const B1 = at(eq.B.re, 1);
  let B2 = at(eq.B.re, 2),
    B3 = at(eq.B.re, 3);
  const C0r = at(eq.C.re, 0),
    C3r = at(eq.C.re, 3),
    C4r = at(eq.C.re, 4);
  let C1r = at(eq.C.re, 1),
    C2r = at(eq.C.re, 2);
  const C0i = at(eq.C.im, 0),
    C3i = at(eq.C.im, 3),
    C4i = at(eq.C.im, 4);
  let C1i = at(eq.C.im, 1),
    C2i = at(eq.C.im, 2);
  // imaginary parts of B's coefficients (nonzero only in the factored series)
  let B2i = 0,
    B3i = 0;
  // the exponent β of the factor (1 + x/b)^β (0: the plain series)
  let betaRe = 0,
    betaIm = 0;
  if (factorsThroat(hole, mode)) {
    // indicial equation at x = −b (Δ² ≈ b² y², (s+1)ΔΔ' ≈ (s+1) b² y, y = x + b):
    // μ² + s μ + U(−b)/b² = 0, U the coefficient C read at x = −b
    let uRe = 0,
      uIm = 0;
    for (let j = Math.max(eq.C.re.length, eq.C.im.length) - 1; j >= 0; j--) {
      uRe = uRe * -b + at(eq.C.re, j);
      uIm = uIm * -b + at(eq.C.im, j);
    }
    const a2m = A2 - 3 * b * A3 + 6 * b * b * A4;
    const b1m = B1 - 2 * b * B2 + 3 * b * b * B3;
    // a2m μ² + (b1m − a2m) μ + U(−b) = 0
    const pRe = (b1m - a2m) / a2m;
    const qRe = uRe / a2m,
      qIm = uIm / a2m;
    // discriminant p² − 4q and its square root
    const dRe = pRe * pRe - 4 * qRe,
      dIm = -4 * qIm;
    const dAbs = Math.hypot(dRe, dIm);
    const sqRe = Math.sqrt(0.5 * (dAbs + dRe));
    const sqIm = (dIm < 0 ? -1 : 1) * Math.sqrt(0.5 * (dAbs - dRe));
    // the root whose imaginary part is nearest −Im ν
    const sign = Math.abs(0.5 * sqIm + nuIm) < Math.abs(0.5 * sqIm - nuIm) ? 1 : -1;
    betaRe = 0.5 * (-pRe + sign * sqRe);
    betaIm = 0.5 * sign * sqIm;
    // R = (1 + x/b)^β G: G solves A G'' + B̃ G' + C̃ G = 0 with
    // B̃ = B + 2β A/(x+b), C̃ = C + β B/(x+b) + β(β−1) A/(x+b)² (A has the factor (x+b)², B the factor (x+b))
    throatA[0] = 0;
    throatA[1] = 0;
    throatA[2] = A2;
    throatA[3] = A3;
    throatA[4] = A4;
    throatB[0] = 0;
    throatB[1] = B1;
    throatB[2] = B2;
    throatB[3] = B3;
    const aQ = quotientByXPlusB(throatA, 5, b, throatAQ);
    const aQQ = quotientByXPlusB(aQ, 4, b, throatAQQ);
    const bQ = quotientByXPlusB(throatB, 4, b, throatBQ);
    const bbRe = betaRe * (betaRe - 1) - betaIm * betaIm,
      bbIm = betaIm * (2 * betaRe - 1);
    // B̃: the x² and x³ coefficients change (A/(x+b) starts at x²)
    B2 += 2 * betaRe * aQ[2];
    B2i = 2 * betaIm * aQ[2];
    B3 += 2 * betaRe * aQ[3];
    B3i = 2 * betaIm * aQ[3];
    // C̃: the x¹ and x² coefficients change (B/(x+b) starts at x¹, A/(x+b)² at x²)
    C1r += betaRe * bQ[1];
    C1i += betaIm * bQ[1];
    C2r += betaRe * bQ[2] + bbRe * aQQ[2];
    C2i += betaIm * bQ[2] + bbIm * aQQ[2];
  }

  // d_0: |d_0| = b^{−s}; phase from the additive constant of r*.
  const phaseConst = rPlus - cPlus * Math.log(2 * M) - cMinus * Math.log(b / (2 * M));
  const mag0 = Math.pow(b, -s);
  // The d_n do not depend on x0: those of the last series are kept, and a sum at another x0 of the same series
  // (startAtHorizon's retries) reads them rather than recomputing them.
  const d = known;
  if (
    d.eq !== eq ||
    d.a !== hole.a ||
    d.mass !== M ||
    d.s !== s ||
    d.m !== mode.m ||
    d.omega !== mode.omega ||
    d.lambda !== mode.lambda ||
    d.mu !== (mode.mu ?? 0)
  ) {
    d.eq = eq;
    d.a = hole.a;
    d.mass = M;
    d.s = s;
    d.m = mode.m;
    d.omega = mode.omega;
    d.lambda = mode.lambda;
    d.mu = mode.mu ?? 0;
    d.re[0] = mag0 * Math.cos(-k * phaseConst);
    d.im[0] = mag0 * Math.sin(-k * phaseConst);
    d.count = 1;
  }
  const dRe = d.re,
    dIm = d.im;

  // Partial sums S = Σ d_n x0^n and S' = Σ (n + ν) d_n x0^n.
  let sRe = dRe[0],
    sIm = dIm[0];
  let tRe = nuRe * sRe - nuIm * sIm;
  let tIm = nuRe * sIm + nuIm * sRe;
  let pw = 1;
  let small = 0;
  let n = 1;
  // squared magnitudes in the loop (Math.hypot per term was measured to cost more than the recurrence)
  let scaleMax2 = sRe * sRe + sIm * sIm;
  let truncation2 = 1;
  for (; n < MAX_TERMS; n++) {
    if (n >= d.count) {
      // numerator = −[ (A3 (μ1)(μ1−1) + B2 μ1 + C1) d_{n−1} + (A4 (μ2)(μ2−1) + B3 μ2 + C2) d_{n−2} + C3 d_{n−3} + C4 d_{n−4} ]
      let numRe = 0,
        numIm = 0;
      // j = 1 term (index n−1): μ1 = n − 1 + ν
      {
        const mr = n - 1 + nuRe,
          mi = nuIm;
        // μ(μ−1) = (mr + i mi)(mr − 1 + i mi)
        const pr = mr * (mr - 1) - mi * mi;
        const pi = mr * mi + mi * (mr - 1);
        const cr = A3 * pr + B2 * mr - B2i * mi + C1r;
        const ci = A3 * pi + B2 * mi + B2i * mr + C1i;
        numRe += cr * dRe[n - 1] - ci * dIm[n - 1];
        numIm += cr * dIm[n - 1] + ci * dRe[n - 1];
      }
      if (n >= 2) {
        const mr = n - 2 + nuRe,
          mi = nuIm;
        const pr = mr * (mr - 1) - mi * mi;
        const pi = mr * mi + mi * (mr - 1);
        const cr = A4 * pr + B3 * mr - B3i * mi + C2r;
        const ci = A4 * pi + B3 * mi + B3i * mr + C2i;
        numRe += cr * dRe[n - 2] - ci * dIm[n - 2];
        numIm += cr * dIm[n - 2] + ci * dRe[n - 2];
      }
      if (n >= 3) {
        numRe += C3r * dRe[n - 3] - C3i * dIm[n - 3];
        numIm += C3r * dIm[n - 3] + C3i * dRe[n - 3];
      }
      if (n >= 4) {
        numRe += C4r * dRe[n - 4] - C4i * dIm[n - 4];
        numIm += C4r * dIm[n - 4] + C4i * dRe[n - 4];
      }
      // F(n + ν) = A2 μ(μ−1) + B1 μ + C0, μ = n + ν
      const mr = n + nuRe,
        mi = nuIm;
      const fr = A2 * (mr * (mr - 1) - mi * mi) + B1 * mr + C0r;
      const fi = A2 * (mr * mi + mi * (mr - 1)) + B1 * mi + C0i;
      const den = fr * fr + fi * fi;
      // d_n = −num / F
      dRe[n] = -(numRe * fr + numIm * fi) / den;
      dIm[n] = -(numIm * fr - numRe * fi) / den;
      d.count = n + 1;
    }
    const mr = n + nuRe,
      mi = nuIm;
    pw *= x0;
    const termRe = dRe[n] * pw,
      termIm = dIm[n] * pw;
    sRe += termRe;
    sIm += termIm;
    tRe += mr * termRe - mi * termIm;
    tIm += mr * termIm + mi * termRe;
    const termMag2 = termRe * termRe + termIm * termIm;
    const sumMag2 = sRe * sRe + sIm * sIm;
    // Overflowed terms never come back (near extremality the coefficients swell
    // past the double range where the start is too wide): fail now, not after
    // MAX_TERMS, so that startAtHorizon's retries stay cheap.
    if (!(sumMag2 < Number.POSITIVE_INFINITY && termMag2 < Number.POSITIVE_INFINITY)) {
      truncation2 = Number.NaN;
      break;
    }
    scaleMax2 = Math.max(scaleMax2, termMag2);
    truncation2 = termMag2 / sumMag2;
    if (termMag2 <= 1e-34 * sumMag2) {
      if (++small >= 3) break;
    } else small = 0;
  }
  const truncation = Math.sqrt(truncation2);
  if (small < 3) {
    if (quiet) return undefined;
    throw new ConvergenceError('horizon series did not converge', {
      method: 'horizon Frobenius series',
      steps: n,
      rhsEvaluations: 0,
      errorEstimate: truncation,
      message: `the last of ${n} terms is ${truncation.toExponential(2)} of the sum at x0 = ${x0}`,
      x0,
      terms: n,
      truncation,
      b,
    });
  }
  // x0^ν = exp(ν ln x0)
  const lx = Math.log(x0);
  const mag = Math.exp(nuRe * lx);
  const ph = nuIm * lx;
  let xnRe = mag * Math.cos(ph),
    xnIm = mag * Math.sin(ph);
  if (betaRe !== 0 || betaIm !== 0) {
    // the factor (1 + x0/b)^β, and R'/R gains β/(b + x0): T += x0 β/(b + x0) S
    const lb = Math.log1p(x0 / b);
    const fm = Math.exp(betaRe * lb),
      fp = betaIm * lb;
    const fRe = fm * Math.cos(fp),
      fIm = fm * Math.sin(fp);
    const xr = xnRe * fRe - xnIm * fIm;
    xnIm = xnRe * fIm + xnIm * fRe;
    xnRe = xr;
    const w = x0 / (b + x0);
    const gRe = w * (betaRe * sRe - betaIm * sIm),
      gIm = w * (betaRe * sIm + betaIm * sRe);
    tRe += gRe;
    tIm += gIm;
  }
  const R: [number, number] = [xnRe * sRe - xnIm * sIm, xnRe * sIm + xnIm * sRe];
  const dR: [number, number] = [(xnRe * tRe - xnIm * tIm) / x0, (xnRe * tIm + xnIm * tRe) / x0];
  // Cancellation among terms costs accuracy: report it through truncation.
  const cancellation = Math.sqrt(scaleMax2) / Math.hypot(sRe, sIm);
  return { x0, R, dR, terms: n + 1, truncation: Math.max(truncation, cancellation * 1e-16), nu: [nuRe, nuIm] };
}
