/**
 * Flux normalisations that turn radial amplitudes into greybody factors.
 * Conventions (docs/method.md): the +|s| solution is normalised to
 * R → Δ^{−s} e^{−ikr*} at the horizon and R → Z_in e^{−iωr*}/r +
 * Z_out e^{iωr*}/r^{2s+1} at infinity; the −|s| solution to R → Δ^{s} e^{−ikr*}
 * and R → Y_in e^{−iωr*}/r + Y_out e^{iωr*} r^{2s−1}.
 *
 * Sources: Teukolsky & Press, ApJ 193, 443 (1974) for the energy fluxes and the
 * Teukolsky–Starobinsky constants; the forms below are rewritten for the
 * normalisation above and derived in docs/method.md.
 */
import type { KerrHole } from '@penumbra/kerr';

/** Γ = horizonFactor / |Z_in|² for the +|s| field. */
export function horizonFactor(s: number, hole: KerrHole, omega: number, k: number): number {
  const tM = 2 * hole.mass * hole.rPlus; // r+² + a²
  const kap = hole.kappa;
  switch (s) {
    case 0:
      return (k / omega) * tM;
    case 0.5:
      return 1;
    case 1:
      return omega / k / tM;
    case 2:
      return (omega * omega * omega) / (k * (k * k + kap * kap) * tM * tM * tM);
    default:
      throw new RangeError(`unsupported spin ${s}`);
  }
}

/**
 * |C_s|², the squared Teukolsky–Starobinsky constant, from λ_{+s}
 * (λ_{−s} = λ_{+s} + 2s because A_{−s} = A_{+s} + 2s).
 */
export function starobinskyConstantSquared(s: number, lambdaPlus: number, hole: KerrHole, m: number, omega: number): number {
  const a = hole.a;
  const M = hole.mass;
  const lm = lambdaPlus + 2 * s; // λ_{−s}
  const amw = a * m * omega;
  const a2w2 = a * a * omega * omega;
  // |C|² is a squared modulus. For large mc > 0 it becomes exponentially small
  // (for s = 1/2 it is Chandrasekhar's Dirac eigenvalue squared), and forming
  // it from A cancels to rounding level, which may leave −1e-13: clamp at zero.
  // The reflection it multiplies is then correspondingly tiny.
  switch (s) {
    case 0:
      return 1;
    case 0.5:
      return Math.max(lm, 0);
    case 1:
      return Math.max(lm * lm + 4 * amw - 4 * a2w2, 0);
    case 2: {
      const Q = lm + 2;
      return Math.max(
        (Q * Q + 4 * amw - 4 * a2w2) * ((Q - 2) * (Q - 2) + 36 * amw - 36 * a2w2) +
          (2 * Q - 1) * (96 * a2w2 - 48 * amw) +
          144 * omega * omega * (M * M - a * a),
        0,
      );
    }
    default:
      throw new RangeError(`unsupported spin ${s}`);
  }
}

/**
 * |h_s|² where D^{2s} maps the horizon-normalised −|s| ingoing solution
 * Δ^{s} e^{−ikr*} to h_s Δ^{−s} e^{−ikr*}, D = ∂_r − iK/Δ:
 * h_s = Π_{j=0}^{2s−1} 2(r+² + a²)((s − j)κ − ik).
 */
export function horizonMapSquared(s: number, hole: KerrHole, k: number): number {
  const tM = 2 * hole.mass * hole.rPlus;
  const kap = hole.kappa;
  let prod = 1;
  for (let j = 0; j < 2 * s; j++) {
    const p = (s - j) * kap;
    prod *= 4 * tM * tM * (p * p + k * k);
  }
  return prod;
}
