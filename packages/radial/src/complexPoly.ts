/**
 * Minimal complex polynomial arithmetic on split real/imaginary float64 arrays.
 * Used only to build the coefficients of the radial equation once per mode;
 * the hot loops evaluate those coefficients directly.
 */
export interface CPoly {
  re: number[];
  im: number[];
}

export function cpoly(re: number[], im?: number[]): CPoly {
  return { re: re.slice(), im: im ? im.slice() : re.map(() => 0) };
}

function pad(p: CPoly, n: number): CPoly {
  const re = p.re.slice();
  const im = p.im.slice();
  while (re.length < n) re.push(0);
  while (im.length < n) im.push(0);
  return { re, im };
}

export function add(...ps: CPoly[]): CPoly {
  const n = Math.max(...ps.map((p) => p.re.length));
  const out = { re: new Array<number>(n).fill(0), im: new Array<number>(n).fill(0) };
  for (const p0 of ps) {
    const p = pad(p0, n);
    for (let i = 0; i < n; i++) {
      out.re[i] += p.re[i];
      out.im[i] += p.im[i];
    }
  }
  return out;
}

export function mul(p: CPoly, q: CPoly): CPoly {
  const n = p.re.length + q.re.length - 1;
  const re = new Array<number>(n).fill(0);
  const im = new Array<number>(n).fill(0);
  for (let i = 0; i < p.re.length; i++) {
    for (let j = 0; j < q.re.length; j++) {
      re[i + j] += p.re[i] * q.re[j] - p.im[i] * q.im[j];
      im[i + j] += p.re[i] * q.im[j] + p.im[i] * q.re[j];
    }
  }
  return { re, im };
}

/** Multiply by the complex scalar (sr + i si). */
export function scale(p: CPoly, sr: number, si = 0): CPoly {
  return {
    re: p.re.map((x, i) => x * sr - p.im[i] * si),
    im: p.re.map((x, i) => x * si + p.im[i] * sr),
  };
}

/** Coefficients of p(x + x0) in powers of x (Taylor shift by repeated synthetic division). */
export function shift(p: CPoly, x0: number): CPoly {
  const re = p.re.slice();
  const im = p.im.slice();
  const n = re.length;
  for (let k = 0; k < n; k++) {
    for (let j = n - 2; j >= k; j--) {
      re[j] += x0 * re[j + 1];
      im[j] += x0 * im[j + 1];
    }
  }
  return { re, im };
}
