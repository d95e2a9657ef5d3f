/**
 * Local cubic (4-point Lagrange) interpolation on increasing, possibly
 * non-uniform nodes, with an optional even reflection at x = 0 (for functions
 * even in x, such as f and g in θ = arcsin a*). Error O(h⁴) for smooth data.
 */

/** Interpolate (xs, ys) at x with the 4 nodes around x (clamped at the ends; mirrored at 0 when `even`). */
export function localCubic(xs: readonly number[], ys: readonly number[], x: number, even = false): number {
  const n = xs.length;
  if (n === 1) return ys[0];
  if (n < 4) return linear(xs, ys, x);
  let i = 0;
  while (i < n - 2 && xs[i + 1] <= x) i++;
  // window [i − 1, i + 2], mirrored nodes −x_k (value y_k) below index 0 when even
  let i0 = i - 1;
  if (!even) i0 = Math.max(0, i0);
  i0 = Math.min(i0, n - 4);
  const node = (k: number) => (k < 0 ? -xs[-k] : xs[k]);
  const value = (k: number) => (k < 0 ? ys[-k] : ys[k]);
  let s = 0;
  for (let j = 0; j < 4; j++) {
    const xj = node(i0 + j);
    let w = 1;
    for (let k = 0; k < 4; k++) if (k !== j) w *= (x - node(i0 + k)) / (xj - node(i0 + k));
    s += w * value(i0 + j);
  }
  return s;
}

function linear(xs: readonly number[], ys: readonly number[], x: number): number {
  let i = 0;
  while (i < xs.length - 2 && xs[i + 1] <= x) i++;
  const t = (x - xs[i]) / (xs[i + 1] - xs[i]);
  return ys[i] + t * (ys[i + 1] - ys[i]);
}
