// Sweep of the documented range (every spin × Mω up to 30 × |a| up to 0.99999 ×
// l up to 200, sampled): cost and accuracy of greybody at the default
// tolerance, each against something outside the code path:
//   - flux conservation |Γ + R − 1| (R from the independent −|s| solve),
//   - Γ against a solve at tol 1e-12 (where that solve converges),
//   - σ(Mω = 30, a = 0) against the geometric-optics 27πM² (Misner, Thorne &
//     Wheeler, Gravitation, 1973), every spin,
//   - the s = 2, l = m = 2 superradiant peak against ~138 % as a → M
//     (Teukolsky & Press 1974, value from memory).
// Times are process CPU time (a shared machine preempts wall time).
// Run: npm run build && node bench/range.bench.mjs [--quick]
// Results: bench/results/range-<date>.json.
import { absorptionCrossSection, greybody } from '@penumbra/flux';
import { kerrHole } from '@penumbra/kerr';
import { fmt, table, writeResult } from './lib.mjs';

const quick = process.argv.includes('--quick');
const SPINS = [0, 0.5, 1, 2];
const AS = quick ? [0, 0.99999] : [0, 0.9, 0.9999, 0.99999];
const OMEGAS = quick ? [1, 30] : [0.1, 1, 10, 20, 30];
const LS = quick ? [2, 200] : [2, 50, 105, 150, 200];

const cpuMs = () => process.cpuUsage().user / 1000;
const lm = (spin, l, m) => (spin === 0.5 ? { l: l - 0.5, m: m < 0 ? m + 0.5 : Math.max(m - 0.5, 0.5) } : { l, m });

function sweep() {
  const rows = [];
  for (const spin of SPINS)
    for (const a of AS)
      for (const omega of OMEGAS)
        for (const l of LS)
          for (const m of [l, 0, -l]) {
            const problem = { hole: { a }, mode: { field: { spin }, ...lm(spin, l, m) }, omega };
            const t0 = cpuMs();
            const row = { spin, a, omega, l: problem.mode.l, m: problem.mode.m };
            try {
              const r = greybody(problem);
              Object.assign(row, {
                ok: true,
                cpuMs: cpuMs() - t0,
                gamma: r.gamma,
                log10Gamma: r.log10Gamma,
                residual: r.residual,
                relError: r.relError,
                steps: r.diagnostics.steps,
              });
            } catch (e) {
              Object.assign(row, { ok: false, cpuMs: cpuMs() - t0, error: `${e.name}: ${e.message.slice(0, 120)}` });
            }
            rows.push(row);
            // one line per mode as it is measured, so a partial run still reports
            console.log(
              row.ok
                ? `  s=${spin} a=${a} Mω=${omega} l=${row.l} m=${row.m}: |Γ+R−1| ${fmt(row.residual)}, relError ${fmt(row.relError)}, ${row.steps} steps, ${fmt(row.cpuMs)} CPU ms`
                : `  s=${spin} a=${a} Mω=${omega} l=${row.l} m=${row.m}: ${row.error}`,
            );
          }
  return rows;
}

function tightChecks() {
  // Γ at the default tolerance against tol 1e-12, at a = 0.99999 (one mode per spin and frequency).
  const out = [];
  for (const spin of SPINS)
    for (const omega of quick ? [0.5] : [0.1, 0.5, 3, 10]) {
      const problem = { hole: { a: 0.99999 }, mode: { field: { spin }, ...lm(spin, 2, 2) }, omega };
      try {
        const r = greybody(problem);
        const t = greybody(problem, { tol: 1e-12, reflection: false });
        out.push({ spin, omega, rel: Math.abs(r.gamma / t.gamma - 1), relError: r.relError });
      } catch (e) {
        out.push({ spin, omega, error: `${e.name}: ${e.message.slice(0, 100)}` });
      }
    }
  return out;
}

function crossSections() {
  const out = [];
  for (const spin of SPINS) {
    const t0 = cpuMs();
    const r = absorptionCrossSection({ hole: { a: 0 }, field: { spin }, omega: 30 }, { tol: 1e-6 });
    out.push({
      spin,
      sigma: r.sigma,
      ratio: r.sigma / (27 * Math.PI),
      lMax: r.diagnostics.lMax,
      relError: r.relError,
      cpuS: (cpuMs() - t0) / 1000,
    });
  }
  return out;
}

function peak(a) {
  const top = 2 * kerrHole({ a }).omegaH;
  const f = (w) =>
    greybody({ hole: { a }, mode: { field: { spin: 2 }, l: 2, m: 2 }, omega: w }, { tol: 1e-7, reflection: false }).amplification;
  let lo = 0.9 * top,
    hi = 0.99999 * top;
  const g = (Math.sqrt(5) - 1) / 2;
  for (let i = 0; i < 25; i++) {
    const x1 = hi - g * (hi - lo),
      x2 = lo + g * (hi - lo);
    if (f(x1) > f(x2)) hi = x2;
    else lo = x1;
  }
  return { a, peak: f((lo + hi) / 2), omegaOverTop: (lo + hi) / 2 / top };
}

const t0 = cpuMs();
const rows = sweep();
const ok = rows.filter((r) => r.ok);
console.log(
  `greybody sweep: ${rows.length} modes (spins ${SPINS}, a ${AS}, Mω ${OMEGAS}, l ${LS}, m ∈ {l, 0, −l}), ${ok.length} converged`,
);
console.log(
  table(
    ['a', 'modes', 'failed', 'max |Γ+R−1|', 'max relError', 'median CPU ms', 'max CPU ms', 'max steps'],
    AS.map((a) => {
      const all = rows.filter((r) => r.a === a);
      const good = all.filter((r) => r.ok);
      const cpu = good.map((r) => r.cpuMs).sort((x, y) => x - y);
      return [
        String(a),
        String(all.length),
        String(all.length - good.length),
        fmt(Math.max(...good.map((r) => r.residual))),
        fmt(Math.max(...good.map((r) => r.relError))),
        fmt(cpu[cpu.length >> 1]),
        fmt(cpu[cpu.length - 1]),
        String(Math.max(...good.map((r) => r.steps))),
      ];
    }),
  ),
);
for (const r of rows.filter((x) => !x.ok))
  console.log(`  failed: s=${r.spin} a=${r.a} Mω=${r.omega} l=${r.l} m=${r.m}: ${r.error}`);
const l200 = ok.filter((r) => r.l >= 199.5 && r.omega === 30);
console.log(
  `l = 200, Mω = 30: ${l200.length} modes, max |Γ+R−1| ${fmt(Math.max(...l200.map((r) => r.residual)))}, CPU ms median ${fmt(l200.map((r) => r.cpuMs).sort((x, y) => x - y)[l200.length >> 1])}, max ${fmt(Math.max(...l200.map((r) => r.cpuMs)))}`,
);

const tight = tightChecks();
console.log('\nΓ at a = 0.99999, l = m = 2 (default tol 1e-8) against tol 1e-12:');
console.log(
  table(
    ['s', 'Mω', '|Γ/Γ_tight − 1|', 'relError'],
    tight.map((t) => [String(t.spin), String(t.omega), t.error ?? fmt(t.rel), t.error ? '' : fmt(t.relError)]),
  ),
);

const peaks = (quick ? [0.9999, 0.99999] : [0.999, 0.9999, 0.99999]).map(peak);
console.log('\ns = 2, l = m = 2 peak amplification (against ~138 % as a → M, Teukolsky & Press 1974, from memory):');
console.log(
  table(
    ['a', 'peak', 'peak / 1.38', 'ω/(mΩ_H)'],
    peaks.map((p) => [String(p.a), fmt(p.peak, 4), fmt(p.peak / 1.38, 4), fmt(p.omegaOverTop, 5)]),
  ),
);

const sigmas = crossSections();
if (sigmas.length) {
  console.log('\nσ at Mω = 30, a = 0 (tol 1e-6) against 27πM² = 84.823:');
  console.log(
    table(
      ['s', 'σ/M²', 'σ/27π', 'lMax', 'relError', 'CPU s'],
      sigmas.map((x) => [String(x.spin), fmt(x.sigma, 7), fmt(x.ratio, 6), String(x.lMax), fmt(x.relError), fmt(x.cpuS, 3)]),
    ),
  );
}
console.log(`\ntotal CPU ${fmt((cpuMs() - t0) / 1000, 3)} s`);
writeResult('range', { quick, rows, tight, peaks, sigmas });
