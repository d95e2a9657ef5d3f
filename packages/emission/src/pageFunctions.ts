/**
 * Page's f(a*) and g(a*) for a particle content, interpolated from a table of
 * per-dof values (pageTable.ts). Local cubic interpolation in θ = arcsin a*
 * (with the even reflection at θ = 0) converges as h⁴. Interpolation error:
 * the same interpolant built on every other node, compared at the omitted
 * nodes, divided by 2⁴.
 */
import { InputError, requireObject } from '@penumbra/core';
import { resolveContent, dofBySpin, type SpeciesSpec } from './species.js';
import type { PageTable } from './pageTable.js';
import { requireProblem } from './validate.js';
import { halvedNodeError } from './localCubic.js';

/** A table and the content whose f and g are wanted (default: photons, gravitons, three neutrino species). */
export interface PageFunctionsProblem {
  readonly table: PageTable;
  readonly content?: readonly SpeciesSpec[];
}

/** f(a*) and g(a*) of a content, with their error estimates. */
export interface PageFunctions {
  /** mass-loss rate f(a*) = −M² dM/dt, interpolated, dimensionless (G = c = ħ = 1) */
  f: (aStar: number) => number;
  /** spin-loss rate g(a*) = −(M/a*) dJ/dt, interpolated, dimensionless (G = c = ħ = 1) */
  g: (aStar: number) => number;
  /** largest a* of the table */
  aMax: number;
  /** largest relative interpolation error estimate over the table (f, g) */
  interpolationError: { f: number; g: number };
  /** largest relative error of the node values (f, g) */
  nodeError: { f: number; g: number };
  /** node values of f and g for the content */
  nodes: { aStar: number[]; f: number[]; g: number[] };
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

/** A table with at least 5 nodes and equal-length node arrays. */
function checkTable(value: unknown): PageTable {
  const t = requireObject('table', value, 'a PageTable { aStar, theta, spins, tol, gammaCalls }');
  const n = Array.isArray(t.theta) ? t.theta.length : 0;
  if (n < 5) throw new InputError('table.theta', 'an array of at least 5 nodes', t.theta);
  if (!Array.isArray(t.aStar) || t.aStar.length !== n)
    throw new InputError('table.aStar', `an array of ${n} values (one per θ node)`, t.aStar);
  if (!Array.isArray(t.spins)) throw new InputError('table.spins', 'an array of per-spin rows', t.spins);
  return t as unknown as PageTable;
}

/**
 * f(a*) and g(a*) for a particle content from a table of per-dof values,
 * with the interpolation and node errors. Throws InputError if the content
 * needs a spin the table lacks.
 *
 * @example pageFunctions({ table: bundledPageTable(), content: PAGE_1976_CONTENT }).f(0)
 */
export function pageFunctions(problem: PageFunctionsProblem): PageFunctions {
  const p = requireProblem(problem, ['table', 'content']);
  const table = checkTable(p.table);
  const dof = dofBySpin(resolveContent(p.content as readonly SpeciesSpec[] | undefined));
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
  const estimate = (v: number[]) => halvedNodeError(theta, v, true);
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
