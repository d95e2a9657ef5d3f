/**
 * Matrix elements of cosθ between the orthonormal spin-weighted spherical
 * harmonics u_l (fixed s, m). With x = cosθ,
 *   x u_l = a(l) u_{l+1} + b(l) u_l + a(l−1) u_{l−1},
 *   a(l) = sqrt(((l+1)² − m²)((l+1)² − s²) / ((2l+1)(2l+3))) / (l+1),
 *   b(l) = −ms / (l(l+1)).
 * These are the Clebsch–Gordan expressions of Hughes (2000) and follow equally
 * from the three-term recurrence of orthonormal Jacobi polynomials with
 * α = |m+s|, β = |m−s| (docs/spheroidal.md). a(l) > 0 fixes the sign of every
 * basis function (positive leading coefficient in x).
 */
export function cosOffDiagonal(l: number, m: number, s: number): number {
  const lp = l + 1;
  const num = (lp * lp - m * m) * (lp * lp - s * s);
  if (num <= 0) return 0;
  return Math.sqrt(num / ((2 * l + 1) * (2 * l + 3))) / lp;
}

/** b(l) = ⟨l|cosθ|l⟩ = −ms/(l(l + 1)) (zero at l = 0). */
export function cosDiagonal(l: number, m: number, s: number): number {
  return l === 0 ? 0 : (-m * s) / (l * (l + 1));
}
