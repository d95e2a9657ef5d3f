export {
  type KerrHole,
  type TortoiseInversion,
  type NearRegion,
  MASS_RANGE,
  kerrHole,
  requireKerrHole,
  delta,
  tortoise,
  tortoiseDerivative,
  tortoiseFromHorizonDistance,
  invertTortoise,
  horizonDistanceFromTortoise,
  radiusFromTortoise,
  nearRegion,
  cardyEntropy,
} from './kerr.js';
export {
  CODATA2018,
  GM_SUN_IAU2015,
  SOLAR_MASS_KG,
  MASS_UNITS,
  type MassUnit,
  type UnitScales,
  massToKg,
  PHYSICAL_MASS_RANGE_KG,
  requirePhysicalMass,
  unitScales,
} from './units.js';
export { type PhysicalBackground, physicalBackground } from './physical.js';
export { retrogradeImpactParameter } from './photonOrbit.js';
