/**
 * @penumbra/radial: solutions of the Teukolsky radial equation from the
 * horizon to the far zone. Problem → solve → solution: `solveRadial` (one-sided
 * shooting, any s) and `solveTwoSided` (s > 0, −s field mapped to +s by the
 * Teukolsky–Starobinsky operator). Internals for tests and cross-checks are
 * in '@penumbra/radial/internal'.
 */
export { solveRadial } from './solveRadial.js';
export { solveTwoSided } from './solveTwoSided.js';
export type { RadialMode } from './equation.js';
export type { RadialProblem } from './problem.js';
export { RADIAL_VARIABLES, type RadialOptions, type RadialVariable, type TwoSidedOptions } from './options.js';
export { INTEGRATORS, type IntegratorName } from './integrators.js';
export type { Complex2, RadialSample, RadialSolution, TwoSidedSolution } from './solution.js';
export type { RadialDiagnostics } from './diagnostics.js';
export type { DiracRadialProblem } from './dirac/equation.js';
export {
  solveMassiveDiracRadial,
  type DiracRadialOptions,
  type DiracRadialDiagnostics,
  type DiracRadialSample,
  type DiracRadialSolution,
} from './dirac/solveDirac.js';
export { OSCILLATIONS, type Oscillation } from './hybridLeg.js';
