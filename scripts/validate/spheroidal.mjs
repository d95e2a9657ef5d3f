// Section: spheroidal eigenvalues against a reference library's oblate
// characteristic values and the small-c series.
import { readFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { smallCSeries, spheroidalEigenvalue } from '@penumbra/spheroidal';
import { halfLabel, mdTable, rel, sig, spinLabel } from './format.mjs';

function oblateBlock(root) {
  const file = join(root, 'packages/spheroidal/test/fixtures/oblate-cv.json');
  const fixture = JSON.parse(readFileSync(file, 'utf8'));
  const rows = (fixture.rows ?? []).filter(
    (r) => ['m', 'l', 'c'].every((k) => typeof r[k] === 'number') && typeof (r.A ?? r.cv) === 'number',
  );
  const byM = new Map();
  const picked = [];
  for (const r of rows) {
    const ref = r.A ?? r.cv;
    // both signs of (m, c): A_{s l −m}(−c) = A_{s l m}(c)
    const d = Math.max(
      ...[1, -1].map((sign) => {
        const A = spheroidalEigenvalue({ s: 0, l: r.l, m: sign * r.m, c: sign * r.c }, { continuation: false }).A;
        return Math.abs(A - ref) / Math.abs(ref);
      }),
    );
    const e = byM.get(r.m) ?? { n: 0, worst: 0, at: '' };
    e.n++;
    if (d > e.worst) [e.worst, e.at] = [d, `l = ${r.l}, c = ${r.c}`];
    byM.set(r.m, e);
    if (r.l === r.m + 1 && [1, 5, 20].includes(r.c)) {
      picked.push([r.m, r.l, r.c, sig(spheroidalEigenvalue({ s: 0, l: r.l, m: r.m, c: r.c }).A, 15), sig(ref, 15), rel(d)]);
    }
  }
  const source = `${fixture.source ?? 'fixture'}, a general-purpose reference library (oblate characteristic values, the convention of Abramowitz & Stegun ch. 21, Table 21.1); ${fixture.convention ?? ''}`;
  return `s = 0 against \`${relative(root, file)}\` (made by make_oblate_fixture.py beside it); source: ${source}. The test
(packages/spheroidal/test/eigenvalue.test.ts) requires 1e-13 relative for both signs of (m, c).

${mdTable(
  ['m', 'rows (l = m … m + 7, 0.1 ≤ c ≤ 20)', 'max rel. diff.', 'at'],
  [...byM.entries()].map(([m, e]) => [m, e.n, rel(e.worst), e.at]),
)}

Sample rows (l = m + 1):

${mdTable(['m', 'l', 'c', 'A (penumbra)', 'obl_cv', 'rel. diff.'], picked)}`;
}

function smallCBlock() {
  const asRows = [];
  for (const [l, m] of [
    [0, 0],
    [1, 0],
    [1, 1],
    [2, 1],
    [3, 2],
    [5, 0],
    [8, 4],
  ]) {
    const expected = -0.5 * (1 - ((2 * m - 1) * (2 * m + 1)) / ((2 * l - 1) * (2 * l + 3)));
    const got = smallCSeries(0, l, m)[2];
    asRows.push([
      l,
      m,
      sig(got, 15),
      sig(expected, 15),
      rel(Math.abs(got - expected)),
      'Abramowitz & Stegun 21.7.6 with c² → −c² (formula from memory)',
    ]);
  }
  const seriesRows = [];
  for (const [s, l, m] of [
    [-2, 2, 2],
    [-1, 1, -1],
    [0.5, 0.5, 0.5],
    [1, 3, 2],
    [2, 2, 0],
    [2, 4, -3],
  ]) {
    const [A0, A1, A2] = smallCSeries(s, l, m);
    for (const c of [0.01, 0.02]) {
      const A = spheroidalEigenvalue({ s, l, m, c }, { continuation: false }).A;
      seriesRows.push([
        spinLabel(s),
        halfLabel(l),
        halfLabel(m),
        c,
        sig(A, 14),
        sig(A0 + A1 * c + A2 * c * c, 14),
        sig(Math.abs(A - (A0 + A1 * c + A2 * c * c)), 2),
        sig(2 * c ** 3, 2),
        'Press & Teukolsky, ApJ 185, 649 (1973); Seidel, Class. Quantum Grav. 6, 1057 (1989)',
      ]);
    }
  }
  return `Second-order coefficient of the small-c expansion at s = 0 (absolute difference):

${mdTable(['l', 'm', 'A₂ (penumbra)', 'A₂ (formula)', 'abs. diff.', 'source'], asRows)}

Small-c series to second order: the remainder must be O(c³) (test bound 2c³):

${mdTable(['s', 'l', 'm', 'c', 'A (penumbra)', 'A₀ + A₁c + A₂c²', 'remainder', 'bound 2c³', 'source'], seriesRows)}`;
}

export function spheroidalSection(root) {
  return { title: 'Spheroidal eigenvalues', body: [oblateBlock(root), smallCBlock()].join('\n\n') };
}
