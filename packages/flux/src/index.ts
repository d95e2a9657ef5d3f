export * from './normalisation.js';
export * from './validate.js';
export * from './greybody.js';
