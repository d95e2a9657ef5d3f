/**
 * One horizon-to-far-zone integration for the massive Klein–Gordon field on a
 * Schwarzschild hole: the massive series (massiveSeries.ts) at the two ends,
 * Cash–Karp RK45 in r between them. With ψ → e^{−iωr*} at the horizon and
 * ψ → A_in ψ_in + A_out ψ_out at infinity, the Wronskian gives
 * Γ = ω/(k |A_in|²) and R = |A_out/A_in|², k = √(ω² − μ²) (docs/massive-fields.md).
 */
import { ConvergenceError } from '@penumbra/core';
import type { IntegrationControls, SingleIntegration } from './integrate.js';
import { DEFAULT_START_OFFSET } from './integrate.js';
import { massiveHorizonSeries, massiveOutgoingFarSeries, massiveWavenumber, type MassiveScalarMode } from './massiveSeries.js';
import { MIN_STEP_TOLERANCE } from './problem.js';
import { tortoiseFromHorizonDistance } from './series.js';
import { marchWave } from './waveIntegration.js';

const MAX_STEPS = 3_000_000;
const GROWTH = 1.5;
const MAX_MOVES = 60;

/** First matching radius (units of M): k r ≫ 1 and the flat-space terms tame, as for massless fields with k in place of ω. */
export function massiveMatchRadius(p: MassiveScalarMode): number {
  const { k } = massiveWavenumber(p);
  return Math.max(10, (20 + 0.5 * p.l * (p.l + 1)) / (p.mass * k));
}

function fail(p: MassiveScalarMode, message: string, work: { steps: number; rhsEvaluations: number }, extra: object) {
  return new ConvergenceError(message, {
    l: p.l,
    omega: p.omega,
    mu: p.mu,
    mass: p.mass,
    ...extra,
    method: 'massive scalar: single integration (horizon series, Cash–Karp RK45, long-range far-zone series)',
    steps: work.steps,
    rhsEvaluations: work.rhsEvaluations,
    errorEstimate: Infinity,
    message,
  });
}

/** One integration of a massive-scalar mode with the knobs of `integrate` (same meaning, same defaults). */
export function integrateMassiveScalar(p: MassiveScalarMode, controls: IntegrationControls): SingleIntegration {
  const M = p.mass;
  const b = 2 * M;
  const startOffset = controls.startOffset ?? DEFAULT_START_OFFSET;
  const x0 = b * startOffset;
  const r0 = b + x0;
  let matchRadius = Math.max((controls.matchRadius ?? massiveMatchRadius(p)) * M, 2 * r0);
  let far = massiveOutgoingFarSeries(p, matchRadius);
  for (let moves = 0; !far.converged; moves++) {
    if (moves >= MAX_MOVES) {
      throw fail(p, 'far-zone asymptotic series did not converge', { steps: 0, rhsEvaluations: 0 }, { matchRadius });
    }
    matchRadius *= GROWTH;
    far = massiveOutgoingFarSeries(p, matchRadius);
  }
  const start = massiveHorizonSeries(p, x0);
  if (!start.converged) {
    throw fail(p, 'horizon series did not converge', { steps: 0, rhsEvaluations: 0 }, { startRadius: r0 });
  }
  const { k } = massiveWavenumber(p);
  // Step tolerance from the requested accuracy: error ~ tolerance × (3 + ω Δr*), as measured for the massless solver.
  const span = tortoiseFromHorizonDistance(M, matchRadius - b) - tortoiseFromHorizonDistance(M, x0);
  const stepTolerance =
    controls.stepTolerance ??
    Math.max(
      MIN_STEP_TOLERANCE,
      (controls.stepToleranceFactor ?? 1) *
        Math.max(MIN_STEP_TOLERANCE, Math.min(1e-6, (0.1 * controls.tol) / (3 + p.omega * span))),
    );
  const y = new Float64Array([start.psiRe, start.psiIm, start.dpsiRe, start.dpsiIm]);
  const L = p.l * (p.l + 1);
  const omega2 = p.omega * p.omega;
  const mu2 = p.mu * p.mu;
  let rhsEvaluations = 0;
  // y = (ψ, P = dψ/dr*): dψ/dr = P/f, dP/dr = (V/f − ω²/f) ψ, V/f = L/r² + b/r³ + μ².
  const deriv = (dy: Float64Array, s: Float64Array, r: number): void => {
    rhsEvaluations++;
    const invF = r / (r - b);
    const coupling = L / (r * r) + b / (r * r * r) + mu2 - omega2 * invF;
    dy[0] = s[2] * invF;
    dy[1] = s[3] * invF;
    dy[2] = coupling * s[0];
    dy[3] = coupling * s[1];
  };
  const { steps, logRescale } = marchWave(
    y,
    deriv,
    { r0, firstStep: 0.01 * x0, matchRadius },
    stepTolerance,
    controls.maxSteps ?? MAX_STEPS,
    (message, _detail, steps) => fail(p, message, { steps, rhsEvaluations }, { matchRadius }),
  );
  // A_in = (ψ ψ_out' − ψ' ψ_out)/(2ik), A_out = (ψ_in ψ' − ψ_in' ψ)/(2ik), ψ_in = conj(ψ_out).
  const [pr, pi, qr, qi] = y;
  const { psiRe: oR, psiIm: oI, dpsiRe: odR, dpsiIm: odI } = far;
  const nInRe = pr * odR - pi * odI - (qr * oR - qi * oI);
  const nInIm = pr * odI + pi * odR - (qr * oI + qi * oR);
  const nOutRe = oR * qr + oI * qi - (odR * pr + odI * pi);
  const nOutIm = oR * qi - oI * qr - (odR * pi - odI * pr);
  const inMod2 = (nInRe * nInRe + nInIm * nInIm) / (4 * k * k);
  const outMod2 = (nOutRe * nOutRe + nOutIm * nOutIm) / (4 * k * k);
  const gamma = Math.exp(Math.log(p.omega / k) - 2 * logRescale - Math.log(inMod2));
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
