/**
 * f(M, a*) and g(M, a*): the mass- and spin-loss rates of a hole of physical
 * mass M emitting species with masses (Page, Phys. Rev. D 14, 3260 (1976),
 * extended to massive species):
 *   f = −M² dM/dt = Σ_i dof_i P̂_{s_i}(M μ_i, a*),
 *   g = −(M/a*) dJ/dt = Σ_i dof_i Ĵ_{s_i}(M μ_i, a*)/a*   (G = c = ħ = 1),
 * with Mμ_i = G M m_i/(ħ c). Per dof, P̂ = P̂(0, a*)·R_P(Mμ, a*): the massless
 * factor from the Page table (pageTable.ts), the ratio from the massive rate
 * table (massiveRateTable.ts), interpolated as ln R (local cubic in Mμ and in
 * θ = arcsin a*). Past the largest tabulated Mμ, ln R is continued linearly
 * (the Boltzmann tail); such species carry less than R at that node.
 */
import { InputError, numberIn, parseFieldSpin, requireFinite, type FieldSpin } from '@penumbra/core';
import { CODATA2018 } from '@penumbra/kerr';
import { halvedNodeError, localCubic, windowSpread } from './localCubic.js';
import { bundledMassiveRateTable, type MassiveRateTable } from './massiveRateTable.js';
import { bundledPageTable, type PageTable } from './pageTable.js';
import { requireProblem } from './validate.js';

/** Field mass Mμ = G M m/(ħ c) of a species of 1 GeV/c² on a hole of 1 g (CODATA 2018 constants). */
export const FIELD_MASS_PER_GRAM_GEV = (CODATA2018.G * 1e-3 * 1e9 * CODATA2018.eV) / (CODATA2018.hbar * CODATA2018.c ** 3);

/** A species with a rest mass, as the mass-loss rates take it. */
export interface EmittedSpecies {
  name: string;
  spin: FieldSpin;
  /** degrees of freedom */
  dof: number;
  /** rest mass m c² in GeV (0 for a massless species) */
  massGeV: number;
  /** quarks and gluons 'parton' (emitted only while T_H > the confinement scale), pions 'hadron' (only while T_H ≤ it) */
  qcd?: 'parton' | 'hadron';
}

/** The species and, optionally, the tables the rates are built from. */
export interface MassLossProblem {
  readonly species: readonly EmittedSpecies[];
  /** massless per-dof rates over a* (default: bundledPageTable()) */
  readonly pageTable?: PageTable;
  /** massive/massless ratios over (Mμ, a*) (default: bundledMassiveRateTable()) */
  readonly massiveTable?: MassiveRateTable;
  /** T_H (GeV) above which partons and below which hadrons are emitted (default 0.3; common practice, no source); the switch is smoothed over about ±2 % of it */
  readonly confinementScaleGeV?: number;
}

/** f, g and each species' share at one (M, a*). */
export interface MassLossPoint {
  f: number;
  g: number;
  /** per species: dof·P̂ (share of f) and dof·Ĵ/a* (share of g), in the order of `species` */
  species: { name: string; power: number; torqueOverA: number }[];
}

/** f(M, a*), g(M, a*) of a content, with error estimates. */
export interface MassLossRates {
  species: EmittedSpecies[];
  /** f, g and the shares of each species at a hole mass in grams and a* */
  at: (massGrams: number, aStar: number) => MassLossPoint;
  /** f(M, a*) = −M² dM/dt (G = c = ħ = 1) for M in grams */
  f: (massGrams: number, aStar: number) => number;
  /** g(M, a*) = −(M/a*) dJ/dt (G = c = ħ = 1) for M in grams */
  g: (massGrams: number, aStar: number) => number;
  /** largest a* of the tables */
  aMax: number;
  /** the confinement scale used, GeV */
  confinementScaleGeV: number;
  /** the heaviest species' mass in GeV (0 if all are massless): below M = 1e-4/(m·FIELD_MASS_PER_GRAM_GEV) grams every species has Mμ ≤ 1e-4 */
  heaviestMassGeV: number;
  /** relative interpolation error estimates (massless table + ratio table) */
  interpolationError: { f: number; g: number };
  /** relative error of the table nodes (massless + ratio) */
  nodeError: { f: number; g: number };
}

/** A species list, each checked; a massive species of a spin without a massive route is refused. */
export function checkSpecies(value: unknown, rows: readonly FieldSpin[]): EmittedSpecies[] {
  if (!Array.isArray(value) || value.length === 0)
    throw new InputError('species', 'a non-empty list of {name, spin, dof, massGeV}', value);
  return value.map((s, i) => {
    const at = `species[${i}]`;
    if (typeof s !== 'object' || s === null) throw new InputError(at, '{name, spin, dof, massGeV}', s);
    const name = typeof s.name === 'string' ? s.name : `species ${i}`;
    const spin = parseFieldSpin(s.spin, `${at}.spin`);
    const dof = requireFinite(`${at}.dof`, s.dof, 'a finite number ≥ 0');
    if (!(dof >= 0)) throw new InputError(`${at}.dof`, 'a finite number ≥ 0', dof);
    const massGeV = requireFinite(`${at}.massGeV`, s.massGeV ?? 0, 'a finite mass ≥ 0 in GeV');
    if (!(massGeV >= 0 && massGeV <= 1e19)) throw new InputError(`${at}.massGeV`, 'a mass from 0 to 1e19 GeV', massGeV);
    if (massGeV > 0 && !rows.includes(spin))
      throw new InputError(`${at}.massGeV`, `0 for spin ${spin} (massive spins ${rows.join(', ')})`, massGeV);
    if (s.qcd !== undefined && s.qcd !== 'parton' && s.qcd !== 'hadron')
      throw new InputError(`${at}.qcd`, "'parton', 'hadron' or absent", s.qcd);
    return s.qcd ? { name, spin, dof, massGeV, qcd: s.qcd } : { name, spin, dof, massGeV };
  });
}

/**
 * Interpolation error of a short (cut-short) ratio row in θ, where localCubic
 * is linear (2 or 3 nodes) or a single cubic (4 nodes): at each interval's
 * midpoint, the difference between the linear interpolant and the polynomial
 * through all the nodes; with two nodes, the change of R across the interval.
 */
function shortRowError(theta: readonly number[], values: readonly number[]): number {
  const n = theta.length;
  let worst = 0;
  for (let j = 1; j < n; j++) {
    if (n === 2) {
      worst = Math.max(worst, Math.abs(values[1] - values[0]));
      continue;
    }
    const x = 0.5 * (theta[j - 1] + theta[j]);
    let full = 0;
    for (let k = 0; k < n; k++) {
      let w = 1;
      for (let q = 0; q < n; q++) if (q !== k) w *= (x - theta[q]) / (theta[k] - theta[q]);
      full += w * values[k];
    }
    worst = Math.max(worst, Math.abs(full - 0.5 * (values[j - 1] + values[j])));
  }
  return worst;
}

/**
 * f(M, a*) and g(M, a*) of a list of species with masses, from the massless
 * Page table and the massive ratio table. Throws InputError for a bad species
 * list (a massive species of a spin the ratio table lacks included).
 *
 * @example massLossRates({ species: [{ name: 'electron', spin: 0.5, dof: 4, massGeV: 0.000511 }] }).f(1e15, 0)
 */
export function massLossRates(problem: MassLossProblem): MassLossRates {
  const p = requireProblem(problem, ['species', 'pageTable', 'massiveTable', 'confinementScaleGeV']);
  const scale = p.confinementScaleGeV === undefined ? 0.3 : numberIn(1e-3, 1e3)(p.confinementScaleGeV, 'confinementScaleGeV');
  const page = (p.pageTable as PageTable | undefined) ?? bundledPageTable();
  const ratios = (p.massiveTable as MassiveRateTable | undefined) ?? bundledMassiveRateTable();
  const species = checkSpecies(
    p.species,
    ratios.spins.map((r) => r.spin),
  );
  const pageRow = new Map(page.spins.map((r) => [r.spin, r]));
  for (const [i, s] of species.entries())
    if (!pageRow.has(s.spin))
      throw new InputError(`species[${i}].spin`, `a spin of the Page table (${[...pageRow.keys()].join(', ')})`, s.spin);
  const ratioRow = new Map(ratios.spins.map((r) => [r.spin, r]));
  const mus = ratios.fieldMass;
  const lnP = new Map(
    ratios.spins.map((r) => [r.spin, r.powerRatio.map((row) => row.map((x) => Math.log(Math.max(x, 1e-300))))]),
  );
  const lnJ = new Map(
    ratios.spins.map((r) => [r.spin, r.torqueRatio.map((row) => row.map((x) => Math.log(Math.max(x, 1e-300))))]),
  );
  // the a* range: the Page table's, and that of every ratio row a massive species uses
  const massiveSpins = new Set(species.filter((sp) => sp.massGeV > 0).map((sp) => sp.spin));
  const aMax = Math.min(
    page.aStar[page.aStar.length - 1],
    ...ratios.spins.filter((r) => massiveSpins.has(r.spin)).map((r) => r.aStar[r.aStar.length - 1]),
  );
  const spinsUsed = [...new Set(species.map((s) => s.spin))];

  /** ln R over the field-mass nodes at θ, for one spin and quantity. */
  const columnAt = (table: number[][], theta: readonly number[], th: number) =>
    table.map((row) => localCubic(theta, row, th, true));
  const lnRatio = (column: number[], mu: number) => {
    if (mu <= 0) return 0;
    const n = mus.length;
    if (mu <= mus[n - 1]) return localCubic(mus, column, mu);
    const slope = (column[n - 1] - column[n - 2]) / (mus[n - 1] - mus[n - 2]);
    return column[n - 1] + Math.min(slope, 0) * (mu - mus[n - 1]);
  };

  const at = (massGrams: number, aStar: number): MassLossPoint => {
    const M = requireFinite('massGrams', massGrams, 'a hole mass in grams > 0');
    if (!(M > 0)) throw new InputError('massGrams', 'a hole mass in grams > 0', M);
    const a = requireFinite('aStar', aStar);
    if (!(Math.abs(a) <= aMax)) throw new InputError('aStar', `|a*| ≤ ${aMax} (the tables' range)`, a);
    const th = Math.asin(Math.abs(a));
    const thPage = Math.min(th, page.theta[page.theta.length - 1]);
    const massless = new Map(
      spinsUsed.map((spin) => {
        const r = pageRow.get(spin)!;
        return [spin, [localCubic(page.theta, r.power, thPage, true), localCubic(page.theta, r.torqueOverA, thPage, true)]];
      }),
    );
    const columns = new Map<FieldSpin, number[][]>();
    // confinement: T_H of this hole in GeV against the scale
    const root = Math.sqrt(Math.max(0, 1 - a * a));
    const temperatureGeV = root / (4 * Math.PI * (1 + root) * M * FIELD_MASS_PER_GRAM_GEV);
    // the switch is smoothed over about ±2 % of the scale so that an ODE can step through it
    const hot = 1 / (1 + (scale / temperatureGeV) ** 100);
    let f = 0;
    let g = 0;
    const rows = species.map((s) => {
      const share = s.qcd === 'parton' ? hot : s.qcd === 'hadron' ? 1 - hot : 1;
      if (share < 1e-300) return { name: s.name, power: 0, torqueOverA: 0 };
      const [p0, j0] = massless.get(s.spin)!;
      let rp = 1;
      let rj = 1;
      const mu = s.massGeV * M * FIELD_MASS_PER_GRAM_GEV;
      if (mu > 0) {
        let c = columns.get(s.spin);
        if (!c) {
          const grid = ratioRow.get(s.spin)!.theta;
          c = [columnAt(lnP.get(s.spin)!, grid, th), columnAt(lnJ.get(s.spin)!, grid, th)];
          columns.set(s.spin, c);
        }
        rp = Math.exp(lnRatio(c[0], mu));
        rj = Math.exp(lnRatio(c[1], mu));
      }
      const power = share * s.dof * p0 * rp;
      const torqueOverA = share * s.dof * j0 * rj;
      f += power;
      g += torqueOverA;
      return { name: s.name, power, torqueOverA };
    });
    return { f, g, species: rows };
  };

  // error estimates: the massless part as pageFunctions; the ratio part below
  let ratioInterp = 0;
  let ratioNode = 0;
  for (const spin of spinsUsed) {
    const r = ratioRow.get(spin);
    if (!r || !species.some((s) => s.spin === spin && s.massGeV > 0)) continue;
    for (const [key, errKey] of [
      ['powerRatio', 'powerRatioError'],
      ['torqueRatio', 'torqueRatioError'],
    ] as const) {
      const table = r[key];
      const ln = key === 'powerRatio' ? lnP.get(spin)! : lnJ.get(spin)!;
      // spread of ln R between neighbouring cubic windows, weighted by R (a species' share of f is at most R of its massless share)
      for (let j = 0; j < r.theta.length; j++) {
        const col = ln.map((row) => row[j]);
        const weight = (mu: number) => Math.min(1, Math.exp(localCubic(mus, col, mu)));
        ratioInterp = Math.max(ratioInterp, windowSpread(mus, col, false, weight));
        for (let i = 0; i < mus.length; i++) ratioNode = Math.max(ratioNode, r[errKey][i][j] * Math.min(1, table[i][j]));
      }
      for (const [i, row] of ln.entries()) {
        if (r.theta.length >= 5) {
          const weight = (th: number) => Math.min(1, Math.exp(localCubic(r.theta, row, th, true)));
          ratioInterp = Math.max(ratioInterp, windowSpread(r.theta, row, true, weight));
        } else {
          ratioInterp = Math.max(ratioInterp, shortRowError(r.theta, table[i]));
        }
      }
    }
  }
  const pageErr = (key: 'power' | 'torqueOverA', errKey: 'powerError' | 'torqueOverAError') => {
    let interp = 0;
    let node = 0;
    for (const spin of spinsUsed) {
      const r = pageRow.get(spin)!;
      interp = Math.max(interp, halvedNodeError(page.theta, r[key], true));
      node = Math.max(node, ...r[errKey].map((e, i) => e / Math.abs(r[key][i])));
    }
    return { interp, node };
  };
  const pf = pageErr('power', 'powerError');
  const pg = pageErr('torqueOverA', 'torqueOverAError');
  const heaviest = Math.max(...species.map((s) => s.massGeV));
  return {
    species,
    at,
    f: (m, a) => at(m, a).f,
    g: (m, a) => at(m, a).g,
    aMax,
    heaviestMassGeV: heaviest,
    confinementScaleGeV: scale,
    interpolationError: { f: pf.interp + ratioInterp, g: pg.interp + ratioInterp },
    nodeError: { f: pf.node + ratioNode, g: pg.node + ratioNode },
  };
}
