/**
 * Internals for tests and benchmarks (the "./internal" subpath): one
 * integration with explicit knobs, to show that Γ does not depend on them.
 * Not part of the public API.
 */
export type { IntegrationOptions } from './problem.js';
export { type SingleIntegration, integrateOnce } from './integrate.js';
export {
  type ProcaIntegration,
  type ProcaIntegrationControls,
  type ProcaStateSample,
  integrateProca,
  defaultPhaseRadius,
  farZonePhase,
  PHASE_SLACK,
} from './proca/integrate.js';
export { type ProcaSector, type SectorModel, sectorModel } from './proca/sectors.js';
export type { Complex } from './proca/complex.js';
export { type SeriesState, type ChannelState, outgoingFarSolution, horizonSolution } from './proca/series.js';
export { type ProcaChannelEquations, ProcaExtrapolation } from './proca/extrapolation.js';
export { chargedSteps, singleStartOffset } from './proca/greybody.js';
