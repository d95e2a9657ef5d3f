/**
 * Far-zone solutions of the massive Dirac pair as asymptotic series
 *   P = e^{νr} r^ρ Σ_n c_n r^{−n},  ν = ∓ i k∞,  k∞ = √(ω² − μ²),
 * from the 1/r expansion dP/dr = Σ_j M_j r^{−j} P (docs/massive-dirac.md).
 * ρ follows from solvability at first order: for the incoming wave
 * ρ = −i M(2ω² − μ²)/k∞, the long-range (Coulomb-type) logarithmic phase.
 */
import { type C, type M2, type V2, cabs, cdiv, cmul, cscale, csub, dot, mv } from './complex2.js';
import type { DiracRadialProblem } from './equation.js';
import { seriesPower, seriesProduct } from './realSeries.js';

/** One far-zone series. */
export interface DiracFarSeries {
  nu: C;
  rho: C;
  /** c_n at [4n … 4n + 3] as (Re, Im) of its P₊ and P₋ parts */
  coefficients: Float64Array;
  /** number of coefficients */
  count: number;
}

/**
 * The 1/r expansion dP/dr = Σ_j M_j r^{−j} P of the pair, j < count, by its
 * real entries: M_j = [[−i kd_j, le_j − i me_j], [le_j + i me_j, i kd_j]]
 * (kd: K/Δ, le: λ/√Δ·r, me: μr/√Δ, each expanded in 1/r).
 */
export interface FarExpansion {
  kd: Float64Array;
  le: Float64Array;
  me: Float64Array;
}

/** M_j, j = 0 … count − 1: the 1/r expansion of the pair's matrix. */
export function farExpansion(p: DiracRadialProblem, count: number): FarExpansion {
  const { hole, omega, m, mu, lambda } = p;
  const { a, mass } = hole;
  const q = [1, -2 * mass, a * a];
  const d = seriesPower(q, -1, count); // (1 − 2Mt + a²t²)^{−1}
  const e = seriesPower(q, -0.5, count);
  const kdSeries = seriesProduct([omega, 0, omega * a * a - a * m], d, count); // K/Δ
  const kd = new Float64Array(count);
  const le = new Float64Array(count);
  const me = new Float64Array(count);
  for (let j = 0; j < count; j++) {
    kd[j] = kdSeries[j];
    le[j] = j > 0 ? lambda * e[j - 1] : 0;
    me[j] = mu * e[j];
  }
  return { kd, le, me };
}

/** M_j as a complex matrix (for the two the solvability conditions use). */
function matrix(x: FarExpansion, j: number): M2 {
  return [
    [
      [0, -x.kd[j]],
      [x.le[j], -x.me[j]],
    ],
    [
      [x.le[j], x.me[j]],
      [0, x.kd[j]],
    ],
  ];
}

function minus(m: M2, nu: C): M2 {
  return [
    [csub(m[0][0], nu), m[0][1]],
    [m[1][0], csub(m[1][1], nu)],
  ];
}

/** A left null vector of a singular 2×2 matrix. */
function leftNull(b: M2): V2 {
  const l: V2 = [b[1][0], cscale(b[0][0], -1)];
  return cabs(l[0]) + cabs(l[1]) > 0 ? l : [b[1][1], cscale(b[0][1], -1)];
}

/** Σ_{j = from…n} M_j c_{n−j}, written to SUM (scratch: the series is built on scalars, allocation-free). */
const SUM = new Float64Array(4);
function sumProducts(x: FarExpansion, c: Float64Array, n: number, from: number): void {
  const { kd, le, me } = x;
  let s0r = 0;
  let s0i = 0;
  let s1r = 0;
  let s1i = 0;
  for (let j = from; j <= n; j++) {
    const o = 4 * (n - j);
    const v0 = c[o];
    const v1 = c[o + 1];
    const w0 = c[o + 2];
    const w1 = c[o + 3];
    const k = kd[j];
    const l = le[j];
    const u = me[j];
    // mv(M_j, c) with M_j's structural zeros left out (x·0 ± y is y: the doubles of the general product)
    s0r += k * v1 + (l * w0 + u * w1);
    s0i += -k * v0 + (l * w1 - u * w0);
    s1r += l * v0 - u * v1 - k * w1;
    s1i += l * v1 + u * v0 + k * w0;
  }
  SUM[0] = s0r;
  SUM[1] = s0i;
  SUM[2] = s1r;
  SUM[3] = s1i;
}

/**
 * The series of the wave with exponent ν (eigenvalue of M₀) and leading vector
 * c0; `other`/`nuOther` are M₀'s other eigenpair, used to solve the singular
 * systems (M₀ − ν)c = b. Each coefficient from the last: c_{n−1} = p + αc₀
 * with α from the solvability condition ℓ·b_n = 0, then the particular part
 * p_n of (M₀ − ν)c_n = b_n along `other`. The complex products are written
 * out on scalars in the operations of complex2.ts (building the series with
 * its helpers was mostly allocation).
 */
export function diracFarSeries(x: FarExpansion, nu: C, c0: V2, nuOther: C, other: V2): DiracFarSeries {
  const N = x.kd.length;
  const m0 = matrix(x, 0);
  const m1 = matrix(x, 1);
  const l = leftNull(minus(m0, nu));
  const lOther = leftNull(minus(m0, nuOther));
  const lc0 = dot(l, c0);
  const rho = cdiv(dot(l, mv(m1, c0)), lc0);
  const gap = csub(nuOther, nu);
  const lOe = dot(lOther, other);
  const [pr, pi] = cmul(lOe, gap);
  const pd = pr * pr + pi * pi;
  const [[l0r, l0i], [l1r, l1i]] = l;
  const [[o0r, o0i], [o1r, o1i]] = lOther;
  const [[e0r, e0i], [e1r, e1i]] = other;
  const [[c0r, c0i], [c1r, c1i]] = c0;
  const [[a00r, a00i], [a01r, a01i]] = m1[0];
  const [[a10r, a10i], [a11r, a11i]] = m1[1];
  const [lcr, lci] = lc0;
  const c = new Float64Array(4 * N);
  c[0] = c0r;
  c[1] = c0i;
  c[2] = c1r;
  c[3] = c1i;
  for (let n = 1; n < N; n++) {
    const sr = rho[0] - n + 1;
    const si = rho[1];
    if (n > 1) {
      // c_{n−1} is p_{n−1} so far: add αc₀, α = (ℓ·(p·shift − M₁p) − ℓ·Σ_{j≥2} M_j c_{n−j}) / (ℓ·c₀ (n − 1))
      const o = 4 * (n - 1);
      const p0r = c[o];
      const p0i = c[o + 1];
      const p1r = c[o + 2];
      const p1i = c[o + 3];
      // D = vscale(p, shift) − mv(M₁, p)
      const d0r = p0r * sr - p0i * si - (a00r * p0r - a00i * p0i + (a01r * p1r - a01i * p1i));
      const d0i = p0r * si + p0i * sr - (a00r * p0i + a00i * p0r + (a01r * p1i + a01i * p1r));
      const d1r = p1r * sr - p1i * si - (a10r * p0r - a10i * p0i + (a11r * p1r - a11i * p1i));
      const d1i = p1r * si + p1i * sr - (a10r * p0i + a10i * p0r + (a11r * p1i + a11i * p1r));
      sumProducts(x, c, n, 2);
      const [s0r, s0i, s1r, s1i] = SUM;
      // t = dot(ℓ, D) − dot(ℓ, S)
      const tr = l0r * d0r - l0i * d0i + (l1r * d1r - l1i * d1i) - (l0r * s0r - l0i * s0i + (l1r * s1r - l1i * s1i));
      const ti = l0r * d0i + l0i * d0r + (l1r * d1i + l1i * d1r) - (l0r * s0i + l0i * s0r + (l1r * s1i + l1i * s1r));
      // α = t / (ℓ·c₀ · (n − 1))
      const br = lcr * (n - 1);
      const bi = lci * (n - 1);
      const bd = br * br + bi * bi;
      const ar = (tr * br + ti * bi) / bd;
      const ai = (ti * br - tr * bi) / bd;
      c[o] = p0r + (c0r * ar - c0i * ai);
      c[o + 1] = p0i + (c0r * ai + c0i * ar);
      c[o + 2] = p1r + (c1r * ar - c1i * ai);
      c[o + 3] = p1i + (c1r * ai + c1i * ar);
    }
    // b = vscale(c_{n−1}, shift) − Σ_{j≥1} M_j c_{n−j}
    const o = 4 * (n - 1);
    const q0r = c[o];
    const q0i = c[o + 1];
    const q1r = c[o + 2];
    const q1i = c[o + 3];
    sumProducts(x, c, n, 1);
    const b0r = q0r * sr - q0i * si - SUM[0];
    const b0i = q0r * si + q0i * sr - SUM[1];
    const b1r = q1r * sr - q1i * si - SUM[2];
    const b1i = q1r * si + q1i * sr - SUM[3];
    // p_n = other · (ℓ_other·b) / (ℓ_other·other · gap)
    const ur = o0r * b0r - o0i * b0i + (o1r * b1r - o1i * b1i);
    const ui = o0r * b0i + o0i * b0r + (o1r * b1i + o1i * b1r);
    const fr = (ur * pr + ui * pi) / pd;
    const fi = (ui * pr - ur * pi) / pd;
    const on = 4 * n;
    c[on] = e0r * fr - e0i * fi;
    c[on + 1] = e0r * fi + e0i * fr;
    c[on + 2] = e1r * fr - e1i * fi;
    c[on + 3] = e1r * fi + e1i * fr;
  }
  // the last coefficient lacks its c0 part
  return { nu, rho, coefficients: c, count: N - 1 };
}

/** The far series summed at one radius. */
export interface DiracFarValue {
  value: V2;
  /** the last term summed relative to the sum */
  lastTerm: number;
  /** false when the sum ran out of coefficients while its terms still decreased and were above 1e-17 of it */
  complete: boolean;
}

/** Terms below this share of the sum end it: the rest of an asymptotic series cannot move the sum in double precision. */
const NEGLIGIBLE = 1e-17;

/**
 * The series at r, summed to its smallest term or to the first below
 * NEGLIGIBLE of the sum; `lastTerm` is that term relative to the sum. On
 * scalar locals (sizes compared squared): the solve sums it at up to a dozen
 * radii, and the temporaries of the complex helpers were a sixth of a
 * near-threshold solve, in garbage collection.
 */
export function evaluateDiracFar(series: DiracFarSeries, r: number): DiracFarValue {
  const cs = series.coefficients;
  const count = series.count;
  let s0r = 0;
  let s0i = 0;
  let s1r = 0;
  let s1i = 0;
  let pw = 1;
  let prev = Infinity;
  let last = Infinity;
  let complete = false;
  const negligible2 = NEGLIGIBLE * NEGLIGIBLE;
  for (let n = 0; n < count; n++) {
    const t0r = cs[4 * n] * pw;
    const t0i = cs[4 * n + 1] * pw;
    const t1r = cs[4 * n + 2] * pw;
    const t1i = cs[4 * n + 3] * pw;
    const size = t0r * t0r + t0i * t0i + (t1r * t1r + t1i * t1i);
    if (size > prev && size > 0) {
      complete = true;
      break;
    }
    s0r += t0r;
    s0i += t0i;
    s1r += t1r;
    s1i += t1i;
    prev = size;
    last = size;
    pw /= r;
    if (size < negligible2 * (s0r * s0r + s0i * s0i + (s1r * s1r + s1i * s1i))) {
      complete = true;
      break;
    }
  }
  const lr = Math.log(r);
  const { nu, rho } = series;
  const e = Math.exp(nu[0] * r + rho[0] * lr);
  const angle = nu[1] * r + rho[1] * lr;
  const pr = e * Math.cos(angle);
  const pi = e * Math.sin(angle);
  const norm = Math.sqrt(s0r * s0r + s0i * s0i + (s1r * s1r + s1i * s1i));
  return {
    value: [
      [s0r * pr - s0i * pi, s0r * pi + s0i * pr],
      [s1r * pr - s1i * pi, s1r * pi + s1i * pr],
    ],
    lastTerm: Math.sqrt(last) / Math.max(norm, 1e-300),
    complete,
  };
}

/**
 * The outgoing wave from the incoming one: the pair maps to itself under
 * P → (P̄₋, P̄₊) for real ω, μ, λ, and so do the leading terms
 * (1, −q)e^{−ik∞r} ↦ (−q, 1)e^{ik∞r}, so u_out = (ū_in,₋, ū_in,₊) term by term.
 */
export function mirrorDiracFar(f: DiracFarValue): DiracFarValue {
  const [[ar, ai], [br, bi]] = f.value;
  return {
    value: [
      [br, -bi],
      [ar, -ai],
    ],
    lastTerm: f.lastTerm,
    complete: f.complete,
  };
}
