// Where the near-region (two-temperature) form of Γ holds: the ratio Γ_near/Γ
// against the exact greybody factor over (Mω, a) for every spin and the low
// modes, the edges of the 1 % and 10 % regions, the first-order rate
// (ratio − 1)/Mω as Mω → 0 (beside the same rate of the Page–Starobinsky
// low-frequency formula, Page, Phys. Rev. D 13, 198 (1976)), and the ratio near
// extremality as k = ω − mΩ_H → 0. Writes docs/near-region/*.csv, *.json, *.svg.
// Run: npm run build && node bench/near-region-map.mjs  (a few minutes on two cores).
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { logGrid, toCsv, toJsonTable } from '@penumbra/core';
import { lowFrequencyGreybody } from '@penumbra/flux';
import { kerrHole } from '@penumbra/kerr';
import { compareNearRegion, validityEdgesTable, validityMap, validityPointsTable } from '@penumbra/near-region';
import { renderSvg } from '@penumbra/plot';
import { benchDir } from './lib.mjs';

const out = join(benchDir, '..', 'docs', 'near-region');
mkdirSync(out, { recursive: true });
const TOL = 1e-6;
const SPINS = [0, 0.5, 1, 2];
const A_VALUES = [0.1, 0.3, 0.5, 0.7, 0.9, 0.99];
const OMEGAS = logGrid(1e-4, 1, 41); // ten points per decade
const spinText = (s) => (s === 0.5 ? '1/2' : String(s));
const mText = (m) => (Number.isInteger(m) ? String(m) : `${m < 0 ? '−' : ''}${Math.abs(2 * m)}/2`);

/** Low modes: l = s, s + 1 (l ≥ 1/2), each with m = −l, the smallest m ≥ 0, and m = l. */
function lowModes(spin) {
  const modes = [];
  for (const l of [Math.max(spin, 0), spin + 1]) {
    const ms = [...new Set([-l, Number.isInteger(l) ? 0 : 0.5, l])];
    for (const m of ms) modes.push({ field: { spin }, l, m });
  }
  return modes;
}

// 1. The map over (Mω, a).
const t0 = performance.now();
const maps = [];
for (const spin of SPINS) {
  for (const mode of lowModes(spin)) {
    maps.push(validityMap({ mode, aValues: A_VALUES, omegaValues: OMEGAS }, { tol: TOL }));
    process.stderr.write(`map: s = ${spinText(spin)}, l = ${mode.l}, m = ${mode.m} done\n`);
  }
}
const mapSeconds = (performance.now() - t0) / 1000;
writeFileSync(join(out, 'validity-points.csv'), toCsv(validityPointsTable(maps)));
const edges = validityEdgesTable(maps);
writeFileSync(join(out, 'validity-edges.csv'), toCsv(edges));
writeFileSync(join(out, 'validity-edges.json'), `${JSON.stringify(toJsonTable(edges), null, 2)}\n`);

console.log(`validity map: ${maps.length} modes × ${A_VALUES.length} a × ${OMEGAS.length} Mω in ${mapSeconds.toFixed(0)} s`);
console.log(
  'largest Mω on the grid (10 per decade) with |Γ_near/Γ − 1| ≤ 1 % / 10 % there and below; min–max over a = 0.1 … 0.99',
);
for (const map of maps) {
  const e1 = map.edges.map((e) => e.within1Percent ?? 0);
  const e10 = map.edges.map((e) => e.within10Percent ?? 0);
  const range = (v) => `${Math.min(...v).toExponential(1)}–${Math.max(...v).toExponential(1)}`;
  console.log(
    `  s = ${spinText(map.mode.field.spin)}, l = ${map.mode.l}, m = ${mText(map.mode.m)}: 1 %: ${range(e1)}, 10 %: ${range(e10)}`,
  );
}

// 2. The first-order rate as Mω → 0 at a = 0.5, against exact Γ; the Page–Starobinsky formula beside it.
const rates = [];
for (const spin of SPINS) {
  for (const mode of lowModes(spin)) {
    const row = { spin, l: mode.l, m: mode.m };
    for (const omega of [1e-3, 1e-4]) {
      const problem = { hole: { a: 0.5 }, mode, omega };
      const c = compareNearRegion(problem, { tol: 1e-9 });
      row[`near${omega}`] = (c.ratio - 1) / omega;
      row[`page${omega}`] = (lowFrequencyGreybody(problem) / c.gamma - 1) / omega;
    }
    rates.push(row);
  }
}
const rateColumns = [
  { name: 'spin', unit: '1' },
  { name: 'l', unit: '1' },
  { name: 'm', unit: '1' },
  { name: 'nearRegionRateAt1e-3', unit: 'M', description: '(Γ_near/Γ − 1)/ω at Mω = 1e-3, a = 0.5' },
  { name: 'nearRegionRateAt1e-4', unit: 'M', description: '(Γ_near/Γ − 1)/ω at Mω = 1e-4, a = 0.5' },
  { name: 'pageRateAt1e-4', unit: 'M', description: '(Γ_Page/Γ − 1)/ω at Mω = 1e-4, a = 0.5 (Page 1976)' },
];
const rateTable = {
  columns: rateColumns,
  rows: rates.map((r) => [r.spin, r.l, r.m, r['near0.001'], r['near0.0001'], r['page0.0001']]),
};
writeFileSync(join(out, 'rates.csv'), toCsv(rateTable));
console.log('\nfirst-order rate (ratio − 1)/Mω at a = 0.5 (a linear approach has equal rates at 1e-3 and 1e-4; −2π = −6.283)');
for (const r of rates) {
  console.log(
    `  s = ${spinText(r.spin)}, l = ${r.l}, m = ${mText(r.m)}: near region ${r['near0.001'].toFixed(3)} (1e-3), ${r['near0.0001'].toFixed(3)} (1e-4); Page formula ${r['page0.0001'].toFixed(3)}`,
  );
}

// 3. Near extremality as k = ω − mΩ_H → 0 (m = l > 0 modes; m = 0 has k = ω and is the low-frequency map above).
const EXTREMAL_A = [0.99, 0.999, 0.9999];
const K_VALUES = [-1e-2, -1e-3, -1e-4, 1e-4, 1e-3, 1e-2, 1e-1];
const extremalModes = [
  { field: { spin: 0 }, l: 1, m: 1 },
  { field: { spin: 0.5 }, l: 0.5, m: 0.5 },
  { field: { spin: 1 }, l: 1, m: 1 },
  { field: { spin: 2 }, l: 2, m: 2 },
];
const extremalRows = [];
for (const a of EXTREMAL_A) {
  const omegaH = kerrHole({ a }).omegaH;
  for (const mode of extremalModes) {
    for (const k of K_VALUES) {
      const omega = mode.m * omegaH + k;
      if (mode.field.spin === 0.5 && k < 0) continue; // fermions: no superradiant band to probe
      const c = compareNearRegion({ hole: { a }, mode, omega }, { tol: TOL });
      extremalRows.push([mode.field.spin, mode.l, mode.m, a, k, omega, c.TR, c.gammaNearRegion, c.gamma, c.ratio]);
    }
  }
}
const extremalTable = {
  columns: [
    { name: 'spin', unit: '1' },
    { name: 'l', unit: '1' },
    { name: 'm', unit: '1' },
    { name: 'a', unit: 'M' },
    { name: 'k', unit: '1/M', description: 'k = ω − mΩ_H' },
    { name: 'omega', unit: '1/M' },
    { name: 'TR', unit: '1', description: 'right temperature' },
    { name: 'gammaNearRegion', unit: '1' },
    { name: 'gamma', unit: '1' },
    { name: 'ratio', unit: '1', description: 'Γ_near/Γ' },
  ],
  rows: extremalRows,
};
writeFileSync(join(out, 'near-extremal.csv'), toCsv(extremalTable));
console.log('\nnear extremality, ω = mΩ_H + k (Mω ≈ m/2): Γ_near/Γ');
for (const row of extremalRows) {
  console.log(`  s = ${spinText(row[0])}, l = m = ${row[1]}, a = ${row[3]}, Mk = ${row[4]}: ${row[9].toExponential(2)}`);
}

// 4. Figures.
const panels = SPINS.map((spin) => ({
  title: `s = ${spinText(spin)}`,
  series: maps
    .filter((map) => map.mode.field.spin === spin)
    .flatMap((map) =>
      [
        ['within 1 %', 'within1Percent'],
        ['within 10 %', 'within10Percent'],
      ].map(([dash, key]) => ({
        name: `l = ${map.mode.l}, m = ${mText(map.mode.m)}`,
        dash,
        points: map.edges.filter((e) => e[key] !== null).map((e) => [e.a, e[key]]),
      })),
    )
    .filter((series) => series.points.length > 0),
}));
const mapFigure = {
  title: 'Where the near-region form holds',
  subtitle: 'largest Mω with |Γ_near/Γ − 1| within 1 % (solid) and 10 % (dashed)',
  x: { title: 'a', unit: 'M', scale: 'linear', domain: [0, 1] },
  y: { title: 'Mω', scale: 'log', format: '.0e' },
  panels,
  legend: { title: 'mode', position: 'bottom', dashes: ['within 1 %', 'within 10 %'] },
  markers: true,
  width: 260,
  height: 260,
};
writeFileSync(join(out, 'validity-map.svg'), `${await renderSvg(mapFigure)}\n`);

const extremalFigure = {
  title: 'Near extremality, ω = mΩ_H + k',
  subtitle: 'Γ_near/Γ for m = l modes; Mω ≈ m/2 is not small',
  x: { title: 'k', unit: '1/M', scale: 'symlog', symlogConstant: 1e-4 },
  y: { title: 'Γ_near/Γ', scale: 'log', format: '.0e' },
  panels: EXTREMAL_A.map((a) => ({
    title: `a = ${a}`,
    series: extremalModes.map((mode) => ({
      name: `s = ${spinText(mode.field.spin)}, l = m = ${mText(mode.l)}`,
      points: extremalRows.filter((r) => r[3] === a && r[0] === mode.field.spin).map((r) => [r[4], r[9]]),
    })),
  })),
  legend: { title: 'mode' },
  markers: true,
  width: 260,
  height: 260,
};
writeFileSync(join(out, 'near-extremal.svg'), `${await renderSvg(extremalFigure)}\n`);
console.log(
  `\nwrote ${out}/{validity-points.csv, validity-edges.csv, validity-edges.json, rates.csv, near-extremal.csv, validity-map.svg, near-extremal.svg}`,
);
