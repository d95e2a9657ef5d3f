/**
 * Where the near-region form holds: the ratio Γ_near/Γ over a grid of (Mω, a)
 * for one mode, and for each a the largest Mω below which the ratio stays
 * within a tolerance of one. The full map is bench/near-region-map.mjs; the
 * suite runs a tiny one.
 */
import {
  InputError,
  requireKeyedObject,
  type Column,
  type FieldSpin,
  type Table,
  HOLE_SPIN_COLUMN,
  L_COLUMN,
  M_COLUMN,
  SPIN_COLUMN,
  MODE_COLUMNS,
} from '@penumbra/core';
import { compareNearRegion, type NearRegionComparisonOptions } from './compare.js';

/** One mode over a grid of a/M and Mω (mass 1). */
export interface ValidityMapProblem {
  mode: { field: { spin: FieldSpin }; l: number; m: number };
  /** values of a/M, each in (0, 0.9999] */
  aValues: readonly number[];
  /** values of Mω, each in [1e-5, 30]; the edges assume increasing order */
  omegaValues: readonly number[];
}

/** One point of the map. */
export interface ValidityPoint {
  a: number;
  omega: number;
  gamma: number;
  gammaNearRegion: number;
  ratio: number;
}

/** For one a: the largest grid Mω up to which |ratio − 1| stays within the tolerance at every grid point (null: not even the first). */
export interface ValidityEdge {
  a: number;
  /** largest Mω with |ratio − 1| ≤ 1 % at it and every smaller grid Mω */
  within1Percent: number | null;
  /** the same for 10 % */
  within10Percent: number | null;
}

/** The map of one mode: every point and the edges of the 1 % and 10 % regions. */
export interface ValidityMap {
  mode: { field: { spin: FieldSpin }; l: number; m: number };
  points: ValidityPoint[];
  edges: ValidityEdge[];
}

/** Largest number of grid points one map computes. */
export const MAX_MAP_POINTS = 10_000;

/** Compute the ratio Γ_near/Γ on the grid and the edges of the 1 % and 10 % regions. */
export function validityMap(problem: ValidityMapProblem, options?: NearRegionComparisonOptions): ValidityMap {
  const p = requireKeyedObject('problem', problem, ['mode', 'aValues', 'omegaValues']);
  const aValues = numberList('aValues', p.aValues);
  const omegaValues = numberList('omegaValues', p.omegaValues);
  if (aValues.length * omegaValues.length > MAX_MAP_POINTS) {
    throw new InputError('omegaValues', `at most ${MAX_MAP_POINTS} grid points in all`, omegaValues.length);
  }
  let mode = problem.mode;
  const points: ValidityPoint[] = [];
  const edges: ValidityEdge[] = [];
  for (const a of aValues) {
    const row = omegaValues.map((omega) => {
      const c = compareNearRegion({ hole: { a }, mode, omega }, options);
      mode = c.mode; // the checked mode ('1/2' read as 0.5)
      return { a, omega, gamma: c.gamma, gammaNearRegion: c.gammaNearRegion, ratio: c.ratio };
    });
    points.push(...row);
    edges.push({ a, within1Percent: edgeOf(row, 0.01), within10Percent: edgeOf(row, 0.1) });
  }
  return { mode, points, edges };
}

/** The largest ω of a row (in increasing ω) before the first point with |ratio − 1| > tol; NaN ratios end the region. */
export function edgeOf(row: readonly { omega: number; ratio: number }[], tol: number): number | null {
  let edge: number | null = null;
  for (const { omega, ratio } of row) {
    if (!(Math.abs(ratio - 1) <= tol)) break;
    edge = omega;
  }
  return edge;
}

function numberList(name: string, value: unknown): number[] {
  const allowed = 'a non-empty array of finite numbers';
  if (!Array.isArray(value) || value.length === 0) throw new InputError(name, allowed, value);
  value.forEach((v, i) => {
    if (typeof v !== 'number' || !Number.isFinite(v)) throw new InputError(`${name}[${i}]`, allowed, v);
  });
  return [...(value as number[])];
}

const POINT_COLUMNS: Column[] = [
  ...MODE_COLUMNS,
  { name: 'gamma', unit: '1', description: 'exact greybody factor Γ' },
  { name: 'gammaNearRegion', unit: '1', description: 'near-region (two-temperature) form of Γ' },
  { name: 'ratio', unit: '1', description: 'Γ_near / Γ' },
];

const EDGE_COLUMNS: Column[] = [
  SPIN_COLUMN,
  L_COLUMN,
  M_COLUMN,
  HOLE_SPIN_COLUMN,
  { name: 'within1Percent', unit: '1/M', description: 'largest grid ω with |Γ_near/Γ − 1| ≤ 0.01 there and below' },
  { name: 'within10Percent', unit: '1/M', description: 'largest grid ω with |Γ_near/Γ − 1| ≤ 0.1 there and below' },
];

/** Every point of some maps as one table (CSV/JSON through core's table model). */
export function validityPointsTable(maps: readonly ValidityMap[]): Table {
  return {
    columns: POINT_COLUMNS,
    rows: maps.flatMap((map) =>
      map.points.map((p) => [map.mode.field.spin, map.mode.l, map.mode.m, p.a, p.omega, p.gamma, p.gammaNearRegion, p.ratio]),
    ),
  };
}

/** The 1 % and 10 % edges of some maps as one table. */
export function validityEdgesTable(maps: readonly ValidityMap[]): Table {
  return {
    columns: EDGE_COLUMNS,
    rows: maps.flatMap((map) =>
      map.edges.map((e) => [map.mode.field.spin, map.mode.l, map.mode.m, e.a, e.within1Percent, e.within10Percent]),
    ),
  };
}
