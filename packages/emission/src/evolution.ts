/**
 * Evaporation history of a hole from Page's f and g (Phys. Rev. D 14, 3260
 * (1976)): dM/dt = −f(a*)/M², dJ/dt = −g(a*)·a* / M, hence
 *   d ln a* / d ln M = g/f − 2,   dt/d ln M = −M³/f.
 * Integrated in u = ln(M₀/M) ∈ [0, 12] with the Cash–Karp Runge–Kutta method
 * (ode45-cash-karp); after u = 12 (M/M₀ ≈ 6e-6) the remaining time
 * M³/(3 f(a*)) is added in closed form. Time is in units of M₀³ (Planck units,
 * G = c = ħ = 1); the run is repeated at half the ODE tolerance and the
 * difference reported (and bounded).
 */
import ode45 from 'ode45-cash-karp';
import {
  ConvergenceError,
  InputError,
  numberIn,
  requireFinite,
  validateOptions,
  validateTolerance,
  type Diagnostics,
} from '@penumbra/core';
import { CODATA2018, PHYSICAL_MASS_RANGE_KG, requirePhysicalMass, unitScales, type MassUnit } from '@penumbra/kerr';
import type { PageFunctions } from './pageFunctions.js';
import { odeErrorBound, requireLifetimeConverged } from './odeError.js';
import { requireProblem } from './validate.js';

/** A hole's initial a* and the f, g that drive its evaporation. */
export interface EvolutionProblem {
  /** f(a*), g(a*) of the content (from pageFunctions) */
  readonly functions: PageFunctions;
  /** initial a/M, 0 ≤ a* ≤ the table's largest a* */
  readonly aStar0: number;
}

/** One point of an evaporation track. */
export interface TrackPoint {
  /** M/M₀ */
  massRatio: number;
  aStar: number;
  /** time since the start, in units of M₀³ (Planck units) */
  time: number;
}

/** Options of evolveHole; unknown keys are refused. */
export interface EvolutionOptions {
  /**
   * relative tolerance of the ODE integrator (default 1e-8, range 1e-12 … 1e-4):
   * an integrator setting, not an accuracy request, so its range stops where
   * halving it no longer checks anything
   */
  odeTol?: number;
  /** report the time at which a* first falls below each of these values, each in (0, 1) */
  aStarThresholds?: readonly number[];
  /**
   * relative accuracy asked of the lifetime (core's range, 1e-12 … 1e-2; default
   * none: the estimate is reported, not checked): a lifetime whose error estimate
   * (odeError + tableError) exceeds it throws ConvergenceError
   */
  tol?: number;
}

/** How a history was computed; `errorEstimate` bounds the lifetime's relative error (odeError + tableError). */
export interface EvolutionDiagnostics extends Diagnostics {
  /** the integrator tolerance of the reported run (half the requested one) */
  odeTol: number;
  /** |lifetime(odeTol) − lifetime(odeTol/2)| / lifetime */
  halvedTolChange: number;
  /** bound on the lifetime's relative ODE error: halvedTolChange + 10 × the requested odeTol (odeError.ts) */
  odeError: number;
  /** relative error of f and g from the table (node + interpolation), propagated 1:1 to the lifetime */
  tableError: number;
}

/** The evaporation history of a hole. */
export interface Evolution {
  aStar0: number;
  /** lifetime in units of M₀³ (Planck units); multiply by M₀³ */
  lifetime: number;
  track: TrackPoint[];
  /**
   * time (units of M₀³) at which a* first falls below each threshold. A
   * threshold at or above aStar0 is no milestone: time 0 with `atStart: true`
   * (a* starts at or below it). A threshold a* never falls below before the
   * end has `reached: false` and the lifetime as its time.
   */
  crossings: { aStar: number; time: number; atStart: boolean; reached: boolean }[];
  diagnostics: EvolutionDiagnostics;
}

const METHOD = 'Cash–Karp Runge–Kutta in u = ln(M₀/M) to u = 12, closed-form remainder; repeated at half the tolerance';

function thresholds(value: unknown, parameter: string): number[] {
  if (!Array.isArray(value)) throw new InputError(parameter, 'an array of values in (0, 1)', value);
  return value.map((t, i) => {
    const x = requireFinite(`${parameter}[${i}]`, t, 'a value in (0, 1)');
    if (!(x > 0 && x < 1)) throw new InputError(`${parameter}[${i}]`, 'a value in (0, 1)', x);
    return x;
  });
}

const OPTIONS = { odeTol: numberIn(1e-12, 1e-4), aStarThresholds: thresholds, tol: validateTolerance };

function checkFunctions(value: unknown): PageFunctions {
  const fns = value as Partial<PageFunctions> | null;
  if (
    typeof fns !== 'object' ||
    fns === null ||
    typeof fns.f !== 'function' ||
    typeof fns.g !== 'function' ||
    typeof fns.aMax !== 'number'
  ) {
    throw new InputError('functions', 'the result of pageFunctions ({ f, g, aMax, … })', value);
  }
  return fns as PageFunctions;
}

const U_END = 12;

function run(fns: PageFunctions, aStar0: number, tol: number) {
  const y = new Float64Array([aStar0, 0]);
  const counter = { evaluations: 0 };
  const deriv = (dy: Float64Array | number[], yy: Float64Array | number[], u: number) => {
    counter.evaluations++;
    const a = Math.max(0, Math.min(yy[0], fns.aMax));
    const f = fns.f(a);
    dy[0] = -a * (fns.g(a) / f - 2);
    dy[1] = Math.exp(-3 * u) / f;
  };
  const integ = ode45(y, deriv, 0, 1e-3, { tol, dtMaxMag: 0.25, verbose: false });
  const track: TrackPoint[] = [{ massRatio: 1, aStar: aStar0, time: 0 }];
  const us: number[] = [0];
  let steps = 0;
  while (integ.step(U_END)) {
    if (++steps > 100000) {
      throw new ConvergenceError('evolution: too many ODE steps', {
        method: METHOD,
        steps,
        rhsEvaluations: counter.evaluations,
        errorEstimate: Infinity,
        message: `stopped after ${steps} steps at u = ${integ.t} (tolerance ${tol})`,
        u: integ.t,
        tol,
      });
    }
    track.push({ massRatio: Math.exp(-integ.t), aStar: integ.y[0], time: integ.y[1] });
    us.push(integ.t);
  }
  if (integ.t > us[us.length - 1]) {
    track.push({ massRatio: Math.exp(-integ.t), aStar: integ.y[0], time: integ.y[1] });
    us.push(integ.t);
  }
  const last = track[track.length - 1];
  const a = Math.max(0, last.aStar);
  const lifetime = last.time + Math.exp(-3 * U_END) / (3 * fns.f(a));
  track.push({ massRatio: 0, aStar: 0, time: lifetime });
  return { lifetime, track, us, steps, deriv, counter };
}

/**
 * Time at which a* first falls below `target`, by Hermite interpolation in u
 * between steps. A target at or above the starting a* gives 0: the hole starts
 * there, and the first step would otherwise be read as a crossing.
 */
function crossing(r: ReturnType<typeof run>, target: number): number {
  const { track, us, deriv } = r;
  if (track[0].aStar <= target) return 0;
  for (let i = 1; i < us.length; i++) {
    if (track[i].aStar < target) {
      const u0 = us[i - 1];
      const u1 = us[i];
      const p0 = track[i - 1];
      const p1 = track[i];
      const d0 = [0, 0];
      const d1 = [0, 0];
      deriv(d0, [p0.aStar, p0.time], u0);
      deriv(d1, [p1.aStar, p1.time], u1);
      const h = u1 - u0;
      const herm = (s: number, y0: number, y1: number, m0: number, m1: number) => {
        const s2 = s * s;
        const s3 = s2 * s;
        return (2 * s3 - 3 * s2 + 1) * y0 + (s3 - 2 * s2 + s) * h * m0 + (-2 * s3 + 3 * s2) * y1 + (s3 - s2) * h * m1;
      };
      let lo = 0;
      let hi = 1;
      for (let it = 0; it < 60; it++) {
        const mid = 0.5 * (lo + hi);
        if (herm(mid, p0.aStar, p1.aStar, d0[0], d1[0]) >= target) lo = mid;
        else hi = mid;
      }
      return herm(0.5 * (lo + hi), p0.time, p1.time, d0[1], d1[1]);
    }
  }
  return Number.NaN;
}

/**
 * The evaporation history of a hole from Page's f and g: lifetime (units of
 * M₀³), the track a*(M/M₀) and the times a* falls below given values. Throws
 * InputError for a bad problem or option, ConvergenceError if the lifetime
 * moves when the ODE tolerance is halved or its error estimate exceeds `tol`.
 *
 * @example evolveHole({ functions: pageFunctions({ table: bundledPageTable() }), aStar0: 0.9 }, { aStarThresholds: [0.1] })
 */
export function evolveHole(problem: EvolutionProblem, options?: EvolutionOptions): Evolution {
  const p = requireProblem(problem, ['functions', 'aStar0']);
  const fns = checkFunctions(p.functions);
  const aStar0 = p.aStar0;
  if (typeof aStar0 !== 'number' || !Number.isFinite(aStar0) || aStar0 < 0 || aStar0 > fns.aMax) {
    throw new InputError('aStar0', `0 ≤ a* ≤ ${fns.aMax} (the range of the f, g table)`, aStar0);
  }
  const { odeTol = 1e-8, aStarThresholds = [], tol } = validateOptions<EvolutionOptions>(options, OPTIONS);
  const a = run(fns, aStar0, odeTol);
  const b = run(fns, aStar0, odeTol / 2);
  const change = Math.abs(a.lifetime - b.lifetime) / b.lifetime;
  const odeError = odeErrorBound(change, odeTol);
  const tableError = Math.max(fns.interpolationError.f + fns.nodeError.f, fns.interpolationError.g + fns.nodeError.g);
  const crossings = aStarThresholds.map((t) => {
    const time = crossing(b, t);
    // never below t before the end: report the end of the track, flagged, not NaN
    return Number.isNaN(time)
      ? { aStar: t, time: b.lifetime, atStart: false, reached: false }
      : { aStar: t, time, atStart: aStar0 <= t, reached: true };
  });
  const diagnostics: EvolutionDiagnostics = {
    method: METHOD,
    steps: b.steps,
    rhsEvaluations: a.counter.evaluations + b.counter.evaluations,
    errorEstimate: odeError + tableError,
    message: `lifetime moves by ${change.toExponential(2)} when the ODE tolerance is halved (ODE error bound ${odeError.toExponential(2)}); f, g table error ${tableError.toExponential(2)}`,
    odeTol: odeTol / 2,
    halvedTolChange: change,
    odeError,
    tableError,
  };
  requireLifetimeConverged('evolution', diagnostics, odeTol, { coarse: a.lifetime, fine: b.lifetime }, tol);
  return { aStar0, lifetime: b.lifetime, track: b.track, crossings, diagnostics };
}

/**
 * Seconds per unit of `lifetime` for an initial mass: t = τ̂ G²M₀³/(ħc⁴)
 * (Planck time × (M₀/m_P)³).
 */
export function evolutionTimeUnitSeconds(mass: number, unit: MassUnit): number {
  // t ∝ M³: below about 1e-90 kg the time unit leaves the normal double range
  const kg = requirePhysicalMass(
    mass,
    unit,
    { min: 1e-90, max: PHYSICAL_MASS_RANGE_KG.max },
    'outside it the time unit G²M³/(ħc⁴) leaves the normal double range',
  );
  const u = unitScales(kg);
  // t_M × (M/m_P)² with (M/m_P)² = G M²/(ħ c) = M c² t_M/ħ
  return (u.second * kg * CODATA2018.c ** 2 * u.second) / CODATA2018.hbar;
}
