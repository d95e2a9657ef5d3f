/**
 * The three sectors of the Proca field on Schwarzschild, in units M = 1.
 * Each is d²u/dr*² + (ω² − V)u = 0 for an N-channel vector u (N = 1 or 2),
 *   V = f (μ² + L/r²) I + (f/r²) Q(1/r),  f = 1 − 2/r,  L = l(l+1),
 * with Q a matrix polynomial in y = 1/r (derivation: docs/massive-vector.md):
 *   odd (axial, l ≥ 1):  Q = 0
 *   monopole (l = 0):     Q = 2 − 6y            (u = u2 only, L = 0)
 *   even (polar, l ≥ 1):  Q = [[2 − 6y, −2 + 6y], [−2L, 0]] on u = (u2, u3).
 * Flux weights (the conserved Proca current on the two asymptotic ends):
 *   infinity, u = c e^{±i(k∞ r* + η ln r)}: flux k∞ c† D c, D = diag(μ²/ω², 1/L)
 *   horizon,  u = c e^{−iωr*}:             flux c† H c,
 *     H = [[(L/4 + μ²)/ω, i/2], [−i/2, ω/L]];
 * odd: D = 1, H = ω; monopole: D = μ²/ω², H = μ²/ω.
 */

/** The sector of a Proca mode on Schwarzschild. */
export type ProcaSector = 'odd' | 'even' | 'monopole';

/** One sector at one (l, Mω, Mμ), M = 1. */
export interface SectorModel {
  sector: ProcaSector;
  /** number of coupled channels (1 or 2) */
  channels: 1 | 2;
  l: number;
  omega: number;
  mu: number;
  /** L = l(l+1) */
  L: number;
  /** Q(y) = Σ_j qCoeffs[j] y^j, each a row-major channels×channels real matrix */
  qCoeffs: number[][];
  /** flux weights at infinity (times k∞), per channel, diagonal */
  infinityWeights: number[];
  /** horizon flux matrix (Hermitian), row-major as [re, im] pairs */
  horizonFlux: Array<[number, number]>;
}

/** The sector model of a Proca mode (M = 1; omega = Mω, mu = Mμ). */
export function sectorModel(sector: ProcaSector, l: number, omega: number, mu: number): SectorModel {
  const L = l * (l + 1);
  const w2 = omega * omega;
  if (sector === 'odd') {
    return { sector, channels: 1, l, omega, mu, L, qCoeffs: [[0]], infinityWeights: [1], horizonFlux: [[omega, 0]] };
  }
  if (sector === 'monopole') {
    return {
      sector,
      channels: 1,
      l: 0,
      omega,
      mu,
      L: 0,
      qCoeffs: [[2], [-6]],
      infinityWeights: [(mu * mu) / w2],
      horizonFlux: [[(mu * mu) / omega, 0]],
    };
  }
  return {
    sector,
    channels: 2,
    l,
    omega,
    mu,
    L,
    qCoeffs: [
      [2, -2, -2 * L, 0],
      [-6, 6, 0, 0],
    ],
    infinityWeights: [(mu * mu) / w2, 1 / L],
    horizonFlux: [
      [(L / 4 + mu * mu) / omega, 0],
      [0, 0.5],
      [0, -0.5],
      [omega / L, 0],
    ],
  };
}

/** Q(y) as a row-major real matrix. */
export function qAt(model: SectorModel, y: number): number[] {
  const n = model.channels * model.channels;
  const out = new Array<number>(n).fill(0);
  let yp = 1;
  for (const c of model.qCoeffs) {
    for (let i = 0; i < n; i++) out[i] += c[i] * yp;
    yp *= y;
  }
  return out;
}
