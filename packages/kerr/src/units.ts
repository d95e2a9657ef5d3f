/**
 * Conversion between geometric units (G = c = hbar = k_B = 1, lengths in units
 * of the hole mass M) and SI / particle-physics units.
 *
 * Constants: CODATA 2018 recommended values (Tiesinga et al., Rev. Mod. Phys.
 * 93, 025010 (2021)); c, h, k_B and e are exact in the 2019 SI. The solar mass
 * is the IAU 2015 nominal solar mass parameter GM_sun (Resolution B3) divided
 * by CODATA G.
 */
import { InputError, requireFinite } from '@penumbra/core';

/** CODATA 2018 constants used by the unit layer (SI units). */
export const CODATA2018 = {
  /** speed of light in vacuum, m s^-1 (exact) */
  c: 299792458,
  /** Newtonian constant of gravitation, m^3 kg^-1 s^-2 */
  G: 6.6743e-11,
  /** reduced Planck constant, J s (exact: h / 2 pi with h = 6.62607015e-34) */
  hbar: 6.62607015e-34 / (2 * Math.PI),
  /** Boltzmann constant, J K^-1 (exact) */
  kB: 1.380649e-23,
  /** elementary charge = joules per electronvolt (exact) */
  eV: 1.602176634e-19,
} as const;

/** IAU 2015 nominal solar mass parameter, m^3 s^-2 (Resolution B3). */
export const GM_SUN_IAU2015 = 1.3271244e20;
/** Solar mass in kg, GM_sun / G. */
export const SOLAR_MASS_KG = GM_SUN_IAU2015 / CODATA2018.G;

/** Units a physical hole mass can be given in: grams, kilograms, solar masses. */
export type MassUnit = 'g' | 'kg' | 'msun';
/** Every MassUnit, for validation and help texts. */
export const MASS_UNITS: readonly MassUnit[] = ['g', 'kg', 'msun'];

/**
 * Physical masses physicalBackground accepts, in kg. Inside it every quantity
 * (T_H ∝ 1/M up to 1e123 K, area and entropy ∝ M² down to 1e-253 m²) is a
 * normal double; outside it some would overflow to Infinity or underflow to 0.
 */
export const PHYSICAL_MASS_RANGE_KG = { min: 1e-100, max: 1e100 } as const;

/**
 * A physical mass `mass` in `unit` as kilograms, refused with an InputError
 * naming `mass` (the range given in the caller's unit) outside `rangeKg`.
 * `why` says what leaves the double range outside it.
 */
export function requirePhysicalMass(
  mass: number,
  unit: MassUnit,
  rangeKg: { min: number; max: number } = PHYSICAL_MASS_RANGE_KG,
  why = 'outside it the temperature, area or entropy leave the normal double range',
): number {
  if (
    typeof rangeKg !== 'object' ||
    rangeKg === null ||
    !(rangeKg.min > 0 && rangeKg.min <= rangeKg.max && rangeKg.max < Infinity)
  )
    throw new InputError('rangeKg', 'a range { min, max } with 0 < min ≤ max < Infinity', rangeKg);
  if (typeof why !== 'string') throw new InputError('why', 'a string', why);
  const perKg = massToKg(1, unit);
  requireFinite('mass', mass, 'a finite number > 0');
  // compared in the caller's unit first: 1e300 msun is out of range, not an overflow in kg
  if (!(mass >= rangeKg.min / perKg && mass <= rangeKg.max / perKg)) {
    const range = `${fmt(rangeKg.min / perKg)} ≤ mass ≤ ${fmt(rangeKg.max / perKg)} ${unit}`;
    throw new InputError('mass', range, mass, why);
  }
  const kg = massToKg(mass, unit);
  if (!(kg >= rangeKg.min && kg <= rangeKg.max)) {
    const range = `${fmt(rangeKg.min / perKg)} ≤ mass ≤ ${fmt(rangeKg.max / perKg)} ${unit}`;
    throw new InputError('mass', range, mass, why);
  }
  return kg;
}

function fmt(x: number): string {
  return Number(x.toPrecision(3)).toString();
}

/** Convert a mass in the given unit to kilograms. */
export function massToKg(mass: number, unit: MassUnit): number {
  requireFinite('mass', mass, 'a finite number > 0');
  if (!(mass > 0)) throw new InputError('mass', 'a finite number > 0', mass);
  switch (unit) {
    case 'g':
      return mass * 1e-3;
    case 'kg':
      return mass;
    case 'msun':
      // 1e308 msun leaves the double range in kg
      if (!Number.isFinite(mass * SOLAR_MASS_KG))
        throw new InputError('mass', `a mass ≤ ${Number.MAX_VALUE / SOLAR_MASS_KG} msun`, mass);
      return mass * SOLAR_MASS_KG;
    default:
      throw new InputError('unit', "one of 'g', 'kg', 'msun'", unit);
  }
}

/**
 * Scale factors that turn a geometric-unit quantity of a hole of mass M (kg)
 * into SI: a geometric time t·M becomes t·GM/c^3 seconds, an energy E/M
 * becomes E·hbar c^3/(G M) joules, a temperature T/M becomes
 * T·hbar c^3/(G M k_B) kelvin.
 */
export interface UnitScales {
  massKg: number;
  /** seconds per geometric time unit M */
  second: number;
  /** metres per geometric length unit M */
  metre: number;
  /** joules per geometric energy unit 1/M (hbar = 1) */
  joule: number;
  /** GeV per geometric energy unit 1/M */
  GeV: number;
  /** kelvin per geometric temperature unit 1/M */
  kelvin: number;
}

/** The SI scale factors for a hole of mass `massKg` (kilograms, finite and > 0). */
export function unitScales(massKg: number): UnitScales {
  const { c, G, hbar, kB, eV } = CODATA2018;
  const { min, max } = PHYSICAL_MASS_RANGE_KG;
  // outside the physical range the scales (t_M, E_M) leave the normal double range
  if (typeof massKg !== 'number' || !(massKg >= min && massKg <= max))
    throw new InputError('massKg', `${min} ≤ massKg ≤ ${max}`, massKg);
  const second = (G * massKg) / c ** 3;
  const joule = hbar / second;
  return {
    massKg,
    second,
    metre: (G * massKg) / c ** 2,
    joule,
    GeV: joule / (eV * 1e9),
    kelvin: joule / kB,
  };
}
