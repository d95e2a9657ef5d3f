/**
 * Totals over a particle content, and conversion of rates to physical units.
 *
 * Geometric units: G = c = ħ = k_B = 1, so a rate for a hole of mass M scales
 * as dN/dt ∝ 1/M, dE/dt ∝ 1/M², dJ/dt ∝ 1/M, d²N/(dt dω) scale-free. With
 * t_M = GM/c³ (seconds per geometric time unit) and E_M = ħ/t_M (joules per
 * geometric energy unit): dN/dt = N̂/t_M, dE/dt = P̂ ħ/t_M², dJ/dt = Ĵ ħ/t_M,
 * d²N/(dt dE) = N̂(ω)/(t_M E_M), where the hatted values are those of the unit
 * hole. Constants: CODATA 2018 via @penumbra/kerr.
 */
import { CODATA2018, massToKg, unitScales, type MassUnit } from '@penumbra/kerr';
import { emissionTotals, type EmissionTotals, type EstimatedValue, type TotalsOptions } from './totals.js';
import { resolveContent, type Species, type SpeciesSpec } from './species.js';
import type { FieldSpin } from './validate.js';

export interface SpeciesTotals extends Species {
  /** totals for all dof of this species (per-dof totals × dof) */
  numberRate: number;
  power: number;
  torque: number;
}

export interface ContentTotals {
  a: number;
  mass: number;
  species: SpeciesTotals[];
  numberRate: EstimatedValue;
  power: EstimatedValue;
  torque: EstimatedValue;
  /** per-dof totals for each field spin that appears */
  perDof: EmissionTotals[];
}

function combine(parts: { value: number; absError: number }[]): EstimatedValue {
  const value = parts.reduce((s, p) => s + p.value, 0);
  const absError = parts.reduce((s, p) => s + p.absError, 0);
  return { value, absError, relError: value !== 0 ? absError / Math.abs(value) : 0 };
}

/** Totals over a particle content (default: photons, gravitons, three neutrino species). */
export function contentTotals(
  problem: { a: number; mass?: number; content?: readonly SpeciesSpec[] },
  options: TotalsOptions & { onSpin?: (spin: FieldSpin, done: number, total: number) => void } = {},
): ContentTotals {
  const species = resolveContent(problem.content);
  const spins = [...new Set(species.map((s) => s.spin))];
  const perDof = spins.map((spin, i) => {
    const r = emissionTotals({ spin, a: problem.a, mass: problem.mass }, options);
    options.onSpin?.(spin, i + 1, spins.length);
    return r;
  });
  const bySpin = new Map(perDof.map((r) => [r.spin, r]));
  const rows: SpeciesTotals[] = species.map((s) => {
    const r = bySpin.get(s.spin)!;
    return { ...s, numberRate: s.dof * r.numberRate.value, power: s.dof * r.power.value, torque: s.dof * r.torque.value };
  });
  const part = (key: 'numberRate' | 'power' | 'torque') =>
    combine(species.map((s) => ({ value: s.dof * bySpin.get(s.spin)![key].value, absError: s.dof * bySpin.get(s.spin)![key].absError })));
  return {
    a: problem.a,
    mass: problem.mass ?? 1,
    species: rows,
    numberRate: part('numberRate'),
    power: part('power'),
    torque: part('torque'),
    perDof,
  };
}

export interface PhysicalRates {
  massKg: number;
  /** dN/dt in s⁻¹ */
  numberRatePerSecond: number;
  /** dE/dt in W */
  powerWatts: number;
  /** dE/dt in GeV s⁻¹ */
  powerGeVPerSecond: number;
  /** dJ/dt in J (= N m = kg m² s⁻²) */
  torqueJoules: number;
  /** dJ/dt in units of ħ per second */
  torqueHbarPerSecond: number;
}

/**
 * Convert rates of a hole of geometric mass `geometricMass` (the mass used in
 * the computation, default 1) to SI for a physical mass `mass` in `unit`.
 */
export function toPhysicalRates(
  rates: { numberRate: number; power: number; torque: number },
  mass: number,
  unit: MassUnit,
  geometricMass = 1,
): PhysicalRates {
  const kg = massToKg(mass, unit);
  const u = unitScales(kg);
  const M = geometricMass;
  const N = rates.numberRate * M;
  const P = rates.power * M * M;
  const J = rates.torque * M;
  return {
    massKg: kg,
    numberRatePerSecond: N / u.second,
    // u.joule = ħ/t_M is the energy unit, so energy per time unit is P·u.joule/t_M.
    powerWatts: (P * u.joule) / u.second,
    powerGeVPerSecond: (P * u.GeV) / u.second,
    torqueJoules: (J * CODATA2018.hbar) / u.second,
    torqueHbarPerSecond: J / u.second,
  };
}

/** d²N/(dt dE) in GeV⁻¹ s⁻¹ and E in GeV for a spectrum value of the unit hole (geometric ω = Mω). */
export function toPhysicalSpectrum(
  point: { omega: number; number: number },
  mass: number,
  unit: MassUnit,
  geometricMass = 1,
): { energyGeV: number; perGeVPerSecond: number } {
  const u = unitScales(massToKg(mass, unit));
  const w = point.omega * geometricMass;
  return { energyGeV: w * u.GeV, perGeVPerSecond: point.number / (u.second * u.GeV) };
}
