/**
 * The time-integrated spectrum of a final stage (the last τ seconds of a
 * hole, evaporation.ts), per species: dN_i/dE = ∫ d²N_i/(dt dE) dt over the
 * stage. With M the mass at time t and x = G M E/(ħ c³) (= Mω), the per-dof
 * rate is d²N/(dt dE) = n̂_s(x)/ħ (scale-free) and dt = G² M² dM/(ħ c⁴ f(M)),
 * so with M = s M_τ:
 *   dN_i/dE = dof_i · G² M_τ³/(ħ² c⁴) · ∫_0^1 n̂_s(s x_τ) s²/f(s M_τ) ds,  x_τ = G M_τ E/(ħ c³).
 * Approximations (named in the result): a* is held at its value at the start
 * of the stage (the stage of a hole that has spun down has a* ≈ 0), and a
 * massive species has the massless per-dof spectrum above its threshold
 * E > m (its Mμ along the stage is at most the value reported; the exact
 * massive Γ differs by O((Mμ)²) there). n̂_s comes from emissionSpectrum on a
 * log grid of x, extended below it as a power law.
 */
import { CODATA2018 } from '@penumbra/kerr';
import {
  InputError,
  isFunction,
  numberIn,
  requireFinite,
  validateOptions,
  validateTolerance,
  type Diagnostics,
  type FieldSpin,
} from '@penumbra/core';
import { localCubic } from './localCubic.js';
import { FIELD_MASS_PER_GRAM_GEV, type MassLossRates } from './massLoss.js';
import { emissionSpectrum } from './spectrum.js';
import { requireProblem } from './validate.js';

/** A final stage (mass and a* at its start), the content's rates and the energies wanted. */
export interface BurstSpectrumProblem {
  readonly rates: MassLossRates;
  /** the stage: its starting mass (grams) and a*, e.g. an element of evaporateHole(...).finalStages */
  readonly stage: { readonly massGrams: number; readonly aStar: number };
  /** energies E in GeV, increasing */
  readonly energiesGeV: readonly number[];
}

/** Options of burstSpectrum; unknown keys are refused. */
export interface BurstSpectrumOptions {
  /** relative accuracy of the per-dof spectra (default 1e-3, range 1e-12 … 1e-2) */
  tol?: number;
  /** points of the x = Mω grid of each per-dof spectrum (default 64, 12 … 400) */
  points?: number;
  /** called after each field spin's spectrum */
  onSpin?: (spin: FieldSpin, done: number, total: number) => void;
}

/** How the spectrum was computed; `errorEstimate` is the largest relative error of the per-dof spectra. */
export interface BurstSpectrumDiagnostics extends Diagnostics {
  /** greybody solves */
  gammaCalls: number;
  /** the approximations made (a* held fixed, massless shape above threshold) */
  approximation: string;
  /** the largest Mμ of any species at the start of the stage (the massless shape's error is O((Mμ)²)) */
  largestFieldMass: number;
}

/** dN/dE of each species over a final stage. */
export interface BurstSpectrum {
  energiesGeV: number[];
  /** per species: dN/dE in GeV⁻¹ at each energy (0 at and below the species' mass) */
  species: { name: string; perGeV: number[] }[];
  /** sum over species, GeV⁻¹ */
  totalPerGeV: number[];
  diagnostics: BurstSpectrumDiagnostics;
}

const OPTIONS = {
  tol: validateTolerance,
  points: numberIn(12, 400, true),
  onSpin: isFunction<(spin: FieldSpin, done: number, total: number) => void>,
};

const APPROXIMATION =
  'a* held at its value at the start of the stage; massive species with the massless per-dof spectrum above their threshold E > m';

function checkEnergies(value: unknown): number[] {
  if (!Array.isArray(value) || value.length === 0)
    throw new InputError('energiesGeV', 'a non-empty increasing list of energies > 0 (GeV)', value);
  return value.map((e, i) => {
    const x = requireFinite(`energiesGeV[${i}]`, e, 'an energy > 0 in GeV');
    if (!(x > 0 && x < 1e30)) throw new InputError(`energiesGeV[${i}]`, 'an energy from 0 to 1e30 GeV', x);
    if (i > 0 && !(x > (value[i - 1] as number))) throw new InputError(`energiesGeV[${i}]`, `a value > energiesGeV[${i - 1}]`, x);
    return x;
  });
}

/** Hawking temperature and Ω_H of the unit-mass hole with a/M = a. */
function unitHole(a: number): { T: number; omegaH: number } {
  const root = Math.sqrt(Math.max(0, 1 - a * a));
  return { T: root / (4 * Math.PI * (1 + root)), omegaH: a / (2 * (1 + root)) };
}

/**
 * The time-integrated spectrum dN/dE (GeV⁻¹) of each species over a final
 * stage, under the approximations named in its diagnostics. One
 * emissionSpectrum per field spin in the content (seconds to a minute).
 * Throws InputError for a bad problem or option, ConvergenceError as
 * emissionSpectrum.
 *
 * @example burstSpectrum({ rates, stage: evaporateHole({ rates, mass: 1e15, unit: 'g', aStar0: 0 }).finalStages[0], energiesGeV: [10, 100, 1000] })
 */
export function burstSpectrum(problem: BurstSpectrumProblem, options?: BurstSpectrumOptions): BurstSpectrum {
  const p = requireProblem(problem, ['rates', 'stage', 'energiesGeV']);
  const rates = p.rates as MassLossRates;
  if (typeof rates !== 'object' || rates === null || typeof rates.at !== 'function' || !Array.isArray(rates.species))
    throw new InputError('rates', 'the result of massLossRates', rates);
  const stage = p.stage as { massGrams: number; aStar: number };
  if (typeof stage !== 'object' || stage === null) throw new InputError('stage', '{ massGrams, aStar }', stage);
  const massGrams = requireFinite('stage.massGrams', stage.massGrams, 'a mass in grams > 0');
  if (!(massGrams > 0 && massGrams < 1e60)) throw new InputError('stage.massGrams', 'a mass in grams from 0 to 1e60', massGrams);
  const aStar = requireFinite('stage.aStar', stage.aStar);
  if (!(aStar >= 0 && aStar <= rates.aMax)) throw new InputError('stage.aStar', `0 ≤ a* ≤ ${rates.aMax}`, aStar);
  const energies = checkEnergies(p.energiesGeV);
  const { tol = 1e-3, points = 64, onSpin } = validateOptions<BurstSpectrumOptions>(options, OPTIONS);

  // per-dof spectra n̂_s(x) of the spins present, as ln n̂ against ln x
  const { T, omegaH } = unitHole(aStar);
  const xMin = 1e-3;
  const xMax = Math.min(30, 40 * T + 3 * omegaH + 0.2);
  const spins = [...new Set(rates.species.map((s) => s.spin))];
  let gammaCalls = 0;
  let steps = 0;
  let rhsEvaluations = 0;
  let errorEstimate = 0;
  const lnX = Array.from({ length: points }, (_, i) => Math.log(xMin) + (i * Math.log(xMax / xMin)) / (points - 1));
  const shapes = new Map<FieldSpin, number[]>();
  spins.forEach((spin, k) => {
    const s = emissionSpectrum({ hole: { a: aStar }, field: { spin }, grid: lnX.map(Math.exp) }, { tol });
    gammaCalls += s.diagnostics.gammaCalls;
    steps += s.diagnostics.steps;
    rhsEvaluations += s.diagnostics.rhsEvaluations;
    errorEstimate = Math.max(errorEstimate, s.diagnostics.errorEstimate);
    shapes.set(
      spin,
      s.points.map((pt) => Math.log(Math.max(pt.number, 1e-300))),
    );
    onSpin?.(spin, k + 1, spins.length);
  });
  const lnShape = (ln: number[], lx: number) => {
    if (lx <= lnX[0]) return ln[0] + ((ln[1] - ln[0]) / (lnX[1] - lnX[0])) * (lx - lnX[0]);
    if (lx >= lnX[points - 1]) return Number.NEGATIVE_INFINITY;
    return localCubic(lnX, ln, lx);
  };
  // f(s M_τ) on a grid of ln s, linear in between (f is smooth and bounded by its limits)
  const lnS = Array.from({ length: 201 }, (_, i) => -30 + (30 * i) / 200);
  const fS = lnS.map((l) => rates.f(massGrams * Math.exp(l), aStar));
  const fAt = (l: number) => {
    const t = Math.max(0, Math.min(200, ((l + 30) * 200) / 30));
    const i = Math.min(199, Math.floor(t));
    return fS[i] + (t - i) * (fS[i + 1] - fS[i]);
  };
  const { G, hbar, c, eV } = CODATA2018;
  const kg = massGrams * 1e-3;
  const scale = ((G * G * kg ** 3) / (hbar * hbar * c ** 4)) * eV * 1e9;
  const intervals = 600;
  const perDof = (spin: FieldSpin, e: number): number => {
    const xTau = e * massGrams * FIELD_MASS_PER_GRAM_GEV;
    const ln = shapes.get(spin)!;
    const top = Math.min(Math.log(xTau), lnX[points - 1]);
    const bottom = top - 30;
    const h = (top - bottom) / intervals;
    let sum = 0;
    for (let i = 0; i <= intervals; i++) {
      const lx = bottom + i * h;
      const w = i === 0 || i === intervals ? 1 : i % 2 === 1 ? 4 : 2;
      // integrand in ln x: n̂(x) x³ /(x_τ³ f(M_τ x/x_τ))
      sum += (w * Math.exp(lnShape(ln, lx) + 3 * (lx - Math.log(xTau)))) / fAt(lx - Math.log(xTau));
    }
    return (scale * sum * h) / 3;
  };
  const rows = rates.species.map((s) => ({
    name: s.name,
    perGeV: energies.map((e) => (e > s.massGeV ? s.dof * perDof(s.spin, e) : 0)),
  }));
  const totalPerGeV = energies.map((_, j) => rows.reduce((t, r) => t + r.perGeV[j], 0));
  const largestFieldMass = Math.max(...rates.species.map((s) => s.massGeV * massGrams * FIELD_MASS_PER_GRAM_GEV));
  return {
    energiesGeV: energies,
    species: rows,
    totalPerGeV,
    diagnostics: {
      method: 'per-dof spectra n̂(x) on a log grid, integrated over the stage in ln x (Simpson) with f(M) of the content',
      steps,
      rhsEvaluations,
      errorEstimate,
      message: `${spins.length} field spin(s), ${points} points each; largest Mμ at the start of the stage ${largestFieldMass.toExponential(2)}`,
      gammaCalls,
      approximation: APPROXIMATION,
      largestFieldMass,
    },
  };
}
