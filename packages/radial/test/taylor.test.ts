/**
 * Taylor-series stretches (taylorStretch.ts) against closed-form solutions
 * of equations of the radial form A R'' + B R' + C R = 0 with A = Δ²: the
 * oscillator R'' + k² R = 0 (cos), a damped complex oscillator (e^{κx},
 * κ² = −k² − iγ), the Euler equation x² R'' + b x R' + c R = 0 (x^α),
 * whose regular singular point at x = 0 bounds the steps as the horizon
 * does, and growth R'' − k² R = 0 (e^{kx}, where the terms do not cancel)
 * from a state near the double range. Each: the end state within 1e-9 of the
 * closed form, and the stretch's summed error estimate at least the true error.
 */
import { describe, expect, it } from 'vitest';
import { type RiccatiEquation, taylorStretch } from '@penumbra/radial/internal';

const poly = (...c: number[]) => Float64Array.from(c);

/** Relative error of the end state (R, R') against the closed form (R, R'), each against its own modulus. */
function relError(y: Float64Array, logScale: number, R: [number, number], dR: [number, number]): number {
  const f = Math.exp(logScale);
  const eR = Math.hypot(y[0] * f - R[0], y[1] * f - R[1]) / Math.hypot(R[0], R[1]);
  const eD = Math.hypot(y[2] * f - dR[0], y[3] * f - dR[1]) / Math.hypot(dR[0], dR[1]);
  return Math.max(eR, eD);
}

describe('Taylor stretches against closed-form solutions (elementary functions)', () => {
  it('R″ + k²R = 0, k = 7, x from 1 to 30 (~200 radians): R = cos k(x − 1) to 1e-10, the estimate above the true error', () => {
    const k = 7;
    // Δ = 1: A = 1, B = 0, C = k²
    const e: RiccatiEquation = { delta: poly(1, 0, 0), bRe: poly(0), bIm: poly(0), cRe: poly(k * k), cIm: poly(0) };
    const y = Float64Array.from([1, 0.5, 0, 0.5 * k]);
    // R = cos k(x−1) + 0.5 i (cos + sin) k(x−1): a complex solution with R' = −k sin + 0.5 i k (cos − sin)
    const tol = 1e-11;
    const t = taylorStretch(e, 1, 30, y, tol);
    expect(t.ok).toBe(true);
    const p = k * 29;
    const err = relError(
      y,
      t.logScale,
      [Math.cos(p), 0.5 * (Math.cos(p) + Math.sin(p))],
      [-k * Math.sin(p), 0.5 * k * (Math.cos(p) - Math.sin(p))],
    );
    expect(err).toBeLessThan(1e-10);
    expect(t.errorSum * tol).toBeGreaterThan(err);
  });

  it('R″ + (k² + iγ)R = 0, k = 5, γ = 3, x from 0.5 to 12: R = e^{κ(x − 0.5)}, κ = i√(k² + iγ), to 1e-10, the estimate above the true error', () => {
    const k = 5,
      g = 3;
    const e: RiccatiEquation = { delta: poly(1, 0, 0), bRe: poly(0), bIm: poly(0), cRe: poly(k * k), cIm: poly(g) };
    // √(k² + iγ) by the half-angle formulas, κ = i√(…)
    const mod = Math.hypot(k * k, g);
    const sr = Math.sqrt(0.5 * (mod + k * k)),
      si = Math.sqrt(0.5 * (mod - k * k));
    const kr = -si,
      ki = sr;
    const y = Float64Array.from([1, 0, kr, ki]);
    const tol = 1e-11;
    const t = taylorStretch(e, 0.5, 12, y, tol);
    expect(t.ok).toBe(true);
    const L = 11.5;
    const amp = Math.exp(kr * L);
    const R: [number, number] = [amp * Math.cos(ki * L), amp * Math.sin(ki * L)];
    const dR: [number, number] = [kr * R[0] - ki * R[1], kr * R[1] + ki * R[0]];
    const err = relError(y, t.logScale, R, dR);
    expect(err).toBeLessThan(1e-10);
    expect(t.errorSum * tol).toBeGreaterThan(err);
  });

  it('x²R″ + bxR′ + cR = 0 (Δ = x), b = 1.5, c = 40 + 12i, x from 1e-3 to 2: R = x^α, α(α − 1) + bα + c = 0, to 1e-9, the estimate above the true error', () => {
    const b = 1.5,
      cr = 40,
      ci = 12;
    const e: RiccatiEquation = { delta: poly(0, 1, 0), bRe: poly(0, b), bIm: poly(0), cRe: poly(cr), cIm: poly(ci) };
    // α = ((1 − b) + √((1 − b)² − 4c))/2
    const zr = (1 - b) ** 2 - 4 * cr,
      zi = -4 * ci;
    const mod = Math.hypot(zr, zi);
    const wr = Math.sqrt(0.5 * (mod + zr)),
      wi = Math.sign(zi) * Math.sqrt(0.5 * (mod - zr));
    const ar = 0.5 * (1 - b + wr),
      ai = 0.5 * wi;
    // x^α = e^{α ln x}
    const pow = (x: number): [number, number] => {
      const lx = Math.log(x);
      const m = Math.exp(ar * lx);
      return [m * Math.cos(ai * lx), m * Math.sin(ai * lx)];
    };
    const x0 = 1e-3,
      x1 = 2;
    const [p0r, p0i] = pow(x0);
    const y = Float64Array.from([p0r, p0i, (ar * p0r - ai * p0i) / x0, (ar * p0i + ai * p0r) / x0]);
    const tol = 1e-11;
    const t = taylorStretch(e, x0, x1, y, tol);
    expect(t.ok).toBe(true);
    const [r, i] = pow(x1);
    const err = relError(y, t.logScale, [r, i], [(ar * r - ai * i) / x1, (ar * i + ai * r) / x1]);
    expect(err).toBeLessThan(1e-9);
    expect(t.errorSum * tol).toBeGreaterThan(err);
  });

  it('R″ − k²R = 0, k = 7, x from 1 to 12 (77 e-folds) from |R| = 1e153: R = 1e153 e^{k(x − 1)} to 1e-10, the estimate above the true error', () => {
    const k = 7;
    const e: RiccatiEquation = { delta: poly(1, 0, 0), bRe: poly(0), bIm: poly(0), cRe: poly(-k * k), cIm: poly(0) };
    // a start near the top of the double range: the squared moduli of a step's sums must not overflow (they did, and
    // the overflow passed for a settled sum: true error 5e-5 against an estimate of 1.5e-12)
    const y = Float64Array.from([1e153, 2e152, k * 1e153, k * 2e152]);
    const tol = 1e-11;
    const t = taylorStretch(e, 1, 12, y, tol);
    expect(t.ok).toBe(true);
    // against the closed form divided by 1e153 e^{77}, in logs (the state was rescaled on the way)
    const f = Math.exp(t.logScale - 77 - Math.log(1e153));
    const err = relError(Float64Array.from([y[0] * f, y[1] * f, y[2] * f, y[3] * f]), 0, [1, 0.2], [k, 0.2 * k]);
    expect(err).toBeLessThan(1e-10);
    expect(t.errorSum * tol).toBeGreaterThan(err);
  });
});
