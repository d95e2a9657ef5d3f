export {
  type SpheroidalQuery,
  type SpheroidalDiagnostics,
  type SpheroidalEigenvalue,
  type SolveOptions,
  spheroidalEigenvalue,
  radialSeparationConstant,
  clearSpheroidalCache,
} from './eigenvalue.js';
export { SUPPORTED_SPINS, MAX_L, MAX_REAL_C, sphericalEigenvalue } from './quantum.js';
export { leaverFunction, leaverRoot } from './leaver.js';
export { type SpheroidalHarmonic, spheroidalHarmonic } from './harmonic.js';
export { smallCSeries } from './series.js';
export {
  type ComplexValue,
  type ComplexSpheroidalQuery,
  type ComplexSpheroidalDiagnostics,
  type ComplexSpheroidalEigenvalue,
  MAX_COMPLEX_C,
  MAX_COMPLEX_IM_C,
  spheroidalEigenvalueComplex,
  leaverFunctionComplex,
} from './complexC.js';
