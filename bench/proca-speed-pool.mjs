// Pools runs of bench/proca-speed.bench.mjs (their JSON result files, same modes): per row the least CPU of
// each timed call over the runs (on a shared machine load only ever adds CPU time, so the least is the
// best estimate of each), and the ratios formed from those: per Γ (for even-1 and even-2 the pair over 2)
// against the massless mode, for this checkout ("after") and the baseline ("before").
//   node bench/proca-speed-pool.mjs bench/results/<run1>.json bench/results/<run2>.json ...
import { readFileSync } from 'node:fs';
import { fmt, median, table } from './lib.mjs';

const runs = process.argv.slice(2).map((f) => JSON.parse(readFileSync(f, 'utf8')).records);
if (runs.length === 0) throw new Error('give the JSON result files of proca-speed runs');
const key = (r) => `${r.l}|${r.omega}|${r.fieldMass}|${r.polarization}`;
const least = (k, field) => Math.min(...runs.map((rs) => rs.find((r) => key(r) === k)?.[field] ?? Number.NaN));
const rows = [];
const after = [];
const before = [];
for (const r of runs[0]) {
  const k = key(r);
  const even = r.polarization.startsWith('even');
  const massless = least(k, 'msMassless');
  const a = (even ? least(k, 'msPairAfter') / 2 : least(k, 'msAfter')) / massless;
  const b = (even ? least(k, 'msPairBefore') / 2 : least(k, 'msBefore')) / massless;
  after.push({ r, a });
  before.push(b);
  rows.push([
    r.l,
    r.omega,
    fmt(r.fieldMass, 3),
    fmt(r.v, 2),
    r.polarization,
    fmt(massless, 3),
    fmt(b, 2),
    fmt(a, 2),
    `${r.rhsBefore}/${r.rhsAfter}`,
  ]);
}
console.log(`${runs.length} runs pooled (least CPU per call over the runs)`);
console.log(table(['l', 'Mω', 'Mμ', 'v', 'pol', 'massless ms', 'per Γ before', 'per Γ after', 'RHS before/after'], rows));
const a = after.map((x) => x.a);
console.log(
  `per Γ: before median ${fmt(median(before))}, max ${fmt(Math.max(...before))}; after median ${fmt(median(a))}, max ${fmt(Math.max(...a))}`,
);
for (const [name, keep] of [
  ['even sector', (r) => r.polarization.startsWith('even')],
  ['odd + monopole', (r) => !r.polarization.startsWith('even')],
  ['even, v ≤ 0.141', (r) => r.polarization.startsWith('even') && r.v < 0.15],
]) {
  const idx = after.map((x, i) => (keep(x.r) ? i : -1)).filter((i) => i >= 0);
  const aa = idx.map((i) => after[i].a);
  const bb = idx.map((i) => before[i]);
  console.log(
    `  ${name} (${idx.length}): before median ${fmt(median(bb))}, max ${fmt(Math.max(...bb))}; after median ${fmt(median(aa))}, max ${fmt(Math.max(...aa))}`,
  );
}
