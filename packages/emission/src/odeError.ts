/**
 * The ODE part of an evaporation lifetime's error estimate (evolution.ts,
 * evaporation.ts). The change when the integrator tolerance is halved alone
 * is not a bound: it can vanish by coincidence. Against runs at odeTol 1e-11
 * (bench/evolution-ode-error.bench.mjs: default content and single spins,
 * a* from 0 to 0.99 in steps of 0.011, odeTol 1e-8 … 1e-4), the reported
 * lifetime's error reached 6.7·odeTol and 3.4·(change + odeTol); the change
 * plus ODE_ERROR_PER_TOL·odeTol covered every case (worst 0.67 of it).
 */
import { ConvergenceError, type Diagnostics } from '@penumbra/core';

/** Factor on the requested ODE tolerance in the ODE error bound (measured, see the module comment). */
export const ODE_ERROR_PER_TOL = 10;

/** Bound on the relative ODE error of the lifetime: the halved-tolerance change plus ODE_ERROR_PER_TOL × the requested odeTol. */
export function odeErrorBound(halvedTolChange: number, odeTol: number): number {
  return halvedTolChange + ODE_ERROR_PER_TOL * odeTol;
}

/**
 * The verdict on a lifetime computed at odeTol and odeTol/2 (evolution,
 * evaporation): ConvergenceError when the halved-tolerance change is more than
 * 100·odeTol (floor 1e-10), or when the error estimate exceeds the caller's tol.
 */
export function requireLifetimeConverged(
  what: string,
  diagnostics: Diagnostics & { halvedTolChange: number },
  odeTol: number,
  lifetimes: { coarse: number; fine: number },
  tol: number | undefined,
): void {
  if (!(diagnostics.halvedTolChange <= Math.max(100 * odeTol, 1e-10))) {
    throw new ConvergenceError(`${what}: lifetime moves when the ODE tolerance is halved`, {
      ...diagnostics,
      lifetime: lifetimes.coarse,
      lifetimeHalfTol: lifetimes.fine,
    });
  }
  if (tol !== undefined && !(diagnostics.errorEstimate <= tol)) {
    throw new ConvergenceError(`${what}: the lifetime's error estimate exceeds tol = ${tol}`, {
      ...diagnostics,
      lifetime: lifetimes.fine,
      tol,
    });
  }
}
