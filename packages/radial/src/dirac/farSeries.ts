/**
 * Far-zone solutions of the massive Dirac pair as asymptotic series
 *   P = e^{νr} r^ρ Σ_n c_n r^{−n},  ν = ∓ i k∞,  k∞ = √(ω² − μ²),
 * from the 1/r expansion dP/dr = Σ_j M_j r^{−j} P (docs/massive-dirac.md).
 * ρ follows from solvability at first order: for the incoming wave
 * ρ = −i M(2ω² − μ²)/k∞, the long-range (Coulomb-type) logarithmic phase.
 */
import {
  type C,
  type M2,
  type V2,
  cabs,
  cdiv,
  cmul,
  cscale,
  csub,
  dot,
  mv,
  vadd,
  vscale,
} from './complex2.js';
import type { DiracRadialProblem } from './equation.js';
import { seriesPower, seriesProduct } from './realSeries.js';

/** One far-zone series. */
export interface DiracFarSeries {
  nu: C;
  rho: C;
  coefficients: V2[];
}

/** M_j, j = 0 … count − 1: the 1/r expansion of the pair's matrix. */
export function farMatrices(p: DiracRadialProblem, count: number): M2[] {
  const { hole, omega, m, mu, lambda } = p;
  const { a, mass } = hole;
  const q = [1, -2 * mass, a * a];
  const d = seriesPower(q, -1, count); // (1 − 2Mt + a²t²)^{−1}
  const e = seriesPower(q, -0.5, count);
  const kd = seriesProduct([omega, 0, omega * a * a - a * m], d, count); // K/Δ
  const out: M2[] = [];
  for (let j = 0; j < count; j++) {
    const re = j > 0 ? lambda * e[j - 1] : 0;
    out.push([
      [
        [0, -kd[j]],
        [re, -mu * e[j]],
      ],
      [
        [re, mu * e[j]],
        [0, kd[j]],
      ],
    ]);
  }
  return out;
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

/**
 * The series of the wave with exponent ν (eigenvalue of M₀) and leading vector
 * c0; `other`/`nuOther` are M₀'s other eigenpair, used to solve the singular
 * systems (M₀ − ν)c = b.
 */
export function diracFarSeries(mats: M2[], nu: C, c0: V2, nuOther: C, other: V2): DiracFarSeries {
  const N = mats.length;
  const l = leftNull(minus(mats[0], nu));
  const lOther = leftNull(minus(mats[0], nuOther));
  const lc0 = dot(l, c0);
  const rho = cdiv(dot(l, mv(mats[1], c0)), lc0);
  const gap = csub(nuOther, nu);
  const lOe = dot(lOther, other);
  const particular = (b: V2): V2 => vscale(other, cdiv(dot(lOther, b), cmul(lOe, gap)));
  const c: V2[] = [c0];
  let pending: V2 | null = null; // p_{n−1}, awaiting its multiple of c0
  const st = structured(mats);
  const sum = (n: number, from: number): V2 => sumProducts(mats, c, n, from, st);
  for (let n = 1; n < N; n++) {
    if (pending) {
      // choose α so that ℓ·b_n = 0, then c_{n−1} = p + α c0
      const shift: C = [rho[0] - n + 1, rho[1]];
      const t = csub(dot(l, csub2(vscale(pending, shift), mv(mats[1], pending))), dot(l, sum(n, 2)));
      const alpha = cdiv(t, cscale(lc0, n - 1));
      c[n - 1] = vadd(pending, vscale(c0, alpha));
    }
    const shift: C = [rho[0] - n + 1, rho[1]];
    const b = csub2(vscale(c[n - 1], shift), sum(n, 1));
    pending = particular(b);
    c.push(pending);
  }
  c.pop(); // the last coefficient lacks its c0 part
  return { nu, rho, coefficients: c };
}

function csub2(a: V2, b: V2): V2 {
  return [csub(a[0], b[0]), csub(a[1], b[1])];
}


/**
 * The entries of M_j that are not structurally zero, for j ≥ 1 as farMatrices
 * builds them: M_j = [[−i kd_j, λe − iμe], [λe + iμe, i kd_j]] (real kd, λe, μe);
 * null when `mats` has another shape.
 */
interface Structured {
  kd: Float64Array;
  le: Float64Array;
  me: Float64Array;
}
function structured(mats: M2[]): Structured | null {
  const n = mats.length;
  const kd = new Float64Array(n);
  const le = new Float64Array(n);
  const me = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    const [[a, b], [d, e]] = mats[j];
    if (a[0] !== 0 || e[0] !== 0 || a[1] !== -e[1] || b[0] !== d[0] || b[1] !== -d[1]) return null;
    kd[j] = e[1];
    le[j] = d[0];
    me[j] = d[1];
  }
  return { kd, le, me };
}

/**
 * Σ_{j = from…n} M_j c_{n−j} on scalar locals: the same operations in the same
 * order as summing vadd(s, mv(M_j, c_{n−j})), without the temporaries
 * (building the series was mostly allocation); with `st`, the products with
 * M_j's structural zeros left out (the same doubles: x·0 ± y is y).
 */
function sumProducts(mats: M2[], c: V2[], n: number, from: number, st: Structured | null = null): V2 {
  let s0r = 0;
  let s0i = 0;
  let s1r = 0;
  let s1i = 0;
  if (st !== null) {
    const { kd, le, me } = st;
    for (let j = from; j <= n && j < mats.length; j++) {
      const cj = c[n - j];
      const v = cj[0];
      const w = cj[1];
      const k = kd[j];
      const l = le[j];
      const u = me[j];
      s0r += k * v[1] + (l * w[0] + u * w[1]);
      s0i += -k * v[0] + (l * w[1] - u * w[0]);
      s1r += l * v[0] - u * v[1] - k * w[1];
      s1i += l * v[1] + u * v[0] + k * w[0];
    }
  } else {
    for (let j = from; j <= n && j < mats.length; j++) {
      const [[a, b], [d, e]] = mats[j];
      const [v, w] = c[n - j];
      s0r += a[0] * v[0] - a[1] * v[1] + (b[0] * w[0] - b[1] * w[1]);
      s0i += a[0] * v[1] + a[1] * v[0] + (b[0] * w[1] + b[1] * w[0]);
      s1r += d[0] * v[0] - d[1] * v[1] + (e[0] * w[0] - e[1] * w[1]);
      s1i += d[0] * v[1] + d[1] * v[0] + (e[0] * w[1] + e[1] * w[0]);
    }
  }
  return [
    [s0r, s0i],
    [s1r, s1i],
  ];
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
  let s0r = 0;
  let s0i = 0;
  let s1r = 0;
  let s1i = 0;
  let pw = 1;
  let prev = Infinity;
  let last = Infinity;
  let complete = false;
  const negligible2 = NEGLIGIBLE * NEGLIGIBLE;
  for (let n = 0; n < cs.length; n++) {
    const c0 = cs[n][0];
    const c1 = cs[n][1];
    const t0r = c0[0] * pw;
    const t0i = c0[1] * pw;
    const t1r = c1[0] * pw;
    const t1i = c1[1] * pw;
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
