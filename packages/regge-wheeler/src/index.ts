export {
  schwarzschildGreybody,
  integrateOnce,
  DEFAULT_TOLERANCE,
  type SchwarzschildGreybodyResult,
  type SchwarzschildGreybodyQuery,
  type IntegrationControls,
  type SingleIntegration,
} from './greybody.js';
export { horizonSeries, outgoingFarSeries, tortoiseFromHorizonDistance, FAR_SERIES_TOLERANCE, type WaveState, type SeriesValue } from './series.js';
export { potentialOverLapse, farZoneCoefficients, type ModeProblem, type PotentialKind } from './potentials.js';
