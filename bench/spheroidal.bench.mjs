#!/usr/bin/env node
// Spheroidal eigenvalue/harmonic cost. Run on the built package:
//   npx tsc -b packages/spheroidal && node bench/spheroidal.bench.mjs
// Workload (issue 3): s = −2, l = 2…10, every m, 200 values of c in [0, 10].
// Prints the median time per eigenvalue with continuation along c and cold,
// the same with the harmonic sampled on 64 θ points, and the accuracy:
// warm vs cold and the spectral vs Leaver continued-fraction agreement.
import { clearSpheroidalCache, spheroidalEigenvalue, spheroidalHarmonic } from '../packages/spheroidal/dist/index.js';

const s = -2;
const cs = Array.from({ length: 200 }, (_, i) => (10 * i) / 199);
const thetas = Array.from({ length: 64 }, (_, i) => (Math.PI * i) / 63);
const modes = [];
for (let l = 2; l <= 10; l++) for (let m = -l; m <= l; m++) modes.push({ l, m });

function median(xs) {
  const v = [...xs].sort((a, b) => a - b);
  return v[Math.floor(v.length / 2)];
}

function sweep({ warm, harmonic }) {
  const times = [];
  const values = new Map();
  for (const { l, m } of modes) {
    if (!warm) clearSpheroidalCache();
    for (const c of cs) {
      const q = { s, l, m, c };
      const t0 = process.hrtime.bigint();
      let A;
      if (harmonic) {
        const h = spheroidalHarmonic(q, { continuation: warm });
        h.sample(thetas);
        A = h.A;
      } else {
        A = spheroidalEigenvalue(q, { continuation: warm }).A;
      }
      times.push(Number(process.hrtime.bigint() - t0) / 1e3);
      values.set(`${l},${m},${c}`, A);
    }
  }
  return { median: median(times), mean: times.reduce((a, b) => a + b, 0) / times.length, values };
}

// Warm the JIT once.
sweep({ warm: true, harmonic: true });
clearSpheroidalCache();
const warmEig = sweep({ warm: true, harmonic: false });
clearSpheroidalCache();
const warmHarm = sweep({ warm: true, harmonic: true });
const coldEig = sweep({ warm: false, harmonic: false });
const coldHarm = sweep({ warm: false, harmonic: true });

let warmVsCold = 0;
for (const [key, A] of warmEig.values) {
  const B = coldEig.values.get(key);
  warmVsCold = Math.max(warmVsCold, Math.abs(A - B) / Math.max(1, Math.abs(B)));
}
let leaverAgreement = 0;
for (const { l, m } of modes) {
  for (const c of cs.filter((_, i) => i % 20 === 7)) {
    const r = spheroidalEigenvalue({ s, l, m, c }, { continuation: false, leaver: 'check' });
    leaverAgreement = Math.max(leaverAgreement, r.diagnostics.agreement);
  }
}

const n = modes.length * cs.length;
console.log(`spheroidal eigenvalues, s = −2, l = 2…10, all m (${modes.length} modes) × 200 c in [0, 10] = ${n} solves`);
console.log(`  with continuation: median ${warmEig.median.toFixed(2)} µs (mean ${warmEig.mean.toFixed(2)} µs) per eigenvalue`);
console.log(
  `                     median ${warmHarm.median.toFixed(2)} µs (mean ${warmHarm.mean.toFixed(2)} µs) per eigenvalue + S, dS on 64 θ`,
);
console.log(`  cold:              median ${coldEig.median.toFixed(2)} µs (mean ${coldEig.mean.toFixed(2)} µs) per eigenvalue`);
console.log(
  `                     median ${coldHarm.median.toFixed(2)} µs (mean ${coldHarm.mean.toFixed(2)} µs) per eigenvalue + S, dS on 64 θ`,
);
console.log(
  `accuracy: warm vs cold max |ΔA|/max(1,|A|) = ${warmVsCold.toExponential(1)}; spectral vs Leaver continued fraction (${modes.length * 10} points) max = ${leaverAgreement.toExponential(1)}`,
);
console.log(`target: < 20 µs per eigenvalue with continuation — ${warmEig.median < 20 ? 'met' : 'NOT met'}`);
