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

/** n×n product of row-major complex matrices. */
export function matMul(a: Complex[], b: Complex[], n: number): Complex[] {
  const out: Complex[] = [];
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let re = 0;
      let im = 0;
      for (let k = 0; k < n; k++) {
        const p = mul(a[i * n + k], b[k * n + j]);
        re += p[0];
        im += p[1];
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
  const A = a.map((z) => [z[0], z[1]] as Complex);
  const B = b.map((z) => [z[0], z[1]] as Complex);
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let i = col + 1; i < n; i++) if (abs2(A[i * n + col]) > abs2(A[pivot * n + col])) pivot = i;
    if (abs2(A[pivot * n + col]) === 0) throw new Error('singular matching matrix');
    if (pivot !== col) {
      for (let j = 0; j < n; j++) [A[col * n + j], A[pivot * n + j]] = [A[pivot * n + j], A[col * n + j]];
      for (let j = 0; j < m; j++) [B[col * m + j], B[pivot * m + j]] = [B[pivot * m + j], B[col * m + j]];
    }
    const p = A[col * n + col];
    for (let i = col + 1; i < n; i++) {
      const factor = div(A[i * n + col], p);
      for (let j = col; j < n; j++) {
        const q = mul(factor, A[col * n + j]);
        A[i * n + j] = [A[i * n + j][0] - q[0], A[i * n + j][1] - q[1]];
      }
      for (let j = 0; j < m; j++) {
        const q = mul(factor, B[col * m + j]);
        B[i * m + j] = [B[i * m + j][0] - q[0], B[i * m + j][1] - q[1]];
      }
    }
  }
  const X: Complex[] = new Array(n * m);
  for (let i = n - 1; i >= 0; i--) {
    for (let j = 0; j < m; j++) {
      let acc: Complex = [B[i * m + j][0], B[i * m + j][1]];
      for (let k = i + 1; k < n; k++) {
        const q = mul(A[i * n + k], X[k * m + j]);
        acc = [acc[0] - q[0], acc[1] - q[1]];
      }
      X[i * m + j] = div(acc, A[i * n + i]);
    }
  }
  return X;
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
