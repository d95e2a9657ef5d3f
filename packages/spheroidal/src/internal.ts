/**
 * Internals for tests and benchmarks (the "./internal" subpath): the
 * continued fractions of the second method and the band assembly. Not part
 * of the public API; they may change without notice.
 */
export { type ContinuedFractionValue, type LeaverRoot, leaverFunction, leaverRoot } from './leaver.js';
export {
  type ComplexContinuedFractionValue,
  type ComplexLeaverRoot,
  leaverFunctionComplex,
  leaverRootComplex,
} from './complexLeaver.js';
export { type Band, basisLayout, buildBand } from './band.js';
export { type ComplexBand, buildComplexBand } from './complexBand.js';
export type { Tally } from './diagnostics.js';
export { cosElementLowered, sinElementMixed } from './diracAngularMatrix.js';
export { spheroidalEigenvalueOfValidMode } from './eigenvalue.js';
export { type SymmetricEigen, symmetricEigen } from './symmetricEigen.js';
