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
