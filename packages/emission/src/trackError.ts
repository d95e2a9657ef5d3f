/**
 * The table error of f and g carried along an evaporation track
 * (evaporation.ts), with u = ln(M₀/M) and t̂ = t/M₀³ (G = c = ħ = 1):
 *
 * Lifetime. τ = ∫ M² dM/f = M₀³ ∫ e^{−3u}/f du. If f carries a relative error
 * |δf/f| ≤ ε_f(M, a*), then |δτ| ≤ ∫ ε_f dt to first order: the lifetime's
 * relative error is at most the time-weighted average of f's local relative
 * error over the track (dt = M² dM/f, so the hole's slow, massive phase
 * weighs most). The a* track moves too: d(a*)/du = −a*(g/f − 2), so an error
 * δa* obeys d(δa*)/du = J δa* + S with J = −(g/f − 2) − a* ∂(g/f)/∂a* and
 * |S| ≤ a*(g/f)(ε_f + ε_g); A(u) with A' = J A + a*(g/f)(ε_f + ε_g), A(0) = 0,
 * bounds |δa*|, and enters f as |∂ ln f/∂a*|·A. So the integrand is
 * ε = ε_f + |∂ ln f/∂a*|·A, and δτ ≤ ∫ ε dt (a non-rotating hole: A ≡ 0).
 *
 * Final stage. The time left from mass M is R(M) = ∫₀^M m²/f dm; the stage of
 * length τ starts at M_τ with R(M_τ) = τ, so δM_τ = δR/R'(M_τ) and
 * δM_τ/M_τ = (∫_stage ε dt)·f(M_τ)/M_τ³ (= ε/3 when f is constant).
 *
 * The integrals run over the ODE steps (Gauss–Legendre, 5 points per step,
 * a* from the cubic Hermite interpolant); ∂/∂a* by a one-sided difference of
 * 1e-4. The estimate is first order in the table errors (which are ≤ 1e-2).
 */
import type { MassLossRates } from './massLoss.js';

/** One stored ODE point: u, state and its derivative. */
export interface TrackNode {
  u: number;
  y: number[];
  dy: number[];
}

/** 5-point Gauss–Legendre nodes and weights on [−1, 1]. */
export const GL5 = [
  [-0.906179845938664, 0.236926885056189],
  [-0.5384693101056831, 0.4786286704993665],
  [0, 0.5688888888888889],
  [0.5384693101056831, 0.4786286704993665],
  [0.906179845938664, 0.236926885056189],
];

/** Cubic Hermite value of component k between nodes p and q at fraction s. */
export function hermite(p: TrackNode, q: TrackNode, k: number, s: number): number {
  const h = q.u - p.u;
  const s2 = s * s;
  const s3 = s2 * s;
  return (2 * s3 - 3 * s2 + 1) * p.y[k] + (s3 - 2 * s2 + s) * h * p.dy[k] + (-2 * s3 + 3 * s2) * q.y[k] + (s3 - s2) * h * q.dy[k];
}

/** The table error along a track: ∫ ε dt̂ per step and to the end, the a* error bound at each node, the closed-form rest's share. */
export interface TrackError {
  /** ∫ ε dt̂ over each step k (from node k to k + 1; units of M₀³) */
  steps: number[];
  /** ∫ ε dt̂ from node k to the end of the life, summed from the end (no cancellation for a short final stage) */
  toEnd: number[];
  /** bound on |δa*| at each node */
  aStar: number[];
  /** ε at the last node (f, and so ε, constant in the closed-form rest) */
  endRate: number;
  /** ∫ ε dt̂ over the closed-form rest */
  rest: number;
  /** ∫ ε dt̂ over the whole life */
  total: number;
}

/** Local quantities at one (u, a*) given the a* error bound A there. */
function local(rates: MassLossRates, m0: number, u: number, a: number, A: number) {
  const mass = m0 * Math.exp(-u);
  const pt = rates.at(mass, a);
  const step = a + 1e-4 <= rates.aMax ? 1e-4 : -1e-4;
  const shifted = rates.values(mass, Math.max(0, a + step));
  const ratio = pt.g / pt.f;
  const dRatio = (shifted.g / shifted.f - ratio) / step;
  const dLnF = (Math.log(shifted.f) - Math.log(pt.f)) / step;
  return {
    f: pt.f,
    epsF: pt.error.f,
    dLnF: Math.abs(dLnF),
    J: -(ratio - 2) - a * dRatio,
    S: a * Math.abs(ratio) * (pt.error.f + pt.error.g),
    eps: pt.error.f + Math.abs(dLnF) * A,
  };
}

/** A(u₀ + x) for A' = J A + S with J, S constant, from A(u₀) = A0. */
function grow(A0: number, J: number, S: number, x: number): number {
  const e = Math.exp(J * x);
  return A0 * e + S * (Math.abs(J * x) < 1e-8 ? x : (e - 1) / J);
}

/** The table error along the ODE nodes of a run (see the module comment). */
export function trackError(nodes: readonly TrackNode[], rates: MassLossRates, m0: number, restTime: number): TrackError {
  const steps: number[] = [];
  const aStar = [0];
  const clampA = (a: number) => Math.max(0, Math.min(a, rates.aMax));
  for (let k = 0; k + 1 < nodes.length; k++) {
    const p = nodes[k];
    const q = nodes[k + 1];
    const h = q.u - p.u;
    // J and S at the Gauss points (with A = 0), averaged over the step for A's growth
    const points = GL5.map(([x, w]) => {
      const s = 0.5 * (x + 1);
      const u = p.u + s * h;
      return { s, w, u, at: local(rates, m0, u, clampA(hermite(p, q, 0, s)), 0) };
    });
    const J = points.reduce((t, pt) => t + pt.w * pt.at.J, 0) / 2;
    const S = points.reduce((t, pt) => t + pt.w * pt.at.S, 0) / 2;
    const A0 = aStar[k];
    let integral = 0;
    for (const pt of points) {
      const A = grow(A0, J, S, pt.s * h);
      integral += (pt.w * 0.5 * h * Math.exp(-3 * pt.u) * (pt.at.epsF + pt.at.dLnF * A)) / pt.at.f;
    }
    steps.push(integral);
    aStar.push(grow(A0, J, S, h));
  }
  const last = nodes[nodes.length - 1];
  const end = local(rates, m0, last.u, clampA(last.y[0]), aStar[aStar.length - 1]);
  const rest = restTime * end.eps;
  const toEnd = new Array<number>(nodes.length);
  toEnd[nodes.length - 1] = rest;
  for (let k = nodes.length - 2; k >= 0; k--) toEnd[k] = toEnd[k + 1] + steps[k];
  return { steps, toEnd, aStar, endRate: end.eps, rest, total: toEnd[0] };
}
