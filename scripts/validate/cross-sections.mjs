// Section: absorption cross-sections at a = 0 against their low- and
// high-frequency limits; and the σ(ω) figure.
import { absorptionCrossSection } from '@penumbra/flux';
import { SPINS, inLegendOrder, mdTable, rel, sig, spinLabel, spinName } from './format.mjs';

export function crossSectionSection() {
  const AH = 16 * Math.PI;
  const w = 1e-3;
  const low = [
    [0, AH, 'A_H = 16πM²', 'Das, Gibbons & Mathur, Phys. Rev. Lett. 78, 417 (1997)'],
    [0.5, 2 * Math.PI, '2πM²', 'Page (1976) low-frequency formula summed over m = ±1/2'],
    [1, (4 / 3) * AH * w * w, '(4/3) A_H M²ω²', 'Page (1976) low-frequency formula, l = 1'],
    [2, (16 / 45) * AH * w ** 4, '(16/45) A_H M⁴ω⁴', 'Page (1976) low-frequency formula, l = 2'],
  ].map(([spin, expected, label, source]) => {
    const r = absorptionCrossSection({ hole: { a: 0 }, field: { spin }, omega: w });
    return [
      spinLabel(spin),
      w,
      sig(r.sigma),
      `${label} = ${sig(expected)}`,
      rel(Math.abs(r.sigma / expected - 1)),
      rel(2 * Math.PI * w),
      source,
    ];
  });
  const capture = [];
  for (const spin of SPINS) {
    for (const omega of [3, 5]) {
      const r = absorptionCrossSection({ hole: { a: 0 }, field: { spin }, omega }, { tol: 1e-6 });
      capture.push([
        spinLabel(spin),
        omega,
        sig(r.sigma),
        sig(27 * Math.PI),
        rel(Math.abs(r.sigma / (27 * Math.PI) - 1)),
        r.diagnostics.lMax,
        rel(r.diagnostics.droppedBound / r.sigma),
        'Misner, Thorne & Wheeler, *Gravitation* (1973): geometric-optics capture cross-section 27πM²',
      ]);
    }
  }
  return {
    title: 'Absorption cross-sections (a = 0)',
    body: `
Low frequency (Mω = 1e-3, default tolerance). The expected deviation of a
leading-order limit is of order 2πMω (shown for scale); the tests allow
4·2πMω for s = 0, 1/2 and 5 % for s = 1, 2.

${mdTable(['s', 'Mω', 'σ/M² (penumbra)', 'limit', '|rel. diff.|', '2πMω', 'source'], low)}

High frequency (tolerance 1e-6): σ approaches 27πM² with oscillations that
decay like 1/(Mω); the test for s = 0 allows 3 % at Mω = 3 and 2 % at Mω = 5.

${mdTable(['s', 'Mω', 'σ/M² (penumbra)', '27π', '|rel. diff.|', 'l_max summed', 'dropped-tail bound (rel.)', 'source'], capture)}
`,
  };
}

export function crossSectionFigure() {
  const omegas = Array.from({ length: 36 }, (_, i) => 0.02 * Math.pow(300, i / 35));
  const series = SPINS.map((spin) => ({
    name: spinName[spin],
    points: omegas.map((omega) => [
      omega,
      absorptionCrossSection({ hole: { a: 0 }, field: { spin }, omega }, { tol: 1e-6 }).sigma,
    ]),
  }));
  return {
    name: 'cross-section',
    caption:
      'σ(ω) for the four fields at a = 0 approaching the geometric-optics capture cross-section 27πM² (the scalar tends to the horizon area 16πM² as ω → 0)',
    figure: {
      style: 'report',
      title: 'Absorption cross-section σ(ω) at a = 0',
      width: 520,
      height: 300,
      x: { title: 'Mω', scale: 'log' },
      y: { title: 'σ / M²' },
      series: inLegendOrder(series),
      legend: { title: 'field' },
      markers: 14,
      rules: [
        { y: 27 * Math.PI, label: '27πM² (capture)' },
        { y: 16 * Math.PI, label: '16πM² = A_H (s = 0, ω → 0)' },
      ],
    },
  };
}
