/**
 * Leaver's three-term recurrence for the angular equation (J. Math. Phys. 27,
 * 1238 (1986)), written once for real and complex c. With x = cosθ,
 * k₋ = |m − s|/2, k₊ = |m + s|/2, kΣ = k₋ + k₊ and the expansion about x = −1
 *   S = e^{σcx} (1 + x)^{k₋} (1 − x)^{k₊} Σ_n a_n (1 + x)^n,   σ = ±1,
 * the coefficients obey α_n a_{n+1} + β_n a_n + γ_n a_{n−1} = 0 with
 *   α_n = −2(n + 1)(n + 2k₋ + 1)
 *   β_n = n(n − 1) + 2n·(kΣ + 1 − 2σc) + β₀
 *   β₀  = −(2c·(2σk₋ + s + σ) − kΣ(kΣ + 1)) − (c² + s(s + 1) + A)
 *   γ_n = 2σc·(n + kΣ + σs)
 * (derived in docs/spheroidal.md). The n-dependence is real; c and A enter
 * only through three scalars (`leaverScalars`), evaluated in the caller's
 * arithmetic (real: leaver.ts, complex: complexLeaver.ts).
 */
export interface LeaverRecurrence {
  readonly s: number;
  readonly sigma: 1 | -1;
  readonly kMinus: number;
  readonly kPlus: number;
  readonly kSum: number;
  /** α_n */
  alpha(n: number): number;
  /** n(n − 1), the c-free part of β_n */
  betaQuadratic(n: number): number;
  /** 2n, the weight of the slope kΣ + 1 − 2σc in β_n */
  betaLinear(n: number): number;
  /** n + kΣ + σs, the weight of 2σc in γ_n */
  gammaWeight(n: number): number;
}

/** The recurrence for (s, m) expanded about the pole picked by σ. */
export function leaverRecurrence(s: number, m: number, sigma: 1 | -1): LeaverRecurrence {
  const kMinus = Math.abs(m - s) / 2;
  const kPlus = Math.abs(m + s) / 2;
  const kSum = kMinus + kPlus;
  return {
    s,
    sigma,
    kMinus,
    kPlus,
    kSum,
    alpha: (n) => -2 * (n + 1) * (n + 2 * kMinus + 1),
    betaQuadratic: (n) => n * (n - 1),
    betaLinear: (n) => 2 * n,
    gammaWeight: (n) => n + kSum + sigma * s,
  };
}

/** The few operations the c-dependent scalars need, for numbers or complex pairs. */
export interface Arithmetic<T> {
  add(a: T, b: T): T;
  sub(a: T, b: T): T;
  mul(a: T, b: T): T;
  neg(a: T): T;
  scale(a: T, k: number): T;
  real(k: number): T;
}

/** Plain numbers (real c and A). */
export const realArithmetic: Arithmetic<number> = {
  add: (a, b) => a + b,
  sub: (a, b) => a - b,
  mul: (a, b) => a * b,
  neg: (a) => -a,
  scale: (a, k) => a * k,
  real: (k) => k,
};

/** The c- and A-dependent scalars: β_n = n(n − 1) + 2n·slope + β₀, γ_n = gammaScale·(n + kΣ + σs). */
export interface LeaverScalars<T> {
  beta0: T;
  slope: T;
  gammaScale: T;
}

/** β₀, the slope and 2σc from c and A, in any arithmetic: the only place these formulas are written. */
export function leaverScalars<T>(r: LeaverRecurrence, ar: Arithmetic<T>, c: T, A: T): LeaverScalars<T> {
  const { s, sigma, kMinus, kSum } = r;
  const w = 2 * sigma * kMinus + s + sigma;
  const beta0 = ar.sub(
    ar.neg(ar.sub(ar.scale(ar.scale(c, 2), w), ar.real(kSum * (kSum + 1)))),
    ar.add(ar.add(ar.mul(c, c), ar.real(s * (s + 1))), A),
  );
  const slope = ar.sub(ar.real(kSum + 1), ar.scale(c, 2 * sigma));
  const gammaScale = ar.scale(c, 2 * sigma);
  return { beta0, slope, gammaScale };
}
