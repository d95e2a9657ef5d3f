/**
 * Per-degree-of-freedom power and torque of massive fields, as ratios to the
 * massless values, over the field mass Mμ and the hole's a* = a/M. For a
 * species of mass m the per-dof rates of a hole of mass M depend on M only
 * through Mμ = G M m/(ħ c) (and scale as 1/M², 1/M like the massless ones), so
 * one table per field spin serves every species and every hole mass:
 *   P̂(Mμ, a*) = P̂(0, a*) · R_P(Mμ, a*),   Ĵ(Mμ, a*) = Ĵ(0, a*) · R_J(Mμ, a*),
 * with the massless factors from the Page table (pageTable.ts) and R from
 * this table. R → 1 as Mμ → 0 and falls like a Boltzmann factor once Mμ
 * exceeds the temperature (T_H = 1/8π at a* = 0), so ln R is smooth and is
 * what massLoss.ts interpolates. Nodes: a* uniform in θ = arcsin a* (as the
 * Page table), Mμ on a list of each spin's own, dense at small Mμ and
 * where the ratios fall fastest.
 */
import {
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
import { SHIPPED_MASSIVE_RATE_TABLE } from './massiveRateTableData.js';
import { requireProblem } from './validate.js';

/** Ratios of one field spin, indexed [field-mass node][a* node]. */
export interface MassiveRateRow {
  spin: FieldSpin;
  /** the a* nodes of this spin: the table's, or its first nodes when the generation of this spin was cut short */
  aStar: number[];
  /** θ = arcsin a* of those nodes */
  theta: number[];
  /** the field masses Mμ of this spin's rows, increasing, the first 0 (each spin has its own) */
  fieldMass: number[];
  /** per-dof power at (Mμ, a*) over the massless per-dof power at a* */
  powerRatio: number[][];
  /** per-dof torque at (Mμ, a*) over the massless per-dof torque at a* (at a* = 0 the limit, from the even series in θ) */
  torqueRatio: number[][];
  /** relative error estimates of powerRatio (massive and massless errors added) */
  powerRatioError: number[][];
  /** relative error estimates of torqueRatio */
  torqueRatioError: number[][];
}

/** Ratio table over field mass Mμ and a*; row 0 of every spin is Mμ = 0 (ratio 1). */
export interface MassiveRateTable {
  aStar: number[];
  theta: number[];
  /** every field mass Mμ of the spins' rows (each row lists its own), increasing, the first 0 */
  fieldMass: number[];
  spins: MassiveRateRow[];
  /** relative accuracy requested of each emissionTotals solve */
  tol: number;
  /** greybody solves spent on the table */
  gammaCalls: number;
}

/** The grid of a massive rate table. */
export interface MassiveRateTableProblem {
  /** a* nodes, uniform in θ = arcsin a* (default 5, 3 … 200) */
  readonly aStarPoints?: number;
  /** largest a* (default 0.99, at most MAX_SOLVER_A_RATIO) */
  readonly aMax?: number;
  /** field masses Mμ > 0, increasing (default DEFAULT_FIELD_MASSES); the row Mμ = 0 is added */
  readonly fieldMasses?: readonly number[];
  /** field spins (default 0, 1/2, 1) */
  readonly spins?: readonly FieldSpinInput[];
}

/** Options of massiveRateTable; unknown keys are refused. */
export interface MassiveRateTableOptions {
  /** relative accuracy of each totals solve (default 1e-3, range 1e-12 … 1e-2) */
  tol?: number;
  /** called after each (field mass, a*) node, all spins */
  onPoint?: (done: number, total: number) => void;
}

/** How a ratio table was computed; `errorEstimate` is the largest relative error of a power ratio. */
export interface MassiveRateTableDiagnostics extends Diagnostics {
  /** greybody solves */
  gammaCalls: number;
}

/** A freshly computed ratio table with its diagnostics. */
export interface MassiveRateTableSolution extends MassiveRateTable {
  diagnostics: MassiveRateTableDiagnostics;
}

/**
 * Default field masses Mμ: dense below 0.1, where the ratios leave their
 * massless limit, up to 0.5. At a* = 0 the rates there are below 1e-3 of the
 * massless ones (1e-8 at Mμ = 0.7); past the last node ln R is continued
 * linearly (massLoss.ts). Heavier nodes cost minutes each (the radial
 * solves of a massive field slow down as Mμ grows) for nothing but the
 * superradiant tail of holes with a* ≳ 0.9. (The shipped table has its own,
 * denser nodes per spin: SHIPPED_GRIDS in scripts/make-massive-rate-table.mjs.)
 */
export const DEFAULT_FIELD_MASSES: readonly number[] = Object.freeze([0.01, 0.025, 0.05, 0.08, 0.12, 0.17, 0.25, 0.35, 0.5]);

const OPTIONS = { tol: validateTolerance, onPoint: isFunction<(done: number, total: number) => void> };

function checkMasses(value: unknown): number[] {
  if (!Array.isArray(value) || value.length === 0)
    throw new InputError('fieldMasses', 'a non-empty increasing list of field masses Mμ > 0', value);
  return value.map((x, i) => {
    const v = numberIn(1e-6, 10)(x, `fieldMasses[${i}]`);
    if (i > 0 && !(v > value[i - 1])) throw new InputError(`fieldMasses[${i}]`, `a value > fieldMasses[${i - 1}]`, v);
    return v;
  });
}

function checkSpins(value: unknown): FieldSpin[] {
  if (!Array.isArray(value) || value.length === 0)
    throw new InputError('spins', 'a non-empty list of field spins 0, 1/2, 1', value);
  return value.map((s, i) => {
    const spin = parseFieldSpin(s, `spins[${i}]`);
    if (spin === 2) throw new InputError(`spins[${i}]`, 'a massive field spin 0, 1/2 or 1', s);
    return spin;
  });
}

/** θ nodes and a* nodes, uniform in θ, the last exactly aMax. */
export function thetaGrid(points: number, aMax: number): { theta: number[]; aStar: number[] } {
  const thetaMax = Math.asin(aMax);
  const theta = Array.from({ length: points }, (_, i) => (thetaMax * i) / (points - 1));
  return { theta, aStar: theta.map((t, i) => (i === points - 1 ? aMax : Math.sin(t))) };
}

/** The per-dof totals of a field (massless when mass = 0) at a*: power, torque and their relative errors. */
export function fieldTotals(spin: FieldSpin, mass: number, a: number, tol: number) {
  const r = emissionTotals({ hole: { a }, field: mass > 0 ? { spin, mass } : { spin } }, { tol });
  return {
    power: r.power.value,
    powerRel: r.power.relError,
    torque: r.torque.value,
    torqueRel: r.torque.relError,
    gammaCalls: r.diagnostics.gammaCalls,
    steps: r.diagnostics.steps,
    rhsEvaluations: r.diagnostics.rhsEvaluations,
  };
}

type NodeTotals = ReturnType<typeof fieldTotals>;

/**
 * The massless limit of a massive field per dof. Spins 0 and 1/2: the massless
 * field itself. Spin 1: a massive vector keeps three polarisations as Mμ → 0,
 * two that become the photon's and a longitudinal one that becomes a scalar,
 * so per dof the limit is (2 P̂₁ + P̂₀)/3 (and the same for the torque), not the
 * massless vector: the ratio row Mμ = 0 of spin 1 is that mixture over P̂₁.
 */
export function masslessLimit(spin: FieldSpin, own: NodeTotals, scalar?: NodeTotals): NodeTotals {
  if (spin !== 1) return own;
  if (!scalar) throw new InputError('scalar', 'the massless scalar totals at the same a* (needed for spin 1)', scalar);
  return {
    power: (2 * own.power + scalar.power) / 3,
    powerRel: Math.max(own.powerRel, scalar.powerRel),
    torque: (2 * own.torque + scalar.torque) / 3,
    torqueRel: Math.max(own.torqueRel, scalar.torqueRel),
    gammaCalls: 0,
    steps: 0,
    rhsEvaluations: 0,
  };
}

/** The ratios of one node and their relative errors (massive and massless errors added). */
export interface NodeRatio {
  power: number;
  torque: number;
  powerError: number;
  torqueError: number;
}

/**
 * The ratios of one node from the totals of the massive field (`own`; none
 * for the row Mμ = 0, which is the massless limit: masslessLimit, with the
 * massless scalar `scalar` for spin 1) over the massless field's (`base`).
 * At a* = 0 the torques vanish and the torque ratio is NaN (assembleRatioRow
 * puts the limit there).
 */
export function nodeRatio(spin: FieldSpin, own: NodeTotals | undefined, base: NodeTotals, scalar?: NodeTotals): NodeRatio {
  if (!own) return masslessRowRatio(spin, base, scalar);
  const atZero = base.torque === 0;
  return {
    power: own.power / base.power,
    torque: atZero ? Number.NaN : own.torque / base.torque,
    powerError: own.powerRel + base.powerRel,
    torqueError: atZero ? Number.NaN : own.torqueRel + base.torqueRel,
  };
}

/**
 * The row Mμ = 0. Spins 0 and 1/2: the massless field over itself, 1 with no
 * error (the solve errors cancel exactly). Spin 1: R = (2 P̂₁ + P̂₀)/(3 P̂₁) =
 * 2/3 + P̂₀/(3 P̂₁), so only the part P̂₀/(3 P̂₁) carries the two solves'
 * errors: δR/R = ((R − 2/3)/R)·(ε₀ + ε₁) (the same for the torque).
 */
function masslessRowRatio(spin: FieldSpin, base: NodeTotals, scalar?: NodeTotals): NodeRatio {
  const atZero = base.torque === 0;
  if (spin !== 1) return { power: 1, torque: atZero ? Number.NaN : 1, powerError: 0, torqueError: atZero ? Number.NaN : 0 };
  const t = masslessLimit(spin, base, scalar);
  const s = scalar as NodeTotals;
  const power = t.power / base.power;
  const torque = atZero ? Number.NaN : t.torque / base.torque;
  return {
    power,
    torque,
    powerError: (Math.abs(power - 2 / 3) / power) * (s.powerRel + base.powerRel),
    torqueError: atZero ? Number.NaN : (Math.abs(torque - 2 / 3) / torque) * (s.torqueRel + base.torqueRel),
  };
}

/**
 * The row of one spin from its node ratios, indexed [field-mass node][a*
 * node] (fieldMass[0] = 0); the a* = 0 torque ratio (whatever the entries
 * hold there) is the limit from the even series in θ on the row's own nodes.
 */
export function assembleRatioRow(
  spin: FieldSpin,
  grid: { aStar: readonly number[]; theta: readonly number[] },
  fieldMass: readonly number[],
  entries: readonly (readonly NodeRatio[])[],
): MassiveRateRow {
  const n = entries[0].length;
  const row: MassiveRateRow = {
    spin,
    aStar: grid.aStar.slice(0, n),
    theta: grid.theta.slice(0, n),
    fieldMass: fieldMass.slice(),
    powerRatio: [],
    torqueRatio: [],
    powerRatioError: [],
    torqueRatioError: [],
  };
  for (const t of entries) {
    row.powerRatio.push(t.map((x) => x.power));
    row.powerRatioError.push(t.map((x) => x.powerError));
    const tr = t.map((x) => x.torque);
    const te = t.map((x) => x.torqueError);
    // even series in θ for ln R (R stays positive where it falls steeply): ln R(0) ≈ (4 ln R(h) − ln R(2h))/3
    // (with only two a* nodes, a cut-short row, the value at the second node)
    tr[0] = tr.length > 2 ? Math.exp((4 * Math.log(tr[1]) - Math.log(tr[2])) / 3) : tr[1];
    te[0] = te.length > 2 ? (4 * te[1] + te[2]) / 3 : te[1];
    row.torqueRatio.push(tr);
    row.torqueRatioError.push(te);
  }
  return row;
}

/**
 * Ratios of one spin from its totals at every (mass, a*) node (row 0: the
 * massless field, the denominator); the Mμ = 0 row is the massless limit of
 * the massive field (masslessLimit, with `scalar` the massless spin-0 totals
 * per a* for spin 1); the a* = 0 torque ratio comes from the even series.
 */
export function ratioRow(
  spin: FieldSpin,
  grid: { aStar: readonly number[]; theta: readonly number[] },
  fieldMass: readonly number[],
  totals: readonly (readonly NodeTotals[])[],
  scalar?: readonly NodeTotals[],
): MassiveRateRow {
  const base = totals[0];
  const entries = totals.map((t, i) => t.map((x, j) => nodeRatio(spin, i === 0 ? undefined : x, base[j], scalar?.[j])));
  return assembleRatioRow(spin, grid, fieldMass, entries);
}

/**
 * Compute a ratio table (one emissionTotals solve per spin, field mass and
 * a* node, plus the massless ones: tens of minutes for the default grid;
 * scripts/make-massive-rate-table.mjs runs it on two workers). Throws
 * InputError for a bad problem or option, ConvergenceError as emissionTotals.
 *
 * @example massiveRateTable({ aStarPoints: 3, aMax: 0.5, fieldMasses: [0.1], spins: [0] }, { tol: 1e-3 })
 */
export function massiveRateTable(
  problem: MassiveRateTableProblem = {},
  options?: MassiveRateTableOptions,
): MassiveRateTableSolution {
  const p = requireProblem(problem, ['aStarPoints', 'aMax', 'fieldMasses', 'spins']);
  const n = p.aStarPoints === undefined ? 5 : numberIn(3, 200, true)(p.aStarPoints, 'aStarPoints');
  const aMax = p.aMax === undefined ? 0.99 : numberIn(0, MAX_SOLVER_A_RATIO)(p.aMax, 'aMax');
  if (!(aMax > 0)) throw new InputError('aMax', `0 < aMax ≤ ${MAX_SOLVER_A_RATIO}`, aMax);
  const masses = [0, ...(p.fieldMasses === undefined ? DEFAULT_FIELD_MASSES : checkMasses(p.fieldMasses))];
  const spins = p.spins === undefined ? ([0, 0.5, 1] as FieldSpin[]) : checkSpins(p.spins);
  const { tol = 1e-3, onPoint } = validateOptions<MassiveRateTableOptions>(options, OPTIONS);
  const { theta, aStar } = thetaGrid(n, aMax);
  let gammaCalls = 0;
  let steps = 0;
  let rhsEvaluations = 0;
  let done = 0;
  const solve = (spin: FieldSpin, mu: number, a: number) => {
    const t = fieldTotals(spin, mu, a, tol);
    gammaCalls += t.gammaCalls;
    steps += t.steps;
    rhsEvaluations += t.rhsEvaluations;
    return t;
  };
  const all = spins.map((spin) =>
    masses.map((mu) =>
      aStar.map((a) => {
        const t = solve(spin, mu, a);
        onPoint?.(++done, spins.length * masses.length * n);
        return t;
      }),
    ),
  );
  const scalarRow = spins.includes(1) ? (all[spins.indexOf(0)]?.[0] ?? aStar.map((a) => solve(0, 0, a))) : undefined;
  const rows = spins.map((spin, k) => ratioRow(spin, { aStar, theta }, masses, all[k], scalarRow));
  const errorEstimate = Math.max(...rows.flatMap((r) => r.powerRatioError.flat()));
  return {
    aStar,
    theta,
    fieldMass: masses,
    spins: rows,
    tol,
    gammaCalls,
    diagnostics: {
      method: 'emissionTotals of the massive and the massless field at each node; ratios',
      steps,
      rhsEvaluations,
      errorEstimate,
      message: `${masses.length} field masses × ${n} a* nodes × ${spins.length} spin(s); largest relative error of a power ratio ${errorEstimate.toExponential(2)}`,
      gammaCalls,
    },
  };
}

/**
 * The ratio table shipped with the package (src/massiveRateTableData.ts, made
 * by scripts/make-massive-rate-table.mjs), as a fresh copy.
 */
export function bundledMassiveRateTable(): MassiveRateTable {
  const t = SHIPPED_MASSIVE_RATE_TABLE;
  const copy = (x: number[][]) => x.map((r) => r.slice());
  return {
    aStar: t.aStar.slice(),
    theta: t.theta.slice(),
    fieldMass: t.fieldMass.slice(),
    spins: t.spins.map((r) => ({
      spin: r.spin,
      aStar: r.aStar.slice(),
      theta: r.theta.slice(),
      fieldMass: r.fieldMass.slice(),
      powerRatio: copy(r.powerRatio),
      torqueRatio: copy(r.torqueRatio),
      powerRatioError: copy(r.powerRatioError),
      torqueRatioError: copy(r.torqueRatioError),
    })),
    tol: t.tol,
    gammaCalls: t.gammaCalls,
  };
}

/**
 * The table without one a* node (index into each spin's θ nodes) and/or one
 * field-mass node (index into each spin's field masses): leave-one-node-out checks of the interpolation error
 * estimates need no solves (the left-out node is the truth there).
 */
export function withoutNode(table: MassiveRateTable, drop: { theta?: number; fieldMass?: number }): MassiveRateTable {
  const keep = <T>(xs: readonly T[], i: number | undefined) => xs.filter((_, k) => k !== i);
  const cut = (rows: readonly (readonly number[])[]) => keep(rows, drop.fieldMass).map((r) => keep(r, drop.theta));
  return {
    ...table,
    spins: table.spins.map((r) => ({
      spin: r.spin,
      aStar: keep(r.aStar, drop.theta),
      theta: keep(r.theta, drop.theta),
      fieldMass: keep(r.fieldMass, drop.fieldMass),
      powerRatio: cut(r.powerRatio),
      torqueRatio: cut(r.torqueRatio),
      powerRatioError: cut(r.powerRatioError),
      torqueRatioError: cut(r.torqueRatioError),
    })),
  };
}
