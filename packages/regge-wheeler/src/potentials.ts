/**
 * The two real one-dimensional potentials of a Schwarzschild hole
 * (Chandrasekhar, The Mathematical Theory of Black Holes, 1983):
 *
 *   Regge–Wheeler, s = 0, 1, 2:  V = f [l(l+1)/r² + (1 − s²) 2M/r³]
 *   Dirac, s = 1/2:              V = W² ± dW/dr*,  W = (l + 1/2) √f / r
 *
 * with f = 1 − 2M/r. Everything the solver needs is expressed through
 * U = V/f, which stays finite at the horizon.
 */
export type PotentialKind = 'regge-wheeler' | 'dirac';

/** A validated mode of one of the two potentials (mass M, frequency ω, Dirac sign). */
export interface ModeProblem {
  readonly kind: PotentialKind;
  readonly spin: number;
  readonly l: number;
  readonly omega: number;
  readonly mass: number;
  /** sign in V = W² ± dW/dr*; both give the same Γ (supersymmetric partners) */
  readonly diracSign: 1 | -1;
}

/** U(r) = V(r)/f(r). */
export function potentialOverLapse(p: ModeProblem, r: number): number {
  const b = 2 * p.mass;
  if (p.kind === 'regge-wheeler') {
    const L = p.l * (p.l + 1);
    return L / (r * r) + ((1 - p.spin * p.spin) * b) / (r * r * r);
  }
  const k = p.l + 0.5;
  // V/f = k²/r² ± k (3M − r) / (r³ √f), from dW/dr* = k √f (3M − r)/r³.
  const f = 1 - b / r;
  return (k * k) / (r * r) + (p.diracSign * k * (1.5 * b - r)) / (r * r * r * Math.sqrt(f));
}

/**
 * Dimensionless far-zone coefficients ε_j with r³U = Σ_j ε_j (2M)^j r^{1−j}.
 * Regge–Wheeler: ε_0 = l(l+1), ε_1 = 1 − s², the rest vanish.
 * Dirac: (3M − r) f^{−1/2} = −r Σ_j e_j (2M/r)^j with e_j the coefficients of
 * (1 − y)^{−1/2}(1 − 3y/2), so ε_0 = k² − σk and ε_j = −σ k e_j.
 */
export function farZoneCoefficients(p: ModeProblem, count: number): Float64Array {
  const eps = new Float64Array(count);
  if (p.kind === 'regge-wheeler') {
    eps[0] = p.l * (p.l + 1);
    if (count > 1) eps[1] = 1 - p.spin * p.spin;
    return eps;
  }
  const k = p.l + 0.5;
  const sigma = p.diracSign;
  let dPrev = 0; // binomial coefficients of (1 − y)^{−1/2}
  let d = 1;
  for (let j = 0; j < count; j++) {
    if (j > 0) {
      dPrev = d;
      d = (d * (2 * j - 1)) / (2 * j);
    }
    const e = d - 1.5 * dPrev;
    eps[j] = -sigma * k * e;
  }
  eps[0] += k * k;
  return eps;
}
