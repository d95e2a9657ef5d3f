export * from './equation.js';
export * from './horizonSeries.js';
export * from './farSeries.js';
export * from './solve.js';
export * from './integrators.js';
export * from './starobinskyMap.js';
