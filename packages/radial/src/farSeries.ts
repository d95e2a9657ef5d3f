/**
 * Asymptotic series of the Teukolsky radial equation at infinity:
 *
 *   R_in  = e^{−iωr*} r^{−1}      Σ c_n r^{−n}   (σ = −1)
 *   R_out = e^{+iωr*} r^{−2s−1}   Σ c_n r^{−n}   (σ = +1)
 *
 * Substituting R = e^{iσωr*} g into the radial equation gives
 * Δ² g'' + Δ[2iσω(r² + a²) + (s+1)Δ'] g' + Q_σ g = 0 with polynomial
 * coefficients; the leading balance fixes the power p and the c_n follow from
 * a recurrence (docs/method.md). The series is asymptotic: we sum it until the
 * terms fall below 1e-17 of the sum, and report failure if they turn upward
 * first, so the caller can move the matching radius outward.
 */
import type { KerrHole } from '@penumbra/kerr';
import { tortoiseFromHorizonDistance } from '@penumbra/kerr';
import { add, cpoly, mul, scale, type CPoly } from './complexPoly.js';
import { deltaPoly, kPoly, type RadialMode } from './equation.js';

export interface FarSeries {
  sigma: 1 | -1;
  /** leading power p of r (−1 for ingoing, −2s−1 for outgoing) */
  p: number;
  cRe: number[];
  cIm: number[];
}

export interface FarValue {
  R: [number, number];
  dR: [number, number];
  terms: number;
  /** magnitude of the last term kept relative to the sum */
  truncation: number;
  converged: boolean;
}

function padTo(p: CPoly, n: number): CPoly {
  const re = p.re.slice(), im = p.im.slice();
  while (re.length < n) { re.push(0); im.push(0); }
  return { re, im };
}

// The same mode is solved at two tolerances (and on both legs of the
// two-sided route), so recently built series are reused.
const cache = new Map<string, FarSeries>();
const CACHE_SIZE = 64;

/** Coefficients c_n (n < maxTerms) of the series with σ = ±1. */
export function farSeries(hole: KerrHole, mode: RadialMode, sigma: 1 | -1, maxTerms = 120): FarSeries {
  const key = `${hole.mass},${hole.a},${mode.s},${mode.m},${mode.omega},${mode.lambda},${sigma},${maxTerms}`;
  const hit = cache.get(key);
  if (hit) return hit;
  const series = buildFarSeries(hole, mode, sigma, maxTerms);
  if (cache.size >= CACHE_SIZE) cache.delete(cache.keys().next().value as string);
  cache.set(key, series);
  return series;
}

function buildFarSeries(hole: KerrHole, mode: RadialMode, sigma: 1 | -1, maxTerms: number): FarSeries {
  const { a, mass: M } = hole;
  const { s, omega, m, lambda } = mode;
  const D = deltaPoly(hole);
  const dD = cpoly([-2 * M, 2]);
  const varpi = cpoly([a * a, 0, 1]);
  const K = kPoly(hole, mode);
  const A = padTo(mul(D, D), 5);
  const B = padTo(mul(D, add(scale(varpi, 0, 2 * sigma * omega), scale(dD, s + 1))), 5);
  const Q = padTo(
    add(
      scale(add(mul(cpoly([0, 2]), D), scale(mul(dD, varpi), s)), 0, sigma * omega),
      add(scale(varpi, -2 * a * m * omega), cpoly([a * a * m * m])),
      scale(mul(cpoly([-M, 1]), K), 0, -2 * s),
      mul(D, add(cpoly([-lambda]), cpoly([0, 0], [0, 4 * s * omega]))),
    ),
    5,
  );
  // Leading balance: B4 p + C3 = 0 with B4 = 2iσω.
  const b4r = B.re[4], b4i = B.im[4];
  const c3r = Q.re[3], c3i = Q.im[3];
  const bb = b4r * b4r + b4i * b4i;
  const p = -(c3r * b4r + c3i * b4i) / bb; // real by construction
  const cRe = [1], cIm = [0];
  for (let N = 1; N < maxTerms; N++) {
    let rr = 0, ri = 0;
    for (let j = 0; j <= 4; j++) {
      const n = N + j - 5;
      if (n < 0) continue;
      const f = (p - n) * (p - n - 1);
      rr += f * (A.re[j] * cRe[n] - A.im[j] * cIm[n]);
      ri += f * (A.re[j] * cIm[n] + A.im[j] * cRe[n]);
    }
    for (let j = 0; j <= 3; j++) {
      const n = N + j - 4;
      if (n < 0) continue;
      const f = p - n;
      rr += f * (B.re[j] * cRe[n] - B.im[j] * cIm[n]);
      ri += f * (B.re[j] * cIm[n] + B.im[j] * cRe[n]);
    }
    for (let j = 0; j <= 2; j++) {
      const n = N + j - 3;
      if (n < 0) continue;
      rr += Q.re[j] * cRe[n] - Q.im[j] * cIm[n];
      ri += Q.re[j] * cIm[n] + Q.im[j] * cRe[n];
    }
    // c_N = rest / (B4 N)
    const dr = b4r * N, di = b4i * N;
    const den = dr * dr + di * di;
    cRe.push((rr * dr + ri * di) / den);
    cIm.push((ri * dr - rr * di) / den);
  }
  return { sigma, p, cRe, cIm };
}

/** Evaluate R and R' of a far-zone series solution at radius r. */
export function evaluateFar(hole: KerrHole, mode: RadialMode, series: FarSeries, r: number): FarValue {
  const { cRe, cIm, p, sigma } = series;
  const inv = 1 / r;
  let sRe = 0, sIm = 0, tRe = 0, tIm = 0;
  let pw = 1;
  let small = 0;
  let terms = 0;
  let truncation = 1;
  let converged = false;
  let prev1 = Infinity, prev2 = Infinity;
  for (let n = 0; n < cRe.length; n++) {
    const termRe = cRe[n] * pw, termIm = cIm[n] * pw;
    const mag = Math.hypot(termRe, termIm);
    // Divergence has set in after two successive increases (a single uptick
    // can follow a coefficient that vanishes by accident).
    if (n > 3 && mag > prev1 && prev1 > prev2 && mag > 1e-17 * Math.hypot(sRe, sIm)) break;
    prev2 = prev1;
    prev1 = mag;
    sRe += termRe; sIm += termIm;
    tRe += (p - n) * termRe; tIm += (p - n) * termIm;
    terms = n + 1;
    truncation = mag / Math.hypot(sRe, sIm);
    if (truncation < 1e-17) {
      if (++small >= 3) { converged = true; break; }
    } else small = 0;
    pw *= inv;
  }
  const { a } = hole;
  const omega = mode.omega;
  const rs = tortoiseFromHorizonDistance(hole, r - hole.rPlus);
  const rp = Math.pow(r, p);
  const ph = sigma * omega * rs;
  const eRe = rp * Math.cos(ph), eIm = rp * Math.sin(ph);
  // g = r^p S, g' = r^{p−1} T; R = e g, R' = e (g' + iσω ϖ/Δ g)
  const R: [number, number] = [eRe * sRe - eIm * sIm, eRe * sIm + eIm * sRe];
  const w = (sigma * omega * (r * r + a * a)) / ((r - hole.rPlus) * (r - hole.rMinus));
  const gpRe = tRe * inv - w * sIm;
  const gpIm = tIm * inv + w * sRe;
  const dR: [number, number] = [eRe * gpRe - eIm * gpIm, eRe * gpIm + eIm * gpRe];
  return { R, dR, terms, truncation, converged };
}
