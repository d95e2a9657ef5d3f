import {
  radialSeparationConstant,
  spheroidalEigenvalue,
  spheroidalEigenvalueComplex,
  spheroidalHarmonic,
} from '@penumbra/spheroidal';

// Gravitational (s = −2) l = m = 2 mode of a hole with a = 0.9 M at Mω = 0.5: c = aω.
const a = 0.9;
const omega = 0.5;
// The problem is { s, l, m, c } with s the signed spin weight of the Teukolsky equation.
const mode = spheroidalEigenvalue({ s: -2, l: 2, m: 2, c: a * omega });
const lambda = radialSeparationConstant(mode.A, a, omega, 2);
console.log(
  `A = ${mode.A.toFixed(12)}, E = ${mode.E.toFixed(12)}, λ = ${lambda.toFixed(12)} (${mode.diagnostics.method}, ${mode.diagnostics.truncation} terms, error ≤ ${mode.diagnostics.errorEstimate.toExponential(0)})`,
);

// The same mode for s = +2 obeys A_{−s} = A_{s} + 2s.
const plus = spheroidalEigenvalue({ s: 2, l: 2, m: 2, c: a * omega });
console.log(`A(s=+2) + 4 = ${(plus.A + 4).toFixed(12)}`);

// The harmonic on a few angles: S normalised to ∫|S|² sinθ dθ = 1, with dS/dθ.
const harmonic = spheroidalHarmonic({ s: -2, l: 2, m: 2, c: a * omega });
const { S, dS } = harmonic.sample([0, Math.PI / 4, Math.PI / 2]);
console.log(`S = ${Array.from(S, (v) => v.toFixed(8)).join(', ')}; dS/dθ = ${Array.from(dS, (v) => v.toFixed(8)).join(', ')}`);

// A frequency sweep: each call warm-starts from the previous c of the same mode.
const sweep = Array.from({ length: 5 }, (_, i) => spheroidalEigenvalue({ s: -2, l: 3, m: 1, c: 2 * i }).A);
console.log(`A(s=−2, l=3, m=1; c = 0, 2, …, 8) = ${sweep.map((v) => v.toFixed(6)).join(', ')}`);

// A damped mode: complex c = aω with Im ω < 0, continued from the real axis (|c| ≤ 10, |Im c| ≤ min(|Re c|, 4)).
const damped = spheroidalEigenvalueComplex({ s: -2, l: 2, m: 2, c: { re: a * 0.5, im: -a * 0.1 } });
console.log(
  `complex c: A = ${damped.A.re.toFixed(12)} ${damped.A.im < 0 ? '−' : '+'} ${Math.abs(damped.A.im).toFixed(12)}i (Leaver agreement ${damped.diagnostics.agreement.toExponential(1)})`,
);
