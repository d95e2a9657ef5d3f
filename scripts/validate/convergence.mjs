// Section: achieved error of Γ against the requested tolerance, with its
// two figures (against the tolerance, against the cost).
import { greybody } from '@penumbra/flux';
import { halfLabel, inLegendOrder, mdTable, rel, spinLabel } from './format.mjs';

const MODES = [
  { spin: 0, l: 1, m: 1, a: 0.7, omega: 0.4 },
  { spin: 0.5, l: 1.5, m: 0.5, a: 0.99, omega: 0.8 },
  { spin: 1, l: 2, m: -1, a: 0.7, omega: 0.15 },
  { spin: 2, l: 2, m: 2, a: 0.99, omega: 1.2 },
  { spin: 2, l: 3, m: 3, a: 0.99, omega: 0.05 },
];
const TOLERANCES = [1e-2, 1e-3, 1e-4, 1e-5, 1e-6, 1e-7, 1e-8, 1e-9, 1e-10, 1e-11];
/** Errors below this are drawn at it (a log axis cannot show zero). */
const FLOOR = 1e-15;

export function convergenceStudy() {
  const rows = [];
  const byTolerance = [];
  const byCost = [];
  for (const mode of MODES) {
    const problem = { hole: { a: mode.a }, mode: { field: { spin: mode.spin }, l: mode.l, m: mode.m }, omega: mode.omega };
    const ref = greybody(problem, { tol: 1e-12, reflection: false }).gamma;
    const label = `s = ${spinLabel(mode.spin)}, l = ${halfLabel(mode.l)}, m = ${halfLabel(mode.m)}, a = ${mode.a}, Mω = ${mode.omega}`;
    const runs = TOLERANCES.map((tol) => {
      const r = greybody(problem, { tol, reflection: false });
      return { tol, achieved: Math.max(Math.abs(r.gamma / ref - 1), FLOOR), rhs: r.diagnostics.rhsEvaluations };
    });
    rows.push([label, rel(Math.max(...runs.map((d) => d.achieved / d.tol)))]);
    byTolerance.push({ name: label, points: runs.map((d) => [d.tol, d.achieved]) });
    byCost.push({ name: label, points: runs.map((d) => [d.rhs, d.achieved]) });
  }
  const errorAxis = { title: '|Γ/Γ(tol 1e-12) − 1|', scale: 'log', format: '.0e' };
  const common = {
    style: 'report',
    width: 420,
    height: 300,
    y: errorAxis,
    legend: { title: 'mode', position: 'bottom' },
    markers: true,
  };
  const figures = [
    {
      name: 'convergence-tolerance',
      caption:
        'Convergence: achieved relative error of Γ against the requested tolerance (dashed: error = tolerance; errors below 1e-15 drawn at 1e-15)',
      figure: {
        ...common,
        title: 'Achieved error against requested tolerance (Γ only)',
        x: { title: 'requested tolerance', scale: 'log', format: '.0e' },
        series: inLegendOrder(byTolerance),
        guide: [
          [1e-11, 1e-11],
          [1e-2, 1e-2],
        ],
      },
    },
    {
      name: 'convergence-cost',
      caption:
        'Convergence: achieved relative error of Γ against the number of right-hand-side evaluations (all solves, including the error-estimate solve)',
      figure: {
        ...common,
        title: 'Achieved error against cost (Γ only)',
        x: { title: 'right-hand-side evaluations', scale: 'log', nice: false },
        series: inLegendOrder(byCost),
        join: 'given', // from the loosest tolerance to the tightest
      },
    },
  ];
  const section = {
    title: 'Convergence',
    body: `Largest ratio achieved error / requested tolerance over tolerances 1e-2 … 1e-11
(reference: tolerance 1e-12):

${mdTable(['mode', 'max achieved/requested'], rows)}`,
  };
  return { section, figures };
}
