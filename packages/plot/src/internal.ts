/** Internals for tests and debugging: the Vega-Lite specification behind a figure, and the scale helpers it uses. */
export { vegaLiteSpec } from './spec.js';
export { smallestMagnitude, symlogTicks } from './scales.js';
