/**
 * One solve of the massive Dirac radial pair: horizon series → ODE
 * integration in r → far-zone series, giving the incoming and outgoing
 * amplitudes A, B of P = A u_in + B u_out with u_in ≈ (1, −μ/(ω + k∞)) e^{−i(k∞r + η ln r)}
 * and u_out ≈ (−μ/(ω + k∞), 1) e^{+i(k∞r + η ln r)} (η = M(2ω² − μ²)/k∞),
 * the horizon solution normalised to |P₊| = 1, P₋ = 0 there.
 * Both solutions are of one size at both ends, so there is no shooting trap.
 */
import { ConvergenceError, type Diagnostics } from '@penumbra/core';
import { INTEGRATORS, makeStepper, type IntegratorName } from '../integrators.js';
import { type C, type V2, cabs, cdiv, cmul, csub } from './complex2.js';
import { type DiracRadialProblem, diracRhs } from './equation.js';
import { type DiracFarSeries, diracFarSeries, evaluateDiracFar, farMatrices } from './farSeries.js';
import { diracHorizonStart } from './horizonSeries.js';

/** Options of one massive Dirac radial solve. */
export interface DiracRadialOptions {
  /** local relative tolerance of the integrator */
  tol: number;
  integrator?: IntegratorName;
  /** start at r₊ + fraction·(r₊ − r₋) (default 0.1) */
  startFraction?: number;
  /** first matching radius tried (moved outward until the far series converges) */
  matchRadius?: number;
}

/** Diagnostics of one massive Dirac radial solve. */
export interface DiracRadialDiagnostics extends Diagnostics {
  startRadius: number;
  matchRadius: number;
  horizonTerms: number;
  farTerms: number;
  /** last far-series term relative to the sum, worst of the two series */
  farTruncation: number;
}

/** Amplitudes of one solve (logarithms: |A| can exceed the double range only for Γ < 1e-300). */
export interface DiracRadialSolution {
  /** ln |A|, incoming amplitude at infinity */
  logAbsIn: number;
  /** ln |B|, outgoing amplitude at infinity */
  logAbsOut: number;
  /** k∞ = √(ω² − μ²) */
  kInf: number;
  diagnostics: DiracRadialDiagnostics;
}

const FAR_TERMS = 50;
const FAR_ACCEPT = 1e-16;

let lastFar: { key: string; sIn: DiracFarSeries; sOut: DiracFarSeries } | null = null;

/** The incoming and outgoing far series; the last pair is kept (a greybody solve asks twice for the same mode). */
function farPair(p: DiracRadialProblem, kInf: number): { sIn: DiracFarSeries; sOut: DiracFarSeries } {
  const key = [p.hole.a, p.hole.mass, p.omega, p.m, p.mu, p.lambda].join(',');
  if (lastFar?.key === key) return lastFar;
  const mats = farMatrices(p, FAR_TERMS);
  const q = p.mu / (p.omega + kInf);
  const cIn: V2 = [
    [1, 0],
    [-q, 0],
  ];
  const cOut: V2 = [
    [-q, 0],
    [1, 0],
  ];
  const sIn = diracFarSeries(mats, [0, -kInf], cIn, [0, kInf], cOut);
  const sOut = diracFarSeries(mats, [0, kInf], cOut, [0, -kInf], cIn);
  lastFar = { key, sIn, sOut };
  return lastFar;
}

/** Solve once; Γ = (ω + k∞)/(2k∞|A|²), reflection |B/A|² (docs/massive-dirac.md). */
export function solveMassiveDiracRadial(p: DiracRadialProblem, options: DiracRadialOptions): DiracRadialSolution {
  const { omega, mu, hole } = p;
  const kInf = Math.sqrt((omega - mu) * (omega + mu));
  const rhs = diracRhs(p);
  let evaluations = 0;
  const counted = (dy: Float64Array | number[], y: Float64Array | number[], r: number) => {
    evaluations++;
    rhs(dy, y, r);
  };
  let fraction = options.startFraction ?? 0.1;
  let start = null;
  while (!start) {
    try {
      start = diracHorizonStart(p, fraction);
    } catch (e) {
      if (!(e instanceof RangeError) || fraction < 1e-6) throw e;
      fraction /= 4;
    }
  }
  // far-zone series of the two waves
  const { sIn, sOut } = farPair(p, kInf);
  let R = options.matchRadius ?? Math.max(50 * hole.mass, (20 + p.lambda * p.lambda) / kInf);
  let fIn = evaluateDiracFar(sIn, R);
  let fOut = evaluateDiracFar(sOut, R);
  while (Math.max(fIn.lastTerm, fOut.lastTerm) > FAR_ACCEPT && R < 1e9) {
    R *= 2;
    fIn = evaluateDiracFar(sIn, R);
    fOut = evaluateDiracFar(sOut, R);
  }
  const farTruncation = Math.max(fIn.lastTerm, fOut.lastTerm);
  const y = Float64Array.from([start.value[0][0], start.value[0][1], start.value[1][0], start.value[1][1]]);
  const stepper = makeStepper({
    integrator: options.integrator ?? INTEGRATORS[0],
    rhs: counted,
    tol: options.tol,
    rPlus: hole.rPlus,
    maxSteps: 5e6,
  });
  let r = start.r;
  let steps = 0;
  let h = Math.min(0.1 * (r - hole.rPlus), 0.1 / omega);
  while (r < R) {
    const res = stepper.advance(y, r, R, h, 1e300);
    steps += res.steps;
    if (res.r === r) break;
    r = res.r;
    h = res.h;
  }
  const diagnosticsBase = {
    method:
      'massive Dirac radial pair: horizon Frobenius series in √(r − r₊), ODE in r, far asymptotic series with the logarithmic phase',
    steps,
    rhsEvaluations: evaluations,
    startRadius: start.r,
    matchRadius: R,
    horizonTerms: start.terms,
    farTerms: FAR_TERMS,
    farTruncation,
  };
  if (r < R || farTruncation > 1e-10) {
    throw new ConvergenceError('massive Dirac radial solve did not reach the matching radius with a converged far series', {
      ...diagnosticsBase,
      errorEstimate: Infinity,
      message: `stopped at r = ${r}, matching radius ${R}, far truncation ${farTruncation.toExponential(1)}`,
    });
  }
  const P: V2 = [
    [y[0], y[1]],
    [y[2], y[3]],
  ];
  // P = A u_in + B u_out  (Cramer's rule)
  const det = (u: V2, v: V2): C => csub(cmul(u[0], v[1]), cmul(u[1], v[0]));
  const w = det(fIn.value, fOut.value);
  const A = cdiv(det(P, fOut.value), w);
  const B = cdiv(det(fIn.value, P), w);
  return {
    logAbsIn: Math.log(cabs(A)),
    logAbsOut: Math.log(cabs(B)),
    kInf,
    diagnostics: {
      ...diagnosticsBase,
      errorEstimate: steps * options.tol + farTruncation,
      message: `integrated from r = ${start.r.toPrecision(6)} to ${R.toPrecision(6)} in ${steps} steps`,
    },
  };
}
