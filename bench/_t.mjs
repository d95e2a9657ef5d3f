import { greybody } from '@penumbra/flux';
const cases = [[0.5, 10.5, 0.5, 0, 20], [2, 2, 2, 0.7, 20], [0, 50, 10, 0.7, 12], [0, 2, 1, 0.7, 0.5], [1, 30, 30, 0.99, 30],[0, 3, 3, 0.99, 2, 1.9975]];
const cpu = (f) => { f(); const t = process.cpuUsage(); let n = 0; do { f(); n++; } while ((process.cpuUsage(t).user + process.cpuUsage(t).system) < 4e5 && n < 100); const u = process.cpuUsage(t); return (u.user + u.system) / 1000 / n; };
for (const [spin, l, m, a, omega, mass] of cases) {
  const pr = { hole: { a }, mode: { field: mass ? { spin, mass } : { spin }, l, m }, omega };
  const r = {};
  for (let rep = 0; rep < 2; rep++) for (const osc of ['ode', 'riccati']) { const t = cpu(() => greybody(pr, { oscillation: osc })); r[osc] = Math.min(r[osc] ?? 1e9, t); }
  const g1 = greybody(pr, { oscillation: 'ode' }), g2 = greybody(pr, { oscillation: 'riccati' });
  console.log(JSON.stringify([spin, l, m, a, omega, mass]), 'ode', r.ode.toFixed(2), 'ric', r.riccati.toFixed(2), 'x', (r.ode / r.riccati).toFixed(2), 'rhs', g1.diagnostics.rhsEvaluations, g2.diagnostics.rhsEvaluations, 'diff', Math.abs(g2.gamma / g1.gamma - 1).toExponential(1), 'rel', g2.relError.toExponential(1));
}
