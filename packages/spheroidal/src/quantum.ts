/** Lowest l in the (s, m) family: max(|m|, |s|). */
export function lowestL(s: number, m: number): number {
  return Math.max(Math.abs(m), Math.abs(s));
}

/** The eigenvalue at c = 0, A_{slm}(0) = (l − s)(l + s + 1) (spin-weighted spherical harmonics). */
export function sphericalEigenvalue(s: number, l: number): number {
  return (l - s) * (l + s + 1);
}
