/**
 * Total emission rates per degree of freedom: number rate dN/dt, power dE/dt
 * and torque dJ/dt, as Σ_{l,m} ∫_0^∞ dω of the mode rates (docs/emission.md).
 *
 * The sum and the integral are swapped: each mode is integrated on its own
 * with adaptive Gauss–Kronrod, so every greybody solve is spent where that
 * mode matters, and dJ/dt = Σ m N_{lm} needs no extra solves. Upper limit per
 * mode: the smallest W > mΩ_H whose Boltzmann tail bound (Γ ≤ 1 for
 * ω > mΩ_H) is below a hundredth of the mode's tolerance. Whole modes with
 * mΩ_H < 0 are skipped when that bound from ω = 0 is below tolerance.
 * l-truncation: whole shells from l = s upward, stopping after two shells that
 * each add less than tol/5 of the running totals; the dropped tail is bounded
 * by S_last·q/(1 − q), q = S_last/S_previous (shells fall geometrically once
 * the barrier top l/b exceeds the thermal range). m-truncation (a ≠ 0): modes
 * are taken co-rotating first (m = l, l − 1, …); once two successive modes
 * fall and each adds less than tol/100, the rest of the shell is bounded by
 * the continued geometric series and not solved.
 */
import { ConvergenceError } from '@penumbra/kerr';
import { MOMEGA_RANGE } from '@penumbra/flux';

const MAX_MOMEGA = MOMEGA_RANGE.max;
import { adaptiveKronrod } from './quadrature.js';
import { boltzmannTailBound, modeContext, modeRate, shellMs, type ModeContext } from './modes.js';
import { validateEmissionTol, validateMass, validateSpin, validateSpinParameter, type FieldSpin } from './validate.js';

export interface EstimatedValue {
  value: number;
  /** estimated relative error (quadrature + greybody errors + truncation bounds) */
  relError: number;
  absError: number;
}

export interface ModeTotal {
  l: number;
  m: number;
  /** multiplicity (2l + 1 at a = 0, where one m stands for the shell) */
  weight: number;
  /** number and energy rates of this mode (already multiplied by weight), unit-mass hole */
  number: number;
  energy: number;
  upperFrequency: number;
  evaluations: number;
}

export interface EmissionTotals {
  spin: FieldSpin;
  a: number;
  mass: number;
  /** dN/dt per degree of freedom, geometric units (∝ 1/M) */
  numberRate: EstimatedValue;
  /** dE/dt per degree of freedom, geometric units (∝ 1/M²) */
  power: EstimatedValue;
  /** dJ/dt per degree of freedom, geometric units (ħ = 1, ∝ 1/M); positive: the hole loses J along its spin */
  torque: EstimatedValue;
  diagnostics: {
    tol: number;
    lMax: number;
    modesIntegrated: number;
    modesSkipped: number;
    gammaCalls: number;
    rhsEvaluations: number;
    panels: number;
    /** absolute error parts for numberRate / power / torque (unit-mass hole) */
    quadratureError: [number, number, number];
    greybodyError: [number, number, number];
    truncationBound: [number, number, number];
    attempts: number;
  };
  modes: ModeTotal[];
}

export interface TotalsOptions {
  /** requested relative accuracy of every total (default 1e-6; 1e-10 … 1e-2) */
  tol?: number;
  /** largest l before the shell sum counts as not converged (default 60) */
  maxL?: number;
  /** progress: called after each integrated mode */
  onMode?: (mode: ModeTotal) => void;
}

interface Acc {
  v: [number, number, number];
  q: [number, number, number];
  g: [number, number, number];
  t: [number, number, number];
  panels: number;
  skipped: number;
  modes: ModeTotal[];
}

function integrateMode(
  ctx: ModeContext,
  l: number,
  m: number,
  weight: number,
  tolN: number,
  tolE: number,
  tolRel: number,
  acc: Acc,
  onMode: ((mode: ModeTotal) => void) | undefined,
  initialPanels: number,
): ModeTotal {
  const T = ctx.hole.temperature;
  const start = Math.max(m * ctx.hole.omegaH, 0);
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
  // Leading modes: break at the thermal scales past the threshold max(mΩ_H, 0), where the
  // integrand turns over, so bisection does not have to find that scale.
  const breaks = [0];
  if (initialPanels > 1) {
    if (start > 0) breaks.push(0.5 * start, start);
    for (const x of [4, 10, 20]) if (start + x * T < W) breaks.push(start + x * T);
  }
  breaks.push(W);
  let q = adaptiveKronrod(f, breaks, tolAbs, 400, tolRel);
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
    q = adaptiveKronrod(f, [W, W2], tolAbs.map((t, i) => Math.max(t, tolRel * value[i])), 400);
    value = value.map((v, i) => v + q.value[i]);
    error = error.map((e, i) => e + q.error[i]);
    evaluations += q.evaluations;
    panels += q.panels;
    W = W2;
  }
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
  acc.panels += panels;
  const mode: ModeTotal = { l, m, weight, number: value[0], energy: value[1], upperFrequency: W, evaluations };
  acc.modes.push(mode);
  onMode?.(mode);
  return mode;
}

function totalsUnit(ctx: ModeContext, tol: number, maxL: number, looseness: number, onMode?: (m: ModeTotal) => void) {
  const acc: Acc = { v: [0, 0, 0], q: [0, 0, 0], g: [0, 0, 0], t: [0, 0, 0], panels: 0, skipped: 0, modes: [] };
  const modeRel = 0.2 * tol * looseness;
  const modeAbs = 0.05 * tol * looseness;
  const shellN: number[] = [];
  const shellE: number[] = [];
  let below = 0;
  let l = ctx.spin as number;
  let first = true;
  for (; l <= maxL; l++) {
    const { ms, weight } = shellMs(ctx, l);
    let sN = 0;
    let sE = 0;
    for (let i = 0; i < ms.length; i++) {
      const m = ms[i];
      const tolN = first ? 0 : modeAbs * acc.v[0];
      const tolE = first ? 0 : modeAbs * acc.v[1];
      if (!first && m * ctx.hole.omegaH < 0) {
        // k > 0 at every ω: Γ ≤ 1, and later m (more counter-rotating) are smaller still.
        const b = boltzmannTailBound(ctx, m, 0);
        const rest = ms.length - i;
        if (weight * rest * b.number <= 0.01 * tolN && weight * rest * b.energy <= 0.01 * tolE) {
          acc.t[0] += weight * rest * b.number;
          acc.t[1] += weight * rest * b.energy;
          acc.t[2] += weight * rest * l * b.number;
          sN += weight * rest * b.number;
          sE += weight * rest * b.energy;
          acc.skipped += rest;
          break;
        }
      }
      const mode = integrateMode(ctx, l, m, weight, tolN, tolE, modeRel, acc, onMode, i === 0 ? 2 : 1);
      first = false;
      sN += mode.number;
      sE += mode.energy;
      // m-truncation (a ≠ 0): counter-rotating modes fall geometrically in m;
      // after two falling modes below tol/100, bound the rest of the shell by that geometric series.
      const j = acc.modes.length;
      if (i >= 2 && i + 1 < ms.length) {
        const last = acc.modes[j - 1];
        const prev = acc.modes[j - 2];
        const tiny = (x: ModeTotal) => x.number <= 0.01 * tol * acc.v[0] && x.energy <= 0.01 * tol * acc.v[1];
        if (tiny(last) && tiny(prev) && last.number < prev.number && last.energy < prev.energy) {
          const rest = ms.length - i - 1;
          const series = (x: number, y: number) => {
            const q = x / y;
            return (x * q * (1 - Math.pow(q, rest))) / (1 - q);
          };
          const bN = series(last.number, prev.number);
          const bE = series(last.energy, prev.energy);
          acc.t[0] += bN;
          acc.t[1] += bE;
          acc.t[2] += l * bN;
          sN += bN;
          sE += bE;
          acc.skipped += rest;
          break;
        }
      }
    }
    shellN.push(sN);
    shellE.push(sE);
    const small = sN <= 0.2 * tol * acc.v[0] && sE <= 0.2 * tol * acc.v[1];
    if (l >= (ctx.spin as number) + 1 && small) {
      if (++below >= 2) break;
    } else below = 0;
  }
  if (below < 2) {
    throw new ConvergenceError('emission totals: l-shell sum did not converge within maxL', {
      maxL, spin: ctx.spin, aStar: ctx.aStar, numberRate: acc.v[0], power: acc.v[1], lastShells: shellE.slice(-3),
    });
  }
  const n = shellN.length;
  const tailOf = (s: number[]) => {
    const last = s[n - 1];
    const prev = s[n - 2];
    if (!(last > 0)) return { bound: 0, q: 0, last };
    const q = last / prev;
    if (!(q < 1)) {
      throw new ConvergenceError('emission totals: l-shells are not decreasing', { l, last, prev, spin: ctx.spin, aStar: ctx.aStar });
    }
    return { bound: (last * q) / (1 - q), q, last };
  };
  const tN = tailOf(shellN);
  const tE = tailOf(shellE);
  const truncation: [number, number, number] = [
    tN.bound,
    tE.bound,
    tN.last > 0 ? tN.last * ((l * tN.q) / (1 - tN.q) + tN.q / ((1 - tN.q) * (1 - tN.q))) : 0,
  ];
  for (let i = 0; i < 3; i++) acc.t[i] += truncation[i];
  return { acc, lMax: l };
}

/**
 * Number rate, power and torque per degree of freedom of a field of the given
 * spin emitted by a hole of mass M (geometric, default 1) and spin a.
 */
export function emissionTotals(problem: { spin: number; a: number; mass?: number }, options: TotalsOptions = {}): EmissionTotals {
  const spin = validateSpin(problem.spin);
  const mass = validateMass(problem.mass ?? 1);
  const a = validateSpinParameter(problem.a, mass);
  const tol = validateEmissionTol(options.tol ?? 1e-6);
  const maxL = options.maxL ?? 60;
  const aStar = Math.abs(a) / mass;
  const ctx = modeContext(spin, aStar, Math.min(Math.max(tol / 5, 1e-12), 1e-2));
  let looseness = 1;
  for (let attempt = 1; ; attempt++) {
    const { acc, lMax } = totalsUnit(ctx, tol, maxL, looseness, options.onMode);
    const absErr = [0, 1, 2].map((i) => acc.q[i] + acc.g[i] + acc.t[i]);
    const rel = absErr.map((e, i) => (i === 2 && aStar === 0 ? 0 : e / Math.abs(acc.v[i])));
    // The torque of a slowly spinning hole is a small difference of co- and counter-rotating
    // sums: its relative error (reported) grows like tol/a*, so it does not gate convergence.
    const converged = rel[0] <= tol && rel[1] <= tol;
    if (converged || attempt >= 3) {
      if (!converged) {
        throw new ConvergenceError('emission totals did not reach the requested accuracy', {
          spin, a, tol, relError: rel, attempts: attempt, gammaCalls: ctx.counters.gammaCalls,
        });
      }
      const sign = a < 0 ? -1 : 1;
      const ev = (i: number, scale: number, s = 1): EstimatedValue => ({
        value: (s * acc.v[i]) / scale,
        relError: rel[i],
        absError: absErr[i] / scale,
      });
      return {
        spin,
        a,
        mass,
        numberRate: ev(0, mass),
        power: ev(1, mass * mass),
        torque: aStar === 0 ? { value: 0, relError: 0, absError: 0 } : ev(2, mass, sign),
        diagnostics: {
          tol,
          lMax,
          modesIntegrated: acc.modes.length,
          modesSkipped: acc.skipped,
          gammaCalls: ctx.counters.gammaCalls,
          rhsEvaluations: ctx.counters.rhsEvaluations,
          panels: acc.panels,
          quadratureError: acc.q,
          greybodyError: acc.g,
          truncationBound: acc.t,
          attempts: attempt,
        },
        modes: acc.modes,
      };
    }
    looseness /= 10;
  }
}
