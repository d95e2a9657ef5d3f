/**
 * Schwarzschild greybody factors from the real one-dimensional wave equations
 *   d²ψ/dr*² + (ω² − V) ψ = 0
 * with ψ → e^{−iωr*} at the horizon and ψ → A_in e^{−iωr*} + A_out e^{iωr*}
 * at infinity; Γ = 1/|A_in|² (Wronskian), reflection = |A_out/A_in|².
 *
 * This package is an independent check of the Teukolsky-based solver and
 * deliberately shares no numerical code with it. Method and derivations:
 * docs/method-schwarzschild-reference.md.
 */
import createIntegrator from 'ode45-cash-karp';
import { ConvergenceError, InputError } from '@penumbra/kerr';
import type { ModeProblem, PotentialKind } from './potentials.js';
import { potentialOverLapse } from './potentials.js';
import { horizonSeries, outgoingFarSeries, tortoiseFromHorizonDistance, type WaveState } from './series.js';

export interface SchwarzschildGreybodyResult {
  spin: number;
  l: number;
  omega: number;
  mass: number;
  gamma: number;
  reflection: number;
  /** |Γ + R − 1| */
  residual: number;
  /** estimated relative error of gamma */
  relError: number;
  diagnostics: {
    startRadius: number;
    matchRadius: number;
    steps: number;
    rhsEvaluations: number;
    seriesTerms: number;
    method: string;
  };
}

export interface SchwarzschildGreybodyQuery {
  /** 0, 0.5, 1 or 2 (Γ does not depend on the sign of s) */
  spin: number;
  /** l ≥ s with l − s a non-negative integer */
  l: number;
  /** ω > 0 */
  omega: number;
  /** hole mass M > 0, default 1 */
  mass?: number;
  /** target relative accuracy of Γ, default 1e-11 */
  tol?: number;
}

/**
 * Knobs of a single integration; the defaults are what schwarzschildGreybody
 * uses. Exposed so that tests can show the answer does not depend on them.
 */
export interface IntegrationControls {
  /** start at r0 = 2M (1 + startOffset); the horizon series converges for startOffset < 1 */
  startOffset?: number;
  /** first matching radius tried, in units of M; moved outward until the far series converges */
  matchRadius?: number;
  /** local error tolerance of the Cash–Karp steps (relative to |ψ|, |dψ/dr*|); default from tol */
  stepTolerance?: number;
  /** multiplies the default step tolerance (ignored when stepTolerance is given) */
  stepToleranceFactor?: number;
  /** sign in the Dirac potential W² ± dW/dr* */
  diracSign?: 1 | -1;
  /** step budget; exceeding it throws ConvergenceError */
  maxSteps?: number;
}

export interface SingleIntegration {
  gamma: number;
  reflection: number;
  residual: number;
  startRadius: number;
  matchRadius: number;
  steps: number;
  rhsEvaluations: number;
  seriesTerms: number;
  /** ln of the factor by which ψ was renormalised on the way out */
  logRescale: number;
}

export const DEFAULT_TOLERANCE = 1e-11;
const MIN_TOLERANCE = 1e-12;
/** Below this the Cash–Karp error estimate is dominated by rounding. */
const MIN_STEP_TOLERANCE = 1e-16;
const MAX_TOLERANCE = 1e-2;
const DEFAULT_START_OFFSET = 0.15;
const RELATIVE_ERROR_FLOOR = 3e-13;
const DEFAULT_MAX_STEPS = 3_000_000;
const RESCALE_THRESHOLD = 1e100;
const MATCH_RADIUS_GROWTH = 1.5;
const MAX_MATCH_MOVES = 60;

const SPINS = [0, 0.5, 1, 2];

function validate(q: SchwarzschildGreybodyQuery): { problemBase: Omit<ModeProblem, 'diracSign'>; tol: number } {
  if (q === null || typeof q !== 'object') throw new InputError('query', 'an object { spin, l, omega, mass?, tol? }', q);
  const { spin, l, omega } = q;
  if (typeof spin !== 'number' || !SPINS.includes(spin)) {
    throw new InputError('spin', 'one of 0, 0.5, 1, 2', spin, 'Γ is the same for ±s; pass |s|');
  }
  if (typeof l !== 'number' || !Number.isFinite(l) || l < spin || !Number.isInteger(l - spin)) {
    throw new InputError('l', `l ≥ ${spin} with l − s an integer`, l);
  }
  if (l > 200) throw new InputError('l', 'l ≤ 200', l);
  if (typeof omega !== 'number' || !Number.isFinite(omega) || !(omega > 0)) {
    throw new InputError('omega', 'a finite number > 0', omega);
  }
  const mass = q.mass ?? 1;
  if (typeof mass !== 'number' || !Number.isFinite(mass) || !(mass > 0)) {
    throw new InputError('mass', 'a finite number > 0', mass);
  }
  const tol = q.tol ?? DEFAULT_TOLERANCE;
  if (typeof tol !== 'number' || !Number.isFinite(tol) || tol < MIN_TOLERANCE || tol > MAX_TOLERANCE) {
    throw new InputError('tol', `a number in [${MIN_TOLERANCE}, ${MAX_TOLERANCE}]`, tol);
  }
  const Momega = mass * omega;
  if (Momega > 50) throw new InputError('omega', `M ω ≤ 50`, omega, 'beyond that Γ = 1 to machine precision for any l the solver is meant for');
  const kind: PotentialKind = spin === 0.5 ? 'dirac' : 'regge-wheeler';
  return { problemBase: { kind, spin, l, omega, mass }, tol };
}

/**
 * Step tolerance for a target accuracy of Γ. Measured (bench/accuracy.mjs):
 * the relative error of Γ is about stepTolerance × (3 + ω Δr*), where Δr* is
 * the tortoise-coordinate span of the integration — the Runge–Kutta amplitude
 * error accumulates per wavelength. Aim a factor 10 below tol.
 */
function stepToleranceFor(tol: number, p: ModeProblem, startOffset: number, matchRadius: number): number {
  const b = 2 * p.mass;
  const span = tortoiseFromHorizonDistance(p.mass, matchRadius - b) - tortoiseFromHorizonDistance(p.mass, b * startOffset);
  return Math.max(MIN_STEP_TOLERANCE, Math.min(1e-6, (0.1 * tol) / (3 + p.omega * span)));
}

/** First matching radius tried (units of M): far enough that ωr ≫ 1 and the flat-space terms are tame. */
function defaultMatchRadius(p: ModeProblem): number {
  const Momega = p.mass * p.omega;
  const L = p.l * (p.l + 1);
  return Math.max(10, (20 + 0.5 * L) / Momega);
}

/** One horizon-to-far-zone integration. Throws ConvergenceError if the series or the integrator fail. */
export function integrateOnce(q: SchwarzschildGreybodyQuery, controls: IntegrationControls = {}): SingleIntegration {
  const { problemBase, tol } = validate(q);
  const p: ModeProblem = { ...problemBase, diracSign: controls.diracSign ?? 1 };
  const M = p.mass;
  const b = 2 * M;
  const startOffset = controls.startOffset ?? DEFAULT_START_OFFSET;
  if (!(startOffset > 0 && startOffset <= 0.5)) throw new InputError('startOffset', 'in (0, 0.5]', startOffset);
  let matchRadius = (controls.matchRadius ?? defaultMatchRadius(p)) * M;
  const maxSteps = controls.maxSteps ?? DEFAULT_MAX_STEPS;
  const x0 = b * startOffset;
  const r0 = b + x0;
  if (!(matchRadius > 2 * r0)) matchRadius = 2 * r0;

  let far = outgoingFarSeries(p, matchRadius);
  let moves = 0;
  while (!far.converged) {
    if (++moves > MAX_MATCH_MOVES) {
      throw new ConvergenceError('far-zone asymptotic series did not converge', { spin: p.spin, l: p.l, omega: p.omega, mass: M, matchRadius, seriesTerms: far.terms });
    }
    matchRadius *= MATCH_RADIUS_GROWTH;
    far = outgoingFarSeries(p, matchRadius);
  }
  const stepTolerance =
    controls.stepTolerance ??
    Math.max(MIN_STEP_TOLERANCE, (controls.stepToleranceFactor ?? 1) * stepToleranceFor(tol, p, startOffset, matchRadius));

  const start = horizonSeries(p, x0);
  if (!start.converged) {
    throw new ConvergenceError('horizon series did not converge', { spin: p.spin, l: p.l, omega: p.omega, startRadius: r0, seriesTerms: start.terms });
  }
  const y = new Float64Array([start.psiRe, start.psiIm, start.dpsiRe, start.dpsiIm]);
  const omega2 = p.omega * p.omega;
  let rhsEvaluations = 0;
  // y = (Re ψ, Im ψ, Re P, Im P), P = dψ/dr*; independent variable r:
  // dψ/dr = P/f,  dP/dr = (U − ω²/f) ψ  with U = V/f.
  const deriv = (dydr: Float64Array, s: Float64Array, r: number): void => {
    rhsEvaluations++;
    const invF = r / (r - b);
    const coupling = potentialOverLapse(p, r) - omega2 * invF;
    dydr[0] = s[2] * invF;
    dydr[1] = s[3] * invF;
    dydr[2] = coupling * s[0];
    dydr[3] = coupling * s[1];
  };
  // Error measured against the complex moduli |ψ| and |P| (plus the step's
  // own change), so that a zero of Re ψ or Im ψ does not force tiny steps.
  const errorScale = (i: number, dt: number, _yi: number, dydt: number): number => {
    const mod = i < 2 ? Math.hypot(y[0], y[1]) : Math.hypot(y[2], y[3]);
    return mod + Math.abs(dt * dydt) + 1e-300;
  };
  const integrator = createIntegrator(y, deriv, r0, 0.01 * x0, {
    tol: stepTolerance,
    verbose: false,
    errorScaleFunction: errorScale,
  });
  let steps = 0;
  let logRescale = 0;
  const diagnostics = (): Record<string, unknown> => ({
    spin: p.spin, l: p.l, omega: p.omega, mass: M, startRadius: r0, matchRadius, steps, rhsEvaluations,
    seriesTerms: start.terms + far.terms,
  });
  let more = true;
  while (more) {
    more = integrator.step(matchRadius);
    steps++;
    const size = Math.abs(y[0]) + Math.abs(y[1]) + Math.abs(y[2]) + Math.abs(y[3]);
    if (!Number.isFinite(size)) throw new ConvergenceError('integration produced a non-finite state', diagnostics());
    if (size > RESCALE_THRESHOLD) {
      // Linear equation: renormalising is exact once the factor is tracked.
      for (let i = 0; i < 4; i++) y[i] /= RESCALE_THRESHOLD;
      logRescale += Math.log(RESCALE_THRESHOLD);
    }
    if (steps > maxSteps) throw new ConvergenceError('integration step budget exhausted', diagnostics());
  }
  const psi: WaveState = { psiRe: y[0], psiIm: y[1], dpsiRe: y[2], dpsiIm: y[3] };
  const amplitudes = matchToFarZone(psi, far, p.omega);
  // Γ = e^{−2 logRescale} / |A_in|², formed in logs so tiny Γ does not underflow early.
  const inMod2 = amplitudes.inRe * amplitudes.inRe + amplitudes.inIm * amplitudes.inIm;
  const outMod2 = amplitudes.outRe * amplitudes.outRe + amplitudes.outIm * amplitudes.outIm;
  const gamma = Math.exp(-2 * logRescale - Math.log(inMod2));
  const reflection = outMod2 / inMod2;
  return {
    gamma,
    reflection,
    residual: Math.abs(gamma + reflection - 1),
    startRadius: r0,
    matchRadius,
    steps,
    rhsEvaluations,
    seriesTerms: start.terms + far.terms,
    logRescale,
  };
}

/**
 * Solve ψ = A_in Φ_in + A_out Φ_out (and the same for dψ/dr*) with
 * Φ_in = conj(Φ_out) and the exact Wronskian W[Φ_in, Φ_out] = 2iω.
 */
function matchToFarZone(psi: WaveState, out: WaveState, omega: number) {
  const { psiRe: pr, psiIm: pi, dpsiRe: qr, dpsiIm: qi } = psi;
  const { psiRe: oR, psiIm: oI, dpsiRe: odR, dpsiIm: odI } = out;
  // A_in = (ψ Φ_out' − ψ' Φ_out) / (2iω)
  const nInRe = pr * odR - pi * odI - (qr * oR - qi * oI);
  const nInIm = pr * odI + pi * odR - (qr * oI + qi * oR);
  // A_out = (Φ_in ψ' − Φ_in' ψ) / (2iω), Φ_in = conj(Φ_out)
  const nOutRe = oR * qr + oI * qi - (odR * pr + odI * pi);
  const nOutIm = oR * qi - oI * qr - (odR * pi - odI * pr);
  const w = 2 * omega;
  // divide by i w: (a + ib)/(iw) = (b − ia)/w
  return { inRe: nInIm / w, inIm: -nInRe / w, outRe: nOutIm / w, outIm: -nOutRe / w };
}

/**
 * Greybody factor of a Schwarzschild hole for spin s ∈ {0, 1/2, 1, 2}.
 *
 * Two integrations with different start radius, matching radius and step
 * tolerance are compared; their difference is the error estimate relError,
 * and the more careful one is returned. Throws ConvergenceError when the
 * estimate stays above tol.
 */
export function schwarzschildGreybody(q: SchwarzschildGreybodyQuery): SchwarzschildGreybodyResult {
  const { problemBase, tol } = validate(q);
  const p: ModeProblem = { ...problemBase, diracSign: 1 };
  let factor = 1;
  let steps = 0;
  let rhsEvaluations = 0;
  let last: SingleIntegration | undefined;
  let relError = Infinity;
  for (let attempt = 0; attempt < 3; attempt++) {
    const coarse = integrateOnce(q, { stepToleranceFactor: factor, startOffset: DEFAULT_START_OFFSET });
    const fine = integrateOnce(q, {
      stepToleranceFactor: factor / 8,
      startOffset: 0.6 * DEFAULT_START_OFFSET,
      matchRadius: 1.4 * defaultMatchRadius(p),
    });
    steps += coarse.steps + fine.steps;
    rhsEvaluations += coarse.rhsEvaluations + fine.rhsEvaluations;
    last = fine;
    relError = fine.gamma > 0 ? Math.abs(coarse.gamma - fine.gamma) / fine.gamma : Infinity;
    // Floor: rounding accumulated over ~1e4 steps (measured up to 2e-13 in
    // bench/accuracy.mjs) is invisible to the comparison of two runs.
    relError = Math.max(relError, RELATIVE_ERROR_FLOOR);
    if (relError <= tol) break;
    factor /= 10;
  }
  const run = last!;
  const diagnostics = {
    startRadius: run.startRadius,
    matchRadius: run.matchRadius,
    steps,
    rhsEvaluations,
    seriesTerms: run.seriesTerms,
    method:
      (p.kind === 'dirac' ? 'Dirac potential W² + dW/dr*' : 'Regge–Wheeler potential') +
      '; horizon Frobenius series, Cash–Karp RK45 in r, asymptotic-series match; error from two independent integrations',
  };
  if (!(relError <= tol)) {
    throw new ConvergenceError(`greybody factor did not reach relative accuracy ${tol}`, {
      spin: p.spin, l: p.l, omega: p.omega, mass: p.mass, gamma: run.gamma, relError, ...diagnostics,
    });
  }
  return {
    spin: p.spin,
    l: p.l,
    omega: p.omega,
    mass: p.mass,
    gamma: run.gamma,
    reflection: run.reflection,
    residual: run.residual,
    relError,
    diagnostics,
  };
}
