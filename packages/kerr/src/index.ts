export * from './errors.js';
export * from './kerr.js';
export * from './units.js';
export * from './physical.js';
