/**
 * The Teukolsky radial equation for spin weight s (either sign), written with
 * polynomial coefficients (multiplying through by Δ):
 *
 *   Δ² R'' + (s+1) Δ Δ' R' + U(r) R = 0,
 *   U = K² − 2is(r − M)K + Δ(4isωr − λ),   K = (r² + a²)ω − am,
 *
 * Teukolsky, ApJ 185, 635 (1973). Derivation: docs/method.md.
 */
import type { KerrHole } from '@penumbra/kerr';
import { add, cpoly, mul, scale, type CPoly } from './complexPoly.js';

export interface RadialMode {
  /** spin weight s of the field component (sign matters: +|s| or −|s|) */
  s: number;
  /** azimuthal number m */
  m: number;
  /** real frequency ω (units of 1/M) */
  omega: number;
  /** radial separation constant λ = A + a²ω² − 2amω for this s */
  lambda: number;
}

/** Δ(r) as a real polynomial in r. */
export function deltaPoly(hole: KerrHole): CPoly {
  return cpoly([hole.a * hole.a, -2 * hole.mass, 1]);
}

/** K(r) = ω r² + (ω a² − a m). */
export function kPoly(hole: KerrHole, mode: RadialMode): CPoly {
  const { a } = hole;
  return cpoly([mode.omega * a * a - a * mode.m, 0, mode.omega]);
}

/** U(r) as a complex polynomial in r (degree 4). */
export function potentialPoly(hole: KerrHole, mode: RadialMode): CPoly {
  const { s, omega, lambda } = mode;
  const M = hole.mass;
  const K = kPoly(hole, mode);
  const D = deltaPoly(hole);
  const rMinusM = cpoly([-M, 1]);
  return add(
    mul(K, K),
    scale(mul(rMinusM, K), 0, -2 * s),
    mul(D, add(cpoly([-lambda]), cpoly([0, 0], [0, 4 * s * omega]))),
  );
}
