// Honesty of a Riccati step's own error estimate (radial's riccatiStep.ts),
// step by step: what a massless leg charges to the single-solve estimate is
// RICCATI_ERROR_FACTOR × the step's truncation estimate + its rounding
// estimate (hybridLeg.ts). For each mode the +s solution is started from the
// horizon series and carried out along the leg's ladder (x → 4x); on every
// rung where a Riccati step is worth trying and succeeds, the same start state
// is carried by the integrator at tol 1e-13 and 1e-14 (the references). The
// error is measured in √(|R|² + |R'/k|²), k the local wavenumber (as the
// two WKB amplitudes carry it, without blowing up at the nodes of a standing
// wave), after the best common phase rotation (a common phase of the state
// does not reach Γ). A step counts as resolved where the two references agree
// to 0.3 of its difference from them, and a Riccati step at a 1e4 times
// tighter tolerance agrees with them as well; that tight step alone is also
// a reference (convergence of the step itself), wherever it succeeds. Printed: resolved steps, how many have
// true error above the bare truncation estimate and above the charge, and the
// worst ratios. Modes: the tail grid (lib.mjs tailGrid) and 150 random modes
// (s ∈ {0, 1/2, 1, 2}, l < s + 40, any m, a ∈ {0, 0.7, 0.99, 0.9999},
// 0.05 ≤ Mω ≤ 30 log-uniform), at leg tolerances 1e-9 and 1e-11.
// Run: npx tsc -b && node bench/riccati-step.bench.mjs
import { kerrHole } from '@penumbra/kerr';
import {
  RICCATI_ERROR_FACTOR,
  integrateLeg,
  phaseRate,
  radialEquation,
  riccatiEquation,
  riccatiStep,
  riccatiWorthIt,
  startAtHorizon,
  validateProblem,
} from '@penumbra/radial/internal';
import { radialSeparationConstant, spheroidalEigenvalue } from '@penumbra/spheroidal';
import { fmt, seededRandom, tailGrid } from './lib.mjs';

const modes = tailGrid().map((p) => [p.mode.field.spin, p.mode.l, p.mode.m, p.hole.a, p.omega]);
const rand = seededRandom(7);
for (let i = 0; i < 150; i++) {
  const s = [0, 0.5, 1, 2][Math.floor(rand() * 4)];
  const l = s + Math.floor(rand() * 40);
  const m = -l + Math.floor(rand() * (2 * l + 1));
  modes.push([s, l, m, [0, 0.7, 0.99, 0.9999][Math.floor(rand() * 4)], 0.05 * 600 ** rand()]);
}

/**
 * The difference of state y (times f) from ref in the norm √(|R|² + |R'/k|²),
 * k the local wavenumber (no blow-up at the nodes of a standing wave), after
 * the best common phase rotation (phase-blind), relative to |ref|.
 */
function phaseBlind(y, f, ref, k) {
  const u = [f * y[0], f * y[1], (f * y[2]) / k, (f * y[3]) / k];
  const v = [ref[0], ref[1], ref[2] / k, ref[3] / k];
  // rotation e^{iθ} maximising Re⟨v, e^{iθ}u⟩
  let re = 0,
    im = 0;
  for (const j of [0, 2]) {
    re += v[j] * u[j] + v[j + 1] * u[j + 1];
    im += v[j + 1] * u[j] - v[j] * u[j + 1];
  }
  const n = Math.hypot(re, im) || 1;
  const c = re / n,
    s = im / n;
  let d2 = 0,
    r2 = 0;
  for (const j of [0, 2]) {
    const ur = c * u[j] - s * u[j + 1],
      ui = s * u[j] + c * u[j + 1];
    d2 += (ur - v[j]) ** 2 + (ui - v[j + 1]) ** 2;
    r2 += v[j] ** 2 + v[j + 1] ** 2;
  }
  return Math.sqrt(d2 / r2);
}

function stepsOf(spin, l, m, a, omega, tol, out) {
  const hole = kerrHole({ a });
  const A = spheroidalEigenvalue({ s: spin, l, m, c: a * omega }).A;
  const mode = validateProblem({ hole, s: spin, m, omega, lambda: radialSeparationConstant(A, a, omega, m) });
  const equation = radialEquation(hole, mode, hole.rPlus);
  const e = riccatiEquation(equation, hole.rPlus);
  const start = startAtHorizon(hole, mode, equation);
  let y = new Float64Array([start.R[0], start.R[1], start.dR[0], start.dR[1]]);
  const xEnd = Math.min(2000, Math.max(50, (4 * (l + 1)) / omega));
  const leg = (x0, x1, state, legTol) => {
    const seg = integrateLeg({
      hole,
      mode,
      equation,
      y: state,
      from: hole.rPlus + x0,
      fromOffset: x0,
      to: hole.rPlus + x1,
      stops: [],
      tol: legTol,
      integrator: 'gbs',
      maxSteps: 1e6,
      variable: 'R',
      counter: { evaluations: 0 },
      method: 'bench',
    });
    return seg.logScale;
  };
  const scale = new Float64Array(1);
  for (let x = start.x0; x < xEnd; x *= 4) {
    const x1 = Math.min(4 * x, xEnd);
    const fine = Float64Array.from(y);
    const fineScale = leg(x, x1, fine, 1e-14);
    if (riccatiWorthIt(e, x, x1)) {
      const k = phaseRate(e, x1) / x1;
      const ric = Float64Array.from(y);
      const step = riccatiStep(e, x, x1, ric, tol, scale);
      if (step.ok) {
        const ricScale = scale[0];
        const coarse = Float64Array.from(y);
        const coarseScale = leg(x, x1, coarse, 1e-13);
        const diff = phaseBlind(ric, Math.exp(ricScale - fineScale), fine, k);
        const spread = phaseBlind(coarse, Math.exp(coarseScale - fineScale), fine, k);
        // the same rung by a Riccati step at a 1e4 times tighter tolerance: a second, converged reference
        const tight = Float64Array.from(y);
        const tightStep = riccatiStep(e, x, x1, tight, Math.max(tol * 1e-4, 1e-15), scale);
        const tightApart = tightStep.ok ? phaseBlind(tight, Math.exp(scale[0] - fineScale), fine, k) : Number.POSITIVE_INFINITY;
        const selfDiff = tightStep.ok ? phaseBlind(ric, Math.exp(ricScale - scale[0]), tight, k) : Number.NaN;
        out.push({
          selfDiff,
          tightApart,
          mode: [spin, l, m, a, omega],
          x,
          diff,
          spread,
          bare: step.error * tol,
          charge: (RICCATI_ERROR_FACTOR * step.error + step.rounding) * tol,
        });
      }
    }
    // carry on from the finest reference, rescaled to a moderate size
    const n = Math.hypot(fine[0], fine[1]) || 1;
    y = fine.map((v) => v / n);
  }
}

for (const tol of [1e-9, 1e-11]) {
  const rows = [];
  let failed = 0;
  for (const [s, l, m, a, w] of modes) {
    try {
      stepsOf(s, l, m, a, w, tol, rows);
    } catch {
      failed++;
    }
  }
  // resolved: the two integrator references, and the tight Riccati step, agree to 0.3 of the difference
  const resolved = rows.filter((r) => r.spread < 0.3 * r.diff && r.tightApart < 0.3 * r.diff);
  const self = rows.filter((r) => Number.isFinite(r.selfDiff));
  const selfWorst = (key) => self.reduce((w, r) => Math.max(w, r.selfDiff / r[key]), 0);
  const overBare = resolved.filter((r) => r.diff > r.bare);
  const overCharge = resolved.filter((r) => r.diff > r.charge);
  const worst = (key) => resolved.reduce((w, r) => Math.max(w, r.diff / r[key]), 0);
  console.log(
    `leg tol ${tol}: ${rows.length} Riccati steps on ${modes.length - failed} modes (${failed} not started); resolved against the references ${resolved.length}; ` +
      `true error above the bare truncation estimate ${overBare.length} (worst ×${fmt(worst('bare'))}), above the charge ${overCharge.length} (worst true/charge ${fmt(worst('charge'))})`,
  );
  console.log(
    `  against the tight Riccati step alone (${self.length} steps): above the bare truncation estimate ${self.filter((r) => r.selfDiff > r.bare).length} (worst ×${fmt(selfWorst('bare'))}), above the charge ${self.filter((r) => r.selfDiff > r.charge).length} (worst ${fmt(selfWorst('charge'))})`,
  );
  for (const r of [...self].sort((p, q) => q.selfDiff / q.charge - p.selfDiff / p.charge).slice(0, 3)) {
    console.log(
      `    against the tight step, true/charge ${fmt(r.selfDiff / r.charge)}: s=${r.mode[0]} l=${r.mode[1]} m=${r.mode[2]} a=${r.mode[3]} Mω=${fmt(r.mode[4], 3)} rung x ${fmt(r.x, 3)}→×4: true ${fmt(r.selfDiff)}, bare ${fmt(r.bare)}, charge ${fmt(r.charge)}`,
    );
  }
  for (const r of [...resolved].sort((p, q) => q.diff / q.charge - p.diff / p.charge).slice(0, 4)) {
    console.log(
      `    true/charge ${fmt(r.diff / r.charge)}: s=${r.mode[0]} l=${r.mode[1]} m=${r.mode[2]} a=${r.mode[3]} Mω=${fmt(r.mode[4], 3)} rung x ${fmt(r.x, 3)}→×4: true ${fmt(r.diff)} (references ${fmt(r.spread)} apart), bare ${fmt(r.bare)}, charge ${fmt(r.charge)}`,
    );
  }
}
