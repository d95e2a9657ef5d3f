/**
 * Globally adaptive quadrature with nested panels: Fejér's second rule
 * (Fejér 1933; weights after Waldvogel, BIT 46, 195 (2006)) on n = 2^k − 1
 * interior Chebyshev points x_j = cos(jπ/N), N = n + 1. The nodes of N are
 * those of 2N with even j, so raising a panel from 7 to 15 to 31 points
 * keeps every value already computed (one greybody solve each); the rule is
 * open, so no node falls on a threshold or a superradiant edge ω = mΩ_H.
 *
 * Error of a panel: the larger difference between Q_N and the two coarser
 * rules inside it (the second rule on the even nodes j, N/2 − 1 points; the
 * first rule on the odd ones, N/2 points: two rules that miss a feature
 * differently), which is the error of a coarser rule and overstates that of
 * Q_N for a smooth integrand (the rules converge geometrically); with a
 * floor of 50 ulp of ∫|f|. Strategy (as QUADPACK's
 * QAG): refine the panel whose error weighs most against its component's
 * target; a panel below the top level is raised, one at the top is bisected
 * into two 7-point panels.
 */
import { ConvergenceError } from '@penumbra/core';
import type { QuadratureResult } from './quadrature.js';

/** Largest N (points N − 1) a panel is raised to before it is bisected. */
const TOP_N = 64;
const FIRST_N = 8;

const weightCache = new Map<number, Float64Array>();
const firstKindCache = new Map<number, Float64Array>();

/**
 * Fejér's first rule on (−1, 1): the n nodes cos((2k − 1)π/2n), the zeros of T_n, which are the odd
 * nodes j = 2k − 1 of the second rule with N = 2n (Waldvogel 2006).
 */
export function fejerFirstWeights(n: number): Float64Array {
  let w = firstKindCache.get(n);
  if (w) return w;
  w = new Float64Array(n);
  for (let k = 1; k <= n; k++) {
    const t = ((2 * k - 1) * Math.PI) / (2 * n);
    let s = 0;
    for (let j = 1; j <= n / 2; j++) s += Math.cos(2 * j * t) / (4 * j * j - 1);
    w[k - 1] = (2 / n) * (1 - 2 * s);
  }
  firstKindCache.set(n, w);
  return w;
}

/** Fejér-2 weights on (−1, 1) for the N − 1 nodes cos(jπ/N), j = 1 … N − 1. */
export function fejerWeights(N: number): Float64Array {
  let w = weightCache.get(N);
  if (w) return w;
  w = new Float64Array(N - 1);
  for (let j = 1; j < N; j++) {
    const t = (j * Math.PI) / N;
    let s = 0;
    for (let p = 1; p <= N / 2; p++) s += Math.sin((2 * p - 1) * t) / (2 * p - 1);
    w[j - 1] = ((4 * Math.sin(t)) / N) * s;
  }
  weightCache.set(N, w);
  return w;
}

/** One panel: its values at the nodes j = 1 … N − 1 of level N, its estimate and error per component. */
interface NestedPanel {
  lo: number;
  hi: number;
  N: number;
  values: number[][];
  value: number[];
  error: number[];
}

function ruleSum(values: readonly number[][], N: number, h: number, dim: number): number[] {
  const w = fejerWeights(N);
  const q = new Array<number>(dim).fill(0);
  for (let j = 1; j < N; j++) for (let d = 0; d < dim; d++) q[d] += w[j - 1] * h * values[j - 1][d];
  return q;
}

/** The two coarser rules inside level N: the second rule on the even nodes, the first rule on the odd ones. */
function coarseSums(values: readonly number[][], N: number, h: number, dim: number): [number[], number[]] {
  const even = fejerWeights(N / 2);
  const odd = fejerFirstWeights(N / 2);
  const qe = new Array<number>(dim).fill(0);
  const qo = new Array<number>(dim).fill(0);
  for (let j = 1; j < N; j++) {
    const v = values[j - 1];
    if (j % 2 === 0) for (let d = 0; d < dim; d++) qe[d] += even[j / 2 - 1] * h * v[d];
    else for (let d = 0; d < dim; d++) qo[d] += odd[(j - 1) / 2] * h * v[d];
  }
  return [qe, qo];
}

function finishPanel(p: NestedPanel, dim: number): void {
  const h = 0.5 * (p.hi - p.lo);
  const fine = ruleSum(p.values, p.N, h, dim);
  const [even, odd] = coarseSums(p.values, p.N, h, dim);
  const w = fejerWeights(p.N);
  p.value = fine;
  p.error = fine.map((v, d) => {
    let abs = 0;
    for (let j = 1; j < p.N; j++) abs += w[j - 1] * Math.abs(p.values[j - 1][d]);
    // Two independent coarser rules: both agreeing by accident with the finer one is far less likely.
    const e = Math.max(Math.abs(v - even[d]), Math.abs(v - odd[d]));
    return Math.max(e, 50 * Number.EPSILON * abs * Math.abs(h));
  });
}

function node(lo: number, hi: number, N: number, j: number): number {
  return 0.5 * (lo + hi) + 0.5 * (hi - lo) * Math.cos((j * Math.PI) / N);
}

function newPanel(f: (x: number) => number[], lo: number, hi: number, dim: number): NestedPanel {
  const values: number[][] = [];
  for (let j = 1; j < FIRST_N; j++) values.push(f(node(lo, hi, FIRST_N, j)));
  const p: NestedPanel = { lo, hi, N: FIRST_N, values, value: [], error: [] };
  finishPanel(p, dim);
  return p;
}

/** Raise a panel from N to 2N: the old values sit at the even nodes, f is called at the odd ones only. */
function raise(f: (x: number) => number[], p: NestedPanel, dim: number): void {
  const N = 2 * p.N;
  const values: number[][] = [];
  for (let j = 1; j < N; j++) values.push(j % 2 === 0 ? p.values[j / 2 - 1] : f(node(p.lo, p.hi, N, j)));
  p.N = N;
  p.values = values;
  finishPanel(p, dim);
}

/**
 * ∫ f over the partition `breaks` to error max(tolAbs[d], tolRel·|value[d]|)
 * in every component d (components with an infinite tolerance are integrated
 * but do not drive refinement). Throws ConvergenceError after `maxEvaluations`.
 */
export function adaptiveNested(
  f: (x: number) => number[],
  breaks: readonly number[],
  tolAbs: readonly number[],
  tolRel = 0,
  maxEvaluations = 6000,
): QuadratureResult {
  const dim = tolAbs.length;
  let evaluations = 0;
  const counted = (x: number) => {
    evaluations++;
    return f(x);
  };
  const panels: NestedPanel[] = [];
  for (let i = 0; i + 1 < breaks.length; i++) panels.push(newPanel(counted, breaks[i], breaks[i + 1], dim));
  const total = (key: 'value' | 'error') => Array.from({ length: dim }, (_, d) => panels.reduce((s, p) => s + p[key][d], 0));
  for (;;) {
    const err = total('error');
    const val = total('value');
    const target = tolAbs.map((t, d) => Math.max(t, tolRel * Math.abs(val[d])));
    if (err.every((e, d) => e <= target[d])) return { value: val, error: err, panels: panels.length, evaluations };
    if (evaluations >= maxEvaluations) {
      throw new ConvergenceError('adaptive nested quadrature did not converge', {
        method: 'globally adaptive nested Fejér (7/15/31/63-point) quadrature',
        steps: panels.length,
        rhsEvaluations: evaluations,
        errorEstimate: Math.max(...err.map((e, d) => (Number.isFinite(tolAbs[d]) ? e / Math.abs(val[d]) : 0))),
        message: `${maxEvaluations} integrand evaluations used and the summed error still above the target in some component`,
        panels: panels.length,
        value: val,
        error: err,
        tolAbs,
      });
    }
    let worst = 0;
    let worstScore = -1;
    for (let i = 0; i < panels.length; i++) {
      let score = 0;
      for (let d = 0; d < dim; d++) score = Math.max(score, panels[i].error[d] / (target[d] || Number.MIN_VALUE));
      if (score > worstScore) {
        worstScore = score;
        worst = i;
      }
    }
    const p = panels[worst];
    if (p.N < TOP_N) raise(counted, p, dim);
    else {
      const mid = 0.5 * (p.lo + p.hi);
      panels.splice(worst, 1, newPanel(counted, p.lo, mid, dim), newPanel(counted, mid, p.hi, dim));
    }
  }
}
