// 'gbs' against 'odex' on random modes: the same algorithm, so the same doubles
// (Γ, reflection, steps, RHS evaluations of the first solve) and the CPU time of
// each. relError may differ: 'gbs' can charge the loop's own per-step error sum,
// which the odex package does not report, and so skip the check solve more often.
// Run: npx tsc -b && node bench/gbs-identity.bench.mjs [N]
import { greybody } from '@penumbra/flux';
import { fmt, seededRandom } from './lib.mjs';

const N = Number(process.argv[2] ?? 300);
const rand = seededRandom(7);
const spins = [0, 0.5, 1, 2];
const modes = [];
for (let i = 0; i < N; i++) {
  const spin = spins[Math.floor(rand() * 4)];
  const l = spin + Math.floor(rand() * 4);
  const m = -l + Math.floor(rand() * (2 * l + 1));
  const a = [0, 0.7, 0.99, 0.9999][Math.floor(rand() * 4)];
  const omega = 0.01 * 300 ** rand();
  modes.push({ hole: { a }, mode: { field: { spin }, l, m }, omega });
}
const run = (integrator) => {
  const out = [];
  const t0 = process.cpuUsage();
  for (const p of modes) {
    try {
      out.push(greybody(p, { integrator }));
    } catch (e) {
      out.push({ error: e.name });
    }
  }
  const t = process.cpuUsage(t0);
  return { out, ms: (t.user + t.system) / 1e3 };
};
run('gbs');
run('odex');
const a = run('gbs');
const b = run('odex');
let same = 0;
let estimateDiffers = 0;
const firstSolve = (r) => r.diagnostics.rhsEvaluations - (r.diagnostics.checkEvaluations ?? 0);
const diffs = [];
for (let i = 0; i < N; i++) {
  const x = a.out[i];
  const y = b.out[i];
  const eq =
    (x.error && x.error === y.error) ||
    (x.gamma === y.gamma &&
      Object.is(x.reflection, y.reflection) &&
      x.diagnostics.steps === y.diagnostics.steps &&
      firstSolve(x) === firstSolve(y));
  if (!x.error && x.relError !== y.relError) estimateDiffers++;
  if (eq) same++;
  else diffs.push({ p: modes[i], gbs: x.gamma ?? x.error, odex: y.gamma ?? y.error });
}
console.log(`${N} random modes: ${same} bit-identical (Γ, reflection, steps, first-solve RHS evaluations)`);
console.log(`  relError differs in ${estimateDiffers} (the per-step error sum against the steps × tol bound)`);
for (const d of diffs.slice(0, 5)) console.log('  differs:', JSON.stringify(d));
console.log(`CPU: gbs ${fmt(a.ms / N)} ms/mode, odex ${fmt(b.ms / N)} ms/mode, ratio ${fmt(b.ms / a.ms)}`);
