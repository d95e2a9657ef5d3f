// f(M, a*), g(M, a*) with massive species, and the evaporation they drive.
// Run after building:  npx tsc -b && node bench/mass-loss.bench.mjs [--quick] [--skip-direct] [--tol 1e-4] [--spins 0,0.5,1]
// Prints:
//  (1) the regeneration time of the shipped tables (written into the modules by
//      their scripts) against the one-hour budget on two cores, as a ratio;
//  (2) the tabulated f, g of one dof of each massive spin against massLossAt (direct
//      emissionTotals at --tol) at the midpoints of the ratio table's cells (off-grid in Mμ
//      and in a*), with the local error stated by rates.at(M, a*).error, as ratios true/stated;
//      --quick: a few points per spin; spin 1 also at Mμ = 0.003 (the W of a 1e10 g hole) in the full run;
//  (2c) the Standard Model at 1e10 g (W, Z in the first Mμ cell) against massLossAt;
//  (2b) leave-one-node-out: each interior node of the shipped table (in θ, in Mμ, both)
//      left out in turn and predicted from the rest, against its stated error (no solves);
//  (3) f(M) of the Standard Model at a* = 0 in MacGibbon's normalisation
//      (Phys. Rev. D 44, 376 (1991), from memory: dM/dt = −5.34e25 f (M/g)⁻² g/s), with its local error;
//  (4) the mass whose lifetime is the age of the universe (a* = 0 and 0.5) against
//      about 5e14 g (Carr, Kohri, Sendouda & Yokoyama, Phys. Rev. D 81, 104019 (2010), from memory),
//      the lifetime, error and final stage of 1e10 g and 1e15 g holes with a* = 0, 0.5, 0.9, 0.99, and the time of
//      one Standard-Model f at one (M, a*) on demand against the 10 s budget.
// Results: bench/results/mass-loss-<date>.json.
import os from 'node:os';
import {
  FIELD_MASS_PER_GRAM_GEV,
  bundledMassiveRateTable,
  evaporateHole,
  massForLifetime,
  massLossAt,
  massLossRates,
  resolveContent,
} from '@penumbra/emission';
import { SHIPPED_MASSIVE_RATE_TABLE, SHIPPED_PAGE_TABLE, withoutNode } from '@penumbra/emission/internal';
import { CODATA2018 } from '@penumbra/kerr';
import { writeResult } from './lib.mjs';

const args = process.argv.slice(2);
const opt = (name, dflt) => {
  const i = args.indexOf(name);
  return i >= 0 ? args[i + 1] : dflt;
};
const quick = args.includes('--quick');
// --spins 0,0.5: the direct checks of (2) for these field spins only (default all three)
const spins = opt('--spins', '0,0.5,1').split(',').map(Number);
const tol = Number(opt('--tol', 1e-4));
const started = performance.now();
const out = {
  machine: `${os.cpus()[0]?.model ?? '?'} × ${os.cpus().length}, load ${os.loadavg()[0].toFixed(1)}`,
  quick,
  directTol: tol,
};
console.log(`machine: ${out.machine}`);
const e = (x, d = 1) => x.toExponential(d);

// (1) regeneration time
const ratio = SHIPPED_MASSIVE_RATE_TABLE;
const regen = ratio.seconds + SHIPPED_PAGE_TABLE.seconds;
out.regeneration = {
  massiveSeconds: ratio.seconds,
  pageSeconds: SHIPPED_PAGE_TABLE.seconds,
  grid: `${ratio.spins.map((r) => `spin ${r.spin}: ${r.fieldMass.length} Mμ × ${r.aStar.length} a*`).join(', ')}; tol ${ratio.tol}`,
  runSeconds: ratio.runSeconds,
  ratioToHour: regen / 3600,
};
console.log(
  `(1) tables regenerated in ${ratio.seconds.toFixed(0)} s (massive ratios, ${out.regeneration.grid}${ratio.runSeconds === undefined ? '' : `; ${ratio.runSeconds.toFixed(0)} s of it for the nodes new in its last generation`}) + ${SHIPPED_PAGE_TABLE.seconds.toFixed(0)} s (Page table) = ${(regen / 3600).toFixed(2)} × the one-hour budget (two workers; as recorded in the modules: node times summed over the generations that made them, some on a loaded machine; one run from nothing is measured by bench/rate-table-regeneration.bench.mjs)`,
);

// (2) off-grid accuracy of the tables against direct solves, one dof of each massive spin
const table = bundledMassiveRateTable();
const mids = (xs) => xs.slice(0, -1).map((x, i) => 0.5 * (x + xs[i + 1]));
// each spin's own cell midpoints in Mμ (past the first cell) and in θ (plus a* = 0)
const rowOf = (spin) => table.spins.find((r) => r.spin === spin);
const muMid = (spin) => mids(rowOf(spin).fieldMass);
const aMid = (spin) => [0, ...mids(rowOf(spin).theta).map(Math.sin)];
const every = (xs, k) => xs.filter((_, i) => i % k === 0);
const probes = quick
  ? {
      0: { mu: [muMid(0)[2], muMid(0)[7], muMid(0)[12]], a: [aMid(0)[0], aMid(0)[3]] },
      0.5: { mu: [muMid(0.5)[7]], a: [aMid(0.5)[3]] },
      1: { mu: [muMid(1)[4]], a: [aMid(1)[0]] },
    }
  : {
      // every spin also in its first Mμ cell (0 to 0.01), where the row Mμ = 0 is exact (spins 0, 1/2)
      0: { mu: muMid(0), a: every(aMid(0), 2) },
      0.5: { mu: [muMid(0.5)[0], ...every(muMid(0.5).slice(1), 2)], a: [aMid(0.5)[0], aMid(0.5)[2], aMid(0.5)[5]] },
      // spin 1 also in its first Mμ cell: Mμ 0.003 is the W of a 1e10 g hole, on the θ interpolation of the row Mμ = 0
      1: { mu: [0.003, muMid(1)[4], muMid(1)[7]], a: [aMid(1)[0], aMid(1)[2], aMid(1)[6], aMid(1)[12]] },
    };
out.offGrid = [];
if (!args.includes('--skip-direct')) {
  console.log(
    `(2) tabulated f, g (one dof, M = 1 g) against massLossAt at tol ${tol}; stated = rates.at(M, a*).error + direct error:`,
  );
  for (const spin of spins)
    for (const mu of probes[spin].mu)
      for (const a of probes[spin].a) {
        const species = [{ name: `s${spin}`, spin, dof: 1, massGeV: mu / FIELD_MASS_PER_GRAM_GEV }];
        const rates = massLossRates({ species });
        const t0 = performance.now();
        let direct;
        try {
          direct = massLossAt({ species, massGrams: 1, aStar: a }, { tol });
        } catch (err) {
          // a direct solve that fails is no reference: reported and left out of the summary
          const message = String(err?.message ?? err).slice(0, 120);
          out.offGridFailed = [...(out.offGridFailed ?? []), { spin, mu, aStar: a, message }];
          console.log(`   spin ${spin} Mμ ${mu.toFixed(4)} a* ${a.toFixed(3)}: direct solve failed (${message})`);
          continue;
        }
        const seconds = (performance.now() - t0) / 1000;
        const tab = rates.at(1, a);
        const errF = Math.abs(tab.f / direct.f - 1);
        const statedF = tab.error.f + direct.fRelError;
        // g is not computed directly at a* = 0 (a limit there)
        const errG = a > 0 ? Math.abs(tab.g / direct.g - 1) : null;
        const statedG = a > 0 ? tab.error.g + direct.gRelError : null;
        out.offGrid.push({
          spin,
          mu,
          aStar: a,
          errF,
          statedF,
          ratioF: errF / statedF,
          errG,
          statedG,
          ratioG: a > 0 ? errG / statedG : null,
          seconds,
        });
        console.log(
          `   spin ${spin} Mμ ${mu.toFixed(4)} a* ${a.toFixed(3)}: |Δf|/f ${e(errF)} stated ${e(statedF)} (ratio ${(errF / statedF).toFixed(2)})` +
            (a > 0 ? `, |Δg|/g ${e(errG)} stated ${e(statedG)} (ratio ${(errG / statedG).toFixed(2)})` : '') +
            `; direct ${seconds.toFixed(1)} s`,
        );
      }
  const rf = out.offGrid.map((r) => r.ratioF);
  const rg = out.offGrid.filter((r) => r.ratioG !== null).map((r) => r.ratioG);
  out.offGridSummary = {
    points: rf.length,
    worstRatioF: Math.max(...rf),
    worstRatioG: Math.max(...rg),
    withinF: rf.filter((r) => r <= 1).length,
    withinG: rg.filter((r) => r <= 1).length,
    gPoints: rg.length,
  };
  console.log(
    `   worst true/stated: f ${out.offGridSummary.worstRatioF.toFixed(2)} (${out.offGridSummary.withinF}/${rf.length} within), g ${out.offGridSummary.worstRatioG.toFixed(2)} (${out.offGridSummary.withinG}/${rg.length} within)`,
  );
}

// (2c) the Standard Model at 1e10 g (T_H ≈ 1 TeV: W, Z, Higgs, top at Mμ 0.003–0.0065, in the first Mμ cell)
// against massLossAt: partons only (the confinement switch is fully on there), species below the
// solvers' lowest Mμ (1e-5: u, d, s, e, μ) taken massless in both
if (!args.includes('--skip-direct')) {
  const light = resolveContent(['standard-model'])
    .filter((s) => s.qcd !== 'hadron')
    .map((s) => (s.massGeV * 1e10 * FIELD_MASS_PER_GRAM_GEV < 1e-5 ? { ...s, massGeV: 0 } : s));
  const rates = massLossRates({ species: light });
  out.sm1e10 = [];
  console.log(`(2c) Standard Model at 1e10 g, tabulated f, g against massLossAt at tol ${tol}:`);
  for (const a of quick ? [0.5] : [0, 0.3, 0.6, 0.9]) {
    const t0 = performance.now();
    const d = massLossAt({ species: light, massGrams: 1e10, aStar: a }, { tol });
    const seconds = (performance.now() - t0) / 1000;
    const p = rates.at(1e10, a);
    const errF = Math.abs(p.f / d.f - 1);
    const statedF = p.error.f + d.fRelError;
    const errG = a > 0 ? Math.abs(p.g / d.g - 1) : null;
    const statedG = a > 0 ? p.error.g + d.gRelError : null;
    out.sm1e10.push({ aStar: a, errF, statedF, errG, statedG, tableErrorF: p.error.f, seconds });
    console.log(
      `   a* ${a}: |Δf|/f ${e(errF)} stated ${e(statedF)} (ratio ${(errF / statedF).toFixed(2)}; table ${e(p.error.f)})` +
        (a > 0 ? `, |Δg|/g ${e(errG)} stated ${e(statedG)} (ratio ${(errG / statedG).toFixed(2)})` : '') +
        `; direct ${seconds.toFixed(0)} s`,
    );
  }
}

// (2b) leave-one-node-out, no solves: the node left out is the truth at its own (Mμ, a*)
{
  const cases = [];
  for (const spin of [0, 0.5, 1]) {
    const row = rowOf(spin);
    const nT = row.theta.length;
    const nM = row.fieldMass.length;
    for (let j = 1; j < nT - 1; j++) for (let i = 1; i < nM; i++) cases.push({ spin, drop: { theta: j }, i, j });
    for (let i = 2; i < nM - 1; i++) for (let j = 0; j < nT; j++) cases.push({ spin, drop: { fieldMass: i }, i, j });
    for (let j = 1; j < nT - 1; j++)
      for (let i = 2; i < nM - 1; i++) cases.push({ spin, drop: { theta: j, fieldMass: i }, i, j });
  }
  const ratios = { f: [], g: [] };
  const worst = { f: { ratio: 0 }, g: { ratio: 0 } };
  for (const c of cases) {
    const { spin } = c;
    const row = rowOf(spin);
    const species = [{ name: 'x', spin, dof: 1, massGeV: row.fieldMass[c.i] / FIELD_MASS_PER_GRAM_GEV }];
    const a = row.aStar[c.j];
    const truth = massLossRates({ species }).at(1, a);
    const left = massLossRates({ species, massiveTable: withoutNode(table, c.drop) }).at(1, a);
    const rf = Math.abs(left.f / truth.f - 1) / left.error.interpolation.f;
    ratios.f.push(rf);
    if (rf > worst.f.ratio) worst.f = { ratio: rf, spin, mu: row.fieldMass[c.i], aStar: a, drop: c.drop };
    // g: not where the left-out θ node feeds the a* = 0 torque limit (the table's θ = 0 torque comes from nodes 1 and 2)
    if (a > 0 && !(c.drop.theta !== undefined && c.drop.theta <= 2)) {
      const rg = Math.abs(left.g / truth.g - 1) / left.error.interpolation.g;
      ratios.g.push(rg);
      if (rg > worst.g.ratio) worst.g = { ratio: rg, spin, mu: row.fieldMass[c.i], aStar: a, drop: c.drop };
    }
  }
  const share = (xs, t) => xs.filter((r) => r <= t).length / xs.length;
  out.leaveOneOut = {
    casesF: ratios.f.length,
    casesG: ratios.g.length,
    withinStatedF: share(ratios.f, 1),
    withinStatedG: share(ratios.g, 1),
    within2xF: share(ratios.f, 2),
    within2xG: share(ratios.g, 2),
    worstF: worst.f,
    worstG: worst.g,
  };
  console.log(
    `(2b) leave-one-node-out (θ, Mμ, both; spins 0, 1/2, 1): true error within the stated interpolation error in ${(100 * out.leaveOneOut.withinStatedF).toFixed(0)} % of ${ratios.f.length} cases for f, ${(100 * out.leaveOneOut.withinStatedG).toFixed(0)} % of ${ratios.g.length} for g; within 2× in ${(100 * out.leaveOneOut.within2xF).toFixed(0)} % / ${(100 * out.leaveOneOut.within2xG).toFixed(0)} %; worst ${worst.f.ratio.toFixed(2)}× (f: spin ${worst.f.spin}, Mμ ${worst.f.mu}, a* ${worst.f.aStar.toFixed(3)}), ${worst.g.ratio.toFixed(2)}× (g: spin ${worst.g.spin}, Mμ ${worst.g.mu}, a* ${worst.g.aStar.toFixed(3)})`,
  );
}

// (3) MacGibbon's normalisation
const sm = resolveContent(['standard-model']);
const smRates = massLossRates({ species: sm });
const { G, hbar, c } = CODATA2018;
const gramsCubedPerSecond = ((hbar * c ** 4) / G ** 2) * 1e9;
const toMacGibbon = (f) => (f * gramsCubedPerSecond) / 5.34e25;
out.macGibbon = [];
console.log(
  '(3) f(M) of the Standard Model at a* = 0 in MacGibbon normalisation (f = 1: photons, gravitons, 3 ν), with its local relative error:',
);
for (let ex = 8; ex <= 20; ex += 0.5) {
  const M = 10 ** ex;
  const p = smRates.at(M, 0);
  const T = 1 / (8 * Math.PI * M * FIELD_MASS_PER_GRAM_GEV);
  out.macGibbon.push({ massGrams: M, temperatureGeV: T, f: toMacGibbon(p.f), relError: p.error.f });
  console.log(`   M = 1e${ex.toFixed(1)} g  T_H = ${e(T, 2)} GeV  f = ${toMacGibbon(p.f).toFixed(3)}  (±${e(p.error.f)})`);
}
out.tableWide = { interpolationError: smRates.interpolationError, nodeError: smRates.nodeError };
console.log(
  `    table-wide maxima for this content: interpolation f ${e(smRates.interpolationError.f)}, g ${e(smRates.interpolationError.g)}; node f ${e(smRates.nodeError.f)}, g ${e(smRates.nodeError.g)}`,
);

// (4) age of the universe, 1e15 g histories, on-demand speed
out.ageMass = [];
for (const a0 of [0, 0.5]) {
  const age = massForLifetime({ rates: smRates, aStar0: a0 });
  out.ageMass.push({ aStar0: a0, massGrams: age.massGrams, ratioTo5e14: age.massGrams / 5e14, relError: age.relError });
  console.log(
    `(4) mass with lifetime 13.787 Gyr, a* = ${a0}: ${age.massGrams.toExponential(4)} g (${(age.massGrams / 5e14).toFixed(3)} × 5e14 g), rel. error ${e(age.relError)}`,
  );
}
out.history = [];
for (const m0 of [1e10, 1e15])
  for (const a0 of [0, 0.5, 0.9, 0.99]) {
    const ev = evaporateHole({ rates: smRates, mass: m0, unit: 'g', aStar0: a0 }, { finalSeconds: [1] });
    const st = ev.finalStages[0];
    out.history.push({
      massGrams: m0,
      aStar0: a0,
      lifetimeSeconds: ev.lifetimeSeconds,
      relError: ev.diagnostics.errorEstimate,
      tableError: ev.diagnostics.tableError,
      halvedTolChange: ev.diagnostics.halvedTolChange,
      energyBalance: ev.energyBalance.relError,
      final1s: { massGrams: st.massGrams, energyGeV: st.energyGeV, relError: st.relError },
    });
    console.log(
      `    ${m0.toExponential(0)} g, a* = ${a0}: lifetime ${ev.lifetimeSeconds.toExponential(4)} s (rel. error ${e(ev.diagnostics.errorEstimate)}: tables ${e(ev.diagnostics.tableError)}, ODE ${e(ev.diagnostics.halvedTolChange)}), energy balance ${e(ev.energyBalance.relError)}, last 1 s: ${st.massGrams.toExponential(3)} g = ${st.energyGeV.toExponential(3)} GeV (±${e(st.relError)})`,
    );
  }
if (!args.includes('--skip-direct')) {
  const t0 = performance.now();
  const d = massLossAt({ species: sm, massGrams: 1e15, aStar: 0.5 }, { tol: 1e-3 });
  const s = (performance.now() - t0) / 1000;
  out.onDemand = { seconds: s, solves: d.diagnostics.solves, tol: 1e-3 };
  console.log(
    `    on demand, SM at 1e15 g, a* = 0.5, tol 1e-3: ${s.toFixed(1)} s for ${d.diagnostics.solves} totals solves (${(s / 10).toFixed(2)} × the 10 s budget; massLossAt has no confinement switch, so not compared with the table)`,
  );
}
out.benchSeconds = (performance.now() - started) / 1000;
console.log(`bench: ${out.benchSeconds.toFixed(0)} s`);
writeResult('mass-loss', out);
