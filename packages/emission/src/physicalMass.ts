/** The hole's physical mass { value, unit } of the content solves: checked, with errors naming physicalMass. */
import { InputError, requireKeyedObject } from '@penumbra/core';
import { requirePhysicalMass, type MassUnit } from '@penumbra/kerr';

/** A hole's physical mass: value and unit. */
export interface PhysicalMass {
  value: number;
  unit: MassUnit;
}

/** Check a physical mass (undefined allowed unless `required`). */
export function checkPhysicalMass(value: unknown, required = false): PhysicalMass | undefined {
  if (value === undefined && !required) return undefined;
  const p = requireKeyedObject('physicalMass', value, ['value', 'unit']);
  if (p.unit !== 'g' && p.unit !== 'kg' && p.unit !== 'msun')
    throw new InputError('physicalMass.unit', "'g', 'kg' or 'msun'", p.unit);
  requirePhysicalMass(p.value as number, p.unit);
  return { value: p.value as number, unit: p.unit };
}
