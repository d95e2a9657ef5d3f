/**
 * The Teukolsky–Starobinsky map from the −|s| radial function to the +|s|
 * one: R_{+s} ∝ D^{2s} R_{−s}, D = ∂_r − iK/Δ (Teukolsky & Press, ApJ 193,
 * 443 (1974); Chandrasekhar, The Mathematical Theory of Black Holes (1983)).
 *
 * The higher derivatives of R_{−s} follow from its own radial equation,
 * R'' = P R' + Q R, so D^{2s} R_{−s} = α(r) R + β(r) R' with α, β built by
 * the recursion α ← α' + βQ − iWα, β ← α + β' + βP − iWβ (W = K/Δ). We carry
 * α, β as truncated Taylor series about the switching radius, which gives
 * their derivatives exactly; the map is applied at one radius, so its cost is
 * negligible. Derivation: docs/method.md.
 */
import type { KerrHole } from '@penumbra/kerr';
import type { CPoly } from './complexPoly.js';
import { radialEquation, type RadialMode } from './equation.js';

/** Complex truncated power series in h = r − r0 (coefficient arrays of equal length). */
interface Series {
  re: number[];
  im: number[];
}

/** The first n coefficients of a polynomial (already in powers of h = r − r0). */
function fromPoly(q: CPoly, n: number): Series {
  const re = new Array<number>(n).fill(0),
    im = new Array<number>(n).fill(0);
  for (let i = 0; i < Math.min(n, q.re.length); i++) {
    re[i] = q.re[i];
    im[i] = q.im[i];
  }
  return { re, im };
}

function negate(a: Series): Series {
  return { re: a.re.map((x) => -x), im: a.im.map((x) => -x) };
}

/** a / b for a series b with b_0 ≠ 0. */
function div(a: Series, b: Series, n: number): Series {
  const re = new Array<number>(n).fill(0),
    im = new Array<number>(n).fill(0);
  const d = b.re[0] * b.re[0] + b.im[0] * b.im[0];
  for (let k = 0; k < n; k++) {
    let xr = a.re[k],
      xi = a.im[k];
    for (let j = 1; j <= k; j++) {
      xr -= b.re[j] * re[k - j] - b.im[j] * im[k - j];
      xi -= b.re[j] * im[k - j] + b.im[j] * re[k - j];
    }
    re[k] = (xr * b.re[0] + xi * b.im[0]) / d;
    im[k] = (xi * b.re[0] - xr * b.im[0]) / d;
  }
  return { re, im };
}

/** R_{+s} = a0 R + b0 R',  R'_{+s} = a1 R + b1 R' (complex, [re, im]). */
export interface StarobinskyMap {
  /** coefficient of R in R_{+s} */
  a0: [number, number];
  /** coefficient of R' in R_{+s} */
  b0: [number, number];
  /** coefficient of R in R'_{+s} */
  a1: [number, number];
  /** coefficient of R' in R'_{+s} */
  b1: [number, number];
}

/**
 * Coefficients of D^{2s} acting on a solution of the −s equation
 * (`minus.s` = −|s|, `minus.lambda` = λ_{−s}) and of its r-derivative, at r.
 */
export function starobinskyMapAt(hole: KerrHole, minus: RadialMode, r: number): StarobinskyMap {
  const twoS = Math.round(-2 * minus.s);
  const n = twoS + 2; // series order needed: 2s derivatives plus one
  // The −s equation A R'' + B R' + C R = 0 expanded about r itself.
  const eq = radialEquation(hole, minus, r);
  const W = div(fromPoly(eq.K, n), fromPoly(eq.delta, n), n);
  // R'' = P R' + Q R: P = −B/A = −(s+1)Δ'/Δ, Q = −C/A = −U/Δ².
  const A = fromPoly(eq.A, n);
  const P = div(negate(fromPoly(eq.B, n)), A, n);
  const Q = div(negate(fromPoly(eq.C, n)), A, n);
  // α ← α' + βQ − iWα, β ← α + β' + βP − iWβ, each pass one order shorter; the sums run in the order of the
  // series helpers above (the same doubles), on arrays made once per call instead of a dozen per pass.
  let aRe = new Array<number>(n).fill(0),
    aIm = new Array<number>(n).fill(0),
    bRe = new Array<number>(n).fill(0),
    bIm = new Array<number>(n).fill(0);
  aRe[0] = 1;
  let naRe = new Array<number>(n).fill(0),
    naIm = new Array<number>(n).fill(0),
    nbRe = new Array<number>(n).fill(0),
    nbIm = new Array<number>(n).fill(0);
  let size = n;
  for (let j = 0; j < twoS; j++) {
    const len = size - 1;
    for (let k = 0; k < len; k++) {
      // products truncated at len: bQ, Wα (for α) and bP, Wβ (for β), summed over i + m = k in the order of `mul`
      let bqR = 0,
        bqI = 0,
        waR = 0,
        waI = 0,
        bpR = 0,
        bpI = 0,
        wbR = 0,
        wbI = 0;
      for (let i = 0; i <= k; i++) {
        const m = k - i;
        bqR += bRe[i] * Q.re[m] - bIm[i] * Q.im[m];
        bqI += bRe[i] * Q.im[m] + bIm[i] * Q.re[m];
        waR += W.re[i] * aRe[m] - W.im[i] * aIm[m];
        waI += W.re[i] * aIm[m] + W.im[i] * aRe[m];
        bpR += bRe[i] * P.re[m] - bIm[i] * P.im[m];
        bpI += bRe[i] * P.im[m] + bIm[i] * P.re[m];
        wbR += W.re[i] * bRe[m] - W.im[i] * bIm[m];
        wbI += W.re[i] * bIm[m] + W.im[i] * bRe[m];
      }
      // α' + βQ + (−i)(Wα): (−i)(x + iy) = y − ix
      naRe[k] = 0 + (k + 1) * aRe[k + 1] + bqR + waI;
      naIm[k] = 0 + (k + 1) * aIm[k + 1] + bqI + -waR;
      nbRe[k] = 0 + aRe[k] + (k + 1) * bRe[k + 1] + bpR + wbI;
      nbIm[k] = 0 + aIm[k] + (k + 1) * bIm[k + 1] + bpI + -wbR;
    }
    [aRe, naRe] = [naRe, aRe];
    [aIm, naIm] = [naIm, aIm];
    [bRe, nbRe] = [nbRe, bRe];
    [bIm, nbIm] = [nbIm, bIm];
    size = len;
  }
  const alpha: Series = { re: aRe, im: aIm };
  const beta: Series = { re: bRe, im: bIm };
  // alpha, beta now carry two coefficients: values and first derivatives at r.
  const P0: [number, number] = [P.re[0], P.im[0]];
  const Q0: [number, number] = [Q.re[0], Q.im[0]];
  const a0: [number, number] = [alpha.re[0], alpha.im[0]];
  const b0: [number, number] = [beta.re[0], beta.im[0]];
  // d/dr(αR + βR') = (α' + βQ) R + (α + β' + βP) R'
  const a1: [number, number] = [alpha.re[1] + b0[0] * Q0[0] - b0[1] * Q0[1], alpha.im[1] + b0[0] * Q0[1] + b0[1] * Q0[0]];
  const b1: [number, number] = [
    a0[0] + beta.re[1] + b0[0] * P0[0] - b0[1] * P0[1],
    a0[1] + beta.im[1] + b0[0] * P0[1] + b0[1] * P0[0],
  ];
  return { a0, b0, a1, b1 };
}

/** (R_{+s}, R'_{+s}) as [re, im, re, im] from y = (Re R, Im R, Re R', Im R') of the −s field. */
export function applyStarobinskyMap(map: StarobinskyMap, y: ArrayLike<number>): number[] {
  const c = (z: [number, number], re: number, im: number) => [z[0] * re - z[1] * im, z[0] * im + z[1] * re];
  const [p0r, p0i] = c(map.a0, y[0], y[1]),
    [p1r, p1i] = c(map.b0, y[2], y[3]);
  const [q0r, q0i] = c(map.a1, y[0], y[1]),
    [q1r, q1i] = c(map.b1, y[2], y[3]);
  return [p0r + p1r, p0i + p1i, q0r + q1r, q0i + q1i];
}

/**
 * The horizon factor of the map: D^{2s}(Δ^{s} e^{−ikr*}) → h Δ^{−s} e^{−ikr*},
 * h = Π_{j=0}^{2s−1} 2(r+² + a²)((s − j)κ − ik), as [re, im].
 */
export function starobinskyHorizonFactor(hole: KerrHole, s: number, k: number): [number, number] {
  const tM = 2 * hole.mass * hole.rPlus;
  let re = 1,
    im = 0;
  for (let j = 0; j < 2 * s; j++) {
    const fr = 2 * tM * (s - j) * hole.kappa,
      fi = -2 * tM * k;
    const nr = re * fr - im * fi;
    im = re * fi + im * fr;
    re = nr;
  }
  return [re, im];
}
