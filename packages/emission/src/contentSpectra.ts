/**
 * Primary spectra per species of a particle content: d²N/(dt dE) of all of a
 * species' degrees of freedom on a grid of particle energies, for a hole of
 * physical mass (docs/emission.md, "Primary spectra"). Secondary spectra
 * (hadronisation, decays of unstable primaries) are out of scope: these
 * tables are what a hadronisation code takes as input.
 *
 * Rules as in contentTotals: confinement (partons only when T_H > the scale,
 * pions only when T_H ≤ it; a confined species' rows are 0), Mμ from the
 * physical mass; a species with Mμ below the solvers' lowest Mω is emitted as
 * its massless limit (spin 1: (2 × photon + 1 × scalar)/3 per dof).
 */
import { InputError, isFunction, numberIn, validateHole, validateOptions, validateTolerance, type Hole } from '@penumbra/core';
import { kerrHole, requirePhysicalMass, unitScales } from '@penumbra/kerr';
import { MOMEGA_RANGE } from '@penumbra/flux';
import { DEFAULT_CONFINEMENT_SCALE_GEV, type PhysicalMass } from './content.js';
import { checkPhysicalMass } from './physicalMass.js';
import { resolveContent, type Species, type SpeciesSpec } from './species.js';
import { emissionSpectrum, type EmissionSpectrum } from './spectrum.js';
import { requireProblem, validateGrid } from './validate.js';

/** A hole of physical mass, the species it emits, and the particle energies (GeV, increasing). */
export interface ContentSpectraProblem {
  readonly hole: Hole;
  readonly content?: readonly SpeciesSpec[];
  readonly physicalMass: PhysicalMass;
  /** particle energies E in GeV, strictly increasing, each with ME/(ħ·c³/G) ≤ 30 */
  readonly energiesGeV: readonly number[];
}

/** Options of contentSpectra; unknown keys are refused. */
export interface ContentSpectraOptions {
  /** relative accuracy of each point (default 1e-4) */
  tol?: number;
  /** T_H above which quarks and gluons are emitted and below which pions are, GeV (default 0.3) */
  confinementScaleGeV?: number;
  /** called after each species */
  onSpecies?: (name: string, done: number, total: number) => void;
}

/** One species' primary spectrum, all degrees of freedom. */
export interface SpeciesSpectrum extends Species {
  /** Mμ for this hole */
  fieldMass: number;
  /** false for a species removed by the confinement rule (its rows are 0) */
  emitted: boolean;
  /** d²N/(dt dE) in GeV⁻¹ s⁻¹ at each energy, all dof */
  perGeVPerSecond: number[];
  /** estimated relative error of each value */
  relError: number[];
  /** the approximation used for Γ, if any */
  approximation?: string;
}

/** Primary spectra of a content. */
export interface ContentSpectra {
  hole: { a: number; mass: number };
  physicalMass: PhysicalMass;
  temperatureGeV: number;
  confinementScaleGeV: number;
  energiesGeV: number[];
  species: SpeciesSpectrum[];
}

const OPTIONS = {
  tol: validateTolerance,
  confinementScaleGeV: numberIn(1e-3, 1e3),
  onSpecies: isFunction<(name: string, done: number, total: number) => void>,
};

/**
 * Primary spectra d²N/(dt dE) per species (GeV⁻¹ s⁻¹ against E in GeV) of a
 * hole of physical mass. Throws InputError for bad input, ConvergenceError
 * as emissionSpectrum does.
 *
 * @example contentSpectra({ hole: { a: 0 }, content: ['photon', 'electron'], physicalMass: { value: 1e15, unit: 'g' }, energiesGeV: [0.01, 0.05] })
 */
export function contentSpectra(problem: ContentSpectraProblem, options?: ContentSpectraOptions): ContentSpectra {
  const p = requireProblem(problem, ['hole', 'content', 'physicalMass', 'energiesGeV']);
  const species = resolveContent(p.content as readonly SpeciesSpec[] | undefined);
  const hole = validateHole(p.hole, 'hole');
  const physicalMass = checkPhysicalMass(p.physicalMass, true)!;
  const {
    tol = 1e-4,
    confinementScaleGeV = DEFAULT_CONFINEMENT_SCALE_GEV,
    onSpecies,
  } = validateOptions<ContentSpectraOptions>(options, OPTIONS);
  const u = unitScales(requirePhysicalMass(physicalMass.value, physicalMass.unit));
  const aStar = Math.abs(hole.a) / hole.mass;
  const temperatureGeV = kerrHole({ a: aStar, mass: 1 }).temperature * u.GeV;
  // Checked as a grid (mass 0 skips its Mω cap, checked here in GeV): errors name energiesGeV[i].
  const energies = validateGrid(p.energiesGeV, 0, 'energiesGeV');
  const top = energies.length - 1;
  if (energies[top] / u.GeV > MOMEGA_RANGE.max) {
    throw new InputError(
      `energiesGeV[${top}]`,
      `E ≤ ${MOMEGA_RANGE.max * u.GeV} GeV for this hole (Mω ≤ ${MOMEGA_RANGE.max})`,
      energies[top],
      `the greybody solver covers Mω ≤ ${MOMEGA_RANGE.max}`,
    );
  }
  // geometric ω of the computation's hole (mass hole.mass): Mω = E/u.GeV
  const grid = energies.map((e) => e / u.GeV / hole.mass);
  const spectrum = (spin: Species['spin'], mass: number): EmissionSpectrum =>
    emissionSpectrum({ hole, field: mass > 0 ? { spin, mass } : { spin }, grid }, { tol });
  const rows = species.map((s, i): SpeciesSpectrum => {
    const fieldMass = s.massGeV / u.GeV;
    const deconfined = temperatureGeV > confinementScaleGeV;
    const emitted = s.qcd === undefined || (s.qcd === 'parton') === deconfined;
    const row: SpeciesSpectrum = { ...s, fieldMass, emitted, perGeVPerSecond: [], relError: [] };
    let points: { number: number; relError: number }[];
    if (!emitted) points = grid.map(() => ({ number: 0, relError: 0 }));
    else if (fieldMass >= MOMEGA_RANGE.min) {
      const r = spectrum(s.spin, Math.min(fieldMass, MOMEGA_RANGE.max * 0.999999));
      if (r.approximation) row.approximation = r.approximation;
      points = r.points;
    } else if (s.spin === 1 && fieldMass > 0) {
      const t = spectrum(1, 0).points;
      const sc = spectrum(0, 0).points;
      points = t.map((q, j) => ({
        number: (2 * q.number + sc[j].number) / 3,
        relError: Math.max(q.relError, sc[j].relError),
      }));
    } else points = spectrum(s.spin, 0).points;
    // d²N/(dt dω) is scale-free; per GeV per second: divide by (t_M·E_M) of the physical hole (units.ts).
    row.perGeVPerSecond = points.map((q) => (s.dof * q.number) / (u.second * u.GeV));
    row.relError = points.map((q) => q.relError);
    onSpecies?.(s.name, i + 1, species.length);
    return row;
  });
  return {
    hole,
    physicalMass,
    temperatureGeV,
    confinementScaleGeV,
    energiesGeV: grid.map((w) => w * hole.mass * u.GeV),
    species: rows,
  };
}
