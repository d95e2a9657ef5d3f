/**
 * The evaporation of a hole of physical mass M₀ and spin a*₀ emitting species
 * with masses, from f(M, a*) and g(M, a*) (massLoss.ts): with u = ln(M₀/M),
 *   d(a*)/du = −a* (g/f − 2),   dt/du = M³/f,   dE_i/du = M P̂_i/f
 * (G = c = ħ = 1; Page, Phys. Rev. D 14, 3260 (1976), with f and g now
 * depending on M through the species' thresholds). E_i is the energy carried
 * away by species i; Σ E_i = M₀ checks the bookkeeping. Integrated with the
 * Cash–Karp Runge–Kutta method until every species is effectively massless
 * (Mμ ≤ 1e-4) and u ≥ 12, then the rest in closed form, M³/(3f); repeated at
 * half the ODE tolerance and the change reported. The final stage (the last τ
 * seconds) starts where the remaining lifetime is τ: the mass then left is
 * all radiated in τ, each species taking its share E_i.
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
import { massToKg, type MassUnit } from '@penumbra/kerr';
import { evolutionTimeUnitSeconds } from './evolution.js';
import { FIELD_MASS_PER_GRAM_GEV, type MassLossRates } from './massLoss.js';
import { GL5, hermite, trackError, type TrackNode } from './trackError.js';
import { odeErrorBound, requireLifetimeConverged } from './odeError.js';
import { requireProblem } from './validate.js';

/** The age of the universe, 13.787 Gyr (Planck 2018 results VI, A&A 641, A6 (2020)), in seconds (Julian years). */
export const AGE_OF_UNIVERSE_SECONDS = 13.787e9 * 365.25 * 86400;

/** GeV per gram of rest mass (m c², CODATA 2018). */
const GEV_PER_GRAM = (1e-3 * 299792458 ** 2) / (1.602176634e-19 * 1e9);

/** A hole of physical mass and spin, and the rates of its content. */
export interface EvaporationProblem {
  /** f(M, a*), g(M, a*) of the content (massLossRates) */
  readonly rates: MassLossRates;
  /** formation mass, in `unit` */
  readonly mass: number;
  readonly unit: MassUnit;
  /** formation a/M, 0 ≤ a* ≤ rates.aMax */
  readonly aStar0: number;
}

/** Options of evaporateHole; unknown keys are refused. */
export interface EvaporationOptions {
  /** relative tolerance of the ODE integrator (default 1e-8, range 1e-12 … 1e-4) */
  odeTol?: number;
  /** report the time at which a* first falls below each of these values, each in (0, 1) */
  aStarThresholds?: readonly number[];
  /** durations τ (seconds) of the final stages to report (default [1]) */
  finalSeconds?: readonly number[];
  /**
   * relative accuracy asked of the lifetime (core's range, 1e-12 … 1e-2; default none:
   * the estimate is reported, not checked): a lifetime whose error estimate
   * (odeError + table error along the track) exceeds it throws ConvergenceError
   */
  tol?: number;
}

/** One point of the track, in physical units. */
export interface EvaporationPoint {
  timeSeconds: number;
  massGrams: number;
  aStar: number;
  /** Hawking temperature k_B T_H in GeV */
  temperatureGeV: number;
}

/** Energy carried away by one species. */
export interface SpeciesEnergy {
  name: string;
  energyGeV: number;
  /** share of the energy of the stage */
  fraction: number;
}

/** The last τ seconds of a hole's life. */
export interface FinalStage {
  /** τ in seconds */
  seconds: number;
  /** true if τ is at least the lifetime: the stage is the whole life */
  wholeLife: boolean;
  /** mass left when τ seconds remain, all of it radiated in τ */
  massGrams: number;
  /** that mass as energy, in GeV and erg */
  energyGeV: number;
  energyErg: number;
  aStar: number;
  temperatureGeV: number;
  /** energy per species over the stage; the energies add up to energyGeV */
  species: SpeciesEnergy[];
  /** relative error estimate of massGrams (and energyGeV) from the table errors of f: (∫_stage ε dt)·f(M_τ)/M_τ³ */
  relError: number;
  /** bound on the error of aStar from the table errors of f and g (0 at formation) */
  aStarError: number;
}

/** How a history was computed; `errorEstimate` bounds the lifetime's relative error (odeError + tableError). */
export interface EvaporationDiagnostics extends Diagnostics {
  /** integrator tolerance of the reported run (half the requested one) */
  odeTol: number;
  /** |lifetime(odeTol) − lifetime(odeTol/2)| / lifetime */
  halvedTolChange: number;
  /** bound on the lifetime's relative ODE error: halvedTolChange + 10 × the requested odeTol (odeError.ts) */
  odeError: number;
  /**
   * relative error of the lifetime from the tables: the local relative error
   * of f (rates.at(M, a*).error), plus that of a* carried into f, averaged over
   * the track with the weight dt (trackError.ts)
   */
  tableError: number;
  /** bound on the error of a* at the end of the integrated track, from the table errors of f and g */
  aStarTableError: number;
  /** u = ln(M₀/M) where the closed-form rest takes over */
  uEnd: number;
}

/** The evaporation history of a hole in physical units. */
export interface Evaporation {
  mass0Grams: number;
  aStar0: number;
  lifetimeSeconds: number;
  /** lifetime / M₀³ in Planck units (t_P (M₀/m_P)³) */
  lifetimeOverMassCubed: number;
  /** the ODE steps, from formation to the start of the closed-form rest */
  track: EvaporationPoint[];
  /** time at which a* first falls below each threshold (atStart: it starts there; reached: false, never before the end) */
  crossings: { aStar: number; timeSeconds: number; atStart: boolean; reached: boolean }[];
  finalStages: FinalStage[];
  /** energy carried away by each species over the whole life */
  species: SpeciesEnergy[];
  /** energy emitted (sum over species) against the mass lost M₀c² */
  energyBalance: { emittedGeV: number; massLostGeV: number; relError: number };
  diagnostics: EvaporationDiagnostics;
}

const METHOD =
  'Cash–Karp Runge–Kutta in u = ln(M₀/M) until every species is effectively massless, closed-form remainder; repeated at half the tolerance';

function positiveList(parameter: string, lo: number, hi: number) {
  return (value: unknown): number[] => {
    if (!Array.isArray(value)) throw new InputError(parameter, `an array of values in (${lo}, ${hi})`, value);
    return value.map((t, i) => {
      const x = requireFinite(`${parameter}[${i}]`, t, `a value in (${lo}, ${hi})`);
      if (!(x > lo && x < hi)) throw new InputError(`${parameter}[${i}]`, `a value in (${lo}, ${hi})`, x);
      return x;
    });
  };
}

const OPTIONS = {
  odeTol: numberIn(1e-12, 1e-4),
  aStarThresholds: positiveList('aStarThresholds', 0, 1),
  finalSeconds: positiveList('finalSeconds', 0, 1e300),
  tol: validateTolerance,
};

function checkRates(value: unknown): MassLossRates {
  const r = value as Partial<MassLossRates> | null;
  if (
    typeof r !== 'object' ||
    r === null ||
    typeof r.at !== 'function' ||
    typeof r.values !== 'function' ||
    typeof r.aMax !== 'number' ||
    !Array.isArray(r.species)
  )
    throw new InputError('rates', 'the result of massLossRates ({ at, f, g, aMax, species, … })', value);
  return r as MassLossRates;
}

/** Hawking temperature of the unit-mass hole with a/M = a (geometric units). */
function unitTemperature(a: number): number {
  const root = Math.sqrt(Math.max(0, 1 - a * a));
  return root / (4 * Math.PI * (1 + root));
}

/** One integration from formation; the state is [a*, t/M₀³, E_1/M₀, …]. */
function integrate(rates: MassLossRates, m0: number, aStar0: number, tol: number, uEnd: number) {
  const n = rates.species.length;
  const counter = { evaluations: 0 };
  const deriv = (dy: Float64Array | number[], y: Float64Array | number[], u: number) => {
    counter.evaluations++;
    const a = Math.max(0, Math.min(y[0], rates.aMax));
    const pt = rates.values(m0 * Math.exp(-u), a);
    if (!(pt.f > 0))
      throw new InputError(
        'rates',
        'a content that emits at every mass the hole passes (f > 0)',
        pt.f,
        `f = 0 at M = ${m0 * Math.exp(-u)} g`,
      );
    dy[0] = -a * (pt.g / pt.f - 2);
    dy[1] = Math.exp(-3 * u) / pt.f;
    const w = Math.exp(-u) / pt.f;
    for (let i = 0; i < n; i++) dy[2 + i] = w * pt.species[i].power;
  };
  const y0 = new Float64Array(2 + n);
  y0[0] = aStar0;
  const node = (u: number, y: ArrayLike<number>): TrackNode => {
    const dy = new Array<number>(2 + n).fill(0);
    const yy = Array.from(y);
    deriv(dy, yy, u);
    return { u, y: yy, dy };
  };
  const nodes: TrackNode[] = [node(0, y0)];
  const integ = ode45(y0, deriv, 0, 1e-3, { tol, dtMaxMag: 0.25, verbose: false });
  let steps = 0;
  while (integ.step(uEnd)) {
    if (++steps > 200000) {
      throw new ConvergenceError('evaporation: too many ODE steps', {
        method: METHOD,
        steps,
        rhsEvaluations: counter.evaluations,
        errorEstimate: Number.POSITIVE_INFINITY,
        message: `stopped after ${steps} steps at u = ${integ.t} (tolerance ${tol})`,
      });
    }
    nodes.push(node(integ.t, integ.y));
  }
  if (integ.t > nodes[nodes.length - 1].u) nodes.push(node(integ.t, integ.y));
  const last = nodes[nodes.length - 1];
  const endPoint = rates.values(m0 * Math.exp(-last.u), Math.max(0, Math.min(last.y[0], rates.aMax)));
  const rest = Math.exp(-3 * last.u) / (3 * endPoint.f);
  const lifetime = last.y[1] + rest;
  // after uEnd f is constant: each species radiates its share of the mass left
  const energies = rates.species.map((_, i) => last.y[2 + i] + (Math.exp(-last.u) * endPoint.species[i].power) / endPoint.f);
  return { nodes, lifetime, rest, energies, endPoint, steps, evaluations: counter.evaluations };
}

type Run = ReturnType<typeof integrate>;

/**
 * Remaining time and per-species energies (units of M₀³ and M₀) from node k's
 * interval fraction s to the end of that interval: ∫ e^{−3u}/f and ∫ e^{−u} P̂_i/f
 * by 5-point Gauss–Legendre, a* from the Hermite interpolant.
 */
function intervalRest(run: Run, rates: MassLossRates, m0: number, k: number, s: number): number[] {
  const p = run.nodes[k];
  const q = run.nodes[k + 1];
  const u0 = p.u + s * (q.u - p.u);
  const half = 0.5 * (q.u - u0);
  const out = new Array<number>(1 + rates.species.length).fill(0);
  for (const [x, w] of GL5) {
    const u = u0 + half * (x + 1);
    const a = Math.max(0, Math.min(hermite(p, q, 0, (u - p.u) / (q.u - p.u)), rates.aMax));
    const pt = rates.values(m0 * Math.exp(-u), a);
    out[0] += (w * half * Math.exp(-3 * u)) / pt.f;
    for (let i = 0; i < rates.species.length; i++) out[1 + i] += (w * half * Math.exp(-u) * pt.species[i].power) / pt.f;
  }
  return out;
}

/** The start of the final stage of length τ̂ (units of M₀³) inside the track, found backwards from the end. */
function backwardStage(run: Run, rates: MassLossRates, m0: number, tauHat: number) {
  const { nodes, endPoint } = run;
  const last = nodes[nodes.length - 1];
  // the closed-form rest after the last node
  let rest = [
    Math.exp(-3 * last.u) / (3 * endPoint.f),
    ...endPoint.species.map((sp) => (Math.exp(-last.u) * sp.power) / endPoint.f),
  ];
  for (let k = nodes.length - 2; k >= 0; k--) {
    const whole = intervalRest(run, rates, m0, k, 0);
    if (rest[0] + whole[0] < tauHat) {
      rest = rest.map((x, i) => x + whole[i]);
      continue;
    }
    let lo = 0;
    let hi = 1;
    for (let it = 0; it < 50; it++) {
      const mid = 0.5 * (lo + hi);
      if (rest[0] + intervalRest(run, rates, m0, k, mid)[0] >= tauHat) lo = mid;
      else hi = mid;
    }
    const s = 0.5 * (lo + hi);
    const part = intervalRest(run, rates, m0, k, s);
    const p = nodes[k];
    const q = nodes[k + 1];
    return {
      u: p.u + s * (q.u - p.u),
      aStar: Math.max(0, hermite(p, q, 0, s)),
      energies: rates.species.map((_, i) => rest[1 + i] + part[1 + i]),
      k,
      s,
      /** share of step k's time after the stage's start */
      fraction: whole[0] > 0 ? part[0] / whole[0] : 0,
    };
  }
  return { u: 0, aStar: nodes[0].y[0], energies: run.energies, k: nodes.length, s: 0, fraction: 0 };
}

/** The first point where component k, decreasing (sign −1) or increasing (+1), passes `target`; null if never. */
function locate(run: Run, k: number, target: number, sign: 1 | -1): { p: TrackNode; q: TrackNode; s: number } | null {
  const { nodes } = run;
  for (let i = 1; i < nodes.length; i++) {
    if (sign * (nodes[i].y[k] - target) >= 0) {
      const p = nodes[i - 1];
      const q = nodes[i];
      let lo = 0;
      let hi = 1;
      for (let it = 0; it < 60; it++) {
        const mid = 0.5 * (lo + hi);
        if (sign * (hermite(p, q, k, mid) - target) < 0) lo = mid;
        else hi = mid;
      }
      return { p, q, s: 0.5 * (lo + hi) };
    }
  }
  return null;
}

/** uEnd: every species effectively massless (Mμ ≤ 1e-4) and u ≥ 12, at most u = 700. */
function endOfIntegration(rates: MassLossRates, m0: number): number {
  const heaviest = rates.heaviestMassGeV;
  if (!(heaviest > 0)) return 12;
  const below = 1e-4 / (heaviest * FIELD_MASS_PER_GRAM_GEV);
  return Math.min(700, Math.max(12, Math.log(m0 / below) + 0.5));
}

/**
 * The evaporation of a hole from formation (mass and a*) to the end, for a
 * content with massive species: lifetime, the track of M, a*, T_H against
 * time, the times a* falls below given values, the final stages (the last τ
 * seconds: mass and energy released, per species) and the energy balance.
 * Throws InputError for a bad problem or option, ConvergenceError if the
 * lifetime moves when the ODE tolerance is halved or its error estimate
 * exceeds `tol`.
 *
 * @example evaporateHole({ rates: massLossRates({ species }), mass: 1e15, unit: 'g', aStar0: 0.5 })
 */
export function evaporateHole(problem: EvaporationProblem, options?: EvaporationOptions): Evaporation {
  const p = requireProblem(problem, ['rates', 'mass', 'unit', 'aStar0']);
  const rates = checkRates(p.rates);
  const unit = p.unit as MassUnit;
  const unitSeconds = evolutionTimeUnitSeconds(p.mass as number, unit);
  const m0 = massToKg(p.mass as number, unit) * 1e3;
  const aStar0 = p.aStar0;
  if (typeof aStar0 !== 'number' || !Number.isFinite(aStar0) || aStar0 < 0 || aStar0 > rates.aMax)
    throw new InputError('aStar0', `0 ≤ a* ≤ ${rates.aMax} (the range of the rate tables)`, aStar0);
  const { odeTol = 1e-8, aStarThresholds = [], finalSeconds = [1], tol } = validateOptions<EvaporationOptions>(options, OPTIONS);
  const uEnd = endOfIntegration(rates, m0);
  const a = integrate(rates, m0, aStar0, odeTol, uEnd);
  const b = integrate(rates, m0, aStar0, odeTol / 2, uEnd);
  const change = Math.abs(a.lifetime - b.lifetime) / b.lifetime;
  const odeError = odeErrorBound(change, odeTol);
  const track = trackError(b.nodes, rates, m0, b.rest);
  const tableError = track.total / b.lifetime;
  const aStarTableError = track.aStar[track.aStar.length - 1];
  const diagnostics: EvaporationDiagnostics = {
    method: METHOD,
    steps: b.steps,
    rhsEvaluations: a.evaluations + b.evaluations,
    errorEstimate: odeError + tableError,
    message: `lifetime moves by ${change.toExponential(2)} when the ODE tolerance is halved (ODE error bound ${odeError.toExponential(2)}); f, g table error along the track ${tableError.toExponential(2)}`,
    odeTol: odeTol / 2,
    halvedTolChange: change,
    odeError,
    tableError,
    aStarTableError,
    uEnd,
  };
  requireLifetimeConverged('evaporation', diagnostics, odeTol, { coarse: a.lifetime, fine: b.lifetime }, tol);
  const temperatureGeV = (massGrams: number, aStar: number) => unitTemperature(aStar) / (massGrams * FIELD_MASS_PER_GRAM_GEV);
  const point = (u: number, y: readonly number[]): EvaporationPoint => {
    const massGrams = m0 * Math.exp(-u);
    const aStar = Math.max(0, y[0]);
    return { timeSeconds: y[1] * unitSeconds, massGrams, aStar, temperatureGeV: temperatureGeV(massGrams, aStar) };
  };
  const crossings = aStarThresholds.map((t) => {
    if (aStar0 <= t) return { aStar: t, timeSeconds: 0, atStart: true, reached: true };
    const c = locate(b, 0, t, -1);
    return c === null
      ? { aStar: t, timeSeconds: b.lifetime * unitSeconds, atStart: false, reached: false }
      : { aStar: t, timeSeconds: hermite(c.p, c.q, 1, c.s) * unitSeconds, atStart: false, reached: true };
  });
  const total = b.energies.reduce((s, e) => s + e, 0);
  const shares = (energies: readonly number[], scaleGeV: number): SpeciesEnergy[] => {
    const sum = energies.reduce((s, e) => s + e, 0);
    return rates.species.map((s, i) => ({
      name: s.name,
      energyGeV: energies[i] * scaleGeV,
      fraction: sum > 0 ? energies[i] / sum : 0,
    }));
  };
  const m0GeV = m0 * GEV_PER_GRAM;
  const finalStages = finalSeconds.map((tau): FinalStage => {
    const tauHat = tau / unitSeconds;
    const last = b.nodes[b.nodes.length - 1];
    let u: number;
    let aStar: number;
    let energies: number[];
    // ∫ ε dt̂ over the stage and the a* error at its start
    let stageError = 0;
    let aStarError = 0;
    if (tauHat >= b.lifetime) {
      u = 0;
      aStar = aStar0;
      energies = b.energies;
    } else if (b.lifetime - last.y[1] <= tauHat) {
      // τ reaches back into the integrated track: remaining time and energies integrated backwards
      // from the end (no cancellation against the lifetime, which a 1 s stage of a 1e17 s life would need)
      const stage = backwardStage(b, rates, m0, tauHat);
      u = stage.u;
      aStar = stage.aStar;
      energies = stage.energies;
      // the error integral from the stage's start: the rest of its step (by the share of the step's time) and the steps after it
      stageError = stage.k + 1 < b.nodes.length ? track.toEnd[stage.k + 1] + stage.fraction * track.steps[stage.k] : track.total;
      if (stage.k + 1 < b.nodes.length) {
        const A0 = track.aStar[stage.k];
        aStarError = A0 + stage.s * (track.aStar[stage.k + 1] - A0);
      }
    } else {
      // inside the closed-form rest: every species effectively massless, a* frozen
      const f = b.endPoint.f;
      u = -Math.log(Math.cbrt(3 * f * tauHat));
      aStar = Math.max(0, last.y[0]);
      energies = b.endPoint.species.map((s) => (Math.exp(-u) * s.power) / f);
      stageError = tauHat * track.endRate;
      aStarError = track.aStar[track.aStar.length - 1];
    }
    const massGrams = m0 * Math.exp(-u);
    // δM_τ/M_τ = δR/(M_τ R'(M_τ)) with R the time left, R' = M²/f (units of M₀)
    const relError =
      stageError > 0 ? (stageError * rates.values(massGrams, Math.min(aStar, rates.aMax)).f) / Math.exp(-3 * u) : 0;
    const energyGeV = massGrams * GEV_PER_GRAM;
    return {
      seconds: tau,
      wholeLife: tauHat >= b.lifetime,
      massGrams,
      energyGeV,
      energyErg: massGrams * 29979245800 ** 2,
      aStar,
      temperatureGeV: temperatureGeV(massGrams, aStar),
      species: shares(energies, m0GeV),
      relError,
      aStarError,
    };
  });
  return {
    mass0Grams: m0,
    aStar0,
    lifetimeSeconds: b.lifetime * unitSeconds,
    lifetimeOverMassCubed: b.lifetime,
    track: b.nodes.map((nd) => point(nd.u, nd.y)),
    crossings,
    finalStages,
    species: shares(b.energies, m0GeV),
    energyBalance: { emittedGeV: total * m0GeV, massLostGeV: m0GeV, relError: Math.abs(total - 1) },
    diagnostics,
  };
}

/** The mass whose lifetime is a given time, with the lifetime reached and how it was found. */
export interface MassForLifetime {
  massGrams: number;
  aStar0: number;
  lifetimeSeconds: number;
  /** bisection steps in ln M */
  iterations: number;
  /**
   * relative error of the mass: the lifetime's error estimate (ODE + tables along
   * the track) / 3 (τ grows at least as M₀³), the bisection width, and the miss
   * |ln(lifetime reached / lifetime wanted)| / 3
   */
  relError: number;
  /** the final run's diagnostics (evaporateHole at the mass found) */
  diagnostics: EvaporationDiagnostics;
}

/** A content's rates, a lifetime and the formation a*. */
export interface MassForLifetimeProblem {
  readonly rates: MassLossRates;
  /** the lifetime wanted, in seconds (default: the age of the universe, AGE_OF_UNIVERSE_SECONDS) */
  readonly seconds?: number;
  /** formation a* (default 0) */
  readonly aStar0?: number;
}

/** Options of massForLifetime; unknown keys are refused. */
export interface MassForLifetimeOptions {
  /** relative tolerance of the final run's ODE integrator (default 1e-8, range 1e-12 … 1e-4); the bisection runs at 10× it */
  odeTol?: number;
  /**
   * relative accuracy asked of the mass (core's range, 1e-12 … 1e-2; default
   * none: the estimate is reported, not checked): a mass whose relError exceeds
   * it throws ConvergenceError
   */
  tol?: number;
}

const MASS_FOR_LIFETIME_OPTIONS = { odeTol: numberIn(1e-12, 1e-4), tol: validateTolerance };

/**
 * The formation mass whose lifetime equals `seconds` (by default the age of
 * the universe, 13.787 Gyr) for a content: bisection in ln M on the lifetime
 * of evaporateHole, bracketed by the lifetimes with the lightest and the full
 * content. Throws InputError for a bad problem or option, ConvergenceError if
 * the final run's lifetime moves when the ODE tolerance is halved or the
 * mass's error estimate exceeds `tol`.
 *
 * @example massForLifetime({ rates: massLossRates({ species }) }, { tol: 1e-3 }).massGrams
 */
export function massForLifetime(problem: MassForLifetimeProblem, options?: MassForLifetimeOptions): MassForLifetime {
  const p = requireProblem(problem, ['rates', 'seconds', 'aStar0']);
  const rates = checkRates(p.rates);
  const seconds =
    p.seconds === undefined ? AGE_OF_UNIVERSE_SECONDS : requireFinite('seconds', p.seconds, 'a time in seconds > 0');
  if (!(seconds > 1e-30 && seconds < 1e100)) throw new InputError('seconds', 'a time from 1e-30 to 1e100 s', seconds);
  const aStar0 = p.aStar0 === undefined ? 0 : requireFinite('aStar0', p.aStar0);
  if (!(aStar0 >= 0 && aStar0 <= rates.aMax)) throw new InputError('aStar0', `0 ≤ a* ≤ ${rates.aMax}`, aStar0);
  const { odeTol = 1e-8, tol } = validateOptions<MassForLifetimeOptions>(options, MASS_FOR_LIFETIME_OPTIONS);
  const bisectionOdeTol = Math.min(1e-4, 10 * odeTol);
  const lifetimeSeconds = (massGrams: number) =>
    integrate(rates, massGrams, aStar0, bisectionOdeTol, endOfIntegration(rates, massGrams)).lifetime *
    evolutionTimeUnitSeconds(massGrams, 'g');
  // t = M³/(3f) with f between its values for the full content (small M) and the massless part (large M)
  const tUnit = evolutionTimeUnitSeconds(1, 'g');
  const fLow = rates.f(1e-3, 0);
  const fHigh = rates.f(1e40, 0);
  let lo = Math.log(Math.cbrt((3 * Math.min(fLow, fHigh) * seconds) / tUnit) / 2);
  let hi = Math.log(Math.cbrt((3 * Math.max(fLow, fHigh) * seconds) / tUnit) * 2);
  // the bracket in ln M: 1e-7, or a tenth of tol when that is asked for
  const width = Math.max(1e-13, Math.min(1e-7, tol === undefined ? 1 : tol / 10));
  let iterations = 0;
  while (hi - lo > width && iterations < 100) {
    const mid = 0.5 * (lo + hi);
    if (lifetimeSeconds(Math.exp(mid)) < seconds) lo = mid;
    else hi = mid;
    iterations++;
  }
  const massGrams = Math.exp(0.5 * (lo + hi));
  const ev = evaporateHole({ rates, mass: massGrams, unit: 'g', aStar0 }, { finalSeconds: [], odeTol });
  // δM₀/M₀ = (δτ/τ)/(d ln τ/d ln M₀) with d ln τ/d ln M₀ = M₀³/(f₀ τ) ≥ 3 where f does not fall as the hole
  // gets lighter (τ ≤ M₀³/(3 f₀)); the bisection width and the miss of the final run (its ODE tolerance
  // differs from the bisection's) on top
  const miss = Math.abs(Math.log(ev.lifetimeSeconds / seconds)) / 3;
  const relError = ev.diagnostics.errorEstimate / 3 + (hi - lo) + miss;
  if (tol !== undefined && !(relError <= tol)) {
    throw new ConvergenceError(`massForLifetime: the mass's error estimate exceeds tol = ${tol}`, {
      ...ev.diagnostics,
      errorEstimate: relError,
      message: `mass ${massGrams} g: lifetime error ${ev.diagnostics.errorEstimate.toExponential(2)} (/3), bisection width ${(hi - lo).toExponential(2)}, miss ${miss.toExponential(2)}`,
      massGrams,
      lifetimeErrorEstimate: ev.diagnostics.errorEstimate,
      tol,
    });
  }
  return { massGrams, aStar0, lifetimeSeconds: ev.lifetimeSeconds, iterations, relError, diagnostics: ev.diagnostics };
}
