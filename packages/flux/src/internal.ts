/**
 * Internals for tests and benchmarks (the "./internal" subpath): the massive
 * Dirac solve called directly, which also runs at field mass 0 (the check
 * against the massless s = 1/2 route). Not part of the public API.
 */
export { massiveDiracGreybody } from './massiveDirac.js';
