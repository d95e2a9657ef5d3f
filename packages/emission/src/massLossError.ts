/**
 * Local error estimates of the tabulated ln R(Mμ, θ) (massLoss.ts): ln R is
 * interpolated in θ = arcsin a* at every field-mass node (a column), then in
 * Mμ along that column. At a point the error has three parts, all in ln R
 * (so relative errors of R):
 *   - the θ interpolation of each column entry (localCubicError in θ), carried
 *     through the Mμ interpolation by |Lagrange weight|;
 *   - the Mμ interpolation of the column (localCubicError in Mμ); past the last
 *     node, where ln R is continued linearly, the change of slope between the
 *     last two intervals times the distance (a curvature estimate);
 *   - the nodes' own errors (solve errors of the table), carried by the
 *     |weights| of both interpolations.
 */
import { localCubic, localCubicError, localCubicWeights } from './localCubic.js';

/** Value and absolute error estimates (interpolation, node) of one interpolated quantity. */
export interface Estimated {
  value: number;
  interpolation: number;
  node: number;
}

/** ln R at every field-mass node at one θ, with the θ-interpolation and node errors of each entry (zero when not asked for). */
export interface Column {
  values: number[];
  interpolation: number[];
  node: number[];
}

/** The column of ln R at θ; with `withErrors`, the θ-interpolation and node errors of each entry too. */
export function columnAt(
  theta: readonly number[],
  lnTable: readonly (readonly number[])[],
  nodeError: readonly (readonly number[])[],
  th: number,
  withErrors: boolean,
): Column {
  const values = lnTable.map((row) => localCubic(theta, row, th, true));
  if (!withErrors) return { values, interpolation: [], node: [] };
  const { i0, weights } = localCubicWeights(theta, th, true);
  return {
    values,
    interpolation: lnTable.map((row) => localCubicError(theta, row, th, true)),
    node: nodeError.map((row) => weights.reduce((s, w, j) => s + Math.abs(w) * row[Math.abs(i0 + j)], 0)),
  };
}

/**
 * ln R at field mass mu from a column at θ (mus increasing, mus[0] = 0); with
 * `withErrors`, its errors. Past the last node: ln R continued with the last
 * slope (never rising), its error the slope change of the last two intervals
 * times the distance beyond the node.
 */
export function lnRatioAt(mus: readonly number[], column: Column, mu: number, withErrors: boolean): Estimated {
  const n = mus.length;
  const { values } = column;
  if (mu <= mus[n - 1]) {
    const value = localCubic(mus, values, mu);
    if (!withErrors) return { value, interpolation: 0, node: 0 };
    const { i0, weights } = localCubicWeights(mus, mu);
    let interpolation = localCubicError(mus, values, mu);
    let node = 0;
    for (const [j, w] of weights.entries()) {
      interpolation += Math.abs(w) * column.interpolation[i0 + j];
      node += Math.abs(w) * column.node[i0 + j];
    }
    return { value, interpolation, node };
  }
  const h = mus[n - 1] - mus[n - 2];
  const slope = (values[n - 1] - values[n - 2]) / h;
  const d = mu - mus[n - 1];
  const falling = slope < 0;
  const value = values[n - 1] + (falling ? slope : 0) * d;
  if (!withErrors) return { value, interpolation: 0, node: 0 };
  const before = (values[n - 2] - values[n - 3]) / (mus[n - 2] - mus[n - 3]);
  // weights of the linear continuation on the last two nodes
  const w1 = falling ? 1 + d / h : 1;
  const w2 = falling ? d / h : 0;
  return {
    value,
    interpolation: w1 * column.interpolation[n - 1] + w2 * column.interpolation[n - 2] + Math.abs(slope - before) * d,
    node: w1 * column.node[n - 1] + w2 * column.node[n - 2],
  };
}

/**
 * The node error of the a* = 0 torque ratios, where the table holds the limit
 * from the even series in θ, ln R(0) ≈ (4 ln R(h) − ln R(2h))/3: the solve
 * errors plus the difference to the next order, 1.5 ln R(h) − 0.6 ln R(2h) +
 * 0.1 ln R(3h) (exact for c₀ + c₂θ² + c₄θ⁴ on uniform nodes); needs 4 θ nodes.
 */
export function torqueLimitError(lnRow: readonly number[], nodeError: readonly number[]): number {
  if (lnRow.length < 4) return nodeError[0];
  const next = 1.5 * lnRow[1] - 0.6 * lnRow[2] + 0.1 * lnRow[3];
  return nodeError[0] + Math.abs(lnRow[0] - next);
}
