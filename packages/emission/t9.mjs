import { emissionTotals } from '@penumbra/emission';
const r = emissionTotals({ spin: 1, a: +process.argv[2] }, { tol: +process.argv[3] });
const d = r.diagnostics; const v=[r.numberRate.value, r.power.value, r.torque.value];
console.log(d.attempts, d.gammaCalls, d.modesIntegrated, d.modesSkipped, d.lMax, [0,1,2].map(i=>[d.quadratureError[i]/v[i], d.greybodyError[i]/v[i], d.truncationBound[i]/v[i]].map(x=>x.toExponential(1)).join(' ')));
