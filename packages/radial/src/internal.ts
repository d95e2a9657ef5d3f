/**
 * Internals of @penumbra/radial for tests and cross-checks
 * ('@penumbra/radial/internal'): the one definition of the equation and what
 * is built from it, the series at both ends, the integrators and the legs of
 * a solve. Not a stable API.
 */
export { type CPoly, cpoly, padTo, add, mul, scale, derivative, cpolyAt } from './complexPoly.js';
export { type RadialEquation, radialEquation, substitutePhase } from './equation.js';
export { type Rhs, type EvaluationCounter, type EquationKernel, equationRhs, equationKernel } from './rhs.js';
export { type AdvanceResult, type Stepper, type StepperSpec, makeStepper } from './integrators.js';
export { type HorizonStart, horizonSeriesStart, horizonWavenumber } from './horizonSeries.js';
export { defaultStartFraction, startAtHorizon } from './horizonStart.js';
export { type FarSeries, type FarValue, type FarRecurrence, farSeries, evaluateFar } from './farSeries.js';
export { type FarMatch, type MatchedAmplitudes, chooseMatch, matchAmplitudes } from './farMatch.js';
export { type StarobinskyMap, starobinskyMapAt, applyStarobinskyMap, starobinskyHorizonFactor } from './starobinskyMap.js';
export { phaseEquation, convertPhase } from './phaseVariable.js';
export { type Leg, type Segment, type RawSample, integrateLeg } from './shooting.js';
export { type ResolvedOptions, RADIAL_DEFAULTS, resolveRadialOptions, resolveTwoSidedOptions } from './options.js';
export { validateProblem } from './problem.js';
export { type ErrorBudget, singleSolveErrorEstimate, singleSolveMessage } from './diagnostics.js';
export { type DiracKernel, diracKernel, diracRhs } from './dirac/equation.js';
export {
  type DiracFarSeries,
  type DiracFarValue,
  type FarExpansion,
  diracFarSeries,
  evaluateDiracFar,
  farExpansion,
  mirrorDiracFar,
} from './dirac/farSeries.js';
export { type DiracHorizonStart, diracHorizonStart } from './dirac/horizonSeries.js';
export type { C, V2, M2 } from './dirac/complex2.js';
export {
  type HybridSegment,
  integrateHybridLeg,
  chargedSteps,
  riccatiWorthIt,
  WKB_LIMIT,
  MIN_PHASE,
  RICCATI_STEP_CHARGE,
  RICCATI_ERROR_FACTOR,
} from './hybridLeg.js';
export {
  type RiccatiEquation,
  type RiccatiStep,
  riccatiEquation,
  riccatiStep,
  localRiccati,
  phaseRate,
  RICCATI_NODES,
} from './riccatiStep.js';
export { type ChebyshevRule, chebyshevRule, chebyshevTail, chebyshevDerivative } from './chebyshev.js';
export { type TaylorStretch, taylorStretch } from './taylorStretch.js';
export { twoSidedChecked } from './solveTwoSided.js';
export { oneSidedChecked } from './solveRadial.js';
