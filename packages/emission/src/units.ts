/**
 * Conversion of rates of the geometric computation to physical units.
 *
 * Geometric units: G = c = ħ = k_B = 1, so a rate for a hole of mass M scales
 * as dN/dt ∝ 1/M, dE/dt ∝ 1/M², dJ/dt ∝ 1/M, d²N/(dt dω) scale-free. With
 * t_M = GM/c³ (seconds per geometric time unit) and E_M = ħ/t_M (joules per
 * geometric energy unit): dN/dt = N̂/t_M, dE/dt = P̂ ħ/t_M², dJ/dt = Ĵ ħ/t_M,
 * d²N/(dt dE) = N̂(ω)/(t_M E_M), where the hatted values are those of the unit
 * hole. Constants: CODATA 2018 via @penumbra/kerr.
 */
import { InputError, requireFinite, requireObject } from '@penumbra/core';
import { CODATA2018, requirePhysicalMass, unitScales, type MassUnit } from '@penumbra/kerr';

function checkGeometricMass(geometricMass: unknown): number {
  const M = requireFinite('geometricMass', geometricMass, 'a finite number > 0');
  if (!(M > 0)) throw new InputError('geometricMass', 'a finite number > 0', M);
  return M;
}

/** Every value finite, or an InputError naming `parameter` (the input whose size made it overflow). */
function allFinite<T extends Record<string, number>>(values: T, parameter: string, given: unknown): T {
  if (!Object.values(values).every(Number.isFinite))
    throw new InputError(parameter, 'values whose SI conversion stays within the double range for this mass', given);
  return values;
}

/** Rates in SI (and a few convenient) units. */
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
  const r = requireObject('rates', rates, 'rates { numberRate, power, torque }');
  for (const key of ['numberRate', 'power', 'torque']) requireFinite(`rates.${key}`, r[key]);
  const kg = requirePhysicalMass(mass, unit);
  const u = unitScales(kg);
  const M = checkGeometricMass(geometricMass);
  const N = rates.numberRate * M;
  const P = rates.power * M * M;
  const J = rates.torque * M;
  return allFinite(
    {
      massKg: kg,
      numberRatePerSecond: N / u.second,
      // u.joule = ħ/t_M is the energy unit, so energy per time unit is P·u.joule/t_M.
      powerWatts: (P * u.joule) / u.second,
      powerGeVPerSecond: (P * u.GeV) / u.second,
      torqueJoules: (J * CODATA2018.hbar) / u.second,
      torqueHbarPerSecond: J / u.second,
    },
    'rates',
    rates,
  );
}

/** d²N/(dt dE) in GeV⁻¹ s⁻¹ and E in GeV for a spectrum value of the unit hole (geometric ω = Mω). */
export function toPhysicalSpectrum(
  point: { omega: number; number: number },
  mass: number,
  unit: MassUnit,
  geometricMass = 1,
): { energyGeV: number; perGeVPerSecond: number } {
  const p = requireObject('point', point, 'a spectrum point { omega, number }');
  const omega = requireFinite('point.omega', p.omega);
  const number = requireFinite('point.number', p.number);
  const u = unitScales(requirePhysicalMass(mass, unit));
  const w = omega * checkGeometricMass(geometricMass);
  return allFinite({ energyGeV: w * u.GeV, perGeVPerSecond: number / (u.second * u.GeV) }, 'point', point);
}
