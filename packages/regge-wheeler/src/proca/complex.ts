/**
 * Small complex linear algebra for the Proca channels: numbers as [re, im]
 * pairs, matrices row-major. Sizes are 1, 2 or 4, so plain loops suffice.
 */

/** A complex number as [re, im]. */
export type Complex = [number, number];

/** Product of two complex numbers. */
export function mul(a: Complex, b: Complex): Complex {
  return [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
}

/** Quotient a / b. */
export function div(a: Complex, b: Complex): Complex {
  const d = b[0] * b[0] + b[1] * b[1];
  return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d];
}

/** |a|². */
export function abs2(a: Complex): number {
  return a[0] * a[0] + a[1] * a[1];
}

/** Complex conjugate. */
export function conj(a: Complex): Complex {
  return [a[0], -a[1]];
}

/** n×n product of row-major complex matrices (the products written out: no pair per term). */
export function matMul(a: Complex[], b: Complex[], n: number): Complex[] {
  const out: Complex[] = [];
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let re = 0;
      let im = 0;
      for (let k = 0; k < n; k++) {
        const x = a[i * n + k];
        const y = b[k * n + j];
        re += x[0] * y[0] - x[1] * y[1];
        im += x[0] * y[1] + x[1] * y[0];
      }
      out.push([re, im]);
    }
  }
  return out;
}

/** Conjugate transpose of an n×n matrix. */
export function adjoint(a: Complex[], n: number): Complex[] {
  const out: Complex[] = [];
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) out.push(conj(a[j * n + i]));
  return out;
}

/**
 * Solve A X = B for an n×n complex A and n×m right-hand side B (row-major),
 * by Gaussian elimination with partial pivoting. Throws on a singular A.
 */
export function solve(a: Complex[], b: Complex[], n: number, m: number): Complex[] {
  // the same operations as on [re, im] pairs, on split real and imaginary parts in shared scratch (no pair
  // allocated per operation; the matching and absorption solves are 4×4 at most)
  const fits = n * n <= SCRATCH && n * m <= SCRATCH;
  const Ar = fits ? SOLVE_AR : new Float64Array(n * n);
  const Ai = fits ? SOLVE_AI : new Float64Array(n * n);
  const Br = fits ? SOLVE_BR : new Float64Array(n * m);
  const Bi = fits ? SOLVE_BI : new Float64Array(n * m);
  const Xr = fits ? SOLVE_XR : new Float64Array(n * m);
  const Xi = fits ? SOLVE_XI : new Float64Array(n * m);
  for (let i = 0; i < n * n; i++) {
    Ar[i] = a[i][0];
    Ai[i] = a[i][1];
  }
  for (let i = 0; i < n * m; i++) {
    Br[i] = b[i][0];
    Bi[i] = b[i][1];
  }
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let i = col + 1; i < n; i++) if (size2(Ar, Ai, i * n + col) > size2(Ar, Ai, pivot * n + col)) pivot = i;
    if (size2(Ar, Ai, pivot * n + col) === 0) throw new Error('singular matching matrix');
    if (pivot !== col) {
      for (let j = 0; j < n; j++) {
        swap(Ar, col * n + j, pivot * n + j);
        swap(Ai, col * n + j, pivot * n + j);
      }
      for (let j = 0; j < m; j++) {
        swap(Br, col * m + j, pivot * m + j);
        swap(Bi, col * m + j, pivot * m + j);
      }
    }
    const pr = Ar[col * n + col];
    const pi = Ai[col * n + col];
    const d = pr * pr + pi * pi;
    for (let i = col + 1; i < n; i++) {
      // factor = A_i,col / p
      const xr = Ar[i * n + col];
      const xi = Ai[i * n + col];
      const fr = (xr * pr + xi * pi) / d;
      const fi = (xi * pr - xr * pi) / d;
      for (let j = col; j < n; j++) {
        const yr = Ar[col * n + j];
        const yi = Ai[col * n + j];
        Ar[i * n + j] -= fr * yr - fi * yi;
        Ai[i * n + j] -= fr * yi + fi * yr;
      }
      for (let j = 0; j < m; j++) {
        const yr = Br[col * m + j];
        const yi = Bi[col * m + j];
        Br[i * m + j] -= fr * yr - fi * yi;
        Bi[i * m + j] -= fr * yi + fi * yr;
      }
    }
  }
  for (let i = n - 1; i >= 0; i--) {
    for (let j = 0; j < m; j++) {
      let accR = Br[i * m + j];
      let accI = Bi[i * m + j];
      for (let k = i + 1; k < n; k++) {
        const xr = Ar[i * n + k];
        const xi = Ai[i * n + k];
        const yr = Xr[k * m + j];
        const yi = Xi[k * m + j];
        accR -= xr * yr - xi * yi;
        accI -= xr * yi + xi * yr;
      }
      const pr = Ar[i * n + i];
      const pi = Ai[i * n + i];
      const d = pr * pr + pi * pi;
      Xr[i * m + j] = (accR * pr + accI * pi) / d;
      Xi[i * m + j] = (accI * pr - accR * pi) / d;
    }
  }
  const X: Complex[] = new Array(n * m);
  for (let i = 0; i < n * m; i++) X[i] = [Xr[i], Xi[i]];
  return X;
}

/** Scratch of solve: 16 entries each (4×4). */
const SCRATCH = 16;
const SOLVE_AR = new Float64Array(SCRATCH);
const SOLVE_AI = new Float64Array(SCRATCH);
const SOLVE_BR = new Float64Array(SCRATCH);
const SOLVE_BI = new Float64Array(SCRATCH);
const SOLVE_XR = new Float64Array(SCRATCH);
const SOLVE_XI = new Float64Array(SCRATCH);

/** |v_k|² of split parts. */
function size2(re: Float64Array, im: Float64Array, k: number): number {
  return re[k] * re[k] + im[k] * im[k];
}

function swap(v: Float64Array, x: number, y: number): void {
  const t = v[x];
  v[x] = v[y];
  v[y] = t;
}

/** Upper-triangular S with S†S = H for a Hermitian positive-definite 1×1 or 2×2 H. */
export function choleskyUpper(h: Complex[], n: 1 | 2): Complex[] {
  const s11 = Math.sqrt(h[0][0]);
  if (n === 1) return [[s11, 0]];
  const s12: Complex = [h[1][0] / s11, h[1][1] / s11];
  const s22 = Math.sqrt(h[3][0] - abs2(s12));
  return [[s11, 0], s12, [0, 0], [s22, 0]];
}

/**
 * Eigenvalues (descending) and unit eigenvectors of a Hermitian 2×2 matrix
 * [[a, b], [b̄, d]], with the determinant supplied separately so that the
 * small eigenvalue is det/λ₁ (no cancellation when the two differ greatly).
 */
export function hermitianEigen2(
  a: number,
  b: Complex,
  d: number,
  det: number,
): { values: [number, number]; vectors: [Complex[], Complex[]] } {
  const half = 0.5 * (a - d);
  const rad = Math.sqrt(half * half + abs2(b));
  const l1 = 0.5 * (a + d) + rad;
  const l2 = det / l1;
  const vector = (lambda: number): Complex[] => {
    // (a − λ) x + b y = 0; choose the better-conditioned row.
    let x: Complex;
    let y: Complex;
    if (Math.abs(a - lambda) + Math.sqrt(abs2(b)) >= Math.abs(d - lambda) + Math.sqrt(abs2(b))) {
      x = [b[0], b[1]];
      y = [lambda - a, 0];
    } else {
      x = [lambda - d, 0];
      y = [b[0], -b[1]];
    }
    const norm = Math.sqrt(abs2(x) + abs2(y));
    if (norm === 0)
      return lambda === l1
        ? [
            [1, 0],
            [0, 0],
          ]
        : [
            [0, 0],
            [1, 0],
          ];
    return [
      [x[0] / norm, x[1] / norm],
      [y[0] / norm, y[1] / norm],
    ];
  };
  return { values: [l1, l2], vectors: [vector(l1), vector(l2)] };
}
