/**
 * Globally adaptive Gauss–Kronrod quadrature (7-point Gauss, 15-point
 * Kronrod) for vector-valued integrands, after QUADPACK's QAG strategy
 * (Piessens, de Doncker-Kapenga, Überhuber & Kahaner, QUADPACK, Springer 1983):
 * keep every panel with its Kronrod value and |K15 − G7| error, bisect the
 * panel whose weighted error is largest, stop when the summed error of every
 * component is below its absolute tolerance.
 *
 * Why our own: the integrand is a vector (number and energy rates share each
 * greybody solve), a greybody call costs ~10⁵ times a panel's bookkeeping, and
 * no small well-kept npm package offers vector-valued adaptive Kronrod rules.
 */
import { ConvergenceError } from '@penumbra/core';

// Nodes and weights on [−1, 1], QUADPACK qk15 (30-digit values).
const XGK = [
  0.991455371120812639206854697526329, 0.949107912342758524526189684047851, 0.864864423359769072789712788640926,
  0.741531185599394439863864773280788, 0.586087235467691130294144845693013, 0.405845151377397166906606412076961,
  0.207784955007898467600689403773245, 0,
];
const WGK = [
  0.02293532201052922496373200805897, 0.063092092629978553290700663189204, 0.104790010322250183839876322541518,
  0.140653259715525918745189590510238, 0.16900472663926790282658342659855, 0.190350578064785409913256402421014,
  0.204432940075298892414161999234649, 0.209482141084727828012999174891714,
];
// Gauss weights for the nodes XGK[1], XGK[3], XGK[5], XGK[7].
const WG = [
  0.129484966168869693270611432679082, 0.27970539148927666790146777142378, 0.381830050505118944950369775488975,
  0.417959183673469387755102040816327,
];

/** Nodes on [0, 1) (the rule is symmetric) and Kronrod/Gauss weights of the G7/K15 pair. */
export const KRONROD15 = { nodes: XGK, kronrodWeights: WGK, gaussWeights: WG } as const;

/** One panel of the adaptive rule: its interval, Kronrod values and error estimates per component. */
export interface Panel {
  lo: number;
  hi: number;
  value: number[];
  error: number[];
}

/** One G7/K15 panel of a vector integrand with `dim` components. */
export function kronrodPanel(f: (x: number) => number[], lo: number, hi: number, dim: number): Panel {
  const c = 0.5 * (lo + hi);
  const h = 0.5 * (hi - lo);
  const k = new Array<number>(dim).fill(0);
  const g = new Array<number>(dim).fill(0);
  const centre = f(c);
  for (let d = 0; d < dim; d++) {
    k[d] = WGK[7] * centre[d];
    g[d] = WG[3] * centre[d];
  }
  const left7: number[][] = [];
  const right7: number[][] = [];
  for (let j = 0; j < 7; j++) {
    const left = f(c - h * XGK[j]);
    const right = f(c + h * XGK[j]);
    left7.push(left);
    right7.push(right);
    for (let d = 0; d < dim; d++) {
      const s = left[d] + right[d];
      k[d] += WGK[j] * s;
      if (j % 2 === 1) g[d] += WG[(j - 1) / 2] * s;
    }
  }
  // QUADPACK's error scaling: |K15 − G7| overstates the K15 error for smooth
  // integrands, so it is mapped through resasc·min(1, (200·|K − G|/resasc)^1.5),
  // resasc = ∫|f − mean|, with a floor of 50 ulp of ∫|f|.
  const resasc = new Array<number>(dim).fill(0);
  const resabs = new Array<number>(dim).fill(0);
  for (let d = 0; d < dim; d++) {
    const mean = 0.5 * k[d];
    resasc[d] = WGK[7] * Math.abs(centre[d] - mean);
    resabs[d] = WGK[7] * Math.abs(centre[d]);
  }
  for (let j = 0; j < 7; j++) {
    for (let d = 0; d < dim; d++) {
      const mean = 0.5 * k[d];
      resasc[d] += WGK[j] * (Math.abs(left7[j][d] - mean) + Math.abs(right7[j][d] - mean));
      resabs[d] += WGK[j] * (Math.abs(left7[j][d]) + Math.abs(right7[j][d]));
    }
  }
  const value = k.map((v) => v * h);
  const error = k.map((v, d) => {
    let e = Math.abs((v - g[d]) * h);
    const asc = resasc[d] * Math.abs(h);
    if (asc !== 0 && e !== 0) e = asc * Math.min(1, Math.pow((200 * e) / asc, 1.5));
    return Math.max(e, 50 * Number.EPSILON * resabs[d] * Math.abs(h));
  });
  return { lo, hi, value, error };
}

/** An adaptive integral of a vector integrand. */
export interface QuadratureResult {
  value: number[];
  /** summed |K15 − G7| panel errors per component (conservative for smooth integrands) */
  error: number[];
  panels: number;
  evaluations: number;
}

/**
 * ∫_lo^hi f over an initial partition `breaks` (lo … hi), to error
 * max(tolAbs[d], tolRel·|value[d]|) in every component d. Throws
 * ConvergenceError after maxPanels.
 */
export function adaptiveKronrod(
  f: (x: number) => number[],
  breaks: readonly number[],
  tolAbs: readonly number[],
  maxPanels = 400,
  tolRel = 0,
): QuadratureResult {
  const dim = tolAbs.length;
  const panels: Panel[] = [];
  for (let i = 0; i + 1 < breaks.length; i++) panels.push(kronrodPanel(f, breaks[i], breaks[i + 1], dim));
  let created = panels.length;
  const total = (key: 'value' | 'error') => Array.from({ length: dim }, (_, d) => panels.reduce((acc, p) => acc + p[key][d], 0));
  for (;;) {
    const err = total('error');
    const val = total('value');
    const target = tolAbs.map((t, d) => Math.max(t, tolRel * Math.abs(val[d])));
    if (err.every((e, d) => e <= target[d])) {
      return { value: total('value'), error: err, panels: panels.length, evaluations: 15 * created };
    }
    if (panels.length >= maxPanels) {
      const value = total('value');
      throw new ConvergenceError('adaptive Gauss–Kronrod quadrature did not converge', {
        method: 'globally adaptive Gauss–Kronrod (G7/K15) quadrature',
        steps: panels.length,
        rhsEvaluations: 15 * created,
        // relative error of the components that drive refinement (finite tolerance)
        errorEstimate: Math.max(...err.map((e, d) => (Number.isFinite(tolAbs[d]) ? e / Math.abs(value[d]) : 0))),
        message: `${maxPanels} panels used and the summed error still above the target in some component`,
        panels: panels.length,
        value,
        error: err,
        tolAbs,
      });
    }
    let worst = 0;
    let worstScore = -1;
    for (let i = 0; i < panels.length; i++) {
      const score = Math.max(...panels[i].error.map((e, d) => e / (target[d] || Number.MIN_VALUE)));
      if (score > worstScore) {
        worstScore = score;
        worst = i;
      }
    }
    const p = panels[worst];
    const mid = 0.5 * (p.lo + p.hi);
    panels.splice(worst, 1, kronrodPanel(f, p.lo, mid, dim), kronrodPanel(f, mid, p.hi, dim));
    created += 2;
  }
}
