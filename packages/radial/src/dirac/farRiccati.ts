/**
 * The far-zone carry of the massive Dirac pair (docs/massive-dirac.md,
 * section 3): the ratio w = P₋/P₊ of the incoming wave obeys
 *
 *   w' = G₊ + 2i(K/Δ) w − G₋ w²,   G± = (λ ± iμr)/√Δ,
 *
 * and has no phase: where the wave is locally plane it varies on the scale r,
 * not on the wavelength (the outgoing wave needs no carry of its own: it is
 * (P̄₋, P̄₊) of the incoming one). It is found rung by rung (r → r/4, in
 * u = ln r) by the defect correction w ← w + (w' − f(w))/∂f/∂w with w' by
 * Chebyshev collocation, started from the root of f(w) = 0 that tends to the
 * wave's limit −μ/(ω + k∞): each pass gains a factor of the wavelength over r
 * (the idea of Agocs & Barnett, SIAM J. Numer. Anal. 62 (2024), as in
 * riccatiStep.ts), so the cost does not grow with the oscillations crossed.
 * A perturbation of w would oscillate on the wavelength; the smooth solution
 * is the wave's ratio, unique up to terms exponentially small in kr. The
 * top rung is checked against the series and each rung against the one
 * outside it at their common end; the carry stops at the first rung whose
 * correction stops contracting (a turning point near) or whose mismatch or
 * unresolved tail exceeds the tolerance, and the ODE takes over there.
 */
import { chebyshevDerivative, chebyshevRule, chebyshevTail } from '../chebyshev.js';
import type { C } from './complex2.js';
import type { DiracRadialProblem } from './equation.js';

/** The carried ratio down the ladder and what it took. */
export interface FarCarry {
  /** w at ladder[0], ladder[1], … as far as the carry got (ratios[0] is the start) */
  ratios: C[];
  /** error bound of each ratio: its rung's last correction and unresolved tail, plus its mismatch with the rung outside it (0 for the start) */
  errors: number[];
  /** evaluations of the Riccati coefficients (nodes × (1 + passes)) */
  evaluations: number;
}

/** Nodes per rung (as RICCATI_NODES: a rung r → 4r in ln r is resolved to ~1e-15 by 16). */
const NODES = 16;
/** Ratio of a rung's ends. */
const RUNG = 4;
const MAX_PASSES = 30;
/**
 * A rung's corrections stop below this share of the tolerance: its error
 * bound counts the last correction in full, which bounds the rest while
 * they contract by at least half per pass (a slower pass ends the rung).
 */
const STOP = 0.1;
/**
 * Largest WKB ratio |dk/dr|/k² (k² = (K/Δ)² − (λ² + μ²r²)/Δ, the local
 * wavenumber) at a rung's inner end: the corrections contract by about this
 * factor per pass (the value of hybridLeg.ts's WKB_LIMIT).
 */
const WKB_LIMIT = 0.08;
/**
 * Least phase ∫k dr on a rung: a rung costs 16 × (1 + passes) evaluations,
 * about what the integrator spends on a few radians (common practice, no source).
 */
const MIN_PHASE = 8;

/** k² of the pair at r (see WKB_LIMIT). */
function localWavenumberSquared(p: DiracRadialProblem, r: number): number {
  const { hole, omega, m, mu, lambda } = p;
  const delta = (r - hole.rPlus) * (r - hole.rMinus);
  const kd = ((r * r + hole.a * hole.a) * omega - hole.a * m) / delta;
  return kd * kd - (lambda * lambda + mu * mu * r * r) / delta;
}

/**
 * The radii from `from` inward by factors of RUNG, as far as the rungs are
 * locally plane-wave (WKB ratio below WKB_LIMIT at the inner end), hold at
 * least MIN_PHASE radians and stay outside `floor`; just [from] when no rung qualifies.
 */
export function carryLadder(p: DiracRadialProblem, from: number, floor: number): number[] {
  const ladder = [from];
  for (;;) {
    const outer = ladder[ladder.length - 1];
    const inner = outer / RUNG;
    if (inner < floor) return ladder;
    const k2 = localWavenumberSquared(p, inner);
    const k2Outer = localWavenumberSquared(p, outer);
    if (!(k2 > 0)) return ladder;
    const dk2 = (localWavenumberSquared(p, inner * (1 + 1e-6)) - k2) / (inner * 1e-6);
    if (!(Math.abs(dk2) / (2 * k2 ** 1.5) < WKB_LIMIT)) return ladder;
    if (!(0.5 * (Math.sqrt(k2) + Math.sqrt(k2Outer)) * (outer - inner) > MIN_PHASE)) return ladder;
    ladder.push(inner);
  }
}

/**
 * The wave's ratio w down the `ladder` (descending radii), given its value
 * `start` at ladder[0] (from the series), as far as each rung's error stays
 * within `tol`.
 */
export function carryFarRatio(p: DiracRadialProblem, ladder: readonly number[], start: C, tol: number): FarCarry {
  const { hole, omega, m, mu, lambda } = p;
  const { a, rPlus, rMinus } = hole;
  const rule = chebyshevRule(NODES);
  const n = rule.n;
  const rungs = ladder.length - 1;
  // per node: f = α + 2i kd w − β w² with α = G₊ = (aRe, aIm), β = G₋ = (aRe, bIm)
  const aRe = new Float64Array(n);
  const aIm = new Float64Array(n);
  const bIm = new Float64Array(n);
  const kd = new Float64Array(n);
  const r = new Float64Array(n);
  const wRe = new Float64Array(n);
  const wIm = new Float64Array(n);
  const dRe = new Float64Array(n);
  const dIm = new Float64Array(n);
  let outer: C = start;
  const ratios: C[] = [start];
  const errors = [0];
  let evaluations = 0;
  for (let k = 0; k < rungs; k++) {
    const ub = Math.log(ladder[k]);
    const half = 0.5 * (ub - Math.log(ladder[k + 1]));
    const mid = ub - half;
    for (let j = 0; j < n; j++) {
      r[j] = j === 0 ? ladder[k] : j === n - 1 ? ladder[k + 1] : Math.exp(mid + half * rule.t[j]);
      const delta = (r[j] - rPlus) * (r[j] - rMinus);
      const sq = Math.sqrt(delta);
      kd[j] = ((r[j] * r[j] + a * a) * omega - a * m) / delta;
      aRe[j] = lambda / sq;
      aIm[j] = (mu * r[j]) / sq;
      bIm[j] = -aIm[j];
      // roots of β w² − 2i kd w − α = 0: w = (i kd ± √(αβ − kd²))/β, αβ = (λ² + μ²r²)/Δ real;
      // the wave's is the smaller one (→ −μ/(ω + k∞) at infinity)
      const disc = aRe[j] * aRe[j] + aIm[j] * aIm[j] - kd[j] * kd[j];
      const rootRe = disc >= 0 ? Math.sqrt(disc) : 0;
      const rootIm = disc >= 0 ? 0 : Math.sqrt(-disc);
      // w₁,₂ = (±rootRe + i(kd ± rootIm))/β, written out (a pair of arrays per node was most of the carry's garbage)
      const yr = aRe[j];
      const yi = bIm[j];
      const yd = yr * yr + yi * yi;
      const x1i = kd[j] + rootIm;
      const w1r = (rootRe * yr + x1i * yi) / yd;
      const w1i = (x1i * yr - rootRe * yi) / yd;
      const x2i = kd[j] - rootIm;
      const w2r = (-rootRe * yr + x2i * yi) / yd;
      const w2i = (x2i * yr + rootRe * yi) / yd;
      const first = w1r * w1r + w1i * w1i <= w2r * w2r + w2i * w2i;
      wRe[j] = first ? w1r : w2r;
      wIm[j] = first ? w1i : w2i;
    }
    evaluations += n;
    let previous = Infinity;
    let last = Infinity;
    let scale = 0;
    for (let pass = 1; pass <= MAX_PASSES; pass++) {
      let largest = 0;
      chebyshevDerivative(rule, wRe, wIm, 0, dRe, dIm);
      for (let i = 0; i < n; i++) {
        const inv = 1 / (half * r[i]); // dw/dr = (dw/dt)/(half · r)
        dRe[i] *= inv;
        dIm[i] *= inv;
      }
      scale = 0;
      for (let i = 0; i < n; i++) {
        const yr = wRe[i];
        const yi = wIm[i];
        const s = kd[i];
        // f = α + 2i kd w − β w²; ∂f/∂w = 2i kd − 2βw
        const bwr = aRe[i] * yr - bIm[i] * yi;
        const bwi = aRe[i] * yi + bIm[i] * yr;
        const fr = aRe[i] - 2 * s * yi - (bwr * yr - bwi * yi);
        const fi = aIm[i] + 2 * s * yr - (bwr * yi + bwi * yr);
        const gr = -2 * bwr;
        const gi = 2 * s - 2 * bwi;
        // w += (w' − f)/∂f/∂w
        const rr = dRe[i] - fr;
        const ri = dIm[i] - fi;
        const gg = gr * gr + gi * gi;
        const cr = (rr * gr + ri * gi) / gg;
        const ci = (ri * gr - rr * gi) / gg;
        wRe[i] = yr + cr;
        wIm[i] = yi + ci;
        // squared moduli (|w| is of order 1): Math.hypot here was half the carry's cost
        largest = Math.max(largest, cr * cr + ci * ci);
        scale = Math.max(scale, wRe[i] * wRe[i] + wIm[i] * wIm[i]);
      }
      evaluations += n;
      largest = Math.sqrt(largest);
      scale = Math.sqrt(scale);
      last = largest;
      if (largest <= Math.max(1e-15 * scale, STOP * tol)) break;
      if (pass > 2 && largest > 0.5 * previous) break; // stalled: rounding or a turning point
      previous = largest;
    }
    const tail = chebyshevTail(rule, wRe, wIm);
    const gap = Math.hypot(wRe[0] - outer[0], wIm[0] - outer[1]);
    const error = last + tail + gap;
    if (!(error <= tol)) break;
    outer = [wRe[n - 1], wIm[n - 1]];
    ratios.push(outer);
    errors.push(error);
  }
  return { ratios, errors, evaluations };
}
