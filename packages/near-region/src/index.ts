export { type NearRegionForm, nearRegionForm } from './form.js';
export {
  type NearRegionComparison,
  type NearRegionComparisonOptions,
  type NearRegionDiagnostics,
  compareNearRegion,
} from './compare.js';
export { type ConformalWeights, type ThermalFactor, conformalWeights, thermalFactor, logMatchingFactor } from './weights.js';
export {
  type ValidityMapProblem,
  type ValidityPoint,
  type ValidityEdge,
  type ValidityMap,
  MAX_MAP_POINTS,
  validityMap,
  validityPointsTable,
  validityEdgesTable,
} from './validityMap.js';
export { MIN_A_RATIO, MAX_MOMEGA } from './problem.js';
