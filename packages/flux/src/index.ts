export * from './normalisation.js';
export * from './validate.js';
export * from './greybody.js';
export * from './lowFrequency.js';
export * from './crossSection.js';
