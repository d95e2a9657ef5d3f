/**
 * Taylor-series steps of the radial equation A R'' + B R' + C R = 0 across
 * a stretch [xa, xb] (x = r − r+), for the stretches of a massless leg that
 * its Riccati steps leave (around turning points, where the solutions are
 * neither fast nor slow). The coefficients are polynomials in x (A = Δ²,
 * degree 4; B, C of degree ≤ 4), so the Taylor coefficients of R about any
 * point follow from a five-term recurrence: one term costs about what one
 * right-hand-side evaluation of the extrapolation integrator costs, and a
 * step of ~5 radians (or e-folds) takes ~30 terms where the extrapolation
 * integrator crosses ~1.5 radians per ~70 evaluations near a turning point.
 * Measured on x from 0.15 to 1 of s = −1/2, l = 100.5, m = 50.5, a = 0.99,
 * Mω = 1 (a turning point at x ≈ 0.35) at tol 3e-12: 875 terms in 25 steps,
 * true error 2.7e-13 (estimate 6.5e-12), against the integrator's 5,917
 * evaluations in 81 steps, true error 2.5e-11; 3–4 times less CPU.
 *
 * With σ = (x − x0)/h and the scaled coefficients τ_n = ρ_n hⁿ of
 * R = Σ ρ_n (x − x0)ⁿ, the equation multiplied by h² reads
 * Ã R_σσ + B̃ R_σ + C̃ R = 0 with Ã_j = a_j h^j, B̃_j = b_j h^{j+1},
 * C̃_j = c_j h^{j+2} (a_j, b_j, c_j the coefficients about x0), and the
 * coefficient of σⁿ (substituting the series and collecting powers) gives
 *   Ã_0 (n+2)(n+1) τ_{n+2} = −Σ_{j≥1} Ã_j (n−j+2)(n−j+1) τ_{n−j+2}
 *                            − Σ_{j≥0} B̃_j (n−j+1) τ_{n−j+1} − Σ_{j≥0} C̃_j τ_{n−j}
 * R(x0 + h) = Σ τ_n, h R'(x0 + h) = Σ n τ_n.
 *
 * A step's error estimate is what the last two terms leave (the terms are
 * summed until they fall below the target and decrease by at least half
 * from term to term, so the rest of the series is smaller than its last
 * term) plus the rounding of the sum (ROUNDING ε × the sum of the terms'
 * moduli: the cancellation of an oscillating series), each relative to the
 * larger modulus of R (and of R') at the step's two ends. The radius of
 * convergence is the distance to the nearer zero of Δ (x = 0 or x = r− − r+),
 * and a step reaches at most RADIUS_SHARE of it (LONG_RADIUS_SHARE for a step
 * longer than its phase where the terms do not cancel: GROWTH_PHASE).
 */
import type { RiccatiEquation } from './riccatiStep.js';

/**
 * Phase (or growth) a step aims at, in radians (e-folds): the sum of the
 * terms' moduli, and with it the rounding charged, grows like e^θ (8 ε e⁵ ≈
 * 3e-13), while the terms per radian fall slowly beyond a few radians.
 */
const STEP_PHASE = 5;
/**
 * The longer phase a step aims at where the tolerance leaves room for its
 * rounding (8 ε e⁶ ≈ 7e-13; WIDE_STEP_TOL and above, as at tol 1e-8, where a
 * stretch runs at 3.3e-12). s = 1/2, l = 100.5, m = 50.5, a = 0.99, Mω = 1:
 * 3,459 evaluations rather than 3,613 (estimate 1.7e-10 → 2.4e-10); at 7,
 * 3,506. Below WIDE_STEP_TOL STEP_PHASE stays: at 6 throughout, the
 * honesty bench at tol 1e-12 refused one near-extremal mode more (a =
 * 0.9999: 8 of 16 against 7) and one band point fewer (a = 0.99).
 */
const WIDE_STEP_PHASE = 6;
/**
 * Most growth (e-folds, at the terms' rate) a step aims at where its terms do
 * not cancel: where the solution that dominates grows (Z = p² − 4q > 0 in the
 * classically forbidden zones) the sum of the terms' moduli stays near the
 * sum, and a step is limited by the rise and fall of its terms rather than by
 * rounding (a 16 e-fold step took 37–50 terms where a 6 e-fold step took
 * 24–34). Tail grid (bench/lib.mjs), modes of l ≥ 50 at tol 1e-8, against
 * steps of WIDE_STEP_PHASE throughout: RHS evaluations (Taylor terms
 * included) 0.952 times at 12, 0.938 at 16, 0.940 at 20, 0.945 at 24; their
 * Taylor terms 110,198 → 98,390, those stretches replayed alone 7–8 % less
 * CPU, but the grid's cells within the noise (bench/floor --grid against the
 * same code without long steps, interleaved: l = 100, Mω = 1 and 10 cells
 * 3.31 and 2.63 → 3.28 and 2.64 times the random median, worst mode 4.41 →
 * 3.96; the rates at x − h and the per-step work take back part). At tol
 * 1e-12 fewer steps lower the rounding floor: 33 grid modes refused against
 * 45 (their estimates 8.5e-13–1.0e-12).
 */
const GROWTH_PHASE = 16;
/**
 * Largest share of the radius of convergence a step longer than `phase`
 * reaches: towards RADIUS_SHARE its terms shrink slowly (x = 0.8–3 of s = 0,
 * l = 25, a = 0.7, Mω = 1, where R grows like a power of x: 73–81 terms for
 * 12–15 e-folds at 0.5, against 24 terms for 6). Tail grid, l ≥ 50 (l < 50):
 * evaluations 0.952 (1.000) times at 0.2, 0.938 (0.999) at 0.3, 0.936
 * (0.999) at 0.35, 0.935 (1.011) at 0.4, 0.936 (1.012) at 0.5.
 */
const LONG_RADIUS_SHARE = 0.3;
/** Least stretch tolerance at which steps aim at WIDE_STEP_PHASE. */
const WIDE_STEP_TOL = 1e-12;
/** Share of the tolerance below which the terms are summed (a term more costs ~1/6 radian of work). */
const TARGET = 0.1;
/** Largest share of the radius of convergence a step reaches (the terms then shrink by at least this ratio, beyond the oscillation). */
const RADIUS_SHARE = 0.5;
/** Fewest terms of one step of θ radians: past the largest term θⁿ/n! (n ≈ θ), twice over. */
const minTerms = (phase: number) => 2 * phase + 2;
/**
 * Most terms of one step; a step that needs more is halved. With the long
 * steps of GROWTH_PHASE, against 80: 64 took 1.6 % more RHS evaluations on
 * the tail grid at tol 1e-8 (the near-horizon steps of 6 radians take up to
 * 61 terms), 100 0.4 % fewer there (120 the same) but 0.6 % more on 300
 * random modes at tol 1e-12.
 */
const MAX_TERMS = 80;
/** Rounding charged to a step, in units of ε × the sum of the moduli of its terms (common practice, no source). */
const ROUNDING = 8;
/** Largest number of halvings of one step before the stretch is given back. */
const MAX_HALVINGS = 8;

/** The result of a Taylor stretch. */
export interface TaylorStretch {
  /** false when a step could not be made (the caller integrates the stretch otherwise; `y` is then unchanged) */
  ok: boolean;
  /** steps taken */
  steps: number;
  /** sum of the steps' error estimates relative to `tol` */
  errorSum: number;
  /** terms summed (counted as right-hand-side evaluations) */
  terms: number;
  /** ln of the scale taken out of y (to add to the caller's log-scale) */
  logScale: number;
  /** times y was rescaled */
  rescalings: number;
}

const OVERFLOW = 1e150;
const RESCALE = 1e-300;
const LN_RESCALE = 300 * Math.LN10;

// coefficients about x0, scaled by h: A (real, 5), B and C (complex, 5)
const sa = new Float64Array(5);
const sbr = new Float64Array(5),
  sbi = new Float64Array(5),
  scr = new Float64Array(5),
  sci = new Float64Array(5);
const tr = new Float64Array(MAX_TERMS + 2),
  ti = new Float64Array(MAX_TERMS + 2);
const start = new Float64Array(4);
/** Scratch for the exponent of a double (big-endian, DataView's default). */
const bits = new DataView(new ArrayBuffer(8));
const dScratch = new Float64Array(3);

/** C(j, k) at 5j + k for j, k < 5 (exact small integers: a division per coefficient was a tenth of a stretch). */
const BINOMIAL = Float64Array.from({ length: 25 }, (_, i) => {
  const j = Math.floor(i / 5),
    k = i % 5;
  let c = 1;
  for (let q = 1; q <= k; q++) c = (c * (j + 1 - q)) / q;
  return k > j ? 0 : c;
});

/** Coefficients of p(x0 + t) in powers of t (p of length ≤ 5), into out[0..length) (Taylor shift). */
function shiftInto(p: Float64Array, x0: number, out: Float64Array, length: number): void {
  for (let k = 0; k < length; k++) {
    let sum = 0;
    let pw = 1;
    for (let j = k; j < p.length; j++) {
      sum += BINOMIAL[5 * j + k] * p[j] * pw;
      pw *= x0;
    }
    out[k] = sum;
  }
  for (let k = length; k < out.length; k++) out[k] = 0;
}

/** Σ c_k x^k by Horner's rule. */
function horner(c: Float64Array, x: number): number {
  let v = 0;
  for (let k = c.length - 1; k >= 0; k--) v = v * x + c[k];
  return v;
}

/**
 * The local rates at x, per unit x, into rates[0..1]: the rate of the terms, |√Z|/2 + |p|/2 (Z = p² − 4q), a
 * bound on |λ| for both local exponents λ = (−p ± √Z)/2 of the solutions; and the rate of their cancellation,
 * |λ₊| − Re λ₊ for the exponent that grows the faster (Re √Z ≥ 0), capped at the first: the sum of the terms'
 * moduli over the sum of a step of h grows like e^{(|λ₊| − Re λ₊) h} where that solution dominates (the whole
 * rate where it oscillates, Z < 0; none where it grows, Z > 0 and p ≤ 0). x is read from rates[0] (see STEP_IO).
 */
function ratesAt(e: RiccatiEquation, rates: Float64Array): void {
  const x = rates[0];
  const d = horner(e.delta, x);
  const iA = 1 / (d * d);
  const pr = horner(e.bRe, x) * iA,
    pi = horner(e.bIm, x) * iA,
    qr = horner(e.cRe, x) * iA,
    qi = horner(e.cIm, x) * iA;
  const zr = pr * pr - pi * pi - 4 * qr,
    zi = 2 * pr * pi - 4 * qi;
  // √Z with Re ≥ 0 (from the larger of its parts)
  const zm = Math.sqrt(zr * zr + zi * zi);
  let wr = 0,
    wi = 0;
  if (zr >= 0) {
    wr = Math.sqrt(0.5 * (zm + zr));
    wi = wr > 0 ? (0.5 * zi) / wr : 0;
  } else {
    const t = Math.sqrt(0.5 * (zm - zr));
    wr = Math.abs((0.5 * zi) / t);
    // the sign of Im √Z by a product: a negation of its own, first run after ratesAt was optimised, deoptimised it
    wi = (zi < 0 ? -1 : 1) * t;
  }
  const rate = 0.5 * (Math.sqrt(zm) + Math.sqrt(pr * pr + pi * pi));
  const lr = 0.5 * (wr - pr),
    li = 0.5 * (wi - pi);
  rates[0] = rate;
  rates[1] = Math.min(rate, Math.sqrt(lr * lr + li * li) - lr);
}

/**
 * The numbers `step` takes and gives, in `io` at these indices: a double passed to or returned from a call that is
 * not inlined (step, ratesAt) is boxed, and those boxes were measured at ~3 KB of the ~33 KB a greybody factor
 * allocates (s = 1, l = 100, m = 50, a = 0.99, Mω = 1).
 */
const STEP_IO = {
  /** in: the step's start x0 */
  X0: 0,
  /** in: its length h */
  H: 1,
  /** in: the target, relative */
  TARGET: 2,
  /** in: the fewest terms */
  LEAST_TERMS: 3,
  /** out: the terms summed */
  TERMS: 4,
  /** out: the error estimate relative to the state, or NaN */
  ERROR: 5,
  SIZE: 6,
} as const;

/**
 * One step from x0 by h (see STEP_IO): writes R, R' at x0 + h into y (in
 * place) and gives the error estimate relative to the state, or NaN when
 * the terms do not settle below `target` (relative) within MAX_TERMS (y
 * then unchanged), and the terms summed.
 */
function step(e: RiccatiEquation, y: Float64Array, io: Float64Array, realB: boolean): void {
  const x0 = io[STEP_IO.X0],
    h = io[STEP_IO.H],
    target = io[STEP_IO.TARGET],
    leastTerms = io[STEP_IO.LEAST_TERMS];
  // A = Δ² about x0
  shiftInto(e.delta, x0, dScratch, 3);
  const d0 = dScratch[0],
    d1 = dScratch[1],
    d2 = dScratch[2];
  sa[0] = d0 * d0;
  sa[1] = 2 * d0 * d1;
  sa[2] = d1 * d1 + 2 * d0 * d2;
  sa[3] = 2 * d1 * d2;
  sa[4] = d2 * d2;
  shiftInto(e.bRe, x0, sbr, Math.min(5, e.bRe.length));
  // Im B is zero where realB (its shift would be zeros)
  if (realB) sbi.fill(0);
  else shiftInto(e.bIm, x0, sbi, Math.min(5, e.bIm.length));
  shiftInto(e.cRe, x0, scr, Math.min(5, e.cRe.length));
  shiftInto(e.cIm, x0, sci, Math.min(5, e.cIm.length));
  let hp = 1;
  for (let j = 0; j < 5; j++) {
    sa[j] *= hp;
    sbr[j] *= hp * h;
    sbi[j] *= hp * h;
    scr[j] *= hp * h * h;
    sci[j] *= hp * h * h;
    hp *= h;
  }
  const ia0 = 1 / sa[0];
  const a1 = sa[1],
    a2 = sa[2],
    a3 = sa[3],
    a4 = sa[4];
  const b0s = sbr[0],
    b1s = sbr[1],
    b2s = sbr[2],
    b3s = sbr[3];
  const c0r = scr[0],
    c1r = scr[1],
    c2r = scr[2],
    c3r = scr[3],
    c4r = scr[4];
  const c0i = sci[0],
    c1i = sci[1],
    c2i = sci[2],
    c3i = sci[3];
  // the state over a power of two near its size (exact): the squared moduli below stay finite whatever the state's
  // size up to OVERFLOW and the step's growth (unscaled, a step of 16 e-folds from |R| ~ 1e150 overflowed them, and
  // the overflow was taken for a settled sum: estimate 0, true error 2e-8)
  const size = Math.max(Math.abs(y[0]), Math.abs(y[1]), Math.abs(y[2] * h), Math.abs(y[3] * h));
  // 2^−e for size = 2^e × (1…2), from the exponent bits (Math.log2 and a power cost ~5 % of a stretch); 1 for a size
  // of 0, below the normal range, of 2^1023 or more, or not finite
  bits.setFloat64(0, size);
  const biased = bits.getUint32(0) >>> 20;
  bits.setUint32(0, (biased > 0 && biased < 2046 ? 2046 - biased : 1023) << 20);
  bits.setUint32(4, 0);
  const inverse = bits.getFloat64(0);
  const unit = 1 / inverse;
  const y0 = y[0] * inverse,
    y1 = y[1] * inverse,
    y2 = y[2] * inverse,
    y3 = y[3] * inverse;
  tr[0] = y0;
  ti[0] = y1;
  tr[1] = y2 * h;
  ti[1] = y3 * h;
  let Rr = tr[0] + tr[1],
    Ri = ti[0] + ti[1];
  let Dr = tr[1],
    Di = ti[1];
  // moduli bounded by |re| + |im| (within √2, and cheaper than a square root per term)
  let absSum = Math.abs(tr[0]) + Math.abs(ti[0]) + Math.abs(tr[1]) + Math.abs(ti[1]);
  let absSumD = Math.abs(tr[1]) + Math.abs(ti[1]);
  let prev = Math.abs(tr[1]) + Math.abs(ti[1]);
  // τ_{n+1}, the term just made, kept out of the arrays (the next term waits on it)
  let lastR = tr[1],
    lastI = ti[1];
  // the result and the terms summed, written once after the loop: a return of its own on the rare path where the
  // terms do not settle was code without type feedback, and its first use deoptimised the step (measured on
  // Node 20: at times it was not optimised again, and a term then cost 3–4 times as much)
  let err = Number.NaN,
    count = 2;
  const m0 = Math.sqrt(y0 * y0 + y1 * y1),
    md0 = Math.sqrt(y2 * y2 + y3 * y3) * h;
  for (let n = 0; n + 2 <= MAX_TERMS; n++) {
    // τ_{n+2}
    let sr = 0,
      si = 0;
    if (n >= 4 && realB) {
      // B real of degree ≤ 3 and Im C of degree ≤ 3 (the massless equation): the sums below without the terms whose
      // factor is an exact zero, in the general path's order (x − 0 = x: the same doubles)
      const k0 = n + 1,
        k1 = n,
        k2 = n - 1,
        k3 = n - 2,
        k4 = n - 3,
        k5 = n - 4;
      const f1 = a1 * k0 * n,
        f2 = a2 * k1 * (n - 1),
        f3 = a3 * k2 * (n - 2),
        f4 = a4 * k3 * (n - 3);
      const u0r = lastR,
        u0i = lastI,
        u1r = tr[k1],
        u1i = ti[k1],
        u2r = tr[k2],
        u2i = ti[k2],
        u3r = tr[k3],
        u3i = ti[k3],
        u4r = tr[k4],
        u4i = ti[k4];
      sr = f1 * u0r + f2 * u1r + f3 * u2r + f4 * u3r;
      si = f1 * u0i + f2 * u1i + f3 * u2i + f4 * u3i;
      const b0 = b0s * k0,
        b1 = b1s * k1,
        b2 = b2s * k2,
        b3 = b3s * k3;
      sr += b0 * u0r + c0r * u1r - c0i * u1i;
      si += b0 * u0i + c0r * u1i + c0i * u1r;
      sr += b1 * u1r + c1r * u2r - c1i * u2i;
      si += b1 * u1i + c1r * u2i + c1i * u2r;
      sr += b2 * u2r + c2r * u3r - c2i * u3i;
      si += b2 * u2i + c2r * u3i + c2i * u3r;
      sr += b3 * u3r + c3r * u4r - c3i * u4i;
      si += b3 * u3i + c3r * u4i + c3i * u4r;
      sr += c4r * tr[k5];
      si += c4r * ti[k5];
    } else if (n >= 4) {
      // every index in range: the five-term sums written out (the bounds tests were most of a term's cost)
      const k0 = n + 1,
        k1 = n,
        k2 = n - 1,
        k3 = n - 2;
      const f1 = sa[1] * k0 * n,
        f2 = sa[2] * k1 * (n - 1),
        f3 = sa[3] * k2 * (n - 2),
        f4 = sa[4] * k3 * (n - 3);
      sr = f1 * tr[k0] + f2 * tr[k1] + f3 * tr[k2] + f4 * tr[k3];
      si = f1 * ti[k0] + f2 * ti[k1] + f3 * ti[k2] + f4 * ti[k3];
      // B̃_j (n − j + 1) τ_{n−j+1} + C̃_j τ_{n−j}, j = 0…4
      for (let j = 0; j < 5; j++) {
        const k = n + 1 - j;
        const br = sbr[j] * k,
          bi = sbi[j] * k;
        const cr = scr[j],
          ci = sci[j];
        const ur = tr[k],
          ui = ti[k],
          vr = tr[k - 1],
          vi = ti[k - 1];
        sr += br * ur - bi * ui + cr * vr - ci * vi;
        si += br * ui + bi * ur + cr * vi + ci * vr;
      }
    } else {
      for (let j = 1; j <= 4 && j <= n + 2; j++) {
        const k = n - j + 2;
        const f = sa[j] * k * (k - 1);
        sr += f * tr[k];
        si += f * ti[k];
      }
      for (let j = 0; j <= 4 && j <= n + 1; j++) {
        const k = n - j + 1;
        const br = sbr[j] * k,
          bi = sbi[j] * k;
        sr += br * tr[k] - bi * ti[k];
        si += br * ti[k] + bi * tr[k];
      }
      for (let j = 0; j <= 4 && j <= n; j++) {
        const k = n - j;
        sr += scr[j] * tr[k] - sci[j] * ti[k];
        si += scr[j] * ti[k] + sci[j] * tr[k];
      }
    }
    const f = -ia0 / ((n + 2) * (n + 1));
    const vr = sr * f,
      vi = si * f;
    tr[n + 2] = vr;
    ti[n + 2] = vi;
    Rr += vr;
    Ri += vi;
    Dr += (n + 2) * vr;
    Di += (n + 2) * vi;
    const mod = Math.abs(vr) + Math.abs(vi);
    absSum += mod;
    absSumD += (n + 2) * mod;
    count = n + 3;
    // settled: two terms below the target of both R and hR', the last at most half its predecessor, and past the
    // rise of the terms of a step of its phase (a dip of two small terms before it is not taken for the end)
    // (first against a bound of the scale without square roots, |re| + |im| ≥ the modulus: past the largest term
    // every term of an oscillating series came this far, and the two square roots were an eighth of a stretch)
    const last = Math.abs(tr[n + 1]) + Math.abs(ti[n + 1]);
    const t = mod + last;
    if (n + 3 >= leastTerms && mod <= 0.5 * prev && t < 2 * target * (m0 + Math.abs(Rr) + Math.abs(Ri))) {
      const scaleR = Math.max(m0, Math.sqrt(Rr * Rr + Ri * Ri)),
        scaleD = Math.max(md0, Math.sqrt(Dr * Dr + Di * Di));
      const tD = (n + 2) * mod + (n + 1) * last;
      if (t < target * scaleR && tD < target * scaleD) {
        const tail = t / scaleR,
          tailD = tD / scaleD;
        const rounding = ROUNDING * Number.EPSILON * Math.max(absSum / scaleR, absSumD / scaleD);
        y[0] = Rr * unit;
        y[1] = Ri * unit;
        y[2] = (Dr / h) * unit;
        y[3] = (Di / h) * unit;
        err = Math.max(tail, tailD) + rounding;
        break;
      }
    }
    prev = mod;
    lastR = vr;
    lastI = vi;
  }
  io[STEP_IO.TERMS] = count;
  io[STEP_IO.ERROR] = err;
}

const stepIO = new Float64Array(STEP_IO.SIZE);
const rates = new Float64Array(2);
const trial = new Float64Array(4);

/**
 * Carry y = (Re R, Im R, Re R', Im R') from xa to xb (0 < xa < xb) by
 * Taylor steps at relative tolerance `tol` per step, in place. Steps aim at
 * STEP_PHASE (WIDE_STEP_PHASE) radians by the local rate at both ends and at most RADIUS_SHARE
 * of the distance to the horizon; a step whose terms do not settle, or
 * whose rounding exceeds tol, is halved (up to MAX_HALVINGS times, else the
 * stretch is given back with y unchanged: ok false). The result is written
 * into `out` (default a new object) and returned.
 */
export function taylorStretch(
  e: RiccatiEquation,
  xa: number,
  xb: number,
  y: Float64Array,
  tol: number,
  out: TaylorStretch = { ok: false, steps: 0, errorSum: 0, terms: 0, logScale: 0, rescalings: 0 },
): TaylorStretch {
  // the recurrence is written for A = Δ² with Δ of degree ≤ 2 and B, C of degree ≤ 4 (the massless equation)
  if (e.delta.length > 3 || e.bRe.length > 5 || e.bIm.length > 5 || e.cRe.length > 5 || e.cIm.length > 5)
    return result(out, false, 0, 0, 0, 0, 0);
  copy4(y, start);
  let x = xa,
    steps = 0,
    errorSum = 0,
    terms = 0,
    logScale = 0,
    rescalings = 0;
  // the shape of the coefficients, once per stretch: B real of degree ≤ 3 and Im C of degree ≤ 3, as in every
  // massless equation (B = (s+1)ΔΔ', Im U = −sΔ'K + 4sωrΔ); the Taylor shift about x0 keeps those zeros exact
  const realB = allZero(e.bIm) && cubic(e.bRe) && cubic(e.cIm);
  const phase = tol >= WIDE_STEP_TOL ? WIDE_STEP_PHASE : STEP_PHASE;
  // the growth a long step may aim at: GROWTH_PHASE, halved after a long step failed, regained by half per step
  let growthCap = GROWTH_PHASE;
  // the rates at the end of the last step tried
  let endX = Number.NaN,
    endRate = 0,
    endCancel = 0;
  while (x < xb) {
    const rest = xb - x;
    // a step of `phase` radians at the terms' rate at both ends (the step where the solutions oscillate); the
    // rates at x were most often those at the end of the step before
    if (x !== endX) {
      rates[0] = x;
      ratesAt(e, rates);
    } else {
      rates[0] = endRate;
      rates[1] = endCancel;
    }
    const rate0 = rates[0],
      cancel0 = rates[1];
    let h = Math.min(phase / rate0, RADIUS_SHARE * x, rest);
    endX = x + h;
    rates[0] = endX;
    ratesAt(e, rates);
    endRate = rates[0];
    endCancel = rates[1];
    if (h * rates[0] > phase) h = phase / rates[0];
    // longer where the terms do not cancel (tried where at x they cancel at less than half their rate): at most
    // `phase` of cancellation at both ends, and at most growthCap at the terms' rate at both ends and at x − h (the
    // disc of convergence of the series reaches back as far; past a turning point the oscillation behind x swelled
    // the terms of steps aimed by the two ends alone)
    let growth = phase;
    const longReach = Math.min(LONG_RADIUS_SHARE * x, rest);
    if (h < longReach && growthCap > phase && cancel0 < 0.5 * rate0) {
      let g = Math.min(phase / cancel0, growthCap / rate0, longReach);
      let rate = rate0;
      for (let pass = 0; pass < 2 && g > h; pass++) {
        const end = x + g;
        rates[0] = end;
        ratesAt(e, rates);
        const rate1 = rates[0],
          cancel1 = rates[1];
        endX = end;
        endRate = rate1;
        endCancel = cancel1;
        rates[0] = x - g;
        ratesAt(e, rates);
        rate = Math.max(rate0, rate1, rates[0]);
        const shorter = Math.min(g, phase / cancel1, growthCap / rate);
        if (shorter === g) break;
        g = shorter;
      }
      if (g > h) {
        h = g;
        growth = Math.max(phase, g * rate);
      }
    }
    const leastTerms = minTerms(growth);
    let err = Number.NaN;
    for (let halvings = 0; ; halvings++) {
      copy4(y, trial);
      stepIO[STEP_IO.X0] = x;
      stepIO[STEP_IO.H] = h;
      stepIO[STEP_IO.TARGET] = TARGET * tol;
      stepIO[STEP_IO.LEAST_TERMS] = leastTerms;
      step(e, trial, stepIO, realB);
      err = stepIO[STEP_IO.ERROR];
      terms += stepIO[STEP_IO.TERMS];
      if (err <= tol) break;
      if (halvings === 0 && growth > phase) growthCap = Math.max(phase, 0.5 * growth);
      if (halvings === MAX_HALVINGS) {
        copy4(start, y);
        return result(out, false, steps, errorSum, terms, 0, 0);
      }
      h *= 0.5;
    }
    copy4(trial, y);
    growthCap = Math.min(GROWTH_PHASE, 1.5 * growthCap);
    x = h >= rest ? xb : x + h;
    steps++;
    errorSum += err / tol;
    if (Math.abs(y[0]) + Math.abs(y[1]) > OVERFLOW) {
      for (let c = 0; c < 4; c++) y[c] *= RESCALE;
      logScale += LN_RESCALE;
      rescalings++;
    }
  }
  if (!(Number.isFinite(y[0]) && Number.isFinite(y[1]) && Number.isFinite(y[2]) && Number.isFinite(y[3]))) {
    copy4(start, y);
    return result(out, false, steps, errorSum, terms, 0, 0);
  }
  return result(out, true, steps, errorSum, terms, logScale, rescalings);
}

/** to[0..4) = from[0..4) (set() is a builtin call, ~9 ns against ~3 measured on Node 20, twice a step). */
function copy4(from: Float64Array, to: Float64Array): void {
  to[0] = from[0];
  to[1] = from[1];
  to[2] = from[2];
  to[3] = from[3];
}

/** Whether every coefficient is 0 (a loop: `every` with an arrow allocated the arrow per call). */
export function allZero(c: Float64Array): boolean {
  for (let i = 0; i < c.length; i++) if (c[i] !== 0) return false;
  return true;
}

/** Whether the x⁴ coefficient of c (degree ≤ 4) is 0. */
function cubic(c: Float64Array): boolean {
  return c.length < 5 || c[4] === 0;
}

/** `out` with these fields (the caller's object, reused from stretch to stretch: a new one per stretch was measured among a solve's allocations). */
function result(
  out: TaylorStretch,
  ok: boolean,
  steps: number,
  errorSum: number,
  terms: number,
  logScale: number,
  rescalings: number,
): TaylorStretch {
  out.ok = ok;
  out.steps = steps;
  out.errorSum = errorSum;
  out.terms = terms;
  out.logScale = logScale;
  out.rescalings = rescalings;
  return out;
}
