// Section: Γ against the leading low-frequency formula.
import { greybody, lowFrequencyGreybody } from '@penumbra/flux';
import { halfLabel, mdTable, rel, sig, spinLabel } from './format.mjs';

const SOURCE = 'Page, Phys. Rev. D 13, 198 (1976), eqs. (13)–(14); Starobinsky & Churilov, Sov. Phys. JETP 38, 1 (1974)';

export function lowFrequencySection() {
  const cases = [
    [0, 0, 0, 0],
    [0, 1, 1, 0.9],
    [0.5, 0.5, 0.5, 0.9],
    [0.5, 1.5, -0.5, 0.5],
    [1, 1, 1, 0.7],
    [1, 1, -1, 0.99],
    [1, 2, 0, 0],
    [2, 2, 2, 0.9],
    [2, 2, 1, 0.5],
    [2, 3, 3, 0.99],
  ];
  const rows = cases.map(([spin, l, m, a]) => {
    const dev = [1e-3, 1e-4].map((omega) => {
      const g = greybody({ hole: { a }, mode: { field: { spin }, l, m }, omega });
      const f = lowFrequencyGreybody({ hole: { a }, mode: { field: { spin }, l, m }, omega });
      return { g: g.gamma, f, d: g.gamma / f - 1 };
    });
    const bound = 4 * 2 * Math.PI * 1e-4;
    const shrink = dev[0].d / dev[1].d;
    const pass = Math.abs(dev[1].d) < bound && shrink > 7 && shrink < 13 && Math.sign(dev[1].g) === Math.sign(dev[1].f);
    return [
      spinLabel(spin),
      halfLabel(l),
      halfLabel(m),
      a,
      sig(dev[1].g),
      sig(dev[1].f),
      rel(Math.abs(dev[0].d)),
      rel(Math.abs(dev[1].d)),
      sig(shrink, 3),
      pass ? 'yes' : '**no**',
      SOURCE,
    ];
  });
  return {
    title: 'Low-frequency limit of Γ',
    body: `
The leading low-frequency formula is a limit, not a value at a fixed frequency:
its first correction is about a factor 1 + 2πMω. The tests
(packages/flux/test/low-frequency.test.ts) therefore require |Γ/formula − 1|
< 4·2πMω at Mω = 1e-4 and a shrink of that deviation by a factor 7–13 from
Mω = 1e-3 to 1e-4. Γ at tolerance 1e-8 (default).

${mdTable(['s', 'l', 'm', 'a/M', 'Γ (Mω = 1e-4)', 'formula (Mω = 1e-4)', '|rel. diff.| Mω = 1e-3', '|rel. diff.| Mω = 1e-4', 'shrink 1e-3 → 1e-4', 'test criterion met', 'source'], rows)}
`,
  };
}
