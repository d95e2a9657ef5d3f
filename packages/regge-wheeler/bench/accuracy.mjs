// Accuracy and speed of schwarzschildGreybody over the required domain:
// spins 0, 1/2, 1, 2; l ≤ 6; 1e-3 ≤ Mω ≤ 5; rows with Γ ≥ 1e-30.
// Reference: one integration with step tolerance 1e-16, start radius
// 2M(1 + 0.05) and twice the matching radius (self-consistency, not an
// external check; the external one is test/reference-fixture.test.ts).
// Also prints the step-tolerance error model used by stepToleranceFor().
// Run from /work/main:  npx tsc -b && node packages/regge-wheeler/bench/accuracy.mjs
import { schwarzschildGreybody } from '../dist/index.js';
import { integrateOnce } from '../dist/internal.js';

const omegas = [1e-3, 3e-3, 0.01, 0.03, 0.1, 0.2, 0.3, 0.5, 0.8, 1.2, 2, 3, 5];
const spins = [0, 0.5, 1, 2];
let worst = { rel: 0 };
let worstEstimateRatio = 0;
const times = [];
let rows = 0;
for (const spin of spins) {
  for (let l = spin; l <= 6.5 && l - spin <= 6; l++) {
    for (const omega of omegas) {
      const t0 = performance.now();
      const r = schwarzschildGreybody({ field: { spin }, l, omega });
      times.push(performance.now() - t0);
      if (r.gamma < 1e-30) continue;
      const ref = integrateOnce(
        { field: { spin }, l, omega },
        { stepTolerance: 1e-16, startOffset: 0.05, matchRadius: 2 * r.diagnostics.matchRadius },
      );
      const rel = Math.abs(r.gamma / ref.gamma - 1);
      rows++;
      if (rel > worst.rel) worst = { rel, spin, l, omega, relError: r.diagnostics.errorEstimate };
      worstEstimateRatio = Math.max(worstEstimateRatio, rel / r.diagnostics.errorEstimate);
    }
  }
}
times.sort((a, b) => a - b);
console.log(`rows with Γ ≥ 1e-30: ${rows}`);
console.log(
  `largest |Γ/Γ_ref − 1| = ${worst.rel.toExponential(2)} at s=${worst.spin} l=${worst.l} Mω=${worst.omega} (its errorEstimate ${worst.relError?.toExponential(2)})`,
);
console.log(`largest (actual error)/(errorEstimate) = ${worstEstimateRatio.toFixed(3)}`);
console.log(
  `time per mode (both integrations), ms: median ${times[times.length >> 1].toFixed(1)}, 90% ${times[Math.floor(0.9 * times.length)].toFixed(1)}, max ${times[times.length - 1].toFixed(1)}`,
);

console.log('\nstep-tolerance model: relative error of Γ vs Cash–Karp step tolerance');
for (const [spin, l, omega] of [
  [0, 0, 5],
  [2, 6, 1.2],
  [1, 3, 0.8],
  [0.5, 2.5, 0.02],
]) {
  const ref = integrateOnce({ field: { spin }, l, omega }, { stepTolerance: 1e-16, startOffset: 0.1 });
  const line = [`s=${spin} l=${l} Mω=${omega}`];
  for (const st of [1e-10, 1e-12, 1e-14]) {
    const a = integrateOnce({ field: { spin }, l, omega }, { stepTolerance: st, startOffset: 0.15, matchRadius: 10 });
    line.push(`${st.toExponential(0)}: ${(a.gamma / ref.gamma - 1).toExponential(1)} (${a.steps} steps)`);
  }
  console.log(`  ${line.join(' | ')}`);
}
