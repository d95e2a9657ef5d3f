/**
 * Particle content: which fields a hole emits, how many degrees of freedom
 * (helicity or spin states, particle and antiparticle counted) each has, and
 * its rest mass in GeV.
 *
 * Counting of the massless fields: photon 2, graviton 2, each massless
 * two-component neutrino species with its antiparticle 2, a real scalar 1
 * (Page, Phys. Rev. D 13, 198 (1976)). The Standard Model adds gluons 16
 * (8 colours × 2 helicities), charged leptons 4 (2 spin states × particle and
 * antiparticle), quarks 12 (× 3 colours), W± 6, Z 3, Higgs 1, and the pions
 * π⁰ 1, π± 2. Neutrinos are treated as massless (their masses, below 1 eV, are
 * irrelevant at any temperature a hole in the supported mass range has).
 *
 * Masses: S. Navas et al. (Particle Data Group), Review of Particle Physics,
 * Phys. Rev. D 110, 030001 (2024) — every value below is recalled from that
 * edition, not read from it (value from memory). Quark masses are the
 * Review's MS-bar values (u, d, s at 2 GeV; c, b at their own scale) and the
 * top's direct-measurement average; for emission they only set thresholds.
 */
import { InputError, parseFieldSpin, type FieldSpin, type FieldSpinInput } from '@penumbra/core';

/** How a species takes part in the confinement rule (content.ts): free partons above the scale, hadrons below. */
export type QcdRole = 'parton' | 'hadron';

/** One emitted species: a field, its degrees of freedom and its rest mass. */
export interface Species {
  name: string;
  spin: FieldSpin;
  /** degrees of freedom: helicities or spin states × (particle + antiparticle where distinct) */
  dof: number;
  /** rest mass in GeV (0: massless) */
  massGeV: number;
  /** quarks and gluons 'parton', pions 'hadron': emitted only above / below the confinement scale */
  qcd?: QcdRole;
}

const sp = (name: string, spin: FieldSpin, dof: number, massGeV: number, qcd?: QcdRole): Species =>
  qcd ? { name, spin, dof, massGeV, qcd } : { name, spin, dof, massGeV };

/**
 * The species known by name. Masses in GeV from the Particle Data Group,
 * Phys. Rev. D 110, 030001 (2024) (values from memory).
 */
export const KNOWN_SPECIES: Readonly<Record<string, Species>> = Object.freeze({
  photon: sp('photon', 1, 2, 0),
  gluon: sp('gluon', 1, 16, 0, 'parton'),
  graviton: sp('graviton', 2, 2, 0),
  'neutrino-e': sp('neutrino-e', 0.5, 2, 0),
  'neutrino-mu': sp('neutrino-mu', 0.5, 2, 0),
  'neutrino-tau': sp('neutrino-tau', 0.5, 2, 0),
  electron: sp('electron', 0.5, 4, 0.51099895e-3),
  muon: sp('muon', 0.5, 4, 0.1056583755),
  tau: sp('tau', 0.5, 4, 1.77693),
  up: sp('up', 0.5, 12, 2.16e-3, 'parton'),
  down: sp('down', 0.5, 12, 4.7e-3, 'parton'),
  strange: sp('strange', 0.5, 12, 93.5e-3, 'parton'),
  charm: sp('charm', 0.5, 12, 1.273, 'parton'),
  bottom: sp('bottom', 0.5, 12, 4.183, 'parton'),
  top: sp('top', 0.5, 12, 172.57, 'parton'),
  'w-boson': sp('w-boson', 1, 6, 80.3692),
  'z-boson': sp('z-boson', 1, 3, 91.188),
  higgs: sp('higgs', 0, 1, 125.2),
  'pion-neutral': sp('pion-neutral', 0, 1, 0.1349768, 'hadron'),
  'pion-charged': sp('pion-charged', 0, 2, 0.13957039, 'hadron'),
  scalar: sp('scalar', 0, 1, 0),
});

/** Default content: photons, gravitons and three massless neutrino species. */
export const DEFAULT_CONTENT: readonly string[] = ['photon', 'graviton', 'neutrino-e', 'neutrino-mu', 'neutrino-tau'];

/** Page's 1976 content: photons, gravitons and two neutrino species. */
export const PAGE_1976_CONTENT: readonly string[] = ['photon', 'graviton', 'neutrino-e', 'neutrino-mu'];

/**
 * The Standard Model with gravitons and the pions: every species of
 * KNOWN_SPECIES but the generic `scalar`. Quarks and gluons are emitted only
 * above the confinement scale, the pions only below it (content.ts).
 */
export const STANDARD_MODEL_CONTENT: readonly string[] = Object.freeze(Object.keys(KNOWN_SPECIES).filter((n) => n !== 'scalar'));

/**
 * A species as a caller names it: a known name, or an object overriding a
 * known species' dof or mass, or defining a new one (spin, dof, and massGeV
 * (default 0); spin '1/2' accepted).
 */
export type SpeciesSpec = string | { name: string; spin?: FieldSpinInput; dof?: number; massGeV?: number };

/** Content names that stand for a whole list. */
const CONTENT_SETS: Readonly<Record<string, readonly string[]>> = { 'standard-model': STANDARD_MODEL_CONTENT };

/**
 * Resolve a content list: names from KNOWN_SPECIES (or 'standard-model' for
 * STANDARD_MODEL_CONTENT), or objects that override a known species' dof or
 * mass, or define a new one (spin and dof both required then).
 */
export function resolveContent(content: readonly SpeciesSpec[] = DEFAULT_CONTENT): Species[] {
  if (!Array.isArray(content) || content.length === 0) {
    throw new InputError('content', 'a non-empty list of species', content);
  }
  const known = [...Object.keys(KNOWN_SPECIES), ...Object.keys(CONTENT_SETS)].join(', ');
  const out: Species[] = [];
  for (const [i, spec] of content.entries()) {
    const at = `content[${i}]`;
    if (typeof spec === 'string') {
      const set = Object.hasOwn(CONTENT_SETS, spec) ? CONTENT_SETS[spec] : undefined;
      if (set) {
        for (const name of set) out.push({ ...KNOWN_SPECIES[name] });
        continue;
      }
      const s = Object.hasOwn(KNOWN_SPECIES, spec) ? KNOWN_SPECIES[spec] : undefined;
      if (!s) throw new InputError(at, `one of ${known}, or {name, spin, dof, massGeV?}`, spec);
      out.push({ ...s });
      continue;
    }
    if (typeof spec !== 'object' || spec === null || typeof spec.name !== 'string') {
      throw new InputError(
        typeof spec === 'object' && spec !== null ? `${at}.name` : at,
        `a name (${known}) or {name, spin, dof, massGeV?}`,
        spec,
      );
    }
    const base = Object.hasOwn(KNOWN_SPECIES, spec.name) ? KNOWN_SPECIES[spec.name] : undefined;
    if (!base && (spec.spin === undefined || spec.dof === undefined)) {
      throw new InputError(at, `one of ${known}, or a new species with both spin and dof`, spec);
    }
    const spin = parseFieldSpin(spec.spin ?? base!.spin, `${at}.spin`);
    const dof = spec.dof ?? base!.dof;
    if (typeof dof !== 'number' || !Number.isFinite(dof) || dof < 0) {
      throw new InputError(`${at}.dof`, 'a finite number ≥ 0', dof, `species ${spec.name}`);
    }
    const massGeV = spec.massGeV ?? base?.massGeV ?? 0;
    if (typeof massGeV !== 'number' || !Number.isFinite(massGeV) || massGeV < 0 || massGeV > 1e19) {
      throw new InputError(`${at}.massGeV`, 'a finite mass in GeV, 0 ≤ massGeV ≤ 1e19', massGeV, `species ${spec.name}`);
    }
    const qcd = base && base.spin === spin ? base.qcd : undefined;
    out.push(sp(spec.name, spin, dof, massGeV, qcd));
  }
  return out;
}

/**
 * Total degrees of freedom per field spin of a massless content (the Page
 * table's per-dof values are massless). A massive species is refused with an
 * InputError naming content[i]: its emission needs contentTotals.
 */
export function dofBySpin(species: readonly Species[]): Map<FieldSpin, number> {
  const m = new Map<FieldSpin, number>();
  species.forEach((s, i) => {
    if (s.massGeV > 0) {
      throw new InputError(
        `content[${i}]`,
        'a massless species (massive species are emitted by contentTotals with a physical hole mass)',
        s.name,
      );
    }
    m.set(s.spin, (m.get(s.spin) ?? 0) + s.dof);
  });
  return m;
}
