/**
 * One horizon-to-far-zone integration of d²ψ/dr*² + (ω² − V)ψ = 0: Frobenius
 * start at the horizon, Cash–Karp RK45 in r, match to the far-zone series.
 * `schwarzschildGreybody` compares two of them; `integrateOnce` (the
 * "./internal" subpath) runs one with explicit knobs.
 */
import { ConvergenceError, type Diagnostics } from '@penumbra/core';
import type { ModeProblem } from './potentials.js';
import { potentialOverLapse } from './potentials.js';
import {
  MIN_STEP_TOLERANCE,
  type IntegrationOptions,
  type SchwarzschildGreybodyProblem,
  validateIntegrationOptions,
  validateProblem,
} from './problem.js';
import { integrateMassiveScalar } from './massiveIntegrate.js';
import { marchWave } from './waveIntegration.js';
import { horizonSeries, outgoingFarSeries, tortoiseFromHorizonDistance, type WaveState } from './series.js';

/** The outcome of one integration (no error estimate: that needs a second one). */
export interface SingleIntegration {
  gamma: number;
  reflection: number;
  /** |Γ + R − 1| */
  residual: number;
  startRadius: number;
  matchRadius: number;
  steps: number;
  rhsEvaluations: number;
  seriesTerms: number;
  /** ln of the factor by which ψ was renormalised on the way out */
  logRescale: number;
}

/** Integration knobs after validation, with the requested tol. */
export type IntegrationControls = Omit<IntegrationOptions, 'tol'> & { tol: number };

/** Default start r0 = 2M(1 + 0.15): well inside the horizon series' convergence (offset < 1). */
export const DEFAULT_START_OFFSET = 0.15;
const DEFAULT_MAX_STEPS = 3_000_000;
const MATCH_RADIUS_GROWTH = 1.5;
const MAX_MATCH_MOVES = 60;

/** What a failed integration reports: full core Diagnostics plus the mode and radii. */
function failure(
  p: ModeProblem,
  message: string,
  work: { steps: number; rhsEvaluations: number },
  extra: object,
): Diagnostics & Record<string, unknown> {
  return {
    spin: p.spin,
    l: p.l,
    omega: p.omega,
    mass: p.mass,
    ...extra,
    method: 'single integration (horizon series, Cash–Karp RK45, far-zone series)',
    steps: work.steps,
    rhsEvaluations: work.rhsEvaluations,
    errorEstimate: Infinity,
    message,
  };
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
export function defaultMatchRadius(p: Omit<ModeProblem, 'diracSign'>): number {
  const Momega = p.mass * p.omega;
  const L = p.l * (p.l + 1);
  return Math.max(10, (20 + 0.5 * L) / Momega);
}

/**
 * One horizon-to-far-zone integration of a validated problem. Throws
 * ConvergenceError (full diagnostics) if a series or the integrator fails.
 */
export function integrate(base: Omit<ModeProblem, 'diracSign'>, controls: IntegrationControls): SingleIntegration {
  const p: ModeProblem = { ...base, diracSign: controls.diracSign ?? 1 };
  const M = p.mass;
  const b = 2 * M;
  const startOffset = controls.startOffset ?? DEFAULT_START_OFFSET;
  let matchRadius = (controls.matchRadius ?? defaultMatchRadius(p)) * M;
  const maxSteps = controls.maxSteps ?? DEFAULT_MAX_STEPS;
  const x0 = b * startOffset;
  const r0 = b + x0;
  if (!(matchRadius > 2 * r0)) matchRadius = 2 * r0;

  let far = outgoingFarSeries(p, matchRadius);
  let moves = 0;
  while (!far.converged) {
    if (++moves > MAX_MATCH_MOVES) {
      throw new ConvergenceError(
        'far-zone asymptotic series did not converge',
        failure(
          p,
          `no convergence after ${MAX_MATCH_MOVES} moves of the matching radius`,
          { steps: 0, rhsEvaluations: 0 },
          { matchRadius, seriesTerms: far.terms },
        ),
      );
    }
    matchRadius *= MATCH_RADIUS_GROWTH;
    far = outgoingFarSeries(p, matchRadius);
  }
  const stepTolerance =
    controls.stepTolerance ??
    Math.max(
      MIN_STEP_TOLERANCE,
      (controls.stepToleranceFactor ?? 1) * stepToleranceFor(controls.tol, p, startOffset, matchRadius),
    );

  const start = horizonSeries(p, x0);
  if (!start.converged) {
    throw new ConvergenceError(
      'horizon series did not converge',
      failure(
        p,
        `no convergence in ${start.terms} terms at r0 = ${r0}`,
        { steps: 0, rhsEvaluations: 0 },
        { startRadius: r0, seriesTerms: start.terms },
      ),
    );
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
  const { steps, logRescale } = marchWave(
    y,
    deriv,
    { r0, firstStep: 0.01 * x0, matchRadius },
    stepTolerance,
    maxSteps,
    (message, detail, steps) =>
      new ConvergenceError(
        message,
        failure(p, detail, { steps, rhsEvaluations }, { startRadius: r0, matchRadius, seriesTerms: start.terms + far.terms }),
      ),
  );
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
 * One horizon-to-far-zone integration with explicit knobs (validated
 * options; unknown keys refused). No error estimate: the tests compare
 * integrations to show that Γ does not depend on the knobs.
 */
export function integrateOnce(problem: SchwarzschildGreybodyProblem, options?: IntegrationOptions): SingleIntegration {
  const base = validateProblem(problem);
  const controls = validateIntegrationOptions(options);
  if (base.fieldMass > 0) {
    return integrateMassiveScalar({ l: base.l, omega: base.omega, mu: base.fieldMass / base.mass, mass: base.mass }, controls);
  }
  return integrate(base, controls);
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
