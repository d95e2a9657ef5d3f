/**
 * Γ per degree of freedom of a massive field, one (l, m) slot of the shell sum
 * (docs/emission.md, "Massive fields"):
 *
 * - spin 0: the massive scalar on Kerr (exact);
 * - spin 1/2: the massive Dirac field on Kerr, the mean of the two modes of one
 *   (j, m) with opposite signs of κ (exact; at μ = 0 both are the massless Γ);
 * - spin 1 at a = 0: the Proca field, (odd + even-1 + even-2)/3 per (l, m),
 *   with the l = 0 monopole/3 carried by the m = 0 slot of shell l = 1
 *   (it has the same occupation, m = 0) (exact);
 * - spin 1 at a ≠ 0: no verified massive vector on Kerr, so the approximation
 *   MASSIVE_VECTOR_KERR_APPROXIMATION (below).
 *
 * Every Γ here is 0 at and below the threshold ω ≤ μ: no wave reaches infinity.
 */
import { ConvergenceError, TOLERANCE_RANGE, type Field } from '@penumbra/core';
import { setBounded } from '@penumbra/core/internal';
import { greybody, type GreybodyOptions, type ProcaPolarization } from '@penumbra/flux';
import type { ModeContext } from './modes.js';

/** The name of the massive-vector approximation on Kerr (a ≠ 0), reported in solution metadata. */
export const MASSIVE_VECTOR_KERR_APPROXIMATION =
  'massive vector on Kerr (a ≠ 0): [2·Γ(massless s = 1, Kerr) + Γ(massive scalar, Kerr)]/3 per (l, m), times the Schwarzschild ratio of the exact Proca Γ to the same combination at a = 0 (monopole: the massive-scalar l = 0 Γ times its Schwarzschild Proca/scalar ratio), at most 1 where ω > mΩ_H; exact at a = 0';

/** Γ and its relative error. */
export interface GammaEstimate {
  gamma: number;
  relError: number;
}

/** One greybody solve with the context's accuracy, counted, its failure re-thrown with the emission context. */
function solve(
  ctx: ModeContext,
  a: number,
  field: Field,
  l: number,
  m: number,
  omega: number,
  extra: { kappaSign?: 1 | -1; polarization?: ProcaPolarization } = {},
): GammaEstimate {
  const mode = extra.kappaSign === undefined ? { field, l, m } : { field, l, m, kappaSign: extra.kappaSign };
  const attemptAt = (tol: number): GammaEstimate => {
    const options: GreybodyOptions = { tol, reflection: false };
    if (extra.polarization !== undefined) options.polarization = extra.polarization;
    const r = greybody({ hole: { a }, mode, omega }, options);
    ctx.counters.gammaCalls++;
    ctx.counters.steps += r.diagnostics.steps;
    ctx.counters.rhsEvaluations += r.diagnostics.rhsEvaluations;
    return { gamma: r.gamma, relError: r.relError };
  };
  try {
    return attemptAt(ctx.greybodyTol);
  } catch (first) {
    if (!(first instanceof ConvergenceError)) throw first;
    // Near threshold (k∞ → 0) the massive solvers can stall just short of a tight tol; a looser
    // solve carries its own (larger) error, which the totals integrate with the rate, so a mode
    // that matters still shows up in the error estimate.
    const loose = Math.min(ctx.greybodyTol * 100, TOLERANCE_RANGE.max);
    try {
      if (loose > ctx.greybodyTol) return attemptAt(loose);
    } catch (second) {
      if (!(second instanceof ConvergenceError)) throw second;
    }
    // Γ of a fermion, or of a boson outside its superradiant band, lies in [0, 1] (physics notes): a
    // solve that fails even loosely (very near the threshold, k∞ → 0) is carried as 1/2 ± 1/2, so
    // the totals integrate the whole interval as error and a slot that matters fails them loudly.
    if (field.spin === 0.5 || omega - m * ctx.hole.omegaH > 0) return { gamma: 0.5, relError: 1 };
    throw new ConvergenceError(
      `greybody solve failed inside the emission sum (spin = ${field.spin}, Mμ = ${field.mass ?? 0}, l = ${l}, m = ${m}, a* = ${a}, Mω = ${omega})`,
      { ...first.diagnostics, spin: field.spin, fieldMass: field.mass ?? 0, l, m, aStar: a, omega, ...extra },
    );
  }
}

/** Σ of estimates with the relative error of the sum (absolute errors added). */
function sum(parts: readonly GammaEstimate[], scale = 1): GammaEstimate {
  let gamma = 0;
  let abs = 0;
  for (const p of parts) {
    gamma += p.gamma;
    abs += Math.abs(p.gamma) * p.relError;
  }
  return { gamma: scale * gamma, relError: gamma !== 0 ? abs / Math.abs(gamma) : 0 };
}

/** Exact Proca Γ at a = 0 summed over the polarisations of shell l (odd, even-1, even-2; the monopole for l = 0). */
function procaShell(ctx: ModeContext, l: number, omega: number): GammaEstimate {
  const field = { spin: 1 as const, mass: ctx.fieldMass };
  try {
    if (l === 0) return solve(ctx, 0, field, 0, 0, omega, { polarization: 'monopole' });
    return sum((['odd', 'even-1', 'even-2'] as const).map((polarization) => solve(ctx, 0, field, l, 0, omega, { polarization })));
  } catch (e) {
    if (!(e instanceof ConvergenceError)) throw e;
    // The Schwarzschild Proca solver can stall at small Mω (k∞ ≪ 1/M), where Γ is tiny: stand in the
    // small-mass combination [2·Γ(s = 1, massless) + Γ(massive scalar)] with a 100 % error, which the
    // totals integrate with the rate (a solve that matters then fails the totals' tolerance, loudly).
    const scalar = solve(ctx, 0, { spin: 0, mass: ctx.fieldMass }, l, 0, omega);
    const gamma = l === 0 ? scalar.gamma : 2 * solve(ctx, 0, { spin: 1 }, l, 0, omega).gamma + scalar.gamma;
    return { gamma, relError: 1 };
  }
}

/** The a = 0 ratio of the exact Proca Γ of shell l to [2·Γ(s = 1, massless) + Γ(massive scalar)] (monopole: to the scalar l = 0). */
function procaRatio(ctx: ModeContext, l: number, omega: number): GammaEstimate {
  const key = `${l}:${omega}`;
  const cached = ctx.procaRatios.get(key);
  if (cached) return cached;
  const exact = procaShell(ctx, l, omega);
  const scalar = solve(ctx, 0, { spin: 0, mass: ctx.fieldMass }, l, 0, omega);
  let denom = scalar;
  if (l > 0) {
    const transverse = solve(ctx, 0, { spin: 1 }, l, 0, omega);
    denom = sum([transverse, transverse, scalar]);
  }
  // Both underflow only where Γ itself is far below every scale of the sum.
  const r = { gamma: denom.gamma > 0 ? exact.gamma / denom.gamma : 0, relError: exact.relError + denom.relError };
  setBounded(ctx.procaRatios, key, r, 10_000);
  return r;
}

/** The Kerr approximation of one massive-vector slot (a ≠ 0): see MASSIVE_VECTOR_KERR_APPROXIMATION. */
function approximateVector(ctx: ModeContext, l: number, m: number, omega: number): GammaEstimate {
  const k = omega - m * ctx.hole.omegaH;
  // Each polarisation's Γ is at most 1 where k > 0 (no superradiance there): n polarisations at most n.
  const clamp = (g: GammaEstimate, n: number): GammaEstimate => (k > 0 && g.gamma > n ? { gamma: n, relError: g.relError } : g);
  const slot = (lv: number, mv: number): GammaEstimate => {
    const scalar = solve(ctx, ctx.aStar, { spin: 0, mass: ctx.fieldMass }, lv, mv, omega);
    const ratio = procaRatio(ctx, lv, omega);
    if (lv === 0) return clamp({ gamma: ratio.gamma * scalar.gamma, relError: ratio.relError + scalar.relError }, 1);
    const transverse = solve(ctx, ctx.aStar, { spin: 1 }, lv, mv, omega);
    const combo = sum([transverse, transverse, scalar]);
    return clamp({ gamma: ratio.gamma * combo.gamma, relError: ratio.relError + combo.relError }, 3);
  };
  const main = slot(l, m);
  if (l !== 1 || m !== 0) return { gamma: main.gamma / 3, relError: main.relError };
  // The monopole rides with the m = 0 slot of shell l = 1 (weight 1 at a ≠ 0).
  return sum([main, slot(0, 0)], 1 / 3);
}

/**
 * Γ per degree of freedom of a massive field in slot (l, m) of the shell sum
 * at ω, for the unit-mass hole of `ctx` (the slot's multiplicity is that of
 * shellMs: 2l + 1 at a = 0, else 1).
 */
export function massiveGamma(ctx: ModeContext, l: number, m: number, omega: number): GammaEstimate {
  if (!(omega > ctx.fieldMass)) return { gamma: 0, relError: 0 };
  const field = { spin: ctx.spin, mass: ctx.fieldMass };
  if (ctx.spin === 0) return solve(ctx, ctx.aStar, field, l, m, omega);
  if (ctx.spin === 0.5) {
    return sum(
      ([1, -1] as const).map((kappaSign) => solve(ctx, ctx.aStar, field, l, m, omega, { kappaSign })),
      0.5,
    );
  }
  if (ctx.aStar !== 0) return approximateVector(ctx, l, m, omega);
  const shell = procaShell(ctx, l, omega);
  if (l !== 1) return { gamma: shell.gamma / 3, relError: shell.relError };
  // shell l = 1 at a = 0 (one slot of weight 3): 3·Γ_slot = (odd + even-1 + even-2) + monopole/3.
  const mono = procaShell(ctx, 0, omega);
  return sum([
    { gamma: shell.gamma / 3, relError: shell.relError },
    { gamma: mono.gamma / 9, relError: mono.relError },
  ]);
}
