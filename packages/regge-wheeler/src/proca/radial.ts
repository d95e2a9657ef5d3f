/**
 * The Proca solution of one polarisation on a grid of radii (Schwarzschild):
 * the ingoing-at-horizon solution whose incident wave is the polarisation's
 * transmission eigenvector, so that its Γ is the one `procaGreybody` reports
 * (docs/massive-vector.md, section 3). Inside the start radius it is the
 * horizon series, between start and matching radius the integration (which
 * steps to every requested radius), beyond it the far series.
 */
import { ConvergenceError, InputError } from '@penumbra/core';
import { type Complex, abs2, mul, solve } from './complex.js';
import { procaSpan, singleExtrapolationSolve, type ProcaGreybodyDiagnostics } from './greybody.js';
import type { ProcaIntegration } from './integrate.js';
import {
  type ProcaGreybodyOptions,
  type ProcaGreybodyProblem,
  type ProcaPolarization,
  validateProcaOptions,
  validateProcaProblem,
} from './problem.js';
import { qAt, sectorModel, type SectorModel } from './sectors.js';
import { farWaveNumbers, horizonSolution, outgoingFarSolution } from './series.js';

/** Largest number of radii one call samples. */
export const MAX_PROCA_RADII = 100_000;

/** The field at one radius: one entry per channel (odd: a; monopole: u2; even: u2, u3). */
export interface ProcaRadialSample {
  /** radius, in units of the hole's mass unit (as the problem's ω) */
  r: number;
  /** the channel functions u */
  u: Complex[];
  /** du/dr */
  dudr: Complex[];
  /** the conserved flux into the hole through this sphere, in units M = 1 (the same at every r; horizonFlux at the horizon) */
  flux: number;
}

/** One Proca polarisation on a grid of radii. */
export interface ProcaRadialSolution {
  polarization: ProcaPolarization;
  samples: ProcaRadialSample[];
  /**
   * unit channel vector c_H of the horizon behaviour u → c_H e^{−iωr*}: 1 for
   * the odd and monopole sectors (as the greybody solve starts them), for
   * the even sector the eigen-polarisation's combination of the two, scaled to
   * unit length with its largest entry real and positive
   */
  horizonAmplitude: Complex[];
  /** c_in, c_out of u → Σ_c (c_in e^{−i(k∞r* + η ln r)} + c_out e^{+i(k∞r* + η ln r)}) e_c at infinity */
  incomingAmplitude: Complex[];
  outgoingAmplitude: Complex[];
  /** c_H† H c_H, the flux into the hole */
  horizonFlux: number;
  /** k∞ c_in† D c_in and k∞ c_out† D c_out */
  incomingFlux: number;
  outgoingFlux: number;
  /** horizonFlux / incomingFlux */
  gamma: number;
  /** outgoingFlux / incomingFlux */
  reflection: number;
  /** errorEstimate: relative error of Γ (and of the samples) from the integration's accumulation bound */
  diagnostics: ProcaGreybodyDiagnostics;
}

/**
 * Flux into the hole through the sphere at r of a solution (u, P = du/dr*):
 * F = −Im[r² h̄0 G + f L k̄ H] (docs/massive-vector.md, section 2) with
 * u2 = r f h1, u3 = L k and h0 from the Lorenz condition; −Im(ū P) for the
 * odd sector. M = 1.
 */
export function procaFlux(model: SectorModel, r: number, u: Complex[], p: Complex[]): number {
  if (model.sector === 'odd') return -(u[0][0] * p[0][1] - u[0][1] * p[0][0]);
  const { omega, mu, L } = model;
  const f = 1 - 2 / r;
  const df = 2 / (r * r);
  const q = qAt(model, 1 / r);
  const N = model.channels;
  // u″ from d²u/dr*² = (V − ω²) u with V = f(μ² + L/r²) + (f/r²) Q
  const d1 = (i: number): Complex => [p[i][0] / f, p[i][1] / f];
  const d2 = (i: number): Complex => {
    let re = (mu * mu + L / (r * r) - (omega * omega) / f) * u[i][0];
    let im = (mu * mu + L / (r * r) - (omega * omega) / f) * u[i][1];
    for (let j = 0; j < N; j++) {
      re += (q[i * N + j] / (r * r)) * u[j][0];
      im += (q[i * N + j] / (r * r)) * u[j][1];
    }
    return [re / f - (p[i][0] * df) / (f * f), im / f - (p[i][1] * df) / (f * f)];
  };
  const u2 = u[0];
  const u3: Complex = N === 2 ? u[1] : [0, 0];
  const du2 = d1(0);
  const du3: Complex = N === 2 ? d1(1) : [0, 0];
  const dd2 = d2(0);
  const h1: Complex = [u2[0] / (r * f), u2[1] / (r * f)];
  const g: Complex = [u3[0] - u2[0] - r * du2[0], u3[1] - u2[1] - r * du2[1]];
  const dg: Complex = [du3[0] - 2 * du2[0] - r * dd2[0], du3[1] - 2 * du2[1] - r * dd2[1]];
  // h0 = f g / (iω r²); 1/(iω) = −i/ω
  const overIOmega = (z: Complex): Complex => [z[1] / omega, -z[0] / omega];
  const h0 = overIOmega([(f * g[0]) / (r * r), (f * g[1]) / (r * r)]);
  const dh0 = overIOmega([
    (df * g[0] + f * dg[0]) / (r * r) - (2 * f * g[0]) / (r * r * r),
    (df * g[1] + f * dg[1]) / (r * r) - (2 * f * g[1]) / (r * r * r),
  ]);
  // G = −iω h1 − h0′
  const G: Complex = [omega * h1[1] - dh0[0], -omega * h1[0] - dh0[1]];
  let im = r * r * (h0[0] * G[1] - h0[1] * G[0]);
  if (N === 2) {
    // k = u3/L, H = k′ − h1
    const k: Complex = [u3[0] / L, u3[1] / L];
    const H: Complex = [du3[0] / L - h1[0], du3[1] / L - h1[1]];
    im += f * L * (k[0] * H[1] - k[1] * H[0]);
  }
  return -im;
}

function scale(z: Complex, s: number): Complex {
  return [z[0] * s, z[1] * s];
}

function add(a: Complex, b: Complex): Complex {
  return [a[0] + b[0], a[1] + b[1]];
}

/**
 * The horizon combination a (coefficients of the stored horizon solutions) of
 * one polarisation: 1 for one channel; for two, a ∝ A_in⁻¹ S_∞⁻¹ v with v the
 * eigenvector of T (the incident unit-flux amplitudes), scaled to unit length
 * with its largest entry real and positive.
 */
function horizonCombination(model: SectorModel, run: ProcaIntegration, index: number): Complex[] {
  if (model.channels === 1) return [[1, 0]];
  const { k } = farWaveNumbers(model);
  const v = run.eigenvectors[index];
  const incident = v.map((z, c) => scale(z, 1 / Math.sqrt(k * model.infinityWeights[c])));
  const a = solve(run.amplitudesIn, incident, 2, 1);
  const big = abs2(a[0]) >= abs2(a[1]) ? a[0] : a[1];
  const norm = Math.sqrt(abs2(a[0]) + abs2(a[1]));
  const phase: Complex = [big[0] / Math.sqrt(abs2(big)), -big[1] / Math.sqrt(abs2(big))];
  return a.map((z) => scale(mul(z, phase), 1 / norm));
}

/**
 * The solution of one Proca polarisation at the given radii (any order, each
 * > 2M), normalised at the horizon to u → c_H e^{−iωr*} (c_H of unit length),
 * with its amplitudes and fluxes at both ends. Throws InputError for a bad
 * problem, options or radius, and ConvergenceError when the accumulation
 * bound of the integration stays above `options.tol`.
 */
export function procaRadialSolution(
  problem: ProcaGreybodyProblem,
  radii: readonly number[],
  options?: ProcaGreybodyOptions,
): ProcaRadialSolution {
  const p = validateProcaProblem(problem);
  const { tol } = validateProcaOptions(options);
  if (!Array.isArray(radii) || radii.length > MAX_PROCA_RADII) {
    throw new InputError('radii', `an array of at most ${MAX_PROCA_RADII} finite radii r > 2M`, radii);
  }
  radii.forEach((r, i) => {
    if (typeof r !== 'number' || !Number.isFinite(r) || !(r > 2 * p.mass)) {
      throw new InputError(`radii[${i}]`, `a finite radius r > 2M = ${2 * p.mass}`, r);
    }
  });
  const model = sectorModel(p.sector, p.l, p.omega, p.mu);
  const index = p.polarization === 'even-2' ? 1 : 0;
  const N = model.channels;
  // units M = 1 inside
  const inside = radii.map((r) => r / p.mass);
  const sorted = [...inside].sort((x, y) => x - y);
  const solved = singleExtrapolationSolve(model, tol, procaSpan(model), sorted);
  const run = solved.fine;
  const d: ProcaGreybodyDiagnostics = {
    method: `Proca ${model.sector} sector (${N} channel${N > 1 ? 's' : ''}) on a grid: horizon Frobenius series, Gragg–Bulirsch–Stoer extrapolation in r stepping to every radius, far-zone series with the long-range log phase; error from the accumulation bound of one integration`,
    steps: solved.steps,
    rhsEvaluations: solved.rhsEvaluations,
    errorEstimate: solved.relError,
    message:
      solved.relError <= tol
        ? `converged: accumulation bound ${solved.relError.toExponential(1)} (tol ${tol})`
        : `not converged: accumulation bound ${solved.relError.toExponential(1)} > tol ${tol} after three step tolerances`,
    startRadius: run.startRadius * p.mass,
    matchRadius: run.matchRadius * p.mass,
    seriesTerms: run.seriesTerms,
  };
  if (solved.relError > tol) throw new ConvergenceError(`Proca radial solution did not reach relative accuracy ${tol}`, d);

  const a = horizonCombination(model, run, index);
  const combine = (states: Array<{ u: Complex[]; p: Complex[] }>): { u: Complex[]; p: Complex[] } => {
    const u: Complex[] = [];
    const P: Complex[] = [];
    for (let i = 0; i < N; i++) {
      let su: Complex = [0, 0];
      let sp: Complex = [0, 0];
      states.forEach((s, j) => {
        su = add(su, mul(a[j], s.u[i]));
        sp = add(sp, mul(a[j], s.p[i]));
      });
      u.push(su);
      P.push(sp);
    }
    return { u, p: P };
  };
  // far-channel amplitudes of the combination, rescaling undone
  const grow = Math.exp(run.logRescale);
  const cIn: Complex[] = [];
  const cOut: Complex[] = [];
  for (let c = 0; c < N; c++) {
    let zi: Complex = [0, 0];
    let zo: Complex = [0, 0];
    for (let j = 0; j < N; j++) {
      zi = add(zi, mul(run.amplitudesIn[c * N + j], a[j]));
      zo = add(zo, mul(run.amplitudesOut[c * N + j], a[j]));
    }
    cIn.push(scale(zi, grow));
    cOut.push(scale(zo, grow));
  }
  const byRadius = new Map(run.samples.map((s) => [s.r, s]));
  const farByRadius = new Map(run.farSamples.map((s) => [s.r, s.far]));
  const block = 4 * N;
  const stateAt = (r: number): { u: Complex[]; p: Complex[] } => {
    if (r < run.startRadius) return combine(Array.from({ length: N }, (_, j) => horizonSolution(model, j, r - 2)));
    const kept = byRadius.get(r);
    if (kept) {
      const g = Math.exp(kept.logRescale);
      const states = Array.from({ length: N }, (_, j) => ({
        u: Array.from(
          { length: N },
          (_, i): Complex => [kept.state[j * block + 2 * i] * g, kept.state[j * block + 2 * i + 1] * g],
        ),
        p: Array.from(
          { length: N },
          (_, i): Complex => [kept.state[j * block + 2 * N + 2 * i] * g, kept.state[j * block + 2 * N + 2 * i + 1] * g],
        ),
      }));
      return combine(states);
    }
    // beyond the matching radius: the far solutions (carried in phase form, or the series), incoming = conjugate of outgoing
    const u: Complex[] = Array.from({ length: N }, (): Complex => [0, 0]);
    const P: Complex[] = Array.from({ length: N }, (): Complex => [0, 0]);
    const carried = farByRadius.get(r);
    for (let c = 0; c < N; c++) {
      const s = carried ? carried[c] : outgoingFarSolution(model, c, r);
      if (!s.converged) throw new ConvergenceError(`far-zone series did not converge at r = ${r * p.mass}`, d);
      for (let i = 0; i < N; i++) {
        u[i] = add(u[i], add(mul(cIn[c], [s.u[i][0], -s.u[i][1]]), mul(cOut[c], s.u[i])));
        P[i] = add(P[i], add(mul(cIn[c], [s.p[i][0], -s.p[i][1]]), mul(cOut[c], s.p[i])));
      }
    }
    return { u, p: P };
  };
  const samples = inside.map((r, n): ProcaRadialSample => {
    const s = stateAt(r);
    const f = 1 - 2 / r;
    return {
      r: radii[n],
      u: s.u,
      // du/dr = P/f, in units of 1/M
      dudr: s.p.map((z) => scale(z, 1 / (f * p.mass))),
      flux: procaFlux(model, r, s.u, s.p),
    };
  });
  const { k } = farWaveNumbers(model);
  const weighted = (c: Complex[]) => k * c.reduce((acc, z, i) => acc + model.infinityWeights[i] * abs2(z), 0);
  let horizonFlux = 0;
  for (let i = 0; i < N; i++) {
    for (let j = 0; j < N; j++) {
      // conj(a_i) H_ij a_j
      const t = mul([a[i][0], -a[i][1]], mul(model.horizonFlux[i * N + j], a[j]));
      horizonFlux += t[0];
    }
  }
  const incomingFlux = weighted(cIn);
  const outgoingFlux = weighted(cOut);
  return {
    polarization: p.polarization,
    samples,
    horizonAmplitude: a,
    incomingAmplitude: cIn,
    outgoingAmplitude: cOut,
    horizonFlux,
    incomingFlux,
    outgoingFlux,
    gamma: horizonFlux / incomingFlux,
    reflection: outgoingFlux / incomingFlux,
    diagnostics: d,
  };
}
