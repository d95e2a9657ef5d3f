// The floor bench's measurement (bench/floor.bench.mjs: 150 warm-up modes, then N random Kerr modes, Γ with
// its error estimate at tol 1e-8, reflection off, CPU time per call) with each build in a fresh process of
// its own, the processes alternating (base, new, new, base, …) for R rounds.
//
// Why beside the same-process interleaving of floor.bench.mjs: in a process that has run ~1,000 modes the JIT
// is still compiling (measured: the compiler threads' CPU in modes 150–1,150 was about twice the main
// thread's), and process.cpuUsage charges that work to whichever call is running. With two builds in one
// process each build's calls carry about half of both builds' compilation, so a build that compiles less
// cannot show it there; here each process carries only its own.
// Printed per build: the median over rounds of the per-round median and p99 (ms), RHS evaluations, and the
// median over modes of the per-mode ratio base/new of each mode's median CPU time over rounds.
// Run: npx tsc -b && BASE=/path/to/built/checkout node bench/floor-fresh.bench.mjs [N] [R]
import { spawnSync } from 'node:child_process';
import { readFileSync, readdirSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { benchDir, fmt, median, seededRandom } from './lib.mjs';

const quantile = (xs, q) => {
  const s = [...xs].sort((x, y) => x - y);
  return s[Math.min(s.length - 1, Math.floor(q * s.length))];
};

/** The floor bench's modes (seed 41, the same draws). */
function floorModes(n) {
  const rand = seededRandom(41);
  const spins = [0, 0.5, 1, 2];
  return Array.from({ length: n }, () => {
    const spin = spins[Math.floor(rand() * 4)];
    const l = spin + Math.floor(rand() * (7 - Math.ceil(spin)));
    const m = -l + Math.floor(rand() * (2 * l + 1));
    return { hole: { a: 0.9999 * rand() }, mode: { field: { spin }, l, m }, omega: 0.01 * 300 ** rand() };
  });
}

/** CPU ms of this process's main thread and of all its other threads (the JIT's and GC's helpers), from /proc (Linux; null elsewhere). */
function threadCpuMs() {
  try {
    let main = 0,
      other = 0;
    for (const t of readdirSync('/proc/self/task')) {
      const stat = readFileSync(`/proc/self/task/${t}/stat`, 'utf8');
      const f = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
      // utime + stime in clock ticks (100 per second on Linux)
      const ms = (Number(f[11]) + Number(f[12])) * 10;
      if (Number(t) === process.pid) main += ms;
      else other += ms;
    }
    return { main, other };
  } catch {
    return null;
  }
}

if (process.argv[2] === '--child') {
  const [root, n] = [process.argv[3], Number(process.argv[4])];
  const { greybody } = await import(pathToFileURL(join(root, 'packages/flux/dist/index.js')).href);
  const modes = floorModes(n);
  for (const p of modes.slice(0, 150)) greybody(p, { reflection: false, tol: 1e-8 });
  const ms = [];
  const evals = [];
  const threads0 = threadCpuMs();
  for (const p of modes) {
    const t0 = process.cpuUsage();
    const sol = greybody(p, { reflection: false, tol: 1e-8 });
    const t = process.cpuUsage(t0);
    ms.push((t.user + t.system) / 1e3);
    evals.push(sol.diagnostics.rhsEvaluations);
  }
  const threads1 = threadCpuMs();
  const threads = threads0 && threads1 ? { main: threads1.main - threads0.main, other: threads1.other - threads0.other } : null;
  process.stdout.write(JSON.stringify({ ms, evals, threads }));
  process.exit(0);
}

const N = Number(process.argv[2] ?? 1000);
const R = Number(process.argv[3] ?? 6);
const builds = [['new', join(benchDir, '..')]];
if (process.env.BASE) builds.unshift(['base', process.env.BASE]);
const self = fileURLToPath(import.meta.url);
const runs = Object.fromEntries(builds.map(([name]) => [name, []]));
for (let round = 0; round < R; round++) {
  const order = round % 2 ? [...builds].reverse() : builds;
  for (const [name, root] of order) {
    const child = spawnSync(process.execPath, [self, '--child', root, String(N)], { encoding: 'utf8', maxBuffer: 1 << 26 });
    if (child.status !== 0) throw new Error(`${name} child failed: ${child.stderr}`);
    runs[name].push(JSON.parse(child.stdout));
  }
}
const out = {
  date: new Date().toISOString(),
  load: os.loadavg(),
  cpu: `${os.cpus()[0]?.model} × ${os.cpus().length}`,
  n: N,
  rounds: R,
  builds: {},
};
console.log(
  `load average ${os
    .loadavg()
    .map((x) => x.toFixed(1))
    .join(' ')}; ${out.cpu}; ${N} modes, ${R} fresh processes per build`,
);
for (const [name] of builds) {
  const rs = runs[name];
  const s = {
    medianMs: median(rs.map((r) => quantile(r.ms, 0.5))),
    p99Ms: median(rs.map((r) => quantile(r.ms, 0.99))),
    medianEvals: quantile(rs[0].evals, 0.5),
    perRound: rs.map((r) => ({ median: quantile(r.ms, 0.5), p99: quantile(r.ms, 0.99) })),
    mainThreadMs: rs[0].threads ? median(rs.map((r) => r.threads.main)) : null,
    otherThreadsMs: rs[0].threads ? median(rs.map((r) => r.threads.other)) : null,
  };
  out.builds[name] = s;
  console.log(
    `${name}: CPU ms median ${fmt(s.medianMs, 3)}, p99 ${fmt(s.p99Ms, 3)} (medians over rounds; per round median ${s.perRound.map((x) => fmt(x.median, 3)).join(' ')}, p99 ${s.perRound.map((x) => fmt(x.p99, 3)).join(' ')}); RHS evaluations median ${s.medianEvals}; CPU of the ${N} modes on the main thread ${s.mainThreadMs} ms, on the other threads (compiler, GC) ${s.otherThreadsMs} ms`,
  );
}
if (process.env.BASE) {
  const perMode = (name) => runs[name][0].ms.map((_, i) => median(runs[name].map((r) => r.ms[i])));
  const b = perMode('base'),
    n = perMode('new');
  out.ratios = {
    medianPerMode: median(b.map((x, i) => x / n[i])),
    medianOfMedians: out.builds.base.medianMs / out.builds.new.medianMs,
    p99: out.builds.base.p99Ms / out.builds.new.p99Ms,
    evals: median(runs.base[0].evals.map((x, i) => x / runs.new[0].evals[i])),
  };
  console.log(
    `base/new: median of per-mode CPU ratios ${fmt(out.ratios.medianPerMode)}; ratio of medians ${fmt(out.ratios.medianOfMedians)}, of p99 ${fmt(out.ratios.p99)}; median RHS-evaluation ratio ${fmt(out.ratios.evals)}`,
  );
}
const file = join(
  benchDir,
  'results',
  `floor-fresh-${process.env.PENUMBRA_RESULT_TAG ?? new Date().toISOString().slice(0, 10)}.json`,
);
writeFileSync(file, `${JSON.stringify(out, null, 1)}\n`);
console.log(`results: ${file}`);
