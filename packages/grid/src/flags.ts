/**
 * A grid description from command-line flags. Values that do not parse are
 * passed through as text so that validateGrid reports them together with
 * every other problem.
 */
/** The grid options of `penumbra table`, as given on the command line. */
export interface GridFlags {
  spins?: string;
  /** fields SPIN[:MASS], e.g. 0,1/2:0.2 (MASS = Mμ) */
  fields?: string;
  /** species: names or NAME:SPIN:DOF[:MASS_GEV] */
  species?: string;
  /** the hole's mass of a species grid, with `unit` */
  mass?: string;
  unit?: string;
  a?: string;
  omega?: string;
  spacing?: string;
  l?: string;
  tol?: string;
  quantities?: string;
  chunkSize?: string;
}

const number = (text: string): number | string => {
  const t = text.trim();
  const v = t === '' ? Number.NaN : Number(t);
  return Number.isFinite(v) ? v : text;
};
const list = (text: string) => text.split(',').map((item) => item.trim());
const spinText = (s: string): number | string => (/^1\s*\/\s*2$/.test(s) ? s : number(s));

/** SPIN or SPIN:MASS (MASS = Mμ). */
function fieldEntry(text: string): unknown {
  const [spin, mass, ...rest] = text.split(':');
  if (rest.length > 0) return text;
  return mass === undefined ? spinText(spin.trim()) : { spin: spinText(spin.trim()), mass: number(mass) };
}

/** A registry name, or a user species NAME:SPIN:DOF[:MASS_GEV] (the syntax of `emission --content`). */
function speciesEntry(text: string): unknown {
  const parts = text.split(':');
  if (parts.length === 1) return text;
  if (parts.length < 3 || parts.length > 4) return text;
  const [name, spin, dof, massGeV] = parts;
  return { name, spin: spinText(spin.trim()), dof: number(dof), ...(massGeV === undefined ? {} : { massGeV: number(massGeV) }) };
}

/** True if any grid flag was given. */
export function hasGridFlags(flags: GridFlags): boolean {
  return Object.values(flags).some((v) => v !== undefined);
}

/**
 * --spins 0,1/2,1 (or --fields 0,1/2:0.2 with masses Mμ, or --species electron,dark:0:1:0.01
 * with --mass M --unit g|kg|msun)  --a 0,0.9  --omega FROM:TO:COUNT (with --spacing linear|log) or a list W1,W2,…
 * --l MAX, MIN:MAX or auto  --tol 1e-6  --quantities gamma,crossSection  --chunk-size 16
 */
export function gridFromFlags(flags: GridFlags): Record<string, unknown> {
  const raw: Record<string, unknown> = {};
  if (flags.spins !== undefined) raw.fieldSpins = list(flags.spins).map(spinText);
  if (flags.fields !== undefined) raw.fields = list(flags.fields).map(fieldEntry);
  if (flags.species !== undefined) raw.species = list(flags.species).map(speciesEntry);
  if (flags.mass !== undefined || flags.unit !== undefined) raw.holeMass = { value: number(flags.mass ?? ''), unit: flags.unit };
  if (flags.a !== undefined) raw.holeA = list(flags.a).map(number);
  if (flags.omega !== undefined) {
    const parts = flags.omega.split(':');
    if (parts.length === 3) {
      raw.frequencies = {
        spacing: flags.spacing ?? 'linear',
        from: number(parts[0]),
        to: number(parts[1]),
        count: number(parts[2]),
      };
    } else {
      raw.frequencies = {
        values: list(flags.omega).map(number),
        ...(flags.spacing !== undefined ? { spacing: flags.spacing } : {}),
      };
    }
  } else if (flags.spacing !== undefined) {
    raw.frequencies = { spacing: flags.spacing };
  }
  if (flags.l !== undefined) {
    const parts = flags.l.split(':');
    raw.l =
      flags.l.trim() === 'auto'
        ? 'auto'
        : parts.length === 2
          ? { min: number(parts[0]), max: number(parts[1]) }
          : { max: number(flags.l) };
  }
  if (flags.tol !== undefined) raw.tolerance = number(flags.tol);
  if (flags.quantities !== undefined) raw.quantities = list(flags.quantities);
  if (flags.chunkSize !== undefined) raw.chunkSize = number(flags.chunkSize);
  return raw;
}
