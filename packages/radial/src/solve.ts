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
import { ConvergenceError, InputError, tortoiseFromHorizonDistance, type KerrHole } from '@penumbra/kerr';
import { horizonSeriesStart, horizonWavenumber, type HorizonStart } from './horizonSeries.js';
import { evaluateFar, farSeries, type FarValue } from './farSeries.js';
import type { RadialMode } from './equation.js';
import { makeStepper, type IntegratorName, type Rhs } from './integrators.js';
import { starobinskyHorizonFactor, starobinskyMapAt } from './starobinskyMap.js';

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
  /** integrate R itself ('plain', default) or u = e^{iφ}R with the ingoing phase removed ('phase'; a second formulation for cross-checks) */
  variable?: 'phase' | 'plain';
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

/**
 * Default start point as a fraction of r+ − r−. The series converges out to
 * x = r+ − r− (the singular point r−), but near the horizon the solution
 * oscillates with wavenumber ≈ 2ωr+/(r+ − r−) in x, so terms grow like
 * (ωr+·fraction)^n/n! before decaying; keeping ωr+·fraction ≲ 1/2 bounds that
 * cancellation. Starting closer than necessary costs digits for s > 0
 * (the outgoing horizon solution is relatively amplified), so no closer.
 */
export function defaultStartFraction(hole: KerrHole, omega: number): number {
  return Math.min(0.25, 0.5 / (Math.abs(omega) * hole.rPlus));
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

function validateCommon(problem: RadialProblem, options: RadialOptions): number {
  const tol = options.tol ?? 1e-12;
  if (!(tol >= 1e-15 && tol <= 1e-3)) throw new InputError('tol', '1e-15 ≤ tol ≤ 1e-3', tol);
  if (!Number.isFinite(problem.omega) || problem.omega === 0) {
    throw new InputError('omega', 'a finite non-zero frequency', problem.omega);
  }
  if (!Number.isFinite(problem.lambda)) throw new InputError('lambda', 'a finite number', problem.lambda);
  return tol;
}

/** Right-hand side R'' = −(s+1)Δ'/Δ R' − U/Δ² R in plain float64; counts its calls. */
function radialRhs(hole: KerrHole, mode: RadialMode, counter: { evaluations: number }): Rhs {
  const { s, omega, lambda: lam } = mode;
  const M = hole.mass;
  const am = hole.a * mode.m;
  const a2 = hole.a * hole.a;
  const rPlus = hole.rPlus, rMinus = hole.rMinus;
  return (dy, y, r) => {
    counter.evaluations++;
    const D = (r - rPlus) * (r - rMinus);
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
}

/**
 * Right-hand side for u = e^{iφ} R with φ' = K/Δ, the phase of the ingoing
 * horizon solution (e^{−ikr*} near r+, e^{−iωr*} far away). Substituting into
 * the radial equation (docs/method.md, section 7):
 *   Δu'' + [(s+1)Δ' − 2iK]u' + [2i(2s − 1)ωr − λ − 2isΔ'K/Δ]u = 0,
 * whose ingoing solution does not carry the e^{−ikr*} winding near the
 * horizon. Measured, it is not cheaper in general (the far-zone outgoing part
 * then oscillates at 2ω), so it is kept as an independent second formulation
 * for cross-checks rather than as the default.
 */
function phaseRhs(hole: KerrHole, mode: RadialMode, counter: { evaluations: number }): Rhs {
  const { s, omega, lambda: lam } = mode;
  const M = hole.mass;
  const am = hole.a * mode.m;
  const a2 = hole.a * hole.a;
  const rPlus = hole.rPlus, rMinus = hole.rMinus;
  return (dy, y, r) => {
    counter.evaluations++;
    const D = (r - rPlus) * (r - rMinus);
    const dD = 2 * (r - M);
    const K = (r * r + a2) * omega - am;
    const P = (s + 1) * dD;
    const Pi = -2 * K;
    const Qre = -lam;
    const Qim = 2 * (2 * s - 1) * omega * r - (2 * s * dD * K) / D;
    const iD = 1 / D;
    dy[0] = y[2];
    dy[1] = y[3];
    dy[2] = -(P * y[2] - Pi * y[3] + Qre * y[0] - Qim * y[1]) * iD;
    dy[3] = -(P * y[3] + Pi * y[2] + Qre * y[1] + Qim * y[0]) * iD;
  };
}

/** φ(r) = ∫K/Δ dr = ω r* − (am/(r+ − r−)) ln((r − r+)/(r − r−)). */
function phaseAt(hole: KerrHole, mode: RadialMode, r: number): number {
  const x = r - hole.rPlus;
  const b = hole.rPlus - hole.rMinus;
  return mode.omega * tortoiseFromHorizonDistance(hole, x) - ((hole.a * mode.m) / b) * Math.log(x / (x + b));
}

/** (R, R') ↔ (u, u') with u = e^{iφ}R, u' = e^{iφ}(R' + iK/Δ R); direction −1 inverts. */
function convertPhase(hole: KerrHole, mode: RadialMode, r: number, y: Float64Array | number[], direction: 1 | -1): void {
  const phi = direction * phaseAt(hole, mode, r);
  const c = Math.cos(phi), sn = Math.sin(phi);
  const W = (direction * ((r * r + hole.a * hole.a) * mode.omega - hole.a * mode.m)) / ((r - hole.rPlus) * (r - hole.rMinus));
  if (direction === 1) {
    // u' = e^{iφ}(R' + iWR)
    const dRe = y[2] - W * y[1], dIm = y[3] + W * y[0];
    const uRe = c * y[0] - sn * y[1], uIm = sn * y[0] + c * y[1];
    y[2] = c * dRe - sn * dIm;
    y[3] = sn * dRe + c * dIm;
    y[0] = uRe;
    y[1] = uIm;
  } else {
    // R = e^{−iφ}u, R' = e^{−iφ}(u' − iWu); here W already carries the sign.
    const RRe = c * y[0] - sn * y[1], RIm = sn * y[0] + c * y[1];
    const dRe = c * y[2] - sn * y[3], dIm = sn * y[2] + c * y[3];
    y[0] = RRe;
    y[1] = RIm;
    y[2] = dRe - W * RIm;
    y[3] = dIm + W * RRe;
  }
}

/** Horizon start for the ingoing solution, moved inward while the series cancels digits. */
function startAtHorizon(hole: KerrHole, mode: RadialMode, options: RadialOptions): HorizonStart {
  const b = hole.rPlus - hole.rMinus;
  const fraction = options.startFraction ?? defaultStartFraction(hole, mode.omega);
  if (!(fraction > 0 && fraction < 1)) throw new InputError('startFraction', '0 < startFraction < 1', fraction);
  let x0 = fraction * b;
  // Large |k|/κ near extremality makes the terms swell before they decay.
  for (;;) {
    try {
      const start = horizonSeriesStart(hole, mode, x0);
      if (start.truncation <= 1e-13 || x0 < 1e-4 * b || options.startFraction !== undefined) return start;
    } catch (e) {
      if (!(e instanceof ConvergenceError) || x0 < 1e-6 * b) throw e;
    }
    x0 *= 0.5;
  }
}

interface Segment {
  logScale: number;
  steps: number;
  rescalings: number;
  samples: RadialSample[];
  /** the same samples unscaled, with the log-scale in force when each was taken */
  raw: { r: number; y: number[]; logScale: number }[];
}

/**
 * Integrate y = (Re R, Im R, Re R', Im R') from r0 through the requested
 * radii to rEnd, renormalising when |R| grows past 1e150 (the equation is
 * linear, so the factor is tracked exactly in logScale).
 */
function integrate(
  hole: KerrHole,
  mode: RadialMode,
  y: Float64Array,
  r0: number,
  rEnd: number,
  stops: readonly number[],
  tol: number,
  options: RadialOptions,
  counter: { evaluations: number },
  logScale0 = 0,
): Segment {
  const integratorName = options.integrator ?? 'odex';
  const maxSteps = options.maxSteps ?? 200_000;
  const phased = options.variable === 'phase';
  const rhs = phased ? phaseRhs(hole, mode, counter) : radialRhs(hole, mode, counter);
  const stepper = makeStepper(integratorName, rhs, tol, hole.rPlus, maxSteps);
  if (phased) convertPhase(hole, mode, r0, y, 1);
  let logScale = logScale0;
  let rescalings = 0;
  let steps = 0;
  const samples: RadialSample[] = [];
  const raw: Segment['raw'] = [];
  const targets = [...stops.filter((g) => g > r0 && g < rEnd), rEnd];
  let r = r0;
  let h = 0.05 * Math.min(r0 - hole.rPlus, 1);
  for (const target of targets) {
    while (r < target) {
      let adv;
      try {
        adv = stepper.advance(y, r, target, h, 1e150);
      } catch (e) {
        throw new ConvergenceError('radial integration failed', {
          reason: (e as Error).message, integrator: integratorName, steps, rhsEvaluations: counter.evaluations,
          from: r0, to: rEnd,
        });
      }
      steps += adv.steps;
      r = adv.r;
      h = adv.h;
      if (steps > maxSteps) {
        throw new ConvergenceError('radial integration exceeded the step limit', {
          r, steps, rhsEvaluations: counter.evaluations, from: r0, to: rEnd,
        });
      }
      if (Math.abs(y[0]) + Math.abs(y[1]) > 1e150) {
        for (let i = 0; i < 4; i++) y[i] *= RESCALE;
        logScale += LN_RESCALE;
        rescalings++;
      }
    }
    if (stops.includes(target)) {
      const yr = Array.from(y);
      if (phased) convertPhase(hole, mode, target, yr, -1);
      const f = Math.exp(logScale);
      samples.push({ r: target, R: { re: yr[0] * f, im: yr[1] * f }, dR: { re: yr[2] * f, im: yr[3] * f } });
      raw.push({ r: target, y: yr, logScale });
    }
  }
  if (phased) convertPhase(hole, mode, rEnd, y, -1);
  if (!y.every(Number.isFinite)) {
    throw new ConvergenceError('radial integration produced non-finite values', { steps, rhsEvaluations: counter.evaluations });
  }
  return { logScale, steps, rescalings, samples, raw };
}

/** Solve R = Z_in R_in + Z_out R_out at the matching radius (2×2 complex system). */
function matchAmplitudes(y: ArrayLike<number>, vin: FarValue, vout: FarValue): { zIn: Complex2; zOut: Complex2 } {
  const [ir, ii] = vin.R, [idr, idi] = vin.dR, [or, oi] = vout.R, [odr, odi] = vout.dR;
  const detRe = ir * odr - ii * odi - (idr * or - idi * oi);
  const detIm = ir * odi + ii * odr - (idr * oi + idi * or);
  const numInRe = y[0] * odr - y[1] * odi - (y[2] * or - y[3] * oi);
  const numInIm = y[0] * odi + y[1] * odr - (y[2] * oi + y[3] * or);
  const numOutRe = ir * y[2] - ii * y[3] - (idr * y[0] - idi * y[1]);
  const numOutIm = ir * y[3] + ii * y[2] - (idr * y[1] + idi * y[0]);
  const dd = detRe * detRe + detIm * detIm;
  return {
    zIn: { re: (numInRe * detRe + numInIm * detIm) / dd, im: (numInIm * detRe - numInRe * detIm) / dd },
    zOut: { re: (numOutRe * detRe + numOutIm * detIm) / dd, im: (numOutIm * detRe - numOutRe * detIm) / dd },
  };
}

function logAbs(z: Complex2): number {
  return Math.log(Math.hypot(z.re, z.im));
}

/**
 * One-sided shooting for spin weight s of either sign: horizon series start,
 * integration to r_match, asymptotic match.
 */
export function solveRadial(problem: RadialProblem, options: RadialOptions = {}): RadialSolution {
  const tol = validateCommon(problem, options);
  const { hole, s, omega, lambda, m } = problem;
  const mode: RadialMode = { s, m, omega, lambda };
  const start = startAtHorizon(hole, mode, options);
  const match = chooseMatch(hole, mode, options.matchRadius);
  const r0 = hole.rPlus + start.x0;
  if (!(match.r > r0)) throw new InputError('matchRadius', `> start radius ${r0}`, match.r);
  const counter = { evaluations: 0 };
  const y = new Float64Array([start.R[0], start.R[1], start.dR[0], start.dR[1]]);
  const seg = integrate(hole, mode, y, r0, match.r, options.grid ?? [], tol, options, counter);
  const { zIn, zOut } = matchAmplitudes(y, match.vin, match.vout);
  return {
    status: 'success',
    zIn,
    zOut,
    logScale: seg.logScale,
    logAbsZIn: logAbs(zIn) + seg.logScale,
    logAbsZOut: logAbs(zOut) + seg.logScale,
    k: horizonWavenumber(hole, mode),
    samples: seg.samples,
    diagnostics: {
      method: `teukolsky-shooting/frobenius-start/asymptotic-match/${options.integrator ?? 'odex'}`,
      tol,
      startRadius: r0,
      matchRadius: match.r,
      horizonTerms: start.terms,
      horizonTruncation: start.truncation,
      farTerms: Math.max(match.vin.terms, match.vout.terms),
      farTruncation: Math.max(match.vin.truncation, match.vout.truncation),
      steps: seg.steps,
      rhsEvaluations: counter.evaluations,
      rescalings: seg.rescalings,
    },
  };
}

export interface TwoSidedSolution {
  status: 'success';
  /** ln|Z_in| of the +|s| solution normalised to Δ^{−s} e^{−ikr*} at the horizon */
  logAbsZInPlus: number;
  /** ln|Z_out| of the same solution (loses digits like (ωr)^{2s}; for diagnostics) */
  logAbsZOutPlus: number;
  /** ln|Y_out| of the −|s| solution normalised to Δ^{s} e^{−ikr*} at the horizon */
  logAbsYOutMinus: number;
  /** ln|Y_in| of the same −|s| solution (subdominant at infinity: loses digits like (ωr)^{2s}; for cross-checks) */
  logAbsYInMinus: number;
  /** R_{+s} and dR_{+s}/dr (normalised to Δ^{−s} e^{−ikr*} at the horizon) at the requested radii */
  samples: RadialSample[];
  k: number;
  switchRadius: number;
  diagnostics: RadialDiagnostics;
}

export interface TwoSidedOptions extends RadialOptions {
  /** radius where the −s solution is mapped to the +s one (default r+ + max(M, 2(r+ − r−)), capped at halfway to the matching radius) */
  switchRadius?: number;
  /** carry the −s field on to the far zone for Y_out (default true; false saves that leg) */
  reflection?: boolean;
}

/**
 * Two-sided route for s > 0 (physics notes; docs/method.md): the −|s| field is
 * integrated from the horizon, where its ingoing solution is the one that grows
 * outward (stable), to the far zone, giving Y_out without cancellation; at a
 * switching radius it is mapped by D^{2s} to the +|s| field, which is
 * integrated outward to give Z_in without cancellation. Neither end asks for
 * a subdominant solution.
 */
export function solveTwoSided(problem: RadialProblem, options: TwoSidedOptions = {}): TwoSidedSolution {
  const tol = validateCommon(problem, options);
  const { hole, s, omega, lambda, m } = problem;
  if (!(s > 0)) throw new InputError('s', 's > 0 for the two-sided route', s);
  const plus: RadialMode = { s, m, omega, lambda };
  const minus: RadialMode = { s: -s, m, omega, lambda: lambda + 2 * s };
  const b = hole.rPlus - hole.rMinus;
  const start = startAtHorizon(hole, minus, options);
  const r0 = hole.rPlus + start.x0;
  const matchMinus = chooseMatch(hole, minus, options.matchRadius);
  const matchPlus = chooseMatch(hole, plus, options.matchRadius);
  // Beyond the near-horizon zone (a few b, at least M) but well inside the matching radius.
  const rSwitch = options.switchRadius ?? Math.min(hole.rPlus + Math.max(hole.mass, 2 * b), (r0 + matchPlus.r) / 2);
  if (!(rSwitch > r0 && rSwitch < matchPlus.r)) {
    throw new InputError('switchRadius', `between the start ${r0} and the matching radius ${matchPlus.r}`, rSwitch);
  }
  const counter = { evaluations: 0 };
  const y = new Float64Array([start.R[0], start.R[1], start.dR[0], start.dR[1]]);
  const wantReflection = options.reflection ?? true;
  const grid = options.grid ?? [];
  // Radii inside the start point are evaluated from the horizon series itself.
  const series = grid.filter((g) => g > hole.rPlus && g <= r0);
  const inner = grid.filter((g) => g > r0 && g < rSwitch);
  const outer = grid.filter((g) => g > rSwitch && g <= matchPlus.r);
  if (grid.length !== series.length + inner.length + outer.length + grid.filter((g) => g === rSwitch).length) {
    throw new InputError('grid', `radii within (r+, ${matchPlus.r}] = (${hole.rPlus}, ${matchPlus.r}]`, grid);
  }
  const minusStops = [...inner, rSwitch];
  const segMinus = wantReflection
    ? integrate(hole, minus, y, r0, matchMinus.r, minusStops, tol, options, counter)
    : integrate(hole, minus, y, r0, rSwitch, minusStops, tol, options, counter);
  const minusAmps = wantReflection
    ? matchAmplitudes(y, matchMinus.vin, matchMinus.vout)
    : { zIn: { re: Number.NaN, im: Number.NaN }, zOut: { re: Number.NaN, im: Number.NaN } };
  const yOut = minusAmps.zOut;
  const at = segMinus.raw[segMinus.raw.length - 1];
  // Map (R, R') of the −s field to the +s field at the switching radius.
  const map = starobinskyMapAt(hole, minus, rSwitch);
  const c = (z: [number, number], R: Complex2) => [z[0] * R.re - z[1] * R.im, z[0] * R.im + z[1] * R.re];
  const Rv = { re: at.y[0], im: at.y[1] };
  const dRv = { re: at.y[2], im: at.y[3] };
  const [p0r, p0i] = c(map.a0, Rv), [p1r, p1i] = c(map.b0, dRv);
  const [q0r, q0i] = c(map.a1, Rv), [q1r, q1i] = c(map.b1, dRv);
  const yPlus = new Float64Array([p0r + p1r, p0i + p1i, q0r + q1r, q0i + q1i]);
  const rawSwitch = Array.from(yPlus);
  const segPlus = integrate(hole, plus, yPlus, rSwitch, matchPlus.r, outer, tol, options, counter, at.logScale);
  const amp = matchAmplitudes(yPlus, matchPlus.vin, matchPlus.vout);
  const k = horizonWavenumber(hole, plus);
  const h = starobinskyHorizonFactor(hole, s, k);
  const logH = Math.log(Math.hypot(h[0], h[1]));
  // Samples of the normalised +s solution: mapped −s samples inside r_sw, the +s leg outside.
  const hh = h[0] * h[0] + h[1] * h[1];
  const overH = (re: number, im: number, f: number): Complex2 => ({
    re: (f * (re * h[0] + im * h[1])) / hh,
    im: (f * (im * h[0] - re * h[1])) / hh,
  });
  const plusSample = (r: number, yy: ArrayLike<number>, logScale: number): RadialSample => {
    const f = Math.exp(logScale);
    return { r, R: overH(yy[0], yy[1], f), dR: overH(yy[2], yy[3], f) };
  };
  const samples: RadialSample[] = [];
  const seriesSamples = series.map((g) => {
    const st = horizonSeriesStart(hole, minus, g - hole.rPlus);
    return { r: g, y: [st.R[0], st.R[1], st.dR[0], st.dR[1]], logScale: 0 };
  });
  for (const smp of [...seriesSamples, ...segMinus.raw]) {
    if (smp.r === rSwitch) {
      if (grid.includes(rSwitch)) samples.push(plusSample(rSwitch, rawSwitch, smp.logScale));
      continue;
    }
    const mp = starobinskyMapAt(hole, minus, smp.r);
    const R = { re: smp.y[0], im: smp.y[1] }, dR = { re: smp.y[2], im: smp.y[3] };
    const [u0r, u0i] = c(mp.a0, R), [u1r, u1i] = c(mp.b0, dR), [v0r, v0i] = c(mp.a1, R), [v1r, v1i] = c(mp.b1, dR);
    samples.push(plusSample(smp.r, [u0r + u1r, u0i + u1i, v0r + v1r, v0i + v1i], smp.logScale));
  }
  for (const smp of segPlus.raw) samples.push(plusSample(smp.r, smp.y, smp.logScale));
  return {
    status: 'success',
    logAbsZInPlus: logAbs(amp.zIn) + segPlus.logScale - logH,
    logAbsZOutPlus: logAbs(amp.zOut) + segPlus.logScale - logH,
    logAbsYOutMinus: logAbs(yOut) + segMinus.logScale,
    logAbsYInMinus: logAbs(minusAmps.zIn) + segMinus.logScale,
    samples,
    k,
    switchRadius: rSwitch,
    diagnostics: {
      method: `teukolsky-two-sided/frobenius-start(−s)/starobinsky-map/asymptotic-match/${options.integrator ?? 'odex'}`,
      tol,
      startRadius: r0,
      matchRadius: Math.max(matchMinus.r, matchPlus.r),
      horizonTerms: start.terms,
      horizonTruncation: start.truncation,
      farTerms: Math.max(matchMinus.vin.terms, matchMinus.vout.terms, matchPlus.vin.terms, matchPlus.vout.terms),
      farTruncation: Math.max(matchMinus.vout.truncation, matchPlus.vin.truncation),
      steps: segMinus.steps + segPlus.steps,
      rhsEvaluations: counter.evaluations,
      rescalings: segMinus.rescalings + segPlus.rescalings,
    },
  };
}
