/**
 * Far-zone asymptotic series of the massive Dirac potential problem in r:
 * Z_rr + p Z_r + q Z = 0 with p = −g_r/g, q = g²(ω² − Ŵ²) − g Ŵ_r, g = dr̂* / dr
 * (docs/massive-dirac.md). Z = e^{νr} r^ρ Σ c_n r^{−n}, ν = ∓ik∞, ρ =
 * −(p₁ν + q₁)/(2ν) (the logarithmic phase), and
 *   2νn c_n = (ρ−n+1)(ρ−n) c_{n−1} + Σ_{j≥1} p_j(ρ−n+j) c_{n−j} + Σ_{j≥2}(νp_j + q_j) c_{n+1−j}.
 * Coefficients of p and q are built by power-series arithmetic in t = 1/r.
 */
import type { MassiveDiracMode } from './massiveDiracPotential.js';

type Cx = [number, number];
const mul = (a: Cx, b: Cx): Cx => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
const add = (a: Cx, b: Cx): Cx => [a[0] + b[0], a[1] + b[1]];
const div = (a: Cx, b: Cx): Cx => {
  const d = b[0] * b[0] + b[1] * b[1];
  return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d];
};

function power(a: number[], e: number, n: number): number[] {
  const b = new Array<number>(n).fill(0);
  b[0] = a[0] ** e;
  for (let k = 1; k < n; k++) {
    let s = 0;
    for (let i = 1; i <= Math.min(k, a.length - 1); i++) s += (i * (e + 1) - k) * a[i] * b[k - i];
    b[k] = s / (k * a[0]);
  }
  return b;
}
function times(a: number[], b: number[], n: number): number[] {
  const c = new Array<number>(n).fill(0);
  for (let i = 0; i < Math.min(a.length, n); i++) for (let j = 0; j < Math.min(b.length, n - i); j++) c[i + j] += a[i] * b[j];
  return c;
}
const plus = (a: number[], b: number[], n: number): number[] => Array.from({ length: n }, (_, i) => (a[i] ?? 0) + (b[i] ?? 0));
const scale = (a: number[], s: number): number[] => a.map((v) => v * s);
/** d/dr of a series in t = 1/r: −t² d/dt. */
const dr = (a: number[], n: number): number[] => Array.from({ length: n }, (_, i) => (i >= 2 ? -(i - 1) * a[i - 1] : 0));

/** p_j and q_j, j < n. */
export function farCoefficients(p: MassiveDiracMode, n: number): { pc: number[]; qc: number[] } {
  const { mass: M, omega, mu, lambda } = p;
  const beta = (lambda / mu) ** 2;
  const cc = (mu * lambda) / (2 * omega) / (mu * mu);
  const oneMinus = [1, -2 * M];
  const S2 = [1, 0, beta];
  const S3 = power(S2, 1.5, n);
  const g = plus(power(oneMinus, -1, n), scale(times([0, 0, cc], power(S2, -1, n), n), -1), n);
  const den = plus(S2, scale(times(oneMinus, [0, 0, cc], n), -1), n);
  const W = scale(times(times(power(oneMinus, 0.5, n), S3, n), power(den, -1, n), n), mu);
  const ginv = power(g, -1, n);
  const pc = scale(times(dr(g, n), ginv, n), -1);
  const g2 = times(g, g, n);
  const qc = plus(times(g2, plus([omega * omega], scale(times(W, W, n), -1), n), n), scale(times(g, dr(W, n), n), -1), n);
  return { pc, qc };
}

/** Value and r-derivative of one far-zone solution at r, summed to its smallest term. */
export interface FarWave {
  value: Cx;
  derivative: Cx;
  lastTerm: number;
}

/** The far-zone wave with exponent ν = sign·ik∞ at r (count series terms). */
export function farWave(p: MassiveDiracMode, sign: 1 | -1, r: number, count: number): FarWave {
  const { pc, qc } = farCoefficients(p, count + 2);
  const kInf = Math.sqrt((p.omega - p.mu) * (p.omega + p.mu));
  const nu: Cx = [0, sign * kInf];
  const rho = div(add(mul([pc[1], 0], nu), [qc[1], 0]), mul([-2, 0], nu));
  const c: Cx[] = [[1, 0]];
  for (let n = 1; n < count; n++) {
    const sh1: Cx = [rho[0] - n + 1, rho[1]];
    const sh0: Cx = [rho[0] - n, rho[1]];
    let s = mul(mul(sh1, sh0), c[n - 1]);
    for (let j = 1; j <= n; j++) s = add(s, mul(mul([pc[j], 0], [rho[0] - n + j, rho[1]]), c[n - j]));
    for (let j = 2; j <= n + 1; j++) s = add(s, mul(add(mul(nu, [pc[j], 0]), [qc[j], 0]), c[n + 1 - j]));
    c.push(div(s, mul([2 * n, 0], nu)));
  }
  let sum: Cx = [0, 0];
  let dsum: Cx = [0, 0];
  let pw = 1;
  let prev = Infinity;
  let last = Infinity;
  for (let n = 0; n < count; n++) {
    const term = mul(c[n], [pw, 0]);
    const size = Math.hypot(term[0], term[1]);
    if (size > prev && size > 0) break;
    sum = add(sum, term);
    // d/dr of r^{ρ−n} e^{νr}: (ν + (ρ − n)/r)
    dsum = add(dsum, mul(term, add(nu, [(rho[0] - n) / r, rho[1] / r])));
    prev = size;
    last = size;
    pw /= r;
  }
  const lr = Math.log(r);
  const ph = [rho[0] * lr + nu[0] * r, rho[1] * lr + nu[1] * r];
  const e = Math.exp(ph[0]);
  const phase: Cx = [e * Math.cos(ph[1]), e * Math.sin(ph[1])];
  return { value: mul(sum, phase), derivative: mul(dsum, phase), lastTerm: last / Math.hypot(sum[0], sum[1]) };
}

export { mul as cmul, div as cdiv };
