/**
 * Greybody factors of a massive vector (Proca) field, dispatched from
 * `greybody` when the mode's field has spin 1 and mass > 0. Only a = 0 is
 * offered: the Schwarzschild solver of @penumbra/regge-wheeler by vector
 * spherical harmonics (docs/massive-vector.md). The separable Kerr ansatz of
 * Frolov, Krtouš, Kubizňák & Santos (Phys. Rev. Lett. 120, 231103 (2018)) is
 * not offered until it is verified against the Schwarzschild limit and the
 * massless limit of the transverse modes.
 */
import { InputError, validateField, validateHole, requireKeyedObject, type Hole } from '@penumbra/core';
import { MAX_PROCA_L } from '@penumbra/regge-wheeler';
import { type ProcaPolarization, procaGreybody } from '@penumbra/regge-wheeler';
import type { GreybodyOptions, GreybodyProblem } from './validate.js';
import { validateOmega } from './validate.js';
import type { GreybodySolution } from './greybody.js';

/** The mode of a massive vector: as core's Mode, but l = 0 (the monopole) is a mode of its own. */
export function checkVectorMode(value: unknown): { fieldMass: number; l: number; m: number } {
  const mode = requireKeyedObject('mode', value, ['field', 'l', 'm']);
  const { mass } = validateField(mode.field, 'mode.field');
  const { l, m } = mode;
  if (typeof l !== 'number' || !Number.isInteger(l) || l < 0 || l > MAX_PROCA_L) {
    throw new InputError('mode.l', `an integer 0 ≤ l ≤ ${MAX_PROCA_L} (a massive vector has a monopole)`, l);
  }
  if (typeof m !== 'number' || !Number.isInteger(m) || Math.abs(m) > l)
    throw new InputError('mode.m', `an integer |m| ≤ l = ${l}`, m);
  return { fieldMass: mass, l, m };
}

/** Refuse a ≠ 0 for a massive vector, naming hole.a. */
export function requireSchwarzschild(a: number): void {
  if (a !== 0) {
    throw new InputError(
      'hole.a',
      '0 for a massive vector (spin 1, mass > 0)',
      a,
      'the separable Kerr ansatz of Frolov, Krtouš, Kubizňák & Santos (2018) is not yet verified here against the Schwarzschild limit and the massless transverse modes; see docs/massive-vector.md',
    );
  }
}

/** The default polarisation: the monopole at l = 0, the odd (axial) mode otherwise. */
export function defaultPolarization(l: number): ProcaPolarization {
  return l === 0 ? 'monopole' : 'odd';
}

/** Γ of one massive vector polarisation at a = 0, shaped as every other greybody solution. */
export function massiveVectorGreybody(problem: GreybodyProblem, options: GreybodyOptions): GreybodySolution {
  const p = requireKeyedObject('problem', problem, ['hole', 'mode', 'omega']);
  const { fieldMass, l, m } = checkVectorMode(p.mode);
  const { a, mass } = validateHole(p.hole as Hole, 'hole');
  requireSchwarzschild(a);
  const omega = validateOmega(p.omega, mass);
  const polarization = options.polarization ?? defaultPolarization(l);
  // the greybody integrators 'gbs' and 'odex' are extrapolation loops: the Proca solver's own one; 'cash-karp' is its RK45 cross-check
  const integrator = options.integrator === 'cash-karp' ? 'cash-karp' : 'extrapolation';
  const sol = procaGreybody(
    { field: { spin: 1, mass: fieldMass }, l, omega, mass, polarization },
    { tol: options.tol ?? 1e-8, integrator },
  );
  const d = sol.diagnostics;
  return {
    hole: { a, mass },
    mode: { field: { spin: 1, mass: fieldMass }, l, m },
    omega,
    polarization: sol.polarization,
    gamma: sol.gamma,
    log10Gamma: Math.log10(sol.gamma),
    underflow: false,
    reflection: sol.reflection,
    // the sector's |T + R − 1| (both even polarisations at once), at least this one's
    residual: Math.max(sol.residual, Math.abs(sol.gamma + sol.reflection - 1)),
    relError: d.errorEstimate,
    amplification: -sol.gamma,
    k: omega,
    superradiant: false,
    diagnostics: {
      method: d.method,
      steps: d.steps,
      rhsEvaluations: d.rhsEvaluations,
      errorEstimate: d.errorEstimate,
      message: d.message,
      integrator: options.integrator === 'cash-karp' ? 'cash-karp' : 'gbs',
      odeTol: options.tol ?? 1e-8,
      startRadius: d.startRadius,
      matchRadius: d.matchRadius,
      horizonTerms: 0,
      farTerms: d.seriesTerms,
      // no spheroidal problem at a = 0: the angular eigenvalue is l(l + 1)
      eigenvalue: l * (l + 1),
      lambda: l * (l + 1),
      starobinskySquared: Number.NaN,
      attempts: 1,
    },
  };
}
