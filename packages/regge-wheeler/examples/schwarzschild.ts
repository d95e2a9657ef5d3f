import { schwarzschildGreybody } from '@penumbra/regge-wheeler';

// Photon, l = 1, around the peak of the spectrum of a hole of mass M = 1.
// The problem has no m: at a = 0 the greybody factor does not depend on it.
const photon = schwarzschildGreybody({ field: { spin: 1 }, l: 1, omega: 0.25 });
console.log(
  `photon l=1: Γ = ${photon.gamma.toPrecision(12)}, errorEstimate ≈ ${photon.diagnostics.errorEstimate.toExponential(1)}`,
);

// Low frequency: Γ ~ (Mω)^(2l+2) is computed from |A_in|, never from 1 − R; tol is an option.
const graviton = schwarzschildGreybody({ field: { spin: 2 }, l: 2, omega: 1e-3 }, { tol: 1e-10 });
console.log(
  `graviton l=2 at Mω = 1e-3: Γ = ${graviton.gamma.toExponential(10)}, |Γ + R − 1| = ${graviton.residual.toExponential(1)}`,
);

// A neutrino (spin '1/2', the Dirac potential), l = 1/2.
const neutrino = schwarzschildGreybody({ field: { spin: '1/2' }, l: 0.5, omega: 0.2 });
console.log(
  `neutrino l=1/2: Γ = ${neutrino.gamma.toPrecision(12)} (${neutrino.diagnostics.steps} steps, ${neutrino.diagnostics.rhsEvaluations} RHS evaluations)`,
);
