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
import { localCubic, localCubicError, localCubicWeights } from './localCubic.js';
import { columnAt, lnRatioAt, torqueLimitError, type Column, type Estimated } from './massLossError.js';
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

/** Relative error estimates of f and g at one point or over a table: interpolation and node parts. */
export interface RateErrors {
  /** interpolation error of the tables (massless table in θ; ratio table in θ and Mμ) */
  interpolation: { f: number; g: number };
  /** the table nodes' own error (the solves they were made from), carried by the interpolation weights */
  node: { f: number; g: number };
  /** interpolation + node, for f and for g */
  f: number;
  g: number;
}

/** f, g and each species' share at one (M, a*). */
export interface MassLossValues {
  f: number;
  g: number;
  /** per species: dof·P̂ (share of f) and dof·Ĵ/a* (share of g), in the order of `species` */
  species: { name: string; power: number; torqueOverA: number }[];
}

/** f, g, each species' share and the local error estimates at one (M, a*). */
export interface MassLossPoint extends MassLossValues {
  /**
   * relative errors of f and g at this point, from the table cells actually
   * used: each species' error (its Mμ cell and the θ cell of a*, plus the
   * massless table's) weighted by its share of f or g
   */
  error: RateErrors;
}

/** f(M, a*), g(M, a*) of a content, with error estimates. */
export interface MassLossRates {
  species: EmittedSpecies[];
  /** f, g, the shares of each species and their local errors at a hole mass in grams and a* */
  at: (massGrams: number, aStar: number) => MassLossPoint;
  /** f, g and the shares as `at`, without the error estimates (several times faster: what the ODEs call) */
  values: (massGrams: number, aStar: number) => MassLossValues;
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
  /**
   * table-wide maximum of the local relative interpolation error (`at(M, a*).error`)
   * of this content: its ratio-table part sampled over every M where a species
   * crosses the Mμ nodes and a* at the θ nodes and midpoints, plus the largest
   * massless-table part; computed on first access
   */
  interpolationError: { f: number; g: number };
  /** table-wide maximum of the local node error, sampled as interpolationError */
  nodeError: { f: number; g: number };
}

/**
 * Factor on the next-term interpolation estimate (localCubicError) in the
 * stated interpolation errors, chosen from measurements: the estimate from
 * the nearest divided difference alone was exceeded by direct emissionTotals
 * at the cell midpoints of the 10 × 5 ratio table by up to 1.4× in f and 3.0×
 * in g (a massive scalar, Mμ = 0.425, a* = 0.18), and in leave-one-node-out by
 * up to 5.5×. With the factor (and four divided differences), on the shipped
 * per-spin table (the massive vector on 17 a* nodes): f within the stated error
 * at all cell midpoints probed (worst 0.81 of it, spin 1 at Mμ = 0.3,
 * a* = 0.86), g likewise (worst 0.76); leave-one-node-out within it in 99 %
 * (f, g) of cases, all within 2× (bench/mass-loss.bench.mjs).
 */
export const INTERPOLATION_SAFETY = 3;

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
  const musOf = new Map(ratios.spins.map((r) => [r.spin, r.fieldMass]));
  const ln = (table: number[][]) => table.map((row) => row.map((x) => Math.log(Math.max(x, 1e-300))));
  const lnP = new Map(ratios.spins.map((r) => [r.spin, ln(r.powerRatio)]));
  const lnJ = new Map(ratios.spins.map((r) => [r.spin, ln(r.torqueRatio)]));
  // node errors of the torque ratios: the a* = 0 entry is a limit from the even series, with its own truncation
  const errJ = new Map(
    ratios.spins.map((r) => [
      r.spin,
      r.torqueRatioError.map((row, i) => row.map((e, j) => (j === 0 ? torqueLimitError(lnJ.get(r.spin)![i], row) : e))),
    ]),
  );
  // the a* range: the Page table's, and that of every ratio row a massive species uses
  const massiveSpins = new Set(species.filter((sp) => sp.massGeV > 0).map((sp) => sp.spin));
  const aMax = Math.min(
    page.aStar[page.aStar.length - 1],
    ...ratios.spins.filter((r) => massiveSpins.has(r.spin)).map((r) => r.aStar[r.aStar.length - 1]),
  );
  const spinsUsed = [...new Set(species.map((s) => s.spin))];
  const thetaPageMax = page.theta[page.theta.length - 1];

  /** The massless per-dof power and torque/a* of a spin at θ, with their relative errors. */
  const masslessAt = (spin: FieldSpin, th: number, withErrors = true): Estimated[] => {
    const r = pageRow.get(spin)!;
    const { i0, weights } = withErrors ? localCubicWeights(page.theta, th, true) : { i0: 0, weights: [] };
    const one = (values: readonly number[], errors: readonly number[]): Estimated => {
      const value = localCubic(page.theta, values, th, true);
      if (!withErrors) return { value, interpolation: 0, node: 0 };
      return {
        value,
        interpolation: localCubicError(page.theta, values, th, true) / Math.abs(value),
        node: weights.reduce((s, w, j) => s + Math.abs(w) * errors[Math.abs(i0 + j)], 0) / Math.abs(value),
      };
    };
    return [one(r.power, r.powerError), one(r.torqueOverA, r.torqueOverAError)];
  };

  const cache = { th: Number.NaN, withErrors: false, columns: new Map<FieldSpin, Column[]>() };
  /** f, g, shares and errors; the errors split into the massless-table and the ratio-table parts. */
  const evaluate = (massGrams: number, aStar: number, withErrors: boolean) => {
    const M = requireFinite('massGrams', massGrams, 'a hole mass in grams > 0');
    if (!(M > 0)) throw new InputError('massGrams', 'a hole mass in grams > 0', M);
    const a = requireFinite('aStar', aStar);
    if (!(Math.abs(a) <= aMax)) throw new InputError('aStar', `|a*| ≤ ${aMax} (the tables' range)`, a);
    const th = Math.asin(Math.abs(a));
    const thPage = Math.min(th, thetaPageMax);
    const massless = new Map(spinsUsed.map((spin) => [spin, masslessAt(spin, thPage, withErrors)]));
    // the columns depend on θ only: kept from the previous call at the same θ (sweeps over M at fixed a*)
    if (cache.th !== th || (withErrors && !cache.withErrors)) {
      cache.th = th;
      cache.withErrors = withErrors;
      cache.columns.clear();
    }
    const columns = cache.columns;
    // confinement: T_H of this hole in GeV against the scale
    const root = Math.sqrt(Math.max(0, 1 - a * a));
    const temperatureGeV = root / (4 * Math.PI * (1 + root) * M * FIELD_MASS_PER_GRAM_GEV);
    // the switch is smoothed over about ±2 % of the scale so that an ODE can step through it
    const hot = 1 / (1 + (scale / temperatureGeV) ** 100);
    let f = 0;
    let g = 0;
    // absolute errors: [page interpolation, page node, ratio interpolation, ratio node] of f and of g
    const ef = [0, 0, 0, 0];
    const eg = [0, 0, 0, 0];
    const none: Estimated = { value: 0, interpolation: 0, node: 0 };
    const rows = species.map((s) => {
      const share = s.qcd === 'parton' ? hot : s.qcd === 'hadron' ? 1 - hot : 1;
      if (share < 1e-300) return { name: s.name, power: 0, torqueOverA: 0 };
      const [p0, j0] = massless.get(s.spin)!;
      let rp = none;
      let rj = none;
      const mu = s.massGeV * M * FIELD_MASS_PER_GRAM_GEV;
      if (mu > 0) {
        let c = columns.get(s.spin);
        if (!c) {
          const grid = ratioRow.get(s.spin)!;
          c = [
            columnAt(grid.theta, lnP.get(s.spin)!, grid.powerRatioError, th, withErrors),
            columnAt(grid.theta, lnJ.get(s.spin)!, errJ.get(s.spin)!, th, withErrors),
          ];
          columns.set(s.spin, c);
        }
        const mus = musOf.get(s.spin)!;
        rp = lnRatioAt(mus, c[0], mu, withErrors);
        rj = lnRatioAt(mus, c[1], mu, withErrors);
      }
      const power = share * s.dof * p0.value * Math.exp(rp.value);
      const torqueOverA = share * s.dof * j0.value * Math.exp(rj.value);
      f += power;
      g += torqueOverA;
      if (!withErrors) return { name: s.name, power, torqueOverA };
      for (const [e, x, m, r] of [
        [ef, power, p0, rp],
        [eg, torqueOverA, j0, rj],
      ] as const) {
        const w = Math.abs(x);
        e[0] += w * m.interpolation;
        e[1] += w * m.node;
        // w·(e^err − 1) without overflow where a species far past the last node has w ≈ 0 and a large ln-error
        if (w > 0) {
          e[2] += Math.exp(Math.log(w) + r.interpolation) - w;
          e[3] += Math.exp(Math.log(w) + r.node) - w;
        }
      }
      return { name: s.name, power, torqueOverA };
    });
    // a content that emits nothing here (every dof 0, or all switched off) has no relative error to state
    const relative = (e: number, x: number) => (x === 0 ? 0 : e / Math.abs(x));
    return { f, g, rows, ef: ef.map((e) => relative(e, f)), eg: eg.map((e) => relative(e, g)) };
  };

  const at = (massGrams: number, aStar: number): MassLossPoint => {
    const { f, g, rows, ef, eg } = evaluate(massGrams, aStar, true);
    const interpolation = { f: INTERPOLATION_SAFETY * (ef[0] + ef[2]), g: INTERPOLATION_SAFETY * (eg[0] + eg[2]) };
    const node = { f: ef[1] + ef[3], g: eg[1] + eg[3] };
    return {
      f,
      g,
      species: rows,
      error: { interpolation, node, f: interpolation.f + node.f, g: interpolation.g + node.g },
    };
  };

  const heaviest = Math.max(...species.map((s) => s.massGeV));
  let tableWide: { interpolation: { f: number; g: number }; node: { f: number; g: number } } | undefined;
  const tableWideErrors = () => {
    tableWide ??= tableWideMaxima();
    return tableWide;
  };
  /**
   * The local estimates' largest values: the massless-table part over every
   * θ cell midpoint of the Page table (a* ≤ aMax), the ratio part sampled at 16
   * masses per decade wherever a species' Mμ is between a tenth of the first
   * and twice the last Mμ node, at the ratio table's θ nodes and midpoints.
   */
  function tableWideMaxima() {
    const out = { interpolation: { f: 0, g: 0 }, node: { f: 0, g: 0 } };
    const thetaMax = Math.asin(aMax);
    for (const spin of spinsUsed)
      for (let k = 0; k + 1 < page.theta.length && page.theta[k] < thetaMax; k++) {
        const [p0, j0] = masslessAt(spin, Math.min(0.5 * (page.theta[k] + page.theta[k + 1]), thetaMax));
        out.interpolation.f = Math.max(out.interpolation.f, p0.interpolation);
        out.interpolation.g = Math.max(out.interpolation.g, j0.interpolation);
        out.node.f = Math.max(out.node.f, p0.node);
        out.node.g = Math.max(out.node.g, j0.node);
      }
    const massive = species.filter((s) => s.massGeV > 0);
    if (massive.length === 0) {
      out.interpolation.f *= INTERPOLATION_SAFETY;
      out.interpolation.g *= INTERPOLATION_SAFETY;
      return out;
    }
    const thetas = new Set<number>();
    for (const spin of massiveSpins) {
      const t = ratioRow.get(spin)!.theta.filter((x) => x <= thetaMax);
      for (const [k, x] of t.entries()) {
        thetas.add(x);
        if (k + 1 < t.length) thetas.add(0.5 * (x + t[k + 1]));
      }
    }
    // each species' own window of hole masses, in logarithms (a mass of 1e-300 GeV puts it past 1e300 g);
    // masses outside double range are skipped: no hole there has a finite rate to state
    const holeMasses: number[] = [];
    for (const s of massive) {
      const mus = musOf.get(s.spin)!;
      const logLo = Math.log10(0.1 * mus[1]);
      const span = Math.log10((2 * mus[mus.length - 1]) / (0.1 * mus[1]));
      const steps = Math.ceil(16 * span);
      const base = logLo - Math.log10(s.massGeV * FIELD_MASS_PER_GRAM_GEV);
      for (let k = 0; k <= steps; k++) {
        const M = 10 ** (base + (span * k) / steps);
        if (M > 0 && Number.isFinite(M)) holeMasses.push(M);
      }
    }
    let ratio = [0, 0, 0, 0];
    for (const th of thetas)
      for (const M of holeMasses) {
        const { ef, eg } = evaluate(M, Math.min(Math.sin(th), aMax), true);
        ratio = [Math.max(ratio[0], ef[2]), Math.max(ratio[1], eg[2]), Math.max(ratio[2], ef[3]), Math.max(ratio[3], eg[3])];
      }
    out.interpolation.f += ratio[0];
    out.interpolation.g += ratio[1];
    out.interpolation.f *= INTERPOLATION_SAFETY;
    out.interpolation.g *= INTERPOLATION_SAFETY;
    out.node.f += ratio[2];
    out.node.g += ratio[3];
    return out;
  }
  return {
    species,
    at,
    values: (m, a) => {
      const { f, g, rows } = evaluate(m, a, false);
      return { f, g, species: rows };
    },
    f: (m, a) => evaluate(m, a, false).f,
    g: (m, a) => evaluate(m, a, false).g,
    aMax,
    heaviestMassGeV: heaviest,
    confinementScaleGeV: scale,
    get interpolationError() {
      return tableWideErrors().interpolation;
    },
    get nodeError() {
      return tableWideErrors().node;
    },
  };
}
