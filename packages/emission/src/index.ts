export * from './validate.js';
export * from './quadrature.js';
export * from './species.js';
export * from './modes.js';
export * from './spectrum.js';
export * from './totals.js';
