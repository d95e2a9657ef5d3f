/**
 * Internals for tests, benchmarks and scripts (the "./internal" subpath): the
 * Gauss–Kronrod and nested Fejér rules, the per-mode rates and bounds, one spectrum point of the
 * unit hole, and the input helpers. Not part of the public API; they may
 * change without notice.
 */
export { KRONROD15, kronrodPanel, adaptiveKronrod, type Panel, type QuadratureResult } from './quadrature.js';
export { adaptiveNested, fejerWeights, fejerFirstWeights } from './nestedQuadrature.js';
export {
  modeContext,
  modeRate,
  occupation,
  boltzmannTailBound,
  retrogradeImpactParameter,
  shellMs,
  torqueTailBound,
  type ModeContext,
  type ModeCounters,
  type ModeRate,
} from './modes.js';
export { spectrumPointUnit } from './spectrumPoint.js';
export { massiveGamma, type GammaEstimate } from './massiveModes.js';
export { integrateMode, emptyAccumulator, type ModeTargets, type TotalsAccumulator } from './modeIntegral.js';
export { dofBySpin } from './species.js';
export { boltzmannSpeciesBound, masslessProxyBound, MASSLESS_PROXY_MAX_MU } from './speciesBounds.js';
export { validateGrid, requireProblem } from './validate.js';
export { SHIPPED_PAGE_TABLE } from './pageTableData.js';
export {
  thetaGrid,
  fieldTotals,
  ratioRow,
  nodeRatio,
  assembleRatioRow,
  masslessLimit,
  withoutNode,
  type NodeRatio,
} from './massiveRateTable.js';
export { SHIPPED_MASSIVE_RATE_TABLE } from './massiveRateTableData.js';
export { localCubic, localCubicError } from './localCubic.js';
