/**
 * Shooting solver for the Teukolsky radial equation: problem → solve → solution.
 *
 * The ingoing-at-horizon solution is started from its Frobenius series at
 * x0 = r0 − r+ inside the series' disc of convergence, integrated outward in
 * r with the Cash–Karp 4(5) pair (ode45-cash-karp), and matched at r_match to
 * the in/out asymptotic series at infinity. For s > 0 the ingoing amplitude
 * Z_in dominates at infinity, so it is extracted without cancellation even
 * when Γ ~ 1e-30; see docs/method.md for the numerical trap this avoids.
 */
import { ConvergenceError, InputError, type KerrHole } from '@penumbra/kerr';
import { horizonSeriesStart, horizonWavenumber, type HorizonStart } from './horizonSeries.js';
import { evaluateFar, farSeries, type FarValue } from './farSeries.js';
import type { RadialMode } from './equation.js';
import { makeStepper, type IntegratorName } from './integrators.js';

export type { RadialMode } from './equation.js';

export interface RadialProblem extends RadialMode {
  hole: KerrHole;
}

export interface RadialOptions {
  /** local relative tolerance of the integrator (default 1e-12) */
  tol?: number;
  /** start point as a fraction of r+ − r− (default chosen from ω) */
  startFraction?: number;
  /** matching radius; default: the smallest radius where both far series converge */
  matchRadius?: number;
  /** radii (increasing, within (r0, r_match]) at which to record R and R' */
  grid?: readonly number[];
  /** abort after this many steps (default 2e5) */
  maxSteps?: number;
  /** ODE integrator (default 'odex') */
  integrator?: IntegratorName;
}

export interface Complex2 {
  re: number;
  im: number;
}

export interface RadialSample {
  r: number;
  R: Complex2;
  dR: Complex2;
}

export interface RadialDiagnostics {
  method: string;
  tol: number;
  startRadius: number;
  matchRadius: number;
  horizonTerms: number;
  horizonTruncation: number;
  farTerms: number;
  farTruncation: number;
  steps: number;
  rhsEvaluations: number;
  rescalings: number;
}

export interface RadialSolution {
  status: 'success';
  /** amplitudes relative to a horizon amplitude of 1; true value = Z · e^{logScale} */
  zIn: Complex2;
  zOut: Complex2;
  logScale: number;
  /** ln|Z_in| and ln|Z_out| including logScale (safe when |Z| would overflow) */
  logAbsZIn: number;
  logAbsZOut: number;
  /** k = ω − mΩ_H */
  k: number;
  samples: RadialSample[];
  diagnostics: RadialDiagnostics;
}

const LN_RESCALE = 300 * Math.LN10;
const RESCALE = 1e-300;

/** Default start point: inside the horizon series' disc, closer in when ω is large. */
export function defaultStartFraction(hole: KerrHole, omega: number, k: number): number {
  const b = hole.rPlus - hole.rMinus;
  // Series terms grow like (ω·2Mr+·x/b)^n/n! before decaying; keep that factor O(1).
  const w = Math.max(Math.abs(omega), Math.abs(k)) * 2 * hole.mass * hole.rPlus;
  return Math.min(0.25, 1 / (1 + 2 * w / b));
}

/** Smallest radius on a geometric ladder where both asymptotic series converge to 1e-17. */
function chooseMatch(hole: KerrHole, mode: RadialMode, fixed?: number) {
  const inSeries = farSeries(hole, mode, -1);
  const outSeries = farSeries(hole, mode, 1);
  const M = hole.mass;
  let r = fixed ?? Math.max(6 * M, hole.rPlus + 4 * M, 20 / Math.abs(mode.omega));
  for (let attempt = 0; attempt < 60; attempt++) {
    const vin = evaluateFar(hole, mode, inSeries, r);
    const vout = evaluateFar(hole, mode, outSeries, r);
    if (vin.converged && vout.converged) return { r, vin, vout };
    if (fixed !== undefined) {
      throw new ConvergenceError('far-zone series do not converge at the requested matching radius', {
        matchRadius: r,
        inTruncation: vin.truncation,
        outTruncation: vout.truncation,
      });
    }
    r *= 1.25;
  }
  throw new ConvergenceError('far-zone series did not converge at any matching radius tried', { lastRadius: r });
}

export function solveRadial(problem: RadialProblem, options: RadialOptions = {}): RadialSolution {
  const { hole, s, omega, lambda, m } = problem;
  const tol = options.tol ?? 1e-12;
  if (!(tol >= 1e-15 && tol <= 1e-3)) throw new InputError('tol', '1e-15 ≤ tol ≤ 1e-3', tol);
  if (!Number.isFinite(omega) || omega === 0) throw new InputError('omega', 'a finite non-zero frequency', omega);
  if (!Number.isFinite(lambda)) throw new InputError('lambda', 'a finite number', lambda);
  const mode: RadialMode = { s, m, omega, lambda };
  const M = hole.mass;
  const a = hole.a;
  const b = hole.rPlus - hole.rMinus;
  const k = horizonWavenumber(hole, mode);
  const fraction = options.startFraction ?? defaultStartFraction(hole, omega, k);
  if (!(fraction > 0 && fraction < 1)) throw new InputError('startFraction', '0 < startFraction < 1', fraction);

  let start: HorizonStart;
  let x0 = fraction * b;
  for (;;) {
    try {
      start = horizonSeriesStart(hole, mode, x0);
      break;
    } catch (e) {
      if (!(e instanceof ConvergenceError) || x0 < 1e-6 * b) throw e;
      x0 *= 0.5;
    }
  }
  const match = chooseMatch(hole, mode, options.matchRadius);
  const rMatch = match.r;
  const r0 = hole.rPlus + x0;
  if (!(rMatch > r0)) throw new InputError('matchRadius', `> start radius ${r0}`, rMatch);

  // Hot loop: R'' = −(s+1)Δ'/Δ R' − U/Δ² R in plain float64.
  const lam = lambda;
  const am = a * m;
  const a2 = a * a;
  let evaluations = 0;
  const rPlus = hole.rPlus, rMinus = hole.rMinus;
  const deriv = (dy: Float64Array | number[], y: Float64Array | number[], r: number) => {
    evaluations++;
    const x = r - rPlus;
    const D = x * (r - rMinus);
    const dD = 2 * (r - M);
    const K = (r * r + a2) * omega - am;
    const Ure = K * K - lam * D;
    const Uim = -2 * s * (r - M) * K + 4 * s * omega * r * D;
    const c1 = ((s + 1) * dD) / D;
    const iD2 = 1 / (D * D);
    dy[0] = y[2];
    dy[1] = y[3];
    dy[2] = -c1 * y[2] - (Ure * y[0] - Uim * y[1]) * iD2;
    dy[3] = -c1 * y[3] - (Ure * y[1] + Uim * y[0]) * iD2;
  };
  const y = new Float64Array([start.R[0], start.R[1], start.dR[0], start.dR[1]]);
  const integratorName = options.integrator ?? 'odex';
  const maxSteps = options.maxSteps ?? 200_000;
  const stepper = makeStepper(integratorName, deriv, tol, rPlus, maxSteps);
  let logScale = 0;
  let rescalings = 0;
  let steps = 0;
  const samples: RadialSample[] = [];
  const grid = options.grid ?? [];
  const record = (r: number) => {
    const f = Math.exp(logScale);
    samples.push({ r, R: { re: y[0] * f, im: y[1] * f }, dR: { re: y[2] * f, im: y[3] * f } });
  };
  const targets = [...grid.filter((g) => g > r0 && g < rMatch), rMatch];
  let r = r0;
  let h = 0.05 * x0;
  for (const target of targets) {
    while (r < target) {
      let adv;
      try {
        adv = stepper.advance(y, r, target, h, 1e150);
      } catch (e) {
        throw new ConvergenceError('radial integration failed', {
          reason: (e as Error).message, integrator: integratorName, steps, rhsEvaluations: evaluations,
          startRadius: r0, matchRadius: rMatch,
        });
      }
      steps += adv.steps;
      r = adv.r;
      h = adv.h;
      if (steps > maxSteps) {
        throw new ConvergenceError('radial integration exceeded the step limit', {
          r, steps, rhsEvaluations: evaluations, startRadius: r0, matchRadius: rMatch,
        });
      }
      if (Math.abs(y[0]) + Math.abs(y[1]) > 1e150) {
        for (let i = 0; i < 4; i++) y[i] *= RESCALE;
        logScale += LN_RESCALE;
        rescalings++;
      }
    }
    if (target !== rMatch || grid.includes(rMatch)) record(target);
  }
  if (!y.every(Number.isFinite)) {
    throw new ConvergenceError('radial integration produced non-finite values', { steps, rhsEvaluations: evaluations });
  }
  // Match R = Z_in R_in + Z_out R_out at r_match (2×2 complex solve).
  const vin: FarValue = match.vin, vout: FarValue = match.vout;
  const [ir, ii] = vin.R, [idr, idi] = vin.dR, [or, oi] = vout.R, [odr, odi] = vout.dR;
  const detRe = ir * odr - ii * odi - (idr * or - idi * oi);
  const detIm = ir * odi + ii * odr - (idr * oi + idi * or);
  const numInRe = y[0] * odr - y[1] * odi - (y[2] * or - y[3] * oi);
  const numInIm = y[0] * odi + y[1] * odr - (y[2] * oi + y[3] * or);
  const numOutRe = ir * y[2] - ii * y[3] - (idr * y[0] - idi * y[1]);
  const numOutIm = ir * y[3] + ii * y[2] - (idr * y[1] + idi * y[0]);
  const dd = detRe * detRe + detIm * detIm;
  const zIn = { re: (numInRe * detRe + numInIm * detIm) / dd, im: (numInIm * detRe - numInRe * detIm) / dd };
  const zOut = { re: (numOutRe * detRe + numOutIm * detIm) / dd, im: (numOutIm * detRe - numOutRe * detIm) / dd };
  return {
    status: 'success',
    zIn,
    zOut,
    logScale,
    logAbsZIn: Math.log(Math.hypot(zIn.re, zIn.im)) + logScale,
    logAbsZOut: Math.log(Math.hypot(zOut.re, zOut.im)) + logScale,
    k,
    samples,
    diagnostics: {
      method: `teukolsky-shooting/frobenius-start/asymptotic-match/${integratorName}`,
      tol,
      startRadius: r0,
      matchRadius: rMatch,
      horizonTerms: start.terms,
      horizonTruncation: start.truncation,
      farTerms: Math.max(vin.terms, vout.terms),
      farTruncation: Math.max(vin.truncation, vout.truncation),
      steps,
      rhsEvaluations: evaluations,
      rescalings,
    },
  };
}
