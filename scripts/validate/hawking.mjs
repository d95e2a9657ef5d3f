// Section: Hawking power of a Schwarzschild hole against the published
// figures; and the emission-spectrum figure.
import { emissionSpectrum, emissionTotals } from '@penumbra/emission';
import { SPINS, inLegendOrder, mdTable, rel, sig, spinLabel, spinName } from './format.mjs';

const PAGE = [
  [0, 1, 7.44e-5, 'one real massless scalar'],
  [0.5, 2, 8.18e-5, 'one two-component neutrino species with its antiparticle'],
  [1, 2, 3.36e-5, 'photon, both polarisations'],
  [2, 2, 3.84e-6, 'graviton, both polarisations'],
];

export function hawkingPowerSection() {
  const rows = PAGE.map(([spin, dof, page, what]) => {
    const r = emissionTotals({ hole: { a: 0 }, field: { spin } }, { tol: 1e-5 });
    const p = r.power.value * dof;
    return [
      spinLabel(spin),
      what,
      dof,
      sig(p, 4),
      sig(page, 3),
      rel(Math.abs(p / page - 1)),
      rel(r.power.relError),
      'Page, Phys. Rev. D 13, 198 (1976) (values from memory, three figures)',
    ];
  });
  return {
    title: 'Hawking power of a Schwarzschild hole',
    body: `
dE/dt in units ħc⁶/(G²M²) from @penumbra/emission (emissionTotals, tolerance
1e-5) times the degrees of freedom. The published figures carry three
significant figures, so agreement is expected to about 1e-3.

${mdTable(['s', 'field', 'dof', 'penumbra', 'published', '|rel. diff.|', 'estimated rel. error', 'source'], rows)}
`,
  };
}

export function emissionFigure() {
  const grid = { spacing: 'linear', from: 0.01, to: 1.6, count: 48 };
  const panels = [0, 0.99].map((a) => ({
    title: `a = ${a}`,
    series: inLegendOrder(
      SPINS.map((spin) => ({
        name: spinName[spin],
        points: emissionSpectrum({ hole: { a }, field: { spin }, grid }, { tol: 1e-4 }).points.map((p) => [p.omega, p.energy]),
      })),
    ),
  }));
  return {
    name: 'emission',
    caption:
      'Emission spectra of the four fields (one degree of freedom each) at a = 0 and a = 0.99 M, from @penumbra/emission (tolerance 1e-4)',
    figure: {
      style: 'report',
      title: 'Hawking emission per degree of freedom, d²E/(dt dω)',
      width: 300,
      height: 240,
      x: { title: 'Mω' },
      y: { title: 'd²E/(dt dω)  (ħ = 1, M = 1)' },
      panels,
      panelY: 'independent',
      legend: { title: 'field' },
    },
  };
}
