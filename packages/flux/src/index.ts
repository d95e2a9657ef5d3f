export {
  greybody,
  tryGreybody,
  radialFunction,
  MAX_RADII,
  type GreybodyDiagnostics,
  type GreybodySolution,
  type TeukolskyRadialFunction,
} from './greybody.js';
export type { ProcaRadialFunction, ProcaRadialSample } from './radialFunctionProca.js';
export type { DiracRadialFunction, MassiveDiracProblem, RadialFunctionOptions } from './radialFunctionDirac.js';
export type { DiracRadialSample } from '@penumbra/radial';
export { MOMEGA_RANGE, L_TAIL_MARGIN, automaticMaxL, type GreybodyProblem, type GreybodyOptions } from './validate.js';
export type { ProcaPolarization } from '@penumbra/regge-wheeler';
export { lowFrequencyGreybody } from './lowFrequency.js';
export {
  absorptionCrossSection,
  type CrossSectionProblem,
  type CrossSectionOptions,
  type CrossSectionSolution,
  type CrossSectionDiagnostics,
} from './crossSection.js';
export { horizonFactor, starobinskyConstantSquared, horizonMapSquared } from './publicNormalisation.js';
