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
import { EQUATION_SCRATCH, fillEquation, type RadialMode } from './equation.js';

/** Series scratch (n ≤ 2·2 + 2 = 6 coefficients): the map runs to completion without re-entering itself. */
const LEN = 8;
const [wRe, wIm, pRe, pIm, qRe, qIm, numRe, numIm, denRe, denIm] = Array.from({ length: 10 }, () => new Float64Array(LEN));
const [aRe0, aIm0, bRe0, bIm0, aRe1, aIm1, bRe1, bIm1] = Array.from({ length: 8 }, () => new Float64Array(LEN));

/**
 * Load the first n coefficients of a real polynomial (length `len`, zero
 * beyond) into re, with im 0; `negate` loads −p (and −0 for im), as
 * negating the loaded series did.
 */
function load(re: Float64Array, im: Float64Array, p: Float64Array, len: number, n: number, f: number, negate: boolean): void {
  for (let i = 0; i < n; i++) {
    const v = i < len ? (f === 1 ? p[i] : p[i] * f) : 0;
    re[i] = negate ? -v : v;
    im[i] = negate ? -0 : 0;
  }
}

/** out = a / b to n terms for a series b with b_0 ≠ 0 (out distinct from a and b). */
function divInto(
  outRe: Float64Array,
  outIm: Float64Array,
  aRe: Float64Array,
  aIm: Float64Array,
  bRe: Float64Array,
  bIm: Float64Array,
  n: number,
): void {
  const d = bRe[0] * bRe[0] + bIm[0] * bIm[0];
  for (let k = 0; k < n; k++) {
    let xr = aRe[k],
      xi = aIm[k];
    for (let j = 1; j <= k; j++) {
      xr -= bRe[j] * outRe[k - j] - bIm[j] * outIm[k - j];
      xi -= bRe[j] * outIm[k - j] + bIm[j] * outRe[k - j];
    }
    outRe[k] = (xr * bRe[0] + xi * bIm[0]) / d;
    outIm[k] = (xi * bRe[0] - xr * bIm[0]) / d;
  }
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
  // The −s equation A R'' + B R' + C R = 0 expanded about r itself, read in place from its scratch.
  fillEquation(hole, minus, r);
  const eq = EQUATION_SCRATCH;
  load(numRe, numIm, eq.K, 3, n, 1, false);
  load(denRe, denIm, eq.delta, eq.nDelta, n, 1, false);
  divInto(wRe, wIm, numRe, numIm, denRe, denIm, n);
  // R'' = P R' + Q R: P = −B/A = −(s+1)Δ'/Δ, Q = −C/A = −U/Δ².
  load(denRe, denIm, eq.A, eq.nA, n, 1, false);
  load(numRe, numIm, eq.DD, eq.nDD, n, minus.s + 1, true);
  divInto(pRe, pIm, numRe, numIm, denRe, denIm, n);
  for (let i = 0; i < n; i++) {
    const v = i < eq.nC ? eq.CRe[i] : 0;
    const w = i < eq.nC ? eq.CIm[i] : 0;
    numRe[i] = -v;
    numIm[i] = -w;
  }
  divInto(qRe, qIm, numRe, numIm, denRe, denIm, n);
  // α ← α' + βQ − iWα, β ← α + β' + βP − iWβ, each pass one order shorter; the sums run in the order of the
  // series helpers above (the same doubles), on scratch arrays.
  let aRe = aRe0.fill(0, 0, n),
    aIm = aIm0.fill(0, 0, n),
    bRe = bRe0.fill(0, 0, n),
    bIm = bIm0.fill(0, 0, n);
  aRe[0] = 1;
  let naRe = aRe1.fill(0, 0, n),
    naIm = aIm1.fill(0, 0, n),
    nbRe = bRe1.fill(0, 0, n),
    nbIm = bIm1.fill(0, 0, n);
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
        bqR += bRe[i] * qRe[m] - bIm[i] * qIm[m];
        bqI += bRe[i] * qIm[m] + bIm[i] * qRe[m];
        waR += wRe[i] * aRe[m] - wIm[i] * aIm[m];
        waI += wRe[i] * aIm[m] + wIm[i] * aRe[m];
        bpR += bRe[i] * pRe[m] - bIm[i] * pIm[m];
        bpI += bRe[i] * pIm[m] + bIm[i] * pRe[m];
        wbR += wRe[i] * bRe[m] - wIm[i] * bIm[m];
        wbI += wRe[i] * bIm[m] + wIm[i] * bRe[m];
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
  const alpha = { re: aRe, im: aIm };
  const beta = { re: bRe, im: bIm };
  // alpha, beta now carry two coefficients: values and first derivatives at r.
  const P0: [number, number] = [pRe[0], pIm[0]];
  const Q0: [number, number] = [qRe[0], qIm[0]];
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
