/**
 * Tables of Page's mass- and spin-loss functions (Phys. Rev. D 14, 3260
 * (1976)) per field spin:
 *   f(a*) = −M² dM/dt = Σ dof·P̂(a*),   g(a*) = −(M/a*) dJ/dt = Σ dof·Ĵ(a*)/a*,
 * for massless fields, functions of a* = a/M alone (M only scales time as
 * M³). Tabulated per degree of freedom on a grid uniform in θ = arcsin a*:
 * f and g are even in a*, hence in θ, and smooth in cos θ = √(1 − a*²) near
 * the extremal end (pageFunctions.ts interpolates them). g(0) is the limit of
 * torque/a*, extrapolated from the first two nodes with the even series
 * g0 + g2 a*².
 */
import {
  FIELD_SPINS,
  InputError,
  MAX_SOLVER_A_RATIO,
  isFunction,
  numberIn,
  parseFieldSpin,
  validateOptions,
  validateTolerance,
  type Diagnostics,
  type FieldSpin,
  type FieldSpinInput,
} from '@penumbra/core';
import { emissionTotals } from './totals.js';
import { SHIPPED_PAGE_TABLE } from './pageTableData.js';
import { requireProblem } from './validate.js';

/** Per-dof power and torque/a* of one field spin at the table's nodes. */
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

/** A table of per-dof power and torque/a* on a grid uniform in θ = arcsin a*. */
export interface PageTable {
  aStar: number[];
  theta: number[];
  spins: PageTableSpin[];
  /** relative accuracy requested at each node */
  tol: number;
  /** greybody solves spent on the table */
  gammaCalls: number;
}

/** The grid of a table: its nodes and the field spins tabulated. */
export interface PageTableProblem {
  /** grid points (default 50, 5 … 2000) */
  readonly points?: number;
  /** largest a* (default 0.99, at most MAX_SOLVER_A_RATIO = 0.99999) */
  readonly aMax?: number;
  /** field spins (default 0, 1/2, 1, 2; '1/2' accepted) */
  readonly spins?: readonly FieldSpinInput[];
}

/** Options of pageTable; unknown keys are refused. */
export interface PageTableOptions {
  /** relative accuracy of each node (default 1e-5, range 1e-12 … 1e-2) */
  tol?: number;
  /** called after each node (all spins) */
  onPoint?: (done: number, total: number) => void;
}

/** How a table was computed; `errorEstimate` is the largest relative error of a node's power. */
export interface PageTableDiagnostics extends Diagnostics {
  /** greybody solves */
  gammaCalls: number;
}

/** A freshly computed table with its diagnostics. */
export interface PageTableSolution extends PageTable {
  diagnostics: PageTableDiagnostics;
}

const OPTIONS = { tol: validateTolerance, onPoint: isFunction<(done: number, total: number) => void> };
const ALL_SPINS: readonly FieldSpin[] = FIELD_SPINS;

function checkSpins(spins: unknown): FieldSpin[] {
  if (!Array.isArray(spins) || spins.length === 0)
    throw new InputError('spins', 'a non-empty list of field spins 0, 1/2, 1, 2', spins);
  return spins.map((s, i) => parseFieldSpin(s, `spins[${i}]`));
}

/**
 * Compute a table of per-dof power and torque/a* (one emissionTotals solve
 * per node and spin: minutes for the default 50 nodes). Throws InputError for
 * a bad problem or option, ConvergenceError as emissionTotals does.
 *
 * @example pageTable({ points: 9, aMax: 0.9, spins: [1] }, { tol: 1e-4 })
 */
export function pageTable(problem: PageTableProblem = {}, options?: PageTableOptions): PageTableSolution {
  const p = requireProblem(problem, ['points', 'aMax', 'spins']);
  const n = p.points === undefined ? 50 : numberIn(5, 2000, true)(p.points, 'points');
  const aMax = p.aMax === undefined ? 0.99 : numberIn(0, MAX_SOLVER_A_RATIO)(p.aMax, 'aMax');
  if (!(aMax > 0)) throw new InputError('aMax', `0 < aMax ≤ ${MAX_SOLVER_A_RATIO}`, aMax);
  const spins = p.spins === undefined ? [...ALL_SPINS] : checkSpins(p.spins);
  const { tol = 1e-5, onPoint } = validateOptions<PageTableOptions>(options, OPTIONS);
  const thetaMax = Math.asin(aMax);
  const theta = Array.from({ length: n }, (_, i) => (thetaMax * i) / (n - 1));
  const aStar = theta.map((t, i) => (i === n - 1 ? aMax : Math.sin(t)));
  const rows: PageTableSpin[] = spins.map((spin) => ({ spin, power: [], torqueOverA: [], powerError: [], torqueOverAError: [] }));
  let calls = 0;
  let steps = 0;
  let rhsEvaluations = 0;
  let errorEstimate = 0;
  for (let i = 0; i < n; i++) {
    for (const row of rows) {
      const r = emissionTotals({ hole: { a: aStar[i] }, field: { spin: row.spin } }, { tol });
      calls += r.diagnostics.gammaCalls;
      steps += r.diagnostics.steps;
      rhsEvaluations += r.diagnostics.rhsEvaluations;
      errorEstimate = Math.max(errorEstimate, r.power.relError);
      row.power.push(r.power.value);
      row.powerError.push(r.power.absError);
      row.torqueOverA.push(i === 0 ? Number.NaN : r.torque.value / aStar[i]);
      row.torqueOverAError.push(i === 0 ? Number.NaN : r.torque.absError / aStar[i]);
    }
    onPoint?.(i + 1, n);
  }
  for (const row of rows) {
    // even series g(θ) = g0 + g2 θ² + …  →  g0 ≈ (4 g(h) − g(2h))/3, error O(h⁴)
    row.torqueOverA[0] = (4 * row.torqueOverA[1] - row.torqueOverA[2]) / 3;
    row.torqueOverAError[0] = (4 * row.torqueOverAError[1] + row.torqueOverAError[2]) / 3;
  }
  return {
    aStar,
    theta,
    spins: rows,
    tol,
    gammaCalls: calls,
    diagnostics: {
      method: 'emissionTotals at each node of a grid uniform in θ = arcsin a*; g(0) from the even series',
      steps,
      rhsEvaluations,
      errorEstimate,
      message: `${n} nodes × ${spins.length} spin(s), a* ≤ ${aMax}; largest relative error of a node's power ${errorEstimate.toExponential(2)}`,
      gammaCalls: calls,
    },
  };
}

/**
 * The table shipped with the package (src/pageTableData.ts, made by
 * scripts/make-page-table.mjs: 50 nodes, a* ≤ 0.99, tol 1e-5 per node), as a
 * fresh copy.
 */
export function bundledPageTable(): PageTable {
  const t = SHIPPED_PAGE_TABLE;
  return {
    aStar: t.aStar.slice(),
    theta: t.theta.slice(),
    spins: t.spins.map((r) => ({
      spin: r.spin,
      power: r.power.slice(),
      torqueOverA: r.torqueOverA.slice(),
      powerError: r.powerError.slice(),
      torqueOverAError: r.torqueOverAError.slice(),
    })),
    tol: t.tol,
    gammaCalls: t.gammaCalls,
  };
}
