/**
 * The Chandrasekhar angular pair of the massive Dirac field as a symmetric
 * matrix eigenproblem (derivation: docs/massive-dirac.md).
 *
 * With ℒ = D − aω sinθ, ℒ† = D̃ + aω sinθ, D = ∂θ + m/sinθ + ½cotθ,
 * D̃ = ∂θ − m/sinθ + ½cotθ, the pair
 *   ℒ S₊ = −(λ − aμ cosθ) S₋,   ℒ† S₋ = (λ + aμ cosθ) S₊
 * is λ (S₊, S₋) = H (S₊, S₋) with H = [[−aμ cosθ, ℒ†], [−ℒ, aμ cosθ]].
 * Basis: u_j, the orthonormal s = +1/2 spin-weighted harmonics (j ≥ |m|), and
 * v_j = D u_j/(j + ½), orthonormal because D̃D u_j = −(j + ½)² u_j. With
 * X = ⟨u|cosθ|u⟩ (coupling.ts) and L_j = (j + ½)²:
 *   ⟨v_i|cosθ|v_j⟩ = ½[(L_i + L_j − 1) X_ij + 2m δ_ij] / ((i + ½)(j + ½)),
 *   ⟨u_i|sinθ|v_j⟩ = ½[(L_i − L_j − 1) X_ij + 2m δ_ij] / (j + ½).
 */
import { Matrix } from 'ml-matrix';
import { cosDiagonal, cosOffDiagonal } from './coupling.js';

const S = 0.5;

function cosElement(ji: number, jj: number, m: number): number {
  if (ji === jj) return cosDiagonal(ji, m, S);
  if (ji === jj + 1) return cosOffDiagonal(jj, m, S);
  if (jj === ji + 1) return cosOffDiagonal(ji, m, S);
  return 0;
}

/** ⟨v_i|cosθ|v_j⟩ for the basis v_j = D u_j/(j + ½). */
export function cosElementLowered(ji: number, jj: number, m: number): number {
  const Li = (ji + 0.5) ** 2;
  const Lj = (jj + 0.5) ** 2;
  return (0.5 * ((Li + Lj - 1) * cosElement(ji, jj, m) + (ji === jj ? 2 * m : 0))) / ((ji + 0.5) * (jj + 0.5));
}

/** ⟨u_i|sinθ|v_j⟩. */
export function sinElementMixed(ji: number, jj: number, m: number): number {
  const Li = (ji + 0.5) ** 2;
  const Lj = (jj + 0.5) ** 2;
  return (0.5 * ((Li - Lj - 1) * cosElement(ji, jj, m) + (ji === jj ? 2 * m : 0))) / (jj + 0.5);
}

/**
 * The truncated matrix H in the interleaved basis (u_{j0}, v_{j0}, u_{j0+1}, …),
 * j0 = |m|, with `count` values of j (size 2·count).
 */
export function diracAngularMatrix(m: number, aOmega: number, aMu: number, count: number): Matrix {
  const j0 = Math.abs(m);
  const H = new Matrix(2 * count, 2 * count);
  for (let p = 0; p < count; p++) {
    for (let q = Math.max(0, p - 1); q <= Math.min(count - 1, p + 1); q++) {
      const ji = j0 + p;
      const jj = j0 + q;
      H.set(2 * p, 2 * q, -aMu * cosElement(ji, jj, m));
      H.set(2 * p + 1, 2 * q + 1, aMu * cosElementLowered(ji, jj, m));
      H.set(2 * p, 2 * q + 1, (p === q ? -(jj + 0.5) : 0) + aOmega * sinElementMixed(ji, jj, m));
      H.set(2 * q + 1, 2 * p, H.get(2 * p, 2 * q + 1));
    }
  }
  return H;
}
