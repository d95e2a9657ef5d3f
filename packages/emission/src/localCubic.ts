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
  return cubicOnWindow(xs, ys, x, cubicWindowStart(xs, x, even));
}

/** First node of the 4-node window localCubic uses at x (negative: a mirrored node −x_{−k}, when `even`); n ≥ 4. */
export function cubicWindowStart(xs: readonly number[], x: number, even = false): number {
  const n = xs.length;
  let i = 0;
  while (i < n - 2 && xs[i + 1] <= x) i++;
  // window [i − 1, i + 2], mirrored nodes −x_k (value y_k) below index 0 when even
  let i0 = i - 1;
  if (!even) i0 = Math.max(0, i0);
  return Math.min(i0, n - 4);
}

/** The window localCubic uses at x: first signed node index (negative: mirrored, when `even`) and size (1, 2 or 4). */
function usedWindow(xs: readonly number[], x: number, even: boolean): { i0: number; size: number } {
  const n = xs.length;
  if (n === 1) return { i0: 0, size: 1 };
  if (n < 4) {
    let i = 0;
    while (i < n - 2 && xs[i + 1] <= x) i++;
    return { i0: i, size: 2 };
  }
  return { i0: cubicWindowStart(xs, x, even), size: 4 };
}

/** How far (in nodes) the divided-difference sets of localCubicError reach beyond the window. */
const SPREAD = 2;
const signedNode = (xs: readonly number[], k: number) => (k < 0 ? -xs[-k] : xs[k]);

/**
 * The weights localCubic gives the nodes i0 … i0 + size − 1 (signed: a
 * negative index −k is the mirrored node −x_k, value y_k) at x: value =
 * Σ_j weights[j]·y[|i0 + j|]. Used to carry the nodes' own errors into an
 * interpolated value, Σ |weight|·error.
 */
export function localCubicWeights(xs: readonly number[], x: number, even = false): { i0: number; weights: number[] } {
  const { i0, size } = usedWindow(xs, x, even);
  const weights = new Array<number>(size);
  for (let j = 0; j < size; j++) {
    const xj = signedNode(xs, i0 + j);
    let w = 1;
    for (let k = 0; k < size; k++) if (k !== j) w *= (x - signedNode(xs, i0 + k)) / (xj - signedNode(xs, i0 + k));
    weights[j] = w;
  }
  return { i0, weights };
}

/**
 * Local error estimate of localCubic at x (absolute, in the units of y): the
 * next term of the interpolation, |y[S]|·|∏_{k∈W}(x − x_k)|, with W the
 * window used at x and y[S] the divided difference over a set S of
 * size(W) + 1 consecutive nodes (mirrored nodes count when `even`); the
 * largest over the sets that start from two nodes left of W to one node
 * right of its start, so that an accidental zero of one divided difference
 * does not hide the error. With S = W plus the next node this is
 * p_S(x) − p_W(x) exactly. It vanishes at every node of W, so at the nodes
 * themselves, and grows inside a cell as the error does; for smooth data it
 * is of the size of the leading error term.
 */
export function localCubicError(xs: readonly number[], ys: readonly number[], x: number, even = false): number {
  const n = xs.length;
  if (n === 1) return 0;
  const { i0, size } = usedWindow(xs, x, even);
  let omega = 1;
  for (let k = i0; k < i0 + size; k++) omega *= x - signedNode(xs, k);
  const lowest = even ? -(n - 1) : 0;
  let worst = 0;
  for (let lo = i0 - SPREAD; lo <= i0 + SPREAD - 1; lo++) {
    const hi = lo + size;
    if (lo < lowest || hi > n - 1) continue;
    // divided difference over the size + 1 nodes lo … hi
    let dd = 0;
    for (let j = lo; j <= hi; j++) {
      const xj = signedNode(xs, j);
      let denominator = 1;
      for (let k = lo; k <= hi; k++) if (k !== j) denominator *= xj - signedNode(xs, k);
      dd += ys[Math.abs(j)] / denominator;
    }
    worst = Math.max(worst, Math.abs(dd * omega));
  }
  return worst;
}

/** The cubic through nodes i0 … i0 + 3 at x (a negative index k stands for the mirrored node −x_{−k}). */
export function cubicOnWindow(xs: readonly number[], ys: readonly number[], x: number, i0: number): number {
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

/**
 * Error estimate of localCubic between nodes: at each interval's midpoint, the
 * difference between the cubics on the two windows that contain the interval
 * (nodes k − 1 … k + 2 and k − 2 … k + 1, or k … k + 3 at the first interval),
 * times `weight(x)`; the largest over the intervals. Both are O(h⁴)
 * approximations, so their difference is of the size of the error itself.
 */
export function windowSpread(
  xs: readonly number[],
  ys: readonly number[],
  even: boolean,
  weight: (x: number) => number = () => 1,
): number {
  const n = xs.length;
  if (n < 5) return 0;
  let worst = 0;
  for (let k = 0; k < n - 1; k++) {
    const x = 0.5 * (xs[k] + xs[k + 1]);
    const lo = Math.max(even ? -(n - 1) : 0, k - 2);
    const candidates = [k - 1, k - 2, k].filter((i0) => i0 >= lo && i0 + 3 <= n - 1);
    if (candidates.length < 2) continue;
    const values = candidates.map((i0) => cubicOnWindow(xs, ys, x, i0));
    worst = Math.max(worst, (Math.max(...values) - Math.min(...values)) * weight(x));
  }
  return worst;
}

function linear(xs: readonly number[], ys: readonly number[], x: number): number {
  let i = 0;
  while (i < xs.length - 2 && xs[i + 1] <= x) i++;
  const t = (x - xs[i]) / (xs[i + 1] - xs[i]);
  return ys[i] + t * (ys[i + 1] - ys[i]);
}

/**
 * Relative error estimate of localCubic on (xs, ys) from every other node: the
 * cubic through the even-indexed nodes against each odd-indexed node inside
 * their range (relative to |y|), divided by 2⁴ because halving the spacing
 * divides an O(h⁴) error by 16.
 */
export function halvedNodeError(xs: readonly number[], ys: readonly number[], even: boolean): number {
  const hx = xs.filter((_, i) => i % 2 === 0);
  const hy = ys.filter((_, i) => i % 2 === 0);
  let worst = 0;
  for (let i = 1; i < xs.length && xs[i] <= hx[hx.length - 1]; i += 2)
    worst = Math.max(worst, Math.abs(localCubic(hx, hy, xs[i], even) - ys[i]) / Math.abs(ys[i]));
  return worst / 16;
}
