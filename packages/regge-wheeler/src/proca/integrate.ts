/**
 * One horizon-to-far-zone integration of a Proca sector (M = 1): horizon
 * series for each channel, Cash–Karp RK45 in r for all channels at once,
 * match to the far-zone series, and the absorption matrix from the flux
 * weights (docs/massive-vector.md).
 */
import createIntegrator from 'ode45-cash-karp';
import { ConvergenceError, type Diagnostics } from '@penumbra/core';
import { tortoiseFromHorizonDistance } from '../series.js';
import { type Complex, abs2, adjoint, choleskyUpper, hermitianEigen2, matMul, solve } from './complex.js';
import { channelDerivative, ProcaExtrapolation } from './extrapolation.js';
import { COLLOCATION_FLOOR, carryFarSolutions } from './farPhase.js';
import type { ProcaIntegrator } from './problem.js';
import type { SectorModel } from './sectors.js';
import {
  FAR_TOLERANCE,
  farSeriesConverges,
  farWaveNumbers,
  horizonSolution,
  outgoingFarSolution,
  type SeriesState,
} from './series.js';

/** Knobs of one integration (the tests turn them to show Γ does not depend on them). */
export interface ProcaIntegrationControls {
  /** start at r0 = 2(1 + startOffset), 0 < startOffset ≤ 0.5 */
  startOffset: number;
  /** first matching radius tried (units of M), moved outward until the far series converges */
  matchRadius?: number;
  /** local error tolerance of the Cash–Karp steps */
  stepTolerance: number;
  /** 'extrapolation' (default: the Gragg–Bulirsch–Stoer loop of extrapolation.ts) or 'cash-karp' (RK45, kept as a cross-check) */
  integrator?: ProcaIntegrator;
  /** rotate the horizon and far channel bases by this angle (radians) before forming Γ; the eigen-Γ must not move */
  basisAngle?: number;
  /** radii (ascending, units of M) at which to keep the state: those in [r0, matchRadius] become step ends */
  sampleRadii?: readonly number[];
  /**
   * where the far solutions, carried inward in phase form from where their
   * series converges (farPhase.ts), meet the horizon integration: absent,
   * carryEndRadius where that pays (carryPays); a radius, there whenever
   * the series starts beyond it; false: match where the series converges.
   * Step tolerances below COLLOCATION_FLOOR, and a collocation that fails,
   * take the direct route.
   */
  phaseRadius?: number | false;
}

/** The state of all horizon solutions at one radius: true value = state · e^{logRescale}. */
export interface ProcaStateSample {
  r: number;
  state: Float64Array;
  logRescale: number;
}

/** What one integration gives: absorption eigenvalues (descending) and their reflections. */
export interface ProcaIntegration {
  /** transmission eigenvalues Γ (descending; one entry for a one-channel sector) */
  gammas: number[];
  /** reflected fraction in each transmission eigen-polarisation */
  reflections: number[];
  /** largest entry of |T + R − 1| (flux conservation of the 2×2 S-matrix) */
  residual: number;
  /** diagonal entries of T in the channel basis (depend on the basis; their sum does not) */
  channelDiagonal: number[];
  startRadius: number;
  matchRadius: number;
  steps: number;
  rhsEvaluations: number;
  seriesTerms: number;
  /** raw amplitudes of the stored horizon solutions (columns) in the incoming / outgoing far channels (rows), row-major; true = raw · e^{logRescale} */
  amplitudesIn: Complex[];
  amplitudesOut: Complex[];
  logRescale: number;
  /** unit eigenvectors of T in the unit-flux far-channel basis, in the order of `gammas` */
  eigenvectors: Complex[][];
  /** the outgoing far solutions at the matching radius, one per channel */
  far: SeriesState[];
  /** the states at `sampleRadii` that lie in [startRadius, matchRadius] */
  samples: ProcaStateSample[];
  /** where the far series was summed (= matchRadius unless the phase form carried it inward) */
  farStartRadius: number;
  /** the outgoing far solutions at the `sampleRadii` between matchRadius and farStartRadius */
  farSamples: Array<{ r: number; far: SeriesState[] }>;
  /** steps of the phase-form far zone (included in steps) */
  phaseSteps: number;
}

const MAX_STEPS = 3_000_000;
const RESCALE = 1e100;
const MATCH_GROWTH = 1.5;
const MAX_MATCH_MOVES = 60;

/**
 * Carry the far solutions inward only when the phase the direct route would
 * cross between the two radii exceeds this many radians per interval the carry
 * would take (about 1 + ln(r_start / r_end): intervals of about one e-fold in
 * r), per channel count. Break-even, measured with both routes on the same
 * modes (tol 1e-8 step tolerance 1.5e-11, interleaved CPU): one channel
 * carried/direct 0.97 at 6.9 rad per interval (odd l = 1, Mω = 0.3, v = 0.14),
 * 0.79 at 6.7 (monopole there), 0.85 at 10 (odd l = 2, Mω = 0.8, v = 0.14);
 * two channels 1.10 at 6.9 (even l = 1, Mω = 0.3, v = 0.14), 1.12 at 9.5
 * (even l = 1, v = 0.05), 0.92 at 10.0 (even l = 2, Mω = 0.8, v = 0.14), 0.68
 * at 16.8 (even l = 2, v = 0.05): the even sector's carry solves a 2×2 matrix
 * Riccati equation. With that carry 1.4× cheaper (reciprocal pivots, paired
 * solves, Gauss–Seidel sweeps) and the far-series ladder rescaling its terms
 * (series.ts), the two-channel break-even moved down (same modes, warmed up,
 * interleaved, best of 9): carried/direct 0.73–0.89 at 9.5 (even l = 1,
 * v = 0.05; 758 against 2677 evaluations), 1.04–1.11 at 6.9 (l = 1, v = 0.14),
 * 0.75–0.81 at 10.0 (l = 2, v = 0.14).
 */
const RADIANS_PER_INTERVAL = { 1: 6, 2: 8 } as const;

/** Whether carrying the far solutions from rStart in to rEnd costs less than integrating across. */
function carryPays(model: SectorModel, rEnd: number, rStart: number): boolean {
  if (!(rEnd < rStart)) return false;
  return farZonePhase(model, rEnd, rStart) > RADIANS_PER_INTERVAL[model.channels] * (1 + Math.log(rStart / rEnd));
}
/**
 * The phase-form far zone may stop at the end of a whole interval up to this
 * factor outside the phase radius instead of adding a short last interval
 * (which costs as much as a whole one, about what the direct route takes
 * for that stretch): measured in bench/proca-speed.bench.mjs near threshold.
 */
export const PHASE_SLACK = 1.6;

/**
 * The phase ∫ √(k∞² + 2μ²/r) dr between r1 < r2: the far-zone wave number with
 * its Newtonian part, f and the centrifugal term left out (an estimate of
 * the work of the direct route). With a = 2μ² the antiderivative is
 * r√(k² + a/r) + (a/k) asinh(k√(r/a)).
 */
export function farZonePhase(model: SectorModel, r1: number, r2: number): number {
  const { k } = farWaveNumbers(model);
  const a = 2 * model.mu * model.mu;
  const F = (r: number) => r * Math.sqrt(k * k + a / r) + (a / k) * Math.asinh(k * Math.sqrt(r / a));
  return F(r2) - F(r1);
}

/**
 * Where the phase-form far solutions meet the horizon integration: where the
 * massless mode of the same l and ω would match (ω r ≫ 1, centrifugal terms tame).
 */
export function defaultPhaseRadius(model: SectorModel): number {
  return Math.max(10, (20 + 0.5 * (model.L + 2 * model.l + 2)) / model.omega);
}

/**
 * Radians of far-zone phase per e-fold of r (p r, p = √(k∞² + 2μ²/r)) below
 * which the direct route costs less than the carry, whose intervals span
 * about one e-fold each: near threshold at small Mω the default phase radius
 * lies where the wave is slow (p r ≈ 3.9 at 77 M for l = 1, Mω = 0.3,
 * v = 0.05). Measured there (even sector, tol 1e-8 step tolerance 8.3e-12,
 * interleaved, best of 40): the carry ending at 110–176 M instead of 77 M
 * took one interval fewer and 0.88× the CPU; ending at 45–60 M, 1.2–1.5×.
 */
const CARRY_END_PHASE = 6;

/**
 * Where the default route's carry ends: the default phase radius, or further
 * out where the far-zone phase per e-fold falls to CARRY_END_PHASE (r with
 * p r = CARRY_END_PHASE: r = P²/(√(μ⁴ + k∞²P²) + μ²)) when that is more than
 * PHASE_SLACK outside it: a shorter move saves no interval of the carry, only
 * lengthens the direct route (1.02–1.13× the CPU at l ≤ 1, Mω = 0.3, v = 0.14).
 */
export function carryEndRadius(model: SectorModel): number {
  const { k } = farWaveNumbers(model);
  const m2 = model.mu * model.mu;
  const P = CARRY_END_PHASE;
  const slow = (P * P) / (Math.sqrt(m2 * m2 + k * k * P * P) + m2);
  const phaseRadius = defaultPhaseRadius(model);
  return slow > PHASE_SLACK * phaseRadius ? slow : phaseRadius;
}

/**
 * Relative size of the last kept far-series term when the matching radius is
 * laddered: a tenth of the step tolerance, between 1e-16 and 1e-12. The
 * series then converges at a smaller k∞r than at 1e-16 (measured at tol
 * 1e-8: matching radii 20–30 % smaller, as many fewer right-hand-side
 * evaluations, Γ within 1e-10 of tol-1e-11 solves), and the truncation it
 * leaves is charged in the accumulation bound (greybody.ts).
 */
export function farTruncation(stepTolerance: number): number {
  return Math.min(1e-12, Math.max(FAR_TOLERANCE, 0.1 * stepTolerance));
}

/** Rungs of the matching-radius ladder; its first rung (ladderStart) is below where the looser target converges. */
const LADDER_GROWTH = 1.2;

/** First rung of the matching-radius ladder: k∞r about 8 plus the centrifugal allowance. */
function ladderStart(model: SectorModel): number {
  const { k } = farWaveNumbers(model);
  return Math.max(10, (8 + 0.5 * (model.L + 2 * model.l + 2)) / k);
}

/** First matching radius: far enough that k∞ r ≫ 1 and the centrifugal terms are tame. */
export function defaultProcaMatchRadius(model: SectorModel): number {
  const { k } = farWaveNumbers(model);
  return Math.max(10, (20 + 0.5 * (model.L + 2 * model.l + 2)) / k);
}

function methodOf(model: SectorModel): string {
  return `Proca ${model.sector} sector, l = ${model.l}, Mω = ${model.omega}, Mμ = ${model.mu}: single integration`;
}

function failure(model: SectorModel, message: string, steps: number, rhsEvaluations: number): Diagnostics {
  return {
    method: methodOf(model),
    steps,
    rhsEvaluations,
    errorEstimate: Infinity,
    message,
  };
}

function rotation(angle: number, n: number): Complex[] {
  if (n === 1) return [[1, 0]];
  const c = Math.cos(angle);
  const s = Math.sin(angle);
  return [
    [c, 0],
    [-s, 0],
    [s, 0],
    [c, 0],
  ];
}

/** One integration with explicit knobs. Throws ConvergenceError when a series or the integrator fails. */
export function integrateProca(model: SectorModel, controls: ProcaIntegrationControls): ProcaIntegration {
  const N = model.channels;
  const x0 = 2 * controls.startOffset;
  const r0 = 2 + x0;
  // without a radius given, the ladder starts below the default and climbs in finer rungs to where the series
  // meets a target tied to the step tolerance (its truncation is charged in the caller's bound: farTruncation)
  const laddered = controls.matchRadius === undefined;
  let matchRadius = laddered ? ladderStart(model) : (controls.matchRadius as number);
  if (!(matchRadius > 2 * r0)) matchRadius = 2 * r0;
  const target = laddered ? farTruncation(controls.stepTolerance) : FAR_TOLERANCE;
  const growth = laddered ? LADDER_GROWTH : MATCH_GROWTH;
  // the channels in turn, stopping at the first whose series does not converge (the radius moves out anyway);
  // the solutions are built only where every channel converges
  const farAt = (r: number): SeriesState[] => {
    for (let c = 0; c < N; c++) if (!farSeriesConverges(model, c, r, target)) return [];
    return Array.from({ length: N }, (_, c) => outgoingFarSolution(model, c, r, target));
  };
  let far = farAt(matchRadius);
  let moves = 0;
  while (far.length < N || !far.every((s) => s.converged)) {
    if (++moves > MAX_MATCH_MOVES) {
      throw new ConvergenceError(
        'far-zone asymptotic series did not converge',
        failure(model, 'matching radius moved too often', 0, 0),
      );
    }
    matchRadius *= growth;
    far = farAt(matchRadius);
  }
  const farStartRadius = matchRadius;
  let farSamples: ProcaIntegration['farSamples'] = [];
  let phaseSteps = 0;
  let phaseEvaluations = 0;
  const inner = controls.phaseRadius === false ? Infinity : Math.max(2 * r0, controls.phaseRadius ?? carryEndRadius(model));
  const wanted = controls.phaseRadius === undefined ? carryPays(model, inner, farStartRadius) : inner < farStartRadius;
  if (wanted && controls.stepTolerance >= COLLOCATION_FLOOR) {
    try {
      // on a grid of radii the carry ends where asked; for Γ alone it may end up to PHASE_SLACK further out
      const slack = controls.sampleRadii ? 1 : PHASE_SLACK;
      const carried = carryFarSolutions(model, far, farStartRadius, inner, controls.stepTolerance, controls.sampleRadii, slack);
      far = carried.far;
      farSamples = carried.samples;
      phaseSteps = carried.steps;
      phaseEvaluations = carried.rhsEvaluations;
      matchRadius = carried.endRadius;
    } catch (e) {
      // the collocation could not meet its tolerance: the direct route from the series start
      if (!(e instanceof ConvergenceError)) throw e;
    }
  }
  const starts = Array.from({ length: N }, (_, c) => horizonSolution(model, c, x0));
  if (!starts.every((s) => s.converged)) {
    throw new ConvergenceError('horizon series did not converge', failure(model, `no convergence at r0 = ${r0}`, 0, 0));
  }
  // State: for each horizon solution j, u (N complex) then P (N complex).
  const block = 4 * N;
  const y = new Float64Array(N * block);
  starts.forEach((s, j) => {
    for (let i = 0; i < N; i++) {
      y[j * block + 2 * i] = s.u[i][0];
      y[j * block + 2 * i + 1] = s.u[i][1];
      y[j * block + 2 * N + 2 * i] = s.p[i][0];
      y[j * block + 2 * N + 2 * i + 1] = s.p[i][1];
    }
  });
  const w2 = model.omega * model.omega;
  const mu2 = model.mu * model.mu;
  // Q(y) = q0 + q1 y (degree 1 in every sector), evaluated into one buffer
  const NN = N * N;
  const q0 = Float64Array.from(model.qCoeffs[0]);
  const q1 = model.qCoeffs[1] ? Float64Array.from(model.qCoeffs[1]) : new Float64Array(NN);
  if (model.qCoeffs.length > 2) throw new Error('Proca sector with Q of degree > 1');
  let rhsEvaluations = phaseEvaluations;
  // du/dr = P/f,  dP/dr = [μ² + L/r² + Q(1/r)/r² − ω²/f] u.
  const L = model.L;
  const equations = { channels: N, mu2, w2, L, q0, q1 };
  // the Cash–Karp route's right-hand side: the same channel equations the extrapolation loop carries
  const deriv = (dydr: Float64Array, s: Float64Array, r: number): void => {
    rhsEvaluations++;
    channelDerivative(equations, dydr, s, r);
  };
  const norms = new Float64Array(2 * N);
  const errorScale = (i: number, dt: number, _yi: number, dydt: number): number => {
    const j = Math.floor(i / block);
    const part = i % block < 2 * N ? 0 : 1;
    return norms[2 * j + part] + Math.abs(dt * dydt) + 1e-300;
  };
  const updateNorms = () => {
    for (let j = 0; j < N; j++) {
      let a = 0;
      let b = 0;
      for (let i = 0; i < 2 * N; i++) {
        a += y[j * block + i] ** 2;
        b += y[j * block + 2 * N + i] ** 2;
      }
      norms[2 * j] = Math.sqrt(a);
      norms[2 * j + 1] = Math.sqrt(b);
    }
  };
  updateNorms();
  const cashKarp = controls.integrator === 'cash-karp';
  // first step: a tenth of the distance to the horizon for the extrapolation loop (a hundredth cost it two
  // extra steps, 2–4 % of its evaluations), a hundredth for Cash–Karp as before
  const stepper = !cashKarp
    ? new ProcaExtrapolation(
        y,
        { channels: N, mu2, w2, L, q0, q1 },
        r0,
        0.1 * x0,
        controls.stepTolerance,
        model.omega,
        methodOf(model),
      )
    : createIntegrator(y, deriv, r0, 0.01 * x0, {
        tol: controls.stepTolerance,
        verbose: false,
        errorScaleFunction: errorScale,
      });
  // the extrapolation loop counts its own evaluations (its equations are written out inside it)
  const evaluations = (): number => rhsEvaluations + (stepper instanceof ProcaExtrapolation ? stepper.evaluations : 0);
  let steps = phaseSteps;
  let logRescale = 0;
  const targets = (controls.sampleRadii ?? []).filter((r) => r >= r0 && r <= matchRadius);
  const samples: ProcaStateSample[] = [];
  let next = 0;
  // a sample at r0 itself is the start state
  while (next < targets.length && targets[next] === r0) {
    samples.push({ r: r0, state: Float64Array.from(y), logRescale: 0 });
    next++;
  }
  const position = (): number => ('t' in stepper ? stepper.t : stepper.r);
  const stepTo = (): boolean => {
    // the extrapolation integrator's step-size underflow is a ConvergenceError of its own
    if (next >= targets.length) return stepper.step(matchRadius);
    stepper.step(targets[next]);
    const at = position();
    if (at >= targets[next]) {
      // every target at this radius (repeated radii) takes the same state
      while (next < targets.length && targets[next] <= at) {
        samples.push({ r: targets[next], state: Float64Array.from(y), logRescale });
        next++;
      }
    }
    return at < matchRadius;
  };
  let more = true;
  while (more) {
    more = stepTo();
    steps++;
    if (cashKarp) updateNorms();
    let size = 0;
    for (let i = 0; i < y.length; i++) size += Math.abs(y[i]);
    if (!Number.isFinite(size)) {
      throw new ConvergenceError(
        'integration produced a non-finite state',
        failure(model, `non-finite after ${steps} steps`, steps, evaluations()),
      );
    }
    if (size > RESCALE) {
      for (let i = 0; i < y.length; i++) y[i] /= RESCALE;
      logRescale += Math.log(RESCALE);
      updateNorms();
    }
    if (steps > MAX_STEPS) {
      throw new ConvergenceError(
        'integration step budget exhausted',
        failure(model, `more than ${MAX_STEPS} steps`, steps, evaluations()),
      );
    }
  }
  // Matching matrix: columns Φin_c, Φout_c (2N-vectors (u, P)); Φin = conj(Φout).
  const dim = 2 * N;
  const F: Complex[] = new Array(dim * dim);
  for (let c = 0; c < N; c++) {
    const s = far[c];
    for (let i = 0; i < N; i++) {
      F[i * dim + c] = [s.u[i][0], -s.u[i][1]];
      F[(N + i) * dim + c] = [s.p[i][0], -s.p[i][1]];
      F[i * dim + N + c] = s.u[i];
      F[(N + i) * dim + N + c] = s.p[i];
    }
  }
  const rhs: Complex[] = new Array(dim * N);
  for (let j = 0; j < N; j++) {
    for (let i = 0; i < N; i++) {
      rhs[i * N + j] = [y[j * block + 2 * i], y[j * block + 2 * i + 1]];
      rhs[(N + i) * N + j] = [y[j * block + 2 * N + 2 * i], y[j * block + 2 * N + 2 * i + 1]];
    }
  }
  const amp = solve(F, rhs, dim, N);
  const Ain: Complex[] = [];
  const Aout: Complex[] = [];
  for (let c = 0; c < N; c++) for (let j = 0; j < N; j++) Ain.push(amp[c * N + j]);
  for (let c = 0; c < N; c++) for (let j = 0; j < N; j++) Aout.push(amp[(N + c) * N + j]);
  // the absorption's fields by name, not spread: the spread result plus fifteen more keys cost about 5 % of a
  // near-threshold solve (CPU profile of bench/proca-speed's even l = 3, v = 0.05)
  const a = absorption(model, Ain, Aout, logRescale, controls.basisAngle ?? 0);
  return {
    gammas: a.gammas,
    reflections: a.reflections,
    residual: a.residual,
    channelDiagonal: a.channelDiagonal,
    eigenvectors: a.eigenvectors,
    startRadius: r0,
    matchRadius,
    steps,
    rhsEvaluations: evaluations(),
    seriesTerms: starts.reduce((a, s) => a + s.terms, 0) + far.reduce((a, s) => a + s.terms, 0),
    amplitudesIn: Ain,
    amplitudesOut: Aout,
    logRescale,
    far,
    samples,
    farStartRadius,
    farSamples,
    phaseSteps,
  };
}

/**
 * Absorption and reflection matrices from the amplitudes of the horizon
 * solutions (columns) in the incoming and outgoing far channels (rows).
 * With S_∞ = diag √(k∞ D_c) and S_H the Cholesky factor of the horizon flux
 * matrix, the unit-flux transmission amplitude is t = S_H A_in⁻¹ S_∞⁻¹ and
 * T = t†t; R = r†r with r = S_∞ A_out A_in⁻¹ S_∞⁻¹. The stored solutions are
 * the true ones divided by e^{logRescale}.
 */
function absorption(model: SectorModel, AinRaw: Complex[], AoutRaw: Complex[], logRescale: number, angle: number) {
  const N = model.channels;
  const { k } = farWaveNumbers(model);
  // Another raw basis at both ends (real rotation B): horizon solutions H B,
  // far channels Φ B; then A → B⁻¹ A B and the flux matrices → Bᵀ (·) B.
  const B = rotation(angle, N);
  const Bt = adjoint(B, N);
  const Ain = matMul(matMul(Bt, AinRaw, N), B, N);
  const Aout = matMul(matMul(Bt, AoutRaw, N), B, N);
  const D: Complex[] = [];
  for (let i = 0; i < N; i++) for (let j = 0; j < N; j++) D.push([i === j ? k * model.infinityWeights[i] : 0, 0]);
  const Sinf = choleskyUpper(matMul(matMul(Bt, D, N), B, N), N);
  const SH = choleskyUpper(matMul(matMul(Bt, model.horizonFlux, N), B, N), N);
  const identity: Complex[] =
    N === 1
      ? [[1, 0]]
      : [
          [1, 0],
          [0, 0],
          [0, 0],
          [1, 0],
        ];
  const SinfInv = solve(Sinf, identity, N, N);
  const AinInv = solve(Ain, identity, N, N);
  const tRot = matMul(matMul(SH, AinInv, N), SinfInv, N);
  const T = matMul(adjoint(tRot, N), tRot, N);
  const rAmp = matMul(matMul(matMul(Sinf, Aout, N), AinInv, N), SinfInv, N);
  const R = matMul(adjoint(rAmp, N), rAmp, N);
  const scale = Math.exp(-2 * logRescale);
  let residual = 0;
  for (let i = 0; i < N; i++) {
    for (let j = 0; j < N; j++) {
      const e = scale * T[i * N + j][0] + R[i * N + j][0] - (i === j ? 1 : 0);
      residual = Math.max(residual, Math.hypot(e, scale * T[i * N + j][1] + R[i * N + j][1]));
    }
  }
  const channelDiagonal = Array.from({ length: N }, (_, i) => scale * T[i * N + i][0]);
  if (N === 1) {
    return { gammas: [scale * T[0][0]], reflections: [R[0][0]], residual, channelDiagonal, eigenvectors: [[[1, 0] as Complex]] };
  }
  // det T = |det t|², formed without cancellation.
  const detT = abs2([
    tRot[0][0] * tRot[3][0] - tRot[0][1] * tRot[3][1] - (tRot[1][0] * tRot[2][0] - tRot[1][1] * tRot[2][1]),
    tRot[0][0] * tRot[3][1] + tRot[0][1] * tRot[3][0] - (tRot[1][0] * tRot[2][1] + tRot[1][1] * tRot[2][0]),
  ]);
  const eig = hermitianEigen2(T[0][0], T[1], T[3][0], detT);
  const reflections = eig.vectors.map((v) => {
    // v† R v
    let re = 0;
    for (let i = 0; i < 2; i++) {
      for (let j = 0; j < 2; j++) {
        const a = R[i * 2 + j];
        const vi = v[i];
        const vj = v[j];
        // conj(vi) a vj
        const avj: Complex = [a[0] * vj[0] - a[1] * vj[1], a[0] * vj[1] + a[1] * vj[0]];
        re += vi[0] * avj[0] + vi[1] * avj[1];
      }
    }
    return re;
  });
  return {
    gammas: [scale * eig.values[0], scale * eig.values[1]],
    reflections,
    residual,
    channelDiagonal,
    eigenvectors: eig.vectors,
  };
}

/** Tortoise span of an integration (for the step-tolerance rule). */
export function tortoiseSpan(startOffset: number, matchRadius: number): number {
  return tortoiseFromHorizonDistance(1, matchRadius - 2) - tortoiseFromHorizonDistance(1, 2 * startOffset);
}
