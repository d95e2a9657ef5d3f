/**
 * The Teukolsky radial equation for spin weight s (either sign), written once,
 * with polynomial coefficients (multiplying through by Δ):
 *
 *   Δ² R'' + (s+1) Δ Δ' R' + U(r) R = 0,
 *   U = K² − is Δ' K + Δ(4isωr − λ − μ²r²),   K = (r² + a²)ω − am,   Δ' = 2(r − M),
 *
 * Teukolsky, ApJ 185, 635 (1973). Derivation: docs/method.md, section 1. The
 * mass term −μ²r² is the Klein–Gordon one and is allowed for s = 0 only
 * (massive fields of other spins obey other equations): docs/massive-fields.md.
 *
 * Every user takes its coefficients from `radialEquation`: the integrator
 * right-hand side (rhs.ts, about r+), the horizon series (about r+), the
 * far-zone series (about 0, after R = e^{iσωr*} g), the 'phase' variable
 * (after R = e^{−iφ} u) and the Teukolsky–Starobinsky map (about the switching
 * radius). Expanding about the point where they are used, with Δ built from
 * its roots, keeps Δ(r+) = 0 exact and avoids shifting polynomials afterwards.
 */
import type { KerrHole } from '@penumbra/kerr';
import { add, derivative, mul, scale, type CPoly } from './complexPoly.js';

/** The separated mode of one radial equation. */
export interface RadialMode {
  /** spin weight s of the field component (sign matters: +|s| or −|s|) */
  s: number;
  /** azimuthal number m */
  m: number;
  /** real frequency ω (units of 1/M) */
  omega: number;
  /** radial separation constant λ = A + a²ω² − 2amω for this s */
  lambda: number;
  /** field mass μ (units of 1/M for M = 1, i.e. Mμ/M); s = 0 only; default 0 */
  mu?: number;
}

/** The field mass μ of a mode (0 when absent). */
export function fieldMassOf(mode: RadialMode): number {
  return mode.mu ?? 0;
}

/**
 * A R'' + B R' + C R = 0 with coefficients that are complex polynomials in
 * y = r − center, and the pieces they are built from (same variable).
 */
export interface RadialEquation {
  /** expansion point: coefficients are in powers of y = r − center */
  center: number;
  /** spin weight s of the equation */
  s: number;
  /** coefficient of R'': Δ² (real) */
  A: CPoly;
  /** coefficient of R': (s+1)ΔΔ' (complex after a phase substitution) */
  B: CPoly;
  /** coefficient of R: U (or its substituted form) */
  C: CPoly;
  /** Δ = (r − r+)(r − r−) */
  delta: CPoly;
  /** Δ' = 2(r − M) */
  dDelta: CPoly;
  /** K = (r² + a²)ω − am */
  K: CPoly;
  /** ϖ = r² + a² */
  varpi: CPoly;
  /** W of the substitution R = e^{i∫W/Δ} g already applied, or null for the equation of R itself */
  substituted: CPoly | null;
}

/**
 * Scratch lists for the pieces of `radialEquation` (it runs to completion
 * without re-entering itself; the coefficients it returns are fresh copies):
 * measured, the intermediate arrays were a fifth of a greybody factor's
 * allocations.
 */
const SCRATCH = Array.from({ length: 14 }, () => new Float64Array(8));
const [sDelta, sDDelta, sRR, sVarpi, sK, sInRe, sInIm, sKK, sDK, sDIRe, sDIIm, sURe, sUIm, sDD] = SCRATCH;

/** out = p·q on the first pn and qn coefficients, summed in the order `mul` of complexPoly.ts sums (the same doubles); returns the length. */
function realMulInto(out: Float64Array, p: Float64Array, pn: number, q: Float64Array, qn: number): number {
  const n = pn + qn - 1;
  for (let i = 0; i < n; i++) out[i] = 0;
  for (let i = 0; i < pn; i++) for (let j = 0; j < qn; j++) out[i + j] += p[i] * q[j];
  return n;
}

/**
 * Zero imaginary parts by length, shared by the real coefficients of every
 * equation built here (equations are read, never written: measured, their
 * typed arrays were the larger part of building one).
 */
const ZEROS = Array.from({ length: 9 }, (_, n) => new Float64Array(n));

/** A complex polynomial from the first n entries of coefficient lists (a copy; a real one shares its zero imaginary part). */
function fromLists(n: number, re: Float64Array, im?: Float64Array, reScale = 1): CPoly {
  const out = { re: new Float64Array(n), im: im ? new Float64Array(n) : ZEROS[n] };
  for (let i = 0; i < n; i++) out.re[i] = reScale === 1 ? re[i] : re[i] * reScale;
  if (im) for (let i = 0; i < n; i++) out.im[i] = im[i];
  return out;
}

/**
 * The coefficient lists of `radialEquation` as they lie in its scratch after
 * `fillEquation` (valid until the next call; read, never kept): Δ² (`A`),
 * ΔΔ' before the factor s + 1 (`DD`), U (`CRe`, `CIm`), Δ, K, each with its
 * length. `starobinskyMapAt` reads them in place (a copy per map was
 * measured among a solve's allocations).
 */
export const EQUATION_SCRATCH = {
  A: sKK,
  DD: sDD,
  CRe: sURe,
  CIm: sUIm,
  delta: sDelta,
  dDelta: sDDelta,
  K: sK,
  varpi: sVarpi,
  nA: 0,
  nDD: 0,
  nC: 0,
  nDelta: 0,
};

/**
 * Fill EQUATION_SCRATCH with the radial equation of `mode` about `center`.
 * Every coefficient but U is real, so they are built on plain real lists and
 * U's real and imaginary parts apart, in the order of operations of the
 * complex-polynomial form
 *   U = K·K + (−is)·(Δ'·K) + Δ·(−λ + 4isω r − μ² r²)
 * (the same doubles; measured 4–5× faster, a few % of a greybody factor).
 */
export function fillEquation(hole: KerrHole, mode: RadialMode, center: number): void {
  const { s, omega, lambda } = mode;
  const a = hole.a;
  const c = center;
  // Δ = (r − r+)(r − r−) about c
  sRR[0] = c - hole.rPlus;
  sRR[1] = 1;
  sK[0] = c - hole.rMinus;
  sK[1] = 1;
  const nDelta = realMulInto(sDelta, sRR, 2, sK, 2);
  sDDelta[0] = sDelta[1];
  sDDelta[1] = 2 * sDelta[2];
  // r² about c
  sVarpi[0] = c;
  sVarpi[1] = 1;
  realMulInto(sRR, sVarpi, 2, sVarpi, 2);
  sVarpi[0] = sRR[0] + a * a;
  sVarpi[1] = sRR[1];
  sVarpi[2] = sRR[2];
  sK[0] = sVarpi[0] * omega + -a * mode.m;
  sK[1] = sVarpi[1] * omega;
  sK[2] = sVarpi[2] * omega;
  const mu = fieldMassOf(mode);
  // −λ + 4isωr, and −μ²r² for a massive scalar (kept out when μ = 0, so massless is unchanged bit for bit)
  const si = 4 * s * omega;
  let nIn: number;
  if (mu === 0) {
    nIn = 2;
    sInRe[0] = -lambda;
    sInRe[1] = 0;
    sInIm[0] = c * si;
    sInIm[1] = si;
  } else {
    nIn = 3;
    sInRe[0] = -lambda + sRR[0] * (-mu * mu);
    sInRe[1] = sRR[1] * (-mu * mu);
    sInRe[2] = sRR[2] * (-mu * mu);
    sInIm[0] = c * si;
    sInIm[1] = si;
    sInIm[2] = 0;
  }
  const nKK = realMulInto(sKK, sK, 3, sK, 3);
  const nDK = realMulInto(sDK, sDDelta, 2, sK, 3);
  const nDI = realMulInto(sDIRe, sDelta, nDelta, sInRe, nIn);
  realMulInto(sDIIm, sDelta, nDelta, sInIm, nIn);
  const n = Math.max(nKK, nDI);
  for (let i = 0; i < n; i++) {
    sURe[i] = (i < nKK ? sKK[i] : 0) + (i < nDI ? sDIRe[i] : 0);
    sUIm[i] = (i < nDK ? sDK[i] * -s : 0) + (i < nDI ? sDIIm[i] : 0);
  }
  EQUATION_SCRATCH.nDD = realMulInto(sDD, sDelta, nDelta, sDDelta, 2);
  EQUATION_SCRATCH.nA = realMulInto(sKK, sDelta, nDelta, sDelta, nDelta);
  EQUATION_SCRATCH.nC = n;
  EQUATION_SCRATCH.nDelta = nDelta;
}

/** `shared` where it is the real polynomial of the first n entries of `re` (the same doubles), else a copy of them. */
function sharedOr(shared: CPoly | undefined, n: number, re: Float64Array): CPoly {
  if (shared === undefined || shared.re.length !== n || shared.im !== ZEROS[n]) return fromLists(n, re);
  for (let i = 0; i < n; i++) if (!Object.is(shared.re[i], re[i])) return fromLists(n, re);
  return shared;
}

/**
 * The radial equation of `mode` on `hole`, expanded in powers of r − center (default: powers of r); see
 * `fillEquation`. `like`, an equation built here before (the two-sided route's other spin weight), lends the pieces
 * that hold the same doubles (Δ², Δ, Δ', K, ϖ are free of s and λ; equations are read, never written) rather than
 * copies of them: measured, the second equation's lists were ~1.5 KB of the ~33 KB a greybody factor allocated
 * (s = 1, l = 100, m = 50, a = 0.99, Mω = 1).
 */
export function radialEquation(hole: KerrHole, mode: RadialMode, center = 0, like?: RadialEquation): RadialEquation {
  fillEquation(hole, mode, center);
  const { s } = mode;
  const { nA, nDD, nC, nDelta } = EQUATION_SCRATCH;
  return {
    center,
    s,
    A: sharedOr(like?.A, nA, sKK),
    B: fromLists(nDD, sDD, undefined, s + 1),
    C: fromLists(nC, sURe, sUIm),
    delta: sharedOr(like?.delta, nDelta, sDelta),
    dDelta: sharedOr(like?.dDelta, 2, sDDelta),
    K: sharedOr(like?.K, 3, sK),
    varpi: sharedOr(like?.varpi, 3, sVarpi),
    substituted: null,
  };
}

/**
 * The equation for g where R = e^{iφ} g, φ' = W/Δ, W a polynomial in the same
 * variable as `eq` (which must be an unsubstituted `radialEquation`):
 *
 *   Δ² g'' + [B + 2iWΔ] g' + [U − W² + i(W'Δ + sWΔ')] g = 0
 *
 * (docs/method.md, section 1). W = σωϖ gives the far-zone series,
 * W = −K the 'phase' variable u = e^{iφ}R with the ingoing horizon phase removed.
 */
export function substitutePhase(eq: RadialEquation, W: CPoly): RadialEquation {
  const { delta, dDelta, s } = eq;
  if (eq.substituted) throw new Error('substitutePhase: the equation is already substituted');
  return {
    center: eq.center,
    s,
    A: eq.A,
    B: add(eq.B, scale(mul(W, delta), 0, 2)),
    C: add(eq.C, scale(mul(W, W), -1), scale(add(mul(derivative(W), delta), scale(mul(W, dDelta), s)), 0, 1)),
    delta,
    dDelta,
    K: eq.K,
    varpi: eq.varpi,
    substituted: W,
  };
}
