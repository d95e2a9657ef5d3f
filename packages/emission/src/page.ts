/**
 * Page's mass- and spin-loss functions (Phys. Rev. D 14, 3260 (1976)):
 *   f(a*) = −M² dM/dt,   g(a*) = −(M/a*) dJ/dt,   a* = a/M = J/M²,
 * for a content of massless fields; they depend on a* alone (M only scales
 * time as M³). Tabulated per field spin on a grid uniform in θ = arcsin a*:
 * f and g are even in a*, hence in θ, and smooth in cos θ = √(1 − a*²) near
 * the extremal end, so local cubic interpolation in θ (with the even
 * reflection at θ = 0) converges as h⁴. g(0) is the limit of torque/a*,
 * extrapolated from the first two nodes with the even series g0 + g2 a*².
 * Interpolation error: the same interpolant built on every other node,
 * compared at the omitted nodes, divided by 2⁴.
 */
import { readFileSync } from 'node:fs';
import { InputError } from '@penumbra/kerr';
import { MAX_SOLVER_A_RATIO as MAX_SPIN } from '@penumbra/core';
import { emissionTotals } from './totals.js';
import { resolveContent, dofBySpin, type SpeciesSpec } from './species.js';
import { validateEmissionTol, type FieldSpin } from './validate.js';

export interface PageTableSpin {
  spin: FieldSpin;
  /** per-dof power P̂(a*) of the unit hole (so f = Σ dof·P̂) */
  power: number[];
  /** per-dof torque/a* (so g = Σ dof·torque/a*) */
  torqueOverA: number[];
  /** absolute error estimates of the node values */
  powerError: number[];
  torqueOverAError: number[];
}

export interface PageTable {
  aStar: number[];
  theta: number[];
  spins: PageTableSpin[];
  tol: number;
  gammaCalls: number;
}

export interface PageTableOptions {
  /** grid points (default 50, at least 5) */
  points?: number;
  /** largest a* (default 0.99, at most 0.9999) */
  aMax?: number;
  spins?: readonly FieldSpin[];
  /** relative accuracy of each node (default 1e-5) */
  tol?: number;
  onPoint?: (done: number, total: number) => void;
}

export function pageTable(options: PageTableOptions = {}): PageTable {
  const n = options.points ?? 50;
  if (!Number.isInteger(n) || n < 5 || n > 2000) throw new InputError('points', 'an integer 5 … 2000', n);
  const aMax = options.aMax ?? 0.99;
  if (!(aMax > 0 && aMax <= MAX_SPIN)) throw new InputError('aMax', `0 < aMax ≤ ${MAX_SPIN}`, aMax);
  const tol = validateEmissionTol(options.tol ?? 1e-5);
  const spins = options.spins ?? ([0, 0.5, 1, 2] as FieldSpin[]);
  const thetaMax = Math.asin(aMax);
  const theta = Array.from({ length: n }, (_, i) => (thetaMax * i) / (n - 1));
  const aStar = theta.map((t, i) => (i === n - 1 ? aMax : Math.sin(t)));
  const rows: PageTableSpin[] = spins.map((spin) => ({ spin, power: [], torqueOverA: [], powerError: [], torqueOverAError: [] }));
  let calls = 0;
  let done = 0;
  for (let i = 0; i < n; i++) {
    for (const row of rows) {
      const r = emissionTotals({ spin: row.spin, a: aStar[i] }, { tol });
      calls += r.diagnostics.gammaCalls;
      row.power.push(r.power.value);
      row.powerError.push(r.power.absError);
      row.torqueOverA.push(i === 0 ? Number.NaN : r.torque.value / aStar[i]);
      row.torqueOverAError.push(i === 0 ? Number.NaN : r.torque.absError / aStar[i]);
    }
    options.onPoint?.(++done, n);
  }
  for (const row of rows) {
    // even series g(θ) = g0 + g2 θ² + …  →  g0 ≈ (4 g(h) − g(2h))/3, error O(h⁴)
    row.torqueOverA[0] = (4 * row.torqueOverA[1] - row.torqueOverA[2]) / 3;
    row.torqueOverAError[0] = (4 * row.torqueOverAError[1] + row.torqueOverAError[2]) / 3;
  }
  return { aStar, theta, spins: rows, tol, gammaCalls: calls };
}

/** Local 4-point Lagrange interpolation on a uniform θ grid with even reflection at θ = 0. */
function interpolateEven(theta: readonly number[], values: readonly number[], t: number): number {
  const n = theta.length;
  const h = theta[1] - theta[0];
  let i0 = Math.floor(t / h) - 1;
  i0 = Math.min(i0, n - 4);
  let s = 0;
  for (let j = 0; j < 4; j++) {
    const idx = i0 + j;
    const xj = idx * h;
    const vj = values[Math.abs(idx)];
    let w = 1;
    for (let k = 0; k < 4; k++) if (k !== j) w *= (t - (i0 + k) * h) / (xj - (i0 + k) * h);
    s += w * vj;
  }
  return s;
}

export interface PageFunctions {
  f: (aStar: number) => number;
  g: (aStar: number) => number;
  aMax: number;
  /** largest relative interpolation error estimate over the table (f, g) */
  interpolationError: { f: number; g: number };
  /** largest relative error of the node values (f, g) */
  nodeError: { f: number; g: number };
  /** node values of f and g for the content */
  nodes: { aStar: number[]; f: number[]; g: number[] };
}

/** f(a*) and g(a*) for a particle content from a table of per-dof values. */
export function pageFunctions(table: PageTable, content?: readonly SpeciesSpec[]): PageFunctions {
  const dof = dofBySpin(resolveContent(content));
  const n = table.theta.length;
  const fNodes = new Array<number>(n).fill(0);
  const gNodes = new Array<number>(n).fill(0);
  const fErr = new Array<number>(n).fill(0);
  const gErr = new Array<number>(n).fill(0);
  for (const [spin, d] of dof) {
    const row = table.spins.find((r) => r.spin === spin);
    if (!row) throw new InputError('content', `spins present in the table (${table.spins.map((r) => r.spin).join(', ')})`, spin);
    for (let i = 0; i < n; i++) {
      fNodes[i] += d * row.power[i];
      gNodes[i] += d * row.torqueOverA[i];
      fErr[i] += d * row.powerError[i];
      gErr[i] += d * row.torqueOverAError[i];
    }
  }
  const { theta } = table;
  const half = theta.filter((_, i) => i % 2 === 0);
  const estimate = (v: number[]) => {
    const hv = v.filter((_, i) => i % 2 === 0);
    let worst = 0;
    for (let i = 1; i < n; i += 2) {
      if (theta[i] > half[half.length - 1]) break;
      worst = Math.max(worst, Math.abs(interpolateEven(half, hv, theta[i]) - v[i]) / Math.abs(v[i]));
    }
    return worst / 16;
  };
  const aMax = table.aStar[n - 1];
  const thetaMax = theta[n - 1];
  const make = (v: number[], name: string) => (a: number) => {
    if (!(Math.abs(a) <= aMax)) throw new InputError('aStar', `|a*| ≤ ${aMax} (the table's range)`, a, name);
    return interpolateEven(theta, v, Math.min(Math.asin(Math.abs(a)), thetaMax));
  };
  return {
    f: make(fNodes, 'f'),
    g: make(gNodes, 'g'),
    aMax,
    interpolationError: { f: estimate(fNodes), g: estimate(gNodes) },
    nodeError: { f: Math.max(...fErr.map((e, i) => e / fNodes[i])), g: Math.max(...gErr.map((e, i) => e / gNodes[i])) },
    nodes: { aStar: table.aStar.slice(), f: fNodes, g: gNodes },
  };
}

/**
 * The table shipped with the package (data/page-table.json, made by
 * scripts/make-page-table.mjs: 50 nodes, a* ≤ 0.99, tol 1e-5 per node).
 */
export function bundledPageTable(): PageTable {
  const text = readFileSync(new URL('../data/page-table.json', import.meta.url), 'utf8');
  const t = JSON.parse(text) as PageTable;
  return { aStar: t.aStar, theta: t.theta, spins: t.spins, tol: t.tol, gammaCalls: t.gammaCalls };
}
