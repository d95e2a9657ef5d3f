// penumbra against a careful tortoise-coordinate scipy solver on Schwarzschild
// modes (bench/peers/tortoise_peer.py: Regge–Wheeler equation in r*, DOP853,
// Frobenius start and asymptotic series at both ends). Modes: field spins 0, 1,
// 2 × l = s … s + 3 × 27 values of Mω in [0.1, 3] = 324 modes (the peer has no
// polynomial series for the massless spin-½ potential).
// penumbra: Γ alone with its error estimate at tol 1e-8, CPU time per mode.
// Peer: rtol 1e-12 (the careful setting) and rtol 1e-8 (equal requested tol).
// Accuracy of both against penumbra at tol 1e-12, itself checked against the
// independent Regge–Wheeler solver of @penumbra/regge-wheeler at tol 1e-12.
// Run: `npx tsc -b && node bench/tortoise-peer.bench.mjs [repeat]`.
import { greybody } from '@penumbra/flux';
import { schwarzschildGreybody } from '@penumbra/regge-wheeler';
import { cpuMsPerCall, fmt, maximum, median, relDiff, runPeer, table, writeResult } from './lib.mjs';

const TOL = 1e-8;
const REPEAT = Number(process.argv[2] ?? 1);
const OMEGAS = Array.from({ length: 27 }, (_, i) => 0.1 + (2.9 * i) / 26);
const modes = [];
for (const spin of [0, 1, 2]) for (let l = spin; l <= spin + 3; l++) for (const omega of OMEGAS) modes.push({ spin, l, omega });

const problem = (x) => ({ hole: { a: 0 }, mode: { field: { spin: x.spin }, l: x.l, m: 0 }, omega: x.omega });
const rows = modes.map((x) => {
  const reference = greybody(problem(x), { tol: 1e-12, reflection: false });
  const rw = schwarzschildGreybody({ field: { spin: x.spin }, l: x.l, omega: x.omega }, { tol: 1e-12 });
  const ours = greybody(problem(x), { tol: TOL, reflection: false });
  return {
    ...x,
    reference: reference.gamma,
    referenceVsReggeWheeler: relDiff(reference.gamma, rw.gamma),
    gamma: ours.gamma,
    relError: ours.relError,
    error: relDiff(ours.gamma, reference.gamma),
    cpuMs: cpuMsPerCall(() => greybody(problem(x), { tol: TOL, reflection: false })),
  };
});

const PEER_RUNS = [
  { label: 'rtol 1e-12', rtolFactor: 1e-4 },
  { label: 'rtol 1e-8', rtolFactor: 1 },
];
const peer = {};
for (const run of PEER_RUNS) {
  const out = runPeer(modes, { tol: TOL, rtolFactor: run.rtolFactor, repeat: REPEAT, script: 'tortoise_peer.py' });
  if (!out.ok) {
    console.log(`peer skipped: ${out.reason} (${out.detail})`);
    process.exit(0);
  }
  peer[run.label] = out.data;
}

const header = [
  'spin',
  'modes',
  'penumbra ms',
  'err med',
  'err max',
  ...PEER_RUNS.flatMap((r) => [`peer ${r.label} ms`, 'err med', 'err max', 'ratio (medians)', 'ratio (median per mode)']),
];
const summary = [];
const lines = [0, 1, 2].map((spin) => {
  const idx = rows.map((r, i) => (r.spin === spin ? i : -1)).filter((i) => i >= 0);
  const ours = median(idx.map((i) => rows[i].cpuMs));
  const entry = {
    spin,
    modes: idx.length,
    penumbraCpuMs: ours,
    penumbraErrMedian: median(idx.map((i) => rows[i].error)),
    penumbraErrMax: maximum(idx.map((i) => rows[i].error)),
    peers: {},
  };
  const cells = [spin, idx.length, fmt(ours, 3), fmt(entry.penumbraErrMedian), fmt(entry.penumbraErrMax)];
  for (const run of PEER_RUNS) {
    const res = peer[run.label].results;
    const failed = idx.filter((i) => res[i].error !== undefined).length;
    const ms = median(idx.map((i) => 1e3 * res[i].cpuSeconds));
    const err = idx.map((i) => (res[i].error === undefined ? relDiff(res[i].gamma, rows[i].reference) : Number.NaN));
    const perMode = median(idx.map((i) => (1e3 * res[i].cpuSeconds) / rows[i].cpuMs));
    entry.peers[run.label] = {
      cpuMs: ms,
      errMedian: median(err),
      errMax: maximum(err),
      failed,
      ratioOfMedians: ms / ours,
      medianRatio: perMode,
    };
    cells.push(fmt(ms, 3), fmt(median(err)), fmt(maximum(err)), `${fmt(ms / ours, 3)}×`, `${fmt(perMode, 3)}×`);
  }
  summary.push(entry);
  return cells;
});

console.log(
  `Schwarzschild modes, penumbra tol ${TOL} (Γ alone with its estimate), CPU ms per mode (medians); errors relative to penumbra at tol 1e-12`,
);
console.log(table(header, lines));
console.log(
  `reference (penumbra, tol 1e-12) vs Regge–Wheeler (tol 1e-12): max ${fmt(maximum(rows.map((r) => r.referenceVsReggeWheeler)))}; penumbra estimates below the true error: ${rows.filter((r) => r.error > r.relError).length} of ${rows.length}`,
);
const path = writeResult('tortoise-peer', {
  tol: TOL,
  peers: Object.fromEntries(Object.entries(peer).map(([k, v]) => [k, { ...v, results: undefined }])),
  summary,
  rows,
});
console.log(`written: ${path}`);
