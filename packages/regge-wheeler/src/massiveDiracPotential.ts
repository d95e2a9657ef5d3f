/**
 * The massive Dirac field on a Schwarzschild hole as a real one-dimensional
 * problem (derivation: docs/massive-dirac.md, after Chandrasekhar's reduction,
 * The Mathematical Theory of Black Holes, 1983, §104–107):
 *
 *   d²Z/dr̂*² + (ω² − V)Z = 0,   V = Ŵ² + dŴ/dr̂*,
 *   Ŵ = √Δ ρ³ / (r²ρ² − Δ μλ/(2ω)),   ρ² = λ² + μ²r²,
 *   dr̂* / dr = r²/Δ − μλ/(2ωρ²),       Δ = r² − 2Mr,
 *
 * λ = κ = ±(j + ½). V → μ² with a 2Mμ²/r tail at infinity (long range) and
 * V → 0 at the horizon. Written with x = r − 2M so that nothing cancels near
 * the horizon.
 */

/** One massive Dirac mode of a Schwarzschild hole. */
export interface MassiveDiracMode {
  /** hole mass M */
  mass: number;
  omega: number;
  /** field mass μ > 0 */
  mu: number;
  /** λ = κ = ±(j + ½) */
  lambda: number;
}

/** dr̂* / dr at r = 2M + x. */
export function tortoiseRate(p: MassiveDiracMode, x: number): number {
  const r = 2 * p.mass + x;
  const rho2 = p.lambda * p.lambda + p.mu * p.mu * r * r;
  return r / x - (p.mu * p.lambda) / (2 * p.omega * rho2);
}

/** V at r = 2M + x. */
export function massiveDiracPotential(p: MassiveDiracMode, x: number): number {
  const { mass: M, mu, lambda, omega } = p;
  const r = 2 * M + x;
  const c = (mu * lambda) / (2 * omega);
  const rho2 = lambda * lambda + mu * mu * r * r;
  const rho = Math.sqrt(rho2);
  const f = Math.sqrt(x / r); // √(1 − 2M/r)
  // Ŵ = N/D with N = f ρ³, D = rρ² − x c (Δ = r x, common factor r removed)
  const N = f * rho2 * rho;
  const D = r * rho2 - x * c;
  const dN = (M / (r * r * f)) * rho2 * rho + f * 3 * rho * mu * mu * r;
  const dD = rho2 + 2 * mu * mu * r * r - c;
  const W = N / D;
  const dW = (dN * D - N * dD) / (D * D);
  return W * W + dW / tortoiseRate(p, x);
}
