export { type SpheroidalProblem, type SpheroidalOptions, MAX_REAL_C } from './problem.js';
export {
  type SpheroidalDiagnostics,
  type SpheroidalEigenvalue,
  spheroidalEigenvalue,
  radialSeparationConstant,
  clearSpheroidalCache,
} from './eigenvalue.js';
export { type SpheroidalHarmonic, spheroidalHarmonic } from './harmonic.js';
export { sphericalEigenvalue } from './quantum.js';
export { smallCSeries } from './series.js';
export type { ComplexValue } from './complexArithmetic.js';
export {
  type ComplexSpheroidalProblem,
  type ComplexSpheroidalOptions,
  MAX_COMPLEX_C,
  MAX_COMPLEX_IM_C,
} from './complexProblem.js';
export {
  type ComplexSpheroidalDiagnostics,
  type ComplexSpheroidalEigenvalue,
  spheroidalEigenvalueComplex,
} from './complexEigenvalue.js';
export {
  type DiracAngularProblem,
  type DiracAngularDiagnostics,
  type DiracAngularEigenvalue,
  diracAngularEigenvalue,
  MAX_DIRAC_A_OMEGA,
} from './diracAngular.js';
