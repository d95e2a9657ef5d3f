#!/usr/bin/env node
/**
 * Generates src/massiveRateTableData.ts: the ratios of massive to massless
 * per-dof power and torque of field spins 0, 1/2 and 1 over the field mass Mμ
 * and a* (uniform in θ = arcsin a*), each spin on its own nodes, the table
 * behind bundledMassiveRateTable() and massLossRates(): f(M, a*), g(M, a*) of
 * any content for holes of any mass (Mμ = G M m/(ħ c)). A TypeScript module,
 * so the package needs no file access.
 *
 * Run from the repository root after `npx tsc -b`, then rebuild:
 *   node packages/emission/scripts/make-massive-rate-table.mjs [--grid SPEC]... [--tol 1e-3] [--a-max 0.99] [--reuse-shipped] [--assemble]
 * --grid SPIN/POINTS/MU,MU,...: the nodes of one spin, POINTS a* nodes and the
 *   field masses Mμ > 0 (the row Mμ = 0 is added); repeat per spin. Without
 *   --grid: SHIPPED_GRIDS below (the shipped table). Spins not given are left out.
 * --reuse-shipped: a node already in the shipped table (same spin, Mμ > 0, a* and
 *   tol) keeps its shipped ratios, so only new nodes (and the row Mμ = 0, massless
 *   solves of a fraction of a second) are solved; the seconds the
 *   shipped table records for its nodes are carried over (the table's cost from
 *   nothing) and this run's own seconds are printed and written beside them.
 * --assemble: no solve is run; the module is written from PARTIAL. A spin whose
 *   nodes are not all done falls back to every other a* node (and then every
 *   fourth...) when those are complete; with fewer than 3 a* nodes it is left
 *   out. A field mass with a failed node (reported, not in PARTIAL) is left out
 *   of its spin, at most two per spin.
 * Work is split over worker threads (one spin, field mass and a* per task), the
 * new field masses at the a* nodes of the shipped grid first, then the new a*
 * nodes in increasing a*: a cut-short run assembles to the denser Mμ grid.
 * Each finished task is appended to PARTIAL (env MASSIVE_TABLE_PARTIAL, default
 * massive-rate-table.partial.jsonl in the working directory) with its CPU
 * seconds; a rerun skips the tasks found there (resume after an interruption).
 * Environment: MASSIVE_TABLE_WORKERS (default 2) worker threads;
 * MASSIVE_TABLE_OUT the module's path (default src/massiveRateTableData.ts).
 */
import { Worker, isMainThread, parentPort, workerData } from 'node:worker_threads';
import { appendFileSync, existsSync, readFileSync, writeFileSync } from 'node:fs';
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';

const GENERATED_BY = 'packages/emission/scripts/make-massive-rate-table.mjs';

/**
 * The shipped node sets: Mμ dense from 0.12 to 0.5 where the ratios fall
 * fastest (towards the Boltzmann regime; the spin-1/2 ratio bends most between
 * 0.17 and 0.35), more a* nodes where they are cheap (the scalar: a fraction
 * of a second a node, so 17 a* nodes and Mμ to 0.6, past the pions of a
 * 1e15 g hole). The massive vector has 17 a* nodes too: its row Mμ = 0 (the
 * (2 P̂₁ + P̂₀)/3 mixture over P̂₁, where the W and Z of holes of 1e10 g and
 * lighter sit) falls from 2.1 to 0.74 over a*, and on 9 nodes its θ
 * interpolation still dominated their lifetime error; a node costs 1–4 s of CPU.
 */
export const SHIPPED_GRIDS = [
  {
    spin: 0,
    points: 17,
    masses: [
      0.01, 0.025, 0.05, 0.08, 0.1, 0.12, 0.145, 0.17, 0.19, 0.21, 0.23, 0.25, 0.275, 0.3, 0.325, 0.35, 0.37, 0.39, 0.42, 0.45,
      0.475, 0.5, 0.55, 0.6,
    ],
  },
  {
    spin: 0.5,
    points: 9,
    masses: [
      0.01, 0.025, 0.05, 0.08, 0.12, 0.145, 0.17, 0.19, 0.21, 0.23, 0.25, 0.275, 0.3, 0.325, 0.35, 0.375, 0.4, 0.425, 0.45, 0.5,
    ],
  },
  { spin: 1, points: 17, masses: [0.01, 0.025, 0.05, 0.08, 0.12, 0.17, 0.25, 0.35, 0.5] },
];

/** One --grid value, SPIN/POINTS/MU,MU,... */
export function parseGrid(spec) {
  const [spin, points, masses] = spec.split('/');
  const grid = { spin: Number(spin), points: Number(points), masses: (masses ?? '').split(',').filter(Boolean).map(Number) };
  if (![0, 0.5, 1].includes(grid.spin)) throw new Error(`--grid ${spec}: spin 0, 0.5 or 1`);
  if (!(Number.isInteger(grid.points) && grid.points >= 3)) throw new Error(`--grid ${spec}: at least 3 a* nodes`);
  if (grid.masses.length === 0 || grid.masses.some((m, i) => !(m > 0) || (i > 0 && !(m > grid.masses[i - 1]))))
    throw new Error(`--grid ${spec}: field masses > 0, increasing`);
  return grid;
}

/** The text of src/massiveRateTableData.ts (numbers in shortest round-trip form). */
export function tableModule(table, seconds, runSeconds) {
  const num = (x) => JSON.stringify(x);
  const list = (xs) => `[${xs.map(num).join(', ')}]`;
  const grid = (rows) => `[\n${rows.map((r) => `        ${list(r)},`).join('\n')}\n      ]`;
  const row = (r) =>
    [
      '    {',
      `      spin: ${num(r.spin)},`,
      `      aStar: ${list(r.aStar)},`,
      `      theta: ${list(r.theta)},`,
      `      fieldMass: ${list(r.fieldMass)},`,
      `      powerRatio: ${grid(r.powerRatio)},`,
      `      torqueRatio: ${grid(r.torqueRatio)},`,
      `      powerRatioError: ${grid(r.powerRatioError)},`,
      `      torqueRatioError: ${grid(r.torqueRatioError)},`,
      '    },',
    ].join('\n');
  const round = (s) => Math.round(s * 10) / 10;
  return [
    `// Generated by ${GENERATED_BY}; do not edit by hand.`,
    `// Nodes per spin (Mμ incl. 0 × a* ≤ ${table.aStar[table.aStar.length - 1]}): ${table.spins.map((r) => `${r.spin}: ${r.fieldMass.length} × ${r.aStar.length}`).join(', ')}; tol ${table.tol}, ${table.gammaCalls} greybody solves, ${round(seconds)} s on 2 workers (new nodes ${round(runSeconds)} s, the rest recorded for the reused nodes).`,
    "import type { MassiveRateTable } from './massiveRateTable.js';",
    '',
    '/** The shipped table of massive/massless per-dof power and torque ratios (see massiveRateTable.ts for the layout). */',
    'export const SHIPPED_MASSIVE_RATE_TABLE: MassiveRateTable & { generatedBy: string; seconds: number; runSeconds: number } = {',
    `  generatedBy: '${GENERATED_BY}',`,
    `  seconds: ${num(round(seconds))},`,
    `  runSeconds: ${num(round(runSeconds))},`,
    `  aStar: ${list(table.aStar)},`,
    `  theta: ${list(table.theta)},`,
    `  fieldMass: ${list(table.fieldMass)},`,
    '  spins: [',
    ...table.spins.map(row),
    '  ],',
    `  tol: ${num(table.tol)},`,
    `  gammaCalls: ${num(table.gammaCalls)},`,
    '};',
    '',
  ].join('\n');
}

const invoked = process.argv[1] !== undefined && fileURLToPath(import.meta.url) === process.argv[1];

if (isMainThread && invoked) {
  const { thetaGrid, assembleRatioRow, nodeRatio, SHIPPED_MASSIVE_RATE_TABLE } = await import('@penumbra/emission/internal');
  const args = process.argv.slice(2);
  const value = (name, dflt) => {
    const i = args.indexOf(name);
    return i >= 0 ? args[i + 1] : dflt;
  };
  const grids = args.includes('--grid')
    ? args.flatMap((x, i) => (x === '--grid' ? [parseGrid(args[i + 1])] : []))
    : SHIPPED_GRIDS;
  const tol = Number(value('--tol', 1e-3));
  const aMax = Number(value('--a-max', 0.99));
  const reuse = args.includes('--reuse-shipped');
  const shipped = SHIPPED_MASSIVE_RATE_TABLE;
  const same = (x, y) => Math.abs(x - y) <= 1e-14 * Math.max(1, Math.abs(y));
  /** The shipped ratios of a node, or undefined (a* = 0 torque: recomputed from the new grid's series anyway). */
  const shippedNode = (spin, mu, a) => {
    // the row Mμ = 0 is never reused: its error depends on the massless solves themselves (nodeRatio)
    if (!reuse || shipped.tol !== tol || mu === 0) return undefined;
    const row = shipped.spins.find((r) => r.spin === spin);
    const masses = row?.fieldMass ?? shipped.fieldMass;
    const i = masses.findIndex((m) => same(m, mu));
    const j = row ? row.aStar.findIndex((x) => same(x, a)) : -1;
    if (i < 0 || j < 0) return undefined;
    return {
      power: row.powerRatio[i][j],
      torque: row.torqueRatio[i][j],
      powerError: row.powerRatioError[i][j],
      torqueError: row.torqueRatioError[i][j],
    };
  };
  const key = (spin, mu, a) => `${spin}|${mu}|${a}`;
  const partial = process.env.MASSIVE_TABLE_PARTIAL ?? 'massive-rate-table.partial.jsonl';
  const results = new Map();
  // seconds (wall time over the workers) of each solved node, for the cost of the nodes the table uses
  const cost = new Map();
  if (existsSync(partial))
    for (const line of readFileSync(partial, 'utf8').split('\n').filter(Boolean)) {
      const r = JSON.parse(line);
      if (r.tol === tol && r.mu !== undefined && r.a !== undefined && !results.has(key(r.spin, r.mu, r.a))) {
        results.set(key(r.spin, r.mu, r.a), r.totals);
        cost.set(key(r.spin, r.mu, r.a), r.seconds);
      }
    }
  // every node of every spin: reused, or solved (massive and, at its a*, the massless denominators)
  const layout = grids.map((g) => ({ ...g, ...thetaGrid(g.points, aMax), mus: [0, ...g.masses] }));
  const needed = new Map();
  const need = (spin, mu, a, rank) => {
    const k = key(spin, mu, a);
    if (!results.has(k) && !(needed.get(k)?.rank <= rank)) needed.set(k, { spin, mu, a, rank });
  };
  const coarse = (g, j) => shipped.aStar.some((x) => same(x, g.aStar[j]));
  for (const g of layout)
    for (let j = 0; j < g.points; j++) {
      // rank: new masses on the shipped a* nodes first, then the new a* nodes by increasing a*
      const rank = coarse(g, j) ? g.aStar[j] : 10 + g.aStar[j];
      // the row Mμ = 0 at every a* node (massless solves, a fraction of a second each)
      need(g.spin, 0, g.aStar[j], rank - 1e-9);
      if (g.spin === 1) need(0, 0, g.aStar[j], rank - 1e-9);
      for (const mu of g.mus.slice(1)) if (!shippedNode(g.spin, mu, g.aStar[j])) need(g.spin, mu, g.aStar[j], rank);
    }
  const tasks = process.argv.includes('--assemble') ? [] : [...needed.values()].sort((x, y) => x.rank - y.rank);
  const total = results.size + tasks.length;
  console.log(`${tasks.length} tasks to solve (${results.size} in PARTIAL); first the new field masses on the shipped a* nodes`);
  const started = Date.now();
  const failed = [];
  let next = 0;
  const workers = Number(process.env.MASSIVE_TABLE_WORKERS ?? 2);
  await Promise.all(
    Array.from(
      { length: workers },
      () =>
        new Promise((resolve, reject) => {
          const w = new Worker(fileURLToPath(import.meta.url), { workerData: { tol, workers } });
          const feed = () => {
            if (next >= tasks.length) {
              w.terminate();
              resolve();
              return;
            }
            w.postMessage(tasks[next++]);
          };
          w.on('message', (r) => {
            if (r.error) {
              // a failed node is reported and left out (the assembly then falls back or leaves the spin out)
              failed.push(r);
              console.error(`\nspin ${r.spin} Mμ ${r.mu} a* ${r.a}: ${r.error}`);
              feed();
              return;
            }
            results.set(key(r.spin, r.mu, r.a), r.totals);
            cost.set(key(r.spin, r.mu, r.a), r.seconds);
            appendFileSync(partial, `${JSON.stringify({ ...r, tol })}\n`);
            process.stderr.write(
              `\rmassive rate table: ${results.size}/${total} (${((Date.now() - started) / 1000).toFixed(0)} s)`,
            );
            feed();
          });
          w.on('error', reject);
          feed();
        }),
    ),
  );
  process.stderr.write('\n');
  /** The ratios of node (spin, mu, a*), or undefined if not done. */
  const used = new Set();
  const nodeAt = (spin, mu, a) => {
    const old = shippedNode(spin, mu, a);
    if (old) return old;
    const keys = [key(spin, mu, a), key(spin, 0, a), ...(spin === 1 ? [key(0, 0, a)] : [])];
    if (!keys.every((k) => results.has(k))) return undefined;
    for (const k of keys) used.add(k);
    const [own, base, scalar] = keys.map((k) => results.get(k));
    return nodeRatio(spin, mu > 0 ? own : undefined, base, spin === 1 ? scalar : undefined);
  };
  // each spin on its full a* grid, or every 2nd, 4th... node when a cut-short run left gaps; a field mass
  // with a node that failed is left out of its spin (at most two per spin)
  const rows = [];
  for (const g of layout) {
    for (let stride = 1; (g.points - 1) % stride === 0 && (g.points - 1) / stride >= 2; stride *= 2) {
      const js = Array.from({ length: (g.points - 1) / stride + 1 }, (_, k) => k * stride);
      const done = (mu) => js.every((j) => nodeAt(g.spin, mu, g.aStar[j]) !== undefined);
      const mus = g.mus.filter((mu) => mu === 0 || done(mu));
      if (!done(0) || g.mus.length - mus.length > 2) continue;
      const entries = mus.map((mu) => js.map((j) => nodeAt(g.spin, mu, g.aStar[j])));
      rows.push(assembleRatioRow(g.spin, { aStar: js.map((j) => g.aStar[j]), theta: js.map((j) => g.theta[j]) }, mus, entries));
      if (stride > 1) console.warn(`spin ${g.spin}: every ${stride}th a* node only (the run was cut short)`);
      if (mus.length < g.mus.length)
        console.warn(`spin ${g.spin}: Mμ ${g.mus.filter((mu) => !mus.includes(mu)).join(', ')} left out (nodes missing)`);
      break;
    }
    if (rows[rows.length - 1]?.spin !== g.spin) console.warn(`spin ${g.spin}: nodes missing; left out of the table`);
  }
  const densest = layout.reduce((x, y) => (y.points > x.points ? y : x));
  const fieldMass = [...new Set(rows.flatMap((r) => r.fieldMass))].sort((x, y) => x - y);
  // solves of this table: the solved nodes it uses plus the shipped table's (when reused)
  const solved = [...used].reduce((t, k) => t + results.get(k).gammaCalls, 0);
  const calls = solved + (reuse ? shipped.gammaCalls : 0);
  const table = { aStar: densest.aStar, theta: densest.theta, fieldMass, spins: rows, tol, gammaCalls: calls };
  // the nodes' own solve times (this run's and earlier runs' in PARTIAL), not the time lost to failed or unused nodes
  const runSeconds = [...used].reduce((t, k) => t + cost.get(k), 0);
  const seconds = runSeconds + (reuse ? shipped.seconds : 0);
  const out = process.env.MASSIVE_TABLE_OUT ?? fileURLToPath(new URL('../src/massiveRateTableData.ts', import.meta.url));
  writeFileSync(out, tableModule(table, seconds, runSeconds));
  // long node lists: leave the line breaking to the repository's formatter
  spawnSync('npx', ['biome', 'format', '--write', out], { stdio: 'ignore' });
  console.log(
    `wrote ${out}: ${rows.map((r) => `spin ${r.spin} ${r.fieldMass.length} Mμ × ${r.aStar.length} a*`).join(', ')}, tol ${tol}; ` +
      `new nodes ${runSeconds.toFixed(1)} s (${used.size} solves; this run ${((Date.now() - started) / 1000).toFixed(1)} s for ${tasks.length} tasks${failed.length ? `, ${failed.length} failed` : ''}), ` +
      `${seconds.toFixed(1)} s with the reused nodes' recorded time, on ${workers} workers; rebuild with npx tsc -b`,
  );
} else if (!isMainThread) {
  const { fieldTotals } = await import('@penumbra/emission/internal');
  parentPort.on('message', ({ spin, mu, a }) => {
    const t0 = Date.now();
    const cpu0 = process.cpuUsage();
    let totals;
    try {
      totals = fieldTotals(spin, mu, a, workerData.tol);
    } catch (e) {
      parentPort.postMessage({ spin, mu, a, error: String(e?.message ?? e).slice(0, 300) });
      return;
    }
    const cpu = process.cpuUsage(cpu0);
    parentPort.postMessage({
      spin,
      mu,
      a,
      totals,
      seconds: (Date.now() - t0) / 1000 / workerData.workers,
      cpuSeconds: (cpu.user + cpu.system) / 1e6,
    });
  });
}
