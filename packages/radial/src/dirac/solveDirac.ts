/**
 * One solve of the massive Dirac radial pair: horizon series → ODE
 * integration in r → far-zone series (carried inward by farRiccati.ts where
 * it converges only far out), giving the incoming and outgoing
 * amplitudes A, B of P = A u_in + B u_out with u_in ≈ (1, −μ/(ω + k∞)) e^{−i(k∞r + η ln r)}
 * and u_out ≈ (−μ/(ω + k∞), 1) e^{+i(k∞r + η ln r)} (η = M(2ω² − μ²)/k∞),
 * the horizon solution normalised to |P₊| = 1, P₋ = 0 there.
 * Both solutions are of one size at both ends, so there is no shooting trap.
 */
import { ConvergenceError, type Diagnostics } from '@penumbra/core';
import { INTEGRATORS, makeStepper, type IntegratorName } from '../integrators.js';
import type { Complex2 } from '../solution.js';
import { type C, type V2, cabs, cdiv, cmul, csub } from './complex2.js';
import { type DiracRadialProblem, diracKernel, diracRhs } from './equation.js';
import { type DiracFarSeries, diracFarSeries, evaluateDiracFar, farExpansion, mirrorDiracFar } from './farSeries.js';
import { carryFarRatio, carryLadder } from './farRiccati.js';
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
  /** radii (ascending, each > r₊) at which to sample (P₊, P₋); radii beyond the matching radius cost integration out to them */
  grid?: readonly number[];
  /** carry the far waves' ratios inward from the series (default true; false integrates the ODE out to the series, kept for cross-checks) */
  farCarry?: boolean;
}

/** Diagnostics of one massive Dirac radial solve. */
export interface DiracRadialDiagnostics extends Diagnostics {
  startRadius: number;
  /** where the ODE solution is matched to the far-zone waves */
  matchRadius: number;
  /** where the far series is summed (beyond matchRadius when the waves' ratios were carried inward) */
  seriesRadius: number;
  /** collocation rungs of the far-zone carry (0 when the series converged at the matching radius) */
  carrySteps: number;
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
  /** (P₊, P₋) at the radii of `grid`, in its order (empty without one) */
  samples: DiracRadialSample[];
  diagnostics: DiracRadialDiagnostics;
}

/** The pair at one radius: P₊ = Δ^{1/2}R₊ and P₋ = R₋ of the horizon-normalised solution. */
export interface DiracRadialSample {
  r: number;
  pPlus: Complex2;
  pMinus: Complex2;
}

function sample(r: number, a: number, b: number, c: number, d: number): DiracRadialSample {
  return { r, pPlus: { re: a, im: b }, pMinus: { re: c, im: d } };
}

const FAR_TERMS = 50;
/**
 * Terms built first: at the radius where the series is accepted it reaches
 * 1e-17 of its sum within 14–28 terms (measured over a ≤ 0.99, Mω 0.05–2.5,
 * v 0.05–0.99, |λ| ≤ 5.2); the FAR_TERMS are built only where a sum runs out
 * (the series costs the square of its length).
 */
const FAR_TERMS_FIRST = 32;
const METHOD =
  'massive Dirac radial pair: horizon Frobenius series in √(r − r₊), ODE in r, far asymptotic series with the logarithmic phase';
/** The far-zone carry stops outside this multiple of r₊ (the ODE takes the strong field). */
const CARRY_FLOOR = 4;
/** Least error allowed per rung of the carry: its corrections stall at 1e-14–2e-14 from rounding (measured at Mω = 2.5, v = 0.05). */
const CARRY_TOL = 1e-13;
const FAR_ACCEPT = 1e-16;

let lastFar: { p: DiracRadialProblem; sIn: DiracFarSeries } | null = null;

/**
 * The incoming far series with `terms` terms (the outgoing wave is its
 * mirror, mirrorDiracFar); the last one is kept (a greybody solve may ask
 * twice for the same mode). Its first coefficients do not depend on `terms`.
 */
function farSeriesIn(p: DiracRadialProblem, kInf: number, terms: number): DiracFarSeries {
  const l = lastFar?.p;
  if (
    l !== undefined &&
    (lastFar as { sIn: DiracFarSeries }).sIn.count >= terms - 1 &&
    l.hole.a === p.hole.a &&
    l.hole.mass === p.hole.mass &&
    l.omega === p.omega &&
    l.m === p.m &&
    l.mu === p.mu &&
    l.lambda === p.lambda
  ) {
    return (lastFar as { sIn: DiracFarSeries }).sIn;
  }
  const mats = farExpansion(p, terms);
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
  lastFar = { p: { hole: p.hole, omega: p.omega, m: p.m, mu: p.mu, lambda: p.lambda }, sIn };
  return sIn;
}

/** Solve once; Γ = (ω + k∞)/(2k∞|A|²), reflection |B/A|² (docs/massive-dirac.md). */
export function solveMassiveDiracRadial(p: DiracRadialProblem, options: DiracRadialOptions): DiracRadialSolution {
  const { omega, mu, hole } = p;
  const kInf = Math.sqrt((omega - mu) * (omega + mu));
  const rhs = diracRhs(p);
  const counter = { evaluations: 0 };
  const counted = (dy: Float64Array | number[], y: Float64Array | number[], r: number) => {
    counter.evaluations++;
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
  let sIn = farSeriesIn(p, kInf, FAR_TERMS_FIRST);
  const firstRadius = options.matchRadius ?? Math.max(50 * hole.mass, (20 + p.lambda * p.lambda) / kInf);
  let R = firstRadius;
  let fIn = evaluateDiracFar(sIn, R);
  while (fIn.lastTerm > FAR_ACCEPT && R < 1e9) {
    if (!fIn.complete && sIn.count < FAR_TERMS - 1) {
      // the short series ran out before its smallest term: the full one decides at this radius
      sIn = farSeriesIn(p, kInf, FAR_TERMS);
      fIn = evaluateDiracFar(sIn, R);
      continue;
    }
    R *= 2;
    fIn = evaluateDiracFar(sIn, R);
  }
  const fOut = mirrorDiracFar(fIn);
  const farTruncation = Math.max(fIn.lastTerm, fOut.lastTerm);
  // Where the series needed a larger radius than the first, carry the waves' ratios inward from it as far as they
  // are locally plane waves, instead of integrating out to it (elsewhere the solve is the direct one, bit for bit).
  const tried =
    options.farCarry === false || R === firstRadius
      ? null
      : carryBoth(p, carryLadder(p, R, CARRY_FLOOR * hole.rPlus), fIn.value, Math.max(options.tol, CARRY_TOL));
  const carry = tried && tried.steps > 0 ? tried : null;
  const rMatch = carry ? carry.radius : R;
  const y = Float64Array.from([start.value[0][0], start.value[0][1], start.value[1][0], start.value[1][1]]);
  const stepper = makeStepper({
    integrator: options.integrator ?? INTEGRATORS[0],
    rhs: counted,
    tol: options.tol,
    rPlus: hole.rPlus,
    maxSteps: 5e6,
    dirac: diracKernel(p, counter),
    method: METHOD,
    counter,
  });
  let r = start.r;
  let steps = 0;
  let h = Math.min(0.1 * (r - hole.rPlus), 0.1 / omega);
  const advanceTo = (target: number) => {
    while (r < target) {
      // the integrator's own failures (its step limit) throw ConvergenceErrors quoting METHOD
      const res = stepper.advance(y, r, target, h, 1e300);
      steps += res.steps;
      if (res.r === r) return;
      r = res.r;
      h = res.h;
    }
  };
  // The requested radii inside the start from the horizon series itself, the rest from the ODE on its way out.
  const grid = options.grid ?? [];
  const samples: DiracRadialSample[] = [];
  let g = 0;
  const d = hole.rPlus - hole.rMinus;
  for (; g < grid.length && grid[g] <= start.r; g++) {
    const v = grid[g] === start.r ? start.value : diracHorizonStart(p, (grid[g] - hole.rPlus) / d).value;
    samples.push(sample(grid[g], v[0][0], v[0][1], v[1][0], v[1][1]));
  }
  for (; g < grid.length && grid[g] <= rMatch; g++) {
    advanceTo(grid[g]);
    samples.push(sample(grid[g], y[0], y[1], y[2], y[3]));
  }
  advanceTo(rMatch);
  const matchSteps = steps;
  const diagnosticsBase = {
    method: METHOD,
    steps,
    rhsEvaluations: counter.evaluations + (tried?.evaluations ?? 0),
    startRadius: start.r,
    matchRadius: rMatch,
    seriesRadius: R,
    carrySteps: carry?.steps ?? 0,
    horizonTerms: start.terms,
    farTerms: sIn.count + 1,
    farTruncation,
  };
  if (r < rMatch || farTruncation > 1e-10) {
    throw new ConvergenceError('massive Dirac radial solve did not reach the matching radius with a converged far series', {
      ...diagnosticsBase,
      errorEstimate: Infinity,
      message: `stopped at r = ${r}, matching radius ${rMatch}, far truncation ${farTruncation.toExponential(1)}`,
    });
  }
  const P: V2 = [
    [y[0], y[1]],
    [y[2], y[3]],
  ];
  for (; g < grid.length; g++) {
    advanceTo(grid[g]);
    if (r < grid[g]) break;
    samples.push(sample(grid[g], y[0], y[1], y[2], y[3]));
  }
  if (samples.length < grid.length) {
    throw new ConvergenceError('massive Dirac radial solve did not reach the last requested radius', {
      ...diagnosticsBase,
      steps,
      errorEstimate: Infinity,
      message: `stopped at r = ${r}, last radius requested ${grid[grid.length - 1]}`,
    });
  }
  const { logAbsIn, logAbsOut, carryError } = carry
    ? carriedAmplitudes(P, carry, kInf, p)
    : seriesAmplitudes(P, fIn.value, fOut.value);
  return {
    logAbsIn,
    logAbsOut,
    kInf,
    samples,
    diagnostics: {
      ...diagnosticsBase,
      errorEstimate: matchSteps * options.tol + farTruncation + carryError,
      message: `integrated from r = ${start.r.toPrecision(6)} to ${rMatch.toPrecision(6)} in ${steps} steps${carry ? `; far series at ${R.toPrecision(6)}, carried in by ${carry.steps} rungs` : ''}`,
    },
  };
}

interface Amplitudes {
  logAbsIn: number;
  logAbsOut: number;
  /** error bound of ln|A| from the far-zone carry */
  carryError: number;
}

/** P = A u_in + B u_out with both waves from the series at the matching radius (Cramer's rule). */
function seriesAmplitudes(P: V2, uIn: V2, uOut: V2): Amplitudes {
  const det = (u: V2, v: V2): C => csub(cmul(u[0], v[1]), cmul(u[1], v[0]));
  const w = det(uIn, uOut);
  const A = cdiv(det(P, uOut), w);
  const B = cdiv(det(uIn, P), w);
  return { logAbsIn: Math.log(cabs(A)), logAbsOut: Math.log(cabs(B)), carryError: 0 };
}

interface CarriedRatios {
  /** the inner end of the carry, where the ODE solution is matched */
  radius: number;
  /** y = P₋/P₊ of u_in and z = P₊/P₋ of u_out at the matching radius */
  y: C;
  z: C;
  errorIn: number;
  errorOut: number;
  /** rungs (0: the carry did not get past the series radius) */
  steps: number;
  evaluations: number;
}

/**
 * The incoming wave's ratio y = P₋/P₊ carried down the ladder from the series
 * radius, to the innermost radius it reached; the outgoing wave is (P̄₋, P̄₊)
 * of the incoming one (the pair maps to itself under P → (P̄₋, P̄₊) for real
 * ω, μ, λ, and so do the series' leading terms), so its z = P₊/P₋ = ȳ.
 * Null without a rung (the ODE then goes out to the series).
 */
function carryBoth(p: DiracRadialProblem, ladder: number[], uIn: V2, tol: number): CarriedRatios | null {
  if (ladder.length < 2) return null;
  const c = carryFarRatio(p, ladder, cdiv(uIn[1], uIn[0]), tol);
  const k = c.ratios.length - 1;
  const y = c.ratios[k];
  return {
    radius: ladder[k],
    y,
    z: [y[0], -y[1]],
    errorIn: c.errors[k],
    errorOut: c.errors[k],
    steps: k,
    evaluations: c.evaluations,
  };
}

/**
 * A and B from the carried ratios, u_in = e^{L}(1, y), u_out = e^{L'}(z, 1):
 * A = (P₊ − zP₋)/(e^{L}(1 − yz)), B = (P₋ − yP₊)/(e^{L'}(1 − yz)). The phases
 * e^{i Im L} drop out of |A|, |B|; the moduli follow from the conserved
 * current, which the series normalisation fixes at 1 − q² (q = μ/(ω + k∞)):
 * |e^{L}|²(1 − |y|²) = 1 − q² = |e^{L'}|²(1 − |z|²).
 */
function carriedAmplitudes(P: V2, c: CarriedRatios, kInf: number, p: DiracRadialProblem): Amplitudes {
  const { y, z } = c;
  const q = p.mu / (p.omega + kInf);
  const current = (1 - q) * (1 + q);
  const one = csub([1, 0], cmul(y, z));
  const a = csub(P[0], cmul(z, P[1]));
  const b = csub(P[1], cmul(y, P[0]));
  const y2 = cabs(y) ** 2;
  const z2 = cabs(z) ** 2;
  // first-order sensitivity of ln|A| to the errors of y and z
  const perY = cabs(z) / cabs(one) + cabs(y) / (1 - y2);
  const perZ = cabs(P[1]) / cabs(a) + cabs(y) / cabs(one);
  return {
    logAbsIn: Math.log(cabs(a)) - Math.log(cabs(one)) - 0.5 * Math.log(current / (1 - y2)),
    logAbsOut: Math.log(cabs(b)) - Math.log(cabs(one)) - 0.5 * Math.log(current / (1 - z2)),
    carryError: c.errorIn * perY + c.errorOut * perZ,
  };
}
