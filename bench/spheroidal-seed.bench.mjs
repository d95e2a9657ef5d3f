#!/usr/bin/env node
// Large-|c| seeds of the real spheroidal eigenvalue: the warm/bisection seed
// accepted for a cluster of eigenvalues (the pole-concentrated pairs at large
// |c|) against the dense eigen-solve it replaced. N random problems (s ∈ {0,
// ±1/2, ±1, ±2}, l ≤ |s| + 12, every m, 10 ≤ |c| ≤ 40), each cold
// (continuation off) and warm (the same mode solved at c(1 − 1e-9) first),
// in this build and in BASE (another built checkout): A compared bit for bit,
// and the share of solves that still take the dense route.
// Run: npx tsc -b && BASE=/path/to/checkout node bench/spheroidal-seed.bench.mjs [N]
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { benchDir, seededRandom } from './lib.mjs';

const N = Number(process.argv[2] ?? 3000);
const load = async (root) => import(pathToFileURL(join(root, 'packages/spheroidal/dist/index.js')).href);
const mine = await load(join(benchDir, '..'));
const base = process.env.BASE ? await load(process.env.BASE) : null;
const rand = seededRandom(97);
const spins = [0, 0.5, -0.5, 1, -1, 2, -2];
const problems = Array.from({ length: N }, () => {
  const s = spins[Math.floor(rand() * spins.length)];
  const l = Math.abs(s) + Math.floor(rand() * 13);
  const m = -l + Math.floor(rand() * (2 * l + 1));
  const c = (rand() < 0.5 ? -1 : 1) * (10 + 30 * rand());
  return { s, l, m, c };
});

function solve(lib, p, warm) {
  lib.clearSpheroidalCache();
  if (warm) lib.spheroidalEigenvalue({ ...p, c: p.c * (1 - 1e-9) });
  return lib.spheroidalEigenvalue(p, warm ? undefined : { continuation: false });
}

for (const warm of [false, true]) {
  let differ = 0;
  let worst = 0;
  const dense = { mine: 0, base: 0 };
  let cpuMine = 0;
  let cpuBase = 0;
  for (const p of problems) {
    let t0 = process.cpuUsage();
    const a = solve(mine, p, warm);
    let t = process.cpuUsage(t0);
    cpuMine += t.user + t.system;
    if (a.diagnostics.method.startsWith('spectral-dense')) dense.mine++;
    if (!base) continue;
    t0 = process.cpuUsage();
    const b = solve(base, p, warm);
    t = process.cpuUsage(t0);
    cpuBase += t.user + t.system;
    if (b.diagnostics.method.startsWith('spectral-dense')) dense.base++;
    if (!Object.is(a.A, b.A)) {
      differ++;
      const rel = Math.abs(a.A - b.A) / Math.max(1, Math.abs(b.A));
      if (rel > worst) worst = rel;
      if (differ <= 5)
        console.log(`  differs: ${JSON.stringify(p)} ${a.A} vs ${b.A} (${a.diagnostics.method} / ${b.diagnostics.method})`);
    }
  }
  console.log(
    `${warm ? 'warm' : 'cold'}: ${N} problems; dense route this build ${dense.mine}${base ? `, base ${dense.base}; A differs from base in ${differ} (largest ${worst.toExponential(2)} relative); CPU base/this ${(cpuBase / cpuMine).toFixed(2)}` : ''}`,
  );
}
