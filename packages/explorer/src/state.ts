/**
 * What the explorer page shows, as one plain object that round-trips through
 * the URL query string, so a view can be shared by its address. Parsing is
 * lenient about absent keys (defaults per view) and strict about present ones:
 * a value that is not a number where one is needed is an InputError naming
 * the query key, shown on the page instead of a result.
 */
import { InputError, parseFieldSpin, type FieldSpin } from '@penumbra/core';

/** The four questions the page answers. */
export const VIEWS = ['greybody', 'cross-section', 'spectrum', 'evolution'] as const;
/** One of VIEWS. */
export type ViewName = (typeof VIEWS)[number];

/** Units of the hole mass: geometric (M = mass, units G = c = 1) or physical. */
export const HOLE_MASS_UNITS = ['geometric', 'g', 'kg', 'msun'] as const;
/** One of HOLE_MASS_UNITS. */
export type HoleMassUnit = (typeof HOLE_MASS_UNITS)[number];

/** Everything the page needs to compute and draw one view. */
export interface ExplorerState {
  view: ViewName;
  /** hole spin parameter a/M */
  aStar: number;
  /** hole mass in `unit` (geometric: M; physical units convert energies and rates) */
  mass: number;
  unit: HoleMassUnit;
  /** field spin (greybody and cross-section views) */
  spin: FieldSpin;
  /** field rest mass Mμ (greybody and cross-section views; 0 is massless) */
  fieldMass: number;
  /** the l values of the greybody view */
  l: number[];
  /** the m values of the greybody view, or 'all' for every |m| ≤ l */
  m: number[] | 'all';
  /** frequency range Mω (greybody, cross-section, spectrum) */
  from: number;
  to: number;
  count: number;
  spacing: 'linear' | 'log';
  /** species of the spectrum view */
  species: string[];
  /** requested relative accuracy */
  tol: number;
}

/** Defaults of each view: chosen to show its feature at first sight. */
export const VIEW_DEFAULTS: Record<ViewName, ExplorerState> = {
  greybody: {
    view: 'greybody',
    aStar: 0.99,
    mass: 1,
    unit: 'geometric',
    spin: 2,
    fieldMass: 0,
    l: [2],
    m: [2],
    from: 0.05,
    to: 1.2,
    count: 60,
    spacing: 'linear',
    species: [],
    tol: 1e-8,
  },
  'cross-section': {
    view: 'cross-section',
    aStar: 0,
    mass: 1,
    unit: 'geometric',
    spin: 0,
    fieldMass: 0,
    l: [],
    m: 'all',
    from: 0.05,
    to: 2,
    count: 24,
    spacing: 'log',
    species: [],
    tol: 1e-6,
  },
  spectrum: {
    view: 'spectrum',
    aStar: 0.5,
    mass: 1e15,
    unit: 'g',
    spin: 1,
    fieldMass: 0,
    l: [],
    m: 'all',
    from: 0.02,
    to: 1.5,
    count: 30,
    spacing: 'log',
    species: ['photon', 'graviton', 'neutrino-e'],
    tol: 1e-4,
  },
  evolution: {
    view: 'evolution',
    aStar: 0.9,
    mass: 1e15,
    unit: 'g',
    spin: 1,
    fieldMass: 0,
    l: [],
    m: 'all',
    from: 0.02,
    to: 1.5,
    count: 30,
    spacing: 'log',
    species: [],
    tol: 1e-8,
  },
};

const KEYS = ['view', 'a', 'mass', 'unit', 'spin', 'mu', 'l', 'm', 'from', 'to', 'count', 'spacing', 'species', 'tol'];

function number(key: string, text: string): number {
  const v = text.trim() === '' ? Number.NaN : Number(text);
  if (!Number.isFinite(v)) throw new InputError(key, 'a finite number', text);
  return v;
}

function list(key: string, text: string): number[] {
  return text
    .split(',')
    .filter((t) => t.trim() !== '')
    .map((t) => number(key, t));
}

function oneOfList<T extends string>(key: string, text: string, allowed: readonly T[]): T {
  if (!(allowed as readonly string[]).includes(text)) throw new InputError(key, `one of ${allowed.join(', ')}`, text);
  return text as T;
}

/**
 * The state of a query string (`?view=greybody&a=0.99&…`). Absent keys take the
 * view's defaults; unknown keys and malformed values are InputErrors naming the key.
 */
export function parseState(query: string): ExplorerState {
  const params = new URLSearchParams(query);
  for (const key of params.keys()) {
    if (!KEYS.includes(key)) throw new InputError(key, `one of the keys ${KEYS.join(', ')}`, key, 'unknown key');
  }
  const get = (key: string) => params.get(key) ?? undefined;
  const view = oneOfList('view', get('view') ?? 'greybody', VIEWS);
  const s: ExplorerState = { ...VIEW_DEFAULTS[view], l: [...VIEW_DEFAULTS[view].l], species: [...VIEW_DEFAULTS[view].species] };
  const a = get('a');
  if (a !== undefined) s.aStar = number('a', a);
  const mass = get('mass');
  if (mass !== undefined) s.mass = number('mass', mass);
  const unit = get('unit');
  if (unit !== undefined) s.unit = oneOfList('unit', unit, HOLE_MASS_UNITS);
  const spin = get('spin');
  if (spin !== undefined) s.spin = parseFieldSpin(spin, 'spin');
  const mu = get('mu');
  if (mu !== undefined) s.fieldMass = number('mu', mu);
  const l = get('l');
  if (l !== undefined) s.l = list('l', l);
  const m = get('m');
  if (m !== undefined) s.m = m.trim() === 'all' ? 'all' : list('m', m);
  for (const key of ['from', 'to', 'count', 'tol'] as const) {
    const text = get(key);
    if (text !== undefined) s[key] = number(key, text);
  }
  const spacing = get('spacing');
  if (spacing !== undefined) s.spacing = oneOfList('spacing', spacing, ['linear', 'log'] as const);
  const species = get('species');
  if (species !== undefined) s.species = species.split(',').filter((t) => t.trim() !== '');
  return s;
}

/** The query string of a state (without '?'); parseState(formatState(s)) equals s. */
export function formatState(s: ExplorerState): string {
  const params = new URLSearchParams();
  params.set('view', s.view);
  params.set('a', String(s.aStar));
  params.set('mass', String(s.mass));
  params.set('unit', s.unit);
  params.set('spin', s.spin === 0.5 ? '1/2' : String(s.spin));
  if (s.fieldMass !== 0) params.set('mu', String(s.fieldMass));
  if (s.view === 'greybody') {
    params.set('l', s.l.join(','));
    params.set('m', s.m === 'all' ? 'all' : s.m.join(','));
  }
  params.set('from', String(s.from));
  params.set('to', String(s.to));
  params.set('count', String(s.count));
  params.set('spacing', s.spacing);
  if (s.view === 'spectrum') params.set('species', s.species.join(','));
  params.set('tol', String(s.tol));
  return params.toString();
}
