/**
 * `radialFunction` for a massive vector (spin 1, mass > 0) at a = 0: the
 * Proca solution of one polarisation on a grid of radii, from the
 * Schwarzschild solver of @penumbra/regge-wheeler (docs/massive-vector.md).
 * A Proca field has no Teukolsky function R: the samples carry the channel
 * functions u (odd: one; monopole: u2; even: u2, u3) and du/dr instead.
 */
import { InputError, requireKeyedObject, validateHole, validateOptions, type Hole } from '@penumbra/core';
import type { Complex2 } from '@penumbra/radial';
import { type ProcaGreybodyDiagnostics, type ProcaPolarization, procaRadialSolution } from '@penumbra/regge-wheeler';
import { checkVectorMode, defaultPolarization, requireSchwarzschild } from './massiveVector.js';
import { GREYBODY_OPTIONS, validateOmega, type GreybodyOptions, type GreybodyProblem } from './validate.js';

/** The Proca field at one radius. */
export interface ProcaRadialSample {
  r: number;
  /** channel functions u (odd: [a]; monopole: [u2]; even: [u2, u3]) */
  u: Complex2[];
  /** du/dr */
  dudr: Complex2[];
  /** conserved flux into the hole through the sphere at r (units M = 1): the same at every r */
  flux: number;
}

/** `radialFunction` of a massive vector polarisation. */
export interface ProcaRadialFunction {
  hole: { a: number; mass: number };
  mode: { field: { spin: 1; mass: number }; l: number; m: number };
  omega: number;
  polarization: ProcaPolarization;
  samples: ProcaRadialSample[];
  /**
   * the unit channel vector c_H of u → c_H e^{−iωr*} at the horizon: 1 for
   * the odd and monopole modes (as the greybody solve starts them), the
   * eigen-polarisation's combination for the even ones
   */
  horizonAmplitude: Complex2[];
  /** c_in, c_out of u → Σ_c (c_in e^{−i(k∞r* + η ln r)} + c_out e^{+i(k∞r* + η ln r)}) e_c at infinity */
  incomingAmplitude: Complex2[];
  outgoingAmplitude: Complex2[];
  /** fluxes (units M = 1): into the hole, and incident and reflected at infinity */
  horizonFlux: number;
  incomingFlux: number;
  outgoingFlux: number;
  /** horizonFlux / incomingFlux: the Γ of this polarisation */
  gamma: number;
  /** outgoingFlux / incomingFlux */
  reflection: number;
  /** estimated relative error of Γ and of the samples (the integration's accumulation bound) */
  relError: number;
  diagnostics: ProcaGreybodyDiagnostics;
}

const complex2 = (z: [number, number]): Complex2 => ({ re: z[0], im: z[1] });

/** The Proca solution of one polarisation (options.polarization, default odd, monopole at l = 0) at the given radii. */
export function radialFunctionProca(
  problem: GreybodyProblem,
  radii: readonly number[],
  options: Pick<GreybodyOptions, 'tol' | 'integrator' | 'polarization'> | undefined,
): ProcaRadialFunction {
  const p = requireKeyedObject('problem', problem, ['hole', 'mode', 'omega']);
  const { fieldMass, l, m } = checkVectorMode(p.mode);
  const { a, mass } = validateHole(p.hole as Hole, 'hole');
  requireSchwarzschild(a);
  const omega = validateOmega(p.omega, mass);
  const o = validateOptions<Pick<GreybodyOptions, 'tol' | 'integrator' | 'polarization'>>(options, {
    tol: GREYBODY_OPTIONS.tol,
    integrator: GREYBODY_OPTIONS.integrator,
    polarization: GREYBODY_OPTIONS.polarization,
  });
  if (o.integrator === 'cash-karp') {
    throw new InputError(
      'integrator',
      "'gbs' or 'odex' for a massive vector",
      o.integrator,
      'the Proca solution on a grid is computed by the extrapolation loop only',
    );
  }
  const polarization = o.polarization ?? defaultPolarization(l);
  const sol = procaRadialSolution({ field: { spin: 1, mass: fieldMass }, l, omega, mass, polarization }, radii, {
    tol: o.tol ?? 1e-8,
  });
  return {
    hole: { a, mass },
    mode: { field: { spin: 1, mass: fieldMass }, l, m },
    omega,
    polarization,
    samples: sol.samples.map((s) => ({ r: s.r, u: s.u.map(complex2), dudr: s.dudr.map(complex2), flux: s.flux })),
    horizonAmplitude: sol.horizonAmplitude.map(complex2),
    incomingAmplitude: sol.incomingAmplitude.map(complex2),
    outgoingAmplitude: sol.outgoingAmplitude.map(complex2),
    horizonFlux: sol.horizonFlux,
    incomingFlux: sol.incomingFlux,
    outgoingFlux: sol.outgoingFlux,
    gamma: sol.gamma,
    reflection: sol.reflection,
    relError: sol.diagnostics.errorEstimate,
    diagnostics: sol.diagnostics,
  };
}
