/**
 * Internals of @penumbra/core shared by the other packages
 * ('@penumbra/core/internal'): bookkeeping with no physics and no input
 * checks of its own. Not a stable API.
 */
export { setBounded } from './boundedCache.js';
