/**
 * A leg crossed by Riccati steps where the solution oscillates (or grows and
 * decays) fast, and by the ODE integrator elsewhere (docs/method.md,
 * section 9). The leg is cut on a geometric ladder in x = r − r+ (each rung
 * multiplies x by RUNG; in u = ln x the nearest singularity of the
 * coefficients, r−, is π away from the real axis); a rung is given to a
 * Riccati step when a cheap look says the WKB ratio is small and the rung
 * holds enough phase to be worth it. A Riccati step that fails is halved in
 * ln x up to MAX_SPLITS times (near a turning point the branch point of W
 * limits what one rung resolves; a massless rung that predictably fails,
 * RHO_FAIL, is not tried first) and what still fails goes to the
 * integrator. On a massless leg the stretches between Riccati rungs (and a
 * leg of more than TAYLOR_LEG_PHASE radians without any) are crossed by
 * Taylor-series steps instead (taylorStretch.ts), the integrator taking
 * over only where a Taylor step cannot be made. Where no rung qualifies
 * and the phase is below TAYLOR_LEG_PHASE the leg is exactly
 * `integrateLeg`'s, so low-frequency modes are unchanged bit for bit.
 */
import type { RadialSample } from './solution.js';
import type { KerrHole } from '@penumbra/kerr';
import { fieldMassOf, type RadialMode } from './equation.js';
import {
  LOCAL,
  LOCAL_SIZE,
  ACCEPT,
  ACCEPT_LONG_RANGE,
  MAX_PASSES,
  MAX_PASSES_LONG_RANGE,
  RICCATI_NODES,
  localRiccati,
  localRiccatiReal,
  phaseRate,
  type RiccatiEquation,
  riccatiEquation,
  riccatiStep,
} from './riccatiStep.js';
import { integrateLeg, type Leg, type RawSample, type Segment } from './shooting.js';
import { allZero, taylorStretch, type TaylorStretch } from './taylorStretch.js';

/** How oscillatory stretches of a leg are crossed: Riccati steps where they apply and, on a massless leg, Taylor-series steps between them ('riccati', default), or the ODE integrator throughout ('ode', the earlier route, kept for cross-checks). */
export type Oscillation = 'riccati' | 'ode';

/** Every accepted `oscillation`; the first is the default. */
export const OSCILLATIONS: readonly Oscillation[] = ['riccati', 'ode'];

/** Rung ratio of the ladder in x = r − r+ (measured against 2: fewer steps, the same failures after halving). */
const RUNG = 4;
/**
 * A massive field's last rung may stretch to LAST_RUNG_STRETCH × RUNG rather
 * than leave a short remainder before the matching radius: that remainder
 * holds too little phase for a Riccati step and cost the integrator several
 * steps, while a rung of up to 6 (half-length 0.9 in ln x) is still resolved
 * by RICCATI_NODES (a step that is not fails and is halved, as any other).
 * Measured on the 70 modes of bench/massive-cpu.bench.mjs (with the Newton
 * passes of riccatiStep.ts): 2.5 % fewer evaluations over all.
 */
const LAST_RUNG_STRETCH = 1.5;
/** Largest WKB ratio |Y₀'|/|W|² (in u = ln x) at the probe points of a rung given to a Riccati step. */
export const WKB_LIMIT = 0.08;
/**
 * WKB_LIMIT of a massless leg. Near a turning point the defect corrections
 * of a Riccati step contract ever more slowly from pass to pass (the WKB
 * series is asymptotic), and a rung whose largest probed ratio is above
 * ~0.01 was measured never to converge: on the tail grid of
 * bench/floor.bench.mjs (208 modes, 3,000 attempts), of 469 attempts at a
 * ratio ≥ 0.008 one succeeded. Such a rung is cut in halves at once
 * (PLAN_SPLITS) rather than tried whole and halved on failure. Measured on
 * the same grid with the integrator's stretches (before Taylor steps):
 * 0.012 took the fewest evaluations against 0.006, 0.008, 0.016 and 0.024;
 * with Taylor steps (CPU, interleaved) against 0.08 and no cuts: 2 % less
 * per mode, worst mode 2.77 → 2.70 times the median (near the noise).
 */
export const MASSLESS_WKB_LIMIT = 0.012;
/**
 * Times a massless leg's rung that the cheap look refuses is cut in halves
 * (in ln x) before the leg is laid out, each half looked at again: near a
 * turning point the probes at a rung's far end refuse a whole rung of which
 * the near half is a good Riccati rung (measured on the tail grid: the
 * integrator crossed up to 3 rungs, x from 11 to 183, where after the cuts
 * it crosses x from 30 to 80). 4 takes the same evaluations as 3.
 */
const PLAN_SPLITS = 3;
/** Least phase (or growth) ∫|W|/2 du, in radians, on a rung given to a Riccati step: below it the integrator was measured to be as cheap (bench/far-zone.bench.mjs). */
export const MIN_PHASE = 20;
/**
 * MIN_PHASE of a massless leg, whose other stretches are crossed by Taylor
 * steps (taylorStretch.ts) at ~6 terms per radian, several times cheaper
 * than the integrator: a Riccati step (16 nodes × 4–8 passes of O(16²)
 * collocation) pays off only on longer rungs. Measured on the tail grid
 * (CPU, interleaved): against 20 the worst mode 2.83 → 2.68 times the
 * median; 40 left it at 2.8–3.1, 90 and 150 raised the median by 16 % and
 * 43 % (the far zones of the high-frequency modes).
 */
export const MASSLESS_MIN_PHASE = 60;
/**
 * MIN_PHASE for a rung of a massive field's far zone whose rate |W| is at
 * least FAST_RATE at both ends: there a Riccati step converges in a few
 * passes (~100 coefficient evaluations) while the integrator crosses about a
 * radian per step (~60 evaluations), so a short last rung before a distant
 * matching radius pays off (bench/massive.bench.mjs; a lower MIN_PHASE
 * everywhere was measured to cost more, on rungs near the turning point).
 */
export const MIN_PHASE_LONG_RANGE = 8;
/**
 * The rate |W| (radians per unit of ln x) above which a massive field's rung
 * may take MIN_PHASE_LONG_RANGE. It was 45; at 10 the Coulomb-like stretch
 * beyond the barrier (r of 50–1,000 near threshold, where |W| grows like
 * √r and a rung holds 8–20 radians) goes to Riccati steps instead of
 * 10–20 integrator steps (bench/massive-cpu.bench.mjs, with FAR_RUNG and
 * NEWTON_AFTER: the 70 modes' evaluations against massless fell from 1.69
 * to 1.19 times; their summed CPU time 7 % below that at 15, 24 % on the
 * mode a = 0.167, l = 1, m = −1, Mω = 0.41, v = 0.036; at 6, more steps
 * failed and no CPU time was saved).
 */
export const FAST_RATE = 10;
/**
 * The longest rung (ratio in x) of a massive field's far zone: a run of
 * Riccati rungs of the ladder (up to the next stop) is recut into equal
 * rungs in ln x of at most this ratio. There Y varies smoothly over decades
 * of r, and RICCATI_NODES resolve a rung of 6 (half-length 0.9) with the
 * unresolved tail still ~1e-3 of the step's limit; a step costs about the
 * same whatever its length, so the far zone of the worst mode (r from 80 to
 * 10,350) takes 3 steps instead of 4 (one of 74 steps on the 70 modes of
 * bench/massive-cpu.bench.mjs failed and was halved). 20 nodes resolve a
 * rung of 16, but a step at 20 nodes cost 1.4 times one at 16 (measured on
 * those modes' first far rungs: 11.5 against 8 µs), for no gain over all.
 */
const FAR_RUNG = 6;
/**
 * A massive far zone of three or more rungs of FAR_RUNG may take one fewer:
 * its first rungs of FAR_RUNG each (near the turning points as before), and
 * the rest in one last rung of up to this ratio, where that rung is still
 * resolved (farNodes). Far out, the nearest singularity of Y in u = ln x is
 * the Coulomb-like turning point on the negative axis (r ≈ −2M(2ω² − μ²)/k∞²,
 * 500–10,000 M near threshold), π off the real axis above ln|x| of it, and a
 * rung to one side of it sits in a larger Bernstein ellipse than FAR_RUNG
 * assumes (the singularity π straight above the rung's middle). A rung of
 * such a plan that fails is halved whatever its phase. Measured on the worst
 * mode of bench/massive-cpu.bench.mjs (a = 0.313, l = 3, m = 3, Mω = 0.8038,
 * v = 0.022), far zone r from 80 to 5,297: three rungs at 16 nodes 18.4 µs,
 * a rung of 6 and one of 11.3 at 20 nodes 15.5 µs (16 nodes do not resolve
 * it); on the 70 modes of that bench its worst ratio 1.94 → 1.84. On 300
 * other random near-threshold modes (l ≤ 4, v ∈ [0.02, 0.5]) 12 took fewer
 * evaluations, 4 more (the worst +17 %: a first rung of 6 failed and was
 * halved).
 */
const LONG_FAR_RUNG = 12;
/** Nodes of a last far rung that RICCATI_NODES do not resolve (a step costs ~1.4 times one at 16, measured 5.1 against 3.6 µs on a rung of 8: still less than the two it replaces). */
const FAR_NODES = 20;
/** Half-length in ln x of a rung of ratio FAR_RUNG. */
const FAR_HALF = 0.5 * Math.log(FAR_RUNG);
/** Bernstein ρ of a rung of FAR_RUNG with the singularity π straight above its middle: what RICCATI_NODES were measured to resolve. */
const RHO_RESOLVED = Math.PI / FAR_HALF + Math.sqrt(1 + (Math.PI / FAR_HALF) ** 2);

/**
 * Math.hypot(x, y) computed as V8 computes it (the larger modulus factored out; Kahan's compensation is exact for
 * two terms), so the same doubles: the builtin boxed its argument list and result, measured at 3.2 KB of the 42 KB
 * allocated by a greybody factor (s = 1, l = 100, m = 50, a = 0.99, Mω = 1), most of it from `bernstein`.
 */
function hypot(x: number, y: number): number {
  const ax = Math.abs(x),
    ay = Math.abs(y);
  if (ax === Number.POSITIVE_INFINITY || ay === Number.POSITIVE_INFINITY) return Number.POSITIVE_INFINITY;
  if (Number.isNaN(ax) || Number.isNaN(ay)) return Number.NaN;
  const max = Math.max(ax, ay);
  if (max === 0) return 0;
  const u = ax / max,
    v = ay / max;
  return Math.sqrt(u * u + v * v) * max;
}

/**
 * ρ of the Bernstein ellipse (foci ±1) through z = re + i im: its semi-axis sum ρ + 1/ρ is |z − 1| + |z + 1| (no
 * complex square root: the ellipse tests of a massless leg run on every Riccati rung).
 */
function bernstein(re: number, im: number): number {
  const i2 = im * im;
  const S = Math.sqrt((re - 1) * (re - 1) + i2) + Math.sqrt((re + 1) * (re + 1) + i2);
  return 0.5 * (S + Math.sqrt(Math.max(0, S * S - 4)));
}

/**
 * Nodes of a rung [ua, ub] (in u = ln x) of a massive far zone whose
 * singularities lie at u = U + iπ for U in `singular` (ln|x| of each):
 * RICCATI_NODES where the rung's ellipse through the nearest is at least
 * RHO_RESOLVED, FAR_NODES where it is at least RHO_RESOLVED^(16/20) (the
 * same ρⁿ), 0 where neither.
 */
function farNodes(ua: number, ub: number, singular: readonly number[]): number {
  const h = 0.5 * (ub - ua),
    mid = 0.5 * (ua + ub);
  let rho = Number.POSITIVE_INFINITY;
  for (const U of singular) rho = Math.min(rho, bernstein((U - mid) / h, Math.PI / h));
  if (rho >= RHO_RESOLVED) return RICCATI_NODES;
  return rho ** FAR_NODES >= RHO_RESOLVED ** RICCATI_NODES ? FAR_NODES : 0;
}

/** |z| on the real axis beyond which the Bernstein ellipse through z has ρ ≥ RHO_RESOLVED: (ρ + 1/ρ)/2. */
const Z_RESOLVED = 0.5 * (RHO_RESOLVED + 1 / RHO_RESOLVED);

/**
 * The length in u = ln x of a massless far-zone rung starting `d` beyond the outer turning point (a branch point of
 * W on the real u axis): the longest whose ellipse through the turning point has ρ ≥ RHO_RESOLVED (half-length
 * h with 1 + d/h = Z_RESOLVED), and at most ln FAR_RUNG (the inner horizon, π off the axis). The ladder's rungs of
 * RUNG there (halved after a failure, see halveRest) took more steps: s = 1, l = 100, m = 50, a = 0.99, Mω = 1,
 * r from 257 to 1,270: 3 Riccati steps → 2. Measured on the 208 modes of the tail grid (bench/floor.bench.mjs
 * --grid): Riccati steps 1,050 (284 failed) with this ρ, 1,079 (292) with rungs at ρ = 9.5 (Z = 4.2), 1,101 (330)
 * at ρ = 4.1 (Z = 2.3), 1,152 (343) at Z = 3; a cap of 12 rather than FAR_RUNG saved 2 steps. Against the ladder
 * 1.6 % fewer evaluations over the grid, Γ moved by at most 1.7e-13 relative (0.002 of its error estimate);
 * random modes (l ≤ 6) unchanged bit for bit (1,000 modes). Above the barrier the branch point is one of a complex
 * pair, `v` = arg x of it (the rung's ellipse then passes through it off the axis: semi-axis sum
 * |z − a| + |z − b| = 2hZ, solved for h): on the same grid evaluations 292,514 → 281,647, Riccati steps
 * 1,000 → 979 (234 → 225 failed); s = 1/2 and 1, l = 5/2 and 2, a = 0, Mω = 10: 2,282 → 716 evaluations, true
 * error 4.4e-11 → 1e-12 (against 'ode' solves at tol 1e-12).
 */
function masslessFarRung(d: number, v = 0): number {
  if (v === 0) return Math.min(Math.log(FAR_RUNG), (2 * d) / (Z_RESOLVED - 1));
  const D = hypot(d, v);
  return Math.min(Math.log(FAR_RUNG), (2 * (Z_RESOLVED * D + d)) / (Z_RESOLVED * Z_RESOLVED - 1));
}

/** A branch point of W beyond the horizon: x = r − r+ = `modulus` e^{i `arg`} (arg 0: a real turning point). */
interface TurningPoint {
  modulus: number;
  arg: number;
}

const NO_TURNING_POINT: TurningPoint = { modulus: Number.POSITIVE_INFINITY, arg: 0 };

/**
 * The outer turning point of a massless mode, from K² − λΔ (K = (r² + a²)ω − am; the spin terms left out, which
 * move it by ~s/(ωr) relative): its largest real root beyond r+, by Newton from above; where there is none (a mode
 * above the barrier) the complex root of the pair near the barrier (see complexTurningPoint); NO_TURNING_POINT
 * where neither is found.
 */
function outerTurningPoint(hole: KerrHole, mode: RadialMode): TurningPoint {
  const { a, mass: M, rPlus } = hole;
  const { omega: w, m, lambda } = mode;
  if (!(lambda > 0) || w === 0) return NO_TURNING_POINT;
  const f = (r: number) => {
    const K = (r * r + a * a) * w - a * m;
    return K * K - lambda * (r * r - 2 * M * r + a * a);
  };
  const df = (r: number) => 4 * r * w * ((r * r + a * a) * w - a * m) - lambda * (2 * r - 2 * M);
  let r = 2 * (rPlus + Math.sqrt(lambda) / Math.abs(w));
  for (let it = 0; it < 60; it++) {
    const step = f(r) / df(r);
    r -= step;
    if (!(r > rPlus)) break;
    if (Math.abs(step) < 1e-6 * r) return { modulus: r - rPlus, arg: 0 };
  }
  return complexTurningPoint(hole, mode);
}

/**
 * A root of K² − λΔ off the real axis, by complex Newton from (2Mλ/ω²)^{1/3} e^{iπ/3} (the pair of Schwarzschild's
 * ω²r³ − λr + 2Mλ = 0 well above the barrier), as x = r − r+ in polar form (|arg| taken: the pair is conjugate);
 * NO_TURNING_POINT where Newton does not settle in 60 steps.
 */
function complexTurningPoint(hole: KerrHole, mode: RadialMode): TurningPoint {
  const { a, mass: M, rPlus } = hole;
  const { omega: w, m, lambda } = mode;
  const s0 = Math.cbrt((2 * M * lambda) / (w * w));
  let re = 0.5 * s0,
    im = 0.866 * s0;
  for (let it = 0; it < 60; it++) {
    const r2r = re * re - im * im,
      r2i = 2 * re * im;
    const Kr = (r2r + a * a) * w - a * m,
      Ki = r2i * w;
    const fr = Kr * Kr - Ki * Ki - lambda * (r2r - 2 * M * re + a * a),
      fi = 2 * Kr * Ki - lambda * (r2i - 2 * M * im);
    const dr = 4 * w * (re * Kr - im * Ki) - lambda * (2 * re - 2 * M),
      di = 4 * w * (re * Ki + im * Kr) - 2 * lambda * im;
    const dd = dr * dr + di * di;
    const sr = (fr * dr + fi * di) / dd,
      si = (fi * dr - fr * di) / dd;
    re -= sr;
    im -= si;
    if (!Number.isFinite(re + im)) break;
    if (hypot(sr, si) < 1e-9 * hypot(re, im)) {
      const xr = re - rPlus,
        xi = Math.abs(im);
      return { modulus: hypot(xr, xi), arg: Math.atan2(xi, xr) };
    }
  }
  return NO_TURNING_POINT;
}

/**
 * The branch points of W of a massless mode in u = ln x, as (ln|x|, |arg x|) pairs: the four roots of K² − λΔ
 * (a quartic in r without a cubic term; the spin terms left out, see outerTurningPoint) by Ferrari's formula,
 * those beyond the horizon or off the real axis. 0.3–0.5 µs a call (Durand–Kerner iterations took 2–8 µs).
 */
function branchPoints(hole: KerrHole, mode: RadialMode): number[] {
  const { a, mass: M, rPlus } = hole;
  const { omega: w, m, lambda } = mode;
  const out: number[] = [];
  if (!(lambda > 0) || w === 0) return out;
  const k0 = w * a * a - a * m;
  // monic: r⁴ + c2 r² + c1 r + c0
  const c2 = (2 * w * k0 - lambda) / (w * w),
    c1 = (2 * M * lambda) / (w * w),
    c0 = (k0 * k0 - lambda * a * a) / (w * w);
  // Ferrari: m > 0 a root of the resolvent 8m³ + 8c2 m² + (2c2² − 8c0) m − c1² (c1 > 0), then
  // r = (±√(2m) ± √(−(2c2 + 2m ± √2 c1/√m)))/2
  const m0 = largestCubicRoot(c2, 0.25 * c2 * c2 - c0, (-c1 * c1) / 8);
  const re = [0, 0, 0, 0],
    im = [0, 0, 0, 0];
  if (!(m0 > 0)) return out;
  const sq = Math.sqrt(2 * m0);
  for (let k = 0; k < 2; k++) {
    const sign = k === 0 ? 1 : -1;
    const D = -(2 * c2 + 2 * m0 + (sign * Math.SQRT2 * c1) / Math.sqrt(m0));
    const root = Math.sqrt(Math.abs(D));
    for (let j = 0; j < 2; j++) {
      const o = 2 * k + j,
        pm = j === 0 ? 0.5 : -0.5;
      re[o] = 0.5 * sign * sq + (D >= 0 ? pm * root : 0);
      im[o] = D >= 0 ? 0 : pm * root;
    }
  }
  for (let k = 0; k < 4; k++) {
    const xr = re[k] - rPlus,
      xi = Math.abs(im[k]);
    // (a root inside the horizon, π off the real u axis as r− is, leaves every rung of a massless leg, up to a
    // ratio of FAR_RUNG, at ρ ≥ RHO_RESOLVED > RHO_FAIL: left out, as r− is)
    if (!Number.isFinite(xr + xi) || (xr <= 0 && xi === 0)) continue;
    out.push(Math.log(hypot(xr, xi)), Math.atan2(xi, xr));
  }
  return out;
}

/**
 * The ρ (see rungRho, against branchPoints) below which a massless rung is not given to a Riccati step but handled
 * as one that failed (halved, or crossed by Taylor steps) at once. Measured on the tail grid (bench/floor.bench.mjs
 * --grid, 208 modes, 973 massless Riccati steps tried): every step below ρ = 6.7 failed (121 below 6, 57 between
 * 6 and 6.7, none made; 48 of them on −s legs, whose spin terms the quartic leaves out), 22 of 84 between 6 and
 * RHO_RESOLVED were made, 480 of 504 between RHO_RESOLVED and 12. The steps made and Γ are those of before, bit for
 * bit (tail grid, 300 random modes); evaluations −2.1 % on the grid, and interleaved (bench/floor.bench.mjs --grid
 * --rounds=4, three runs) the cost of l = 100, Mω = 1 over the random modes' median 2.89–2.91 → 2.77–2.82, modes
 * above 3× 6–9 → 3–4 of 208 (l = 100, Mω = 10: 2.16–2.23 → 2.23–2.25).
 */
const RHO_FAIL = 6.5;

/**
 * ρ (see rungRho) of the rungs a massless leg is recut into between its turning points (see recutReach): a run of
 * Riccati rungs there that starts with a rung below RHO_FAIL, or follows a failed one, is laid out in rungs as long as
 * their ellipse through the nearest branch point of W (or r−) keeps this ρ, at most RUNG. The ladder's rungs there
 * were made in halves (x from 1 to 32 in five Riccati steps on s = 1/2, l = 100.5, m = 50.5, a = 0.99, Mω = 1),
 * where such rungs take four (x from 1 to 41). Measured on the l = 75 and 100, a = 0.99, Mω = 1, m ≈ l/2 modes of
 * the tail grid (all spins, CPU interleaved): 6 % less CPU time than with ρ = 7 (longer rungs that failed and were
 * halved), 0.6 % less than with 8.
 */
const RHO_RECUT = 7.5;

/** Least phase ∫|W|/2 du (radians) of a recut rung (see RHO_RECUT); below it Taylor steps cross the rest of the run (36 and 54 measured within 0.5 % on the same modes, 60 2 % slower). */
const RECUT_MIN_PHASE = 45;

/**
 * Nodes of a leg's first Riccati rung (from the horizon) that RHO_FAIL refuses at RICCATI_NODES but whose ellipse
 * through its nearest branch point, a real turning point, still has ρ^HORIZON_NODES ≥ RHO_RESOLVED^RICCATI_NODES
 * (ρ ≥ 4.18): tried whole at these nodes before it is halved. The two halves of such a rung (x from 0.035 to 0.141
 * on s = 1/2, l = 100.5, a = 0.99, Mω = 1, up to the inner turning point at x = 0.34) took 4 and 7 passes at 16
 * nodes, 10.2 µs; whole at 22 nodes it takes 7 passes, 9.3 µs. On the tail grid and 300 random modes (l < 100,
 * Mω ≤ 30) 18 such steps were made and 3 failed (and were halved); 24 nodes on any refused rung of a leg whose
 * nearest branch point is real made 114 steps and failed 57 (the cells l = 50, Mω = 1 and l = 100, Mω = 10 3–7 %
 * slower).
 */
const HORIZON_NODES = 22;

/** What a Riccati step not tried (see RHO_FAIL) reports. */
const FAILED = { ok: false, passes: 0, evaluations: 0, correction: 0, error: 0, rounding: 0 } as const;

/** The largest real root of m³ + b m² + c m + d (Cardano, or the trigonometric form for three real roots). */
function largestCubicRoot(b: number, c: number, d: number): number {
  const p = c - (b * b) / 3,
    q = (2 * b * b * b) / 27 - (b * c) / 3 + d;
  const disc = (q * q) / 4 + (p * p * p) / 27;
  let t: number;
  if (disc > 0) {
    const sd = Math.sqrt(disc);
    t = Math.cbrt(-0.5 * q + sd) + Math.cbrt(-0.5 * q - sd);
  } else {
    const rr = Math.sqrt(-p / 3);
    const arg = Math.acos(Math.max(-1, Math.min(1, (3 * q) / (2 * p * rr)))) / 3;
    t = 2 * rr * Math.cos(arg);
  }
  return t - b / 3;
}

/** ρ of the Bernstein ellipse of the rung [ua, ub] (in u = ln x) through the point U + iV. */
function pointRho(ua: number, ub: number, U: number, V: number): number {
  const h = 0.5 * (ub - ua),
    mid = 0.5 * (ua + ub);
  return bernstein((U - mid) / h, V / h);
}

/** The index k of the nearest of `points` ((U, V) pairs at k, k + 1) to the rung [ua, ub]: the least pointRho; −1 for none. */
function nearestPoint(ua: number, ub: number, points: readonly number[]): number {
  let rho = Number.POSITIVE_INFINITY,
    nearest = -1;
  for (let k = 0; k < points.length; k += 2) {
    const r = pointRho(ua, ub, points[k], points[k + 1]);
    if (r < rho) {
      rho = r;
      nearest = k;
    }
  }
  return nearest;
}

/** ρ of the Bernstein ellipse of the rung [ua, ub] (in u = ln x) through the nearest of `points` ((U, V) pairs). */
function rungRho(ua: number, ub: number, points: readonly number[]): number {
  const k = nearestPoint(ua, ub, points);
  return k < 0 ? Number.POSITIVE_INFINITY : pointRho(ua, ub, points[k], points[k + 1]);
}

/** Whether a real branch point of W ((U, V) pairs, V = 0) lies below u: a rung beyond an inner turning point. */
function realBranchPointBelow(u: number, points: readonly number[]): boolean {
  for (let k = 0; k < points.length; k += 2) if (points[k + 1] === 0 && points[k] < u) return true;
  return false;
}

/**
 * The end (in u = ln x) of the longest rung from u, up to ub and a ratio of RUNG, whose Bernstein ellipse through each
 * of `points` ((U, V) pairs) has ρ ≥ RHO_RECUT: for a point at distance D = U − u along the axis and V off it, the
 * ellipse of half-length h (semi-axes hZ and h√(Z² − 1), Z = (ρ + 1/ρ)/2) passes through it where
 * h = (Z·√(D² + V²) − D)/(Z² − 1).
 */
function recutReach(u: number, ub: number, points: readonly number[]): number {
  const Z = 0.5 * (RHO_RECUT + 1 / RHO_RECUT);
  let len = Math.min(Math.log(RUNG), ub - u);
  for (let k = 0; k < points.length; k += 2) {
    const D = points[k] - u;
    len = Math.min(len, (2 * (Z * hypot(D, points[k + 1]) - D)) / (Z * Z - 1));
  }
  return u + len;
}

/**
 * Least phase (radians) of a massless leg without Riccati rungs that is
 * crossed by Taylor steps (taylorStretch.ts) rather than by the integrator.
 * Below it the leg is exactly `integrateLeg`'s, so that low-frequency modes
 * are unchanged bit for bit.
 */
export const TAYLOR_LEG_PHASE = 40;

/** Times a failed rung is halved before the integrator takes it. */
const MAX_SPLITS = 4;

const OVERFLOW = 1e150;
const RESCALE = 1e-300;
const LN_RESCALE = 300 * Math.LN10;

interface Point {
  x: number;
  r: number;
}

const probe = new Float64Array(LOCAL_SIZE);

/** The scale a Riccati step takes out of y (riccatiStep's `scale`), read at once after each step (nothing runs between). */
const scale = new Float64Array(1);

/**
 * Whether a Riccati step on [xa, xb] looks worth trying: at five points (in
 * u = ln x) the WKB ratio |Y₀'|/|W|² is below `ratioLimit` (default
 * WKB_LIMIT), and the phase (or
 * growth) ∫|W|/2 du on the rung is above `minPhase` (default MIN_PHASE).
 */
export function riccatiWorthIt(
  e: RiccatiEquation,
  xa: number,
  xb: number,
  minPhase = MIN_PHASE,
  ratioLimit = WKB_LIMIT,
  mirror = false,
): boolean {
  const K = 5;
  const ua = Math.log(xa),
    du = (Math.log(xb) - ua) / (K - 1);
  let phase = 0,
    prev = 0;
  for (let j = 0; j < K; j++) {
    const x = j === K - 1 ? xb : Math.exp(ua + j * du);
    if (!(mirror && e.real === true && localRiccatiReal(e, x, probe))) localRiccati(e, x, probe, false, mirror);
    if (!(probe[LOCAL.RATIO] < ratioLimit)) return false;
    const W = Math.sqrt(probe[LOCAL.W] ** 2 + probe[LOCAL.W + 1] ** 2);
    if (j > 0) phase += 0.25 * (W + prev) * du;
    prev = W;
  }
  return phase > minPhase;
}

/** 0.25 (rate at from + rate at to) × ln(to/from): the trapezoidal phase ∫|W|/2 du of a rung from the rates at its ends. */
function rungPhase(from: Point, to: Point, rateFrom: number, rateTo: number): number {
  return 0.25 * (rateFrom + rateTo) * Math.log(to.x / from.x);
}

/** The phase (or growth) ∫|W|/2 du of a whole ladder, from the rates at its points (trapezoidal in ln x). */
function legPhase(ladder: Point[], rates: number[]): number {
  let phase = 0;
  for (let i = 1; i < ladder.length; i++) phase += rungPhase(ladder[i - 1], ladder[i], rates[i - 1], rates[i]);
  return phase;
}

/**
 * A massless leg's ladder with every rung the cheap look refused, but which
 * holds the phase of two Riccati rungs, cut in halves (in ln x) up to
 * PLAN_SPLITS times, each half looked at again; `ladder` and `rates` are
 * rewritten in place and the new `good` returned.
 */
function cutRefused(e: RiccatiEquation, ladder: Point[], rates: number[], good: boolean[], rPlus: number): boolean[] {
  const least = MASSLESS_MIN_PHASE;
  let refused = false;
  for (let i = 0; i < good.length && !refused; i++)
    refused = !good[i] && !(rungPhase(ladder[i], ladder[i + 1], rates[i], rates[i + 1]) <= 2 * least);
  if (!refused) return good;
  const points: Point[] = [ladder[0]],
    pointRates: number[] = [rates[0]],
    out: boolean[] = [];
  const worth = (a: Point, b: Point, ra: number, rb: number) =>
    rungPhase(a, b, ra, rb) > 0.5 * least && riccatiWorthIt(e, a.x, b.x, least, MASSLESS_WKB_LIMIT);
  const cut = (from: Point, to: Point, rateFrom: number, rateTo: number, ok: boolean, depth: number): void => {
    if (ok || depth === PLAN_SPLITS || rungPhase(from, to, rateFrom, rateTo) <= 2 * least) {
      points.push(to);
      pointRates.push(rateTo);
      out.push(ok);
      return;
    }
    const xm = Math.sqrt(from.x * to.x);
    const mid = { x: xm, r: rPlus + xm };
    const rateMid = phaseRate(e, xm);
    cut(from, mid, rateFrom, rateMid, worth(from, mid, rateFrom, rateMid), depth + 1);
    cut(mid, to, rateMid, rateTo, worth(mid, to, rateMid, rateTo), depth + 1);
  };
  for (let i = 0; i < good.length; i++) cut(ladder[i], ladder[i + 1], rates[i], rates[i + 1], good[i], 0);
  // rewritten in place element by element (a splice of spread arrays was measured among a solve's allocations)
  for (let i = 0; i < points.length; i++) {
    ladder[i] = points[i];
    rates[i] = pointRates[i];
  }
  ladder.length = points.length;
  rates.length = points.length;
  return out;
}

/**
 * What a Riccati step is charged in a solve's local-error accumulation bound
 * (steps × tol), in integrator steps: a step is accepted with up to 0.3 tol
 * from the last correction and 0.3 tol from the unresolved tail for each of
 * its two solutions, and covers a rung x → 4x. Measured against tight 'ode'
 * solves on random modes (docs/method.md, section 9): with a charge of 4 the
 * true error reached 0.5 of the greybody estimate; 10 keeps the margin of
 * the integrator-only route (0.37).
 */
export const RICCATI_STEP_CHARGE = 10;

/**
 * Multiple of a massless leg's Riccati step's own truncation error estimate
 * charged to the leg's `errorSum` (its rounding estimate is charged once).
 * Measured step by step against the same rung carried by a Riccati step at a
 * 1e4 times tighter tolerance (bench/riccati-step.bench.mjs, tail grid and
 * 150 random modes): the true error reached 2.0 times the bare estimate at
 * leg tol 1e-9 (17 of 699 steps above it) and never the charge (worst 0.35;
 * 0.16 at tol 1e-11, where the rounding estimate dominates); against
 * integrator solves of the rung at tol 1e-13 and 1e-14, where they resolve
 * the error, at most 0.27 of the charge.
 */
export const RICCATI_ERROR_FACTOR = 3;

/**
 * Share of the leg's tolerance at which the integrator crosses the stretches
 * between Riccati rungs of a massless leg; their accepted error estimates
 * enter the leg's `errorSum` scaled by it. There each Riccati step charges
 * its own error estimate (riccatiStep.ts, typically 0.01–1 tol), so the
 * integrator's ~0.2 tol per step became the larger part of the single-solve
 * estimate at l ≳ 25 or Mω ≳ 10; at a third of tol it costs ~5 % more
 * evaluations and keeps that estimate below the point where greybody makes a
 * check solve (measured on the tail grid of bench/floor.bench.mjs --grid).
 */
export const ODE_SHARE = 1 / 3;

/**
 * The tightest tolerance ODE_SHARE takes a stretch to. Below ~1e-12 the
 * integrator's error is no longer set by its tolerance but by rounding, so a
 * tighter stretch buys nothing while its error estimates, scaled by the
 * share, understate it (measured on bench/estimate.bench.mjs, random modes at
 * greybody tol 1e-10, integrator tol 1e-13: with stretches at 3e-14 one
 * estimate fell below the true error, ×1.19; with this floor none, worst 0.59;
 * stretches at 3e-15 made Γ ten times less accurate at tol 1e-11). At the
 * default tol 1e-8 (integrator tol 1e-11) the share applies in full.
 */
export const TIGHTEST_STRETCH_TOL = 1e-12;

/**
 * A leg's segment with its Riccati steps counted apart. Its `errorSum`
 * charges each Riccati step of a massless leg the step's own error estimate
 * (riccatiStep's `error`), and each of a massive far zone
 * RICCATI_STEP_CHARGE (a step is accepted with up to 0.3 tol from each of
 * four sources, see above); integrator stretches of a massless leg with
 * Riccati rungs count at ODE_SHARE.
 */
export interface HybridSegment extends Segment {
  /** Riccati steps taken (included in `steps`) */
  riccatiSteps: number;
  /**
   * Charge beyond RICCATI_STEP_CHARGE of Riccati steps accepted with a
   * stalled correction above ACCEPT tol (a massive field's far zone, up to
   * ACCEPT_LONG_RANGE tol): RICCATI_STEP_CHARGE per ACCEPT tol of it, in
   * integrator steps; 0 on massless legs.
   */
  riccatiExtraCharge: number;
}

/** The steps a segment charges to the accumulation bound: integrator steps plus RICCATI_STEP_CHARGE per Riccati step. */
export function chargedSteps(seg: HybridSegment): number {
  return seg.steps + (RICCATI_STEP_CHARGE - 1) * seg.riccatiSteps + seg.riccatiExtraCharge;
}

function plain(seg: Segment): HybridSegment {
  const out = seg as HybridSegment;
  out.riccatiSteps = 0;
  out.riccatiExtraCharge = 0;
  return out;
}

/** Integrate one leg, by Riccati steps where they apply (see above) or entirely by `integrateLeg` ('ode'). */
export function integrateHybridLeg(leg: Leg, oscillation: Oscillation): HybridSegment {
  if (oscillation === 'ode' || leg.variable === 'phase') return plain(integrateLeg(leg));
  const { hole } = leg;
  const rPlus = hole.rPlus;
  const e = riccatiEquation(leg.equation, rPlus);
  // A massive field's far zone: short fast rungs and more passes pay off (MIN_PHASE_LONG_RANGE, MAX_PASSES_LONG_RANGE);
  // massless legs keep MIN_PHASE and MAX_PASSES, bit for bit.
  const longRange = fieldMassOf(leg.mode) > 0;
  if (longRange) e.real = allZero(e.bIm) && allZero(e.cIm);
  // B and C real (s = 0 at real ω, or a massive far zone): where the two Riccati solutions oscillate, a step takes
  // the σ = −1 one as the mirror image of the σ = +1 one (riccatiStep's `mirror`: the same doubles, half the passes).
  // A massless leg leaves `e.real` unset, so its coefficients are those of the general code, bit for bit.
  const conjugate = longRange || (allZero(e.bIm) && allZero(e.cIm));
  const maxPasses = longRange ? MAX_PASSES_LONG_RANGE : MAX_PASSES;
  const accept = longRange ? ACCEPT_LONG_RANGE : ACCEPT;
  const ladder: Point[] = [{ x: leg.fromOffset ?? leg.from - rPlus, r: leg.from }];
  const xEnd = leg.to - rPlus;
  const inside = leg.stops.filter((g) => g > leg.from && g < leg.to);
  let k = 0;
  for (;;) {
    const last = ladder[ladder.length - 1];
    const reach = longRange ? LAST_RUNG_STRETCH * RUNG : RUNG;
    let next: Point = last.x * reach >= xEnd ? { x: xEnd, r: leg.to } : { x: last.x * RUNG, r: rPlus + last.x * RUNG };
    while (k < inside.length && inside[k] <= last.r) k++;
    if (k < inside.length && inside[k] < next.r) next = { x: inside[k] - rPlus, r: inside[k] };
    if (!(next.x > last.x)) break;
    ladder.push(next);
    if (next.r === leg.to) break;
  }
  // A cheap look first (the rate at the rung ends): most low-frequency legs stop here.
  const rates = ladder.map((p) => phaseRate(e, p.x));
  const rungMinPhase = (i: number) =>
    longRange && Math.min(rates[i], rates[i + 1]) >= FAST_RATE
      ? MIN_PHASE_LONG_RANGE
      : longRange
        ? MIN_PHASE
        : MASSLESS_MIN_PHASE;
  const ratioLimit = longRange ? WKB_LIMIT : MASSLESS_WKB_LIMIT;
  // a massive far zone's singularities in u = ln x (at u = U + iπ): the Coulomb-like turning point (see
  // LONG_FAR_RUNG) and the inner horizon
  const singular: number[] = [];
  if (longRange) {
    const { omega } = leg.mode,
      mu = fieldMassOf(leg.mode),
      M = hole.mass;
    singular.push(Math.log((2 * M * (2 * omega * omega - mu * mu)) / ((omega - mu) * (omega + mu)) + rPlus));
    if (rPlus > hole.rMinus) singular.push(Math.log(rPlus - hole.rMinus));
  }
  // A massive far zone past its first Riccati rung, where the rate keeps growing, takes no probes: its rungs are
  // recut below and a recut step that fails is halved as any other (the same steps on the 70 modes of
  // bench/massive-cpu.bench.mjs; 3–6 % less CPU time on its two worst modes).
  let far = false;
  // A massless leg's rungs beyond the outer turning point take no probes either: they are recut below (masslessFarRung).
  // (found once a rung has the phase of a Riccati rung: most low-frequency legs never look for it)
  let turn: TurningPoint | undefined;
  const turning = () => (turn ??= longRange ? NO_TURNING_POINT : outerTurningPoint(hole, leg.mode));
  let good = ladder.slice(1).map((p, i) => {
    const least = rungMinPhase(i);
    const phase = rungPhase(ladder[i], p, rates[i], rates[i + 1]);
    if (far && rates[i + 1] > rates[i] && phase > least) return true;
    if (phase > 0.5 * least && ladder[i].x > turning().modulus) return true;
    const ok = phase > 0.5 * least && riccatiWorthIt(e, ladder[i].x, p.x, least, ratioLimit, longRange);
    far = longRange && ok;
    return ok;
  });
  if (!longRange) good = cutRefused(e, ladder, rates, good, rPlus);
  const riccati = good.includes(true);
  if (!riccati && (longRange || !(legPhase(ladder, rates) > TAYLOR_LEG_PHASE))) return plain(integrateLeg(leg));

  const y = leg.y;
  // The leg's running sums, as fields of one object: a double in a variable that the closures below share was boxed
  // anew at every write.
  const run = {
    logScale: leg.logScale ?? 0,
    steps: 0,
    errorSum: 0,
    riccatiSteps: 0,
    riccatiExtraCharge: 0,
    rescalings: 0,
  };
  const samples: RadialSample[] = [];
  const raw: RawSample[] = [];
  // On a massless leg the integrator's stretches between Riccati rungs run at ODE_SHARE × tol (see ODE_SHARE), not below TIGHTEST_STRETCH_TOL.
  const odeShare = longRange || !riccati ? 1 : Math.min(1, Math.max(ODE_SHARE, TIGHTEST_STRETCH_TOL / leg.tol));
  const byOde = (from: Point, to: Point) => {
    // written out in the order of the other leg literals (a spread was a second shape where legs are read)
    const seg = integrateLeg({
      hole: leg.hole,
      mode: leg.mode,
      equation: leg.equation,
      y: leg.y,
      from: from.r,
      fromOffset: from.x,
      to: to.r,
      stops: leg.stops,
      tol: leg.tol * odeShare,
      integrator: leg.integrator,
      maxSteps: Math.max(leg.maxSteps - run.steps, 1),
      variable: leg.variable,
      counter: leg.counter,
      logScale: run.logScale,
      method: leg.method,
    });
    run.steps += seg.steps;
    run.errorSum += seg.errorSum * odeShare;
    run.rescalings += seg.rescalings;
    run.logScale = seg.logScale;
    samples.push(...seg.samples);
    raw.push(...seg.raw);
  };
  const record = (to: Point) => {
    if (!leg.stops.includes(to.r)) return;
    const f = Math.exp(run.logScale);
    samples.push({ r: to.r, R: { re: y[0] * f, im: y[1] * f }, dR: { re: y[2] * f, im: y[3] * f } });
    raw.push({ r: to.r, y: [y[0], y[1], y[2], y[3]], logScale: run.logScale });
  };
  // A massless leg's stretch by Taylor steps (taylorStretch.ts) at the integrator's share of tol, its error
  // estimates counted as the integrator's; false (y untouched) where a step could not be made.
  const stretch: TaylorStretch = { ok: false, steps: 0, errorSum: 0, terms: 0, logScale: 0, rescalings: 0 };
  const byTaylor = (from: Point, to: Point): boolean => {
    const t = taylorStretch(e, from.x, to.x, y, leg.tol * odeShare, stretch);
    // counted as right-hand-side evaluations: one term costs about one
    leg.counter.evaluations += t.terms;
    if (!t.ok) return false;
    run.steps += t.steps;
    run.errorSum += t.errorSum * odeShare;
    run.logScale += t.logScale;
    run.rescalings += t.rescalings;
    record(to);
    return true;
  };
  // A massless leg's Taylor stretches are not crossed at once but gathered end to end (`pending`: the first one's
  // start, then each one's end) and crossed as one stretch (see flush) before anything else moves y (a Riccati step,
  // the integrator), at a stop and at the leg's end: no short last step where one stretch ends and the next begins
  // (s = 1/2, l = 100.5, m = 50.5, a = 0.99, Mω = 1: x from 41 to 166, three stretches of 580 terms → one of 564).
  const pending: Point[] = [];
  // the gathered stretches as one; where that cannot be made, one by one, and by the integrator from the first that
  // cannot be made
  const flush = () => {
    if (pending.length === 0) return;
    const p = pending.slice();
    pending.length = 0;
    const last = p.length - 1;
    if (last > 1 && byTaylor(p[0], p[last])) return;
    let k = 0;
    while (k < last && byTaylor(p[k], p[k + 1])) k++;
    if (k < last) byOde(p[k], p[last]);
  };
  const taylorLater = (from: Point, to: Point) => {
    if (pending.length > 0 && pending[pending.length - 1].x !== from.x) flush();
    if (pending.length === 0) pending.push(from);
    pending.push(to);
    if (leg.stops.includes(to.r)) flush();
  };
  // ladder[a] → ladder[b] not by Riccati steps: by Taylor steps on a massless leg (gathered, see flush), by the
  // integrator on a massive leg. (One stretch from stop to stop rather than rung by rung: 2.5 % less CPU over the
  // tail grid, interleaved.)
  const byStretch = (a: number, b: number) => {
    if (longRange) byOde(ladder[a], ladder[b]);
    else for (let k = a; k < b; k++) taylorLater(ladder[k], ladder[k + 1]);
  };
  // One rung by a Riccati step; a rung that fails is halved (in ln x) up to MAX_SPLITS times before the
  // integrator takes it: near a turning point the branch point of W limits the resolution of a whole rung.
  // A massless leg, once one of its rungs failed as a whole Riccati step, takes each later rung of more than twice
  // MASSLESS_MIN_PHASE in halves at once: at large l the rungs of a leg fail alike (W varies too fast in ln x for
  // RICCATI_NODES over a rung of 4; s = 1/2, l = 100.5, m = 50.5, a = 0.99, Mω = 1: failed steps 8 → 5,
  // 3,837 → 3,613 evaluations), and a failed step costs about what a made one does.
  let halveRest = false;
  let branch: number[] | undefined;
  const branchOf = () => (branch ??= branchPoints(hole, leg.mode));
  // the branch points and r− (π off the axis), against which recut rungs are laid out (see RHO_RECUT)
  let recutPoints: number[] | undefined;
  const recutPointsOf = () =>
    (recutPoints ??= branchOf().concat(rPlus > hole.rMinus ? [Math.log(rPlus - hole.rMinus), Math.PI] : []));
  // true where the step was made whole (not halved, nor given to Taylor steps or the integrator)
  // (`nodes`: the step's node count; `long`: a rung of a far zone cut with LONG_FAR_RUNG)
  const byRiccati = (
    from: Point,
    to: Point,
    rateFrom: number,
    rateTo: number,
    depth: number,
    nodes = RICCATI_NODES,
    long = false,
  ): boolean => {
    // a massless rung whose ellipse through the nearest branch point of W is below RHO_FAIL is not tried (see there),
    // but a leg's first rung that more nodes resolve is (see HORIZON_NODES)
    let hopeless = false;
    if (!longRange) {
      const ua = Math.log(from.x),
        ub = Math.log(to.x),
        points = branchOf();
      const k = nearestPoint(ua, ub, points);
      const rho = k < 0 ? Number.POSITIVE_INFINITY : pointRho(ua, ub, points[k], points[k + 1]);
      hopeless = rho < RHO_FAIL;
      // (the nearest branch point a real turning point)
      if (
        hopeless &&
        depth === 0 &&
        from === ladder[0] &&
        rho ** HORIZON_NODES >= RHO_RESOLVED ** RICCATI_NODES &&
        points[k + 1] === 0
      ) {
        hopeless = false;
        nodes = HORIZON_NODES;
      }
    }
    if (!hopeless) flush();
    const step = hopeless
      ? FAILED
      : riccatiStep(e, from.x, to.x, y, leg.tol, scale, nodes, maxPasses, accept, conjugate, longRange);
    // counted as right-hand-side evaluations: the coefficients at every node, and one collocation pass per node and pass
    leg.counter.evaluations += step.evaluations * (1 + step.passes);
    if (!step.ok) {
      const xm = Math.sqrt(from.x * to.x);
      const mid = { x: xm, r: rPlus + xm };
      const rateMid = phaseRate(e, xm);
      // (a rung of a far zone cut with LONG_FAR_RUNG is halved whatever its phase)
      if (
        long ||
        (depth < MAX_SPLITS &&
          rungPhase(from, mid, rateFrom, rateMid) > 0.5 * (longRange ? MIN_PHASE : MASSLESS_MIN_PHASE) &&
          rungPhase(mid, to, rateMid, rateTo) > 0.5 * (longRange ? MIN_PHASE : MASSLESS_MIN_PHASE))
      ) {
        byRiccati(from, mid, rateFrom, rateMid, depth + 1);
        byRiccati(mid, to, rateMid, rateTo, depth + 1);
      } else if (longRange) byOde(from, to);
      else taylorLater(from, to);
      return false;
    }
    run.steps++;
    run.riccatiSteps++;
    // A massless leg charges the step's own error estimate; a massive far zone keeps the flat charge it was measured with.
    run.errorSum += longRange ? RICCATI_STEP_CHARGE : RICCATI_ERROR_FACTOR * step.error + step.rounding;
    if (step.correction > ACCEPT) {
      const extra = RICCATI_STEP_CHARGE * (step.correction / ACCEPT - 1);
      run.errorSum += extra;
      run.riccatiExtraCharge += extra;
    }
    run.logScale += scale[0];
    if (Math.abs(y[0]) + Math.abs(y[1]) > OVERFLOW) {
      for (let c = 0; c < 4; c++) y[c] *= RESCALE;
      run.logScale += LN_RESCALE;
      run.rescalings++;
    }
    record(to);
    return true;
  };
  // the end of the run of Riccati rungs from ladder[i] (good[i]): the next stop, or the next rung not good
  const runEnd = (i: number): number => {
    let j = i;
    while (j < good.length && good[j] && (j === i || !leg.stops.includes(ladder[j].r))) j++;
    return j;
  };
  // the end of a recut rung at u = next, in a run that ends at ladder[j] (u = ub): that ladder point where it reaches it
  const rungEnd = (next: number, ub: number, j: number): Point =>
    next >= ub - 1e-9 ? ladder[j] : { x: Math.exp(next), r: rPlus + Math.exp(next) };
  // the phase rate at a rung's end p (the ladder's where p is ladder[j])
  const rateAt = (p: Point, j: number): number => (p === ladder[j] ? rates[j] : phaseRate(e, p.x));
  let i = 0;
  while (i < good.length) {
    if (!good[i]) {
      let j = i;
      while (j < good.length && !good[j]) j++;
      byStretch(i, j);
      i = j;
      continue;
    }
    if (longRange) {
      // a massive far zone: the run of Riccati rungs up to the next stop, recut into rungs of up to FAR_RUNG (or LONG_FAR_RUNG)
      const j = runEnd(i);
      const ua = Math.log(ladder[i].x),
        ub = Math.log(ladder[j].x);
      let count = Math.ceil((ub - ua) / Math.log(FAR_RUNG) - 1e-9);
      // one rung fewer (see LONG_FAR_RUNG): count − 2 rungs of FAR_RUNG, then one long rung, if resolved
      const longFrom = ua + (count - 2) * Math.log(FAR_RUNG);
      const longNodes = count > 2 && ub - longFrom <= Math.log(LONG_FAR_RUNG) ? farNodes(longFrom, ub, singular) : 0;
      if (longNodes > 0) count--;
      let from = ladder[i],
        rateFrom = rates[i];
      for (let c = 1; c <= count; c++) {
        const xc = longNodes > 0 ? ladder[i].x * FAR_RUNG ** c : ladder[i].x * (ladder[j].x / ladder[i].x) ** (c / count);
        const to = c === count ? ladder[j] : { x: xc, r: rPlus + xc };
        const rateTo = c === count ? rates[j] : phaseRate(e, to.x);
        const nodes = longNodes > 0 && c === count ? longNodes : RICCATI_NODES;
        byRiccati(from, to, rateFrom, rateTo, 0, nodes, longNodes > 0);
        from = to;
        rateFrom = rateTo;
      }
      i = j;
      continue;
    }
    // a massless far zone: from a ladder point beyond the outer turning point, the run of Riccati rungs (up to the
    // next stop) recut into rungs as long as RICCATI_NODES resolve (see masslessFarRung)
    if (!longRange && ladder[i].x > turning().modulus) {
      const j = runEnd(i);
      const uTurn = Math.log(turning().modulus),
        vTurn = turning().arg,
        ub = Math.log(ladder[j].x);
      let from = ladder[i],
        rateFrom = rates[i],
        u = Math.log(from.x);
      let next = u + masslessFarRung(u - uTurn, vTurn);
      let to = rungEnd(next, ub, j);
      let rateTo = rateAt(to, j);
      // a first rung too close to the turning point to hold MASSLESS_MIN_PHASE: the zone starts farther out, where
      // one does, and Taylor steps cross the stretch before it (or the ladder keeps the run where none does)
      while (j > i && !(rungPhase(from, to, rateFrom, rateTo) > MASSLESS_MIN_PHASE) && next < ub - 1e-9) {
        u += 0.25 * (next - u);
        from = { x: Math.exp(u), r: rPlus + Math.exp(u) };
        rateFrom = phaseRate(e, from.x);
        next = u + masslessFarRung(u - uTurn, vTurn);
        to = rungEnd(next, ub, j);
        rateTo = rateAt(to, j);
      }
      if (j > i && rungPhase(from, to, rateFrom, rateTo) > MASSLESS_MIN_PHASE) {
        if (from !== ladder[i]) taylorLater(ladder[i], from);
        for (;;) {
          byRiccati(from, to, rateFrom, rateTo, 0);
          if (to === ladder[j]) break;
          from = to;
          rateFrom = rateTo;
          u = next;
          next = u + masslessFarRung(u - uTurn, vTurn);
          to = rungEnd(next, ub, j);
          rateTo = rateAt(to, j);
        }
        i = j;
        continue;
      }
    }
    // a massless leg between its turning points, where the ladder's rung is one the ellipse rule refuses or follows a
    // failed one: the run of Riccati rungs up to the next stop recut by the ellipse rule (see RHO_RECUT), Taylor steps
    // crossing what is left once a rung would hold less than RECUT_MIN_PHASE (or the ladder's rung kept where the
    // first one would)
    if (
      !longRange &&
      ladder[i].x < turning().modulus &&
      (halveRest || rungRho(Math.log(ladder[i].x), Math.log(ladder[i + 1].x), branchOf()) < RHO_FAIL) &&
      realBranchPointBelow(Math.log(ladder[i].x), branchOf())
    ) {
      const j = runEnd(i);
      const points = recutPointsOf();
      const ub = Math.log(ladder[j].x);
      let from = ladder[i],
        rateFrom = rates[i],
        next = recutReach(Math.log(from.x), ub, points);
      let to = rungEnd(next, ub, j);
      let rateTo = rateAt(to, j);
      if (rungPhase(from, to, rateFrom, rateTo) > RECUT_MIN_PHASE) {
        for (;;) {
          byRiccati(from, to, rateFrom, rateTo, 0);
          if (to === ladder[j]) break;
          from = to;
          rateFrom = rateTo;
          next = recutReach(next, ub, points);
          to = rungEnd(next, ub, j);
          rateTo = rateAt(to, j);
          if (!(rungPhase(from, to, rateFrom, rateTo) > RECUT_MIN_PHASE)) {
            taylorLater(from, ladder[j]);
            break;
          }
        }
        i = j;
        continue;
      }
    }
    // a massless leg once a whole rung has failed: the rungs after it cut in halves first (see halveRest)
    const halve =
      halveRest &&
      rungPhase(ladder[i], ladder[i + 1], rates[i], rates[i + 1]) > 2 * MASSLESS_MIN_PHASE &&
      ladder[i + 1].x > 2 * ladder[i].x;
    if (halve) {
      const xm = Math.sqrt(ladder[i].x * ladder[i + 1].x);
      const mid = { x: xm, r: rPlus + xm };
      const rateMid = phaseRate(e, xm);
      byRiccati(ladder[i], mid, rates[i], rateMid, 1);
      byRiccati(mid, ladder[i + 1], rateMid, rates[i + 1], 1);
    } else if (!byRiccati(ladder[i], ladder[i + 1], rates[i], rates[i + 1], 0)) halveRest = true;
    i++;
  }
  flush();
  return {
    logScale: run.logScale,
    steps: run.steps,
    errorSum: run.errorSum,
    rescalings: run.rescalings,
    samples,
    raw,
    riccatiSteps: run.riccatiSteps,
    riccatiExtraCharge: run.riccatiExtraCharge,
  };
}
