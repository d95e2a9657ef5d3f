export {
  type SchwarzschildGreybodyProblem,
  type SchwarzschildGreybodyOptions,
  DEFAULT_TOLERANCE,
  MAX_REFERENCE_L,
} from './problem.js';
export {
  type SchwarzschildGreybodyDiagnostics,
  type SchwarzschildGreybodySolution,
  schwarzschildGreybody,
} from './greybody.js';
export {
  type SchwarzschildMassiveDiracProblem,
  type SchwarzschildMassiveDiracOptions,
  type SchwarzschildMassiveDiracSolution,
  schwarzschildMassiveDiracGreybody,
} from './massiveDirac.js';
export {
  type ProcaGreybodyProblem,
  type ProcaGreybodyOptions,
  type ProcaPolarization,
  type ProcaIntegrator,
  PROCA_POLARIZATIONS,
  PROCA_INTEGRATORS,
  DEFAULT_PROCA_TOLERANCE,
  MAX_PROCA_L,
} from './proca/problem.js';
export { type ProcaGreybodyDiagnostics, type ProcaGreybodySolution, procaGreybody } from './proca/greybody.js';
export {
  type ProcaRadialSample,
  type ProcaRadialSolution,
  MAX_PROCA_RADII,
  procaRadialSolution,
} from './proca/radial.js';
