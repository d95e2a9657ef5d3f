/**
 * The computations behind each view of the explorer, as plain functions of an
 * ExplorerState: a table (columns with units, rows of numbers), a figure for
 * @penumbra/plot and a few summary lines with the physical numbers. They run
 * in the page's Web Worker and, unchanged, in Node (the tests compare the
 * page's printed numbers with these). Bad input is the library's InputError.
 */
import {
  InputError,
  linearGrid,
  logGrid,
  validateHole,
  validateTolerance,
  type Column,
  type Field,
  GAMMA_COLUMN,
  L_COLUMN,
  M_COLUMN,
  OMEGA_COLUMN,
} from '@penumbra/core';
import {
  bundledPageTable,
  emissionSpectrum,
  evolutionTimeUnitSeconds,
  evolveHole,
  KNOWN_SPECIES,
  pageFunctions,
  toPhysicalSpectrum,
} from '@penumbra/emission';
import { absorptionCrossSection, greybody } from '@penumbra/flux';
import { kerrHole, massToKg, unitScales, type MassUnit } from '@penumbra/kerr';
import { autoScale, type Figure, type Series } from '@penumbra/plot';
import type { ExplorerState } from './state.js';

/** What one view computed: a table, its figure and summary lines. */
export interface ViewResult {
  title: string;
  columns: Column[];
  rows: number[][];
  figure: Figure;
  /** short lines with the physical numbers (temperatures, Ω_H, lifetime, …) */
  summary: string[];
}

/** Progress callback: `done` of `total` steps finished. */
export type ProgressCallback = (done: number, total: number) => void;

/** Significant digits the page prints; the browser test compares to the last of them. */
export const PRINTED_DIGITS = 8;

/** A number as the page prints it. */
export function printNumber(x: number): string {
  if (Number.isInteger(x) && Math.abs(x) < 1e6) return String(x);
  return Number.isFinite(x) ? x.toPrecision(PRINTED_DIGITS) : String(x);
}

/** A parameter as a person writes it: 1e+15 for 1000000000000000, 0.99 for 0.99. */
export function shortNumber(x: number): string {
  const a = Math.abs(x);
  return a !== 0 && (a >= 1e6 || a < 1e-4) ? x.toExponential().replace('e+', 'e') : String(x);
}

function frequencies(s: ExplorerState): number[] {
  if (!Number.isInteger(s.count) || s.count < 2 || s.count > 2000) {
    throw new InputError('count', 'an integer 2 ≤ count ≤ 2000', s.count);
  }
  if (!(s.from > 0)) throw new InputError('from', 'Mω > 0', s.from);
  if (!(s.to > s.from)) throw new InputError('to', `Mω > from = ${s.from}`, s.to);
  return s.spacing === 'log' ? logGrid(s.from, s.to, s.count) : linearGrid(s.from, s.to, s.count);
}

/** The field of a state: massless unless Mμ > 0 (a massive field is only sent where the user asked for one). */
function field(s: ExplorerState): Field {
  return s.fieldMass === 0 ? { spin: s.spin } : { spin: s.spin, mass: s.fieldMass };
}

function physicalUnit(s: ExplorerState): MassUnit | undefined {
  return s.unit === 'geometric' ? undefined : s.unit;
}

/** The hole in geometric units of its own mass (M = 1); a physical mass only converts units. */
function hole(s: ExplorerState) {
  const { a } = validateHole({ a: s.aStar }, 'hole');
  return kerrHole({ a, mass: 1 });
}

function holeSummary(s: ExplorerState): string[] {
  const h = hole(s);
  const lines = [`a/M = ${shortNumber(s.aStar)}: Ω_H = ${printNumber(h.omegaH)}/M, T_H = ${printNumber(h.temperature)}/M`];
  const unit = physicalUnit(s);
  if (unit) {
    const u = unitScales(massToKg(s.mass, unit));
    lines.push(`M = ${shortNumber(s.mass)} ${unit}: T_H = ${printNumber(h.temperature * u.GeV)} GeV`);
  }
  return lines;
}

function modeList(s: ExplorerState): { l: number; m: number }[] {
  if (s.l.length === 0) throw new InputError('l', `one or more l ≥ ${s.spin}`, s.l);
  if (s.l.length * (s.m === 'all' ? 2 * Math.max(...s.l) + 1 : s.m.length) > 60) {
    throw new InputError('m', 'at most 60 modes in one view', s.m);
  }
  const modes: { l: number; m: number }[] = [];
  for (const l of s.l) {
    const ms = s.m === 'all' ? Array.from({ length: 2 * l + 1 }, (_, i) => i - l) : s.m.filter((m) => Math.abs(m) <= l);
    for (const m of ms) modes.push({ l, m });
  }
  if (modes.length === 0) throw new InputError('m', 'at least one m with |m| ≤ l', s.m);
  return modes;
}

/** Γ(ω) of chosen modes, with the superradiant band 0 < ω < mΩ_H shaded. */
export function greybodyView(s: ExplorerState, onProgress?: ProgressCallback): ViewResult {
  const h = hole(s);
  const tol = validateTolerance(s.tol);
  const omegas = frequencies(s);
  const modes = modeList(s);
  const rows: number[][] = [];
  const series: Series[] = [];
  let done = 0;
  for (const { l, m } of modes) {
    const points: [number, number][] = [];
    for (const omega of omegas) {
      const g = greybody({ hole: { a: s.aStar }, mode: { field: field(s), l, m }, omega }, { tol, reflection: false });
      rows.push([l, m, omega, g.gamma, g.relError]);
      points.push([omega, g.gamma]);
      onProgress?.(++done, modes.length * omegas.length);
    }
    series.push({ name: `l = ${l}, m = ${m}`, points });
  }
  const mMax = Math.max(...modes.map((x) => x.m));
  const bandTop = mMax * h.omegaH;
  const gammas = rows.map((r) => r[3]);
  const negative = gammas.some((g) => g < 0);
  const figure: Figure = {
    title: `Greybody factor Γ(ω), spin ${s.spin === 0.5 ? '½' : s.spin}${s.fieldMass ? `, Mμ = ${s.fieldMass}` : ''}, a/M = ${s.aStar}`,
    subtitle: bandTop > 0 ? `shaded: superradiant band 0 < ω < mΩ_H = ${printNumber(bandTop)}/M (Γ < 0 there)` : undefined,
    x: { title: 'Mω', scale: s.spacing === 'log' ? 'log' : 'linear', domain: [s.from, s.to], nice: false },
    y: { title: 'Γ', scale: negative ? 'linear' : autoScale(gammas.filter((g) => g > 0)), zero: negative },
    series,
    legend: { title: 'mode' },
    ...(bandTop > s.from ? { band: [s.from, Math.min(bandTop, s.to)] as const } : {}),
    ...(negative ? { rules: [{ y: 0, label: 'Γ = 0' }] } : {}),
  };
  return {
    title: 'Greybody factors',
    columns: [
      L_COLUMN,
      M_COLUMN,
      OMEGA_COLUMN,
      GAMMA_COLUMN,
      { name: 'relError', unit: '1', description: 'estimated relative error of Γ' },
    ],
    rows,
    figure,
    summary: [...holeSummary(s), ...(bandTop > 0 ? [`superradiant for ω < mΩ_H = ${printNumber(bandTop)}/M`] : [])],
  };
}

/** σ(ω) with the low-frequency and geometric-optics limits drawn as lines. */
export function crossSectionView(s: ExplorerState, onProgress?: ProgressCallback): ViewResult {
  hole(s);
  const tol = validateTolerance(s.tol);
  const omegas = frequencies(s);
  const rows: number[][] = [];
  omegas.forEach((omega, i) => {
    const c = absorptionCrossSection({ hole: { a: s.aStar }, field: field(s), omega }, { tol });
    rows.push([omega, c.sigma, c.sigma / (27 * Math.PI), c.relError]);
    onProgress?.(i + 1, omegas.length);
  });
  const rules = [{ y: 27 * Math.PI, label: '27πM² (geometric optics)' }];
  if (s.aStar === 0 && s.spin === 0) rules.push({ y: 16 * Math.PI, label: '16πM² = A_H (ω → 0)' });
  if (s.aStar === 0 && s.spin === 0.5) rules.push({ y: 2 * Math.PI, label: '2πM² (ω → 0)' });
  return {
    title: 'Absorption cross-section',
    columns: [
      OMEGA_COLUMN,
      { name: 'sigma', unit: 'M^2', description: 'absorption cross-section σ' },
      { name: 'sigmaOverCapture', unit: '1', description: 'σ / 27πM²' },
      { name: 'relError', unit: '1', description: 'estimated relative error of σ' },
    ],
    rows,
    figure: {
      title: `Absorption cross-section σ(ω), spin ${s.spin === 0.5 ? '½' : s.spin}${s.fieldMass ? `, Mμ = ${s.fieldMass}` : ''}, a/M = ${s.aStar}`,
      x: { title: 'Mω', scale: s.spacing === 'log' ? 'log' : 'linear', domain: [s.from, s.to], nice: false },
      y: { title: 'σ', unit: 'M²', scale: 'linear' },
      series: [{ name: 'σ', points: rows.map((r) => [r[0], r[1]] as const) }],
      rules,
      markers: true,
    },
    summary: holeSummary(s),
  };
}

/** Emission spectra d²N/dtdE per species (all degrees of freedom) against E in GeV. */
export function spectrumView(s: ExplorerState, onProgress?: ProgressCallback): ViewResult {
  const unit = physicalUnit(s);
  if (!unit) throw new InputError('unit', 'a physical unit (g, kg or msun) for the spectrum view', s.unit);
  hole(s);
  const tol = validateTolerance(Math.max(s.tol, 1e-8));
  const omegas = frequencies(s);
  if (s.species.length === 0) throw new InputError('species', `one or more of ${Object.keys(KNOWN_SPECIES).join(', ')}`, '');
  const rows: number[][] = [];
  const series: Series[] = [];
  s.species.forEach((name, k) => {
    const species = KNOWN_SPECIES[name];
    if (!species) throw new InputError('species', `names from ${Object.keys(KNOWN_SPECIES).join(', ')}`, name);
    // A massive species emits with its own Mμ = m/(GeV per 1/M) (massless below the solvers' lowest Mω).
    const fieldMass = species.massGeV / unitScales(massToKg(s.mass, unit)).GeV;
    const field = fieldMass >= 1e-5 ? { spin: species.spin, mass: fieldMass } : { spin: species.spin };
    const spectrum = emissionSpectrum({ hole: { a: s.aStar }, field, grid: omegas }, { tol });
    const points: [number, number][] = [];
    for (const p of spectrum.points) {
      const phys = toPhysicalSpectrum(p, s.mass, unit);
      const rate = species.dof * phys.perGeVPerSecond;
      rows.push([k, phys.energyGeV, rate, p.relError]);
      if (rate > 0) points.push([phys.energyGeV, rate]);
    }
    series.push({ name: `${name} (${species.dof} dof)`, points });
    onProgress?.(k + 1, s.species.length);
  });
  return {
    title: 'Emission spectra',
    columns: [
      { name: 'species', unit: '1', description: `index into: ${s.species.join(', ')}` },
      { name: 'energy', unit: 'GeV', description: 'particle energy E' },
      { name: 'rate', unit: '1/(GeV s)', description: 'd²N/dtdE, all degrees of freedom' },
      { name: 'relError', unit: '1', description: 'estimated relative error' },
    ],
    rows,
    figure: {
      title: `Hawking emission of a ${shortNumber(s.mass)} ${unit} hole, a/M = ${s.aStar}`,
      x: { title: 'E', unit: 'GeV', scale: 'log' },
      y: { title: 'd²N/dtdE', unit: 'GeV⁻¹ s⁻¹', scale: 'log', format: '.0e' },
      series,
      legend: { title: 'species' },
    },
    summary: holeSummary(s),
  };
}

/** The evaporation track: M, a* and T_H against time, from the shipped f, g table. */
export function evolutionView(s: ExplorerState, onProgress?: ProgressCallback): ViewResult {
  const unit = physicalUnit(s);
  if (!unit) throw new InputError('unit', 'a physical unit (g, kg or msun) for the evolution view', s.unit);
  const functions = pageFunctions({ table: bundledPageTable() });
  const history = evolveHole({ functions, aStar0: s.aStar }, { aStarThresholds: [] });
  const seconds = evolutionTimeUnitSeconds(s.mass, unit);
  const gev = unitScales(massToKg(s.mass, unit)).GeV;
  const rows = history.track
    .filter((p) => p.massRatio > 0)
    .map((p) => {
      const T = (kerrHole({ a: Math.min(p.aStar, 0.9999), mass: 1 }).temperature * gev) / p.massRatio;
      return [p.time * seconds, p.massRatio * s.mass, p.aStar, T];
    });
  onProgress?.(1, 1);
  const lifetime = history.lifetime * seconds;
  // Against the time left, so the final stage is not squeezed into the right edge; the last instant has none left.
  const remaining = rows.map((r) => [lifetime - r[0], r[1], r[2], r[3]]).filter((r) => r[0] > 0);
  return {
    title: 'Evaporation',
    columns: [
      { name: 'time', unit: 's', description: 'time since the start' },
      { name: 'mass', unit, description: 'hole mass M' },
      { name: 'aStar', unit: '1', description: 'a/M' },
      { name: 'temperature', unit: 'GeV', description: 'Hawking temperature T_H' },
    ],
    rows,
    figure: {
      title: `Evaporation of a ${shortNumber(s.mass)} ${unit} hole born with a/M = ${s.aStar} (massless content)`,
      subtitle: `lifetime ${printNumber(lifetime)} s; against the time left before the end`,
      x: { title: 'time left', unit: 's', scale: 'log', format: '.0e' },
      y: { title: 'value / initial value', scale: 'log', format: '.0e', domain: [1e-6, 1e6] },
      clip: true,
      series: [
        { name: 'M / M₀', points: remaining.map((r) => [r[0], r[1] / s.mass] as const) },
        { name: 'a* / a*₀', points: remaining.filter((r) => r[2] > 0).map((r) => [r[0], r[2] / s.aStar] as const) },
        { name: 'T_H / T_H,0', points: remaining.map((r) => [r[0], r[3] / rows[0][3]] as const) },
      ].filter((x) => x.points.length > 1),
      legend: { title: 'quantity' },
      join: 'x',
    },
    summary: [...holeSummary(s), `lifetime ${printNumber(lifetime)} s (photons, gravitons, 3 neutrino species)`],
  };
}

/** Compute the view a state names. */
export function computeView(s: ExplorerState, onProgress?: ProgressCallback): ViewResult {
  switch (s.view) {
    case 'greybody':
      return greybodyView(s, onProgress);
    case 'cross-section':
      return crossSectionView(s, onProgress);
    case 'spectrum':
      return spectrumView(s, onProgress);
    case 'evolution':
      return evolutionView(s, onProgress);
  }
}
