/** Background quantities of a hole in physical units. */
import { requireKerrHole, type KerrHole } from './kerr.js';
import { CODATA2018, requirePhysicalMass, unitScales, type MassUnit } from './units.js';

/** A hole's mass, temperature, horizon and time scale in SI (and GeV) units. */
export interface PhysicalBackground {
  /** mass in kilograms */
  massKg: number;
  /** mass in grams */
  massGrams: number;
  /** Hawking temperature in kelvin */
  temperatureK: number;
  /** Hawking temperature k_B T_H in GeV */
  temperatureGeV: number;
  /** horizon angular velocity in rad s^-1 */
  omegaHPerSecond: number;
  /** outer horizon radius in metres */
  rPlusMetres: number;
  /** horizon area in m^2 */
  areaSquareMetres: number;
  /** Bekenstein–Hawking entropy in units of k_B */
  entropyKB: number;
  /** geometric time unit GM/c^3 in seconds */
  timeUnitSeconds: number;
}

/**
 * The hole's background in physical units. `hole` is in geometric units of
 * its own mass (any hole.mass; quantities are rescaled by M).
 */
export function physicalBackground(hole: KerrHole, mass: number, unit: MassUnit): PhysicalBackground {
  requireKerrHole(hole);
  const kg = requirePhysicalMass(mass, unit);
  const u = unitScales(kg);
  const M = hole.mass;
  // Geometric quantities scale with the hole mass: T ∝ 1/M, lengths ∝ M.
  const planckAreaSI = u.metre * u.metre; // (G M / c^2)^2 per (M)^2
  return {
    massKg: kg,
    massGrams: kg * 1e3,
    temperatureK: hole.temperature * M * u.kelvin,
    temperatureGeV: hole.temperature * M * u.GeV,
    omegaHPerSecond: (hole.omegaH * M) / u.second,
    rPlusMetres: (hole.rPlus / M) * u.metre,
    areaSquareMetres: (hole.area / (M * M)) * planckAreaSI,
    // S/k_B = A c^3 / (4 G hbar): in geometric units of M it is entropy·(M_kg² G/(hbar c)).
    entropyKB: (hole.entropy / (M * M)) * ((kg * kg * CODATA2018.G) / (CODATA2018.hbar * CODATA2018.c)),
    timeUnitSeconds: u.second,
  };
}
