import { cosDiagonal, cosOffDiagonal } from './coupling.js';
import { validateModeNumbers } from './problem.js';
import { sphericalA0 } from './quantum.js';

/**
 * Small-c series A = A₀ + A₁c + A₂c² + O(c³) from Rayleigh–Schrödinger
 * perturbation theory of K(c) = K₀ + c·2sX − c²X² (the expansion of Press &
 * Teukolsky, ApJ 185, 649 (1973) and Seidel, CQG 6, 1057 (1989), rederived in
 * docs/spheroidal.md):
 *   A₀ = (l − s)(l + s + 1)
 *   A₁ = 2s⟨l|x|l⟩ = −2ms²/(l(l + 1))
 *   A₂ = −⟨l|x²|l⟩ + 4s²[h(l+1)/(A₀(l) − A₀(l+1)) + h(l)/(A₀(l) − A₀(l−1))]
 *      = −h(l) − h(l+1) − m²s²/(l²(l+1)²) − 2s²h(l+1)/(l+1) + 2s²h(l)/l
 * with h(l) = ⟨l|x|l−1⟩² = (l² − m²)(l² − s²)/(l²(2l − 1)(2l + 1)).
 */
export function smallCSeries(s: number, l: number, m: number): [number, number, number] {
  validateModeNumbers({ s, l, m }, ['s', 'l', 'm'], '');
  const A0 = sphericalA0(s, l);
  const diag = cosDiagonal(l, m, s);
  const hUp = cosOffDiagonal(l, m, s) ** 2; // h(l+1)
  const hDown = cosOffDiagonal(l - 1, m, s) ** 2; // h(l), zero at l = lmin
  const A1 = 2 * s * diag;
  const A2 = -hDown - hUp - diag * diag - (2 * s * s * hUp) / (l + 1) + (l > 0 ? (2 * s * s * hDown) / l : 0);
  return [A0, A1, A2];
}
