// Emission totals of the four spins at a = 0.9 to 1e-6 in ONE fresh Node process, against the 2 s
// target, and the same four totals from the CLI: `penumbra emission --a 0.9 --spin 0,2,1/2,1 --tol
// 1e-6 --json` (one process; builds without spin lists skip it) and `--spin S`, one process per spin.
//   npx tsc -b && BASE=/path/to/baseline/checkout node bench/emission-one-process.bench.mjs [--runs 5]
// Why a single process: a fresh lane pays 4–5× a warm run for its first totals (V8 compiles the
// solver on its compiler threads), so two lanes pay that twice, while one process keeps its main
// thread busy and lets the compiler threads use the second core. The wall time is from spawning
// `node` to its exit (start-up and module loading included); CPU is the child's, all threads (for
// the CLI from /usr/bin/time, which also counts any process the CLI starts). With BASE (a built
// checkout) every run times both builds, alternating which goes first, so load on the shared host
// hits both alike; compare builds by the per-run ratios, not by absolute seconds.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import os from 'node:os';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { benchDir, median, writeResult } from './lib.mjs';

const SPINS = [0, 2, 0.5, 1];
const CLI_SPIN = { 0: '0', 2: '2', 0.5: '1/2', 1: '1' };

const child = `
const { emissionTotals } = await import(process.env.EMISSION_MODULE);
const out = [];
for (const spin of ${JSON.stringify(SPINS)}) {
  const r = emissionTotals({ hole: { a: 0.9 }, field: { spin } }, { tol: 1e-6 });
  out.push({ spin, power: r.power.value, powerError: r.power.absError });
}
const u = process.resourceUsage();
console.log(JSON.stringify({ out, cpuSeconds: (u.userCPUTime + u.systemCPUTime) / 1e6 }));
`;

const args = process.argv.slice(2);
const runs = Number(args[args.indexOf('--runs') + 1] ?? 5) || 5;
const builds = [{ name: 'this build', root: resolve(benchDir, '..') }];
if (process.env.BASE) builds.push({ name: `base ${process.env.BASE}`, root: resolve(process.env.BASE) });
const timeTool = existsSync('/usr/bin/time') ? '/usr/bin/time' : undefined;
const scratch = mkdtempSync(join(os.tmpdir(), 'emission-one-process-'));

function library(root) {
  const env = { ...process.env, EMISSION_MODULE: pathToFileURL(join(root, 'packages/emission/dist/index.js')).href };
  const t0 = performance.now();
  const r = spawnSync(process.execPath, ['--input-type=module', '-e', child], { cwd: benchDir, encoding: 'utf8', env });
  const wall = (performance.now() - t0) / 1000;
  if (r.status !== 0) throw new Error(r.stderr);
  const parsed = JSON.parse(r.stdout);
  return { wall, cpu: parsed.cpuSeconds, out: parsed.out };
}

/** One CLI process for the given spins; null when the build rejects the spin list (exit code 2). */
function cliRun(root, spins) {
  const cli = [
    join(root, 'packages/cli/bin/penumbra.js'),
    'emission',
    '--a',
    '0.9',
    '--spin',
    spins.map((spin) => CLI_SPIN[spin]).join(','),
    '--tol',
    '1e-6',
    '--json',
  ];
  const timeFile = join(scratch, 'time.txt');
  const [cmd, cmdArgs] = timeTool
    ? [timeTool, ['-f', '%U %S', '-o', timeFile, process.execPath, ...cli]]
    : [process.execPath, cli];
  const t0 = performance.now();
  const r = spawnSync(cmd, cmdArgs, { cwd: benchDir, encoding: 'utf8' });
  const wall = (performance.now() - t0) / 1000;
  if (r.status === 2 && spins.length > 1) return null;
  if (r.status !== 0) throw new Error(r.stderr);
  const cpu = timeTool
    ? readFileSync(timeFile, 'utf8')
        .trim()
        .split('\n')
        .at(-1)
        .split(' ')
        .reduce((s, x) => s + Number(x), 0)
    : Number.NaN;
  const json = JSON.parse(r.stdout);
  return { wall, cpu, powers: (spins.length > 1 ? json : [json]).map((o) => o.power.value) };
}

function cli(root) {
  const list = cliRun(root, SPINS);
  const per = SPINS.map((spin) => cliRun(root, [spin]));
  return {
    wall: per.reduce((s, p) => s + p.wall, 0),
    cpu: per.reduce((s, p) => s + p.cpu, 0),
    perSpinWall: per.map((p) => p.wall),
    powers: per.map((p) => p.powers[0]),
    list,
  };
}

const load = os.loadavg()[0];
const series = builds.map(() => ({ lib: [], cli: [] }));
for (let i = 0; i < runs; i++) {
  const order = builds.map((_, k) => (i + k) % builds.length);
  for (const k of order) series[k].lib.push(library(builds[k].root));
  for (const k of order) series[k].cli.push(cli(builds[k].root));
  const line = order
    .map((k) => {
      const l = series[k].lib.at(-1);
      const c = series[k].cli.at(-1);
      const list = c.list ? `CLI list wall ${c.list.wall.toFixed(2)} s CPU ${c.list.cpu.toFixed(2)} s; ` : '';
      return `${builds[k].name}: library wall ${l.wall.toFixed(2)} s CPU ${l.cpu.toFixed(2)} s; ${list}CLI ×4 wall ${c.wall.toFixed(2)} s CPU ${c.cpu.toFixed(2)} s`;
    })
    .join(' | ');
  console.log(`run ${i + 1}: ${line}`);
}
rmSync(scratch, { recursive: true, force: true });

console.log(
  `\nEmission totals, four spins at a = 0.9, tol 1e-6 (${runs} runs) on ${os.cpus().length} cores, load average ${load.toFixed(1)} before, ${os.loadavg()[0].toFixed(1)} after`,
);
const summary = (xs) => `least ${Math.min(...xs).toFixed(2)} s, median ${median(xs).toFixed(2)} s`;
builds.forEach((b, k) => {
  const s = series[k];
  console.log(`${b.name}:`);
  console.log(
    `  library, one process: wall ${summary(s.lib.map((r) => r.wall))} (least / 2 s target ${(Math.min(...s.lib.map((r) => r.wall)) / 2).toFixed(2)}); CPU all threads ${summary(s.lib.map((r) => r.cpu))}`,
  );
  const lists = s.cli.map((r) => r.list).filter((r) => r);
  if (lists.length > 0)
    console.log(
      `  CLI, --spin 0,2,1/2,1 in one process: wall ${summary(lists.map((r) => r.wall))} (least / 2 s target ${(Math.min(...lists.map((r) => r.wall)) / 2).toFixed(2)}); CPU ${summary(lists.map((r) => r.cpu))}`,
    );
  console.log(
    `  CLI, one process per spin, summed: wall ${summary(s.cli.map((r) => r.wall))}; CPU ${summary(s.cli.map((r) => r.cpu))}`,
  );
  const perSpin = SPINS.map((spin, j) => `s = ${CLI_SPIN[spin]} ${Math.min(...s.cli.map((r) => r.perSpinWall[j])).toFixed(2)} s`);
  console.log(`  CLI least wall per spin: ${perSpin.join(', ')}`);
});
if (builds.length === 2) {
  const ratio = (key, part) => series[0][part].map((r, i) => r[key] / series[1][part][i][key]);
  for (const part of ['lib', 'cli'])
    for (const key of ['wall', 'cpu']) {
      const q = ratio(key, part);
      console.log(
        `ratio this/base, ${part === 'lib' ? 'library' : 'CLI ×4'} ${key === 'wall' ? 'wall' : 'CPU '} per run: ${q.map((x) => x.toFixed(2)).join(' ')} (median ${median(q).toFixed(2)})`,
      );
    }
}
const last = series[0].lib.at(-1).out;
for (const [j, o] of last.entries()) {
  const others = series.flatMap((s) => [
    s.lib.at(-1).out[j].power,
    s.cli.at(-1).powers[j],
    ...(s.cli.at(-1).list ? [s.cli.at(-1).list.powers[j]] : []),
  ]);
  const same = others.every((p) => p === o.power);
  console.log(
    `  spin ${o.spin}: power·M² ${o.power.toExponential(8)} ± ${o.powerError.toExponential(1)}${same ? ' (identical in every build, library and CLI)' : ` (differs: ${others.map((p) => p.toExponential(12)).join(', ')})`}`,
  );
}
writeResult('emission-one-process', {
  machine: { cores: os.cpus().length, load },
  runs,
  builds: builds.map((b, k) => ({ name: b.name, library: series[k].lib.map(({ out, ...r }) => r), cli: series[k].cli })),
  totals: last,
});
