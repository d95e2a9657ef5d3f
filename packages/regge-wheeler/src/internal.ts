/**
 * Internals for tests and benchmarks (the "./internal" subpath): one
 * integration with explicit knobs, to show that Γ does not depend on them.
 * Not part of the public API.
 */
export type { IntegrationOptions } from './problem.js';
export { type SingleIntegration, integrateOnce } from './integrate.js';
