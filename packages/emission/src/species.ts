/**
 * Particle content: which massless fields a hole emits and how many degrees of
 * freedom (helicity states, particle and antiparticle counted) each has.
 * Counting: photon 2, graviton 2, each massless two-component neutrino species
 * with its antiparticle 2, a real scalar 1 (Page, Phys. Rev. D 13, 198 (1976)).
 */
import { InputError, parseFieldSpin, type FieldSpin, type FieldSpinInput } from '@penumbra/core';

/** One emitted species: a massless field and its degrees of freedom. */
export interface Species {
  name: string;
  spin: FieldSpin;
  /** degrees of freedom: helicities × (particle + antiparticle where distinct) */
  dof: number;
}

/** The species known by name, with their degrees of freedom (Page 1976 counting). */
export const KNOWN_SPECIES: Readonly<Record<string, Species>> = Object.freeze({
  photon: { name: 'photon', spin: 1, dof: 2 },
  graviton: { name: 'graviton', spin: 2, dof: 2 },
  'neutrino-e': { name: 'neutrino-e', spin: 0.5, dof: 2 },
  'neutrino-mu': { name: 'neutrino-mu', spin: 0.5, dof: 2 },
  'neutrino-tau': { name: 'neutrino-tau', spin: 0.5, dof: 2 },
  scalar: { name: 'scalar', spin: 0, dof: 1 },
});

/** Default content: photons, gravitons and three massless neutrino species. */
export const DEFAULT_CONTENT: readonly string[] = ['photon', 'graviton', 'neutrino-e', 'neutrino-mu', 'neutrino-tau'];

/** Page's 1976 content: photons, gravitons and two neutrino species. */
export const PAGE_1976_CONTENT: readonly string[] = ['photon', 'graviton', 'neutrino-e', 'neutrino-mu'];

/** A species as a caller names it: a known name, or an object overriding or defining one (spin '1/2' accepted). */
export type SpeciesSpec = string | { name: string; spin?: FieldSpinInput; dof?: number };

/**
 * Resolve a content list: names from KNOWN_SPECIES, or objects that override a
 * known species' dof or define a new one (spin and dof both required then).
 */
export function resolveContent(content: readonly SpeciesSpec[] = DEFAULT_CONTENT): Species[] {
  if (!Array.isArray(content) || content.length === 0) {
    throw new InputError('content', 'a non-empty list of species', content);
  }
  const known = Object.keys(KNOWN_SPECIES).join(', ');
  const out: Species[] = [];
  for (const [i, spec] of content.entries()) {
    const at = `content[${i}]`;
    if (typeof spec === 'string') {
      const s = KNOWN_SPECIES[spec];
      if (!s) throw new InputError(at, `one of ${known}, or {name, spin, dof}`, spec);
      out.push({ ...s });
      continue;
    }
    if (typeof spec !== 'object' || spec === null || typeof spec.name !== 'string') {
      throw new InputError(
        typeof spec === 'object' && spec !== null ? `${at}.name` : at,
        `a name (${known}) or {name, spin, dof}`,
        spec,
      );
    }
    const base = KNOWN_SPECIES[spec.name];
    if (!base && (spec.spin === undefined || spec.dof === undefined)) {
      throw new InputError(at, `one of ${known}, or a new species with both spin and dof`, spec);
    }
    const spin = parseFieldSpin(spec.spin ?? base.spin, `${at}.spin`);
    const dof = spec.dof ?? base.dof;
    if (typeof dof !== 'number' || !Number.isFinite(dof) || dof < 0) {
      throw new InputError(`${at}.dof`, 'a finite number ≥ 0', dof, `species ${spec.name}`);
    }
    out.push({ name: spec.name, spin, dof });
  }
  return out;
}

/** Total degrees of freedom per field spin. */
export function dofBySpin(species: readonly Species[]): Map<FieldSpin, number> {
  const m = new Map<FieldSpin, number>();
  for (const s of species) m.set(s.spin, (m.get(s.spin) ?? 0) + s.dof);
  return m;
}
