/**
 * Absorption cross-section σ(ω) = (π/k∞²) Σ_{l,m} Γ_{slm}(ω), the partial-wave
 * sum over all modes of one helicity, k∞ = √(ω² − μ²) the wavenumber at
 * infinity (= ω when massless; the s = 0 low-frequency limit σ → A_H is
 * Das, Gibbons & Mathur, Phys. Rev. Lett. 78, 417 (1997)). A massive Dirac
 * field averages the two signs of κ, a massive vector its three
 * polarisations (the l = 0 monopole included), so σ is per spin state.
 *
 * l-truncation rule: sum whole l-shells (all m) from l = s upward; stop once
 * l exceeds the geometric-optics cut ω·b_max (b_max = 5M bounds the capture
 * impact parameter of every Kerr hole, 3√3 M at a = 0) and the shell
 * contributions have fallen for two shells in a row below tol·|σ|. Beyond the
 * barrier Γ falls geometrically in l, so the dropped tail is bounded by
 * S_last·q/(1 − q) with q = S_last/S_previous; that bound is reported.
 */
import {
  InputError,
  isFunction,
  numberIn,
  requireKeyedObject,
  requireLShellReach,
  sumLShells,
  validateField,
  validateHole,
  validateOptions,
  type Diagnostics,
  type Field,
  type FieldSpin,
  type Hole,
} from '@penumbra/core';
import { greybody, type GreybodySolution } from './greybody.js';
import {
  GREYBODY_OPTIONS,
  MAX_L_LIMIT,
  MAX_SUM_L,
  automaticMaxL,
  requireAboveThreshold,
  validateOmega,
  type GreybodyOptions,
} from './validate.js';

/** A field on a hole at one frequency: σ sums over all of its modes. */
export interface CrossSectionProblem {
  readonly hole: Hole;
  readonly field: Field;
  /** real frequency ω > 0 in units of 1/M */
  readonly omega: number;
}

export interface CrossSectionOptions extends GreybodyOptions {
  /**
   * largest l before the sum counts as not converged (at most MAX_SUM_L;
   * default `automaticMaxL(Mω, a*)`, the geometric-optics cut plus 20 shells)
   */
  maxL?: number;
  /** called with every mode solved */
  onMode?: (solution: GreybodySolution) => void;
}

export interface CrossSectionDiagnostics extends Diagnostics {
  /** greybody solves */
  modes: number;
  /** largest l summed */
  lMax: number;
  /** bound on |σ| of the l-shells not summed (units of M²) */
  droppedBound: number;
}

/** The absorption cross-section of one field, with its l-shell breakdown. */
export interface CrossSectionSolution {
  hole: { a: number; mass: number };
  /** the field; `mass` (Mμ) is present only for a massive field */
  field: { spin: FieldSpin; mass?: number };
  omega: number;
  /** σ in units of M² (geometric) */
  sigma: number;
  /** estimated relative error: mode errors plus the dropped bound */
  relError: number;
  /** σ of each l-shell (units of M²) */
  shells: { l: number; sum: number }[];
  diagnostics: CrossSectionDiagnostics;
}

const OPTIONS = {
  ...GREYBODY_OPTIONS,
  maxL: numberIn(0, MAX_SUM_L, true),
  onMode: isFunction<(s: GreybodySolution) => void>,
};

/**
 * Absorption cross-section σ(ω) = (π/ω²) Σ_{l,m} Γ (one helicity), summed by
 * the shared l-shell rule with the geometric-optics cut l > 5Mω. Throws
 * InputError for bad input, ConvergenceError if the l-sum does not converge.
 */
export function absorptionCrossSection(problem: CrossSectionProblem, options?: CrossSectionOptions): CrossSectionSolution {
  const p = requireKeyedObject('problem', problem, ['hole', 'field', 'omega']);
  const field = validateField(p.field, 'field');
  const { spin, mass: fieldMass } = field;
  const { a, mass } = validateHole(p.hole, 'hole');
  const omega = validateOmega(p.omega, mass);
  requireAboveThreshold(omega, mass, fieldMass);
  const fieldOut = fieldMass > 0 ? { spin, mass: fieldMass } : { spin };
  const { maxL: givenMaxL, onMode, ...greybodyOptions } = validateOptions<CrossSectionOptions>(options, OPTIONS);
  const tol = greybodyOptions.tol ?? 1e-8;
  const maxL =
    givenMaxL ?? Math.max(automaticMaxL(omega * mass, Math.abs(a) / mass), Math.min(MAX_SUM_L, Math.ceil(5 * omega * mass) + 2));
  if (maxL < spin) throw new InputError('maxL', `${spin} ≤ maxL ≤ ${MAX_SUM_L}`, maxL);
  // The sum may stop only above the geometric-optics cut 5Mω, and only after two shells beyond it:
  // refuse at once a frequency whose cut the given l range cannot pass, instead of solving every mode up to maxL first.
  const highestMOmega = (maxL - 2) / 5;
  if (givenMaxL !== undefined && omega * mass > highestMOmega) {
    throw new InputError(
      'omega',
      `Mω ≤ (maxL − 2)/5 = ${highestMOmega} for maxL = ${maxL}`,
      omega,
      'the l-sum must pass l = 5Mω and cannot',
    );
  }
  let errAbs = 0;
  let modes = 0;
  let steps = 0;
  let rhsEvaluations = 0;
  const states = polarisationStates(spin, fieldMass);
  const shell = (l: number): number => {
    // At a = 0, Γ does not depend on m: one solve per shell, times its 2l + 1 members.
    const ms = a === 0 ? [spin === 0.5 ? 0.5 : 0] : Array.from({ length: 2 * l + 1 }, (_, i) => i - l);
    const weight = a === 0 ? 2 * l + 1 : 1;
    let sum = 0;
    for (const m of ms) {
      for (const state of states(l)) {
        const r = greybody(
          { hole: { a, mass }, mode: { field: fieldOut, l, m, ...state.mode }, omega },
          { ...greybodyOptions, ...state.options, tol, reflection: false },
        );
        onMode?.(r);
        sum += weight * state.weight * r.gamma;
        errAbs += weight * state.weight * Math.abs(r.gamma) * r.relError;
        steps += r.diagnostics.steps;
        rhsEvaluations += r.diagnostics.rhsEvaluations;
        modes++;
      }
    }
    return sum;
  };
  // A massive vector has the l = 0 monopole (longitudinal); every other field starts at l = spin.
  const lFirst = spin === 1 && fieldMass > 0 ? 0 : spin;
  // A limit of the solvers (not the caller's maxL) that the sum would exceed is refused here, before any solve.
  const rule = { lCut: omega * 5 * mass, tol, maxL };
  requireLShellReach(lFirst, rule, 'cross-section l-sum', givenMaxL === undefined ? MAX_L_LIMIT : 'the maxL option');
  const summed = sumLShells(lFirst, rule, shell, 'cross-section l-sum');
  // π/k∞², k∞² = ω² − μ² (μ = Mμ/M); exactly π/ω² when massless.
  const mu = fieldMass / mass;
  const scale = Math.PI / (fieldMass === 0 ? omega * omega : (omega - mu) * (omega + mu));
  const relError = (errAbs + summed.tailBound) / Math.abs(summed.total);
  return {
    hole: { a, mass },
    field: fieldOut,
    omega,
    sigma: scale * summed.total,
    relError,
    shells: summed.shells.map((s) => ({ l: s.l, sum: scale * s.sum })),
    diagnostics: {
      method: 'partial-wave sum of greybody factors over whole l-shells, geometric tail bound',
      steps,
      rhsEvaluations,
      errorEstimate: relError,
      message: `summed l = ${lFirst} … ${summed.lMax}; dropped shells bounded by ${(scale * summed.tailBound).toExponential(2)} M²`,
      modes,
      lMax: summed.lMax,
      droppedBound: scale * summed.tailBound,
    },
  };
}

/** One spin state of a mode in the unpolarised average, with what selects it. */
interface SpinState {
  /** share in the average over spin states */
  weight: number;
  /** extra mode keys (the Dirac sign) */
  mode?: { kappaSign: 1 | -1 };
  /** extra greybody options (the Proca polarisation) */
  options?: Pick<GreybodyOptions, 'polarization'>;
}

/**
 * The spin states σ averages over, per l. Massless fields and the massive
 * scalar: one helicity, as before. A massive Dirac field: the two signs of
 * κ at each (j, m), averaged (at μ = 0 both equal the massless s = 1/2 Γ, so
 * σ is continuous with the one-helicity neutrino σ). A massive vector: its
 * three polarisations averaged — odd, even-1, even-2 for l ≥ 1 and the
 * monopole, one of the three states, at l = 0 (docs/massive-vector.md).
 */
function polarisationStates(spin: FieldSpin, fieldMass: number): (l: number) => SpinState[] {
  if (fieldMass > 0 && spin === 0.5) {
    return () => [
      { weight: 0.5, mode: { kappaSign: 1 } },
      { weight: 0.5, mode: { kappaSign: -1 } },
    ];
  }
  if (fieldMass > 0 && spin === 1) {
    return (l) =>
      l === 0
        ? [{ weight: 1 / 3, options: { polarization: 'monopole' } }]
        : (['odd', 'even-1', 'even-2'] as const).map((polarization) => ({ weight: 1 / 3, options: { polarization } }));
  }
  return () => [{ weight: 1 }];
}
