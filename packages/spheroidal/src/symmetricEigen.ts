/**
 * Eigenvalues and eigenvectors of a dense real symmetric matrix: Householder
 * reduction to tridiagonal form (tred2) and the implicit QL iteration (tql2)
 * of EISPACK (Smith et al., Matrix Eigensystem Routines, 1976), in the
 * operation order of ml-matrix 6.15's EigenvalueDecomposition, so both give
 * the same doubles (checked in test/symmetricEigen.test.ts). Kept here, on flat
 * Float64Arrays, so the spheroidal solver's cold start does not load that
 * library (its CommonJS bundle costs tens of ms of every process start).
 */

/** Eigen-decomposition of a symmetric n×n matrix. */
export interface SymmetricEigen {
  /** eigenvalues, ascending */
  values: Float64Array;
  /** eigenvector k is vectors[k·n … k·n + n − 1] (unit norm) */
  vectors: Float64Array;
}

/**
 * Decomposes the symmetric matrix `a` (row-major n×n; only its symmetry is
 * assumed, not checked). `a` is not modified.
 */
export function symmetricEigen(a: Float64Array, n: number): SymmetricEigen {
  // v holds the eigenvector matrix transposed (row k = eigenvector k), as
  // ml-matrix stores it during tred2/tql2; for symmetric a its start is a itself.
  const v = Float64Array.from(a);
  const d = new Float64Array(n);
  const e = new Float64Array(n);
  tred2(n, e, d, v);
  tql2(n, e, d, v);
  return { values: d, vectors: v };
}

function hypotenuse(a: number, b: number): number {
  let r = 0;
  if (Math.abs(a) > Math.abs(b)) {
    r = b / a;
    return Math.abs(a) * Math.sqrt(1 + r * r);
  }
  if (b !== 0) {
    r = a / b;
    return Math.abs(b) * Math.sqrt(1 + r * r);
  }
  return 0;
}

/** Householder tridiagonalisation: diagonal into d, sub-diagonal into e, transforms into v. */
function tred2(n: number, e: Float64Array, d: Float64Array, v: Float64Array): void {
  let f: number;
  let g: number;
  let h: number;
  for (let j = 0; j < n; j++) d[j] = v[j * n + n - 1];

  for (let i = n - 1; i > 0; i--) {
    let scale = 0;
    h = 0;
    for (let k = 0; k < i; k++) scale = scale + Math.abs(d[k]);

    if (scale === 0) {
      e[i] = d[i - 1];
      for (let j = 0; j < i; j++) {
        d[j] = v[j * n + i - 1];
        v[j * n + i] = 0;
        v[i * n + j] = 0;
      }
    } else {
      for (let k = 0; k < i; k++) {
        d[k] /= scale;
        h += d[k] * d[k];
      }
      f = d[i - 1];
      g = Math.sqrt(h);
      if (f > 0) g = -g;
      e[i] = scale * g;
      h = h - f * g;
      d[i - 1] = f - g;
      for (let j = 0; j < i; j++) e[j] = 0;

      for (let j = 0; j < i; j++) {
        f = d[j];
        v[i * n + j] = f;
        g = e[j] + v[j * n + j] * f;
        for (let k = j + 1; k <= i - 1; k++) {
          g += v[j * n + k] * d[k];
          e[k] += v[j * n + k] * f;
        }
        e[j] = g;
      }

      f = 0;
      for (let j = 0; j < i; j++) {
        e[j] /= h;
        f += e[j] * d[j];
      }
      const hh = f / (h + h);
      for (let j = 0; j < i; j++) e[j] -= hh * d[j];

      for (let j = 0; j < i; j++) {
        f = d[j];
        g = e[j];
        for (let k = j; k <= i - 1; k++) v[j * n + k] = v[j * n + k] - (f * e[k] + g * d[k]);
        d[j] = v[j * n + i - 1];
        v[j * n + i] = 0;
      }
    }
    d[i] = h;
  }

  for (let i = 0; i < n - 1; i++) {
    v[i * n + n - 1] = v[i * n + i];
    v[i * n + i] = 1;
    h = d[i + 1];
    if (h !== 0) {
      for (let k = 0; k <= i; k++) d[k] = v[(i + 1) * n + k] / h;
      for (let j = 0; j <= i; j++) {
        g = 0;
        for (let k = 0; k <= i; k++) g += v[(i + 1) * n + k] * v[j * n + k];
        for (let k = 0; k <= i; k++) v[j * n + k] = v[j * n + k] - g * d[k];
      }
    }
    for (let k = 0; k <= i; k++) v[(i + 1) * n + k] = 0;
  }

  for (let j = 0; j < n; j++) {
    d[j] = v[j * n + n - 1];
    v[j * n + n - 1] = 0;
  }
  v[(n - 1) * n + n - 1] = 1;
  e[0] = 0;
}

/** Implicit QL on the tridiagonal (d, e), accumulating rotations in v; sorts ascending. */
function tql2(n: number, e: Float64Array, d: Float64Array, v: Float64Array): void {
  let g: number;
  let h: number;
  let p: number;
  let r: number;
  for (let i = 1; i < n; i++) e[i - 1] = e[i];
  e[n - 1] = 0;

  let f = 0;
  let tst1 = 0;
  const eps = Number.EPSILON;

  for (let l = 0; l < n; l++) {
    tst1 = Math.max(tst1, Math.abs(d[l]) + Math.abs(e[l]));
    let m = l;
    while (m < n) {
      if (Math.abs(e[m]) <= eps * tst1) break;
      m++;
    }

    if (m > l) {
      do {
        g = d[l];
        p = (d[l + 1] - g) / (2 * e[l]);
        r = hypotenuse(p, 1);
        if (p < 0) r = -r;

        d[l] = e[l] / (p + r);
        d[l + 1] = e[l] * (p + r);
        const dl1 = d[l + 1];
        h = g - d[l];
        for (let i = l + 2; i < n; i++) d[i] -= h;
        f = f + h;

        p = d[m];
        let c = 1;
        let c2 = c;
        let c3 = c;
        const el1 = e[l + 1];
        let s = 0;
        let s2 = 0;
        for (let i = m - 1; i >= l; i--) {
          c3 = c2;
          c2 = c;
          s2 = s;
          g = c * e[i];
          h = c * p;
          r = hypotenuse(p, e[i]);
          e[i + 1] = s * r;
          s = e[i] / r;
          c = p / r;
          p = c * d[i] - s * g;
          d[i + 1] = h + s * (c * g + s * d[i]);
          for (let k = 0; k < n; k++) {
            h = v[(i + 1) * n + k];
            v[(i + 1) * n + k] = s * v[i * n + k] + c * h;
            v[i * n + k] = c * v[i * n + k] - s * h;
          }
        }
        p = (-s * s2 * c3 * el1 * e[l]) / dl1;
        e[l] = s * p;
        d[l] = c * p;
      } while (Math.abs(e[l]) > eps * tst1);
    }
    d[l] = d[l] + f;
    e[l] = 0;
  }

  for (let i = 0; i < n - 1; i++) {
    let k = i;
    p = d[i];
    for (let j = i + 1; j < n; j++) {
      if (d[j] < p) {
        k = j;
        p = d[j];
      }
    }
    if (k !== i) {
      d[k] = d[i];
      d[i] = p;
      for (let j = 0; j < n; j++) {
        p = v[i * n + j];
        v[i * n + j] = v[k * n + j];
        v[k * n + j] = p;
      }
    }
  }
}
