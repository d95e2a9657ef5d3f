/**
 * One mode's contribution to the emission rate per degree of freedom,
 *   n_{slm}(ω) = Γ_{slm}(ω) / (2π (exp((ω − mΩ_H)/T_H) ∓ 1)),
 * for a hole of unit mass (all rates scale with M; see docs/emission.md).
 * Γ·(occupation) is never negative: in the superradiant band of bosons both
 * factors change sign together.
 */
import { ConvergenceError, type FieldSpin } from '@penumbra/core';
import { setBounded } from '@penumbra/core/internal';
import { kerrHole, type KerrHole } from '@penumbra/kerr';
import { greybody, lowFrequencyGreybody, MOMEGA_RANGE, type GreybodySolution } from '@penumbra/flux';
import { massiveGamma, type GammaEstimate } from './massiveModes.js';

const MIN_MOMEGA = MOMEGA_RANGE.min;
const MAX_MOMEGA = MOMEGA_RANGE.max;

/** Work done by the greybody solves of one emission computation. */
export interface ModeCounters {
  /** greybody solves (the low-frequency formula is not counted) */
  gammaCalls: number;
  /** accepted ODE steps of those solves */
  steps: number;
  /** ODE right-hand-side evaluations of those solves, error-estimate solves included */
  rhsEvaluations: number;
}

/** A field on the unit-mass hole a* = |a|/M, with the greybody accuracy and the work counters. */
export interface ModeContext {
  spin: FieldSpin;
  /** |a|/M; a negative a is handled by the m → −m symmetry at the API edge */
  aStar: number;
  hole: KerrHole;
  fermion: boolean;
  greybodyTol: number;
  counters: ModeCounters;
  /** field mass Mμ (0 when massless; spin 2 has no massive route) */
  fieldMass: number;
  /** massive vector on Kerr: Schwarzschild Proca ratios by `${l}:${ω}` (massiveModes.ts) */
  procaRatios: Map<string, GammaEstimate>;
  /**
   * Γ already solved in this computation, by mode `${l}:${m}` and then ω (a number key: no string is
   * built per call): reused while its own relative error is within the current `greybodyTol` (a retry
   * or a tighter re-solve keeps what is accurate enough).
   */
  gammaCache: Map<string, Map<number, GammaEstimate>>;
}

/** The context of a field of spin `spin` (and mass Mμ, default 0) on the unit-mass hole with a/M = aStar ≥ 0. */
export function modeContext(spin: FieldSpin, aStar: number, greybodyTol: number, fieldMass = 0): ModeContext {
  return {
    fieldMass,
    spin,
    aStar,
    hole: kerrHole({ a: aStar, mass: 1 }),
    fermion: spin === 0.5,
    greybodyTol,
    counters: { gammaCalls: 0, steps: 0, rhsEvaluations: 0 },
    procaRatios: new Map(),
    gammaCache: new Map(),
  };
}

/** 1/(e^x − 1) for bosons, 1/(e^x + 1) for fermions, without overflow. */
export function occupation(fermion: boolean, x: number): number {
  if (fermion) return x > 0 ? Math.exp(-x) / (1 + Math.exp(-x)) : 1 / (1 + Math.exp(x));
  return 1 / Math.expm1(x);
}

/** One mode's emission rate at one frequency. */
export interface ModeRate {
  /** Γ·occupation/2π */
  rate: number;
  /** relative error of Γ */
  relError: number;
}

function gammaAt(ctx: ModeContext, l: number, m: number, omega: number): GammaEstimate {
  if (omega < MIN_MOMEGA && ctx.fieldMass === 0) return solveGamma(ctx, l, m, omega);
  const key = `${l}:${m}`;
  let solved = ctx.gammaCache.get(key);
  if (!solved) {
    solved = new Map();
    ctx.gammaCache.set(key, solved);
  }
  const cached = solved.get(omega);
  if (cached && cached.relError <= ctx.greybodyTol) return cached;
  const g = solveGamma(ctx, l, m, omega);
  setBounded(solved, omega, g, 200_000);
  return g;
}

function solveGamma(ctx: ModeContext, l: number, m: number, omega: number): GammaEstimate {
  // Massive: per degree of freedom over the field's own modes, 0 below the threshold (massiveModes.ts).
  if (ctx.fieldMass > 0) return massiveGamma(ctx, l, m, omega);
  if (omega < MIN_MOMEGA) {
    // Page's low-frequency formula; its first correction is ~2πMω (physics notes).
    const g = lowFrequencyGreybody({ hole: { a: ctx.aStar }, mode: { field: { spin: ctx.spin }, l, m }, omega });
    return { gamma: g, relError: 2 * Math.PI * omega };
  }
  let r: GreybodySolution;
  try {
    r = greybody(
      { hole: { a: ctx.aStar }, mode: { field: { spin: ctx.spin }, l, m }, omega },
      { tol: ctx.greybodyTol, reflection: false },
    );
  } catch (e) {
    if (e instanceof ConvergenceError) {
      throw new ConvergenceError(
        `greybody solve failed inside the emission sum (spin = ${ctx.spin}, l = ${l}, m = ${m}, a* = ${ctx.aStar}, Mω = ${omega})`,
        {
          ...e.diagnostics,
          spin: ctx.spin,
          l,
          m,
          aStar: ctx.aStar,
          omega,
        },
      );
    }
    throw e;
  }
  ctx.counters.gammaCalls++;
  ctx.counters.steps += r.diagnostics.steps;
  ctx.counters.rhsEvaluations += r.diagnostics.rhsEvaluations;
  return { gamma: r.gamma, relError: r.relError };
}

/** Γ·occupation/2π of mode (l, m) at ω on the unit-mass hole, with Γ's relative error. */
export function modeRate(ctx: ModeContext, l: number, m: number, omega: number): ModeRate {
  if (omega > MAX_MOMEGA) throw new RangeError(`mode rate requested at Mω = ${omega} > ${MAX_MOMEGA}`);
  const { hole } = ctx;
  const k = omega - m * hole.omegaH;
  if (k === 0 && !ctx.fermion) {
    // Γ ∝ k and the occupation ∝ 1/k: the product is finite; average the two sides.
    const d = 1e-7 * omega;
    const lo = modeRate(ctx, l, m, omega - d);
    const hi = modeRate(ctx, l, m, omega + d);
    return { rate: 0.5 * (lo.rate + hi.rate), relError: Math.max(lo.relError, hi.relError, 1e-7) };
  }
  const { gamma, relError } = gammaAt(ctx, l, m, omega);
  const rate = (gamma * occupation(ctx.fermion, k / hole.temperature)) / (2 * Math.PI);
  // Rounding can leave a tiny negative product right at the threshold.
  return { rate: Math.max(rate, 0), relError };
}

/**
 * Bound on ∫_W^∞ of the number and energy rates of mode m, valid when
 * W > mΩ_H: there k > 0, so 0 ≤ Γ ≤ 1 and the occupation is below
 * e^{−k/T}/(1 − e^{−k_W/T}) (bosons; fermions are smaller still).
 */
export function boltzmannTailBound(ctx: ModeContext, m: number, W: number): { number: number; energy: number } {
  const T = ctx.hole.temperature;
  const x = (W - m * ctx.hole.omegaH) / T;
  if (!(x > 0)) return { number: Infinity, energy: Infinity };
  const e = Math.exp(-x);
  const denom = ctx.fermion ? 1 : -Math.expm1(-x);
  const number = (T * e) / (2 * Math.PI * denom);
  return { number, energy: number * (W + T) };
}

/** The retrograde photon-orbit impact parameter (units of M), from @penumbra/kerr. */
export { retrogradeImpactParameter } from '@penumbra/kerr';

/** The m values of shell l in the order they are summed (co-rotating first). */
export function shellMs(ctx: ModeContext, l: number): { ms: number[]; weight: number } {
  if (ctx.aStar === 0) return { ms: [ctx.fermion ? 0.5 : 0], weight: 2 * l + 1 };
  const ms: number[] = [];
  for (let m = l; m >= -l; m--) ms.push(m);
  return { ms, weight: 1 };
}

/**
 * Bound on |torque| of the l-shells dropped after shell `l` with number
 * rate `last` falling at the geometric rate q: Σ_{j≥1} (l + j)·last·q^j, since
 * |m| ≤ l + j in shell l + j.
 */
export function torqueTailBound(last: number, q: number, l: number): number {
  return last > 0 ? last * ((l * q) / (1 - q) + q / ((1 - q) * (1 - q))) : 0;
}
