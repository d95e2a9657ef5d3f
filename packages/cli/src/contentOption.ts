/**
 * The --content list of `emission` and its readable syntax: comma-separated
 * entries, each a known species or set name (photon, electron, standard-model,
 * …) or a user species NAME:SPIN:DOF[:MASS_GEV] (e.g. dark-scalar:0:1:0.01,
 * heavy-fermion:1/2:4:2.5; mass 0 when omitted). An unknown bare name is a
 * UsageError listing the known ones, with the nearest as a did-you-mean.
 */
import { parseFieldSpin as parseCoreFieldSpin } from '@penumbra/core';
import type { SpeciesSpec } from '@penumbra/emission';
import { UsageError } from './command.js';
import { closest, parseNumber } from './options.js';

/** Parse a --content list into species specs for contentTotals and contentSpectra. */
export function parseContentList(option: string, text: string, known: readonly string[]): SpeciesSpec[] {
  const entries = text.split(',').map((s) => s.trim());
  return entries.map((entry): SpeciesSpec => {
    if (!entry.includes(':')) {
      if (known.includes(entry)) return entry;
      const near = closest(entry, known);
      const hint = near === undefined ? '' : `; did you mean ${near}?`;
      throw new UsageError(
        `${option} expects a comma-separated list of ${known.join(', ')} or NAME:SPIN:DOF[:MASS_GEV], got '${entry}'${hint}`,
      );
    }
    const parts = entry.split(':');
    if (parts.length < 3 || parts.length > 4 || parts[0] === '') {
      throw new UsageError(`${option}: a user species is NAME:SPIN:DOF[:MASS_GEV] (e.g. dark-scalar:0:1:0.01), got '${entry}'`);
    }
    const [name, spinText, dofText, massText] = parts;
    let spin: number;
    try {
      spin = parseCoreFieldSpin(spinText, 'spin');
    } catch {
      throw new UsageError(`${option}: SPIN of '${entry}' must be 0, 1/2, 1 or 2, got '${spinText}'`);
    }
    const dof = parseNumber(`${option} (DOF of ${name})`, dofText, { min: 0 });
    const massGeV = massText === undefined ? 0 : parseNumber(`${option} (MASS_GEV of ${name})`, massText, { min: 0 });
    return { name, spin: spin as 0 | 0.5 | 1 | 2, dof, massGeV };
  });
}
