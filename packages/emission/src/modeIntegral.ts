/**
 * One mode's number and energy rates integrated over frequency, ∫_μ^W dω
 * (μ = 0 when massless; a massive mode in the wavenumber k∞ = √(ω² − μ²)),
 * with adaptive nested Fejér panels (nestedQuadrature.ts; docs/emission.md,
 * "Quadrature"). Upper limit:
 * the smallest W > max(mΩ_H, μ, 0) whose Boltzmann tail bound (Γ ≤ 1 for
 * ω > mΩ_H) is below a hundredth of the mode's tolerance, extended while the
 * tail is not small against the mode itself, capped at Mω = 30.
 */
import { MOMEGA_RANGE } from '@penumbra/flux';
import { TOLERANCE_RANGE } from '@penumbra/core';
import { adaptiveNested } from './nestedQuadrature.js';
import { boltzmannTailBound, modeRate, type ModeContext } from './modes.js';

const MAX_MOMEGA = MOMEGA_RANGE.max;

/** One mode's integrated rates. */
export interface ModeTotal {
  l: number;
  m: number;
  /** multiplicity (2l + 1 at a = 0, where one m stands for the shell) */
  weight: number;
  /** number and energy rates of this mode (already multiplied by weight), unit-mass hole */
  number: number;
  energy: number;
  /** upper end of the frequency integral */
  upperFrequency: number;
  /** integrand evaluations (each one greybody solve, or a few for a massive field, unless reused) */
  evaluations: number;
  /** relative tolerance of this mode's greybody solves */
  greybodyTol: number;
}

/** A triple (number rate, power, torque). */
export type Triple = [number, number, number];

/** Running sums of a totals computation (unit-mass hole, absolute values). */
export interface TotalsAccumulator {
  /** values */
  v: Triple;
  /** quadrature errors */
  q: Triple;
  /** greybody errors, integrated */
  g: Triple;
  /** truncation and tail bounds */
  t: Triple;
  panels: number;
  skipped: number;
  modes: ModeTotal[];
}

/**
 * ∫_μ^W f(ω) dω as ∫_0^{k(W)} f(ω(k)) (k/ω) dk with k = √(ω² − μ²): a massive
 * mode's rate has a square-root edge at the threshold (Γ ∝ k^{2l+1}, the s-wave
 * a finite Sommerfeld-type limit), which is smooth in k.
 */
function integrateInWavenumber(
  f: (w: number) => number[],
  breaks: readonly number[],
  mu: number,
  tolAbs: readonly number[],
  tolRel: number,
) {
  const toK = (w: number) => Math.sqrt(Math.max((w - mu) * (w + mu), 0));
  const kBreaks: number[] = [];
  for (const b of breaks) {
    const k = toK(b);
    if (kBreaks.length === 0 || k > kBreaks[kBreaks.length - 1]) kBreaks.push(k);
  }
  const g = (k: number): number[] => {
    const w = Math.sqrt(mu * mu + k * k);
    // at k = 0 the Jacobian k/ω vanishes and ω = μ, where nothing is emitted
    if (!(w > mu)) return [0, 0, 0, 0];
    const jac = k / w;
    return f(w).map((v) => v * jac);
  };
  return adaptiveNested(g, kBreaks, tolAbs, tolRel);
}

/** A fresh accumulator. */
export function emptyAccumulator(): TotalsAccumulator {
  return { v: [0, 0, 0], q: [0, 0, 0], g: [0, 0, 0], t: [0, 0, 0], panels: 0, skipped: 0, modes: [] };
}

/** What one mode is integrated to. */
export interface ModeTargets {
  /** absolute tolerances of the number and energy rates (0: no scale yet, the first mode) */
  tolN: number;
  tolE: number;
  /** relative tolerance of both */
  tolRel: number;
  /** relative tolerance of each greybody solve of this mode (raised or lowered by its share of the totals) */
  greybodyTol: number;
  /**
   * initial panels: 'thermal' breaks at the threshold max(mΩ_H, μ, 0) and the thermal scales past it
   * (leading modes wanted accurately), 'threshold' at the threshold only, 'single' one panel
   */
  panels: 'thermal' | 'threshold' | 'single';
}

/** The integral of one mode over [μ, W] (number, energy, and both weighted by Γ's relative error). */
function integrateRange(ctx: ModeContext, l: number, m: number, weight: number, t: ModeTargets) {
  const T = ctx.hole.temperature;
  const mu = ctx.fieldMass;
  const { tolN, tolE, tolRel } = t;
  const start = Math.max(m * ctx.hole.omegaH, mu, 0);
  // Without a scale yet (first mode), reach 30 T past the threshold and let the tail check extend it.
  let W = start + 30 * T;
  if (tolN > 0) {
    for (let x = 4; x < 400; x += 1) {
      W = start + x * T;
      const b = boltzmannTailBound(ctx, m, W);
      if (weight * b.number <= 0.01 * tolN && weight * b.energy <= 0.01 * tolE) break;
    }
  }
  W = Math.min(W, MAX_MOMEGA);
  // Components: number, energy, and the same weighted by Γ's relative error (integrated, not driving refinement).
  const f = (w: number): number[] => {
    const r = modeRate(ctx, l, m, w);
    const n = weight * r.rate;
    return [n, w * n, n * r.relError, w * n * r.relError];
  };
  const tolAbs = [tolN, tolE, Infinity, Infinity];
  // Break at the threshold max(mΩ_H, μ, 0), where the integrand turns over; leading modes also at
  // the thermal scales past it, so refinement does not have to find them.
  const thermal = t.panels === 'thermal';
  const breaks = [mu];
  if (start > mu && t.panels !== 'single') {
    if (thermal) breaks.push(0.5 * (mu + start));
    breaks.push(start);
  }
  if (thermal) for (const x of [6, 16]) if (start + x * T < W) breaks.push(start + x * T);
  // Past the threshold the Boltzmann factor spans e^{−(W − start)/T}: one break at 12 T halves that range.
  if (t.panels === 'threshold' && start + 12 * T < W) breaks.push(start + 12 * T);
  breaks.push(W);
  let q = mu > 0 ? integrateInWavenumber(f, breaks, mu, tolAbs, tolRel) : adaptiveNested(f, breaks, tolAbs, tolRel);
  let value = q.value.slice();
  let error = q.error.slice();
  let evaluations = q.evaluations;
  let panels = q.panels;
  // Extend the range while the Boltzmann tail is not small against this mode itself.
  for (let guard = 0; guard < 20 && W < MAX_MOMEGA; guard++) {
    const b = boltzmannTailBound(ctx, m, W);
    const need = (i: number, bound: number) => weight * bound > 0.01 * Math.max(tolAbs[i], tolRel * value[i]);
    if (!need(0, b.number) && !need(1, b.energy)) break;
    const W2 = Math.min(W + 10 * T, MAX_MOMEGA);
    q = adaptiveNested(
      f,
      [W, W2],
      tolAbs.map((x, i) => Math.max(x, tolRel * value[i])),
    );
    value = value.map((v, i) => v + q.value[i]);
    error = error.map((e, i) => e + q.error[i]);
    evaluations += q.evaluations;
    panels += q.panels;
    W = W2;
  }
  return { value, error, evaluations, panels, W };
}

/**
 * Integrate mode (l, m) of multiplicity `weight` to the targets `t`, with
 * every greybody solve at `t.greybodyTol`; add it to `acc` and report it to
 * `onMode`. The integrated Γ error of a mode is held to half its quadrature
 * target: a mode larger than its tolerance was chosen for is integrated again
 * with tighter solves (those already accurate enough are reused).
 */
export function integrateMode(
  ctx: ModeContext,
  l: number,
  m: number,
  weight: number,
  t: ModeTargets,
  acc: TotalsAccumulator,
  onMode: ((mode: ModeTotal) => void) | undefined,
): ModeTotal {
  let greybodyTol = t.greybodyTol;
  let r: ReturnType<typeof integrateRange>;
  let evaluations = 0;
  for (let pass = 0; ; pass++) {
    ctx.greybodyTol = greybodyTol;
    r = integrateRange(ctx, l, m, weight, t);
    evaluations += r.evaluations;
    const budgetN = 0.5 * Math.max(t.tolN, t.tolRel * r.value[0]);
    const budgetE = 0.5 * Math.max(t.tolE, t.tolRel * r.value[1]);
    const over = Math.max(r.value[2] / budgetN, r.value[3] / budgetE);
    if (!(over > 1) || pass >= 3 || greybodyTol <= TOLERANCE_RANGE.min) break;
    greybodyTol = Math.max(TOLERANCE_RANGE.min, greybodyTol / (4 * over));
  }
  const { value, error, W } = r;
  const tail = boltzmannTailBound(ctx, m, W);
  acc.v[0] += value[0];
  acc.v[1] += value[1];
  acc.v[2] += m * value[0];
  acc.q[0] += error[0];
  acc.q[1] += error[1];
  acc.q[2] += Math.abs(m) * error[0];
  acc.g[0] += value[2];
  acc.g[1] += value[3];
  acc.g[2] += Math.abs(m) * value[2];
  acc.t[0] += weight * tail.number;
  acc.t[1] += weight * tail.energy;
  acc.t[2] += Math.abs(m) * weight * tail.number;
  acc.panels += r.panels;
  const mode: ModeTotal = { l, m, weight, number: value[0], energy: value[1], upperFrequency: W, evaluations, greybodyTol };
  acc.modes.push(mode);
  onMode?.(mode);
  return mode;
}
