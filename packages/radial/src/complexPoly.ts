/**
 * Minimal complex polynomial arithmetic on split real/imaginary float64 arrays.
 * Used to build the coefficients of the radial equation a few times per
 * solve; the hot loops evaluate those coefficients directly.
 */

/** A complex polynomial Σ (re[j] + i im[j]) y^j; `re` and `im` have equal length. */
export interface CPoly {
  /** real parts of the coefficients, lowest power first */
  re: Float64Array;
  /** imaginary parts of the coefficients */
  im: Float64Array;
}

function zeros(n: number): CPoly {
  return { re: new Float64Array(n), im: new Float64Array(n) };
}

/** A polynomial from its real (and optionally imaginary) coefficients, lowest power first. */
export function cpoly(re: readonly number[], im?: readonly number[]): CPoly {
  const p = zeros(re.length);
  p.re.set(re);
  if (im) p.im.set(im);
  return p;
}

/** A copy of p with at least n coefficients (zeros appended). */
export function padTo(p: CPoly, n: number): CPoly {
  const out = zeros(Math.max(n, p.re.length));
  out.re.set(p.re);
  out.im.set(p.im);
  return out;
}

/** The sum of the polynomials. */
export function add(...ps: CPoly[]): CPoly {
  let n = 0;
  for (const p of ps) n = Math.max(n, p.re.length);
  const out = zeros(n);
  for (const p of ps) {
    for (let i = 0; i < p.re.length; i++) {
      out.re[i] += p.re[i];
      out.im[i] += p.im[i];
    }
  }
  return out;
}

/** The product p·q. */
export function mul(p: CPoly, q: CPoly): CPoly {
  const out = zeros(p.re.length + q.re.length - 1);
  for (let i = 0; i < p.re.length; i++) {
    for (let j = 0; j < q.re.length; j++) {
      out.re[i + j] += p.re[i] * q.re[j] - p.im[i] * q.im[j];
      out.im[i + j] += p.re[i] * q.im[j] + p.im[i] * q.re[j];
    }
  }
  return out;
}

/** Multiply by the complex scalar (sr + i si). */
export function scale(p: CPoly, sr: number, si = 0): CPoly {
  const out = zeros(p.re.length);
  for (let i = 0; i < p.re.length; i++) {
    out.re[i] = p.re[i] * sr - p.im[i] * si;
    out.im[i] = p.re[i] * si + p.im[i] * sr;
  }
  return out;
}

/** The derivative dp/dy. */
export function derivative(p: CPoly): CPoly {
  const out = zeros(Math.max(p.re.length - 1, 1));
  for (let i = 1; i < p.re.length; i++) {
    out.re[i - 1] = i * p.re[i];
    out.im[i - 1] = i * p.im[i];
  }
  return out;
}

/** p(y) as [re, im] (Horner's rule; outside the hot loops). */
export function cpolyAt(p: CPoly, y: number): [number, number] {
  let re = 0,
    im = 0;
  for (let j = p.re.length - 1; j >= 0; j--) {
    re = re * y + p.re[j];
    im = im * y + p.im[j];
  }
  return [re, im];
}
