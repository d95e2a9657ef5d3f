/**
 * Low-frequency greybody factor of Page, Phys. Rev. D 13, 198 (1976) and
 * Starobinsky & Churilov, Sov. Phys. JETP 38, 1 (1974), as written in
 * /work/shared/physics.md, evaluated at a = 0: r+ − r− = 2M, κ = 1/(4M),
 * ω − mΩ_H = ω.
 */
function factorial(n: number): number {
  let f = 1;
  for (let i = 2; i <= n; i++) f *= i;
  return f;
}

/** n!! for a positive integer n (for half-integer l, 2l + 1 is even: 2!! = 2, 4!! = 8). */
function doubleFactorial(n: number): number {
  let f = 1;
  for (let i = n; i > 1; i -= 2) f *= i;
  return f;
}

export function pageLowFrequencyGamma(spin: number, l: number, omega: number, mass = 1): number {
  const fermion = !Number.isInteger(spin);
  const kappa = 1 / (4 * mass);
  const prefactor = ((factorial(l - spin) * factorial(l + spin)) / (factorial(2 * l) * doubleFactorial(2 * l + 1))) ** 2;
  let product = 1;
  if (fermion) {
    for (let n = 1; n <= l + 0.5; n++) product *= 1 + (omega / ((n - 0.5) * kappa)) ** 2;
  } else {
    for (let n = 1; n <= l; n++) product *= 1 + (omega / (n * kappa)) ** 2;
  }
  const bosonFactor = fermion ? 1 : (2 * omega) / kappa;
  return prefactor * product * bosonFactor * (2 * mass * omega) ** (2 * l + 1);
}
