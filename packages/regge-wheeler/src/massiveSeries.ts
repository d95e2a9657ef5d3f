/**
 * Series solutions of the massive Klein–Gordon field on a Schwarzschild hole,
 *   d²ψ/dr*² + (ω² − V)ψ = 0,  V = f [l(l+1)/r² + 2M/r³ + μ²],  f = 1 − 2M/r,
 * written for this package alone (no code shared with the Teukolsky route).
 * Derivations: docs/massive-fields.md, section 4.
 *
 * Horizon: ψ = e^{−iωr*} Σ a_n x^n, x = r − 2M, from
 *   x(x+b)² h'' + [b(x+b) − 2iω(x+b)³] h' − [L(x+b) + b + μ²(x+b)³] h = 0  (b = 2M).
 * Far zone: ψ_out = e^{iφ} Σ c_n r^{−n}, φ = k r* + β ln r, k = √(ω² − μ²),
 * β = Mμ²/k (the long-range phase of the 2Mμ²/r tail), from
 *   2ikN c_N = E2(N−1) c_{N−1} + E1(N−2) c_{N−2} + E0(N−3) c_{N−3};
 * ψ_in is its complex conjugate (real potential).
 */
import { tortoiseFromHorizonDistance, withPhase, type SeriesValue } from './series.js';

/** A massive-scalar Schwarzschild mode: multipole l, frequency ω, field mass μ, hole mass M (geometric units). */
export interface MassiveScalarMode {
  readonly l: number;
  readonly omega: number;
  /** field mass μ in units of 1/(length), μ < ω */
  readonly mu: number;
  readonly mass: number;
}

const HORIZON_MAX_TERMS = 2000;
const FAR_MAX_TERMS = 600;
const TERM_FLOOR = 1e-17;
/** Relative size of the last kept far-zone term, as for the massless series. */
const FAR_TOLERANCE = 1e-16;

/** k = √(ω² − μ²) and β = Mμ²/k. */
export function massiveWavenumber(p: MassiveScalarMode): { k: number; beta: number } {
  const k = Math.sqrt((p.omega - p.mu) * (p.omega + p.mu));
  return { k, beta: (p.mass * p.mu * p.mu) / k };
}

/** The ingoing horizon solution ψ = e^{−iωr*} h (h → 1 at the horizon) and dψ/dr* at r = 2M + x. */
export function massiveHorizonSeries(p: MassiveScalarMode, x: number): SeriesValue {
  const b = 2 * p.mass;
  const L = p.l * (p.l + 1);
  const w = p.omega;
  const mu2 = p.mu * p.mu;
  // P2 = b²x + 2bx² + x³ (real); P1 = b(x+b) − 2iω(x+b)³; P0 = −[L(x+b) + b + μ²(x+b)³] (real).
  const P2 = [0, b * b, 2 * b, 1];
  const P1r = [b * b, b, 0, 0];
  const P1i = [-2 * w * b * b * b, -6 * w * b * b, -6 * w * b, -2 * w];
  const P0 = [-(L * b + b + mu2 * b * b * b), -(L + 3 * mu2 * b * b), -3 * mu2 * b, -mu2];
  const aRe = [1],
    aIm = [0];
  let hRe = 1,
    hIm = 0,
    dRe = 0,
    dIm = 0;
  let xPow = 1;
  let small = 0;
  let converged = false;
  let n = 0;
  for (; n < HORIZON_MAX_TERMS; n++) {
    // coefficient of x^n: Σ_j P2_j (n−j+2)(n−j+1) a_{n−j+2} + Σ_j P1_j (n−j+1) a_{n−j+1} + Σ_j P0_j a_{n−j} = 0
    let sRe = 0,
      sIm = 0;
    for (let j = 2; j <= 3; j++) {
      const i = n - j + 2;
      if (i < 0) continue;
      const f = P2[j] * i * (i - 1);
      sRe += f * aRe[i];
      sIm += f * aIm[i];
    }
    for (let j = 1; j <= 3; j++) {
      const i = n - j + 1;
      if (i < 0) continue;
      sRe += i * (P1r[j] * aRe[i] - P1i[j] * aIm[i]);
      sIm += i * (P1r[j] * aIm[i] + P1i[j] * aRe[i]);
    }
    for (let j = 0; j <= 3; j++) {
      const i = n - j;
      if (i < 0) continue;
      sRe += P0[j] * aRe[i];
      sIm += P0[j] * aIm[i];
    }
    // a_{n+1} (n+1) [b² n + P1_0] = −s, P1_0 = b² − 2iωb³
    const dr = (n + 1) * (b * b * n + P1r[0]),
      di = (n + 1) * P1i[0];
    const den = dr * dr + di * di;
    const nextRe = -(sRe * dr + sIm * di) / den;
    const nextIm = -(sIm * dr - sRe * di) / den;
    aRe.push(nextRe);
    aIm.push(nextIm);
    const derivWeight = (n + 1) * xPow;
    xPow *= x;
    hRe += nextRe * xPow;
    hIm += nextIm * xPow;
    dRe += nextRe * derivWeight;
    dIm += nextIm * derivWeight;
    const size = Math.hypot(nextRe, nextIm) * xPow * (n + 2);
    if (size < TERM_FLOOR * (Math.hypot(hRe, hIm) + x * Math.hypot(dRe, dIm))) {
      if (++small >= 4) {
        converged = true;
        n++;
        break;
      }
    } else small = 0;
  }
  // ψ = e^{−iωr*} h, dψ/dr* = e^{−iωr*}(−iωh + f h').
  const r = b + x;
  const f = x / r;
  const qRe = w * hIm + f * dRe;
  const qIm = -w * hRe + f * dIm;
  const ph = -w * tortoiseFromHorizonDistance(p.mass, x);
  return withPhase(ph, hRe, hIm, qRe, qIm, n + 1, converged);
}

/** The outgoing far-zone solution ψ_out = e^{i(kr* + β ln r)} Σ c_n r^{−n} and dψ/dr* at r. */
export function massiveOutgoingFarSeries(p: MassiveScalarMode, r: number): SeriesValue {
  const b = 2 * p.mass;
  const L = p.l * (p.l + 1);
  const { k, beta } = massiveWavenumber(p);
  // Terms T_n = c_n r^{−n}; the recurrence is carried on the terms.
  const tRe = [1],
    tIm = [0];
  let uRe = 1,
    uIm = 0,
    duRe = 0,
    duIm = 0; // Σ T_n and Σ −n T_n (= r du/dr)
  let small = 0;
  let converged = false;
  let previous = Infinity;
  let N = 1;
  const flat = Math.ceil(p.l) + 2;
  for (; N <= FAR_MAX_TERMS; N++) {
    let sRe = 0,
      sIm = 0;
    // E2(n) = n(n+1) + 2kβb − β² − L + i[2n(kb − β) − β]
    {
      const n = N - 1;
      const er = n * (n + 1) + 2 * k * beta * b - beta * beta - L;
      const ei = 2 * n * (k * b - beta) - beta;
      sRe += (er * tRe[n] - ei * tIm[n]) / r;
      sIm += (er * tIm[n] + ei * tRe[n]) / r;
    }
    // E1(n) = −2bn(n+1) − nb + 2bβ² − b + Lb + i[4nbβ + 3bβ]
    if (N >= 2) {
      const n = N - 2;
      const er = -2 * b * n * (n + 1) - n * b + 2 * b * beta * beta - b + L * b;
      const ei = 4 * n * b * beta + 3 * b * beta;
      sRe += (er * tRe[n] - ei * tIm[n]) / (r * r);
      sIm += (er * tIm[n] + ei * tRe[n]) / (r * r);
    }
    // E0(n) = b²[n(n+1) + n + 1 − β²] − i b²β(2n + 2)
    if (N >= 3) {
      const n = N - 3;
      const er = b * b * (n * (n + 1) + n + 1 - beta * beta);
      const ei = -b * b * beta * (2 * n + 2);
      sRe += (er * tRe[n] - ei * tIm[n]) / (r * r * r);
      sIm += (er * tIm[n] + ei * tRe[n]) / (r * r * r);
    }
    // T_N = s / (2ikN)
    const d = 2 * k * N;
    const nextRe = sIm / d,
      nextIm = -sRe / d;
    tRe.push(nextRe);
    tIm.push(nextIm);
    uRe += nextRe;
    uIm += nextIm;
    duRe -= N * nextRe;
    duIm -= N * nextIm;
    const size = Math.hypot(nextRe, nextIm) * (N + 1);
    const scale = Math.hypot(uRe, uIm);
    if (size < FAR_TOLERANCE * scale) {
      if (++small >= 3) {
        converged = true;
        break;
      }
    } else {
      small = 0;
      // Growing terms past the flat-space part: the asymptotic series has turned; the caller moves outward.
      if (N > flat && size > previous && size > 1e-3 * scale) break;
    }
    previous = size;
  }
  // ψ = e^{iφ} u, dψ/dr* = e^{iφ}(iφ_* u + f du/dr), φ_* = k + βf/r.
  const f = 1 - b / r;
  const phiStar = k + (beta * f) / r;
  const qRe = -phiStar * uIm + (f * duRe) / r;
  const qIm = phiStar * uRe + (f * duIm) / r;
  const ph = k * tortoiseFromHorizonDistance(p.mass, r - b) + beta * Math.log(r);
  return withPhase(ph, uRe, uIm, qRe, qIm, N + 1, converged);
}
