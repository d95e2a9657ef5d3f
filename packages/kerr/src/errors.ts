// The error types are defined once, in @penumbra/core; kerr throws them.
export { InputError, ConvergenceError, requireFinite } from '@penumbra/core';
