/**
 * The outgoing far-zone solutions carried inward in phase form (M = 1). Near
 * threshold (small k∞) the asymptotic series converges only at r ~ 20/k∞,
 * far beyond where the horizon integration of the massless mode stops, and
 * integrating the oscillating solutions out there was most of the cost. Here
 * the series starts where it converges and the solutions are brought in to a
 * moderate matching radius through quantities that do not oscillate: the
 * log-derivative matrix Y = P U⁻¹ (Riccati form, dY/dr* = W − Y²,
 * W = V − ω²), the phase θ = S + φ with dθ/dr* = Im tr Y / N (the local wave
 * number; S = ∫ √(k∞² + 2μ²/r) dr, which the local one follows near threshold
 * better than the series' own phase, approached only at r ≫ η/k∞: phaseAt)
 * and the amplitude Ũ = e^{−iθ} U
 * (dŨ/dr* = (Y − i dθ/dr*) Ũ). U holds one outgoing solution per column; the
 * incoming ones are their complex conjugates. In x = −ln r all three vary
 * on a scale of order one, but the Riccati form carries a fast mode (the
 * admixture of the incoming wave, e^{2iθ}) that an explicit integrator must
 * resolve for stability: intervals of Chebyshev collocation (chebyshev.ts),
 * solved by Newton's method, do not, and their last coefficients give the
 * error of each interval.
 */
import { ConvergenceError } from '@penumbra/core';
import type { Complex } from './complex.js';
import { type ChebyshevRule, chebyshevRule, complexLu, complexLuSolve } from './chebyshev.js';
import type { SectorModel } from './sectors.js';
import { farWaveNumbers, type SeriesState } from './series.js';

/** Far solutions at the inner radius, at any sample radii on the way, and the work. */
export interface PhaseCarried {
  far: SeriesState[];
  samples: Array<{ r: number; far: SeriesState[] }>;
  steps: number;
  rhsEvaluations: number;
  /** where the carry stopped: rEnd, or with slack the end of its last whole interval, in [rEnd, slack · rEnd] */
  endRadius: number;
}

/** Collocation nodes per interval: 13 (degree 12). */
const DEGREE = 12;
let rule: ChebyshevRule | undefined;
/** The rule, built on first use so that loading the package (e.g. for massless emission) does not pay for it. */
function collocationRule(): ChebyshevRule {
  rule ??= chebyshevRule(DEGREE);
  return rule;
}
const MAX_INTERVALS = 10_000;
const MAX_NEWTON = 60;
/** Newton and fixed-point iterations stop when the update is this small relative to the solution. */
const NEWTON_FLOOR = 1e-15;
/** The Newton matrix is refreshed only when a chord step contracts the update by less than this. */
const REFACTOR_CONTRACTION = 0.05;
const ZEROS = new Float64Array(DEGREE + 1);
/**
 * Smallest error asked of one interval: the tail coefficients carry rounding
 * of ~n·1e-16 relative times the size of c (W − Y²) ~ r|Y|, about 1e-13 at r ~ 30.
 * Tighter step tolerances take the direct route (integrate.ts).
 */
export const COLLOCATION_FLOOR = 1e-13;
/** First interval in x = −ln r. */
const FIRST_INTERVAL = 1.0;

/**
 * The reference phase the carry measures θ from: ∫ p dr with p = √(k∞² + 2μ²/r), the far-zone wave number with
 * its Newtonian part (antiderivative r p + (2μ²/k∞) asinh(k∞ √(r/2μ²)); the series' phase S = k∞ r* + η ln r
 * without μ). Near threshold the local wave number follows p, not dS/dr*, far inside r ~ η/k∞: measured from S,
 * φ = θ − S swung by tens of radians across an interval and its Chebyshev tail, held to the interval tolerance
 * in radians, set the interval size (5–100× the tails of Y and Ũ at r ≳ 300, even l = 2, 3, v = 0.05);
 * from ∫ p dr it moves by about one.
 */
function phaseAt(k: number, mu: number, r: number): number {
  const a = 2 * mu * mu;
  if (a === 0) return k * r;
  return r * Math.sqrt(k * k + a / r) + (a / k) * Math.asinh(k * Math.sqrt(r / a));
}

/**
 * Carry the outgoing far solutions `start` (one per channel, at rStart) in to
 * rEnd < rStart, keeping them also at the radii of `sampleRadii` in (rEnd, rStart);
 * with slack > 1 the carry may stop short of rEnd, at most at slack · rEnd.
 */
export function carryFarSolutions(
  model: SectorModel,
  start: SeriesState[],
  rStart: number,
  rEnd: number,
  stepTolerance: number,
  sampleRadii: readonly number[] = [],
  slack = 1,
): PhaseCarried {
  const N = model.channels;
  const NN = N * N;
  const { k } = farWaveNumbers(model);
  const w2 = model.omega * model.omega;
  const mu2 = model.mu * model.mu;
  const L = model.L;
  // two channels: work in the eigenbasis E of the 1/r² coupling Q(0) (columns (2, −2l) and (2, 2l + 2),
  // eigenvalues 2l + 2 and −2l), where Y is nearly diagonal and each entry's Newton multiplier is −c(Y_ii + Y_jj)
  const E = N === 2 ? [2, 2, -2 * model.l, 2 * model.l + 2] : [1];
  const det = N === 2 ? E[0] * E[3] - E[1] * E[2] : 1;
  const Einv = N === 2 ? [E[3] / det, -E[1] / det, -E[2] / det, E[0] / det] : [1];
  const similar = (q: number[]): number[] => (N === 2 ? realProduct(realProduct(Einv, q), E) : q);
  const q0 = similar(model.qCoeffs[0]);
  const q1 = similar(model.qCoeffs[1] ?? new Array<number>(NN).fill(0));
  const { n, nodes, S, C } = collocationRule();
  const n1 = n + 1;
  // Y, Ũ (complex, per node per entry at [j·NN + e]), φ (real, per node) and the Newton matrices: reused across calls
  const {
    Yr,
    Yi,
    Ur,
    Ui,
    phi,
    c,
    dS,
    W,
    dW,
    Fr,
    Fi,
    Ir,
    Ii,
    Ar,
    Ai,
    piv,
    bRe,
    bIm,
    rRe,
    rIm,
    rhsRe,
    rhsIm,
    work,
    gr,
    gi,
    hr,
    hi,
    psi,
    Dr,
    Di,
    Sin,
    Kr,
    Ki,
  } = workspace(N);
  const [r0Re, r1Re, r2Re, r3Re] = rhsRe;
  const [r0Im, r1Im, r2Im, r3Im] = rhsIm;
  {
    // U' = E⁻¹ U, P' = E⁻¹ P (columns: the channels' solutions)
    const U: Complex[] = [];
    const P: Complex[] = [];
    for (let i = 0; i < N; i++) {
      for (let col = 0; col < N; col++) {
        let ur = 0;
        let ui = 0;
        let pr = 0;
        let pi = 0;
        for (let m = 0; m < N; m++) {
          ur += Einv[i * N + m] * start[col].u[m][0];
          ui += Einv[i * N + m] * start[col].u[m][1];
          pr += Einv[i * N + m] * start[col].p[m][0];
          pi += Einv[i * N + m] * start[col].p[m][1];
        }
        U.push([ur, ui]);
        P.push([pr, pi]);
      }
    }
    const Y = rightDivide(P, U, N);
    const s0 = phaseAt(k, model.mu, rStart);
    const [cs, sn] = [Math.cos(s0), -Math.sin(s0)];
    for (let e = 0; e < NN; e++) {
      Yr[e] = Y[e][0];
      Yi[e] = Y[e][1];
      Ur[e] = cs * U[e][0] - sn * U[e][1];
      Ui[e] = cs * U[e][1] + sn * U[e][0];
    }
    phi[0] = 0;
  }
  let rhsEvaluations = 0;
  const omega = model.omega;
  // the tail coefficients carry rounding of ~1e-16 relative: no interval is asked for less than COLLOCATION_FLOOR
  const tolerance = Math.max(stepTolerance, COLLOCATION_FLOOR);
  // the iteration error is held to a hundredth of the interval's tolerance (Hairer & Wanner take 1e-2 to 1e-1 of it)
  const converged = Math.max(NEWTON_FLOOR, 1e-2 * tolerance);

  /** Coefficients at the nodes of the interval [x0, x0 + h]. */
  const setNodes = (x0: number, h: number): void => {
    for (let j = 0; j < n1; j++) {
      const r = Math.exp(-(x0 + 0.5 * h * (nodes[j] + 1)));
      const f = 1 - 2 / r;
      const yr = 1 / r;
      c[j] = -r / f;
      // d/dr* of the reference phase: f p
      dS[j] = f * Math.sqrt(k * k + (2 * mu2) / r);
      const diag = f * (mu2 + L * yr * yr) - w2;
      if (N === 2) {
        const y2 = yr * yr;
        const fy2 = f * y2;
        const o = 4 * j;
        W[o] = fy2 * (q0[0] + q1[0] * yr) + diag;
        W[o + 1] = fy2 * (q0[1] + q1[1] * yr);
        W[o + 2] = fy2 * (q0[2] + q1[2] * yr);
        W[o + 3] = fy2 * (q0[3] + q1[3] * yr) + diag;
        for (let i = 0; i < 2; i++) {
          const d = 3 * i;
          const g = mu2 + (L + q0[d]) * y2 + q1[d] * y2 * yr;
          const dg = 2 * (L + q0[d]) * yr + 3 * q1[d] * y2;
          dW[2 * j + i] = -fy2 * (-2 * g + f * dg);
        }
        continue;
      }
      for (let e = 0; e < NN; e++) W[j * NN + e] = f * yr * yr * (q0[e] + q1[e] * yr);
      for (let i = 0; i < N; i++) {
        const d = i * (N + 1);
        W[j * NN + d] += diag;
        // dW_ii/dr* = −f y² dW_ii/dy with W_ii = f g(y) − ω², g = μ² + (L + q0_ii) y² + q1_ii y³
        const g = mu2 + (L + q0[d]) * yr * yr + q1[d] * yr * yr * yr;
        const dg = 2 * (L + q0[d]) * yr + 3 * q1[d] * yr * yr;
        dW[j * N + i] = -f * yr * yr * (-2 * g + f * dg);
      }
    }
  };
  /** F = c (W − Y²) at node j. */
  const riccati = (j: number): void => {
    rhsEvaluations++;
    const o = j * NN;
    if (N === 2) {
      // Y² = [[Y00² + Y01 Y10, Y01 t], [Y10 t, Y11² + Y10 Y01]], t = Y00 + Y11
      const ar = Yr[o];
      const ai = Yi[o];
      const br = Yr[o + 1];
      const bi = Yi[o + 1];
      const dr = Yr[o + 2];
      const di = Yi[o + 2];
      const er = Yr[o + 3];
      const ei = Yi[o + 3];
      const pr = br * dr - bi * di;
      const pi = br * di + bi * dr;
      const tr = ar + er;
      const ti = ai + ei;
      const cj = c[j];
      Fr[o] = cj * (W[o] - (ar * ar - ai * ai + pr));
      Fi[o] = -cj * (2 * ar * ai + pi);
      Fr[o + 1] = cj * (W[o + 1] - (br * tr - bi * ti));
      Fi[o + 1] = -cj * (br * ti + bi * tr);
      Fr[o + 2] = cj * (W[o + 2] - (dr * tr - di * ti));
      Fi[o + 2] = -cj * (dr * ti + di * tr);
      Fr[o + 3] = cj * (W[o + 3] - (er * er - ei * ei + pr));
      Fi[o + 3] = -cj * (2 * er * ei + pi);
      return;
    }
    for (let i = 0; i < N; i++) {
      for (let m = 0; m < N; m++) {
        let sr = 0;
        let si = 0;
        for (let l = 0; l < N; l++) {
          const ar = Yr[o + i * N + l];
          const ai = Yi[o + i * N + l];
          const br = Yr[o + l * N + m];
          const bi = Yi[o + l * N + m];
          sr += ar * br - ai * bi;
          si += ar * bi + ai * br;
        }
        Fr[o + i * N + m] = c[j] * (W[o + i * N + m] - sr);
        Fi[o + i * N + m] = -c[j] * si;
      }
    }
  };
  /** Factor the one-channel Newton matrix I − S[1.., 1..] diag(a) (a complex per node, the factor h/2 included); false when singular. */
  const factor = (ar: Float64Array, ai: Float64Array): boolean => {
    const R = Ar[0];
    const I = Ai[0];
    for (let j = 0; j < n; j++) {
      const row = j * n;
      for (let m = 0; m < n; m++) {
        const s = Sin[row + m];
        R[row + m] = -s * ar[m + 1];
        I[row + m] = -s * ai[m + 1];
      }
      R[row + j] += 1;
    }
    return complexLu(R, I, n, piv[0]);
  };
  /**
   * The three Newton matrices of two channels, I − (h/2) S[1.., 1..] diag(a) with a = −2cY_00, −c(Y_00 + Y_11),
   * −2cY_11, built in one pass.
   */
  const factorTwo = (h: number): boolean => {
    for (let m = 1; m < n1; m++) {
      const o = 4 * m;
      const s = -h * c[m];
      gr[m] = s * Yr[o];
      gi[m] = s * Yi[o];
      hr[m] = s * Yr[o + 3];
      hi[m] = s * Yi[o + 3];
    }
    const [R0, R1, R2] = Ar;
    const [I0, I1, I2] = Ai;
    for (let j = 0; j < n; j++) {
      const row = j * n;
      for (let m = 0; m < n; m++) {
        const s = Sin[row + m];
        const ar = s * gr[m + 1];
        const ai = s * gi[m + 1];
        const br = s * hr[m + 1];
        const bi = s * hi[m + 1];
        R0[row + m] = -ar;
        I0[row + m] = -ai;
        R1[row + m] = -0.5 * (ar + br);
        I1[row + m] = -0.5 * (ai + bi);
        R2[row + m] = -br;
        I2[row + m] = -bi;
      }
      R0[row + j] += 1;
      R1[row + j] += 1;
      R2[row + j] += 1;
    }
    return complexLu(R0, I0, n, piv[0]) && complexLu(R1, I1, n, piv[1]) && complexLu(R2, I2, n, piv[2]);
  };
  const tail = (vr: Float64Array, vi: Float64Array, e: number, stride: number): number => {
    let t = 0;
    for (let row = n - 1; row <= n; row++) {
      let sr = 0;
      let si = 0;
      for (let m = 0; m < n1; m++) {
        sr += C[row * n1 + m] * vr[m * stride + e];
        si += C[row * n1 + m] * vi[m * stride + e];
      }
      t += Math.sqrt(sr * sr + si * si);
    }
    return t;
  };

  /** One interval: returns its error measure (relative to tol 1), or Infinity when the iterations fail. */
  const interval = (x0: number, h: number): number => {
    setNodes(x0, h);
    riccati(0);
    // start: Y_j = Y_0 + (x_j − x0) F_0, but the diagonal's imaginary part follows the local wave number
    // √(−W_ii) (the WKB phase), which carries most of its variation across the interval
    for (let j = 1; j < n1; j++) {
      const dx = 0.5 * h * (nodes[j] + 1);
      for (let e = 0; e < NN; e++) {
        Yr[j * NN + e] = Yr[e] + dx * Fr[e];
        Yi[j * NN + e] = Yi[e] + dx * Fi[e];
      }
      for (let i = 0; i < N; i++) {
        const d = i * (N + 1);
        const w0 = W[d];
        const wj = W[j * NN + d];
        if (w0 < 0 && wj < 0) {
          // second-order WKB: Y ≈ i√(−W) − W'/(4W) (W' = dW/dr*)
          Yi[j * NN + d] = Yi[d] + Math.sqrt(-wj) - Math.sqrt(-w0);
          Yr[j * NN + d] = Yr[d] - dW[j * N + i] / (4 * wj) + dW[i] / (4 * w0);
        }
      }
      if (N === 2) {
        // the off-diagonal entries follow the diagonal adiabatically: Y_01 ≈ W_01 / (Y_00 + Y_11)
        const o = j * NN;
        const sr0 = Yr[0] + Yr[3];
        const si0 = Yi[0] + Yi[3];
        const q0s = sr0 * sr0 + si0 * si0;
        const srj = Yr[o] + Yr[o + 3];
        const sij = Yi[o] + Yi[o + 3];
        const qjs = srj * srj + sij * sij;
        for (let e = 1; e <= 2; e++) {
          Yr[o + e] = Yr[e] + (W[o + e] * srj) / qjs - (W[e] * sr0) / q0s;
          Yi[o + e] = Yi[e] - (W[o + e] * sij) / qjs + (W[e] * si0) / q0s;
        }
      }
    }
    let yScale = omega;
    let previous = Infinity;
    let contraction = 1;
    for (let it = 0; ; it++) {
      if (it > MAX_NEWTON) return Infinity;
      for (let j = 1; j < n1; j++) riccati(j);
      if (it === 0 || contraction > REFACTOR_CONTRACTION) {
        // entry (i, j) of the Jacobian −c(Yδ + δY) without the off-diagonal Y: −c(Y_ii + Y_jj) (exact for one
        // channel); two channels have three such matrices (factorTwo), one channel the one of −2cY
        if (N === 2) {
          if (!factorTwo(h)) return Infinity;
        } else {
          for (let m = 0; m < n1; m++) {
            gr[m] = -0.5 * h * c[m] * (Yr[m] + Yr[m]);
            gi[m] = -0.5 * h * c[m] * (Yi[m] + Yi[m]);
          }
          if (!factor(gr, gi)) return Infinity;
        }
      }
      let change = 0;
      yScale = omega;
      if (N === 2) {
        // residuals of the four entries in the pass over S ([e·n + j − 1]), their solves (the two off-diagonal
        // entries share their matrix: one solve with two right-hand sides), the updates in one pass
        residuals(S, n1, Fr, Fi, 0.5 * h, Yr, Yi, rRe, rIm);
        complexLuSolve(Ar[0], Ai[0], n, piv[0], r0Re, r0Im, work);
        complexLuSolve(Ar[1], Ai[1], n, piv[1], r1Re, r1Im, work, r2Re, r2Im);
        complexLuSolve(Ar[2], Ai[2], n, piv[2], r3Re, r3Im, work);
        for (let j = 1; j < n1; j++) {
          const o = 4 * j;
          for (let e = 0; e < 4; e++) {
            const dr = rRe[e * n + j - 1];
            const di = rIm[e * n + j - 1];
            const yr = Yr[o + e] + dr;
            const yi = Yi[o + e] + di;
            Yr[o + e] = yr;
            Yi[o + e] = yi;
            change = Math.max(change, Math.abs(dr) + Math.abs(di));
            yScale = Math.max(yScale, Math.abs(yr) + Math.abs(yi));
          }
        }
      } else {
        nodeIntegrals(S, n1, Fr, Fi, NN, 0.5 * h, Ir, Ii);
        for (let j = 1; j < n1; j++) {
          bRe[j - 1] = Ir[j - 1] - (Yr[j] - Yr[0]);
          bIm[j - 1] = Ii[j - 1] - (Yi[j] - Yi[0]);
        }
        complexLuSolve(Ar[0], Ai[0], n, piv[0], bRe, bIm, work);
        for (let j = 1; j < n1; j++) {
          Yr[j] += bRe[j - 1];
          Yi[j] += bIm[j - 1];
          change = Math.max(change, Math.abs(bRe[j - 1]) + Math.abs(bIm[j - 1]));
          yScale = Math.max(yScale, Math.abs(Yr[j]) + Math.abs(Yi[j]));
        }
      }
      if (!Number.isFinite(change)) return Infinity;
      if (settled(change, previous, converged * yScale)) break;
      contraction = change / previous;
      previous = change;
    }
    // Ũ: dŨ/dx = G Ũ, G = c (Y − iψ), ψ = Im tr Y / N. The diagonal of G by quadrature, Ũ = D V with
    // D_i = exp ∫ G_ii; the off-diagonal rest (small in the eigenbasis) by Picard iteration on V, no matrices to factor
    for (let m = 0; m < n1; m++) {
      let ti = 0;
      for (let i = 0; i < N; i++) ti += Yi[m * NN + i * N + i];
      psi[m] = ti / N;
    }
    if (N === 2) {
      // the two exponents of D and dφ/dx in one pass over S: entries 0, 1 the diagonal of G, entry 2 dφ/dx
      for (let m = 0; m < n1; m++) {
        const o = 4 * m;
        const cm = c[m];
        Fr[o] = cm * Yr[o];
        Fi[o] = cm * (Yi[o] - psi[m]);
        Fr[o + 1] = cm * Yr[o + 3];
        Fi[o + 1] = cm * (Yi[o + 3] - psi[m]);
        Fr[o + 2] = cm * (psi[m] - dS[m]);
        Fi[o + 2] = 0;
        Fr[o + 3] = 0;
        Fi[o + 3] = 0;
      }
      nodeIntegrals(S, n1, Fr, Fi, 4, 0.5 * h, Ir, Ii);
      Dr[0] = 1;
      Di[0] = 0;
      Dr[1] = 1;
      Di[1] = 0;
      for (let j = 1; j < n1; j++) {
        const o = 4 * (j - 1);
        for (let i = 0; i < 2; i++) {
          const mod = Math.exp(Ir[o + i]);
          Dr[2 * j + i] = mod * Math.cos(Ii[o + i]);
          Di[2 * j + i] = mod * Math.sin(Ii[o + i]);
        }
        phi[j] = phi[0] + Ir[o + 2];
      }
    } else {
      Dr[0] = 1;
      Di[0] = 0;
      for (let j = 1; j < n1; j++) {
        let sr = 0;
        let si = 0;
        for (let m = 0; m < n1; m++) {
          const s = S[j * n1 + m] * c[m];
          sr += s * Yr[m];
          si += s * (Yi[m] - psi[m]);
        }
        const mod = Math.exp(0.5 * h * sr);
        Dr[j] = mod * Math.cos(0.5 * h * si);
        Di[j] = mod * Math.sin(0.5 * h * si);
      }
    }
    for (let j = 1; j < n1; j++) {
      for (let e = 0; e < NN; e++) {
        Ur[j * NN + e] = Ur[e];
        Ui[j * NN + e] = Ui[e];
      }
    }
    // V_j = V_0 + ∫ K V with K_il = c Y_il D_l / D_i (i ≠ l); for one channel V is constant. K is fixed over
    // the iteration: built once. Two channels: K_01 = c Y_01 D_1/D_0, K_10 = c Y_10 D_0/D_1, and each sweep
    // updates row 0 of V from row 1 and then row 1 from the new row 0 (Gauss–Seidel: the contraction per
    // sweep is about the square of the simultaneous update's)
    let uScale = 0;
    previous = Infinity;
    if (N === 2) {
      for (let m = 0; m < n1; m++) {
        // ρ = D_1 / D_0
        const ar = Dr[2 * m];
        const ai = Di[2 * m];
        const br = Dr[2 * m + 1];
        const bi = Di[2 * m + 1];
        const qa = ar * ar + ai * ai;
        const rr = (br * ar + bi * ai) / qa;
        const ri = (bi * ar - br * ai) / qa;
        const qr = rr * rr + ri * ri;
        const o = 4 * m;
        const cm = c[m];
        // K_01 = c Y_01 ρ
        const y1r = Yr[o + 1];
        const y1i = Yi[o + 1];
        Kr[2 * m] = cm * (y1r * rr - y1i * ri);
        Ki[2 * m] = cm * (y1r * ri + y1i * rr);
        // K_10 = c Y_10 / ρ
        const y2r = Yr[o + 2];
        const y2i = Yi[o + 2];
        Kr[2 * m + 1] = (cm * (y2r * rr + y2i * ri)) / qr;
        Ki[2 * m + 1] = (cm * (y2i * rr - y2r * ri)) / qr;
      }
    }
    for (let it = 0; N > 1; it++) {
      if (it > MAX_NEWTON) return Infinity;
      let change = 0;
      uScale = 0;
      for (let row = 0; row < 2; row++) {
        // F_row,col = K_row,other V_other,col at every node
        const other = 1 - row;
        for (let m = 0; m < n1; m++) {
          const kr = Kr[2 * m + row];
          const ki = Ki[2 * m + row];
          const o = 4 * m + 2 * other;
          const v0r = Ur[o];
          const v0i = Ui[o];
          const v1r = Ur[o + 1];
          const v1i = Ui[o + 1];
          Fr[2 * m] = kr * v0r - ki * v0i;
          Fi[2 * m] = kr * v0i + ki * v0r;
          Fr[2 * m + 1] = kr * v1r - ki * v1i;
          Fi[2 * m + 1] = kr * v1i + ki * v1r;
        }
        nodeIntegrals(S, n1, Fr, Fi, 2, 0.5 * h, Ir, Ii);
        const e0 = 2 * row;
        const b0r = Ur[e0];
        const b0i = Ui[e0];
        const b1r = Ur[e0 + 1];
        const b1i = Ui[e0 + 1];
        for (let j = 1; j < n1; j++) {
          const o = 4 * j + e0;
          const sr = b0r + Ir[2 * (j - 1)];
          const si = b0i + Ii[2 * (j - 1)];
          const tr = b1r + Ir[2 * (j - 1) + 1];
          const ti = b1i + Ii[2 * (j - 1) + 1];
          change = Math.max(
            change,
            Math.abs(sr - Ur[o]) + Math.abs(si - Ui[o]),
            Math.abs(tr - Ur[o + 1]) + Math.abs(ti - Ui[o + 1]),
          );
          uScale = Math.max(uScale, Math.abs(sr) + Math.abs(si), Math.abs(tr) + Math.abs(ti));
          Ur[o] = sr;
          Ui[o] = si;
          Ur[o + 1] = tr;
          Ui[o + 1] = ti;
        }
      }
      if (!Number.isFinite(change)) return Infinity;
      if (settled(change, previous, converged * uScale)) break;
      previous = change;
    }
    // Ũ = D V
    uScale = 0;
    for (let j = 1; j < n1; j++) {
      for (let e = 0; e < NN; e++) {
        // row i = ⌊e / N⌋
        const i = N === 2 ? e >> 1 : 0;
        const dr = Dr[j * N + i];
        const di = Di[j * N + i];
        const vr = Ur[j * NN + e];
        const vi = Ui[j * NN + e];
        Ur[j * NN + e] = dr * vr - di * vi;
        Ui[j * NN + e] = dr * vi + di * vr;
        uScale = Math.max(uScale, Math.abs(Ur[j * NN + e]) + Math.abs(Ui[j * NN + e]));
      }
    }
    // φ by quadrature: dφ/dx = c (ψ − dS/dr*) (two channels: with D above)
    for (let j = 1; j < n1 && N === 1; j++) {
      let s = 0;
      for (let m = 0; m < n1; m++) s += S[j * n1 + m] * c[m] * (psi[m] - dS[m]);
      phi[j] = phi[0] + 0.5 * h * s;
    }
    // error: the last two Chebyshev coefficients, Y against |Y| + ω, Ũ against |Ũ|, φ absolute
    let err = 0;
    if (N === 2) {
      err = Math.max(tails(C, n1, Yr, Yi) / yScale, tails(C, n1, Ur, Ui) / uScale);
    } else {
      err = Math.max(tail(Yr, Yi, 0, 1) / yScale, tail(Ur, Ui, 0, 1) / uScale);
    }
    err = Math.max(err, tail(phi, ZEROS, 0, 1));
    return err / tolerance;
  };

  const read = (r: number, terms: number): SeriesState[] => {
    const s = phaseAt(k, model.mu, r) + phi[0];
    const [cs, sn] = [Math.cos(s), Math.sin(s)];
    const u: Complex[] = [];
    for (let e = 0; e < NN; e++) u.push([cs * Ur[e] - sn * Ui[e], cs * Ui[e] + sn * Ur[e]]);
    // P' = Y' U'; then back to the channel basis: u = E u', p = E p'
    const p: Complex[] = [];
    for (let i = 0; i < N; i++) {
      for (let col = 0; col < N; col++) {
        let re = 0;
        let im = 0;
        for (let m = 0; m < N; m++) {
          const yr = Yr[i * N + m];
          const yi = Yi[i * N + m];
          re += yr * u[m * N + col][0] - yi * u[m * N + col][1];
          im += yr * u[m * N + col][1] + yi * u[m * N + col][0];
        }
        p.push([re, im]);
      }
    }
    const back = (v: Complex[], i: number, col: number): Complex => {
      let re = 0;
      let im = 0;
      for (let m = 0; m < N; m++) {
        re += E[i * N + m] * v[m * N + col][0];
        im += E[i * N + m] * v[m * N + col][1];
      }
      return [re, im];
    };
    return Array.from({ length: N }, (_, col) => ({
      u: Array.from({ length: N }, (_, i) => back(u, i, col)),
      p: Array.from({ length: N }, (_, i) => back(p, i, col)),
      terms,
      converged: true,
    }));
  };
  const terms = start.reduce((a, st) => Math.max(a, st.terms), 0);
  const targets = sampleRadii.filter((r) => r > rEnd && r < rStart).sort((a, b) => b - a);
  const samples: PhaseCarried['samples'] = [];
  let steps = 0;
  let x = -Math.log(rStart);
  let h = FIRST_INTERVAL;
  // the carry may stop at the end of a whole interval anywhere in [rEnd, slack · rEnd] rather than add a short one
  const xSoft = -Math.log(slack * rEnd);
  let end = rEnd;
  for (const r of [...targets, rEnd]) {
    const xEnd = -Math.log(r);
    while (x < xEnd) {
      if (r === rEnd && slack > 1 && x >= xSoft) {
        end = Math.exp(-x);
        break;
      }
      const last = h >= xEnd - x;
      const step = last ? xEnd - x : h;
      const err = interval(x, step);
      if (++steps > MAX_INTERVALS) {
        throw new ConvergenceError(
          'phase-form far-zone interval budget exhausted',
          failure(model, `more than ${MAX_INTERVALS} intervals`, steps, rhsEvaluations),
        );
      }
      if (!(err <= 1)) {
        h = step * (Number.isFinite(err) ? Math.max(0.3, Math.min(0.7, 0.8 * err ** -0.1)) : 0.5);
        if (!(h > 1e-6)) {
          throw new ConvergenceError(
            'phase-form far zone did not converge',
            failure(model, `interval below 1e-6 at r = ${Math.exp(-x)}`, steps, rhsEvaluations),
          );
        }
        continue;
      }
      // accepted: the last node is the next start
      for (let e = 0; e < NN; e++) {
        Yr[e] = Yr[n * NN + e];
        Yi[e] = Yi[n * NN + e];
        Ur[e] = Ur[n * NN + e];
        Ui[e] = Ui[n * NN + e];
      }
      phi[0] = phi[n];
      x = last ? xEnd : x + step;
      if (!last || step >= h) h = step * Math.max(1, Math.min(2, 0.8 * err ** -0.1));
    }
    if (r !== rEnd) samples.push({ r, far: read(r, terms) });
  }
  return { far: read(end, terms), samples, steps, rhsEvaluations, endRadius: end };
}

/**
 * Whether an iteration that converges linearly has settled: the last update `change` after `previous`,
 * with contraction θ = change / previous, leaves an error of about θ/(1 − θ) · change (the stopping rule
 * of the simplified Newton iterations in Hairer & Wanner, Solving ODEs II, Sect. IV.8), which must be
 * at most `bound`; a change at most `bound` settles it outright.
 */
function settled(change: number, previous: number, bound: number): boolean {
  if (change <= bound) return true;
  if (!(previous < Infinity)) return false;
  const theta = change / previous;
  return theta < 0.5 && (theta / (1 - theta)) * change <= bound;
}

/**
 * out[(j − 1)·stride + e] = scale Σ_m S_jm f[m·stride + e] (re, im) for j = 1 … n and every entry e < stride:
 * the integrals from node 0 to node j, all entries in one pass over S.
 */
function nodeIntegrals(
  S: Float64Array,
  n1: number,
  fr: Float64Array,
  fi: Float64Array,
  stride: number,
  scale: number,
  outR: Float64Array,
  outI: Float64Array,
): void {
  // unrolled per stride (1, 2 or 4): the loop over entries with a variable bound ran at half the speed
  if (stride === 2) {
    for (let j = 1; j < n1; j++) {
      const row = j * n1;
      let r0 = 0;
      let r1 = 0;
      let i0 = 0;
      let i1 = 0;
      for (let m = 0; m < n1; m++) {
        const s = S[row + m];
        const k = 2 * m;
        r0 += s * fr[k];
        r1 += s * fr[k + 1];
        i0 += s * fi[k];
        i1 += s * fi[k + 1];
      }
      const o = 2 * (j - 1);
      outR[o] = scale * r0;
      outR[o + 1] = scale * r1;
      outI[o] = scale * i0;
      outI[o + 1] = scale * i1;
    }
    return;
  }
  if (stride === 4) {
    for (let j = 1; j < n1; j++) {
      const row = j * n1;
      let r0 = 0;
      let r1 = 0;
      let r2 = 0;
      let r3 = 0;
      let i0 = 0;
      let i1 = 0;
      let i2 = 0;
      let i3 = 0;
      for (let m = 0; m < n1; m++) {
        const s = S[row + m];
        const k = 4 * m;
        r0 += s * fr[k];
        r1 += s * fr[k + 1];
        r2 += s * fr[k + 2];
        r3 += s * fr[k + 3];
        i0 += s * fi[k];
        i1 += s * fi[k + 1];
        i2 += s * fi[k + 2];
        i3 += s * fi[k + 3];
      }
      const o = 4 * (j - 1);
      outR[o] = scale * r0;
      outR[o + 1] = scale * r1;
      outR[o + 2] = scale * r2;
      outR[o + 3] = scale * r3;
      outI[o] = scale * i0;
      outI[o + 1] = scale * i1;
      outI[o + 2] = scale * i2;
      outI[o + 3] = scale * i3;
    }
    return;
  }
  for (let j = 1; j < n1; j++) {
    const row = j * n1;
    let sr = 0;
    let si = 0;
    for (let m = 0; m < n1; m++) {
      const s = S[row + m];
      sr += s * fr[m];
      si += s * fi[m];
    }
    outR[j - 1] = scale * sr;
    outI[j - 1] = scale * si;
  }
}

/**
 * The largest over the four entries (two channels; v[4m + e]) of |a_{n−1}| + |a_n|, the last two Chebyshev
 * coefficients (rows n − 1, n of C), in one pass.
 */
function tails(C: Float64Array, n1: number, vr: Float64Array, vi: Float64Array): number {
  const n = n1 - 1;
  let t0 = 0;
  let t1 = 0;
  let t2 = 0;
  let t3 = 0;
  for (let row = n - 1; row <= n; row++) {
    let r0 = 0;
    let r1 = 0;
    let r2 = 0;
    let r3 = 0;
    let i0 = 0;
    let i1 = 0;
    let i2 = 0;
    let i3 = 0;
    const o = row * n1;
    for (let m = 0; m < n1; m++) {
      const s = C[o + m];
      const k = 4 * m;
      r0 += s * vr[k];
      r1 += s * vr[k + 1];
      r2 += s * vr[k + 2];
      r3 += s * vr[k + 3];
      i0 += s * vi[k];
      i1 += s * vi[k + 1];
      i2 += s * vi[k + 2];
      i3 += s * vi[k + 3];
    }
    t0 += Math.sqrt(r0 * r0 + i0 * i0);
    t1 += Math.sqrt(r1 * r1 + i1 * i1);
    t2 += Math.sqrt(r2 * r2 + i2 * i2);
    t3 += Math.sqrt(r3 * r3 + i3 * i3);
  }
  return Math.max(t0, t1, t2, t3);
}

/**
 * The Newton residuals of two channels: r[e·n + j − 1] = scale Σ_m S_jm f[4m + e] − (y[4j + e] − y[e])
 * (re, im) for j = 1 … n, e < 4, in one pass over S (n = n1 − 1).
 */
function residuals(
  S: Float64Array,
  n1: number,
  fr: Float64Array,
  fi: Float64Array,
  scale: number,
  yr: Float64Array,
  yi: Float64Array,
  outR: Float64Array,
  outI: Float64Array,
): void {
  const n = n1 - 1;
  for (let j = 1; j < n1; j++) {
    const row = j * n1;
    let r0 = 0;
    let r1 = 0;
    let r2 = 0;
    let r3 = 0;
    let i0 = 0;
    let i1 = 0;
    let i2 = 0;
    let i3 = 0;
    for (let m = 0; m < n1; m++) {
      const s = S[row + m];
      const k = 4 * m;
      r0 += s * fr[k];
      r1 += s * fr[k + 1];
      r2 += s * fr[k + 2];
      r3 += s * fr[k + 3];
      i0 += s * fi[k];
      i1 += s * fi[k + 1];
      i2 += s * fi[k + 2];
      i3 += s * fi[k + 3];
    }
    const o = 4 * j;
    const q = j - 1;
    outR[q] = scale * r0 - (yr[o] - yr[0]);
    outR[n + q] = scale * r1 - (yr[o + 1] - yr[1]);
    outR[2 * n + q] = scale * r2 - (yr[o + 2] - yr[2]);
    outR[3 * n + q] = scale * r3 - (yr[o + 3] - yr[3]);
    outI[q] = scale * i0 - (yi[o] - yi[0]);
    outI[n + q] = scale * i1 - (yi[o + 1] - yi[1]);
    outI[2 * n + q] = scale * i2 - (yi[o + 2] - yi[2]);
    outI[3 * n + q] = scale * i3 - (yi[o + 3] - yi[3]);
  }
}

/** The buffers of one carry (every entry is written before it is read). */
interface Workspace {
  Yr: Float64Array;
  Yi: Float64Array;
  Ur: Float64Array;
  Ui: Float64Array;
  phi: Float64Array;
  c: Float64Array;
  dS: Float64Array;
  W: Float64Array;
  /** dW_ii/dr* per node per channel, [j·N + i] */
  dW: Float64Array;
  Fr: Float64Array;
  Fi: Float64Array;
  /** integrals of F from node 0 to nodes 1 … n, [(j − 1)·NN + e] */
  Ir: Float64Array;
  Ii: Float64Array;
  /** one Newton matrix per distinct multiplier of Y (the off-diagonal entries share theirs; then reused per row of Ũ) */
  Ar: Float64Array[];
  Ai: Float64Array[];
  piv: Int32Array[];
  bRe: Float64Array;
  bIm: Float64Array;
  /** the Newton right-hand sides of the four entries (two channels), [e·n + j − 1], and a view of each */
  rRe: Float64Array;
  rIm: Float64Array;
  rhsRe: Float64Array[];
  rhsIm: Float64Array[];
  work: Float64Array;
  /** S[1.., 1..], n×n: the integration matrix of the Newton matrices */
  Sin: Float64Array;
  gr: Float64Array;
  gi: Float64Array;
  hr: Float64Array;
  hi: Float64Array;
  psi: Float64Array;
  /** K_01, K_10 of the Picard iteration (two channels) per node, [2j + i] */
  Kr: Float64Array;
  Ki: Float64Array;
  /** D_i at each node (the quadrature of the diagonal of G), [j·N + i] */
  Dr: Float64Array;
  Di: Float64Array;
}

/** Per channel count: carries run one at a time and never nest, so one set each serves every call. */
const WORKSPACES: Array<Workspace | undefined> = [];

function workspace(N: number): Workspace {
  const cached = WORKSPACES[N];
  if (cached) return cached;
  const { n } = collocationRule();
  const n1 = n + 1;
  const NN = N * N;
  const slots = N === 2 ? 3 : 1;
  const made: Workspace = {
    Yr: new Float64Array(n1 * NN),
    Yi: new Float64Array(n1 * NN),
    Ur: new Float64Array(n1 * NN),
    Ui: new Float64Array(n1 * NN),
    phi: new Float64Array(n1),
    c: new Float64Array(n1),
    dS: new Float64Array(n1),
    W: new Float64Array(n1 * NN),
    dW: new Float64Array(n1 * N),
    Fr: new Float64Array(n1 * NN),
    Fi: new Float64Array(n1 * NN),
    Ir: new Float64Array(n * NN),
    Ii: new Float64Array(n * NN),
    Ar: Array.from({ length: slots }, () => new Float64Array(n * n)),
    Ai: Array.from({ length: slots }, () => new Float64Array(n * n)),
    piv: Array.from({ length: slots }, () => new Int32Array(n)),
    bRe: new Float64Array(n),
    bIm: new Float64Array(n),
    rRe: new Float64Array(4 * n),
    rIm: new Float64Array(4 * n),
    rhsRe: [],
    rhsIm: [],
    work: new Float64Array(4 * n),
    Sin: new Float64Array(n * n),
    gr: new Float64Array(n1),
    gi: new Float64Array(n1),
    hr: new Float64Array(n1),
    hi: new Float64Array(n1),
    psi: new Float64Array(n1),
    Kr: new Float64Array(2 * n1),
    Ki: new Float64Array(2 * n1),
    Dr: new Float64Array(n1 * N),
    Di: new Float64Array(n1 * N),
  };
  for (let e = 0; e < 4; e++) {
    made.rhsRe.push(made.rRe.subarray(e * n, (e + 1) * n));
    made.rhsIm.push(made.rIm.subarray(e * n, (e + 1) * n));
  }
  const { S } = collocationRule();
  for (let j = 1; j < n1; j++) {
    for (let m = 1; m < n1; m++) made.Sin[(j - 1) * n + m - 1] = S[j * n1 + m];
  }
  WORKSPACES[N] = made;
  return made;
}

function failure(model: SectorModel, message: string, steps: number, rhsEvaluations: number) {
  return {
    method: `Proca ${model.sector} sector, l = ${model.l}, Mω = ${model.omega}, Mμ = ${model.mu}: phase-form far zone`,
    steps,
    rhsEvaluations,
    errorEstimate: Infinity,
    message,
  };
}

/** Product of two real N×N matrices (N = 2), row-major. */
function realProduct(a: number[], b: number[]): number[] {
  return [a[0] * b[0] + a[1] * b[2], a[0] * b[1] + a[1] * b[3], a[2] * b[0] + a[3] * b[2], a[2] * b[1] + a[3] * b[3]];
}

/** P U⁻¹ for N×N (N = 1, 2) complex matrices. */
function rightDivide(P: Complex[], U: Complex[], N: number): Complex[] {
  const cmul = (a: Complex, b: Complex): Complex => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
  const cdiv = (a: Complex, b: Complex): Complex => {
    const d = b[0] * b[0] + b[1] * b[1];
    return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d];
  };
  if (N === 1) return [cdiv(P[0], U[0])];
  const det: Complex = [cmul(U[0], U[3])[0] - cmul(U[1], U[2])[0], cmul(U[0], U[3])[1] - cmul(U[1], U[2])[1]];
  const inv: Complex[] = [cdiv(U[3], det), cdiv([-U[1][0], -U[1][1]], det), cdiv([-U[2][0], -U[2][1]], det), cdiv(U[0], det)];
  const out: Complex[] = [];
  for (let i = 0; i < 2; i++) {
    for (let j = 0; j < 2; j++) {
      const a = cmul(P[i * 2], inv[j]);
      const b = cmul(P[i * 2 + 1], inv[2 + j]);
      out.push([a[0] + b[0], a[1] + b[1]]);
    }
  }
  return out;
}
