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

/** The product of two real coefficient lists, summed in the order `mul` of complexPoly.ts sums (the same doubles). */
function realMul(p: readonly number[], q: readonly number[]): number[] {
  const out = new Array<number>(p.length + q.length - 1).fill(0);
  for (let i = 0; i < p.length; i++) for (let j = 0; j < q.length; j++) out[i + j] += p[i] * q[j];
  return out;
}

/** A complex polynomial from coefficient lists. */
function fromLists(re: readonly number[], im?: readonly number[]): CPoly {
  const out = { re: new Float64Array(re.length), im: new Float64Array(re.length) };
  out.re.set(re);
  if (im) out.im.set(im);
  return out;
}

/**
 * The radial equation of `mode` on `hole`, expanded in powers of r − center
 * (default: powers of r). Every coefficient but U is real, so they are built
 * on plain real lists and U's real and imaginary parts apart, in the order of
 * operations of the complex-polynomial form
 *   U = K·K + (−is)·(Δ'·K) + Δ·(−λ + 4isω r − μ² r²)
 * (the same doubles; measured 4–5× faster, a few % of a greybody factor).
 */
export function radialEquation(hole: KerrHole, mode: RadialMode, center = 0): RadialEquation {
  const { s, omega, lambda } = mode;
  const a = hole.a;
  const c = center;
  const r = [c, 1];
  const delta = realMul([c - hole.rPlus, 1], [c - hole.rMinus, 1]);
  const dDelta = [delta[1], 2 * delta[2]];
  const rr = realMul(r, r);
  const varpi = [rr[0] + a * a, rr[1], rr[2]];
  const K = [varpi[0] * omega + -a * mode.m, varpi[1] * omega, varpi[2] * omega];
  const mu = fieldMassOf(mode);
  // −λ + 4isωr, and −μ²r² for a massive scalar (kept out when μ = 0, so massless is unchanged bit for bit)
  const si = 4 * s * omega;
  const innerRe = mu === 0 ? [-lambda, 0] : [-lambda + rr[0] * (-mu * mu), rr[1] * (-mu * mu), rr[2] * (-mu * mu)];
  const innerIm = mu === 0 ? [c * si, si] : [c * si, si, 0];
  const KK = realMul(K, K);
  const dK = realMul(dDelta, K);
  const dIRe = realMul(delta, innerRe);
  const dIIm = realMul(delta, innerIm);
  const n = Math.max(KK.length, dIRe.length);
  const uRe = new Array<number>(n).fill(0),
    uIm = new Array<number>(n).fill(0);
  for (let i = 0; i < n; i++) {
    uRe[i] = (KK[i] ?? 0) + (dIRe[i] ?? 0);
    uIm[i] = (i < dK.length ? dK[i] * -s : 0) + (dIIm[i] ?? 0);
  }
  const dd = realMul(delta, dDelta);
  return {
    center,
    s,
    A: fromLists(realMul(delta, delta)),
    B: fromLists(dd.map((x) => x * (s + 1))),
    C: fromLists(uRe, uIm),
    delta: fromLists(delta),
    dDelta: fromLists(dDelta),
    K: fromLists(K),
    varpi: fromLists(varpi),
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
