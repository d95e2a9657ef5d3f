/** Internals for tests and debugging: the Vega-Lite specification behind a figure, and the scale helpers it uses. */
export { vegaLiteSpec } from './spec.js';
export {
  smallestMagnitude,
  symlogTicks,
  symlogConstant,
  symlogDomain,
  logTicks,
  logDomain,
  roundOut,
  SYMLOG_DECADES,
} from './scales.js';
export { PALETTE, DASHES, PAIRED_COLOURS } from './style.js';
