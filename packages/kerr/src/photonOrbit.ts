/**
 * The retrograde equatorial photon orbit, whose impact parameter bounds the
 * capture impact parameter of every mode (the geometric-optics reach of an
 * l-sum).
 */

/**
 * Retrograde equatorial photon-orbit impact parameter in units of M,
 * b = 3√(M r) + a with r = 2M[1 + cos((2/3) arccos(a/M))] (Bardeen, Press &
 * Teukolsky, ApJ 178, 347 (1972)): 3√3 at a = 0, 7 at a = M. Beyond
 * l + 1/2 ≈ Mω·b the l-shells are below the barrier and fall geometrically.
 */
export function retrogradeImpactParameter(aStar: number): number {
  const r = 2 * (1 + Math.cos((2 / 3) * Math.acos(Math.abs(aStar))));
  return 3 * Math.sqrt(r) + Math.abs(aStar);
}
