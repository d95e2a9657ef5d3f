// Shared helpers of the benchmarks: statistics, timing, the scipy peer, result files.
import { spawnSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

export const benchDir = dirname(fileURLToPath(import.meta.url));

export function median(values) {
  const v = values.filter((x) => Number.isFinite(x)).sort((x, y) => x - y);
  if (v.length === 0) return Number.NaN;
  const mid = v.length >> 1;
  return v.length % 2 ? v[mid] : 0.5 * (v[mid - 1] + v[mid]);
}

export function maximum(values) {
  return values.filter((x) => Number.isFinite(x)).reduce((x, y) => Math.max(x, y), Number.NEGATIVE_INFINITY);
}

export function relDiff(x, ref) {
  return Math.abs(x / ref - 1);
}

/** Median wall time in milliseconds of `runs` single calls: robust against load spikes on a shared machine. */
export function medianMs(fn, runs = 5) {
  const times = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    fn();
    times.push(performance.now() - t0);
  }
  return median(times);
}

/**
 * CPU milliseconds per call of fn (process CPU time over a batch of calls, so
 * preemption by other processes does not count).
 */
export function cpuMsPerCall(fn, minCpuMs = 20, maxCalls = 200) {
  const start = process.cpuUsage();
  let calls = 0;
  let used = 0;
  do {
    fn();
    calls++;
    const d = process.cpuUsage(start);
    used = (d.user + d.system) / 1e3;
  } while (used < minCpuMs && calls < maxCalls);
  return used / calls;
}

/** The least of `batches` cpuMsPerCall measurements of at least `minCpuMs` each: on a shared machine load only ever adds CPU time. */
export function leastCpuMsPerCall(fn, batches, minCpuMs) {
  let least = Number.POSITIVE_INFINITY;
  for (let i = 0; i < batches; i++) least = Math.min(least, cpuMsPerCall(fn, minCpuMs, Number.POSITIVE_INFINITY));
  return least;
}

/**
 * CPU milliseconds per call of each of `fns`, compared on a shared machine: a
 * warm-up call of each, then `batches` (default three) interleaved batches
 * (cpuMsPerCall), and the median of each function's. With `rotate`, batch i starts at function
 * i (mod n), so that none always follows the same one (garbage left by one is
 * collected in the next); without, every batch runs them in the given order.
 */
export function interleavedCpuMs(fns, minCpuMs, maxCalls, { rotate = false, batches = 3 } = {}) {
  for (const f of fns) f();
  const times = fns.map(() => []);
  for (let i = 0; i < batches; i++) {
    for (let k = 0; k < fns.length; k++) {
      const j = rotate ? (i + k) % fns.length : k;
      times[j].push(cpuMsPerCall(fns[j], minCpuMs, maxCalls));
    }
  }
  return times.map(median);
}

export function fmt(x, digits = 2) {
  if (!Number.isFinite(x)) return String(x);
  if (x === 0) return '0';
  const ax = Math.abs(x);
  return ax >= 1e-2 && ax < 1e5 ? x.toPrecision(digits + 1) : x.toExponential(digits - 1 > 0 ? digits - 1 : 1);
}

export function table(header, rows) {
  const cells = [header, ...rows].map((r) => r.map(String));
  const width = header.map((_, j) => Math.max(...cells.map((r) => r[j].length)));
  return cells.map((r) => r.map((c, j) => c.padStart(width[j])).join('  ')).join('\n');
}

export function today() {
  return new Date().toISOString().slice(0, 10);
}

export function writeResult(name, payload) {
  const dir = join(benchDir, 'results');
  mkdirSync(dir, { recursive: true });
  const path = join(dir, `${name}-${today()}.json`);
  writeFileSync(path, `${JSON.stringify(payload, null, 1)}\n`);
  return path;
}

/**
 * Runs a scipy peer (bench/peers/<script>, default greybody_peer.py) on the modes. Returns { ok: true, data } or
 * { ok: false, reason, detail } when python or scipy is missing (exit status 3).
 * PENUMBRA_PEER_PYTHON selects the interpreter (default python3).
 */
export function runPeer(modes, { tol, rtolFactor = 1, repeat = 1, script = 'greybody_peer.py' }) {
  const python = process.env.PENUMBRA_PEER_PYTHON ?? 'python3';
  const run = spawnSync(
    python,
    [join(benchDir, 'peers', script), '--tol', String(tol), '--rtol-factor', String(rtolFactor), '--repeat', String(repeat)],
    {
      input: JSON.stringify(modes),
      encoding: 'utf8',
      maxBuffer: 256 * 1024 * 1024,
    },
  );
  if (run.error)
    return {
      ok: false,
      reason: 'scipy not available',
      detail: `${python} could not be run (${run.error.code ?? run.error.message})`,
    };
  if (run.status === 3) return { ok: false, reason: 'scipy not available', detail: run.stderr.trim() };
  if (run.status !== 0) throw new Error(`peer failed with status ${run.status}: ${run.stderr}`);
  return { ok: true, data: JSON.parse(run.stdout) };
}

/** A seeded linear congruential generator on [0, 1) (the benches' fixed mode samples; not for statistics). */
export function seededRandom(seed) {
  let state = seed;
  return () => {
    state = (state * 1103515245 + 12345) % 2147483648;
    return state / 2147483648;
  };
}

/** Mulberry32 on [0, 1): the generator behind the far-zone and massive-threshold samples (kept so their recorded sets stay the same). */
export function seededMulberry(seed) {
  let t = seed >>> 0;
  return () => {
    t += 0x6d2b79f5;
    let r = Math.imul(t ^ (t >>> 15), 1 | t);
    r ^= r + Math.imul(r ^ (r >>> 7), 61 | r);
    return ((r ^ (r >>> 14)) >>> 0) / 4294967296;
  };
}

/** The tail grid of issue 14 (cost within 3× of the median up to l = 100 and Mω = 30, and near-extremal counter-rotating modes): 208 greybody problems. */
export function tailGrid() {
  const spins = [0, 0.5, 1, 2];
  const out = [];
  const mode = (spin, l, m, a, omega) => ({ hole: { a }, mode: { field: { spin }, l, m }, omega });
  for (const spin of spins)
    for (const a of [0, 0.7, 0.99]) {
      const l0 = Math.max(spin, 2) === 2 && spin !== 2 ? (Number.isInteger(spin) ? 2 : 2.5) : Math.max(spin, 2);
      for (const omega of [3, 10, 20, 30]) out.push(mode(spin, l0, l0, a, omega));
      for (const l of [25, 50, 75, 100]) {
        const L = Number.isInteger(spin) ? l : l + 0.5;
        const m = Number.isInteger(spin) ? Math.round(L / 2) : Math.round(L / 2 - 0.5) + 0.5;
        for (const omega of [1, 10, 30]) out.push(mode(spin, L, m, a, omega));
      }
    }
  for (const spin of spins) {
    const l = Number.isInteger(spin) ? Math.max(spin, 2) : 2.5;
    for (const omega of [3, 10, 30]) out.push(mode(spin, l, -l, 0.99999, omega));
    const L = Number.isInteger(spin) ? 20 : 20.5;
    out.push(mode(spin, L, -L, 0.9999, 1));
  }
  return out;
}
