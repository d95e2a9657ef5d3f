/** The Kerr background as text or as a JSON object, shared by `kerr` and `demo`. */
import { kerrHole, physicalBackground, type KerrHole, type MassUnit, type PhysicalBackground } from '@penumbra/kerr';
import { formatNumber, formatTable } from './format.js';

/** The hole a background report describes. */
export interface BackgroundRequest {
  /** the hole's spin parameter a/M */
  aStar: number;
  /** geometric mass M when `unit` is absent; the physical mass in `unit` otherwise */
  mass: number;
  unit?: MassUnit;
}

/** The background of a hole, with physical units when a mass unit was given. */
export interface BackgroundReport {
  hole: KerrHole;
  physical?: PhysicalBackground & { mass: number; unit: MassUnit };
}

/** The background of the requested hole. */
export function backgroundReport({ aStar, mass, unit }: BackgroundRequest): BackgroundReport {
  if (unit === undefined) return { hole: kerrHole({ a: aStar * mass, mass }) };
  const hole = kerrHole({ a: aStar });
  return { hole, physical: { mass, unit, ...physicalBackground(hole, mass, unit) } };
}

/** The JSON object of `penumbra kerr --json`: the geometric quantities, plus `physical` when a unit was given. */
export function backgroundJson({ hole, physical }: BackgroundReport): Record<string, unknown> {
  const json: Record<string, unknown> = {
    rPlus: hole.rPlus,
    rMinus: hole.rMinus,
    omegaH: hole.omegaH,
    kappa: hole.kappa,
    temperature: hole.temperature,
    area: hole.area,
    entropy: hole.entropy,
  };
  if (physical) json.physical = physical;
  return json;
}

const UNIT_NAMES: Record<MassUnit, string> = { g: 'g', kg: 'kg', msun: 'solar masses' };

/** The background as text for people. */
export function backgroundText({ hole, physical }: BackgroundReport): string {
  const M = hole.mass;
  const header =
    `Kerr hole with a = ${formatNumber(hole.a / M)} M` +
    (physical ? `, M = ${formatNumber(physical.mass)} ${UNIT_NAMES[physical.unit]}` : M === 1 ? '' : `, M = ${formatNumber(M)}`) +
    '\n' +
    `geometric units G = c = ħ = k_B = 1${M === 1 ? ', quantities in units of M' : ''}\n`;
  const geometric = formatTable([
    ['outer horizon', 'r+', formatNumber(hole.rPlus)],
    ['inner horizon', 'r-', formatNumber(hole.rMinus)],
    ['horizon angular velocity', 'Ω_H', formatNumber(hole.omegaH)],
    ['surface gravity', 'κ', formatNumber(hole.kappa)],
    ['Hawking temperature', 'T_H', formatNumber(hole.temperature)],
    ['horizon area', 'A', formatNumber(hole.area)],
    ['Bekenstein-Hawking entropy', 'S', formatNumber(hole.entropy)],
  ]);
  if (!physical) return header + geometric;
  const p = physical;
  return (
    header +
    geometric +
    'physical units (CODATA 2018)\n' +
    formatTable([
      ['mass', formatNumber(p.massGrams), 'g'],
      ['Hawking temperature', formatNumber(p.temperatureK), 'K'],
      ['', formatNumber(p.temperatureGeV), 'GeV'],
      ['horizon angular velocity', formatNumber(p.omegaHPerSecond), 'rad/s'],
      ['outer horizon radius', formatNumber(p.rPlusMetres), 'm'],
      ['horizon area', formatNumber(p.areaSquareMetres), 'm²'],
      ['entropy', formatNumber(p.entropyKB), 'k_B'],
      ['time unit GM/c³', formatNumber(p.timeUnitSeconds), 's'],
    ])
  );
}
